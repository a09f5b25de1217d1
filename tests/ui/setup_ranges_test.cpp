// The setup panel's widgets take their ranges from the parameter table: every box accepts exactly
// what the project reader accepts (no 12 T slider beside a 1000 T reader).
#include <QDoubleSpinBox>
#include <QSpinBox>
#include <gtest/gtest.h>

#include "core/centre/parameter_table.h"
#include "ui/document.h"
#include "ui/setup/setup_panel.h"

namespace finestra::ui {
namespace {

struct Expected {
  const char* key;
  double displayScale;  ///< shown value per stored value
};

TEST(SetupRanges, EveryTableBackedBoxHasTheTableRangeAndHelp) {
  ProjectDocument doc;
  doc.open(QStringLiteral(FINESTRA_SOURCE_DIR "/examples/membrane-vector-magnet.json"));
  SetupPanel panel(doc);
  const std::vector<Expected> boxes{
      {"field.magnitude_T", 1},          {"field.polar_deg", 1},           {"field.azimuth_deg", 1},
      {"strain.crystal.xx", 1e6},        {"strain.crystal.yy", 1e6},       {"strain.crystal.zz", 1e6},
      {"strain.crystal.yz", 1e6},        {"strain.crystal.zx", 1e6},       {"strain.crystal.xy", 1e6},
      {"strain.eg_ground.magnitude_GHz", 1}, {"strain.eg_ground.angle_deg", 1},
      {"strain.eg_excited.magnitude_GHz", 1}, {"strain.eg_excited.angle_deg", 1},
      {"conditions.temperature_K", 1},   {"conditions.broadening_GHz", 1},
  };
  for (const Expected& e : boxes) {
    SCOPED_TRACE(e.key);
    const QuantitySpec& q = quantity(e.key);
    const auto* box = panel.findChild<QDoubleSpinBox*>(QString::fromUtf8(e.key));
    ASSERT_NE(box, nullptr);
    EXPECT_DOUBLE_EQ(box->minimum(), q.minimum * e.displayScale);
    EXPECT_DOUBLE_EQ(box->maximum(), q.maximum * e.displayScale);
    EXPECT_DOUBLE_EQ(box->singleStep(), q.guiStep * e.displayScale);
    EXPECT_TRUE(box->toolTip().contains(QString::fromStdString(q.help)));
  }
  const auto* points = panel.findChild<QSpinBox*>(QStringLiteral("sweeps.points"));
  ASSERT_NE(points, nullptr);
  EXPECT_EQ(points->minimum(), static_cast<int>(quantity("sweeps.points").minimum));
  EXPECT_EQ(points->maximum(), static_cast<int>(quantity("sweeps.points").maximum));
  const auto* vector = panel.findChild<QWidget*>(QStringLiteral("field.vector_T"));
  ASSERT_NE(vector, nullptr);
  const auto components = vector->findChildren<QDoubleSpinBox*>();
  ASSERT_EQ(components.size(), 3);
  for (const QDoubleSpinBox* c : components) {
    EXPECT_DOUBLE_EQ(c->minimum(), -kMaxFieldT);
    EXPECT_DOUBLE_EQ(c->maximum(), kMaxFieldT);
  }
}

}  // namespace
}  // namespace finestra::ui
