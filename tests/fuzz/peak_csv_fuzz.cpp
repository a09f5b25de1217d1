// libFuzzer target: the measured-peak CSV reader. Any input must parse or throw InputError.
#include <cstddef>
#include <cstdint>
#include <string>

#include "core/common/errors.h"
#include "core/io/peak_csv.h"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  try {
    (void)finestra::parsePeakCsv(std::string(reinterpret_cast<const char*>(data), size), "fuzz.csv");
  } catch (const finestra::InputError&) {
  }
  return 0;
}
