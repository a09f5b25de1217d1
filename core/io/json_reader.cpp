#include "core/io/json_reader.h"

#include <cmath>
#include <set>
#include <vector>

#include "core/common/errors.h"

namespace finestra {
using nlohmann::json;

JsonObjectReader::JsonObjectReader(const json& object, std::string path) : j_(object), path_(std::move(path)) {
  if (!j_.is_object()) throw InputError(path_.empty() ? "(top level)" : path_, "expected a JSON object");
}

std::string JsonObjectReader::keyPath(const std::string& key) const {
  if (key.empty()) return path_;
  return path_.empty() ? key : path_ + "." + key;
}

void JsonObjectReader::allowOnly(std::initializer_list<const char*> allowed) const {
  for (auto it = j_.begin(); it != j_.end(); ++it) {
    bool ok = false;
    for (const char* a : allowed) ok = ok || it.key() == a;
    if (!ok) {
      std::string list;
      for (const char* a : allowed) list += (list.empty() ? "" : ", ") + std::string(a);
      throw InputError(keyPath(it.key()), "unknown key (allowed here: " + list + ")");
    }
  }
}

bool JsonObjectReader::has(const char* key) const { return j_.contains(key); }
bool JsonObjectReader::isNull(const char* key) const { return !has(key) || j_.at(key).is_null(); }

const json& JsonObjectReader::raw(const char* key) const {
  if (!has(key)) throw InputError(keyPath(key), "missing");
  return j_.at(key);
}

JsonObjectReader JsonObjectReader::object(const char* key) const { return JsonObjectReader(raw(key), keyPath(key)); }

double finiteNumber(const json& v, const std::string& path) {
  if (!v.is_number()) throw InputError(path, "expected a number, found " + std::string(v.type_name()));
  const double x = v.get<double>();
  if (!std::isfinite(x)) throw InputError(path, "number is not finite");
  return x;
}

Vec3 readVec3(const json& v, const std::string& path) {
  if (!v.is_array() || v.size() != 3) throw InputError(path, "expected an array of 3 numbers");
  return {finiteNumber(v[0], path + "[0]"), finiteNumber(v[1], path + "[1]"), finiteNumber(v[2], path + "[2]")};
}

double JsonObjectReader::number(const char* key) const { return finiteNumber(raw(key), keyPath(key)); }
double JsonObjectReader::number(const char* key, double fallback) const {
  return has(key) ? number(key) : fallback;
}

int JsonObjectReader::integer(const char* key) const {
  const json& v = raw(key);
  if (!v.is_number_integer()) throw InputError(keyPath(key), "expected an integer");
  const auto x = v.get<long long>();
  if (x < -1000000000LL || x > 1000000000LL) throw InputError(keyPath(key), "integer out of range");
  return static_cast<int>(x);
}
int JsonObjectReader::integer(const char* key, int fallback) const { return has(key) ? integer(key) : fallback; }

std::string JsonObjectReader::string(const char* key) const {
  const json& v = raw(key);
  if (!v.is_string()) throw InputError(keyPath(key), "expected a string, found " + std::string(v.type_name()));
  return v.get<std::string>();
}
std::string JsonObjectReader::string(const char* key, const std::string& fallback) const {
  return has(key) ? string(key) : fallback;
}
std::optional<std::string> JsonObjectReader::optionalString(const char* key) const {
  if (isNull(key)) return std::nullopt;
  return string(key);
}

bool JsonObjectReader::boolean(const char* key, bool fallback) const {
  if (!has(key)) return fallback;
  const json& v = raw(key);
  if (!v.is_boolean()) throw InputError(keyPath(key), "expected true or false");
  return v.get<bool>();
}

Vec3 JsonObjectReader::vec3(const char* key) const { return readVec3(raw(key), keyPath(key)); }
std::optional<Vec3> JsonObjectReader::optionalVec3(const char* key) const {
  if (isNull(key)) return std::nullopt;
  return vec3(key);
}

namespace {
std::string lineColumn(const std::string& text, std::size_t byte) {
  std::size_t line = 1, col = 1;
  for (std::size_t i = 0; i < byte && i < text.size(); ++i) {
    if (text[i] == '\n') {
      ++line;
      col = 1;
    } else {
      ++col;
    }
  }
  return std::to_string(line) + ":" + std::to_string(col);
}
}  // namespace

json parseJsonStrict(const std::string& text, const std::string& origin) {
  if (text.size() >= 3 && static_cast<unsigned char>(text[0]) == 0xEF &&
      static_cast<unsigned char>(text[1]) == 0xBB && static_cast<unsigned char>(text[2]) == 0xBF)
    return parseJsonStrict(text.substr(3), origin);
  if (text.find_first_not_of(" \t\r\n") == std::string::npos) throw InputError(origin, "file is empty");
  // UTF-16 text starts with a byte-order mark FF FE / FE FF, or has a NUL byte beside its first
  // ASCII character ('{' or a space) when it has none.
  const auto byte = [&](std::size_t i) { return static_cast<unsigned char>(text[i]); };
  if (text.size() >= 2 && ((byte(0) == 0xFF && byte(1) == 0xFE) || (byte(0) == 0xFE && byte(1) == 0xFF) ||
                           ((byte(0) == 0) != (byte(1) == 0))))
    throw InputError(origin, "file is UTF-16 encoded; save it as UTF-8");
  std::vector<std::set<std::string>> seen;  // keys of each open object
  std::string duplicate;
  json::parser_callback_t callback = [&](int, json::parse_event_t event, json& parsed) {
    switch (event) {
      case json::parse_event_t::object_start: seen.emplace_back(); break;
      case json::parse_event_t::object_end: if (!seen.empty()) seen.pop_back(); break;
      case json::parse_event_t::key:
        if (!seen.empty() && !seen.back().insert(parsed.get<std::string>()).second && duplicate.empty())
          duplicate = parsed.get<std::string>();
        break;
      default: break;
    }
    return true;
  };
  json doc;
  try {
    doc = json::parse(text, callback);
  } catch (const json::parse_error& e) {
    std::string msg = e.what();
    const auto cut = msg.find("syntax error");
    if (cut != std::string::npos) msg = msg.substr(cut);
    throw InputError(origin + ":" + lineColumn(text, e.byte == 0 ? 0 : e.byte - 1), "malformed JSON: " + msg);
  } catch (const json::out_of_range& e) {
    // Number overflow (e.g. 1e999): nlohmann names the literal; locate it for the line number.
    const std::string msg = e.what();
    const auto open = msg.find('\''), close = msg.rfind('\'');
    const std::string literal = open != std::string::npos && close > open ? msg.substr(open + 1, close - open - 1) : "";
    const std::size_t at = literal.empty() ? std::string::npos : text.find(literal);
    throw InputError(origin + (at == std::string::npos ? "" : ":" + lineColumn(text, at)),
                     "number " + literal + " is out of range (not a finite double)");
  }
  if (!duplicate.empty()) throw InputError(origin, "duplicate key '" + duplicate + "'");
  return doc;
}

}  // namespace finestra
