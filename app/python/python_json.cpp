#include "app/python/python_json.h"

#include <pybind11/numpy.h>

#include <optional>

#include "core/common/errors.h"

namespace py = pybind11;

namespace finestra::python {
namespace {

bool allNumbers(const nlohmann::ordered_json& array) {
  for (const auto& v : array)
    if (!v.is_number()) return false;
  return true;
}

// The width of a non-empty array of equal-length, non-empty number arrays; nullopt otherwise.
std::optional<std::size_t> matrixWidth(const nlohmann::ordered_json& array) {
  if (array.empty() || !array.front().is_array() || array.front().empty()) return std::nullopt;
  const std::size_t width = array.front().size();
  for (const auto& row : array)
    if (!row.is_array() || row.size() != width || !allNumbers(row)) return std::nullopt;
  return width;
}

py::array_t<double> numberArray(const nlohmann::ordered_json& array) {
  py::array_t<double> out(static_cast<py::ssize_t>(array.size()));
  auto view = out.mutable_unchecked<1>();
  for (std::size_t i = 0; i < array.size(); ++i) view(static_cast<py::ssize_t>(i)) = array[i].get<double>();
  return out;
}

py::array_t<double> numberMatrix(const nlohmann::ordered_json& array, std::size_t width) {
  py::array_t<double> out({static_cast<py::ssize_t>(array.size()), static_cast<py::ssize_t>(width)});
  auto view = out.mutable_unchecked<2>();
  for (std::size_t i = 0; i < array.size(); ++i)
    for (std::size_t j = 0; j < width; ++j)
      view(static_cast<py::ssize_t>(i), static_cast<py::ssize_t>(j)) = array[i][j].get<double>();
  return out;
}

}  // namespace

py::object toPython(const nlohmann::ordered_json& value, NumberLists numbers) {
  switch (value.type()) {
    case nlohmann::ordered_json::value_t::null: return py::none();
    case nlohmann::ordered_json::value_t::boolean: return py::bool_(value.get<bool>());
    case nlohmann::ordered_json::value_t::number_integer: return py::int_(value.get<long long>());
    case nlohmann::ordered_json::value_t::number_unsigned: return py::int_(value.get<unsigned long long>());
    case nlohmann::ordered_json::value_t::number_float: return py::float_(value.get<double>());
    case nlohmann::ordered_json::value_t::string: return py::str(value.get<std::string>());
    case nlohmann::ordered_json::value_t::array: {
      if (numbers == NumberLists::AsArrays && !value.empty()) {
        if (allNumbers(value)) return numberArray(value);
        if (const auto width = matrixWidth(value)) return numberMatrix(value, *width);
      }
      py::list list;
      for (const auto& item : value) list.append(toPython(item, numbers));
      return list;
    }
    case nlohmann::ordered_json::value_t::object: {
      py::dict dict;
      for (const auto& [key, item] : value.items()) dict[py::str(key)] = toPython(item, numbers);
      return dict;
    }
    default: return py::none();
  }
}

nlohmann::ordered_json fromPython(const py::handle& value, const std::string& where) {
  if (value.is_none()) return nullptr;
  if (py::isinstance<py::bool_>(value)) return value.cast<bool>();
  if (py::isinstance<py::int_>(value)) return value.cast<long long>();
  if (py::isinstance<py::float_>(value)) return value.cast<double>();
  if (py::isinstance<py::str>(value)) return value.cast<std::string>();
  if (py::isinstance<py::array>(value) || py::hasattr(value, "tolist")) return fromPython(value.attr("tolist")(), where);
  if (py::isinstance<py::dict>(value)) {
    nlohmann::ordered_json object = nlohmann::ordered_json::object();
    for (const auto& [key, item] : value.cast<py::dict>()) {
      if (!py::isinstance<py::str>(key)) throw InputError(where, "dictionary keys must be strings");
      const std::string name = key.cast<std::string>();
      object[name] = fromPython(item, where.empty() ? name : where + "." + name);
    }
    return object;
  }
  if (py::isinstance<py::list>(value) || py::isinstance<py::tuple>(value)) {
    nlohmann::ordered_json array = nlohmann::ordered_json::array();
    std::size_t index = 0;
    for (const auto& item : value) array.push_back(fromPython(item, where + "[" + std::to_string(index++) + "]"));
    return array;
  }
  throw InputError(where, "cannot be stored in a project: " + py::repr(value.get_type()).cast<std::string>());
}

}  // namespace finestra::python
