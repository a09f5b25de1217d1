#include "ui/palette.h"

namespace finestra::ui {
namespace {

const std::vector<Palette>& palettes() {
  static const std::vector<Palette> all{
      {"Harbour",
       {QColor("#0072B2"), QColor("#E69F00"), QColor("#009E73"), QColor("#CC79A7"), QColor("#56B4E9"),
        QColor("#D55E00"), QColor("#F0E442"), QColor("#5A5A5A")},
       QColor("#000000"),
       QColor("#D55E00")},
      {"Heath",
       {QColor("#332288"), QColor("#DDCC77"), QColor("#117733"), QColor("#CC6677"), QColor("#88CCEE"),
        QColor("#882255"), QColor("#44AA99"), QColor("#999933"), QColor("#AA4499")},
       QColor("#202020"),
       QColor("#882255")},
  };
  return all;
}

}  // namespace

QStringList paletteNames() {
  QStringList names;
  for (const Palette& p : palettes()) names << p.name;
  return names;
}

const Palette& paletteByName(const QString& name) {
  for (const Palette& p : palettes())
    if (p.name == name) return p;
  return palettes().front();
}

}  // namespace finestra::ui
