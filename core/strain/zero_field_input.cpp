#include "core/strain/zero_field_input.h"

#include <algorithm>
#include <cmath>

#include "core/common/errors.h"

namespace finestra {
namespace {

int letterOfPin(const PinnedAssignment& pin, int levels) {
  const bool upperExcited = pin.upper >= levels / 2;
  const bool upperGround = pin.lower >= levels / 2;
  if (upperExcited) return upperGround ? 1 : 0;
  return upperGround ? 3 : 2;
}

}  // namespace

ZeroFieldSelection selectZeroFieldLines(const Project& project, const CentreModel& model,
                                        const std::optional<std::string>& measurementName) {
  const LabFrame& lab = model.setup().lab;
  int chosen = -1;
  for (std::size_t i = 0; i < project.measurements.size() && chosen < 0; ++i) {
    const MeasurementSet& m = project.measurements[i];
    if (measurementName ? m.name == *measurementName : m.field.labVector(lab).norm() == 0.0) chosen = static_cast<int>(i);
  }
  if (chosen < 0) {
    if (measurementName) throw InputError("measurements", "no measurement set named '" + *measurementName + "'");
    throw InputError("measurements", "no measurement set at zero field (the closed-form strain estimate needs the four "
                                     "zero-field lines A-D as one set with magnitude_T 0 and four peaks)");
  }
  const MeasurementSet& set = project.measurements[static_cast<std::size_t>(chosen)];
  const std::string key = "measurements[" + std::to_string(chosen) + "]";
  if (set.field.labVector(lab).norm() != 0.0)
    throw InputError(key + ".field", "set '" + set.name + "' is not at zero field; the closed form needs zero-field lines");
  if (set.peaks.size() != 4)
    throw InputError(key + ".peaks", "set '" + set.name + "' has " + std::to_string(set.peaks.size()) +
                                         " peaks; the closed form needs exactly the four lines A, B, C, D");

  const int levels = model.manifold(Manifold::Ground).dimension();
  const double reference = model.zplGHz();
  ZeroFieldSelection out;
  out.measurement = chosen;
  out.peak.fill(-1);
  std::array<double, 4> frequency{}, sigma{};
  for (int j = 0; j < 4; ++j) {
    const MeasuredPeak& p = set.peaks[static_cast<std::size_t>(j)];
    const std::string peakKey = key + ".peaks[" + std::to_string(j) + "]";
    frequency[static_cast<std::size_t>(j)] = toAbsoluteGHz(p.position, p.unit, reference);
    sigma[static_cast<std::size_t>(j)] = p.sigma / std::abs(unitPerGHz(frequency[static_cast<std::size_t>(j)], p.unit, reference));
    if (!p.assign) continue;
    if (p.assign->upper >= levels || p.assign->lower >= levels)
      throw InputError(peakKey + ".assign", "level index must be below " + std::to_string(levels));
    const int letter = letterOfPin(*p.assign, levels);
    if (out.peak[static_cast<std::size_t>(letter)] >= 0)
      throw InputError(peakKey + ".assign", std::string("line ") + "ABCD"[letter] + " is pinned twice");
    out.peak[static_cast<std::size_t>(letter)] = j;
    out.pinned[static_cast<std::size_t>(letter)] = true;
  }
  // Letters in order of decreasing predicted frequency.
  const bool bAboveC = model.manifold(Manifold::Excited).lambda >= model.manifold(Manifold::Ground).lambda;
  const std::array<int, 4> letterOrder = bAboveC ? std::array<int, 4>{0, 1, 2, 3} : std::array<int, 4>{0, 2, 1, 3};
  std::vector<int> unpinned;
  for (int j = 0; j < 4; ++j)
    if (std::find(out.peak.begin(), out.peak.end(), j) == out.peak.end()) unpinned.push_back(j);
  std::sort(unpinned.begin(), unpinned.end(),
            [&](int a, int b) { return frequency[static_cast<std::size_t>(a)] > frequency[static_cast<std::size_t>(b)]; });
  std::size_t next = 0;
  for (int letter : letterOrder)
    if (out.peak[static_cast<std::size_t>(letter)] < 0) out.peak[static_cast<std::size_t>(letter)] = unpinned[next++];
  for (int letter = 0; letter < 4; ++letter) {
    out.lines.frequencyGHz[static_cast<std::size_t>(letter)] = frequency[static_cast<std::size_t>(out.peak[static_cast<std::size_t>(letter)])];
    out.lines.sigmaGHz[static_cast<std::size_t>(letter)] = sigma[static_cast<std::size_t>(out.peak[static_cast<std::size_t>(letter)])];
  }
  return out;
}

}  // namespace finestra
