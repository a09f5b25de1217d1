// Data safety of the project file: saves are atomic (a writer killed at any moment leaves either
// the old or the new complete file), a failed save leaves the previous file intact and says why,
// nothing non-finite is written, and a file from a newer version explains itself.
// Tests run as root, so "read-only" is made with a parent that is a regular file, a missing folder,
// an immutable flag (chattr, when the file system supports it) or a file-size limit.
#include <gtest/gtest.h>
#include <signal.h>
#include <sys/resource.h>
#include <sys/wait.h>
#include <unistd.h>

#include <chrono>
#include <cmath>
#include <cstdlib>
#include <filesystem>
#include <functional>
#include <optional>
#include <fstream>
#include <random>
#include <string>
#include <thread>

#include "core/common/errors.h"
#include "core/io/project_file.h"

using namespace finestra;
namespace fs = std::filesystem;

namespace {

class DataSafety : public ::testing::Test {
protected:
  void SetUp() override {
    dir_ = fs::temp_directory_path() / ("finestra_data_safety_" + std::to_string(::getpid()) + "_" +
                                         ::testing::UnitTest::GetInstance()->current_test_info()->name());
    fs::remove_all(dir_);
    fs::create_directories(dir_);
  }
  void TearDown() override {
    if (immutable_) setImmutable(*immutable_, false);
    fs::remove_all(dir_);
  }
  static bool setImmutable(const fs::path& path, bool on) {
    const std::string cmd = std::string("chattr ") + (on ? "+i" : "-i") + " '" + path.string() + "' 2>/dev/null";
    return std::system(cmd.c_str()) == 0;
  }
  fs::path dir_;
  std::optional<fs::path> immutable_;
};

Project projectWithDescription(const std::string& text) {
  Project p;
  p.centre.preset = "SiV-";
  p.description = text;
  p.field = FieldSetting::fromAngles(0.25, 90, 0);
  return p;
}

std::string slurp(const fs::path& path) {
  std::ifstream in(path, std::ios::binary);
  return std::string(std::istreambuf_iterator<char>(in), {});
}

std::string messageOf(const std::function<void()>& call) {
  try {
    call();
  } catch (const InputError& e) {
    return e.what();
  }
  return "";
}

}  // namespace

TEST_F(DataSafety, SavedProjectReadsBackIdentically) {
  Project p = projectWithDescription("round trip");
  p.centre.overrides["lambda_g_GHz"] = 47.123456789012345;
  p.strain.crystal = strainFromComponents(1e-6, -2e-6, 3e-7, 0, 1.5e-6, -1e-7);
  const fs::path target = dir_ / "p.json";
  writeProjectFile(p, target.string());
  const Project back = readProjectFile(target.string());
  EXPECT_EQ(projectToJson(back), projectToJson(p));
  EXPECT_EQ(back.centre.overrides.at("lambda_g_GHz"), 47.123456789012345);
}

TEST_F(DataSafety, WriterKilledAtRandomMomentsNeverLeavesAHalfWrittenProject) {
  // Two versions of a ~2 MB project alternate; a child process saves them in a loop and is killed
  // with SIGKILL after a random delay. After every kill the file must be one of the two versions,
  // complete. A plain truncate-and-write would leave a torn file in most rounds.
  const fs::path target = dir_ / "big.json";
  const std::string a(2'000'000, 'a'), b(2'000'000, 'b');
  writeProjectFile(projectWithDescription(a), target.string());
  std::mt19937 rng(12345);
  std::uniform_int_distribution<int> delayUs(200, 30000);
  for (int round = 0; round < 25; ++round) {
    const pid_t pid = ::fork();
    ASSERT_GE(pid, 0);
    if (pid == 0) {
      const Project pa = projectWithDescription(a), pb = projectWithDescription(b);
      for (int k = 0;; ++k) writeProjectFile(k % 2 ? pa : pb, target.string());
    }
    std::this_thread::sleep_for(std::chrono::microseconds(delayUs(rng)));
    ::kill(pid, SIGKILL);
    int status = 0;
    ::waitpid(pid, &status, 0);
    ASSERT_TRUE(WIFSIGNALED(status));
    Project read;
    ASSERT_NO_THROW(read = readProjectFile(target.string())) << "round " << round;
    EXPECT_TRUE(read.description == a || read.description == b) << "round " << round;
  }
  // A temporary file left by a killed writer does not block the next save.
  writeProjectFile(projectWithDescription("after the kills"), target.string());
  EXPECT_EQ(readProjectFile(target.string()).description, "after the kills");
}

TEST_F(DataSafety, SaveIntoAFolderThatCannotExistFailsAndNamesThePath) {
  const fs::path regular = dir_ / "notes.txt";
  std::ofstream(regular) << "a regular file";
  const std::string underFile = (regular / "p.json").string();
  EXPECT_NE(messageOf([&] { writeProjectFile(projectWithDescription("x"), underFile); }).find(underFile), std::string::npos);
  const std::string missing = (dir_ / "missing" / "p.json").string();
  const std::string msg = messageOf([&] { writeProjectFile(projectWithDescription("x"), missing); });
  EXPECT_NE(msg.find(missing), std::string::npos) << msg;
  EXPECT_NE(msg.find("cannot write"), std::string::npos) << msg;
  EXPECT_FALSE(fs::exists(dir_ / "missing"));
  EXPECT_EQ(slurp(regular), "a regular file");
}

TEST_F(DataSafety, FailedWriteOnAFullDiskLeavesThePreviousFileIntact) {
  // A file-size limit (RLIMIT_FSIZE) in a child process makes the write fail part-way, like a full
  // disk. The previous project must be untouched and no temporary file left behind.
  const fs::path target = dir_ / "p.json";
  writeProjectFile(projectWithDescription("previous version"), target.string());
  const std::string before = slurp(target);
  const pid_t pid = ::fork();
  ASSERT_GE(pid, 0);
  if (pid == 0) {
    ::signal(SIGXFSZ, SIG_IGN);
    const rlimit limit{64 * 1024, 64 * 1024};
    ::setrlimit(RLIMIT_FSIZE, &limit);
    const std::string msg =
        messageOf([&] { writeProjectFile(projectWithDescription(std::string(1'000'000, 'z')), target.string()); });
    const bool good = msg.find(target.string()) != std::string::npos && msg.find("previous file is unchanged") != std::string::npos;
    ::_exit(good ? 0 : 1);
  }
  int status = 0;
  ::waitpid(pid, &status, 0);
  ASSERT_TRUE(WIFEXITED(status)) << "the writer crashed (signal " << WTERMSIG(status) << ")";
  EXPECT_EQ(WEXITSTATUS(status), 0) << "the failed save did not report a clear error naming the file";
  EXPECT_EQ(slurp(target), before);
  for (const auto& item : fs::directory_iterator(dir_))
    EXPECT_EQ(item.path().filename(), "p.json") << "left behind: " << item.path();
}

TEST_F(DataSafety, ImmutableTargetIsNotReplacedAndTheSaveSaysWhy) {
  const fs::path target = dir_ / "p.json";
  writeProjectFile(projectWithDescription("previous version"), target.string());
  const std::string before = slurp(target);
  if (!setImmutable(target, true)) GTEST_SKIP() << "chattr +i not supported here";
  immutable_ = target;
  const std::string msg = messageOf([&] { writeProjectFile(projectWithDescription("new"), target.string()); });
  EXPECT_NE(msg.find(target.string()), std::string::npos) << msg;
  EXPECT_NE(msg.find("previous file is unchanged"), std::string::npos) << msg;
  setImmutable(target, false);
  immutable_.reset();
  EXPECT_EQ(slurp(target), before);
  for (const auto& item : fs::directory_iterator(dir_)) EXPECT_EQ(item.path().filename(), "p.json");
}

TEST_F(DataSafety, ReadOnlyFolderRefusesTheSaveAndKeepsThePreviousFile) {
  const fs::path folder = dir_ / "locked";
  fs::create_directories(folder);
  const fs::path target = folder / "p.json";
  writeProjectFile(projectWithDescription("previous version"), target.string());
  const std::string before = slurp(target);
  if (!setImmutable(folder, true)) GTEST_SKIP() << "chattr +i not supported here";
  immutable_ = folder;
  const std::string msg = messageOf([&] { writeProjectFile(projectWithDescription("new"), target.string()); });
  EXPECT_NE(msg.find(target.string()), std::string::npos) << msg;
  EXPECT_NE(msg.find("cannot write"), std::string::npos) << msg;
  EXPECT_EQ(slurp(target), before);
}

TEST_F(DataSafety, NonFiniteValuesAreNeverWrittenToAProjectFile) {
  // JSON has no NaN: a writer would print null and the file could not be read back. The save must
  // refuse, name the key, and leave the previous file alone.
  const fs::path target = dir_ / "p.json";
  writeProjectFile(projectWithDescription("previous version"), target.string());
  const std::string before = slurp(target);
  Project bad = projectWithDescription("bad");
  bad.centre.overrides["lambda_u_GHz"] = std::nan("");
  std::string msg = messageOf([&] { writeProjectFile(bad, target.string()); });
  EXPECT_NE(msg.find("centre.parameters.lambda_u_GHz"), std::string::npos) << msg;
  EXPECT_NE(msg.find("not a finite number"), std::string::npos) << msg;
  bad = projectWithDescription("bad");
  bad.conditions.temperatureK = INFINITY;
  msg = messageOf([&] { writeProjectFile(bad, target.string()); });
  EXPECT_NE(msg.find("conditions.temperature_K"), std::string::npos) << msg;
  EXPECT_EQ(slurp(target), before);
}

TEST_F(DataSafety, NewerVersionFileExplainsItselfAndIsLeftAlone) {
  const fs::path target = dir_ / "from_the_future.json";
  const std::string text = "{\n  \"format\": \"finestra-project\",\n  \"version\": 7,\n  \"centre\": {\"preset\": \"SiV-\"},\n"
                           "  \"hologram\": {\"enabled\": true}\n}\n";
  std::ofstream(target) << text;
  const std::string msg = messageOf([&] { readProjectFile(target.string()); });
  EXPECT_NE(msg.find(target.string()), std::string::npos) << msg;
  EXPECT_NE(msg.find("version 7"), std::string::npos) << msg;
  EXPECT_NE(msg.find("newer"), std::string::npos) << msg;
  EXPECT_EQ(msg.find("hologram"), std::string::npos) << "the version must be reported before any unknown key: " << msg;
  EXPECT_EQ(slurp(target), text);
}
