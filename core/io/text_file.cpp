#include "core/io/text_file.h"

#include <fcntl.h>
#include <signal.h>
#include <sys/stat.h>
#include <unistd.h>

#include <cerrno>
#include <cstring>
#include <filesystem>
#include <fstream>

#include "core/common/errors.h"
#include "core/common/limits.h"

namespace finestra {
namespace fs = std::filesystem;
namespace {

// Our temporary files: ".~<name>.<pid>.finestra-tmp" beside the target, one per writing process.
const std::string kTempSuffix = ".finestra-tmp";

std::string tempPrefix(const fs::path& target) { return ".~" + target.filename().string() + "."; }

fs::path tempPathFor(const fs::path& target) {
  return target.parent_path() / (tempPrefix(target) + std::to_string(::getpid()) + kTempSuffix);
}

// Removes temporary files of `target` left by writers that no longer run (a crash mid-save).
void removeStrayTemporaryFiles(const fs::path& target) {
  std::error_code ec;
  const fs::path folder = target.parent_path().empty() ? fs::path(".") : target.parent_path();
  const std::string prefix = tempPrefix(target);
  for (fs::directory_iterator it(folder, ec), end; !ec && it != end; it.increment(ec)) {
    const std::string name = it->path().filename().string();
    if (name.size() <= prefix.size() + kTempSuffix.size() || name.rfind(prefix, 0) != 0 || !name.ends_with(kTempSuffix))
      continue;
    const std::string pidText = name.substr(prefix.size(), name.size() - prefix.size() - kTempSuffix.size());
    if (pidText.empty() || pidText.find_first_not_of("0123456789") != std::string::npos || pidText.size() > 9) continue;
    const pid_t pid = static_cast<pid_t>(std::stol(pidText));
    if (pid == ::getpid() || (::kill(pid, 0) != 0 && errno == ESRCH)) {
      std::error_code removeError;
      fs::remove(it->path(), removeError);
    }
  }
}

// The file a save really replaces: a symbolic link is followed to its target, so that the link
// stays a link. Refuses anything that is not a regular file (device, folder, socket, pipe).
fs::path realTarget(const std::string& path) {
  std::error_code ec;
  fs::path target(path);
  if (fs::is_symlink(fs::symlink_status(target, ec))) {
    const fs::path resolved = fs::weakly_canonical(target, ec);
    if (ec) throw InputError(path, "cannot follow the symbolic link: " + ec.message());
    target = resolved;
  }
  const fs::file_status status = fs::status(target, ec);
  if (fs::exists(status) && !fs::is_regular_file(status))
    throw InputError(path, fs::is_directory(status) ? "is a folder, not a file"
                                                     : "is not a regular file (a device, pipe or socket); choose a file name");
  return target;
}

std::string errnoText(int code) { return std::strerror(code); }

}  // namespace

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
  const fs::path target = realTarget(path);
  removeStrayTemporaryFiles(target);
  const fs::path temp = tempPathFor(target);
  // Keep the permissions of the file being replaced (a private 600 file stays private).
  struct stat existing {};
  const bool replacing = ::stat(target.c_str(), &existing) == 0;
  const mode_t mode = replacing ? (existing.st_mode & 07777) : 0666;
  const int fd = ::open(temp.c_str(), O_WRONLY | O_CREAT | O_TRUNC | O_CLOEXEC, mode);
  if (fd < 0) {
    const int code = errno;
    throw InputError(path, "cannot write here (folder missing or not writable): " + errnoText(code));
  }
  if (replacing) (void)::fchmod(fd, mode);  // the umask must not narrow or widen the old mode
  std::size_t written = 0;
  int failure = 0;
  while (written < text.size()) {
    const ssize_t n = ::write(fd, text.data() + written, text.size() - written);
    if (n < 0 && errno == EINTR) continue;
    if (n <= 0) {
      failure = n < 0 ? errno : EIO;
      break;
    }
    written += static_cast<std::size_t>(n);
  }
  if (!failure && ::fsync(fd) != 0) failure = errno;  // on disk before the rename
  if (::close(fd) != 0 && !failure) failure = errno;
  if (failure) {
    std::error_code ec;  // clean up only after the error code is captured
    fs::remove(temp, ec);
    throw InputError(path, "write failed: " + errnoText(failure) + "; the previous file is unchanged");
  }
  if (::rename(temp.c_str(), target.c_str()) != 0) {
    const int code = errno;
    std::error_code ec;
    fs::remove(temp, ec);
    throw InputError(path, "cannot replace the file: " + errnoText(code) + "; the previous file is unchanged");
  }
}

FileStamp takeFileStamp(const std::string& path) {
  FileStamp stamp;
  struct stat info {};
  if (::stat(path.c_str(), &info) != 0) return stamp;
  stamp.exists = true;
  stamp.size = static_cast<std::uint64_t>(info.st_size);
  stamp.modifiedNs = static_cast<std::int64_t>(info.st_mtim.tv_sec) * 1000000000LL + info.st_mtim.tv_nsec;
  // FNV-1a of the content: catches a rewrite within the same clock tick and of the same size.
  std::ifstream in(path, std::ios::binary);
  std::uint64_t hash = 1469598103934665603ULL;
  char block[65536];
  while (in.read(block, sizeof block) || in.gcount() > 0)
    for (std::streamsize k = 0; k < in.gcount(); ++k) {
      hash ^= static_cast<unsigned char>(block[k]);
      hash *= 1099511628211ULL;
    }
  stamp.contentHash = hash;
  return stamp;
}

bool fileChangedSince(const std::string& path, const FileStamp& stamp) { return !(takeFileStamp(path) == stamp); }

}  // namespace finestra
