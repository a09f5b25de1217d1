#pragma once
// Runs the real finestra-cli binary and captures exit code, stdout and stderr.
#include <array>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <string>
#include <sys/wait.h>

namespace finestra::testing {

struct CliRun {
  int exitCode = -1;
  std::string out, err;
};

inline std::string slurp(const std::filesystem::path& p) {
  std::ifstream in(p);
  return {std::istreambuf_iterator<char>(in), std::istreambuf_iterator<char>()};
}

/// Runs `finestra-cli ARGS` (ARGS is passed to the shell as written).
inline CliRun runCli(const std::string& args) {
  static int counter = 0;
  const auto dir = std::filesystem::temp_directory_path();
  const auto out = dir / ("finestra_cli_out_" + std::to_string(::getpid()) + "_" + std::to_string(counter));
  const auto err = dir / ("finestra_cli_err_" + std::to_string(::getpid()) + "_" + std::to_string(counter++));
  const std::string cmd = std::string(FINESTRA_CLI_PATH) + " " + args + " >" + out.string() + " 2>" + err.string();
  const int status = std::system(cmd.c_str());
  CliRun r;
  r.exitCode = WIFEXITED(status) ? WEXITSTATUS(status) : 128 + WTERMSIG(status);
  r.out = slurp(out);
  r.err = slurp(err);
  std::filesystem::remove(out);
  std::filesystem::remove(err);
  return r;
}

/// Writes `text` to a fresh temporary file and returns its path.
inline std::string writeTemp(const std::string& name, const std::string& text) {
  const auto path = std::filesystem::temp_directory_path() / ("finestra_test_" + std::to_string(::getpid()) + "_" + name);
  std::ofstream(path) << text;
  return path.string();
}

}  // namespace finestra::testing
