#pragma once
// finestra.Project: a project held by Python. Every edit goes through the project reader, so an
// edited project obeys the same rules and gives the same key-naming errors as a file.
#include <pybind11/pybind11.h>

#include <string>
#include <utility>

#include "core/common/errors.h"
#include "core/io/project_file.h"
#include "core/project/model_setup.h"

namespace finestra::python {

struct PyProject {
  Project project;
  std::string origin = "<project>";  ///< the file it came from, named in error messages
};

/// Runs body(); an InputError it throws is thrown again with the project's origin before the key,
/// as finestra-cli does for a file (MissingValueError stays a MissingValueError).
template <typename Body>
auto inProject(const PyProject& p, Body body) {
  const auto withOrigin = [&](const InputError& e) {
    return std::make_pair(p.origin + ": " + e.where(),
                          std::string(e.what()).substr(e.where().empty() ? 0 : e.where().size() + 2));
  };
  try {
    return body();
  } catch (const MissingValueError& e) {
    const auto [where, what] = withOrigin(e);
    throw MissingValueError(where, what);
  } catch (const InputError& e) {
    const auto [where, what] = withOrigin(e);
    throw InputError(where, what);
  }
}

/// The engine for a project; set-up errors (e.g. an unknown preset value) name the origin and key.
CentreModel modelOf(const PyProject& p);

void bindProject(pybind11::module_& m);

}  // namespace finestra::python
