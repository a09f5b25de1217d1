// The spectrum fit against the peak route on invented spectra whose lines overlap: spectra are
// made here from an invented truth (E-strain in both manifolds, a miscalibrated magnet) with the
// model's line positions and weights, Lorentzian lines of one width, a scale, a baseline and
// seeded Gaussian noise. The spectrum fit must recover strain and field scale within 3σ and land
// closer to the truth than picking peaks and fitting their positions.
#include <gtest/gtest.h>

#include <cmath>
#include <iostream>
#include <random>

#include "core/common/errors.h"
#include "core/peaks/spectrum_fit.h"
#include "core/peaks/peak_finder.h"
#include "fit_test_support.h"

namespace finestra {
namespace {

using namespace finestra::testing;

const std::vector<std::string> kFree{"eg_strain_g_GHz", "eg_strain_u_GHz", "field_scale"};

struct Scenario {
  Project project;  ///< the starting project (measurement sets give the fields; no peaks)
  FitState truth;
  std::vector<SpectrumData> spectra;
};

// Three magnet settings; PL at 4 K, lines 6 GHz wide so that neighbours overlap.
Scenario inventScenario(std::uint64_t seed) {
  std::mt19937_64 rng(seed);
  Scenario s;
  Project base = scenarioProject("SiV-");
  base.classes = {0, 1};
  const double polar[3] = {30, 60, 80}, azimuth[3] = {10, 100, 200}, magnitude[3] = {0.4, 0.6, 0.8};
  for (int k = 0; k < 3; ++k) {
    MeasurementSet m;
    m.name = "setting " + std::to_string(k);
    m.field = FieldSetting::fromAngles(magnitude[k], polar[k], azimuth[k]);
    base.measurements.push_back(m);
  }
  s.truth = initialFitState(base);
  s.truth.strain.extraGround = {40.0, 0.0};
  s.truth.strain.extraExcited = {70.0, 0.0};
  s.truth.fieldScale = 1.015;
  s.project = base;
  s.project.strain.extraGround = {38.5, 0.0};
  s.project.strain.extraExcited = {71.5, 0.0};

  const FitProblem problem = prepareFitProblem(base, kFree, false);
  const CentreModel model(fitStateSetup(s.truth, problem.baseSetup));
  std::normal_distribution<double> noise(0.0, 1.0);
  const double width = 6.0, scale = 400.0, baseline = 10.0;
  for (int k = 0; k < 3; ++k) {
    std::vector<ClassSolution> solutions;
    for (int cls : problem.classes) solutions.push_back(model.solve(cls, setFieldCrystal(problem, s.truth, k)));
    const auto lines = weightLines(model, solutions, SpectrumKind::Emission);
    double lo = 1e300, hi = -1e300;
    for (const auto& w : lines)
      if (w.weight > 1e-3) {
        lo = std::min(lo, w.line->frequencyGHz);
        hi = std::max(hi, w.line->frequencyGHz);
      }
    SpectrumData d;
    d.name = "invented " + std::to_string(k);
    d.set = k;
    for (int i = 0; i < 1200; ++i) {
      const double f = lo - 40 + (hi - lo + 80) * i / 1199.0;
      double y = baseline;
      for (const auto& w : lines) y += scale * w.weight * lorentzian(f - w.line->frequencyGHz, width);
      d.frequencyGHz.push_back(f);
      d.signal.push_back(y + noise(rng));
    }
    s.spectra.push_back(d);
  }
  return s;
}

// The peak route: find peaks in each spectrum, then assign and fit their positions.
FitResult peakRoute(const Scenario& s) {
  Project p = s.project;
  for (const SpectrumData& d : s.spectra) {
    const PeakFinderResult found = findPeaks(d.frequencyGHz, d.signal, {}, d.name);
    for (const FoundPeak& f : found.peaks) {
      MeasuredPeak m;
      m.position = f.position;
      m.unit = SpectralUnit::GHzAbsolute;
      m.sigma = std::isfinite(f.positionSigma) ? f.positionSigma : 1.0;
      p.measurements[static_cast<std::size_t>(d.set)].peaks.push_back(m);
    }
  }
  FitOptions o;
  o.free = kFree;
  o.starts = 4;
  return fitProject(p, o);
}

double value(const std::vector<FittedParameter>& ps, const std::string& name, double* sigma = nullptr) {
  for (const auto& p : ps)
    if (p.name == name) {
      if (sigma) *sigma = p.standardError;
      return p.value;
    }
  return NAN;
}

TEST(PeaksSpectrumFit, RecoversStrainAndFieldScaleAndBeatsThePeakRoute) {
  int spectrumCloser = 0;
  const int seeds = 3;
  for (int seed = 1; seed <= seeds; ++seed) {
    const Scenario s = inventScenario(static_cast<std::uint64_t>(seed) * 104729ULL);
    SpectrumFitOptions o;
    o.free = kFree;
    const SpectrumFitResult fit = fitSpectra(s.project, s.spectra, o);
    ASSERT_TRUE(fit.converged) << fit.status;
    EXPECT_TRUE(fit.undetermined.empty());
    EXPECT_LT(fit.chi2PerDof, 1.3) << "the model describes the invented spectra";
    double spectrumError = 0, peakError = 0;
    const FitResult peaks = peakRoute(s);
    for (const std::string& name : kFree) {
      double sigma = 0;
      const double v = value(fit.parameters, name, &sigma);
      const double truth = truthValue(s.truth, name);
      EXPECT_LT(std::abs(v - truth), 3 * sigma) << name << " seed " << seed << ": " << v << " vs " << truth;
      // Errors in units of each parameter's typical scale, so that the routes compare on one footing.
      const double scale = findFitParameter(name)->scale;
      spectrumError += std::pow((v - truth) / scale, 2);
      peakError += std::pow((value(peaks.parameters, name) - truth) / scale, 2);
    }
    std::cout << "seed " << seed << ": squared error in parameter scales, spectrum fit " << spectrumError << ", peak route "
              << peakError << " (peak route: " << peaks.assignedCount << " peaks assigned, chi2/dof " << peaks.chi2PerDof << ")\n";
    if (spectrumError < peakError) ++spectrumCloser;
  }
  EXPECT_EQ(spectrumCloser, seeds) << "the spectrum fit must beat the peak route on overlapping lines";
}

TEST(PeaksSpectrumFit, BadSpectrumNamesItself) {
  Scenario s = inventScenario(1);
  s.spectra[1].set = 7;
  EXPECT_THROW(fitSpectra(s.project, s.spectra), InputError);
  s = inventScenario(1);
  s.spectra[0].signal[3] = NAN;
  try {
    fitSpectra(s.project, s.spectra);
    FAIL();
  } catch (const InputError& e) {
    EXPECT_NE(std::string(e.what()).find("invented 0"), std::string::npos);
  }
}

}  // namespace
}  // namespace finestra
