#include "ui/setup/strain_section.h"

#include <QFormLayout>
#include <QGridLayout>
#include <QLabel>
#include <QSignalBlocker>
#include <QVBoxLayout>
#include <array>
#include <string>

#include "ui/setup/setup_widgets.h"

namespace finestra::ui {
namespace {

constexpr double kStrainScale = 1e-6;  // the spin boxes show units of 10⁻⁶
const std::array<std::pair<int, int>, 6> kStrainIndex{{{0, 0}, {1, 1}, {2, 2}, {1, 2}, {2, 0}, {0, 1}}};
const std::array<const char*, 6> kStrainNames{"xx", "yy", "zz", "yz", "zx", "xy"};
// Parameter-table keys of the four E-strain boxes (ground magnitude, angle, excited magnitude, angle).
constexpr std::array<const char*, 4> kEgStrainKeys{"strain.eg_ground.magnitude_GHz", "strain.eg_ground.angle_deg",
                                                   "strain.eg_excited.magnitude_GHz", "strain.eg_excited.angle_deg"};

}  // namespace

StrainSection::StrainSection(ProjectDocument& document, QWidget* parent) : SetupSection(tr("Strain"), document, parent) {
  auto* layout = new QVBoxLayout(this);
  auto* grid = new QGridLayout;
  for (std::size_t i = 0; i < 6; ++i) {
    tensor_[i] = makeSpinBox(0, 0, 3, "");
    applyQuantity(tensor_[i], "strain.crystal." + std::string(kStrainNames[i]), 1 / kStrainScale);
    grid->addWidget(new QLabel(QStringLiteral("\u03b5_%1").arg(kStrainNames[i])), static_cast<int>(i / 3) * 2, static_cast<int>(i % 3));
    grid->addWidget(tensor_[i], static_cast<int>(i / 3) * 2 + 1, static_cast<int>(i % 3));
    connect(tensor_[i], &QDoubleSpinBox::valueChanged, this, [this, i](double v) {
      this->document().edit(tr("Strain %1").arg(kStrainNames[i]), [&](Project& p) {
        const auto [r, c] = kStrainIndex[i];
        p.strain.crystal(r, c) = v * kStrainScale;
        p.strain.crystal(c, r) = v * kStrainScale;
      });
    });
  }
  layout->addWidget(new QLabel(tr("Crystal-frame tensor, units of 10\u207b\u2076")));
  layout->addLayout(grid);
  auto* eg = new QFormLayout;
  const std::array<QString, 4> names{tr("ground |\u03b5_Eg| (GHz)"), tr("ground angle"), tr("excited |\u03b5_Eg| (GHz)"),
                                     tr("excited angle")};
  for (std::size_t i = 0; i < 4; ++i) {
    extra_[i] = i % 2 == 0 ? makeSpinBox(0, 0, 3, "") : makeSpinBox(0, 0, 2, "\u00b0");
    applyQuantity(extra_[i], kEgStrainKeys[i]);
    eg->addRow(names[i], extra_[i]);
    connect(extra_[i], &QDoubleSpinBox::valueChanged, this, [this, i](double v) {
      this->document().edit(tr("E-type strain"), [&](Project& p) {
        EgStrain& e = i < 2 ? p.strain.extraGround : p.strain.extraExcited;
        (i % 2 == 0 ? e.magnitudeGHz : e.angleDeg) = v;
      });
    });
  }
  layout->addWidget(new QLabel(tr("Extra E-type strain per manifold (defect frame, added to the tensor)")));
  layout->addLayout(eg);
  refresh();
}

void StrainSection::refresh() {
  const StrainSetting& s = document().project().strain;
  for (std::size_t i = 0; i < 6; ++i) {
    const QSignalBlocker block(tensor_[i]);
    const auto [r, c] = kStrainIndex[i];
    tensor_[i]->setValue(s.crystal(r, c) / kStrainScale);
  }
  const std::array<double, 4> eg{s.extraGround.magnitudeGHz, s.extraGround.angleDeg, s.extraExcited.magnitudeGHz,
                                 s.extraExcited.angleDeg};
  for (std::size_t i = 0; i < 4; ++i) {
    const QSignalBlocker block(extra_[i]);
    extra_[i]->setValue(eg[i]);
  }
}

}  // namespace finestra::ui
