// finestra-cli on the bad-input catalogue (tests/data/bad/catalogue.json): for every entry the CLI
// must exit with a non-zero code (never by a signal), print the catalogued message on stderr, and
// name the file at fault.
#include <gtest/gtest.h>
#include <sys/wait.h>
#include <unistd.h>

#include <fcntl.h>

#include <filesystem>
#include <fstream>
#include <nlohmann/json.hpp>
#include <sstream>
#include <string>
#include <vector>

namespace fs = std::filesystem;

namespace {

const fs::path kDataDir = FINESTRA_TEST_DATA_DIR;
const fs::path kExample = fs::path(FINESTRA_SOURCE_DIR) / "examples" / "membrane-vector-magnet.json";

struct RunResult {
  bool exited = false;  ///< false: killed by a signal (a crash)
  int exitCode = -1;
  int signal = 0;
  std::string out, err;
};

std::string slurp(const fs::path& path) {
  std::ifstream in(path, std::ios::binary);
  std::ostringstream ss;
  ss << in.rdbuf();
  return ss.str();
}

/// Runs finestra-cli with `args` directly (no shell), capturing stdout and stderr.
RunResult runCli(const std::vector<std::string>& args) {
  const fs::path dir = fs::temp_directory_path() / ("finestra_cli_bad_" + std::to_string(::getpid()));
  fs::create_directories(dir);
  const fs::path outPath = dir / "out.txt", errPath = dir / "err.txt";
  const pid_t pid = ::fork();
  if (pid == 0) {
    const int out = ::open(outPath.c_str(), O_WRONLY | O_CREAT | O_TRUNC, 0644);
    const int err = ::open(errPath.c_str(), O_WRONLY | O_CREAT | O_TRUNC, 0644);
    ::dup2(out, 1);
    ::dup2(err, 2);
    std::vector<std::string> argvStore{FINESTRA_CLI_PATH};
    argvStore.insert(argvStore.end(), args.begin(), args.end());
    std::vector<char*> argv;
    for (auto& a : argvStore) argv.push_back(a.data());
    argv.push_back(nullptr);
    ::execv(FINESTRA_CLI_PATH, argv.data());
    ::_exit(127);
  }
  int status = 0;
  ::waitpid(pid, &status, 0);
  RunResult r;
  r.exited = WIFEXITED(status);
  r.exitCode = r.exited ? WEXITSTATUS(status) : -1;
  r.signal = WIFSIGNALED(status) ? WTERMSIG(status) : 0;
  r.out = slurp(outPath);
  r.err = slurp(errPath);
  fs::remove_all(dir);
  return r;
}

std::string substitute(std::string arg, const fs::path& file) {
  auto replace = [&](const std::string& token, const std::string& value) {
    for (auto at = arg.find(token); at != std::string::npos; at = arg.find(token)) arg.replace(at, token.size(), value);
  };
  replace("{file}", file.string());
  replace("{example}", kExample.string());
  replace("{data}", kDataDir.string());
  return arg;
}

}  // namespace

TEST(BadInputCli, EveryCatalogueEntryFailsCleanlyWithItsMessage) {
  std::ifstream in(kDataDir / "bad" / "catalogue.json");
  const nlohmann::json catalogue = nlohmann::json::parse(in);
  int checked = 0;
  for (const auto& entry : catalogue.at("entries")) {
    const std::string file = entry.value("file", "");
    const fs::path path = kDataDir / "bad" / file;
    std::vector<std::string> args{"levels", "{file}"};
    if (entry.contains("args")) args = entry.at("args").get<std::vector<std::string>>();
    for (auto& a : args) a = substitute(a, path);
    SCOPED_TRACE(entry.at("what").get<std::string>() + " — finestra-cli " + args.front() + " " + (args.size() > 1 ? args[1] : ""));
    const RunResult r = runCli(args);
    ASSERT_TRUE(r.exited) << "killed by signal " << r.signal << "\nstderr: " << r.err;
    EXPECT_NE(r.exitCode, 0) << r.out;
    EXPECT_NE(r.exitCode, 3) << "an internal (non-input) error escaped: " << r.err;
    for (const auto& part : entry.at("expect"))
      EXPECT_NE(r.err.find(part.get<std::string>()), std::string::npos) << "missing '" << part << "' on stderr: " << r.err;
    if (!file.empty()) {
      EXPECT_NE(r.err.find(file), std::string::npos) << "stderr must name the file: " << r.err;
    }
    ++checked;
  }
  EXPECT_GE(checked, 30);
}

TEST(BadInputCli, EveryOutputFormatOfAGoodProjectIsFinite) {
  // The other half of the contract: good input never prints nan or inf in any format.
  for (const char* command : {"levels", "lines", "spectrum", "sweep"})
    for (const char* format : {"table", "json", "csv"}) {
      SCOPED_TRACE(std::string(command) + " --format " + format);
      const RunResult r = runCli({command, kExample.string(), "--format", format});
      ASSERT_TRUE(r.exited && r.exitCode == 0) << r.err;
      std::string lower = r.out;
      for (auto& c : lower) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
      EXPECT_EQ(lower.find("nan"), std::string::npos);
      EXPECT_EQ(lower.find("inf"), std::string::npos);
      if (std::string(format) == "json") {
        EXPECT_EQ(r.out.find("null"), std::string::npos) << "a NaN is printed as null";
      }
    }
}

// ---- Second hardening pass: undefined figures and echoed control characters ------------------

TEST(BadInputCli, PlannerProfileThroughZeroFieldReportsUndefinedFiguresWithAReason) {
  // The profile starts at 0 T, where no field direction exists and the spin levels are degenerate.
  for (const char* format : {"json", "table", "csv"}) {
    SCOPED_TRACE(format);
    const RunResult r = runCli({"plan", kExample.string(), "--what", "profile", "--points", "3", "--format", format});
    ASSERT_TRUE(r.exited && r.exitCode == 0) << r.err;
    std::string lower = r.out;
    for (auto& c : lower) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
    EXPECT_EQ(lower.find("nan"), std::string::npos) << r.out;
    if (std::string(format) == "json") {
      EXPECT_NE(r.out.find("\"undefined_reason\""), std::string::npos) << r.out;
    }
  }
}

TEST(BadInputCli, ControlCharactersFromTheInputNeverReachTheTerminal) {
  const RunResult r = runCli({"levels", (kDataDir / "bad" / "escape_character_in_key.json").string()});
  ASSERT_TRUE(r.exited);
  EXPECT_EQ(r.exitCode, 2);
  EXPECT_EQ(r.err.find('\x1b'), std::string::npos) << "raw ESC on stderr";
  EXPECT_NE(r.err.find("descr\\e[31miption"), std::string::npos) << r.err;
}
