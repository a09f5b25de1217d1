#pragma once
// Peak-finder results as JSON and as a table (the CLI prints them; the GUI shows the same numbers).
#include <nlohmann/json.hpp>

#include "core/peaks/peak_finder.h"
#include "core/report/table.h"
#include "core/units/spectral_units.h"

namespace finestra {

/// {"peaks": [{"position","sigma","fwhm","fwhm_sigma","area","area_sigma"}], "unit", "noise"};
/// an undefined error is null with "undefined_reason" beside it.
nlohmann::ordered_json peaksJson(const PeakFinderResult& result, SpectralUnit unit);
/// One row per peak, numbered from 0: peak, position, sigma, fwhm, fwhm_sigma, area, area_sigma, snr.
Table peaksTable(const PeakFinderResult& result);
/// Lines above the table: count, shape, noise, baseline, χ²/dof and which errors are reported.
std::string peaksSummary(const PeakFinderResult& result, SpectralUnit unit);

}  // namespace finestra
