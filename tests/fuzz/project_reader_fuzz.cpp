// libFuzzer target: the project reader. Any input must either parse or throw InputError; a parsed
// project must survive a write/read round trip and model building must also only throw InputError.
#include <cstddef>
#include <cstdint>
#include <cstdlib>
#include <string>

#include "core/common/errors.h"
#include "core/io/project_file.h"
#include "core/project/model_setup.h"
#include "core/model/centre_model.h"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string text(reinterpret_cast<const char*>(data), size);
  finestra::Project project;
  try {
    project = finestra::parseProject(text, "fuzz.json");
  } catch (const finestra::InputError&) {
    return 0;
  }
  // The writer's output must be readable again (a saved project can always be reopened).
  const std::string saved = finestra::projectToJson(project);
  const finestra::Project again = finestra::parseProject(saved, "fuzz-roundtrip.json");
  if (finestra::projectToJson(again) != saved) std::abort();
  try {
    const finestra::CentreModel model(finestra::makeModelSetup(project));
    (void)model.levels(finestra::Manifold::Ground, project.classes.front(),
                       project.field.crystalVector(model.setup().lab));
  } catch (const finestra::InputError&) {
  }
  return 0;
}
