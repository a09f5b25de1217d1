#pragma once
// JSON and table forms of the microwave-transition and Λ-system results. The default JSON has the
// exact layouts of the `microwave` and `lambda-systems` commands (README); `details` appends the
// supporting figures after the documented keys.
#include <nlohmann/json.hpp>
#include <vector>

#include "core/report/table.h"
#include "core/resonance/lambda_systems.h"
#include "core/resonance/microwave.h"
#include "core/resonance/resonance_spectrum.h"

namespace finestra {

nlohmann::ordered_json microwaveJson(const std::vector<ClassMicrowave>& classes, bool details);
Table microwaveTable(const std::vector<ClassMicrowave>& classes);

nlohmann::ordered_json lambdaJson(const std::vector<ClassLambda>& classes, bool details);
Table lambdaTable(const std::vector<ClassLambda>& classes);

/// Pump line and its dips (class `cls`), JSON entry and table.
nlohmann::ordered_json cptDipsJson(int cls, int excited, int pumpGround, const std::vector<CptDip>& dips);
Table cptDipsTable(int cls, const std::vector<CptDip>& dips);

/// Short label of a transition: electron spin projections as arrows (↑ for ⟨S_z⟩ > ¼, ↓ below −¼,
/// ~ for mixed) and the nuclear projection kept or changed, e.g. "↓→↑ mI 1/2" or "↓→↑ mI 1/2→-1/2".
std::string microwaveLabel(const MicrowaveTransition& transition);
/// Several lines for a hover read-out: class, levels, frequency, strength and parts, character, populations.
std::string describeMicrowaveTransition(int cls, const MicrowaveTransition& transition);

Table resonanceSpectrumTable(const ResonanceSpectrum& spectrum);

}  // namespace finestra
