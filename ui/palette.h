#pragma once
// Colour-blind-safe palettes for classes, levels and overlays. Two choices, both built from
// published colour-vision-deficiency-safe sets and re-ordered by us so that the first four
// colours (the four orientation classes) stay far apart in hue and lightness:
//   "Harbour" — from the Okabe & Ito (2008) "Color Universal Design" set;
//   "Heath"   — from Paul Tol's "muted" qualitative scheme (Tol, SRON technical note, 2021).
#include <QColor>
#include <QString>
#include <QStringList>
#include <vector>

namespace finestra::ui {

struct Palette {
  QString name;
  std::vector<QColor> series;  ///< cycled for classes and tracked levels
  QColor measured;             ///< measured peaks and spectra
  QColor marker;               ///< current-point marker
  QColor color(int index) const { return series[static_cast<std::size_t>(index) % series.size()]; }
};

/// Available palette names, first is the default.
QStringList paletteNames();
/// Palette by name; the default for an unknown name.
const Palette& paletteByName(const QString& name);

}  // namespace finestra::ui
