#pragma once
// Reading and writing the project file ("finestra-project" version 1, docs/architecture.md,
// Project file). The project's types are in core/project/project.h.
#include <string>

#include "core/project/project.h"

namespace finestra {

/// Parses a project document. `origin` (a file name) prefixes every error message.
Project parseProject(const std::string& text, const std::string& origin);
/// Reads a project file; errors name the file (and line for syntax errors, key path otherwise).
Project readProjectFile(const std::string& path);
/// Serialises to the version-1 JSON layout (pretty-printed). A non-finite number (JSON has none)
/// throws InputError naming its key path.
std::string projectToJson(const Project& project);
/// Writes atomically (see writeFileAtomically). On failure the previous file is untouched and
/// InputError names the path.
void writeProjectFile(const Project& project, const std::string& path);

}  // namespace finestra
