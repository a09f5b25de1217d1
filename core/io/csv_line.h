#pragma once
// Splitting of one CSV line into cells (RFC 4180 quoting; comma or tab as separator), shared by
// the measured-peak and measured-spectrum readers.
#include <optional>
#include <string>
#include <vector>

namespace finestra {

/// Cells of one line, whitespace around unquoted cells trimmed. Throws InputError naming `where`
/// for an unterminated quote.
std::vector<std::string> splitCsvLine(const std::string& line, const std::string& where);

/// True for blank lines and comment lines (first non-blank character '#').
bool isCsvCommentOrBlank(const std::string& line);

/// Strict number parse of a whole cell; std::nullopt when the cell is not a finite number.
std::optional<double> parseCsvNumber(const std::string& cell);

}  // namespace finestra
