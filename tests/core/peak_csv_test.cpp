// Measured-peak CSV reader: grouping into measurements, and errors that name file and line.
#include <gtest/gtest.h>

#include <cmath>

#include "core/common/errors.h"
#include "core/io/peak_csv.h"

namespace finestra {
namespace {

const char* kGood =
    "# invented test data\n"
    "measurement,field_T,polar_deg,azimuth_deg,position,unit,sigma,analyser_deg\n"
    "scan A,0.3,90,0,406.6521,THz,0.0003,\n"
    "\n"
    "scan A,0.3,90,0,-25.5,GHz_detuning,0.2,90\n"
    "\"scan, B\",0.5,54.7356,0,737.1,nm_air,0.002,0\n";

TEST(PeakCsv, GroupsRowsByMeasurementName) {
  const auto sets = parsePeakCsv(kGood, "peaks.csv");
  ASSERT_EQ(sets.size(), 2u);
  EXPECT_EQ(sets[0].name, "scan A");
  ASSERT_EQ(sets[0].peaks.size(), 2u);
  EXPECT_DOUBLE_EQ(sets[0].field.magnitudeT, 0.3);
  EXPECT_EQ(sets[0].peaks[0].unit, SpectralUnit::THz);
  EXPECT_FALSE(sets[0].peaks[0].analyserLab.has_value());
  ASSERT_TRUE(sets[0].peaks[1].analyserLab.has_value());
  EXPECT_NEAR((*sets[0].peaks[1].analyserLab - Vec3(0, 1, 0)).norm(), 0.0, 1e-12);
  EXPECT_EQ(sets[1].name, "scan, B");
  EXPECT_EQ(sets[1].peaks[0].unit, SpectralUnit::NmAir);
}

std::string errorOf(const std::string& text) {
  try {
    parsePeakCsv(text, "bad.csv");
  } catch (const InputError& e) {
    return e.what();
  }
  return "no error";
}

TEST(PeakCsv, BadNumberNamesFileAndLine) {
  const std::string text =
      "measurement,field_T,polar_deg,azimuth_deg,position,unit,sigma\n"
      "s,0.3,90,0,406.65,THz,0.001\n"
      "s,0.3,90,0,4o6.65,THz,0.001\n";
  const std::string e = errorOf(text);
  EXPECT_NE(e.find("bad.csv:3"), std::string::npos) << e;
  EXPECT_NE(e.find("position"), std::string::npos) << e;
}

TEST(PeakCsv, OtherErrorsNameTheirLine) {
  const std::string head = "measurement,field_T,polar_deg,azimuth_deg,position,unit,sigma\n";
  EXPECT_NE(errorOf(head + "s,0.3,90,0,406.65,furlong,0.001\n").find("bad.csv:2"), std::string::npos);
  EXPECT_NE(errorOf(head + "s,0.3,90,0,406.65,THz,0\n").find("bad.csv:2: sigma"), std::string::npos);
  EXPECT_NE(errorOf(head + "s,-1,90,0,406.65,THz,1\n").find("bad.csv:2: field_T"), std::string::npos);
  EXPECT_NE(errorOf(head + "s,0.3,90,0,-5,nm_vac,1\n").find("bad.csv:2"), std::string::npos);
  EXPECT_NE(errorOf(head + "s,0.3,90,0,406,THz,1\ns,0.4,90,0,406,THz,1\n").find("bad.csv:3"), std::string::npos);
  EXPECT_NE(errorOf("measurement,field_T,position\n").find("bad.csv:1: missing column"), std::string::npos);
  EXPECT_NE(errorOf(head + "\"s,0.3\n").find("bad.csv:2: unterminated"), std::string::npos);
  EXPECT_NE(errorOf(head).find("no peak rows"), std::string::npos);
}

}  // namespace
}  // namespace finestra
