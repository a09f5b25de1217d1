// The magnet planner for Python: ranked settings and feasible region (planJson, the structure of
// `finestra-cli plan --format json`) and the direction map as 2-D arrays over polar × azimuth.
#include <pybind11/numpy.h>
#include <pybind11/stl.h>

#include <cmath>

#include "app/python/python_json.h"
#include "app/python/python_progress.h"
#include "app/python/python_project.h"
#include "core/common/errors.h"
#include "core/planner/plan_report.h"

namespace py = pybind11;

namespace finestra::python {
namespace {

// The request a project implies before any request document: its selected classes (the first is
// the target), its magnet calibration and the magnitude of its magnet setting (0.5 T at zero
// field), as finestra-cli plan.
PlanRequest projectRequest(const Project& project, const CentreModel& model) {
  PlanRequest request;
  request.settings.classes = project.classes;
  request.targetClass = project.classes.empty() ? 0 : project.classes.front();
  request.magnet = project.magnet;  // reach directions and magnitudes are magnet settings
  const double magnitude = project.field.labVector(model.setup().lab).norm();
  request.magnitudesT = {magnitude > 0 ? magnitude : 0.5};
  return request;
}

// request: None, a dict with the plan-request layout, or the path of a plan-request file.
PlanRequest requestFor(const PyProject& p, const CentreModel& model, const py::object& request) {
  PlanRequest out = projectRequest(p.project, model);
  if (py::isinstance<py::str>(request)) out = readPlanRequestFile(request.cast<std::string>(), out);
  else if (!request.is_none()) out = parsePlanRequest(fromPython(request, "request").dump(), "request", out);
  out.settings.magnitudeT = out.magnitudesT.empty() ? 0.0 : out.magnitudesT.front();
  validatePlanRequest(out);
  return out;
}

py::dict planMap(const PyProject& p, const std::optional<double>& magnitudeT, double stepDeg,
                 const py::object& request, const py::object& callback) {
  if (!(stepDeg >= 0.05 && stepDeg <= 90)) throw InputError("step_deg", "must be between 0.05 and 90 degrees");
  const CentreModel model = modelOf(p);
  PlanRequest planRequest = requestFor(p, model, request);
  if (magnitudeT) {
    if (!(*magnitudeT > 0 && *magnitudeT <= 1000)) throw InputError("magnitude_T", "must be in (0, 1000] T");
    planRequest.settings.magnitudeT = *magnitudeT;
  }
  SphereGrid grid;
  grid.polarCount = static_cast<int>(std::lround(180.0 / stepDeg)) + 1;
  grid.azimuthCount = static_cast<int>(std::lround(360.0 / stepDeg)) + 1;
  PythonProgress progress(callback);
  const FigureMap map = computeWithoutGil(progress, [&](const ProgressControl& control) {
    return computeFigureMap(model, planRequest.settings, grid, control);
  });
  const std::vector<int>& classes = planRequest.settings.classes;
  py::array_t<double> polar(grid.polarCount), azimuth(grid.azimuthCount);
  for (int i = 0; i < grid.polarCount; ++i) polar.mutable_at(i) = grid.polarDeg(i);
  for (int j = 0; j < grid.azimuthCount; ++j) azimuth.mutable_at(j) = grid.azimuthDeg(j);
  py::dict out;
  out["magnitude_T"] = map.magnitudeT;
  out["polar_deg"] = polar;
  out["azimuth_deg"] = azimuth;
  out["classes"] = classes;
  const py::object maskInvalid = py::module_::import("numpy.ma").attr("masked_invalid");
  const auto classCount = static_cast<py::ssize_t>(classes.size());
  for (const FigureInfo& info : figureTable()) {
    py::array_t<double> values({classCount, py::ssize_t{grid.polarCount}, py::ssize_t{grid.azimuthCount}});
    auto view = values.mutable_unchecked<3>();
    for (py::ssize_t c = 0; c < classCount; ++c)
      for (int i = 0; i < grid.polarCount; ++i)
        for (int j = 0; j < grid.azimuthCount; ++j)
          view(c, i, j) = figureValue(map.at(i, j, classes[static_cast<std::size_t>(c)]), info.id);
    out[py::str(std::string(info.key))] = maskInvalid(values);
  }
  return out;
}

}  // namespace

void bindPlanner(py::module_& m) {
  m.def("plan", [](const PyProject& p, const py::object& request, const py::object& callback) {
        const CentreModel model = modelOf(p);
        const PlanRequest planRequest = requestFor(p, model, request);
        PythonProgress progress(callback);
        const PlanResult result = computeWithoutGil(progress, [&](const ProgressControl& control) {
          return runPlan(model, planRequest, control);
        });
        return toPython(planJson(model, planRequest, result));
      }, py::arg("project"), py::arg("request") = py::none(), py::arg("progress") = py::none(),
      R"doc(Magnet planner: figures of merit over the directions the magnet reaches, the feasible region and
the ranked settings; the structure of `finestra-cli plan --format json`. request: None (the project's
classes and field magnitude, full sphere), a dict in the plan-request layout (keys target_class,
magnitudes_T, drive_lab, lines, reach, constraints, objective, best) or the path of a request file.)doc");
  m.def("plan_map", &planMap, py::arg("project"), py::arg("magnitude_T") = py::none(), py::arg("step_deg") = 1.0,
        py::arg("request") = py::none(), py::arg("progress") = py::none(),
        R"doc(Every planner figure over the whole sphere of true-field directions (lab angles) at one magnitude.

Returns a dict: "magnitude_T"; "polar_deg" (P,) and "azimuth_deg" (A,) grid axes in degrees, both ends
included, step step_deg; "classes" (C,) the selected classes; and one numpy.ma array of shape (C, P, A)
per figure (qubit_GHz, drive_GHz_per_T, drive_fraction, cyclicity, separation_linewidths,
ground_gap_GHz, excited_gap_GHz, axis_angle_deg): axis 0 class, axis 1 polar, axis 2 azimuth.
Masked entries are undefined there (e.g. a degenerate level pair). magnitude_T default: the request's
first magnitude (the project's field magnitude).)doc");
}

}  // namespace finestra::python
