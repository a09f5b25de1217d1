#pragma once
// Machine (JSON) and human (table/CSV) forms of the planner's results.
#include <nlohmann/json.hpp>

#include "core/planner/plan_request.h"
#include "core/report/table.h"

namespace finestra {

nlohmann::ordered_json figuresJson(const ClassFigures& f);
nlohmann::ordered_json spinTransitionsJson(const std::vector<SpinTransition>& transitions);

nlohmann::ordered_json planJson(const CentreModel& model, const PlanRequest& request, const PlanResult& result);
/// One row per feasible interval (region) and one per ranked setting (best).
Table planRegionTable(const PlanRequest& request, const PlanResult& result);
Table planBestTable(const PlanRequest& request, const PlanResult& result);

/// All figures of every selected class at one setting (field given in crystal axes).
nlohmann::ordered_json pointJson(const CentreModel& model, const PlannerSettings& settings, const Vec3& fieldCrystal,
                                 const std::array<ClassFigures, kClassCount>& figures,
                                 const std::vector<std::vector<SpinTransition>>& transitions);
Table pointTable(const PlannerSettings& settings, const std::array<ClassFigures, kClassCount>& figures);
/// The same with a strain population and/or an alignment tolerance: every figure of every class as
/// quantiles over the centres and worst in the cone, as in planJson's ranked settings.
nlohmann::ordered_json pointSpreadJson(const CentreModel& model, const PlanRequest& request, const Vec3& fieldCrystal,
                                       const std::vector<CentreStrain>& drawn,
                                       const std::array<ClassSpread, kClassCount>& spread);
Table pointSpreadTable(const PlanRequest& request, const std::array<ClassSpread, kClassCount>& spread);

/// Long form: one row per grid direction and selected class.
Table mapTable(const PlannerSettings& settings, const FigureMap& map);
Table profileTable(const PlannerSettings& settings, const std::vector<ProfilePoint>& profile);
nlohmann::ordered_json profileJson(const PlannerSettings& settings, const Vec3& directionLab,
                                   const std::vector<ProfilePoint>& profile);

}  // namespace finestra
