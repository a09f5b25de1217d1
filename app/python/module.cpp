// The Python extension finestra._finestra (re-exported by the package finestra): wiring from
// finestra::core to Python. Each python_*.cpp binds one part.
#include <pybind11/pybind11.h>

#include <string>

#include "app/python/python_errors.h"
#include "app/python/python_project.h"
#include "core/common/version.h"

namespace finestra::python {
void bindEngine(pybind11::module_& m);
void bindFit(pybind11::module_& m);
void bindPlanner(pybind11::module_& m);
}  // namespace finestra::python

PYBIND11_MODULE(_finestra, m) {
  m.doc() = "The Finestra engine: projects, presets, levels and lines, sweeps, spectra, fit and planner.";
  m.attr("__version__") = std::string(finestra::kVersion);
  finestra::python::bindErrors(m);
  finestra::python::bindProject(m);
  finestra::python::bindEngine(m);
  finestra::python::bindFit(m);
  finestra::python::bindPlanner(m);
}
