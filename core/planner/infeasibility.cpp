#include "core/planner/infeasibility.h"

#include <cmath>
#include <cstdio>
#include <limits>

#include "core/planner/recommendation.h"

namespace finestra {
namespace {

std::string shortNumber(double v) {
  char buf[48];
  std::snprintf(buf, sizeof buf, "%g", v);
  return buf;
}

std::string percent(double share) {
  char buf[48];
  std::snprintf(buf, sizeof buf, "%.1f %%", 100 * share);
  return buf;
}

// How far a value lies outside the range, in the figure's own unit; undefined never meets it.
double violation(const Constraint& c, double v) {
  if (std::isnan(v)) return std::numeric_limits<double>::infinity();
  if (v < c.min) return c.min - v;
  if (v > c.max) return v - c.max;
  return 0;
}

// The value that decides the range: the pessimistic quantile when it falls short of the lower end,
// otherwise the optimistic one (equal for one exact centre).
double nearestValue(const Constraint& c, const ClassFigures& low, const ClassFigures& high) {
  const double lowValue = figureValue(low, c.figure);
  if (std::isnan(lowValue) || lowValue < c.min) return lowValue;
  return figureValue(high, c.figure);
}

}  // namespace

std::string constraintText(const Constraint& c) {
  const std::string key(figureInfo(c.figure).key);
  const bool low = std::isfinite(c.min), high = std::isfinite(c.max);
  if (low && high) return key + " in [" + shortNumber(c.min) + ", " + shortNumber(c.max) + "]";
  if (low) return key + " >= " + shortNumber(c.min);
  if (high) return key + " <= " + shortNumber(c.max);
  return key + " (any value)";
}

std::optional<Infeasibility> explainInfeasibility(const PlanRequest& request, const PlanResult& result) {
  for (const FeasibleRegion& r : result.regions)
    if (r.feasibleCount > 0) return std::nullopt;
  const std::size_t n = result.directions.size(), magnitudes = request.magnitudesT.size();
  const std::size_t count = request.constraints.size();
  if (n == 0 || result.targetFiguresLow.size() != n * magnitudes ||
      result.targetFiguresHigh.size() != n * magnitudes)
    return std::nullopt;

  Infeasibility out;
  out.constraints.resize(count);
  std::vector<double> bestViolation(count, std::numeric_limits<double>::infinity());
  std::vector<std::vector<bool>> together(count, std::vector<bool>(count, false));
  std::vector<bool> holds(count);
  for (std::size_t c = 0; c < count; ++c) out.constraints[c].constraint = request.constraints[c];
  for (std::size_t m = 0; m < magnitudes; ++m)
    for (std::size_t k = 0; k < n; ++k) {
      const ClassFigures& low = result.targetFiguresLow[m * n + k];
      const ClassFigures& high = result.targetFiguresHigh[m * n + k];
      const double weight = result.directions[k].solidAngleWeight / static_cast<double>(magnitudes);
      std::size_t failing = 0;
      for (std::size_t c = 0; c < count; ++c) {
        holds[c] = request.constraints[c].holds(low, high);
        failing += holds[c] ? 0 : 1;
      }
      for (std::size_t c = 0; c < count; ++c) {
        ConstraintShortfall& s = out.constraints[c];
        if (holds[c]) {
          s.metAnywhere = true;
          for (std::size_t d = 0; d < count; ++d) together[c][d] = together[c][d] || holds[d];
          continue;
        }
        s.excludedShare += weight;
        if (failing != 1) continue;  // another range fails here too
        s.soleBlockerShare += weight;
        s.othersMetSomewhere = true;
        const double v = nearestValue(request.constraints[c], low, high);
        const double miss = violation(request.constraints[c], v);
        if (miss < bestViolation[c]) {
          bestViolation[c] = miss;
          s.magnitudeIndex = m;
          s.directionIndex = k;
          s.nearestValue = v;
        }
      }
    }

  for (std::size_t c = 0; c < count; ++c) {
    ConstraintShortfall& s = out.constraints[c];
    const std::string name = constraintText(s.constraint);
    for (std::size_t d = 0; d < count; ++d)
      if (d != c && s.metAnywhere && out.constraints[d].metAnywhere && !together[c][d]) s.neverTogetherWith.push_back(d);
    std::string text;
    if (!s.metAnywhere) {
      text = name + " is met nowhere in the reachable set";
    } else {
      if (s.neverTogetherWith.empty()) {
        text = name + " holds at some settings, but never where every other range holds";
      } else {
        text = name + " is never met together with ";
        for (std::size_t k = 0; k < s.neverTogetherWith.size(); ++k)
          text += (k ? " or " : "") + constraintText(request.constraints[s.neverTogetherWith[k]]);
      }
    }
    text += " (it excludes " + percent(s.excludedShare) + " of the reachable set";
    if (count > 1) text += ", " + percent(s.soleBlockerShare) + " by itself";
    text += ")";
    if (s.magnitudeIndex && s.directionIndex) {
      const double v = s.nearestValue;
      text += "; best compromise: " +
              magnetSettingText(request.magnitudesT[*s.magnitudeIndex], result.directions[*s.directionIndex],
                                request.reach.kind) +
              " gives " + std::string(figureInfo(s.constraint.figure).key) + " = " +
              (std::isnan(v) ? std::string("undefined") : shortNumber(v)) + (count > 1 ? " with every other range met." : ".");
    } else {
      text += "; no reachable setting meets all the other ranges either.";
    }
    out.sentences.push_back(text);
  }
  if (count == 0) out.sentences.push_back("no setting was evaluated");
  return out;
}

}  // namespace finestra
