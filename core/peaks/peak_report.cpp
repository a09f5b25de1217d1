#include "core/peaks/peak_report.h"

#include <cmath>
#include <cstdio>

namespace finestra {
namespace {

using ordered = nlohmann::ordered_json;

const char* kUndeterminedReason =
    "the data cannot determine this figure (the peak is degenerate with a neighbour or a width component sits at its limit)";

void putWithError(ordered& o, const std::string& key, double value, const std::string& errorKey, double error) {
  o[key] = std::isfinite(value) ? ordered(value) : ordered(nullptr);
  if (std::isfinite(error)) {
    o[errorKey] = error;
  } else {
    o[errorKey] = nullptr;
    o["undefined_reason"] = kUndeterminedReason;
  }
}

std::string sig(double v) {
  if (!std::isfinite(v)) return "—";
  char buffer[32];
  std::snprintf(buffer, sizeof buffer, "%.8g", v);
  return buffer;
}

}  // namespace

ordered peaksJson(const PeakFinderResult& r, SpectralUnit unit) {
  ordered peaks = ordered::array();
  for (const FoundPeak& p : r.peaks) {
    ordered o;
    putWithError(o, "position", p.position, "sigma", p.positionSigma);
    putWithError(o, "fwhm", p.fwhm, "fwhm_sigma", p.fwhmSigma);
    putWithError(o, "area", p.area, "area_sigma", p.areaSigma);
    peaks.push_back(o);
  }
  return ordered{{"peaks", peaks}, {"unit", std::string(spectralUnitKey(unit))}, {"noise", r.noise}};
}

Table peaksTable(const PeakFinderResult& r) {
  Table t;
  t.headers = {"peak", "position", "sigma", "fwhm", "fwhm_sigma", "area", "area_sigma", "snr"};
  for (std::size_t k = 0; k < r.peaks.size(); ++k) {
    const FoundPeak& p = r.peaks[k];
    t.rows.push_back({std::to_string(k), sig(p.position), sig(p.positionSigma), sig(p.fwhm), sig(p.fwhmSigma), sig(p.area),
                      sig(p.areaSigma), fixed(p.snr, 1)});
  }
  return t;
}

std::string peaksSummary(const PeakFinderResult& r, SpectralUnit unit) {
  std::string text = std::to_string(r.peaks.size()) + " peaks (" + std::string(lineShapeKey(r.shape)) + "), positions and widths in " +
                     std::string(spectralUnitKey(unit)) + "\n";
  text += "noise sigma per sample = " + sig(r.noise) + (r.noiseFloored ? " (the data show no noise; floor used)" : "") + "\n";
  text += "baseline = " + sig(r.baseline.offset) + " + " + sig(r.baseline.slope) + " * (x - " + sig(r.baseline.origin) + ")\n";
  text += r.status + "; " + errorScalingNote(r.errorsScaled, r.chi2PerDof) + "\n";
  constexpr std::size_t kDroppedShown = 5;  // the rest are counted, not listed
  for (std::size_t k = 0; k < r.dropped.size() && k < kDroppedShown; ++k) text += r.dropped[k] + "\n";
  if (r.dropped.size() > kDroppedShown) text += "... and " + std::to_string(r.dropped.size() - kDroppedShown) + " more candidates dropped\n";
  return text;
}

}  // namespace finestra
