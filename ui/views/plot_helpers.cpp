#include "ui/views/plot_helpers.h"

#include <QLabel>

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
    auto* b = new QToolButton(this);
    b->setCheckable(true);
    b->setChecked(true);
    b->setText(className(c));
    b->setToolTip(tr("Show or hide orientation class %1").arg(c));
    connect(b, &QToolButton::toggled, this, &ClassFilterBar::filterChanged);
    layout_->addWidget(b);
    buttons_[static_cast<std::size_t>(c)] = b;
  }
  layout_->addStretch(1);
}

void ClassFilterBar::applyPalette(const Palette& palette, bool colourByClass) {
  for (int c = 0; c < 4; ++c) {
    QToolButton* b = buttons_[static_cast<std::size_t>(c)];
    if (colourByClass)
      b->setStyleSheet(QStringLiteral("QToolButton{border-left:6px solid %1; padding:2px 6px;}"
                                      "QToolButton:!checked{color:#999;}")
                           .arg(palette.color(c).name()));
    else
      b->setStyleSheet(QStringLiteral("QToolButton{padding:2px 6px;} QToolButton:!checked{color:#999;}"));
  }
}

}  // namespace finestra::ui
