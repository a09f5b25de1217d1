#pragma once
// Centre presets (resources/presets/*.json, compiled into core) with the provenance of every
// value, and resolution of a project's centre choice (preset + isotope + user overrides) into the
// numbers the engine uses.
#include <array>
#include <map>
#include <optional>
#include <string>
#include <vector>

#include "core/centre/parameters.h"

namespace finestra {

enum class ValueStatus { Published, FromMemory, Assumed, Unknown, CommonPractice, UserSet, NotUsed };

std::string valueStatusText(ValueStatus s);
/// Parses a preset status text ("published", "from memory", "assumed", "unknown",
/// "common practice"); throws InputError naming `where` otherwise.
ValueStatus parseValueStatus(const std::string& text, const std::string& where);

struct ValueProvenance {
  double value = std::nan("");  ///< NaN when unknown
  std::string unit;
  std::string source;
  ValueStatus status = ValueStatus::NotUsed;
};

struct Preset {
  std::string name;   ///< e.g. "SiV-"
  std::string title;  ///< human-readable
  std::string zplReference;  ///< what the ZPL value is (centroid, which line, which temperature)
  std::string notes;         ///< choices between published families, alternatives
  std::array<ValueProvenance, kParamCount> values;  ///< hyperfine entries NotUsed
  std::map<std::string, std::array<std::optional<ValueProvenance>, kParamCount>> isotopes;
};

/// All built-in presets, parsed once from the embedded resources.
const std::vector<Preset>& builtinPresets();
/// Throws InputError("centre.preset", ...) listing the available names when not found.
const Preset& findPreset(const std::string& name);
/// Parses one preset document; `origin` names it in errors.
Preset parsePreset(const std::string& jsonText, const std::string& origin);

/// A centre ready for the engine: numbers plus the provenance of each.
struct ResolvedCentre {
  std::string presetName;
  std::optional<std::string> isotope;
  CentreParameters parameters;
  std::array<ValueProvenance, kParamCount> provenance;
};

/// Preset values, replaced by the isotope's, replaced by the user's overrides (status UserSet).
/// Throws InputError for an unknown preset, isotope or override key.
ResolvedCentre resolveCentre(const std::string& presetName, const std::optional<std::string>& isotope,
                             const std::map<std::string, double>& overrides);

/// Sets explicitly assumed values (key → value) with status "assumed" and source "assumed in the
/// project file". Throws InputError naming centre.assumed.<key> for an unknown key.
void applyAssumedValues(ResolvedCentre& centre, const std::map<std::string, double>& assumed);

}  // namespace finestra
