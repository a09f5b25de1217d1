#pragma once
// finestra.Project: a project held by Python. Every edit goes through the project reader, so an
// edited project obeys the same rules and gives the same key-naming errors as a file.
#include <pybind11/pybind11.h>

#include <string>

#include "core/io/project.h"

namespace finestra::python {

struct PyProject {
  Project project;
  std::string origin = "<project>";  ///< the file it came from, named in error messages
};

/// The engine for a project; set-up errors (e.g. an unknown preset value) name the origin and key.
CentreModel modelOf(const PyProject& p);

void bindProject(pybind11::module_& m);

}  // namespace finestra::python
