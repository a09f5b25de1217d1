// libFuzzer target: the measurements and fit sections of a project. The input becomes the value of
// "measurements" (first half) and "fit" (second half) of an otherwise valid project, so the fuzzer
// spends its time inside those sections instead of on the surrounding syntax. Any input must
// either parse or throw InputError, and a parsed project must survive a write/read round trip.
#include <cstddef>
#include <cstdint>
#include <cstdlib>
#include <string>

#include "core/common/errors.h"
#include "core/io/project_file.h"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string bytes(reinterpret_cast<const char*>(data), size);
  const std::string measurements = bytes.substr(0, size / 2), fit = bytes.substr(size / 2);
  const std::string text = R"({"format": "finestra-project", "version": 1, "centre": {"preset": "SiV-"},
    "sample": {"normal": [0, 0, 1], "in_plane_x": [1, 0, 0]}, "field": {"magnitude_T": 0.5},
    "measurements": )" + measurements + R"(, "fit": )" + fit + "}";
  finestra::Project project;
  try {
    project = finestra::parseProject(text, "fuzz-sections.json");
  } catch (const finestra::InputError&) {
    return 0;
  }
  const std::string saved = finestra::projectToJson(project);
  const finestra::Project again = finestra::parseProject(saved, "fuzz-sections-roundtrip.json");
  if (finestra::projectToJson(again) != saved) std::abort();
  return 0;
}
