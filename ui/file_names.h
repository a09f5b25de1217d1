#pragma once
// File names typed into save dialogs: a name without one of the offered extensions gets the
// extension of the chosen file type ("peaks" with "CSV (*.csv)" becomes "peaks.csv").
#include <QString>
#include <QStringList>

namespace finestra::ui {

/// The extensions named in a dialog filter, in order: "PNG (*.png);;SVG (*.svg)" gives png, svg.
QStringList filterExtensions(const QString& filters);

/// `path` when its extension is one of `filters` (any case); otherwise `path` plus the first
/// extension of `chosenFilter` (the type picked in the dialog), or of `filters` when none was picked.
QString withOfferedExtension(const QString& path, const QString& chosenFilter, const QString& filters);

}  // namespace finestra::ui
