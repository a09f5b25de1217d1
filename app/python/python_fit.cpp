// finestra.fit and its result object. The result's to_dict() is fitJson, the structure of
// `finestra-cli fit --format json`; its attributes are read from that same document.
#include <pybind11/numpy.h>
#include <pybind11/stl.h>

#include <cmath>
#include <sstream>

#include "app/python/python_json.h"
#include "app/python/python_progress.h"
#include "app/python/python_project.h"
#include "core/common/errors.h"
#include "core/fit/fit_report.h"

namespace py = pybind11;

namespace finestra::python {
namespace {

struct PyFitResult {
  FitResult result;
  PyProject project;            ///< the project that was fitted
  nlohmann::ordered_json json;  ///< fitJson(project, result)
};

// Correlations between the free parameters; entries of undetermined parameters are masked
// (numpy.ma), never NaN values a reader could take for numbers.
py::object correlationArray(const FitResult& r) {
  const auto n = static_cast<py::ssize_t>(r.correlation.rows());
  py::array_t<double> matrix({n, static_cast<py::ssize_t>(r.correlation.cols())});
  auto view = matrix.mutable_unchecked<2>();
  for (py::ssize_t a = 0; a < n; ++a)
    for (py::ssize_t b = 0; b < view.shape(1); ++b) view(a, b) = r.correlation(a, b);
  return py::module_::import("numpy.ma").attr("masked_invalid")(matrix);
}

std::string reprOf(const PyFitResult& f) {
  std::ostringstream out;
  out << "<finestra.FitResult " << (f.result.converged ? "converged" : "NOT converged") << ": " << f.result.status
      << "\n chi2/dof = ";
  if (std::isfinite(f.result.chi2PerDof)) out << f.result.chi2PerDof;
  else out << "undefined (no degrees of freedom)";
  out << " (chi2 " << f.result.chi2 << ", dof " << f.result.dof << "), " << f.result.assignedCount
      << " peaks assigned, " << f.result.outlierCount << " outliers\n"
      << fitParameterTable(f.result).toText();
  if (!f.result.undetermined.empty()) {
    out << " undetermined by the data:";
    for (const auto& name : f.result.undetermined) out << ' ' << name;
    out << '\n';
  }
  out << ">";
  return out.str();
}

PyFitResult runFit(const PyProject& p, const std::optional<std::vector<std::string>>& free,
                   const std::optional<int>& starts, unsigned seed, const py::object& callback) {
  if (starts && (*starts < 1 || *starts > 1000)) throw InputError("starts", "must be between 1 and 1000");
  FitOptions options;
  options.free = free;
  options.starts = starts;
  options.seed = seed;
  PythonProgress progress(callback);
  const PyProject snapshot = p;  // the caller's object may change while the GIL is released
  FitResult result = computeWithoutGil(progress, [&](const ProgressControl& control) {
    options.progress = control;
    return inProject(snapshot, [&] { return fitProject(snapshot.project, options); });
  });
  nlohmann::ordered_json json = fitJson(snapshot.project, result);
  return {std::move(result), snapshot, std::move(json)};
}

}  // namespace

void bindFit(py::module_& m) {
  py::class_<PyFitResult>(m, "FitResult", R"doc(
The result of finestra.fit: fitted values, standard errors (scaled by sqrt(chi2/dof)), correlations,
the assignment of every measured peak and the parameters the data cannot determine.
to_dict() is exactly the structure of `finestra-cli fit --format json`.)doc")
      .def_property_readonly("converged", [](const PyFitResult& f) { return f.result.converged; })
      .def_property_readonly("status", [](const PyFitResult& f) { return f.result.status; })
      .def_property_readonly("chi2", [](const PyFitResult& f) { return f.result.chi2; })
      .def_property_readonly("dof", [](const PyFitResult& f) { return f.result.dof; })
      .def_property_readonly("chi2_per_dof", [](const PyFitResult& f) { return toPython(f.json["chi2_per_dof"]); },
                             "chi2/dof, or None when there is no degree of freedom.")
      .def_property_readonly("parameters", [](const PyFitResult& f) { return toPython(f.json["parameters"]); },
                             "[{name, value, stderr, free}], free parameters first; stderr None when undetermined.")
      .def_property_readonly("values", [](const PyFitResult& f) {
             py::dict out;
             for (const auto& p : f.result.parameters) out[py::str(p.name)] = p.value;
             return out;
           }, "{parameter name: fitted value} in the unit of the name.")
      .def_property_readonly("errors", [](const PyFitResult& f) {
             py::dict out;
             for (const auto& p : f.json["parameters"]) out[py::str(p["name"].get<std::string>())] = toPython(p["stderr"]);
             return out;
           }, "{parameter name: standard error}, None where fixed or undetermined.")
      .def_property_readonly("correlation", [](const PyFitResult& f) { return correlationArray(f.result); },
                             "numpy.ma array (free × free, order of correlation_names); undetermined entries masked.")
      .def_property_readonly("correlation_names", [](const PyFitResult& f) { return toPython(f.json["correlations"]["names"]); })
      .def_property_readonly("assignments", [](const PyFitResult& f) { return toPython(f.json["assignments"]); },
                             "[{measurement, peak, class, upper, lower, residual_GHz, label, pinned}]; class None: outlier.")
      .def_property_readonly("undetermined", [](const PyFitResult& f) { return f.result.undetermined; },
                             "Free parameters the data cannot determine (identifiability report).")
      .def_property_readonly("undetermined_combinations", [](const PyFitResult& f) { return f.result.undeterminedCombinations; },
                             "Parameter combinations left free by the data, e.g. '0.71 strain_xx - 0.71 strain_yy'.")
      .def("to_dict", [](const PyFitResult& f) { return toPython(f.json); })
      .def("applied", [](const PyFitResult& f) {
             return PyProject{applyFitToProject(f.project.project, f.result), f.project.origin};
           }, "A copy of the fitted project with the fitted values written in (as finestra-cli fit --write-project).")
      .def("__repr__", &reprOf);
  m.def("fit", &runFit, py::arg("project"), py::arg("free") = py::none(), py::arg("starts") = py::none(),
        py::arg("seed") = 1u, py::arg("progress") = py::none(),
        R"doc(Assigns the project's measured peaks to lines and fits the free parameters (default: fit.free of the
project) from several starts (default: fit.starts), without the GIL. progress(fraction) may return False to
cancel (raises finestra.Cancelled). A fit that does not converge is reported in the result, not raised.)doc");
}

}  // namespace finestra::python
