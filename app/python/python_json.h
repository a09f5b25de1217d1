#pragma once
// Conversion between JSON values (nlohmann) and Python objects: the module returns the same
// structures the CLI prints with --format json, as dicts, lists, floats and strings.
#include <pybind11/pybind11.h>

#include <nlohmann/json.hpp>

namespace finestra::python {

enum class NumberLists {
  AsLists,   ///< every JSON array becomes a list (the CLI's JSON, unchanged)
  AsArrays,  ///< an array of numbers becomes a 1-D float64 NumPy array, an array of equal-length
             ///< arrays of numbers a 2-D one (rows = outer index); other arrays stay lists
};

pybind11::object toPython(const nlohmann::ordered_json& value, NumberLists numbers = NumberLists::AsLists);
/// Accepts None, bool, int, float, str, lists, tuples, dicts with str keys and NumPy arrays
/// (through tolist()). `where` names the value in the InputError for anything else.
nlohmann::ordered_json fromPython(const pybind11::handle& value, const std::string& where);

}  // namespace finestra::python
