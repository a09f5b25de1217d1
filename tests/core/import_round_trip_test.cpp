// One validity rule for every reader: whatever the peaks and spectrum CSV imports accept, even at
// the edges of their limits, goes into a project that the project reader opens again unchanged.
#include <gtest/gtest.h>

#include <string>

#include "core/common/errors.h"
#include "core/common/limits.h"
#include "core/io/measured_validity.h"
#include "core/io/peak_csv.h"
#include "core/io/project_file.h"
#include "core/io/spectrum_csv.h"

using namespace finestra;

namespace {

Project projectWithImports(const std::vector<MeasurementSet>& sets, const MeasuredSpectrum& spectrum) {
  Project p;
  p.centre.preset = "SiV-";
  p.field = FieldSetting::fromAngles(0.5, 54.7356, 0.0);
  p.measurements = sets;
  p.measuredSpectrum = spectrum;
  return p;
}

}  // namespace

TEST(ImportRoundTrip, ValuesAtTheImportLimitsOpenAgainAfterSaving) {
  const std::string longName(limits::kMaxNameBytes, 'n');
  const std::string peaks =
      "\xEF\xBB\xBFmeasurement,field_T,polar_deg,azimuth_deg,position,unit,sigma,analyser_deg,temperature_K\r\n"
      "caf\xC3\xA9 set,1000,180,-360,406.7,THz,1.01e-9,45,0\r\n" +        // strongest field, smallest sigma
      longName + ",0,0,0,-99999,GHz_detuning,1.01e-6,,1000\r\n" +          // longest name, farthest detuning
      "edge,0.5,54.7,0,100.0001,nm_vac,0.001,,\r\n"                      // shortest wavelength
      "edge,0.5,54.7,0,2999999,GHz,1.01e-6,,\r\n";                          // highest absolute frequency
  const auto sets = parsePeakCsv(peaks, "edges.csv");
  const MeasuredSpectrum spectrum = parseSpectrumCsv("nm_air,signal\n737.1,0\n737.2,-1e300\n", "edges_spectrum.csv", std::nullopt);
  const Project original = projectWithImports(sets, spectrum);
  const std::string saved = projectToJson(original);
  const Project reopened = parseProject(saved, "saved.json");
  EXPECT_EQ(projectToJson(reopened), saved);
  ASSERT_EQ(reopened.measurements.size(), sets.size());
  EXPECT_EQ(reopened.measurements[1].name, longName);
}

TEST(ImportRoundTrip, WhatTheProjectReaderRefusesTheImportRefusesToo) {
  // Each value just beyond a limit: both readers refuse it (the CSV names the row, the project the key).
  const std::string header = "measurement,field_T,polar_deg,azimuth_deg,position,unit,sigma\n";
  for (const std::string row : {"a,1000.001,0,0,406.7,THz,0.0001", "a,0.5,0,0,-100001,GHz_detuning,0.1",
                                "a,0.5,0,0,406.7,THz,1e-10", "a,0.5,0,0,3000.1,THz,0.001"}) {
    SCOPED_TRACE(row);
    EXPECT_THROW(parsePeakCsv(header + row + "\n", "beyond.csv"), InputError);
  }
  EXPECT_THROW(parsePeakCsv(header + std::string(limits::kMaxNameBytes + 1, 'n') + ",0.5,0,0,406.7,THz,0.0001\n", "name.csv"),
               InputError);
}
