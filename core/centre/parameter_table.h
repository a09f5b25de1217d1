#pragma once
// One table of every number a user sets: the centre parameter keys, the project quantities (field,
// strain, conditions, sweeps, magnet calibration, fit settings) and the fit-only parameters. Each
// entry carries its unit, the valid range that the project reader, the CLI and the GUI widgets all
// enforce, the fit scale, the GUI step and a help text. Adding a quantity = one line in
// parameter_table.cpp (DEVELOPERS.md, "Adding a project key").
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "core/common/limits.h"

namespace finestra {

/// Largest field magnitude (T) anywhere: reader, model, GUI widgets, CLI. Far beyond any laboratory
/// magnet (the engine is tested to 30 T); past it the linear model means nothing and sums lose
/// precision.
inline constexpr double kMaxFieldT = limits::kMaxFieldT;
/// Highest temperature (K) anywhere: sample conditions, temperature sweeps and scans, ZPL anchor.
inline constexpr double kMaxTemperatureK = 1000.0;
/// Largest absolute crystal strain component (dimensionless); core/common/limits.h gives the physics.
inline constexpr double kMaxStrain = limits::kMaxStrain;

struct QuantitySpec {
  /// Project key path ("field.magnitude_T", "centre.parameters.lambda_g_GHz"; array elements without
  /// index: "sweeps.points"), or for a fit-only parameter its fit name.
  std::string key;
  /// Name in fit.free / --free, empty when the quantity cannot be fitted.
  std::string fitName;
  /// Unit as shown to the user; "1" for a dimensionless number.
  std::string unit;
  /// Valid range, both ends included.
  double minimum = 0;
  double maximum = 0;
  /// Typical size of a meaningful change: scales the fit variable, the numerical derivative step and
  /// the spread of random starts.
  double fitScale = 0;
  /// Step of a GUI spin box or slider, in `unit`.
  double guiStep = 0;
  std::string help;
};

/// Every entry, centre parameters in Param order first.
const std::vector<QuantitySpec>& quantityTable();
/// The entry of a key; std::logic_error for a key not in the table (a programming error).
const QuantitySpec& quantity(std::string_view key);
/// The entry of a fit parameter name, or std::nullopt.
std::optional<QuantitySpec> findFitQuantity(std::string_view fitName);
/// "0 … 1000 T": the range as a message shows it.
std::string rangeText(const QuantitySpec& spec);
/// InputError at `where` naming the range when `value` lies outside spec's range.
void requireInRange(const QuantitySpec& spec, double value, const std::string& where);

}  // namespace finestra
