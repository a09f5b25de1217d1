// Saving a file (core/io/text_file.h): permissions kept, symbolic links followed, non-regular
// targets refused, the real reason reported, temporary files cleaned, changes on disk detected.
#include <gtest/gtest.h>
#include <sys/stat.h>
#include <unistd.h>

#include <filesystem>
#include <fstream>
#include <sstream>
#include <string>

#include "core/common/errors.h"
#include "core/io/text_file.h"

namespace fs = std::filesystem;
using namespace finestra;

namespace {

struct Folder {
  fs::path path = fs::temp_directory_path() / ("finestra_save_" + std::to_string(::getpid()));
  Folder() {
    fs::remove_all(path);
    fs::create_directories(path);
  }
  ~Folder() { fs::remove_all(path); }
};

std::string contentOf(const fs::path& p) {
  std::ifstream in(p, std::ios::binary);
  std::ostringstream s;
  s << in.rdbuf();
  return s.str();
}

std::string errorOf(const std::string& path, const std::string& text) {
  try {
    writeFileAtomically(path, text);
  } catch (const InputError& e) {
    return e.what();
  }
  return "";
}

}  // namespace

TEST(FileSaving, ReplacingAPrivateFileKeepsItsPermissions) {
  Folder f;
  const fs::path file = f.path / "p.json";
  std::ofstream(file) << "old";
  fs::permissions(file, fs::perms::owner_read | fs::perms::owner_write);
  writeFileAtomically(file.string(), "new");
  EXPECT_EQ(contentOf(file), "new");
  EXPECT_EQ(fs::status(file).permissions() & fs::perms::all, fs::perms::owner_read | fs::perms::owner_write);
}

TEST(FileSaving, SavingThroughASymbolicLinkReplacesItsTargetAndKeepsTheLink) {
  Folder f;
  const fs::path real = f.path / "real.json", link = f.path / "link.json";
  std::ofstream(real) << "old";
  fs::create_symlink(real, link);
  writeFileAtomically(link.string(), "new");
  EXPECT_TRUE(fs::is_symlink(fs::symlink_status(link)));
  EXPECT_EQ(contentOf(real), "new");
}

TEST(FileSaving, ADeviceOrFolderIsRefusedWithAMessage) {
  const std::string device = errorOf("/dev/null", "x");
  EXPECT_NE(device.find("/dev/null"), std::string::npos);
  EXPECT_NE(device.find("not a regular file"), std::string::npos) << device;
  Folder f;
  EXPECT_NE(errorOf(f.path.string(), "x").find("is a folder"), std::string::npos);
}

TEST(FileSaving, AFailedSaveReportsTheSystemReasonNotSuccess) {
  Folder f;
  const std::string missing = (f.path / "no" / "folder" / "p.json").string();
  const std::string m = errorOf(missing, "x");
  EXPECT_NE(m.find("No such file or directory"), std::string::npos) << m;
  EXPECT_EQ(m.find("Success"), std::string::npos) << m;
}

TEST(FileSaving, StrayTemporaryFilesOfEndedWritersAreRemovedAndNoneIsLeft) {
  Folder f;
  const fs::path file = f.path / "p.json";
  // pid 999999999 exceeds any pid_max: a writer that no longer runs.
  const fs::path stray = f.path / ".~p.json.999999999.finestra-tmp";
  std::ofstream(stray) << "half a save";
  const fs::path unrelated = f.path / ".~other.json.999999999.finestra-tmp";
  std::ofstream(unrelated) << "another file's";
  writeFileAtomically(file.string(), "new");
  EXPECT_FALSE(fs::exists(stray));
  EXPECT_TRUE(fs::exists(unrelated));
  int entries = 0;
  for ([[maybe_unused]] const auto& e : fs::directory_iterator(f.path)) ++entries;
  EXPECT_EQ(entries, 2);  // p.json and the unrelated file
}

TEST(FileSaving, AChangeOnDiskSinceOpeningIsDetected) {
  Folder f;
  const fs::path file = f.path / "p.json";
  std::ofstream(file) << "version one";
  const FileStamp stamp = takeFileStamp(file.string());
  EXPECT_TRUE(stamp.exists);
  EXPECT_FALSE(fileChangedSince(file.string(), stamp));
  std::ofstream(file) << "version two";  // same size: the content hash tells
  EXPECT_TRUE(fileChangedSince(file.string(), stamp));
}
