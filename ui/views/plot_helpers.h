#pragma once
// Shared look and small helpers of the plot views.
#include <QHBoxLayout>
#include <QCheckBox>
#include <QWidget>
#include <array>
#include <qcustomplot.h>

#include "ui/palette.h"

namespace finestra::ui {

/// Fonts, grid and interactions shared by every figure.
void stylePlot(QCustomPlot& plot);
/// Pen style that tells the four classes apart where colour is used for something else.
Qt::PenStyle classPenStyle(int cls);

/// A row of four checkable buttons, one per orientation class, coloured by the palette.
class ClassFilterBar : public QWidget {
  Q_OBJECT
public:
  explicit ClassFilterBar(QWidget* parent = nullptr);
  bool visible(int cls) const { return buttons_[static_cast<std::size_t>(cls)]->isChecked(); }
  void applyPalette(const Palette& palette, bool colourByClass);
  QHBoxLayout* layout() const { return layout_; }

Q_SIGNALS:
  void filterChanged();

private:
  std::array<QCheckBox*, 4> buttons_{};
  QHBoxLayout* layout_ = nullptr;
};

/// Text of a class for legends: "class 0 [111]".
QString className(int cls);

}  // namespace finestra::ui
