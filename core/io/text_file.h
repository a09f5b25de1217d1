#pragma once
// Whole-file text reading and atomic writing, with errors that name the path.
#include <string>

namespace finestra {

/// Reads a whole file; InputError naming the path if it cannot be read.
std::string readTextFile(const std::string& path);
/// Writes text atomically: a temporary file in the same folder, flushed, then renamed over `path`.
/// On failure the previous file is untouched and InputError names the path.
void writeFileAtomically(const std::string& path, const std::string& text);

}  // namespace finestra
