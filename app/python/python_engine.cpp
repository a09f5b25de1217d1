// Levels, lines, the vectorised line grid, sweeps, spectra and presets for Python. The dict
// results are built by the same core/report functions as `finestra-cli ... --format json`.
#include <pybind11/numpy.h>
#include <pybind11/stl.h>

#include <cmath>
#include <memory>

#include "app/python/python_json.h"
#include "app/python/python_progress.h"
#include "app/python/python_project.h"
#include "core/common/errors.h"
#include "core/optics/line_grid.h"
#include "core/project/evaluate.h"
#include "core/report/reports.h"

namespace py = pybind11;

namespace finestra::python {
namespace {

/// Largest number of fields one line_grid call accepts (the output is 512 bytes per field and class).
constexpr py::ssize_t kMaxGridFields = 2'000'000;
/// The project reader's field limit (docs/physics.md, Accepted ranges).
constexpr double kMaxFieldT = 1000.0;

std::vector<Vec3> fieldsFrom(const py::array_t<double, py::array::c_style | py::array::forcecast>& fields) {
  if (fields.ndim() != 2 || fields.shape(1) != 3)
    throw InputError("fields", "expected a float array of shape (N, 3) (crystal-frame field in tesla)");
  const py::ssize_t n = fields.shape(0);
  if (n > kMaxGridFields)
    throw InputError("fields", std::to_string(n) + " fields; at most " + std::to_string(kMaxGridFields) + " per call");
  const auto view = fields.unchecked<2>();
  std::vector<Vec3> out(static_cast<std::size_t>(n));
  for (py::ssize_t k = 0; k < n; ++k) {
    const Vec3 b(view(k, 0), view(k, 1), view(k, 2));
    if (!b.allFinite() || !(b.norm() <= kMaxFieldT))
      throw InputError("fields[" + std::to_string(k) + "]", "field must be finite and at most 1000 T");
    out[static_cast<std::size_t>(k)] = b;
  }
  return out;
}

// The grid is returned without copying: both arrays are strided views of the core's output,
// kept alive by a capsule that owns it.
py::dict gridArrays(std::unique_ptr<std::vector<LineGridPoint>> points, py::ssize_t fieldCount,
                    const std::vector<int>& classes) {
  const auto classCount = static_cast<py::ssize_t>(classes.size());
  LineGridPoint* data = points->data();
  py::capsule owner(points.release(), [](void* p) { delete static_cast<std::vector<LineGridPoint>*>(p); });
  constexpr auto point = static_cast<py::ssize_t>(sizeof(LineGridPoint));
  constexpr auto d = static_cast<py::ssize_t>(sizeof(double));
  py::array_t<double> frequency({fieldCount, classCount, py::ssize_t{4}, py::ssize_t{4}},
                                {classCount * point, point, 4 * d, d}, data->frequencyGHz.data(), owner);
  py::array_t<double> intensity({fieldCount, classCount, py::ssize_t{4}, py::ssize_t{4}, py::ssize_t{3}},
                                {classCount * point, point, 12 * d, 3 * d, d}, data->intensityCrystal[0].data(), owner);
  py::dict out;
  out["frequency_GHz"] = frequency;
  out["intensity_crystal_xyz"] = intensity;
  out["classes"] = py::array_t<int>(static_cast<py::ssize_t>(classes.size()), classes.data());
  return out;
}

py::dict lineGrid(const PyProject& p, const py::array_t<double, py::array::c_style | py::array::forcecast>& fields,
                  const py::object& progressCallback) {
  const std::vector<Vec3> crystalFields = fieldsFrom(fields);
  const CentreModel model = modelOf(p);
  const std::vector<int> classes = p.project.classes;
  auto points = std::make_unique<std::vector<LineGridPoint>>();
  PythonProgress progress(progressCallback);
  computeWithoutGil(progress, [&](const ProgressControl& control) {
    evaluateLineGrid(model, crystalFields, classes, *points, control);
    return 0;
  });
  return gridArrays(std::move(points), static_cast<py::ssize_t>(crystalFields.size()), classes);
}

const SweepSpec& findSweep(const PyProject& p, const std::optional<std::string>& name) {
  if (p.project.sweeps.empty()) throw InputError(p.origin + ": sweeps", "the project defines no sweep");
  if (!name) return p.project.sweeps.front();
  for (const auto& candidate : p.project.sweeps)
    if (candidate.name == *name) return candidate;
  throw InputError("name", "no sweep named '" + *name + "' in " + p.origin);
}

SpectrumKind spectrumKind(const std::string& kind) {
  if (kind == "PL" || kind == "pl") return SpectrumKind::Emission;
  if (kind == "PLE" || kind == "ple") return SpectrumKind::Excitation;
  throw InputError("kind", "expected PL or PLE");
}

}  // namespace

void bindEngine(py::module_& m) {
  m.def("presets", [] { return toPython(presetsJson(builtinPresets())); },
        "Every built-in centre preset: each value with unit, status (published, from memory, assumed, unknown) and "
        "source. Same structure as `finestra-cli presets --format json`.");
  m.def("levels", [](const PyProject& p) {
        const CentreModel model = modelOf(p);
        const Project project = p.project;
        const auto classes = [&] { py::gil_scoped_release release; return solveProjectClasses(model, project); }();
        return toPython(levelsJson(classes));
      }, py::arg("project"),
      "Levels of both manifolds (GHz) of every selected class at the project's field: the structure of "
      "`finestra-cli levels --format json`.");
  m.def("lines", [](const PyProject& p) {
        const CentreModel model = modelOf(p);
        const Project project = p.project;
        const auto classes = [&] { py::gil_scoped_release release; return solveProjectClasses(model, project); }();
        return toPython(linesJson(model, classes));
      }, py::arg("project"),
      "Optical lines of every selected class at the project's field, with labels, frequencies (GHz) and "
      "intensities: exactly the structure of `finestra-cli lines --format json` (dicts, lists, floats).");
  m.def("line_grid", &lineGrid, py::arg("project"), py::arg("fields"), py::arg("progress") = py::none(),
        R"doc(All 16 lines of each selected class at many fields, in parallel, without the GIL.

fields: float array (N, 3), true field in crystal axes, tesla (the magnet calibration is not applied).
Returns a dict of arrays:
  "frequency_GHz"          (N, classes, 4 excited levels, 4 ground levels), absolute frequency, GHz
  "intensity_crystal_xyz"  (N, classes, 4, 4, 3), |e.d|^2 for analysers along crystal x, y, z
  "classes"                (classes,), the project's selected classes in axis-1 order
Levels are indexed in ascending energy. The arrays are read-only-by-convention views of one buffer.
Projects with an isotope (hyperfine) raise InputError: use lines() instead.
At most 2 000 000 fields per call.)doc");
  m.def("sweep", [](const PyProject& p, const std::optional<std::string>& name, const py::object& callback) {
        const CentreModel model = modelOf(p);
        const Project project = p.project;
        const SweepSpec spec = findSweep(p, name);
        PythonProgress progress(callback);
        const SweepResult result = computeWithoutGil(progress, [&](const ProgressControl& control) {
          return runSweep(model, project, spec, control);
        });
        return toPython(sweepJson(spec, result), NumberLists::AsArrays);
      }, py::arg("project"), py::arg("name") = py::none(), py::arg("progress") = py::none(),
      R"doc(Runs a sweep of the project (default: the first) for every selected class.

Same structure as `finestra-cli sweep --format json`, with number lists as NumPy arrays:
  "x" (points,): sweep parameter (T, degrees or strain fraction);
  per class: "ground_GHz", "excited_GHz" (points, levels), levels followed through crossings;
  "lines": per point, a list of {upper, lower, label, frequency_GHz, intensity}.)doc");
  m.def("spectrum", [](const PyProject& p, const std::string& unit, const std::string& kind,
                       const std::optional<std::pair<double, double>>& range, int points) {
        const SpectralUnit spectralUnit = parseSpectralUnit(unit, "unit");
        const SpectrumKind spectrumKindValue = spectrumKind(kind);
        if (points < 2 || points > 10'000'000) throw InputError("points", "must be between 2 and 10000000");
        const CentreModel model = modelOf(p);
        const Project project = p.project;
        const SpectrumCurve curve = [&] {
          py::gil_scoped_release release;
          const auto classes = solveProjectClasses(model, project);
          const auto weighted = weightLines(model, classes, spectrumKindValue);
          std::array<double, 2> bounds = autoRange(model, weighted, spectralUnit);
          if (range && range->first != range->second) bounds = {range->first, range->second};
          return computeSpectrum(model, weighted, spectralUnit, bounds[0], bounds[1], points);
        }();
        return toPython(spectrumJson(curve, spectralUnit, spectrumKindValue), NumberLists::AsArrays);
      }, py::arg("project"), py::arg("unit") = "GHz_detuning", py::arg("kind") = "PL", py::arg("range") = py::none(),
      py::arg("points") = 2001,
      "Simulated PL or PLE spectrum: the structure of `finestra-cli spectrum --format json` with the axis and "
      "intensity as NumPy arrays. unit: GHz_detuning, GHz, THz, nm_vac, nm_air, meV or cm-1; range: (from, to) "
      "in that unit, default automatic.");
}

}  // namespace finestra::python
