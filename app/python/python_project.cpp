#include "app/python/python_project.h"

#include <pybind11/numpy.h>
#include <pybind11/stl.h>

#include <cmath>
#include <sstream>

#include "app/python/python_json.h"
#include "core/common/errors.h"
#include "core/project/field_semantics.h"

namespace py = pybind11;

namespace finestra::python {
namespace {

using ordered = nlohmann::ordered_json;

ordered documentOf(const PyProject& p) { return ordered::parse(projectToJson(p.project)); }

PyProject fromDocument(const ordered& document, const std::string& origin) {
  return {parseProject(document.dump(), origin), origin};
}

// "sweeps[0].points" → {"sweeps", "0", "points"}: dots separate object keys, [i] indexes lists.
std::vector<std::string> splitKeyPath(const std::string& path) {
  std::vector<std::string> parts;
  std::string current;
  for (char c : path) {
    if (c == '.' || c == '[' || c == ']') {
      if (!current.empty()) parts.push_back(current);
      current.clear();
    } else {
      current += c;
    }
  }
  if (!current.empty()) parts.push_back(current);
  if (parts.empty()) throw InputError(path, "empty key path");
  return parts;
}

// The value at `path`; missing object members are created when `create` is set.
ordered& at(ordered& document, const std::string& path, bool create) {
  ordered* node = &document;
  for (const std::string& part : splitKeyPath(path)) {
    if (node->is_array()) {
      std::size_t index = 0;
      try {
        index = std::stoul(part);
      } catch (const std::exception&) {
        throw InputError(path, "'" + part + "' is not a list index");
      }
      if (index >= node->size()) throw InputError(path, "index " + part + " is past the end of the list");
      node = &(*node)[index];
    } else if (node->is_object() || (create && node->is_null())) {
      if (!create && !node->contains(part)) throw InputError(path, "no key '" + part + "' in the project");
      node = &(*node)[part];
    } else {
      throw InputError(path, "'" + part + "' is inside a value that is neither an object nor a list");
    }
  }
  return *node;
}

std::string fieldText(const Project& project) {
  std::ostringstream out;
  out.precision(4);
  const FieldSetting& f = project.field;
  if (f.form == FieldSetting::Form::Angles)
    out << f.magnitudeT << " T at polar " << f.polarDeg << "°, azimuth " << f.azimuthDeg << "° (lab)";
  else
    out << "[" << f.vector.x() << ", " << f.vector.y() << ", " << f.vector.z() << "] T ("
        << (f.form == FieldSetting::Form::VectorLab ? "lab" : "crystal") << " axes)";
  return out.str();
}

std::string reprOf(const PyProject& p) {
  std::ostringstream out;
  const Project& project = p.project;
  out << "<finestra.Project " << project.centre.preset;
  if (project.centre.isotope) out << " (" << *project.centre.isotope << ")";
  out << ", field " << fieldText(project) << ", classes [";
  for (std::size_t k = 0; k < project.classes.size(); ++k) out << (k ? ", " : "") << project.classes[k];
  out << "], " << project.sweeps.size() << " sweep(s), " << project.measurements.size() << " measurement set(s)";
  if (p.origin != "<project>") out << ", from " << p.origin;
  out << ">";
  return out.str();
}

}  // namespace

CentreModel modelOf(const PyProject& p) {
  return inProject(p, [&] { return CentreModel(makeModelSetup(p.project)); });
}

void bindProject(py::module_& m) {
  py::class_<PyProject> cls(m, "Project", R"doc(
A Finestra project: centre, sample, field, strain, detection conditions, classes, sweeps,
measurements and fit settings, as in a project file. Edits (set, update) go through the project
reader: a bad key or value raises finestra.InputError naming the key, and leaves the project as it
was. Key paths use dots for objects and [i] for lists, e.g. "field.magnitude_T",
"centre.parameters.lambda_g_GHz", "sweeps[0].points".
)doc");
  cls.def(py::init([] { return PyProject{}; }), "The default project (SiV-, zero field, all four classes).")
      .def_static("load", [](const std::string& path) { return PyProject{readProjectFile(path), path}; },
                  py::arg("path"), "Reads a project file (same rules and messages as finestra-cli).")
      .def_static("from_dict", [](const py::dict& d) { return fromDocument(fromPython(d, ""), "<dict>"); },
                  py::arg("document"), "A project from a dict with the project-file layout.")
      .def_static("from_json", [](const std::string& text) { return PyProject{parseProject(text, "<json>"), "<json>"}; },
                  py::arg("text"), "A project from the text of a project file.")
      .def("to_dict", [](const PyProject& p) { return toPython(documentOf(p)); },
           "The project-file layout as a dict (format, version, centre, ...).")
      .def("to_json", [](const PyProject& p) { return projectToJson(p.project); }, "The project-file text.")
      .def("get", [](const PyProject& p, const std::string& path) {
             ordered document = documentOf(p);
             return toPython(at(document, path, false));
           }, py::arg("key_path"), "The value at a key path, e.g. p.get(\"field.magnitude_T\").")
      .def("set", [](PyProject& p, const std::string& path, const py::object& value) {
             ordered document = documentOf(p);
             at(document, path, true) = fromPython(value, path);
             p = fromDocument(document, p.origin);
           }, py::arg("key_path"), py::arg("value"),
           "Sets one value and validates the whole project; raises InputError naming the key.")
      .def("update", [](PyProject& p, const py::dict& changes) {
             ordered document = documentOf(p);
             for (const auto& [key, value] : changes) {
               const std::string path = py::str(key);
               at(document, path, true) = fromPython(value, path);
             }
             p = fromDocument(document, p.origin);
           }, py::arg("changes"), "Sets several key paths at once ({path: value}); all or nothing.")
      .def("save", [](const PyProject& p, const std::string& path) { writeProjectFile(p.project, path); },
           py::arg("path"), "Writes the project file atomically (a failed save leaves the old file intact).")
      .def("copy", [](const PyProject& p) { return p; }, "An independent copy.")
      .def("__copy__", [](const PyProject& p) { return p; })
      .def("__deepcopy__", [](const PyProject& p, const py::dict&) { return p; }, py::arg("memo"))
      .def("__eq__", [](const PyProject& a, const PyProject& b) { return projectToJson(a.project) == projectToJson(b.project); })
      .def("__repr__", &reprOf)
      .def_readonly("origin", &PyProject::origin, "The file the project came from, or <dict>/<json>/<project>.")
      .def_property_readonly("description", [](const PyProject& p) { return p.project.description; })
      .def_property_readonly("preset", [](const PyProject& p) { return p.project.centre.preset; })
      .def_property_readonly("classes", [](const PyProject& p) { return p.project.classes; },
                             "Selected orientation classes (0..3).")
      .def_property_readonly("sweep_names", [](const PyProject& p) {
             std::vector<std::string> names;
             for (const auto& s : p.project.sweeps) names.push_back(s.name);
             return names;
           })
      .def_property_readonly("field_crystal_T", [](const PyProject& p) {
             const Vec3 field = projectFieldCrystal(p.project, modelOf(p).setup().lab);
             py::array_t<double> out(3);
             for (py::ssize_t k = 0; k < 3; ++k) out.mutable_at(k) = field[static_cast<Eigen::Index>(k)];
             return out;
           }, "The true field of the magnet setting in crystal axes (T), magnet calibration applied.");
  cls.attr("__hash__") = py::none();
  m.def("load_project", [](const std::string& path) { return PyProject{readProjectFile(path), path}; },
        py::arg("path"), "Reads a project file; same as Project.load(path).");
}

}  // namespace finestra::python
