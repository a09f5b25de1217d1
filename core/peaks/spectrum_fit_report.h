#pragma once
// Spectrum-fit results as JSON and as a text table (same layout as the peak fit's parameters).
#include <nlohmann/json.hpp>

#include "core/peaks/spectrum_fit.h"
#include "core/report/table.h"

namespace finestra {

/// {converged, status, chi2, dof, chi2_per_dof, errors_scaled, error_note,
///  parameters[{name, value, stderr, stderr_formal, stderr_scaled, free}], unidentifiable,
///  unidentifiable_combinations, spectra[{name, measurement, noise}]}; NaN → null.
nlohmann::ordered_json spectrumFitJson(const Project& project, const std::vector<SpectrumData>& spectra, const SpectrumFitResult& r);
Table spectrumFitTable(const SpectrumFitResult& r);

}  // namespace finestra
