#include "ui/file_names.h"

#include <QFileInfo>
#include <QRegularExpression>

namespace finestra::ui {

QStringList filterExtensions(const QString& filters) {
  static const QRegularExpression pattern(QStringLiteral(R"(\*\.([A-Za-z0-9_]+))"));
  QStringList extensions;
  for (const QRegularExpressionMatch& m : pattern.globalMatch(filters)) extensions << m.captured(1).toLower();
  return extensions;
}

QString withOfferedExtension(const QString& path, const QString& chosenFilter, const QString& filters) {
  if (path.isEmpty()) return path;
  const QStringList offered = filterExtensions(filters);
  if (offered.contains(QFileInfo(path).suffix().toLower())) return path;
  QStringList chosen = filterExtensions(chosenFilter);
  if (chosen.isEmpty()) chosen = offered;
  return chosen.isEmpty() ? path : path + '.' + chosen.front();
}

}  // namespace finestra::ui
