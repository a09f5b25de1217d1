#include "core/planner/figures.h"

#include "core/common/errors.h"

namespace finestra {

const std::array<FigureInfo, kFigureCount>& figureTable() {
  static const std::array<FigureInfo, kFigureCount> table{{
      {FigureId::QubitGHz, "qubit_GHz", "qubit frequency E_g1 - E_g0 (GHz)"},
      {FigureId::DriveGHzPerT, "drive_GHz_per_T", "magnetic-dipole drive matrix element (GHz per T of microwave field)"},
      {FigureId::DriveFraction, "drive_fraction", "drive matrix element over the free-electron value g_s mu_B / 2h"},
      {FigureId::Cyclicity, "cyclicity", "spin-conserving over spin-flipping decay, worst chosen excited level"},
      {FigureId::SeparationLinewidths, "separation_linewidths",
       "smallest gap between the chosen lines and any line of another class, in linewidths"},
      {FigureId::GroundGapGHz, "ground_gap_GHz", "smallest E_g2 - E_g1 over 0..|B| (anticrossing warning)"},
      {FigureId::ExcitedGapGHz, "excited_gap_GHz", "smallest E_u2 - E_u1 over 0..|B| (anticrossing warning)"},
      {FigureId::AxisAngleDeg, "axis_angle_deg", "angle between the field and the class axis (deg)"},
  }};
  return table;
}

const FigureInfo& figureInfo(FigureId id) { return figureTable().at(static_cast<std::size_t>(id)); }

FigureId parseFigure(std::string_view key, const std::string& where) {
  std::string valid;
  for (const FigureInfo& info : figureTable()) {
    if (info.key == key) return info.id;
    valid += (valid.empty() ? "" : ", ") + std::string(info.key);
  }
  throw InputError(where, "unknown figure '" + std::string(key) + "' (valid: " + valid + ")");
}

double figureValue(const ClassFigures& f, FigureId id) {
  switch (id) {
    case FigureId::QubitGHz: return f.qubitGHz;
    case FigureId::DriveGHzPerT: return f.driveGHzPerT;
    case FigureId::DriveFraction: return f.driveFraction;
    case FigureId::Cyclicity: return f.cyclicity;
    case FigureId::SeparationLinewidths: return f.separationLinewidths;
    case FigureId::GroundGapGHz: return f.groundGapGHz;
    case FigureId::ExcitedGapGHz: return f.excitedGapGHz;
    case FigureId::AxisAngleDeg: return f.axisAngleDeg;
    case FigureId::Count: break;
  }
  return 0;
}

std::string lineFamilyText(LineFamily f) { return f == LineFamily::C ? "C" : "A"; }

LineFamily parseLineFamily(std::string_view text, const std::string& where) {
  if (text == "C" || text == "c") return LineFamily::C;
  if (text == "A" || text == "a") return LineFamily::A;
  throw InputError(where, "line family must be C (lower excited pair) or A (upper excited pair), got '" +
                              std::string(text) + "'");
}

}  // namespace finestra
