#include "core/centre/parameters.h"

#include <cmath>
#include <sstream>

#include "core/common/errors.h"

namespace finestra {
namespace {
std::string shortNumber(double x) {
  std::ostringstream out;
  out << x;
  return out.str();
}
}  // namespace

const std::array<ParamInfo, kParamCount>& paramTable() {
  static const std::array<ParamInfo, kParamCount> table{{
      {Param::ZplTHz, "zpl_THz", "THz", "zero-phonon line: centroid of the four zero-field lines", false},
      {Param::LambdaG, "lambda_g_GHz", "GHz", "effective spin-orbit splitting, ground manifold", false},
      {Param::LambdaU, "lambda_u_GHz", "GHz", "effective spin-orbit splitting, excited manifold", false},
      {Param::QG, "q_g", "", "orbital Zeeman reduction factor, ground", false},
      {Param::QU, "q_u", "", "orbital Zeeman reduction factor, excited", false},
      {Param::GSpin, "g_spin", "", "electron spin g-factor", false},
      {Param::JtXG, "jt_x_g_GHz", "GHz", "static Jahn-Teller distortion, x part, ground", false},
      {Param::JtYG, "jt_y_g_GHz", "GHz", "static Jahn-Teller distortion, y part, ground", false},
      {Param::JtXU, "jt_x_u_GHz", "GHz", "static Jahn-Teller distortion, x part, excited", false},
      {Param::JtYU, "jt_y_u_GHz", "GHz", "static Jahn-Teller distortion, y part, excited", false},
      {Param::TperpG, "tperp_g_PHz", "PHz/strain", "A1g strain coupling to exx+eyy, ground", false},
      {Param::TparG, "tpar_g_PHz", "PHz/strain", "A1g strain coupling to ezz, ground", false},
      {Param::DG, "d_g_PHz", "PHz/strain", "Eg strain coupling d, ground", false},
      {Param::FG, "f_g_PHz", "PHz/strain", "Eg strain coupling f, ground", false},
      {Param::TperpU, "tperp_u_PHz", "PHz/strain", "A1g strain coupling to exx+eyy, excited", false},
      {Param::TparU, "tpar_u_PHz", "PHz/strain", "A1g strain coupling to ezz, excited", false},
      {Param::DU, "d_u_PHz", "PHz/strain", "Eg strain coupling d, excited", false},
      {Param::FU, "f_u_PHz", "PHz/strain", "Eg strain coupling f, excited", false},
      {Param::DipoleRatio, "dipole_ratio_perp_par", "", "transition dipole ratio d_perp/d_par", false},
      {Param::LifetimeNs, "lifetime_ns", "ns", "excited-state lifetime", false},
      {Param::AParG, "A_par_g_MHz", "MHz", "hyperfine A parallel, ground", true},
      {Param::APerpG, "A_perp_g_MHz", "MHz", "hyperfine A perpendicular, ground", true},
      {Param::AParU, "A_par_u_MHz", "MHz", "hyperfine A parallel, excited", true},
      {Param::APerpU, "A_perp_u_MHz", "MHz", "hyperfine A perpendicular, excited", true},
      {Param::NuclearSpin, "nuclear_spin", "", "nuclear spin I of the isotope (0 without)", true},
      {Param::GammaN, "gamma_n_MHz_per_T", "MHz/T", "nuclear gyromagnetic ratio (signed)", true},
      {Param::PhononChiG, "phonon_chi_g_per_s_GHz3", "1/(s GHz^3)",
       "single-phonon coupling, ground: downward rate = chi D^3 (n+1), upward = chi D^3 n", false},
      {Param::PhononChiU, "phonon_chi_u_per_s_GHz3", "1/(s GHz^3)",
       "single-phonon coupling, excited: downward rate = chi D^3 (n+1), upward = chi D^3 n", false},
      {Param::HigherOrderCoefG, "phonon_ho_coef_g_per_s", "1/s", "higher-order phonon rate at 1 K, ground (rate = c (T/1 K)^p)", false},
      {Param::HigherOrderPowerG, "phonon_ho_power_g", "", "temperature power p of the higher-order phonon rate, ground", false},
      {Param::HigherOrderCoefU, "phonon_ho_coef_u_per_s", "1/s", "higher-order phonon rate at 1 K, excited (rate = c (T/1 K)^p)", false},
      {Param::HigherOrderPowerU, "phonon_ho_power_u", "", "temperature power p of the higher-order phonon rate, excited", false},
      {Param::ZplShiftCoef, "zpl_shift_coef_GHz", "GHz", "thermal ZPL shift at 1 K (shift = c (T/1 K)^p)", false},
      {Param::ZplShiftPower, "zpl_shift_power", "", "temperature power p of the thermal ZPL shift", false},
      {Param::DebyeWaller, "debye_waller", "", "fraction of the emission in the zero-phonon lines", false},
      {Param::SidebandShiftMeV, "sideband_shift_meV", "meV", "phonon sideband feature: distance below the ZPL", false},
      {Param::SidebandFwhmMeV, "sideband_fwhm_meV", "meV", "phonon sideband feature: full width at half maximum", false},
  }};
  return table;
}

const ParamInfo& paramInfo(Param p) { return paramTable()[static_cast<std::size_t>(p)]; }

std::optional<Param> findParam(std::string_view key) {
  for (const ParamInfo& info : paramTable())
    if (info.key == key) return info.id;
  return std::nullopt;
}

double CentreParameters::require(Param p) const {
  const double v = get(p);
  if (!std::isfinite(v))
    throw MissingValueError(std::string(paramInfo(p).key),
                            std::string(paramInfo(p).meaning) +
                                " is unknown for this centre: give it in the project file as centre.parameters." +
                                std::string(paramInfo(p).key) + " (or centre.assumed." + std::string(paramInfo(p).key) +
                                " for an assumed value), or set it in the Setup panel's centre parameter table");
  return v;
}

int CentreParameters::nuclearDimension() const {
  if (!hasNuclearSpin()) return 1;
  return static_cast<int>(std::lround(2.0 * get(Param::NuclearSpin))) + 1;
}

void CentreParameters::validateForComputation() const {
  // The nuclear spin first: it decides which hyperfine values are required below.
  if (known(Param::NuclearSpin)) {
    const double twoI = 2.0 * get(Param::NuclearSpin);
    if (twoI < 0 || std::abs(twoI - std::round(twoI)) > 1e-9 || twoI > 9)
      throw InputError("nuclear_spin", "must be a multiple of 1/2 between 0 and 9/2");
  }
  for (const ParamInfo& info : paramTable()) {
    if (info.hyperfine && !hasNuclearSpin() && info.id != Param::NuclearSpin) continue;
    if (isPhononParam(info.id)) continue;  // required by the thermal figures only
    if (info.id == Param::NuclearSpin && !known(info.id)) continue;  // no isotope
    require(info.id);
  }
  auto positive = [&](Param p) {
    if (get(p) <= 0) throw InputError(std::string(paramInfo(p).key), "must be positive");
  };
  auto nonNegative = [&](Param p) {
    if (get(p) < 0) throw InputError(std::string(paramInfo(p).key), "must not be negative");
  };
  // Every value is in natural units for its key (GHz, PHz/strain, MHz, ns ...), where real values
  // stay far below 1e6; beyond 1e9 the sums of the Hamiltonian lose all precision.
  for (const ParamInfo& info : paramTable())
    if (known(info.id) && std::abs(get(info.id)) > 1e9)
      throw InputError(std::string(info.key), "value " + shortNumber(get(info.id)) +
                                                  " is outside the accepted range (magnitude at most 1e9)");
  positive(Param::ZplTHz);
  nonNegative(Param::LambdaG);
  nonNegative(Param::LambdaU);
  positive(Param::LifetimeNs);
  nonNegative(Param::DipoleRatio);
}

}  // namespace finestra
