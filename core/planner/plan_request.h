#pragma once
// The plan request file, our own small JSON format (documented in docs of `finestra-cli plan`):
//   { "format": "finestra-plan-request", "version": 1,
//     "target_class": 0, "magnitudes_T": [0.3, 0.5], "drive_lab": [1, 0, 0], "lines": "C",
//     "reach": { "kind": "sphere" | "plane" | "sample_rotation", "step_deg": 1,
//                "normal_lab": [...], "start_lab": [...],                  (plane)
//                "magnet_axis_lab": [...], "rotation_axis_lab": [...] },   (sample_rotation)
//     "constraints": { "qubit_GHz": [8, 14], "cyclicity": [100, null] },   (null = open end)
//     "objective": { "figure": "cyclicity", "goal": "max" }, "best": 10,
//     "strain_population": { "eg_ground_GHz": [0, 50], "eg_excited_GHz": [0, 100],
//                            "samples": 64, "seed": 1, "angle_deg": 30 (optional: fixed angle),
//                            "distribution": "uniform" (optional, the only one) },
//     "alignment_tolerance_deg": 1, "rank_quantile": 0.9 }
// Every key is optional; unknown keys are errors naming the key path.
#include <string>

#include "core/planner/planner.h"

namespace finestra {

/// Starts from `defaults` (e.g. taken from the project) and applies the document's keys.
PlanRequest parsePlanRequest(const std::string& text, const std::string& origin, PlanRequest defaults);
PlanRequest readPlanRequestFile(const std::string& path, PlanRequest defaults);

/// "qubit_GHz=8:14", "cyclicity=100:", "drive_fraction=0.2:" (empty bound = open). `where` names
/// the option in errors.
Constraint parseConstraintText(const std::string& text, const std::string& where);
/// "sphere", "plane", "sample_rotation".
ReachKind parseReachKind(const std::string& text, const std::string& where);

}  // namespace finestra
