#pragma once
// Python exception types of the module and the translation of core's errors into them:
// finestra.InputError (a ValueError; .key names the key path or file:line at fault),
// finestra.MissingValueError (an InputError), finestra.Cancelled (a RuntimeError).
#include <pybind11/pybind11.h>

namespace finestra::python {

void bindErrors(pybind11::module_& m);

}  // namespace finestra::python
