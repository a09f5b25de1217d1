#include "core/report/table.h"

#include <algorithm>
#include <cstdio>
#include <sstream>

namespace finestra {
namespace {

// Columns a cell takes on a terminal: one per UTF-8 code point ("—", "°" and "ε" are one column).
std::size_t displayWidth(const std::string& text) {
  return static_cast<std::size_t>(std::count_if(text.begin(), text.end(), [](char c) {
    return (static_cast<unsigned char>(c) & 0xC0u) != 0x80u;
  }));
}

}  // namespace

std::string Table::toText() const {
  std::vector<std::size_t> width(headers.size(), 0);
  for (std::size_t c = 0; c < headers.size(); ++c) width[c] = displayWidth(headers[c]);
  for (const auto& r : rows)
    for (std::size_t c = 0; c < r.size() && c < width.size(); ++c) width[c] = std::max(width[c], displayWidth(r[c]));
  std::ostringstream out;
  auto line = [&](const std::vector<std::string>& cells) {
    for (std::size_t c = 0; c < cells.size(); ++c) {
      if (c) out << "  ";
      out << std::string(width[c] - std::min(width[c], displayWidth(cells[c])), ' ') << cells[c];
    }
    out << '\n';
  };
  line(headers);
  std::vector<std::string> rule;
  for (std::size_t w : width) rule.emplace_back(w, '-');
  line(rule);
  for (const auto& r : rows) line(r);
  return out.str();
}

std::string Table::toCsv() const {
  auto quote = [](const std::string& s) {
    if (s.find_first_of(",\"\n") == std::string::npos) return s;
    std::string q = "\"";
    for (char ch : s) q += ch == '"' ? std::string("\"\"") : std::string(1, ch);
    return q + "\"";
  };
  std::ostringstream out;
  auto line = [&](const std::vector<std::string>& cells) {
    for (std::size_t c = 0; c < cells.size(); ++c) out << (c ? "," : "") << quote(cells[c]);
    out << '\n';
  };
  line(headers);
  for (const auto& r : rows) line(r);
  return out.str();
}

std::string fixed(double value, int decimals) {
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.*f", decimals, value);
  return buf;
}

std::string exact(double value) {
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.15g", value);
  return buf;
}

}  // namespace finestra
