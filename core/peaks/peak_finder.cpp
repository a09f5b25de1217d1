#include "core/peaks/peak_finder.h"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <memory>
#include <numeric>

#include "core/common/errors.h"
#include "core/fit/least_squares.h"
#include "core/peaks/peak_sum_model.h"

namespace finestra {
namespace {

struct Candidate {
  double position = 0, height = 0, hwhm = 0;
};

void validate(const std::vector<double>& x, const std::vector<double>& y, const PeakFinderOptions& o, const std::string& origin) {
  if (x.size() != y.size()) throw InputError(origin, "positions and signals differ in number");
  if (x.size() < 8) throw InputError(origin, "peak finding needs at least 8 samples, found " + std::to_string(x.size()));
  if (x.size() > PeakFinderOptions::kMaxSamples)
    throw InputError(origin, "at most " + std::to_string(PeakFinderOptions::kMaxSamples) + " samples are supported, found " +
                                 std::to_string(x.size()));
  for (std::size_t i = 0; i < x.size(); ++i)
    if (!std::isfinite(x[i]) || !std::isfinite(y[i])) throw InputError(origin, "sample " + std::to_string(i) + " is not a finite number");
  if (!(o.minSnr >= PeakFinderOptions::kMinSnrLowest && o.minSnr <= PeakFinderOptions::kMinSnrHighest))
    throw InputError("min_snr", "must lie between 2 and 1e6");
  if (o.maxPeaks < 1 || o.maxPeaks > PeakFinderOptions::kMaxPeaksLimit)
    throw InputError("max_peaks", "must lie between 1 and " + std::to_string(PeakFinderOptions::kMaxPeaksLimit));
}

// Three-point moving average: the noise of a sample drops by √3 while peaks a few samples wide
// keep their height.
std::vector<double> smooth(const std::vector<double>& y) {
  std::vector<double> s(y.size());
  for (std::size_t i = 0; i < y.size(); ++i) {
    const std::size_t lo = i == 0 ? 0 : i - 1, hi = std::min(i + 1, y.size() - 1);
    double sum = 0;
    for (std::size_t j = lo; j <= hi; ++j) sum += y[j];
    s[i] = sum / static_cast<double>(hi - lo + 1);
  }
  return s;
}

double halfWidthAtHalfMaximum(const std::vector<double>& x, const std::vector<double>& above, std::size_t peak) {
  const double half = 0.5 * above[peak];
  double left = -1, right = -1;
  for (std::size_t i = peak; i-- > 0;)
    if (above[i] < half) {
      left = x[peak] - x[i];
      break;
    }
  for (std::size_t i = peak + 1; i < x.size(); ++i)
    if (above[i] < half) {
      right = x[i] - x[peak];
      break;
    }
  const double step = (x.back() - x.front()) / static_cast<double>(x.size() - 1);
  double hwhm = left > 0 && right > 0 ? 0.5 * (left + right) : std::max(left, right);
  if (hwhm <= 0) hwhm = 3 * step;
  return std::max(hwhm, step);
}

// Local maxima of the smoothed signal at least minSnr·noise above the baseline; of two maxima
// not separated by a dip of 3 noise σ the lower one is dropped (noise on a single peak's top).
std::vector<Candidate> findCandidates(const SampledSpectrum& d, const LinearBaseline& b, double noise, const PeakFinderOptions& o) {
  const std::vector<double> s = smooth(d.signal);
  std::vector<double> above(s.size());
  for (std::size_t i = 0; i < s.size(); ++i) above[i] = s[i] - b.at(d.position[i]);
  std::vector<std::size_t> maxima;
  for (std::size_t i = 1; i + 1 < s.size(); ++i)
    if (above[i] > above[i - 1] && above[i] >= above[i + 1] && above[i] >= o.minSnr * noise) maxima.push_back(i);
  std::vector<std::size_t> kept;
  for (std::size_t m : maxima) {
    if (!kept.empty()) {
      const std::size_t prev = kept.back();
      const double dip = *std::min_element(above.begin() + static_cast<long>(prev), above.begin() + static_cast<long>(m) + 1);
      if (std::min(above[prev], above[m]) - dip < 3 * noise) {
        if (above[m] > above[prev]) kept.back() = m;
        continue;
      }
    }
    kept.push_back(m);
  }
  std::vector<Candidate> out;
  for (std::size_t m : kept) out.push_back({d.position[m], above[m], halfWidthAtHalfMaximum(d.position, above, m)});
  std::sort(out.begin(), out.end(), [](const Candidate& a, const Candidate& c) { return a.height > c.height; });
  if (out.size() > static_cast<std::size_t>(o.maxPeaks)) out.resize(static_cast<std::size_t>(o.maxPeaks));
  return out;
}

// Shape parameters of a candidate: widths chosen so that the FWHM matches, area so the height does.
void appendPeak(Eigen::VectorXd& x, LineShape shape, const Candidate& c) {
  PeakWidths w;
  switch (shape) {
    case LineShape::Lorentzian: w.gamma = c.hwhm; break;
    case LineShape::Gaussian: w.sigma = gaussianSigmaFromFwhm(2 * c.hwhm); break;
    case LineShape::Voigt:
      w.sigma = gaussianSigmaFromFwhm(c.hwhm);
      w.gamma = 0.5 * c.hwhm;
      break;
  }
  const int per = PeakSumModel::parametersPerPeak(shape);
  const Eigen::Index at = x.size();
  x.conservativeResize(at + per);
  x[at] = c.position;
  x[at + 1] = c.height / shapeProfile(shape, 0.0, w);
  if (shape == LineShape::Lorentzian) x[at + 2] = std::log(w.gamma);
  else x[at + 2] = std::log(w.sigma);
  if (shape == LineShape::Voigt) x[at + 3] = std::log(w.gamma);
}

Eigen::VectorXd removePeak(const Eigen::VectorXd& x, LineShape shape, int k) {
  const int per = PeakSumModel::parametersPerPeak(shape), o = PeakSumModel::peakOffset(shape, k);
  Eigen::VectorXd out(x.size() - per);
  out << x.head(o), x.tail(x.size() - o - per);
  return out;
}

struct FitOutcome {
  Eigen::VectorXd x;
  LeastSquaresResult solver;
};

FitOutcome fitPeaks(const std::shared_ptr<const SampledSpectrum>& d, double noise, LineShape shape, const Eigen::VectorXd& start,
                    double origin) {
  const int peaks = static_cast<int>((start.size() - PeakSumModel::kBaselineParameters) / PeakSumModel::parametersPerPeak(shape));
  const PeakSumModel model(d, noise, shape, peaks, origin);
  LeastSquaresOptions options;
  options.maxEvaluations = 2000;
  FitOutcome out;
  out.solver = minimiseLeastSquares(model, start, options);
  out.x = out.solver.x;
  return out;
}

double peakHeight(const PeakSumModel& m, const Eigen::VectorXd& x, int k) {
  return x[PeakSumModel::peakOffset(m.shape(), k) + 1] * m.profile(x, k, x[PeakSumModel::peakOffset(m.shape(), k)]);
}

struct UnwantedPeak {
  int index = -1;      ///< -1: every peak belongs in the result
  std::string reason;  ///< why it was dropped, in words, with its position
};

// The peak that does not belong in the result: outside the data, wider than the whole window,
// below the stated signal-to-noise, or an area not different from zero at 3σ.
UnwantedPeak weakestUnwantedPeak(const PeakSumModel& m, const Eigen::VectorXd& x, const SampledSpectrum& d, double noise, double minSnr) {
  const int n = m.peakCount();
  if (n == 0) return {};
  Eigen::MatrixXd jac;
  m.jacobian(x, jac);
  Eigen::VectorXd r;
  m.residuals(x, r);
  const UncertaintyAnalysis u = analyseUncertainty(jac, r.squaredNorm());
  const double span = d.position.back() - d.position.front();
  UnwantedPeak worst;
  double worstScore = 0;
  for (int k = 0; k < n; ++k) {
    const int o = PeakSumModel::peakOffset(m.shape(), k);
    const double height = peakHeight(m, x, k);
    const double fwhm = shapeFwhm(m.shape(), m.widths(x, k));
    const double areaSignificance = std::abs(x[o + 1]) / u.standardErrors[o + 1];
    const bool outside = x[o] < d.position.front() || x[o] > d.position.back();
    const bool unwanted = outside || fwhm > span || height < minSnr * noise || !(areaSignificance >= 3.0);
    const double score = outside ? 1e300 : height / noise;
    if (unwanted && (worst.index < 0 || score < worstScore || outside)) {
      worst.index = k;
      worstScore = score;
      char near[48];
      std::snprintf(near, sizeof near, "candidate near %.6g dropped: ", x[o]);
      worst.reason = near + std::string(outside                    ? "its fitted centre left the data range"
                                        : fwhm > span               ? "wider than the whole spectrum"
                                        : height < minSnr * noise   ? "its fitted height is below the --min-snr threshold"
                                                                    : "its area does not differ from zero at 3 sigma "
                                                                      "(e.g. a one-sample spike, narrower than the sample step)");
    }
  }
  return worst;
}

}  // namespace

std::string errorScalingNote(bool scaled, double chi2PerDof) {
  if (!std::isfinite(chi2PerDof)) return "no degrees of freedom left: formal errors only";
  char buffer[160];
  std::snprintf(buffer, sizeof buffer,
                scaled ? "chi2/dof = %.3g > 1: errors scaled by sqrt(chi2/dof)" : "chi2/dof = %.3g <= 1: formal errors, not scaled",
                chi2PerDof);
  return buffer;
}

PeakFinderResult findPeaks(const std::vector<double>& position, const std::vector<double>& signal, const PeakFinderOptions& o,
                           const std::string& origin) {
  validate(position, signal, o, origin);
  std::vector<std::size_t> order(position.size());
  std::iota(order.begin(), order.end(), 0);
  std::sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) { return position[a] < position[b]; });
  auto data = std::make_shared<SampledSpectrum>();
  for (std::size_t i : order) {
    data->position.push_back(position[i]);
    data->signal.push_back(signal[i]);
  }
  if (data->position.back() <= data->position.front()) throw InputError(origin, "all samples share one position");

  PeakFinderResult result;
  result.shape = o.shape;
  result.noise = estimateNoise(data->signal);
  if (!(result.noise > 0)) {
    const auto [lo, hi] = std::minmax_element(data->signal.begin(), data->signal.end());
    double scale = std::max({*hi - *lo, std::abs(*hi), std::abs(*lo)});
    if (!(scale > 0)) scale = 1.0;
    result.noise = 1e-9 * scale;
    result.noiseFloored = true;
  }
  const double noise = result.noise;
  const LinearBaseline baseline = estimateBaseline(data->position, data->signal, noise);
  const double origin0 = baseline.origin;

  Eigen::VectorXd x(2);
  x << baseline.offset, baseline.slope;
  for (const Candidate& c : findCandidates(*data, baseline, noise, o)) appendPeak(x, o.shape, c);
  FitOutcome fit = fitPeaks(data, noise, o.shape, x, origin0);

  // Peaks hidden under a neighbour leave structure in the residual: add one where the smoothed
  // residual is largest while that lowers χ² by at least minSnr² (a minSnr-σ improvement).
  const int per = PeakSumModel::parametersPerPeak(o.shape);
  for (int attempt = 0; attempt < o.maxPeaks; ++attempt) {
    const int peaks = static_cast<int>((fit.x.size() - 2) / per);
    if (peaks >= o.maxPeaks) break;
    const PeakSumModel m(data, noise, o.shape, peaks, origin0);
    std::vector<double> residual(data->position.size());
    for (std::size_t i = 0; i < residual.size(); ++i) residual[i] = data->signal[i] - m.value(fit.x, data->position[i]);
    const std::vector<double> s = smooth(residual);
    const auto top = static_cast<std::size_t>(std::max_element(s.begin(), s.end()) - s.begin());
    if (s[top] < 3.0 * noise) break;
    std::vector<double> widths;
    for (int k = 0; k < peaks; ++k) widths.push_back(0.5 * shapeFwhm(o.shape, m.widths(fit.x, k)));
    Eigen::VectorXd trial = fit.x;
    appendPeak(trial, o.shape, {data->position[top], s[top], widths.empty() ? halfWidthAtHalfMaximum(data->position, s, top) : median(widths)});
    const FitOutcome extended = fitPeaks(data, noise, o.shape, trial, origin0);
    if (!(fit.solver.chi2 - extended.solver.chi2 >= o.minSnr * o.minSnr)) break;
    fit = extended;
  }
  for (;;) {
    const int peaks = static_cast<int>((fit.x.size() - 2) / per);
    const PeakSumModel m(data, noise, o.shape, peaks, origin0);
    const UnwantedPeak drop = weakestUnwantedPeak(m, fit.x, *data, noise, o.minSnr);
    if (drop.index < 0) break;
    result.dropped.push_back(drop.reason);
    fit = fitPeaks(data, noise, o.shape, removePeak(fit.x, o.shape, drop.index), origin0);
  }

  const int peaks = static_cast<int>((fit.x.size() - 2) / per);
  const PeakSumModel model(data, noise, o.shape, peaks, origin0);
  Eigen::MatrixXd jac;
  model.jacobian(fit.x, jac);
  const UncertaintyAnalysis u = analyseUncertainty(jac, fit.solver.chi2);
  result.baseline = {fit.x[0], fit.x[1], origin0};
  result.chi2 = fit.solver.chi2;
  result.dof = u.dof;
  result.chi2PerDof = u.chi2PerDof;
  result.errorsScaled = u.errorsScaled;
  result.converged = fit.solver.status == LeastSquaresStatus::Converged;
  result.status = (result.converged ? "converged: " : "not converged: ") + fit.solver.detail;
  auto covariance = [&](int a, int b) { return u.correlation(a, b) * u.standardErrors[a] * u.standardErrors[b]; };
  for (int k = 0; k < peaks; ++k) {
    const int o0 = PeakSumModel::peakOffset(o.shape, k);
    FoundPeak p;
    p.position = fit.x[o0];
    p.positionSigma = u.standardErrors[o0];
    p.area = fit.x[o0 + 1];
    p.areaSigma = u.standardErrors[o0 + 1];
    p.fwhm = shapeFwhm(o.shape, model.widths(fit.x, k));
    // FWHM error by the delta method over the log-width parameters (central differences).
    Eigen::VectorXd gradient = Eigen::VectorXd::Zero(per - 2);
    for (int j = 2; j < per; ++j) {
      Eigen::VectorXd plus = fit.x, minus = fit.x;
      plus[o0 + j] += 1e-6;
      minus[o0 + j] -= 1e-6;
      gradient[j - 2] = (shapeFwhm(o.shape, model.widths(plus, k)) - shapeFwhm(o.shape, model.widths(minus, k))) / 2e-6;
    }
    // A Voigt component that collapsed towards zero width is undetermined, but the FWHM no longer
    // depends on it (an e-fold change moves the FWHM by < 0.1 %): leave it out rather than turn
    // the FWHM error undefined.
    double variance = 0;
    for (int a = 2; a < per; ++a)
      for (int b = 2; b < per; ++b) {
        const double ga = gradient[a - 2], gb = gradient[b - 2];
        if (std::abs(ga) < 1e-3 * p.fwhm || std::abs(gb) < 1e-3 * p.fwhm) continue;
        variance += ga * gb * covariance(o0 + a, o0 + b);
      }
    p.fwhmSigma = std::sqrt(variance);
    p.height = peakHeight(model, fit.x, k);
    p.snr = p.height / noise;
    result.peaks.push_back(p);
  }
  std::sort(result.peaks.begin(), result.peaks.end(), [](const FoundPeak& a, const FoundPeak& b) { return a.position < b.position; });
  return result;
}

}  // namespace finestra
