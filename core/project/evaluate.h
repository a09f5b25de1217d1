#pragma once
// Evaluation of a project at its current settings: every selected class at the project's field.
#include <vector>

#include "core/model/centre_model.h"
#include "core/project/project.h"

namespace finestra {

/// Solves each class in `project.classes` at the project's true field (labels included); classes
/// run in parallel.
std::vector<ClassSolution> solveProjectClasses(const CentreModel& model, const Project& project);

}  // namespace finestra
