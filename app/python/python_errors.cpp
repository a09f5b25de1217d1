#include "app/python/python_errors.h"

#include "core/common/errors.h"
#include "core/common/progress.h"

namespace py = pybind11;

namespace finestra::python {
namespace {

// Raises `type(message)` with the attribute `key` set (the key path, file:line or "" when none).
void raiseWithKey(PyObject* type, const InputError& error) {
  py::object instance = py::reinterpret_steal<py::object>(PyObject_CallFunction(type, "s", error.what()));
  if (!instance) return;  // the call itself set a Python error
  instance.attr("key") = error.where();
  PyErr_SetObject(type, instance.ptr());
}

}  // namespace

void bindErrors(py::module_& m) {
  static py::handle inputError = PyErr_NewExceptionWithDoc(
      "finestra.InputError",
      "Bad input: a project key, file, parameter or argument. str(e) is the full message; e.key names the key "
      "path or file:line at fault (empty when the whole input is meant).",
      PyExc_ValueError, nullptr);
  static py::handle missingValue = PyErr_NewExceptionWithDoc(
      "finestra.MissingValueError",
      "A computation needs a model value that the preset marks unknown; e.key names the parameter.",
      inputError.ptr(), nullptr);
  static py::handle cancelled = PyErr_NewExceptionWithDoc(
      "finestra.Cancelled", "A computation stopped because its progress callback returned False.",
      PyExc_RuntimeError, nullptr);
  m.attr("InputError") = inputError;
  m.attr("MissingValueError") = missingValue;
  m.attr("Cancelled") = cancelled;
  py::register_exception_translator([](std::exception_ptr thrown) {
    try {
      if (thrown) std::rethrow_exception(thrown);
    } catch (const MissingValueError& e) {
      raiseWithKey(missingValue.ptr(), e);
    } catch (const InputError& e) {
      raiseWithKey(inputError.ptr(), e);
    } catch (const Cancelled& e) {
      PyErr_SetString(cancelled.ptr(), e.what());
    }
  });
}

}  // namespace finestra::python
