#pragma once
// From a project to the engine's input: the resolved centre, the sample frame, strain and
// detection conditions.
#include "core/model/centre_model.h"
#include "core/project/project.h"

namespace finestra {

/// Resolves the centre and frames; throws InputError/MissingValueError naming the key at fault.
ModelSetup makeModelSetup(const Project& project);

}  // namespace finestra
