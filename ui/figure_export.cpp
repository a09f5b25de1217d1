#include "ui/figure_export.h"

#include <QFileInfo>
#include <QPainter>
#include <QSvgGenerator>
#include <qcustomplot.h>

#include "core/common/errors.h"
#include "core/io/text_file.h"

namespace finestra::ui {

void exportFigure(QCustomPlot& plot, const QString& path, int width, int height) {
  const QString suffix = QFileInfo(path).suffix().toLower();
  bool ok = false;
  if (suffix == "png") {
    ok = plot.savePng(path, width, height, 1.0, -1, 144);
  } else if (suffix == "pdf") {
    ok = plot.savePdf(path, width, height);
  } else if (suffix == "svg") {
    QSvgGenerator generator;
    generator.setFileName(path);
    generator.setSize(QSize(width, height));
    generator.setViewBox(QRect(0, 0, width, height));
    generator.setTitle("Finestra figure");
    QCPPainter painter;
    ok = painter.begin(&generator);
    if (ok) {
      plot.toPainter(&painter, width, height);
      ok = painter.end();
    }
    ok = ok && QFileInfo(path).size() > 0;
  } else {
    throw InputError(path.toStdString(), "unknown figure type '" + suffix.toStdString() + "' (use .png, .svg or .pdf)");
  }
  if (!ok) throw InputError(path.toStdString(), "could not write the figure");
}

void exportTableCsv(const Table& table, const QString& path) {
  writeFileAtomically(path.toStdString(), table.toCsv());
}

}  // namespace finestra::ui
