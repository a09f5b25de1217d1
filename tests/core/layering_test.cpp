// The module structure of core/: every module includes only modules below it in one layer order
// (the same order is written in DEVELOPERS.md, "Layer order"), no core file includes Qt, and the
// magnet calibration is applied only by core/project/field_semantics.cpp.
#include <gtest/gtest.h>

#include <algorithm>
#include <array>
#include <filesystem>
#include <fstream>
#include <regex>
#include <string>
#include <string_view>
#include <vector>

namespace {

namespace fs = std::filesystem;

// Bottom first. A module may include only modules listed before it.
constexpr std::array<std::string_view, 17> kLayerOrder{
    "common", "units",  "crystal", "centre",    "hamiltonian", "model", "project", "thermal", "io",
    "optics", "sweep",  "strain",  "resonance", "report",      "fit",   "peaks",   "planner"};

const fs::path kSourceDir{FINESTRA_SOURCE_DIR};

struct SourceLine {
  std::string file;  ///< relative to the source folder
  int number = 0;
  std::string text;
};

std::vector<SourceLine> linesOfSources(const std::vector<std::string>& folders) {
  std::vector<SourceLine> out;
  for (const std::string& folder : folders) {
    for (const auto& entry : fs::recursive_directory_iterator(kSourceDir / folder)) {
      const std::string ext = entry.path().extension().string();
      if (!entry.is_regular_file() || (ext != ".h" && ext != ".cpp")) continue;
      std::ifstream in(entry.path());
      std::string text;
      int number = 0;
      while (std::getline(in, text)) out.push_back({fs::relative(entry.path(), kSourceDir).generic_string(), ++number, text});
    }
  }
  return out;
}

// Index of a module in the layer order, or -1 when it is not listed.
int layerOf(std::string_view module) {
  const auto it = std::find(kLayerOrder.begin(), kLayerOrder.end(), module);
  return it == kLayerOrder.end() ? -1 : static_cast<int>(it - kLayerOrder.begin());
}

// The module of a path "core/<module>/...".
std::string moduleOf(const std::string& path) {
  const auto first = path.find('/');
  const auto second = path.find('/', first + 1);
  return second == std::string::npos ? std::string() : path.substr(first + 1, second - first - 1);
}

// One message per include line of `line` that points to a module not below the file's own module.
std::vector<std::string> layerViolations(const SourceLine& line) {
  static const std::regex include(R"(^\s*#\s*include\s*"(core/[^"]+)\")");
  std::smatch m;
  if (!std::regex_search(line.text, m, include)) return {};
  const std::string from = moduleOf(line.file), to = moduleOf(m[1].str());
  if (from == to) return {};
  const std::string where = line.file + ":" + std::to_string(line.number) + " includes " + m[1].str();
  if (layerOf(to) < 0) return {where + ": module '" + to + "' is not in the layer order"};
  if (layerOf(to) > layerOf(from))
    return {where + ": module '" + to + "' is above '" + from + "' in the layer order"};
  return {};
}

TEST(Layering, EveryCoreModuleIsListedInTheLayerOrder) {
  for (const auto& entry : fs::directory_iterator(kSourceDir / "core")) {
    if (!entry.is_directory()) continue;
    EXPECT_GE(layerOf(entry.path().filename().string()), 0)
        << "core/" << entry.path().filename().string() << " is not in the layer order";
  }
}

TEST(Layering, CoreModulesIncludeOnlyModulesBelowThem) {
  std::vector<std::string> violations;
  for (const SourceLine& line : linesOfSources({"core"}))
    for (std::string& v : layerViolations(line)) violations.push_back(std::move(v));
  for (const std::string& v : violations) ADD_FAILURE() << v;
}

TEST(Layering, TheCheckNamesAnUpwardInclude) {
  // The checker itself: an include from model up to project is reported with file and line.
  const auto up = layerViolations({"core/model/centre_model.h", 7, R"(#include "core/project/project.h")"});
  ASSERT_EQ(up.size(), 1u);
  EXPECT_NE(up[0].find("core/model/centre_model.h:7 includes core/project/project.h"), std::string::npos) << up[0];
  EXPECT_TRUE(layerViolations({"core/project/project.h", 3, R"(#include "core/model/centre_model.h")"}).empty());
  EXPECT_EQ(layerViolations({"core/io/x.h", 1, R"(#include "core/nowhere/y.h")"}).size(), 1u);
}

TEST(Layering, NoCoreFileIncludesQt) {
  static const std::regex qtInclude(R"(^\s*#\s*include\s*[<"](Qt[A-Za-z]*/|Q[A-Z][A-Za-z]*[>"]|qglobal))");
  for (const SourceLine& line : linesOfSources({"core"}))
    if (std::regex_search(line.text, qtInclude))
      ADD_FAILURE() << line.file << ":" << line.number << " includes Qt: " << line.text;
}

TEST(Layering, OnlyTheFieldSemanticsApplyTheMagnetCalibration) {
  // Calls of MagnetCalibration::trueFieldLab / nominalFieldLab outside the one place that gives a
  // magnet setting its meaning (docs/architecture.md, Magnet tilt).
  static const std::regex call(R"(\.\s*(trueFieldLab|nominalFieldLab)\s*\()");
  const std::array<std::string_view, 2> allowed{"core/project/field_semantics.cpp", "core/crystal/magnet_calibration.cpp"};
  for (const SourceLine& line : linesOfSources({"core", "ui", "app"}))
    if (std::regex_search(line.text, call) && std::find(allowed.begin(), allowed.end(), line.file) == allowed.end())
      ADD_FAILURE() << line.file << ":" << line.number << " applies the magnet calibration directly: " << line.text;
}

}  // namespace
