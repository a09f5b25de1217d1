#pragma once
// Centre parameters: the named numbers that define one group-IV centre model, with units in their
// keys (docs/architecture.md, Parameters and limits).
// A value not known is stored as NaN and must be set before a computation
// that needs it (require() throws MissingValueError naming the key).
#include <array>
#include <cmath>
#include <optional>
#include <string>
#include <string_view>

#include "core/common/types.h"

namespace finestra {

enum class Param : int {
  ZplTHz, LambdaG, LambdaU, QG, QU, GSpin,
  JtXG, JtYG, JtXU, JtYU,
  TperpG, TparG, DG, FG, TperpU, TparU, DU, FU,
  DipoleRatio, LifetimeNs,
  AParG, APerpG, AParU, APerpU, NuclearSpin, GammaN,
  // Phonon model (docs/physics.md, Phonons and linewidths): needed only by rates, linewidths and sidebands.
  PhononChiG, PhononChiU, HigherOrderCoefG, HigherOrderPowerG, HigherOrderCoefU, HigherOrderPowerU,
  ZplShiftCoef, ZplShiftPower, DebyeWaller, SidebandShiftMeV, SidebandFwhmMeV,
  Count
};
inline constexpr int kParamCount = static_cast<int>(Param::Count);

struct ParamInfo {
  Param id;
  std::string_view key;     ///< file key, e.g. "lambda_g_GHz"
  std::string_view unit;    ///< display unit, e.g. "GHz" ("" for dimensionless)
  std::string_view meaning; ///< one-line description for tables and tooltips
  bool hyperfine;           ///< belongs to the isotope (only needed when an isotope is chosen)
};

const std::array<ParamInfo, kParamCount>& paramTable();
const ParamInfo& paramInfo(Param p);
/// True for the constants of the phonon model: the level engine never needs them, so an unknown
/// one blocks only the thermal figures (rates, linewidths, sideband), not levels and lines.
inline bool isPhononParam(Param p) { return p >= Param::PhononChiG && p < Param::Count; }
/// Finds a parameter by key; std::nullopt for an unknown key.
std::optional<Param> findParam(std::string_view key);

class CentreParameters {
public:
  CentreParameters() { values_.fill(std::nan("")); }
  double get(Param p) const { return values_[static_cast<std::size_t>(p)]; }
  void set(Param p, double v) { values_[static_cast<std::size_t>(p)] = v; }
  bool known(Param p) const { return std::isfinite(get(p)); }
  /// The value, or MissingValueError "<key> is unknown ..." when it is NaN.
  double require(Param p) const;
  /// True when an isotope with nuclear spin > 0 is part of the model.
  bool hasNuclearSpin() const { return known(Param::NuclearSpin) && get(Param::NuclearSpin) > 0; }
  /// Number of nuclear states 2I+1 (1 without isotope).
  int nuclearDimension() const;
  /// Throws MissingValueError for the first value the engine needs that is unknown, and InputError
  /// for values out of their physical range (negative λ, lifetime, I not a multiple of ½ ...).
  void validateForComputation() const;

private:
  std::array<double, kParamCount> values_;
};

}  // namespace finestra
