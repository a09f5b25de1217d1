#pragma once
// Figure and data export: PNG, SVG or PDF by file suffix; CSV via the core table writer.
#include <QString>

#include "core/report/table.h"

class QCustomPlot;

namespace finestra::ui {

/// Writes the plot to `path` (suffix .png, .svg or .pdf) at width × height pixels (points for PDF).
/// Throws InputError naming the path for an unknown suffix or a failed write.
void exportFigure(QCustomPlot& plot, const QString& path, int width, int height);
/// Writes the table as CSV, atomically. Throws InputError naming the path.
void exportTableCsv(const Table& table, const QString& path);

}  // namespace finestra::ui
