// Peak finder on invented spectra generated here with a seeded RNG: recovery of known Lorentzian
// peaks (positions within 3σ, pulls of unit width), false peaks on noise, overlapping peaks, and
// the other shapes. Truth is the generating parameters, not anything computed by the finder.
#include <gtest/gtest.h>

#include <cmath>
#include <iostream>
#include <numbers>
#include <random>
#include <vector>

#include "core/common/errors.h"
#include "core/peaks/peak_finder.h"

using namespace finestra;

namespace {

struct TruePeak {
  double position, fwhm, height;
};

struct Invented {
  std::vector<double> x, y;
};

// Lorentzian peaks on a sloped baseline with white Gaussian noise of σ = `noise`.
Invented inventSpectrum(const std::vector<TruePeak>& peaks, double noise, std::mt19937& rng, int samples = 800,
                        double from = 0.0, double to = 100.0) {
  std::normal_distribution<double> gauss(0.0, noise);
  Invented s;
  for (int i = 0; i < samples; ++i) {
    const double x = from + (to - from) * i / (samples - 1);
    double y = 2.0 + 0.01 * (x - from);
    for (const TruePeak& p : peaks) {
      const double g = 0.5 * p.fwhm;
      y += p.height * g * g / ((x - p.position) * (x - p.position) + g * g);
    }
    s.x.push_back(x);
    s.y.push_back(y + gauss(rng));
  }
  return s;
}

const FoundPeak* nearest(const PeakFinderResult& r, double position) {
  const FoundPeak* best = nullptr;
  for (const auto& p : r.peaks)
    if (!best || std::abs(p.position - position) < std::abs(best->position - position)) best = &p;
  return best;
}

}  // namespace

// 60 spectra with three well-separated Lorentzians of SNR 8–40 each (heights in noise σ). The
// stated SNR of the finder is its default 5, so every true peak lies above it.
TEST(PeaksFinder, RecoversInventedLorentziansWithUnitPulls) {
  std::mt19937 rng(20261205);
  std::uniform_real_distribution<double> snr(8.0, 40.0), width(1.0, 3.0), jitter(-5.0, 5.0);
  std::vector<double> pulls;
  int found = 0, truth = 0, falsePeaks = 0, detected = 0;
  for (int trial = 0; trial < 60; ++trial) {
    const std::vector<TruePeak> peaks{{22 + jitter(rng), width(rng), snr(rng)}, {50 + jitter(rng), width(rng), snr(rng)},
                                      {78 + jitter(rng), width(rng), snr(rng)}};
    const Invented s = inventSpectrum(peaks, 1.0, rng);
    const PeakFinderResult r = findPeaks(s.x, s.y, {}, "invented");
    ASSERT_TRUE(r.converged) << r.status;
    detected += static_cast<int>(r.peaks.size());
    for (const auto& p : r.peaks) {
      bool matches = false;
      for (const auto& t : peaks) matches = matches || std::abs(p.position - t.position) < 2 * t.fwhm;
      if (!matches) ++falsePeaks;
    }
    for (const auto& t : peaks) {
      ++truth;
      const FoundPeak* p = nearest(r, t.position);
      if (!p || std::abs(p->position - t.position) > 2 * t.fwhm) continue;
      ++found;
      pulls.push_back((p->position - t.position) / p->positionSigma);
      pulls.push_back((p->fwhm - t.fwhm) / p->fwhmSigma);
      const double area = t.height * std::numbers::pi * 0.5 * t.fwhm;
      pulls.push_back((p->area - area) / p->areaSigma);
    }
  }
  EXPECT_EQ(found, truth) << "every peak above the stated SNR is found";
  EXPECT_LE(falsePeaks, 0.05 * detected) << "at most 5 % false peaks";
  int within3 = 0;
  double sum = 0, sum2 = 0;
  for (double p : pulls) {
    within3 += std::abs(p) < 3;
    sum += p;
    sum2 += p * p;
  }
  const double n = static_cast<double>(pulls.size());
  const double mean = sum / n, sd = std::sqrt(sum2 / n - mean * mean);
  std::cout << "peak recovery: " << found << "/" << truth << " found, " << falsePeaks << " false of " << detected
            << ", pulls n=" << pulls.size() << " mean " << mean << " sd " << sd << ", within 3σ " << within3 << "\n";
  EXPECT_GE(within3, 0.98 * n) << "positions, widths and areas within 3σ";
  EXPECT_NEAR(mean, 0.0, 0.2);
  EXPECT_NEAR(sd, 1.0, 0.15) << "pull width near 1: the errors are neither too small nor too large";
}

// Pure noise (σ = 1, 800 samples) at the default SNR 5: no peak is reported.
TEST(PeaksFinder, ReportsNoPeaksOnPureNoise) {
  std::mt19937 rng(7);
  int reported = 0;
  for (int trial = 0; trial < 30; ++trial) {
    const Invented s = inventSpectrum({}, 1.0, rng);
    reported += static_cast<int>(findPeaks(s.x, s.y, {}, "noise").peaks.size());
  }
  EXPECT_EQ(reported, 0);
}

// Two Lorentzians 0.8 FWHM apart show one maximum; both are found and fitted together.
TEST(PeaksFinder, ResolvesOverlappingPair) {
  std::mt19937 rng(11);
  int resolved = 0;
  for (int trial = 0; trial < 10; ++trial) {
    const std::vector<TruePeak> peaks{{48.0, 4.0, 60.0}, {51.2, 4.0, 40.0}};
    const Invented s = inventSpectrum(peaks, 1.0, rng);
    const PeakFinderResult r = findPeaks(s.x, s.y, {}, "pair");
    if (r.peaks.size() != 2) continue;
    ++resolved;
    for (std::size_t k = 0; k < 2; ++k)
      EXPECT_LT(std::abs(r.peaks[k].position - peaks[k].position), 3.5 * r.peaks[k].positionSigma) << trial << " peak " << k;
  }
  EXPECT_GE(resolved, 9);
}

TEST(PeaksFinder, FitsGaussianAndVoigtShapes) {
  std::mt19937 rng(5);
  std::normal_distribution<double> gauss(0.0, 0.5);
  const double sigma = 1.2, gamma = 0.8, centre = 40.3, area = 90.0;
  for (LineShape shape : {LineShape::Gaussian, LineShape::Voigt}) {
    std::vector<double> x, y;
    for (int i = 0; i < 600; ++i) {
      x.push_back(i * 0.1 + 10.0);
      const double v = shape == LineShape::Gaussian ? gaussianProfile(x.back() - centre, sigma) : voigtProfile(x.back() - centre, sigma, gamma);
      y.push_back(1.0 + area * v + gauss(rng));
    }
    PeakFinderOptions o;
    o.shape = shape;
    const PeakFinderResult r = findPeaks(x, y, o, "shape");
    ASSERT_EQ(r.peaks.size(), 1u) << lineShapeKey(shape);
    const double fwhm = shape == LineShape::Gaussian ? gaussianFwhmFromSigma(sigma) : voigtFwhm(sigma, gamma);
    EXPECT_LT(std::abs(r.peaks[0].position - centre), 3 * r.peaks[0].positionSigma);
    EXPECT_LT(std::abs(r.peaks[0].fwhm - fwhm), 3 * r.peaks[0].fwhmSigma);
    EXPECT_LT(std::abs(r.peaks[0].area - area), 3 * r.peaks[0].areaSigma);
    EXPECT_NEAR(r.noise, 0.5, 0.05);
  }
}

TEST(PeaksFinder, OptionsOutOfRangeNameTheKeyAndLimit) {
  std::vector<double> x(20), y(20, 1.0);
  for (int i = 0; i < 20; ++i) x[static_cast<std::size_t>(i)] = i;
  PeakFinderOptions o;
  o.minSnr = 0.5;
  try {
    findPeaks(x, y, o, "f.csv");
    FAIL();
  } catch (const InputError& e) {
    EXPECT_EQ(e.where(), "min_snr");
    EXPECT_NE(std::string(e.what()).find("between 2 and"), std::string::npos);
  }
  o = {};
  o.maxPeaks = 1000;
  EXPECT_THROW(findPeaks(x, y, o, "f.csv"), InputError);
  EXPECT_THROW(findPeaks({1, 2, 3}, {1, 2, 3}, {}, "f.csv"), InputError);
  y[3] = std::nan("");
  EXPECT_THROW(findPeaks(x, y, {}, "f.csv"), InputError);
}

TEST(PeaksFinder, ADroppedCandidateIsReportedWithItsPositionAndReason) {
  // A one-sample spike (e.g. a cosmic-ray hit) on a flat, noiseless signal is no resolved line:
  // it must not come out as a peak, and the result must say why the candidate was dropped.
  std::vector<double> x, y;
  for (int i = 0; i < 50; ++i) {
    x.push_back(i);
    y.push_back(i == 25 ? 5.0 : 0.0);
  }
  const PeakFinderResult r = findPeaks(x, y, PeakFinderOptions{}, "spike");
  EXPECT_TRUE(r.peaks.empty());
  ASSERT_FALSE(r.dropped.empty());
  EXPECT_NE(r.dropped.front().find("candidate near 25"), std::string::npos) << r.dropped.front();
  EXPECT_NE(r.dropped.front().find("dropped: "), std::string::npos) << r.dropped.front();
}
