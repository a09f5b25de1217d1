#include "core/common/text_escape.h"

#include <cstdio>

namespace finestra {
namespace {

std::string hexEscape(unsigned char byte) {
  char buffer[8];
  std::snprintf(buffer, sizeof buffer, "\\x%02X", static_cast<unsigned>(byte));
  return buffer;
}

unsigned char byteAt(std::string_view text, std::size_t at) { return static_cast<unsigned char>(text[at]); }

bool isContinuation(std::string_view text, std::size_t at) {
  return at < text.size() && (byteAt(text, at) & 0xC0u) == 0x80u;
}

}  // namespace

std::size_t utf8SequenceLength(std::string_view text, std::size_t at) {
  const unsigned char lead = byteAt(text, at);
  if (lead < 0x80u) return 1;
  std::size_t length = 0;
  unsigned minimum = 0;
  unsigned codePoint = 0;
  if ((lead & 0xE0u) == 0xC0u) { length = 2; minimum = 0x80; codePoint = lead & 0x1Fu; }
  else if ((lead & 0xF0u) == 0xE0u) { length = 3; minimum = 0x800; codePoint = lead & 0x0Fu; }
  else if ((lead & 0xF8u) == 0xF0u) { length = 4; minimum = 0x10000; codePoint = lead & 0x07u; }
  else return 0;
  for (std::size_t k = 1; k < length; ++k) {
    if (!isContinuation(text, at + k)) return 0;
    codePoint = (codePoint << 6) | (byteAt(text, at + k) & 0x3Fu);
  }
  if (codePoint < minimum || codePoint > 0x10FFFFu || (codePoint >= 0xD800u && codePoint <= 0xDFFFu)) return 0;
  return length;
}

std::size_t firstInvalidUtf8(std::string_view text) {
  for (std::size_t at = 0; at < text.size();) {
    const std::size_t length = utf8SequenceLength(text, at);
    if (length == 0) return at;
    at += length;
  }
  return std::string_view::npos;
}

std::string escapeControlCharacters(std::string_view text) {
  std::string out;
  out.reserve(text.size());
  for (std::size_t at = 0; at < text.size();) {
    const unsigned char byte = byteAt(text, at);
    const std::size_t length = utf8SequenceLength(text, at);
    if (length == 0) {
      out += hexEscape(byte);
      ++at;
      continue;
    }
    if (length == 1) {
      if (byte == '\n' || (byte >= 0x20u && byte < 0x7Fu)) out.push_back(static_cast<char>(byte));
      else if (byte == '\t') out += "\\t";
      else if (byte == '\r') out += "\\r";
      else if (byte == 0x1Bu) out += "\\e";
      else out += hexEscape(byte);
      ++at;
      continue;
    }
    const bool c1Control = length == 2 && byte == 0xC2u && byteAt(text, at + 1) < 0xA0u;  // U+0080..U+009F
    const bool byteOrderMark = length == 3 && text.substr(at, 3) == "\xEF\xBB\xBF";
    if (c1Control) out += "\\u00" + hexEscape(byteAt(text, at + 1)).substr(2);
    else if (byteOrderMark) out += "\\uFEFF";
    else out.append(text.substr(at, length));
    at += length;
  }
  return out;
}

}  // namespace finestra
