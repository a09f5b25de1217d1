#include "core/strain/strain_map.h"

#include <algorithm>
#include <cmath>
#include <functional>

#include "core/common/errors.h"
#include "core/common/robust_statistics.h"

namespace finestra {
namespace {

SampleSummary summarise(const std::string& name, const std::string& unit, const std::vector<EmitterStrain>& emitters,
                        const std::function<double(const ZeroFieldStrainEstimate&)>& figure) {
  SampleSummary s{name, unit};
  std::vector<double> values;
  for (const auto& e : emitters) {
    const double v = figure(e.estimate);
    if (std::isfinite(v)) values.push_back(v);
  }
  s.count = static_cast<int>(values.size());
  if (values.empty()) return s;
  s.median = median(values);
  s.spread = robustSpread(values);
  const auto [lo, hi] = std::minmax_element(values.begin(), values.end());
  s.min = *lo;
  s.max = *hi;
  return s;
}

}  // namespace

StrainMap estimateStrainMap(const std::vector<EmitterLines>& emitters, const ManifoldModel& ground, const ManifoldModel& excited,
                            double zplReferenceGHz) {
  StrainMap map;
  for (const EmitterLines& in : emitters) {
    EmitterStrain e{in, {}, {}};
    try {
      e.estimate = estimateZeroFieldStrain(in.lines, ground, excited, zplReferenceGHz);
    } catch (const InputError& err) {
      throw InputError("emitter '" + in.name + "' (line " + std::to_string(in.line) + ")", err.what());
    }
    e.verdict = strainVerdict(e.estimate);
    map.readingsDisagree += !e.verdict.readingsAgree;
    map.pureDFits += e.verdict.pureDFits;
    map.pureFFits += e.verdict.pureFFits;
    map.neitherFits += !e.verdict.pureDFits && !e.verdict.pureFFits;
    map.emitters.push_back(std::move(e));
  }
  auto& s = map.summary;
  const auto& all = map.emitters;
  s.push_back(summarise("|eps_Eg,g|", "GHz", all, [](const auto& e) { return e.egGroundGHz.value; }));
  s.push_back(summarise("|eps_Eg,u|", "GHz", all, [](const auto& e) { return e.egExcitedGHz.value; }));
  s.push_back(summarise("strain (pure d)", "1", all, [](const auto& e) { return e.pureD.combined.value; }));
  s.push_back(summarise("strain (pure f)", "1", all, [](const auto& e) { return e.pureF.combined.value; }));
  s.push_back(summarise("ZPL shift", "GHz", all, [](const auto& e) { return e.zplShiftGHz.value; }));
  s.push_back(summarise("mismatch A-B-C+D", "sigma", all, [](const auto& e) { return e.mismatchPull; }));
  return map;
}

}  // namespace finestra
