// Strain of many invented emitters from a CSV of zero-field lines: each emitter's |ε_Eg| is
// recovered within 3σ, the summary median/spread follow their definitions, a mislabelled emitter
// is called out, the coupling verdicts follow the ratio test, and bad files name line and column.
#include <gtest/gtest.h>

#include <cmath>
#include <random>
#include <sstream>

#include "core/common/errors.h"
#include "core/common/robust_statistics.h"
#include "core/strain/strain_map.h"
#include "test_support.h"

namespace finestra {
namespace {

struct Truth {
  double egG, egU;
};

// Lines of the zero-field pattern: A = c + Δu/2 + Δg/2, B = c + Δu/2 − Δg/2, C = c − Δu/2 + Δg/2,
// D = c − Δu/2 − Δg/2, with Δ_m = √(λ_m² + 4|ε_m|²) (the splitting formula of Meesala et al.,
// PRB 97, 205444 (2018), inverted: |ε| = √(Δ² − λ²)/2).
std::string inventCsv(const std::vector<Truth>& truth, const ManifoldModel& g, const ManifoldModel& u, double zpl, double sigma,
                      std::mt19937& rng) {
  std::normal_distribution<double> noise(0.0, sigma);
  std::ostringstream csv;
  csv << "# invented emitters for a test\nemitter,unit,A,A_sigma,B,B_sigma,C,C_sigma,D,D_sigma,x_um,y_um\n";
  csv.precision(12);
  for (std::size_t k = 0; k < truth.size(); ++k) {
    const double dg = std::sqrt(g.lambda * g.lambda + 4 * truth[k].egG * truth[k].egG);
    const double du = std::sqrt(u.lambda * u.lambda + 4 * truth[k].egU * truth[k].egU);
    const double c = zpl + 3.0;
    const double lines[4] = {c + du / 2 + dg / 2, c + du / 2 - dg / 2, c - du / 2 + dg / 2, c - du / 2 - dg / 2};
    csv << "e" << k << ",GHz";
    for (double l : lines) csv << ',' << l + noise(rng) << ',' << sigma;
    csv << ',' << 10.0 * static_cast<double>(k) << ",0\n";
  }
  return csv.str();
}

class PeaksStrainMap : public ::testing::Test {
protected:
  CentreModel model{testing::setupFor("SiV-")};
  const ManifoldModel& g = model.manifold(Manifold::Ground);
  const ManifoldModel& u = model.manifold(Manifold::Excited);
};

TEST_F(PeaksStrainMap, RecoversEveryEmitterAndSummarises) {
  std::mt19937 rng(99);
  std::uniform_real_distribution<double> eg(20.0, 80.0);
  std::vector<Truth> truth;
  for (int k = 0; k < 40; ++k) {
    const double e = eg(rng);
    truth.push_back({e, e * u.d / g.d});  // pure d-type coupling
  }
  const auto emitters = parseEmitterLinesCsv(inventCsv(truth, g, u, model.zplGHz(), 0.05, rng), "map.csv", model.zplGHz());
  const StrainMap map = estimateStrainMap(emitters, g, u, model.zplGHz());
  ASSERT_EQ(map.emitters.size(), truth.size());
  int within = 0;
  std::vector<double> values;
  for (std::size_t k = 0; k < truth.size(); ++k) {
    const auto& e = map.emitters[k].estimate;
    within += std::abs(e.egGroundGHz.value - truth[k].egG) < 3 * e.egGroundGHz.standardError;
    values.push_back(e.egGroundGHz.value);
  }
  EXPECT_GE(within, 38);
  EXPECT_LE(map.readingsDisagree, 2);
  EXPECT_GE(map.pureDFits, 37) << "the invented emitters follow pure d-type coupling";
  EXPECT_EQ(map.summary[0].count, 40);
  EXPECT_DOUBLE_EQ(map.summary[0].median, median(values));
  EXPECT_DOUBLE_EQ(map.summary[0].spread, robustSpread(values));
  EXPECT_TRUE(map.emitters[3].input.xUm.has_value());
  EXPECT_DOUBLE_EQ(*map.emitters[3].input.xUm, 30.0);
}

TEST_F(PeaksStrainMap, MislabelledLinesAndMixedCouplingGetPlainVerdicts) {
  std::mt19937 rng(1);
  // Emitter 0: A and B swapped (readings disagree). Emitter 1: ratio far from d and from f.
  const std::vector<Truth> truth{{40, 40 * u.d / g.d}, {40, 40 * u.d / g.d * 3.0}};
  std::string csv = inventCsv(truth, g, u, model.zplGHz(), 0.01, rng);
  std::istringstream in(csv);
  std::string line, out;
  while (std::getline(in, line)) {
    if (line.rfind("e0,", 0) == 0) {
      // swap A and B (columns 2 and 4): A−B−C+D becomes −2Δg
      std::vector<std::string> cells;
      std::stringstream ss(line);
      std::string c;
      while (std::getline(ss, c, ',')) cells.push_back(c);
      std::swap(cells[2], cells[4]);
      line.clear();
      for (std::size_t i = 0; i < cells.size(); ++i) line += (i ? "," : "") + cells[i];
    }
    out += line + "\n";
  }
  const StrainMap map = estimateStrainMap(parseEmitterLinesCsv(out, "m.csv", model.zplGHz()), g, u, model.zplGHz());
  EXPECT_FALSE(map.emitters[0].verdict.readingsAgree);
  EXPECT_NE(map.emitters[0].verdict.readings.find("DISAGREE"), std::string::npos);
  EXPECT_FALSE(map.emitters[1].verdict.pureDFits);
  EXPECT_NE(map.emitters[1].verdict.cannotDetermine.find("E-strain angle"), std::string::npos);
  EXPECT_NE(map.emitters[1].verdict.units.find("defect frame"), std::string::npos);
  if (!map.emitters[1].verdict.pureFFits) {
    EXPECT_NE(map.emitters[1].verdict.overall.find("NEITHER"), std::string::npos);
  }
}

TEST_F(PeaksStrainMap, AgreeingReadingsSayWithinHowManySigma) {
  ZeroFieldLines lines;
  const double c = model.zplGHz(), dg = 100, du = 300;
  lines.frequencyGHz = {c + du / 2 + dg / 2, c + du / 2 - dg / 2, c - du / 2 + dg / 2 + 0.22, c - du / 2 - dg / 2};
  lines.sigmaGHz = {0.1, 0.1, 0.1, 0.1};
  const StrainVerdict v = strainVerdict(estimateZeroFieldStrain(lines, g, u, c));
  // mismatch 0.22 GHz over σ = √4 · 0.1 = 0.2 GHz: 1.1σ.
  EXPECT_EQ(v.readings.rfind("readings agree within 1.1σ", 0), 0u) << v.readings;
}

TEST_F(PeaksStrainMap, BadFilesNameLineAndColumn) {
  const double zpl = model.zplGHz();
  try {
    parseEmitterLinesCsv("emitter,unit,A,A_sigma,B,B_sigma,C,C_sigma,D\n", "m.csv", zpl);
    FAIL();
  } catch (const InputError& e) {
    EXPECT_NE(std::string(e.what()).find("m.csv:1"), std::string::npos);
    EXPECT_NE(std::string(e.what()).find("D_sigma"), std::string::npos);
  }
  try {
    parseEmitterLinesCsv("emitter,unit,A,A_sigma,B,B_sigma,C,C_sigma,D,D_sigma\ne1,GHz,1,0.1,1,0.1,1,-2,1,0.1\n", "m.csv", zpl);
    FAIL();
  } catch (const InputError& e) {
    EXPECT_NE(std::string(e.what()).find("m.csv:2"), std::string::npos);
    EXPECT_NE(std::string(e.what()).find("C_sigma"), std::string::npos);
  }
  EXPECT_THROW(parseEmitterLinesCsv("emitter,unit,A,A_sigma,B,B_sigma,C,C_sigma,D,D_sigma\ne1,furlong,1,1,1,1,1,1,1,1\n", "m.csv", zpl),
               InputError);
}

}  // namespace
}  // namespace finestra
