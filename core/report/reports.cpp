#include "core/report/reports.h"

#include "core/units/spectral_units.h"

namespace finestra {
using ordered = nlohmann::ordered_json;

namespace {
ordered toArray(const VectorXr& v) {
  ordered a = ordered::array();
  for (Eigen::Index i = 0; i < v.size(); ++i) a.push_back(v[i]);
  return a;
}

std::string branchName(int b) { return b == 0 ? "lower" : "upper"; }

/// Decimals that resolve about 1 MHz of optical frequency near 400-900 nm on `unit`.
int positionDecimals(SpectralUnit unit) {
  switch (unit) {
    case SpectralUnit::GHzAbsolute:
    case SpectralUnit::GHzDetuning: return 3;
    case SpectralUnit::THz: return 6;
    case SpectralUnit::NmVacuum:
    case SpectralUnit::NmAir: return 6;
    case SpectralUnit::MeV: return 6;
    case SpectralUnit::InvCm: return 5;
  }
  return 6;
}
}  // namespace

ordered linesJson(const CentreModel& model, const std::vector<ClassSolution>& classes, std::optional<SpectralUnit> unit) {
  ordered out;
  if (unit) out["unit"] = std::string(spectralUnitKey(*unit));
  out["classes"] = ordered::array();
  for (const ClassSolution& s : classes) {
    ordered lines = ordered::array();
    for (const OpticalLine& l : s.lines) {
      ordered line{{"upper", l.upper}, {"lower", l.lower}, {"label", l.label()}, {"frequency_GHz", l.frequencyGHz}};
      if (unit) line["position"] = fromAbsoluteGHz(l.frequencyGHz, *unit, model.zplGHz());
      line["intensity"] = l.intensity;
      line["intensity_crystal_xyz"] = l.intensityCrystal;
      lines.push_back(std::move(line));
    }
    out["classes"].push_back(ordered{{"class", s.cls},
                                     {"axis_crystal", classAxisIndices(s.cls)},
                                     {"ground_GHz", toArray(s.ground.energies)},
                                     {"excited_GHz", toArray(s.excited.energies)},
                                     {"lines", lines}});
  }
  return out;
}

Table linesTable(const CentreModel& model, const std::vector<ClassSolution>& classes, std::optional<SpectralUnit> unit) {
  Table t{{"class", "line", "upper", "lower", "frequency (THz)", "detuning (GHz)", "vac. wavelength (nm)",
           "intensity", "I[100]", "I[010]", "I[001]"},
          {}};
  constexpr std::ptrdiff_t kPositionColumn = 4;  // after "lower"
  if (unit) t.headers.insert(t.headers.begin() + kPositionColumn, spectralUnitLabel(*unit));
  for (const ClassSolution& s : classes)
    for (const OpticalLine& l : s.lines) {
      std::vector<std::string> row{std::to_string(s.cls), l.label(), std::to_string(l.upper), std::to_string(l.lower),
                                   fixed(l.frequencyGHz * 1e-3, 6), fixed(l.frequencyGHz - model.zplGHz(), 3),
                                   fixed(fromAbsoluteGHz(l.frequencyGHz, SpectralUnit::NmVacuum, 0), 5), fixed(l.intensity, 4),
                                   fixed(l.intensityCrystal[0], 4), fixed(l.intensityCrystal[1], 4),
                                   fixed(l.intensityCrystal[2], 4)};
      if (unit)
        row.insert(row.begin() + kPositionColumn,
                   fixed(fromAbsoluteGHz(l.frequencyGHz, *unit, model.zplGHz()), positionDecimals(*unit)));
      t.rows.push_back(std::move(row));
    }
  return t;
}

ordered levelsJson(const std::vector<ClassSolution>& classes) {
  ordered out{{"classes", ordered::array()}};
  for (const ClassSolution& s : classes)
    out["classes"].push_back(ordered{{"class", s.cls},
                                     {"axis_crystal", classAxisIndices(s.cls)},
                                     {"ground_GHz", toArray(s.ground.energies)},
                                     {"excited_GHz", toArray(s.excited.energies)},
                                     {"ground_branch", s.groundBranch},
                                     {"excited_branch", s.excitedBranch}});
  return out;
}

Table levelsTable(const std::vector<ClassSolution>& classes) {
  Table t{{"class", "manifold", "level", "energy (GHz)", "branch"}, {}};
  for (const ClassSolution& s : classes) {
    for (Eigen::Index i = 0; i < s.ground.energies.size(); ++i)
      t.rows.push_back({std::to_string(s.cls), "ground", std::to_string(i), fixed(s.ground.energies[i], 4),
                        branchName(s.groundBranch[static_cast<std::size_t>(i)])});
    for (Eigen::Index i = 0; i < s.excited.energies.size(); ++i)
      t.rows.push_back({std::to_string(s.cls), "excited", std::to_string(i), fixed(s.excited.energies[i], 4),
                        branchName(s.excitedBranch[static_cast<std::size_t>(i)])});
  }
  return t;
}

ordered spectrumJson(const SpectrumCurve& c, SpectralUnit unit, SpectrumKind kind) {
  return ordered{{"kind", kind == SpectrumKind::Emission ? "PL" : "PLE"},
                 {"unit", std::string(spectralUnitKey(unit))},
                 {"x", c.x},
                 {"y", c.y}};
}

Table spectrumTable(const SpectrumCurve& c, SpectralUnit unit) {
  Table t{{std::string(spectralUnitKey(unit)), "intensity"}, {}};
  for (std::size_t i = 0; i < c.x.size(); ++i) t.rows.push_back({exact(c.x[i]), exact(c.y[i])});
  return t;
}

std::string sweepAxisLabel(SweepKind kind) {
  switch (kind) {
    case SweepKind::Magnitude: return "field (T)";
    case SweepKind::Angle: return "angle (deg)";
    case SweepKind::Strain: return "strain path fraction";
    case SweepKind::Temperature: return "temperature (K)";
  }
  return {};
}

ordered sweepJson(const SweepSpec& spec, const SweepResult& r) {
  static const char* kinds[] = {"magnitude", "angle", "strain", "temperature"};
  ordered out{{"name", spec.name}, {"kind", kinds[static_cast<int>(spec.kind)]}, {"x", r.x}, {"classes", ordered::array()}};
  for (const ClassSweep& c : r.classes) {
    ordered g = ordered::array(), u = ordered::array(), lines = ordered::array();
    for (Eigen::Index k = 0; k < c.groundLevels.rows(); ++k) {
      g.push_back(toArray(c.groundLevels.row(k).transpose()));
      u.push_back(toArray(c.excitedLevels.row(k).transpose()));
      ordered pts = ordered::array();
      const auto& rowLines = c.lines[static_cast<std::size_t>(k)];
      for (std::size_t i = 0; i < rowLines.size(); ++i) {
        const OpticalLine& l = rowLines[i];
        ordered line{{"upper", l.upper}, {"lower", l.lower}, {"label", l.label()},
                     {"frequency_GHz", l.frequencyGHz}, {"intensity", l.intensity}};
        if (!c.lineFwhmGHz.empty()) line["fwhm_GHz"] = c.lineFwhmGHz[static_cast<std::size_t>(k)][i];
        pts.push_back(line);
      }
      lines.push_back(pts);
    }
    out["classes"].push_back(ordered{{"class", c.cls}, {"ground_GHz", g}, {"excited_GHz", u}, {"lines", lines}});
  }
  return out;
}

Table sweepLinesTable(const SweepSpec& spec, const SweepResult& r) {
  const bool widths = spec.kind == SweepKind::Temperature;
  Table t{{sweepAxisLabel(spec.kind), "class", "upper", "lower", "label", "frequency_GHz", "intensity"}, {}};
  if (widths) t.headers.push_back("fwhm_GHz");
  for (const ClassSweep& c : r.classes)
    for (std::size_t k = 0; k < r.x.size(); ++k)
      for (std::size_t i = 0; i < c.lines[k].size(); ++i) {
        const OpticalLine& l = c.lines[k][i];
        t.rows.push_back({exact(r.x[k]), std::to_string(c.cls), std::to_string(l.upper), std::to_string(l.lower),
                          l.label(), exact(l.frequencyGHz), exact(l.intensity)});
        if (widths) t.rows.back().push_back(exact(c.lineFwhmGHz[k][i]));
      }
  return t;
}

ordered presetsJson(const std::vector<Preset>& presets) {
  ordered out = ordered::array();
  auto entry = [](const ValueProvenance& v) {
    return ordered{{"value", std::isfinite(v.value) ? ordered(v.value) : ordered(nullptr)},
                   {"unit", v.unit}, {"source", v.source}, {"status", valueStatusText(v.status)}};
  };
  for (const Preset& p : presets) {
    ordered params = ordered::object();
    for (const ParamInfo& info : paramTable())
      if (!info.hyperfine) params[std::string(info.key)] = entry(p.values[static_cast<std::size_t>(info.id)]);
    ordered isotopes = ordered::object();
    for (const auto& [name, table] : p.isotopes) {
      ordered iso = ordered::object();
      for (const ParamInfo& info : paramTable())
        if (table[static_cast<std::size_t>(info.id)]) iso[std::string(info.key)] = entry(*table[static_cast<std::size_t>(info.id)]);
      isotopes[name] = iso;
    }
    out.push_back(ordered{{"name", p.name}, {"title", p.title}, {"zpl_reference", p.zplReference}, {"notes", p.notes},
                          {"parameters", params}, {"isotopes", isotopes}});
  }
  return out;
}

Table presetsTable(const std::vector<Preset>& presets) {
  Table t{{"centre", "isotope", "key", "value", "unit", "status", "source"}, {}};
  auto add = [&](const std::string& centre, const std::string& iso, const ParamInfo& info, const ValueProvenance& v) {
    t.rows.push_back({centre, iso, std::string(info.key), std::isfinite(v.value) ? exact(v.value) : "unknown", v.unit,
                      valueStatusText(v.status), v.source});
  };
  for (const Preset& p : presets) {
    t.rows.push_back({p.name, "-", "zpl_reference", "-", "", "note", p.zplReference});
    if (!p.notes.empty()) t.rows.push_back({p.name, "-", "notes", "-", "", "note", p.notes});
    for (const ParamInfo& info : paramTable())
      if (!info.hyperfine) add(p.name, "-", info, p.values[static_cast<std::size_t>(info.id)]);
    for (const auto& [name, table] : p.isotopes)
      for (const ParamInfo& info : paramTable())
        if (table[static_cast<std::size_t>(info.id)]) add(p.name, name, info, *table[static_cast<std::size_t>(info.id)]);
  }
  return t;
}

}  // namespace finestra
