#pragma once
// Strict, path-aware reading of JSON objects: every error names the key path (e.g.
// "field.magnitude_T"), unknown keys are errors, numbers must be finite.
#include <initializer_list>
#include <nlohmann/json.hpp>
#include <optional>
#include <string>

#include "core/common/types.h"

namespace finestra {

class JsonObjectReader {
public:
  /// `path` is the key path of `object` ("" at the top level). Throws if it is not an object.
  JsonObjectReader(const nlohmann::json& object, std::string path);

  /// Throws InputError naming the first key of the object not in `allowed`.
  void allowOnly(std::initializer_list<const char*> allowed) const;
  bool has(const char* key) const;
  bool isNull(const char* key) const;
  std::string keyPath(const std::string& key) const;
  const nlohmann::json& raw(const char* key) const;
  JsonObjectReader object(const char* key) const;

  double number(const char* key) const;
  double number(const char* key, double fallback) const;
  int integer(const char* key) const;
  int integer(const char* key, int fallback) const;
  std::string string(const char* key) const;
  std::string string(const char* key, const std::string& fallback) const;
  std::optional<std::string> optionalString(const char* key) const;
  bool boolean(const char* key, bool fallback) const;
  Vec3 vec3(const char* key) const;
  std::optional<Vec3> optionalVec3(const char* key) const;

private:
  const nlohmann::json& j_;
  std::string path_;
};

/// Reads a JSON number at `path`, rejecting non-numbers and non-finite values.
double finiteNumber(const nlohmann::json& value, const std::string& path);
Vec3 readVec3(const nlohmann::json& value, const std::string& path);

/// Parses JSON text; syntax errors and duplicate keys become InputError "<origin>:<line>:<col>".
nlohmann::json parseJsonStrict(const std::string& text, const std::string& origin);

}  // namespace finestra
