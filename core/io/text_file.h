#pragma once
// Whole-file text reading and atomic writing, with errors that name the path.
#include <cstdint>
#include <string>

namespace finestra {

/// Reads a whole file of at most limits::kMaxInputFileBytes; InputError naming the path if it
/// cannot be read or is larger.
std::string readTextFile(const std::string& path);
/// Writes text atomically: a temporary file in the same folder (".~<name>.<pid>.finestra-tmp"),
/// flushed, then renamed over `path`. A symbolic link is followed (the link stays, its target is
/// replaced), the permissions of the replaced file are kept, and a target that is not a regular file
/// is refused. Temporary files of earlier writers that no longer run are removed. On failure the
/// previous file is untouched and InputError names the path and the system's reason.
void writeFileAtomically(const std::string& path, const std::string& text);

/// What a file was when it was opened: a later save can tell whether someone else changed it.
struct FileStamp {
  bool exists = false;
  std::uint64_t size = 0;
  std::int64_t modifiedNs = 0;  ///< modification time, ns since the epoch
  std::uint64_t contentHash = 0;
  bool operator==(const FileStamp&) const = default;
};
FileStamp takeFileStamp(const std::string& path);
/// True when the file at `path` differs from `stamp` (size, modification time or content).
bool fileChangedSince(const std::string& path, const FileStamp& stamp);

}  // namespace finestra
