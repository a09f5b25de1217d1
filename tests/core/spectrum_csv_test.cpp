// Measured-spectrum CSV reader: unit from the header or chosen on import; errors with file:line.
#include <gtest/gtest.h>

#include "core/common/errors.h"
#include "core/io/spectrum_csv.h"

namespace finestra {
namespace {

std::string errorOf(const std::string& text, std::optional<SpectralUnit> unit = std::nullopt) {
  try {
    parseSpectrumCsv(text, "dir/spec.csv", unit);
  } catch (const InputError& e) {
    return e.what();
  }
  return "no error";
}

TEST(SpectrumCsv, UnitFromHeader) {
  const auto s = parseSpectrumCsv("# invented\nnm_air,counts\n736.9,10\n737.0,12.5\n", "dir/spec.csv");
  EXPECT_EQ(s.unit, SpectralUnit::NmAir);
  EXPECT_EQ(s.name, "spec.csv");
  ASSERT_EQ(s.position.size(), 2u);
  EXPECT_DOUBLE_EQ(s.signal[1], 12.5);
}

TEST(SpectrumCsv, UnitChosenOnImport) {
  const auto s = parseSpectrumCsv("-10\t1\n10\t2\n", "x.csv", SpectralUnit::GHzDetuning);
  EXPECT_EQ(s.unit, SpectralUnit::GHzDetuning);
  EXPECT_DOUBLE_EQ(s.position[0], -10);
  const auto t = parseSpectrumCsv("position,signal\n406.1,1\n406.2,2\n", "x.csv", SpectralUnit::THz);
  EXPECT_EQ(t.unit, SpectralUnit::THz);
}

TEST(SpectrumCsv, ErrorsNameFileAndLine) {
  EXPECT_NE(errorOf("THz,counts\n406.1,1\n406.2,abc\n").find("dir/spec.csv:3: signal"), std::string::npos);
  EXPECT_NE(errorOf("THz,counts\n406.1,1,7\n").find("dir/spec.csv:2: expected two columns"), std::string::npos);
  EXPECT_NE(errorOf("position,counts\n406.1,1\n").find("dir/spec.csv:1"), std::string::npos);
  EXPECT_NE(errorOf("406.1,1\n406.2,1\n").find("dir/spec.csv:1"), std::string::npos);
  EXPECT_NE(errorOf("THz,counts\n406.1,1\n", SpectralUnit::NmVacuum).find("differs"), std::string::npos);
  EXPECT_NE(errorOf("THz,counts\n406.1,1\n").find("at least two"), std::string::npos);
  EXPECT_NE(errorOf("nm_vac,counts\n0,1\n1,1\n").find("dir/spec.csv:2"), std::string::npos);
}

}  // namespace
}  // namespace finestra
