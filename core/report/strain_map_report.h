#pragma once
// A sample map of zero-field strain as JSON and tables. CSV columns carry value and sigma
// separately (an undefined sigma is an empty cell, with the 2σ upper limit in its own column).
#include <nlohmann/json.hpp>

#include "core/report/table.h"
#include "core/strain/strain_map.h"

namespace finestra {

/// {"units", "cannot_determine", "emitters": [...], "summary": [...], "counts": {...}}.
nlohmann::ordered_json strainMapJson(const StrainMap& map);
/// One row per emitter: value and sigma in separate columns, verdict flags.
Table strainMapTable(const StrainMap& map);
/// median, spread, min, max, count per figure.
Table strainSummaryTable(const StrainMap& map);
/// Sentences above the tables: units and frame, counts of verdicts, what the lines cannot determine.
std::string strainMapNotes(const StrainMap& map);

}  // namespace finestra
