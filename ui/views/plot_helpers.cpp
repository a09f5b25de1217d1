#include "ui/views/plot_helpers.h"

#include <QCheckBox>
#include <QLabel>
#include <QPainter>

#include "core/crystal/frames.h"

namespace finestra::ui {

void stylePlot(QCustomPlot& plot) {
  plot.setInteractions(QCP::iRangeDrag | QCP::iRangeZoom);
  plot.setNoAntialiasingOnDrag(true);
  plot.setAntialiasedElements(QCP::aePlottables);
  QFont font = plot.font();
  font.setPointSize(9);
  plot.legend->setFont(font);
  plot.legend->setBrush(QColor(255, 255, 255, 220));
  plot.legend->setBorderPen(QPen(QColor(180, 180, 180)));
}

Qt::PenStyle classPenStyle(int cls) {
  static constexpr std::array<Qt::PenStyle, 4> styles{Qt::SolidLine, Qt::DashLine, Qt::DotLine, Qt::DashDotLine};
  return styles[static_cast<std::size_t>(cls) % styles.size()];
}

QString className(int cls) {
  const auto a = classAxisIndices(cls);
  QString axis;
  for (int v : a) axis += v < 0 ? QStringLiteral("\u03051") : QStringLiteral("1");
  return QStringLiteral("class %1 [%2]").arg(cls).arg(axis);
}

ClassFilterBar::ClassFilterBar(QWidget* parent) : QWidget(parent), layout_(new QHBoxLayout(this)) {
  layout_->setContentsMargins(0, 0, 0, 0);
  layout_->addWidget(new QLabel(tr("Show:"), this));
  for (int c = 0; c < 4; ++c) {
    auto* b = new QCheckBox(this);
    b->setChecked(true);
    b->setText(className(c));
    b->setToolTip(tr("Show or hide orientation class %1").arg(c));
    connect(b, &QCheckBox::toggled, this, &ClassFilterBar::filterChanged);
    layout_->addWidget(b);
    buttons_[static_cast<std::size_t>(c)] = b;
  }
  layout_->addStretch(1);
}

void ClassFilterBar::applyPalette(const Palette& palette, bool colourByClass) {
  for (int c = 0; c < 4; ++c) {
    QCheckBox* b = buttons_[static_cast<std::size_t>(c)];
    QPixmap swatch(14, 14);
    swatch.fill(colourByClass ? palette.color(c) : QColor(Qt::transparent));
    if (!colourByClass) {
      QPainter painter(&swatch);
      painter.setPen(QPen(Qt::black, 1.6, classPenStyle(c)));
      painter.drawLine(0, 7, 14, 7);
    }
    b->setIcon(QIcon(swatch));
  }
}

}  // namespace finestra::ui
