#pragma once
// Makes text from the user safe to show in a message: a terminal must never receive a raw control
// character (an ESC from a file could reprogram it), and every message must be valid UTF-8 (the GUI
// and the JSON writer refuse anything else).
#include <string>
#include <string_view>

namespace finestra {

/// Returns `text` with every control character (C0 except the line break, DEL, C1), the byte-order
/// mark U+FEFF and every byte that is not part of valid UTF-8 written as a visible escape
/// (\t, \r, \e, \xNN or \uFEFF). Printable text, including non-ASCII UTF-8, is kept. The result
/// contains no control character but '\n', so escaping twice changes nothing.
std::string escapeControlCharacters(std::string_view text);

/// Length in bytes of the valid UTF-8 sequence starting at text[at], or 0 when the bytes there are
/// not valid UTF-8 (overlong forms, surrogates and values above U+10FFFF count as invalid).
std::size_t utf8SequenceLength(std::string_view text, std::size_t at);

/// Byte offset of the first byte that is not valid UTF-8, or std::string_view::npos.
std::size_t firstInvalidUtf8(std::string_view text);

}  // namespace finestra
