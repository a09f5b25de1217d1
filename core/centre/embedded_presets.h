#pragma once
// Preset JSON texts compiled into core from resources/presets (generated at build time).
#include <string_view>
#include <vector>

namespace finestra {

struct EmbeddedPreset {
  std::string_view file;
  std::string_view json;
};

const std::vector<EmbeddedPreset>& embeddedPresets();

}  // namespace finestra
