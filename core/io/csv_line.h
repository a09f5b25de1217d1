#pragma once
// Splitting of one CSV line into cells (RFC 4180 quoting; comma or tab as separator), shared by
// the measured-peak and measured-spectrum readers.
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace finestra {

/// Cells of one line, whitespace around unquoted cells trimmed. Throws InputError naming `where`
/// for an unterminated quote.
std::vector<std::string> splitCsvLine(const std::string& line, const std::string& where);

/// The text of a CSV file without the UTF-8 byte-order mark that spreadsheet programs write first.
/// Throws InputError naming `origin` for a UTF-16 or UTF-32 file (a byte-order mark of those).
std::string_view csvTextWithoutByteOrderMark(const std::string& text, const std::string& origin);

/// Throws InputError naming `where` (the row) when `line` is not valid UTF-8 (a file saved as
/// Latin-1 or Windows-1252), telling the user to save the file as UTF-8.
void requireUtf8Row(const std::string& line, const std::string& where);

/// True for blank lines and comment lines (first non-blank character '#').
bool isCsvCommentOrBlank(const std::string& line);

/// Strict number parse of a whole cell; std::nullopt when the cell is not a finite number.
std::optional<double> parseCsvNumber(const std::string& cell);

}  // namespace finestra
