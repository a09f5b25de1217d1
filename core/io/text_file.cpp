#include "core/io/text_file.h"

#include <cstdio>
#include <filesystem>
#include <fstream>
#include <sstream>
#include <unistd.h>

#include "core/common/errors.h"
#include "core/common/limits.h"

namespace finestra {

std::string readTextFile(const std::string& path) {
  std::error_code ec;
  if (std::filesystem::is_directory(path, ec)) throw InputError(path, "is a folder, not a file");
  std::ifstream in(path, std::ios::binary);
  if (!in) throw InputError(path, "cannot open file for reading");
  // Read in blocks and stop at the limit: a device (/dev/zero) or a pipe has no size to ask for.
  std::string text;
  char block[65536];
  while (in.read(block, sizeof block) || in.gcount() > 0) {
    text.append(block, static_cast<std::size_t>(in.gcount()));
    if (text.size() > limits::kMaxInputFileBytes)
      throw InputError(path, "file is larger than the limit of " + std::to_string(limits::kMaxInputFileBytes / (1024 * 1024)) +
                                 " MiB for an input file");
  }
  if (in.bad()) throw InputError(path, "read error");
  return text;
}

void writeFileAtomically(const std::string& path, const std::string& text) {
  namespace fs = std::filesystem;
  const fs::path target(path);
  const fs::path temp = target.parent_path() / (".~" + target.filename().string() + ".tmp");
  {
    std::ofstream out(temp, std::ios::binary | std::ios::trunc);
    if (!out) throw InputError(path, "cannot write here (folder missing or not writable)");
    out << text;
    out.flush();
    if (!out) {
      std::error_code ec;
      fs::remove(temp, ec);
      throw InputError(path, "write failed (disk full?); the previous file is unchanged");
    }
  }
  if (FILE* f = std::fopen(temp.c_str(), "rb")) {  // flush to disk before the rename
    ::fsync(::fileno(f));
    std::fclose(f);
  }
  std::error_code ec;
  fs::rename(temp, target, ec);
  if (ec) {
    fs::remove(temp, ec);
    throw InputError(path, "cannot replace the file: " + ec.message() + "; the previous file is unchanged");
  }
}

}  // namespace finestra
