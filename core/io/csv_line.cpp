#include "core/io/csv_line.h"

#include <cctype>
#include <charconv>
#include <cmath>

#include "core/common/errors.h"
#include "core/common/text_escape.h"

namespace finestra {
namespace {

std::string trimmed(const std::string& s) {
  std::size_t b = 0, e = s.size();
  while (b < e && std::isspace(static_cast<unsigned char>(s[b]))) ++b;
  while (e > b && std::isspace(static_cast<unsigned char>(s[e - 1]))) --e;
  return s.substr(b, e - b);
}

}  // namespace

std::vector<std::string> splitCsvLine(const std::string& rawLine, const std::string& where) {
  std::string line = rawLine;
  if (!line.empty() && line.back() == '\r') line.pop_back();
  std::vector<std::string> cells;
  std::string cell;
  bool quoted = false, wasQuoted = false;
  for (std::size_t i = 0; i < line.size(); ++i) {
    const char c = line[i];
    if (quoted) {
      if (c == '"' && i + 1 < line.size() && line[i + 1] == '"') {
        cell.push_back('"');
        ++i;
      } else if (c == '"') {
        quoted = false;
      } else {
        cell.push_back(c);
      }
    } else if (c == '"') {
      quoted = true;
      wasQuoted = true;
    } else if (c == ',' || c == '\t') {
      cells.push_back(wasQuoted ? cell : trimmed(cell));
      cell.clear();
      wasQuoted = false;
    } else {
      cell.push_back(c);
    }
  }
  if (quoted) throw InputError(where, "unterminated quote");
  cells.push_back(wasQuoted ? cell : trimmed(cell));
  return cells;
}

std::string_view csvTextWithoutByteOrderMark(const std::string& text, const std::string& origin) {
  const std::string_view view(text);
  if (view.starts_with("\xEF\xBB\xBF")) return view.substr(3);
  if (view.starts_with("\xFF\xFE") || view.starts_with("\xFE\xFF"))
    throw InputError(origin, "the file is UTF-16 (or UTF-32) text; save it as UTF-8");
  return view;
}

void requireUtf8Row(const std::string& line, const std::string& where) {
  const std::size_t bad = firstInvalidUtf8(line);
  if (bad == std::string::npos) return;
  throw InputError(where, "byte " + std::to_string(bad + 1) +
                              " of this row is not UTF-8 text (the file looks like Latin-1 or Windows-1252); save "
                              "the file as UTF-8");
}

bool isCsvCommentOrBlank(const std::string& line) {
  for (char c : line) {
    if (std::isspace(static_cast<unsigned char>(c))) continue;
    return c == '#';
  }
  return true;
}

std::optional<double> parseCsvNumber(const std::string& cell) {
  if (cell.empty()) return std::nullopt;
  const char* begin = cell.data();
  if (*begin == '+') ++begin;
  double value = 0;
  const auto [end, ec] = std::from_chars(begin, cell.data() + cell.size(), value);
  if (ec != std::errc() || end != cell.data() + cell.size() || !std::isfinite(value)) return std::nullopt;
  return value;
}

}  // namespace finestra
