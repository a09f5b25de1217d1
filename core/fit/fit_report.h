#pragma once
// Fit and strain results as JSON (docs/architecture.md, Machine-readable output) and as text tables.
#include <nlohmann/json.hpp>

#include "core/fit/project_fit.h"
#include "core/report/table.h"
#include "core/strain/zero_field_input.h"

namespace finestra {

/// { converged, chi2_per_dof, parameters[{name,value,stderr,free}], assignments[{measurement,
/// peak,class,upper,lower,residual_GHz}], unidentifiable[names] } plus status, chi2, dof,
/// label per assignment, correlations and the undetermined combinations. NaN → null.
nlohmann::ordered_json fitJson(const Project& project, const FitResult& result);
Table fitParameterTable(const FitResult& result);
Table fitAssignmentTable(const Project& project, const FitResult& result);

nlohmann::ordered_json strainJson(const Project& project, const ZeroFieldSelection& selection, const ZeroFieldStrainEstimate& e);
Table strainTable(const ZeroFieldStrainEstimate& e);
/// The plain verdicts (core/strain/strain_verdict.h) as sentences, printed under strainTable.
std::string strainVerdictText(const ZeroFieldStrainEstimate& e);

}  // namespace finestra
