#pragma once
// Output of `finestra-cli thermal`: per class and temperature, the branch splittings and phonon
// rates of both manifolds, the spin coherence limit and the homogeneous width of every line.
#include <nlohmann/json.hpp>

#include "core/report/table.h"
#include "core/thermal/thermal_scan.h"

namespace finestra {

/// {"classes": [{"class", "rows": [{"temperature_K", "ground": {"splitting_GHz", "up_per_s",
/// "down_per_s"}, "excited": {...}, "spin_coherence_limit_s", "lines": [{"upper", "lower", "label",
/// "fwhm_GHz"}]}]}]}. An undefined coherence limit is null with "undefined_reason" beside it; with
/// a bath T2* in the project, "bath_t2star_s" and the governing "spin_coherence_s" are added.
nlohmann::ordered_json thermalJson(const ThermalScan& scan);

/// One row per class and temperature: splittings, rates, coherence limit, and the widths of the
/// narrowest and broadest line.
Table thermalTable(const ThermalScan& scan);

/// One row per class, temperature and line (CSV).
Table thermalLinesTable(const ThermalScan& scan);

}  // namespace finestra
