#include "core/centre/parameter_table.h"

#include <cmath>
#include <iomanip>
#include <sstream>
#include <stdexcept>

#include "core/centre/parameters.h"
#include "core/common/errors.h"

namespace finestra {
namespace {

struct Limits {
  double minimum, maximum, fitScale, guiStep;
};

// Range, fit scale and GUI step of a centre parameter. Ranges are wide: they catch typing errors
// (a value in the wrong unit, a wrong sign where the physics fixes it), not unusual centres. Fit
// scales: about 1 % of the SiV value for couplings, 1 GHz-equivalent for energies (common practice
// for scaling least-squares variables).
Limits centreLimits(Param p) {
  switch (p) {
    case Param::ZplTHz: return {1, 3000, 1e-3, 0.001};  // 1 GHz
    case Param::LambdaG: case Param::LambdaU: return {0, 1e5, 1, 1};
    case Param::QG: case Param::QU: return {-10, 10, 0.01, 0.01};
    case Param::GSpin: return {-10, 10, 1e-3, 0.001};
    case Param::JtXG: case Param::JtYG: case Param::JtXU: case Param::JtYU: return {-1e5, 1e5, 1, 1};
    case Param::TperpG: case Param::TparG: case Param::DG: case Param::FG:
    case Param::TperpU: case Param::TparU: case Param::DU: case Param::FU: return {-1e4, 1e4, 0.01, 0.01};
    case Param::DipoleRatio: return {0, 1e3, 0.01, 0.01};
    case Param::LifetimeNs: return {1e-6, 1e6, 0.1, 0.1};
    case Param::AParG: case Param::APerpG: case Param::AParU: case Param::APerpU: return {-1e5, 1e5, 1, 1};
    case Param::NuclearSpin: return {0, 4.5, 0.5, 0.5};
    case Param::GammaN: return {-1e3, 1e3, 0.1, 0.1};
    // Phonon model constants. Powers of T are bounded as the thermal module requires.
    case Param::PhononChiG: case Param::PhononChiU: return {0, 1e6, 1, 1};
    case Param::HigherOrderCoefG: case Param::HigherOrderCoefU: return {0, 1e9, 1, 1};
    case Param::HigherOrderPowerG: case Param::HigherOrderPowerU: return {0, 20, 0.1, 0.1};
    case Param::ZplShiftCoef: return {-1e3, 1e3, 1e-3, 0.001};
    case Param::ZplShiftPower: return {0, 20, 0.1, 0.1};
    case Param::DebyeWaller: return {0, 1, 0.01, 0.01};
    case Param::SidebandShiftMeV: case Param::SidebandFwhmMeV: return {0, 1000, 1, 0.1};
    case Param::Count: break;
  }
  throw std::logic_error("centreLimits: no limits for a centre parameter");
}

std::string unitOrDimensionless(std::string_view unit) { return unit.empty() ? "1" : std::string(unit); }

std::vector<QuantitySpec> buildTable() {
  std::vector<QuantitySpec> t;
  for (const ParamInfo& info : paramTable()) {
    const Limits l = centreLimits(info.id);
    t.push_back({"centre.parameters." + std::string(info.key), std::string(info.key), unitOrDimensionless(info.unit),
                 l.minimum, l.maximum, l.fitScale, l.guiStep, std::string(info.meaning)});
  }
  const double F = kMaxFieldT;
  const double S = kMaxStrain;
  // key, fit name, unit, min, max, fit scale, GUI step, help
  const std::vector<QuantitySpec> project{
      {"field.magnitude_T", "", "T", 0, F, 1e-3, 0.001, "magnet setting: field magnitude"},
      {"field.polar_deg", "", "deg", 0, 180, 1, 0.05, "magnet setting: polar angle from the lab z axis"},
      {"field.azimuth_deg", "", "deg", -360, 360, 1, 0.05, "magnet setting: azimuth from the lab x axis"},
      {"field.vector_T", "", "T", -F, F, 1e-3, 0.0001, "magnet setting: one component of the field vector"},
      {"strain.crystal.xx", "strain_xx", "1", -S, S, 1e-6, 1e-6, "crystal-frame strain component xx"},
      {"strain.crystal.yy", "strain_yy", "1", -S, S, 1e-6, 1e-6, "crystal-frame strain component yy"},
      {"strain.crystal.zz", "strain_zz", "1", -S, S, 1e-6, 1e-6, "crystal-frame strain component zz"},
      {"strain.crystal.yz", "strain_yz", "1", -S, S, 1e-6, 1e-6, "crystal-frame strain component yz"},
      {"strain.crystal.zx", "strain_zx", "1", -S, S, 1e-6, 1e-6, "crystal-frame strain component zx"},
      {"strain.crystal.xy", "strain_xy", "1", -S, S, 1e-6, 1e-6, "crystal-frame strain component xy"},
      {"strain.eg_ground.magnitude_GHz", "eg_strain_g_GHz", "GHz", 0, limits::kMaxEgStrainGHz, 1, 0.001,
       "extra E-type strain of the ground manifold: magnitude"},
      {"strain.eg_ground.angle_deg", "eg_angle_g_deg", "deg", -360, 360, 10, 0.01,
       "extra E-type strain of the ground manifold: angle in the defect frame"},
      {"strain.eg_excited.magnitude_GHz", "eg_strain_u_GHz", "GHz", 0, limits::kMaxEgStrainGHz, 1, 0.001,
       "extra E-type strain of the excited manifold: magnitude"},
      {"strain.eg_excited.angle_deg", "eg_angle_u_deg", "deg", -360, 360, 10, 0.01,
       "extra E-type strain of the excited manifold: angle in the defect frame"},
      {"conditions.temperature_K", "", "K", 0, kMaxTemperatureK, 1, 0.01,
       "sample temperature (sets thermal populations and phonon rates)"},
      {"conditions.broadening_GHz", "", "GHz", 0, 1e4, 0.1, 0.001, "extra line broadening added to the lifetime width"},
      {"conditions.bath_t2star_s", "", "s", 1e-12, 1e6, 1e-9, 1e-9,
       "spin dephasing time T2* set by the spin bath (limits the spin coherence)"},
      {"centre.zpl_anchor.wavelength_nm", "", "nm", 100, 2000, 0.001, 0.001,
       "measured wavelength of the anchor line (sets the ZPL)"},
      {"centre.zpl_anchor.temperature_K", "", "K", 0, kMaxTemperatureK, 1, 0.1,
       "temperature at which the anchor wavelength was measured"},
      {"sweeps.points", "", "1", 2, limits::kMaxSweepPoints, 1, 1, "number of points of a sweep"},
      {"magnet.field_scale", "field_scale", "1", 0.1, 10, 1e-3, 0.001,
       "magnet calibration: true / nominal field magnitude"},
      {"magnet.tilt_deg", "magnet_tilt_deg", "deg", -90, 90, 0.5, 0.01,
       "magnet calibration: tilt of the true field from the nominal direction"},
      {"magnet.tilt_azimuth_deg", "magnet_tilt_azimuth_deg", "deg", -360, 360, 10, 0.1,
       "magnet calibration: azimuth of the tilt"},
      {"fit.starts", "", "1", 1, 1000, 1, 1, "number of fit starts (the first from the project values)"},
      {"planner.step_deg", "", "deg", 0.05, 90, 1, 0.25, "grid step of the planner map in polar and azimuth"},
      {"planner.strain_samples", "", "1", 1, limits::kMaxStrainSamples, 1, 1, "number of centres of a planner strain population"},
      {"planner.alignment_tolerance_deg", "", "deg", 0, limits::kMaxAlignmentToleranceDeg, 0.5, 0.1,
       "magnet's angular uncertainty: half-angle of the cone the planner judges a setting in"},
      {"planner.rank_quantile", "", "1", 0.01, 1, 0.1, 0.01, "share of the sampled centres a planner setting must serve"},
      {"planner.profile_points", "", "1", 2, 1e5, 1, 1, "number of field magnitudes of a planner profile"},
      {"spectrum.points", "", "1", 2, 1e7, 1, 1, "number of points of a simulated spectrum"},
      {"zpl_offset_GHz", "zpl_offset_GHz", "GHz", -1e4, 1e4, 1, 0.01, "fit only: shift added to every line"},
  };
  t.insert(t.end(), project.begin(), project.end());
  return t;
}

// Whole numbers below 1e15 in full ("1000000", not "1e+06"), others in the shortest default form.
std::string shortNumber(double x) {
  std::ostringstream out;
  if (std::isfinite(x) && x == std::round(x) && std::abs(x) < 1e15) out << std::fixed << std::setprecision(0);
  out << x;
  return out.str();
}

}  // namespace

const std::vector<QuantitySpec>& quantityTable() {
  static const std::vector<QuantitySpec> table = buildTable();
  return table;
}

const QuantitySpec& quantity(std::string_view key) {
  for (const QuantitySpec& s : quantityTable())
    if (s.key == key) return s;
  throw std::logic_error("quantity: '" + std::string(key) + "' is not in the parameter table");
}

std::optional<QuantitySpec> findFitQuantity(std::string_view fitName) {
  if (fitName.empty()) return std::nullopt;
  for (const QuantitySpec& s : quantityTable())
    if (s.fitName == fitName) return s;
  return std::nullopt;
}

std::string rangeText(const QuantitySpec& spec) {
  return shortNumber(spec.minimum) + " \u2026 " + shortNumber(spec.maximum) + (spec.unit == "1" ? "" : " " + spec.unit);
}

void requireInRange(const QuantitySpec& spec, double value, const std::string& where) {
  if (!(value >= spec.minimum && value <= spec.maximum))
    throw InputError(where, "value " + shortNumber(value) + " is outside the accepted range " + rangeText(spec));
}

}  // namespace finestra
