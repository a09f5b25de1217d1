#include "core/centre/presets.h"

#include <nlohmann/json.hpp>

#include "core/centre/embedded_presets.h"
#include "core/common/errors.h"

namespace finestra {
namespace {
using nlohmann::json;

ValueProvenance parseValue(const json& j, const std::string& where) {
  if (!j.is_object()) throw InputError(where, "expected an object with value, unit, source, status");
  for (const char* key : {"value", "unit", "source", "status"})
    if (!j.contains(key)) throw InputError(where, std::string("missing '") + key + "'");
  ValueProvenance v;
  if (j["value"].is_number()) v.value = j["value"].get<double>();
  else if (!j["value"].is_null()) throw InputError(where + ".value", "expected a number or null");
  v.unit = j["unit"].get<std::string>();
  v.source = j["source"].get<std::string>();
  v.status = parseValueStatus(j["status"].get<std::string>(), where + ".status");
  if ((v.status == ValueStatus::Unknown) != !std::isfinite(v.value))
    throw InputError(where, "a null value must have status 'unknown' and vice versa");
  return v;
}

}  // namespace

std::string valueStatusText(ValueStatus s) {
  switch (s) {
    case ValueStatus::Published: return "published";
    case ValueStatus::FromMemory: return "from memory";
    case ValueStatus::Assumed: return "assumed";
    case ValueStatus::Unknown: return "unknown";
    case ValueStatus::CommonPractice: return "common practice";
    case ValueStatus::UserSet: return "set by user";
    case ValueStatus::NotUsed: return "not used";
  }
  return {};
}

ValueStatus parseValueStatus(const std::string& text, const std::string& where) {
  for (ValueStatus s : {ValueStatus::Published, ValueStatus::FromMemory, ValueStatus::Assumed,
                        ValueStatus::Unknown, ValueStatus::CommonPractice})
    if (valueStatusText(s) == text) return s;
  throw InputError(where, "unknown status '" + text + "'");
}

Preset parsePreset(const std::string& text, const std::string& origin) {
  json doc;
  try {
    doc = json::parse(text);
  } catch (const json::parse_error& e) {
    throw InputError(origin, e.what());
  }
  try {
    Preset p;
    p.name = doc.at("name").get<std::string>();
    p.title = doc.at("title").get<std::string>();
    p.zplReference = doc.value("zpl_reference", std::string());
    p.notes = doc.value("notes", std::string());
    for (auto& [key, value] : doc.at("parameters").items()) {
      const auto id = findParam(key);
      if (!id || paramInfo(*id).hyperfine)
        throw InputError(origin + ": parameters." + key, "not a centre parameter key");
      p.values[static_cast<std::size_t>(*id)] = parseValue(value, origin + ": parameters." + key);
    }
    for (const ParamInfo& info : paramTable())
      if (!info.hyperfine && p.values[static_cast<std::size_t>(info.id)].status == ValueStatus::NotUsed)
        throw InputError(origin + ": parameters." + std::string(info.key), "missing");
    if (doc.contains("isotopes")) {
      for (auto& [iso, entries] : doc["isotopes"].items()) {
        auto& table = p.isotopes[iso];
        for (auto& [key, value] : entries.items()) {
          const auto id = findParam(key);
          const std::string where = origin + ": isotopes." + iso + "." + key;
          if (!id || !paramInfo(*id).hyperfine) throw InputError(where, "not a hyperfine parameter key");
          table[static_cast<std::size_t>(*id)] = parseValue(value, where);
        }
        for (const ParamInfo& info : paramTable())
          if (info.hyperfine && !table[static_cast<std::size_t>(info.id)])
            throw InputError(origin + ": isotopes." + iso + "." + std::string(info.key), "missing");
      }
    }
    return p;
  } catch (const json::exception& e) {
    throw InputError(origin, e.what());
  }
}

const std::vector<Preset>& builtinPresets() {
  static const std::vector<Preset> presets = [] {
    std::vector<Preset> out;
    for (const EmbeddedPreset& src : embeddedPresets())
      out.push_back(parsePreset(std::string(src.json), "resources/presets/" + std::string(src.file)));
    return out;
  }();
  return presets;
}

const Preset& findPreset(const std::string& name) {
  std::string names;
  for (const Preset& p : builtinPresets()) {
    if (p.name == name) return p;
    names += (names.empty() ? "" : ", ") + p.name;
  }
  throw InputError("centre.preset", "unknown preset '" + name + "' (available: " + names + ")");
}

ResolvedCentre resolveCentre(const std::string& presetName, const std::optional<std::string>& isotope,
                             const std::map<std::string, double>& overrides) {
  const Preset& preset = findPreset(presetName);
  ResolvedCentre out;
  out.presetName = preset.name;
  out.isotope = isotope;
  out.provenance = preset.values;
  if (isotope) {
    auto it = preset.isotopes.find(*isotope);
    if (it == preset.isotopes.end()) {
      std::string names;
      for (auto& [n, _] : preset.isotopes) names += (names.empty() ? "" : ", ") + n;
      throw InputError("centre.isotope", "unknown isotope '" + *isotope + "' for " + presetName +
                                             " (available: " + names + ")");
    }
    for (std::size_t i = 0; i < it->second.size(); ++i)
      if (it->second[i]) out.provenance[i] = *it->second[i];
  }
  for (const auto& [key, value] : overrides) {
    const auto id = findParam(key);
    if (!id) throw InputError("centre.parameters." + key, "unknown parameter key");
    auto& prov = out.provenance[static_cast<std::size_t>(*id)];
    prov.value = value;
    prov.unit = std::string(paramInfo(*id).unit);
    prov.status = ValueStatus::UserSet;
    prov.source = "project file";
  }
  for (const ParamInfo& info : paramTable()) {
    const auto& prov = out.provenance[static_cast<std::size_t>(info.id)];
    if (prov.status != ValueStatus::NotUsed) out.parameters.set(info.id, prov.value);
  }
  return out;
}

void applyAssumedValues(ResolvedCentre& centre, const std::map<std::string, double>& assumed) {
  for (const auto& [key, value] : assumed) {
    const auto id = findParam(key);
    if (!id) throw InputError("centre.assumed." + key, "unknown parameter key");
    if (!std::isfinite(value)) throw InputError("centre.assumed." + key, "not a finite number");
    auto& prov = centre.provenance[static_cast<std::size_t>(*id)];
    prov.value = value;
    prov.unit = std::string(paramInfo(*id).unit);
    prov.status = ValueStatus::Assumed;
    prov.source = "assumed in the project file";
    centre.parameters.set(*id, value);
  }
}

}  // namespace finestra
