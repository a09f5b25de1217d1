#pragma once
// A plain table of strings rendered as aligned text or as CSV (RFC 4180 quoting).
#include <string>
#include <vector>

namespace finestra {

struct Table {
  std::vector<std::string> headers;
  std::vector<std::vector<std::string>> rows;

  std::string toText() const;
  std::string toCsv() const;
};

/// Fixed-point text of a number with `decimals` digits after the point.
std::string fixed(double value, int decimals);
/// Number with 15 significant digits (for CSV and machine output).
std::string exact(double value);

}  // namespace finestra
