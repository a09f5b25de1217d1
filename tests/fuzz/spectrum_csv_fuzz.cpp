// libFuzzer target: the measured-spectrum CSV reader, with and without a unit chosen on import.
#include <cstddef>
#include <cstdint>
#include <string>

#include "core/common/errors.h"
#include "core/io/spectrum_csv.h"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string text(reinterpret_cast<const char*>(data), size);
  try {
    (void)finestra::parseSpectrumCsv(text, "fuzz.csv");
  } catch (const finestra::InputError&) {
  }
  try {
    (void)finestra::parseSpectrumCsv(text, "fuzz.csv", finestra::SpectralUnit::NmAir);
  } catch (const finestra::InputError&) {
  }
  return 0;
}
