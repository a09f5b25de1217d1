#pragma once
// Zero-field lines of many emitters from a CSV file (our layout), one row per emitter:
//   emitter, unit, A, A_sigma, B, B_sigma, C, C_sigma, D, D_sigma   (required, any order)
//   x_um, y_um                                                      (optional: place on the sample)
// A–D are the four zero-field lines in our lettering (A highest frequency, D lowest), positions
// and sigmas in `unit` (GHz, GHz_detuning, THz, nm_vac, nm_air, meV, cm-1). Lines starting with
// '#' are comments.
#include <optional>
#include <string>
#include <vector>

#include "core/strain/zero_field_strain.h"
#include "core/units/spectral_units.h"

namespace finestra {

struct EmitterLines {
  std::string name;
  std::optional<double> xUm, yUm;
  ZeroFieldLines lines;  ///< converted to absolute GHz
  int line = 0;          ///< line number in the file
};

constexpr std::size_t kMaxEmitters = 100000;

/// `zplGHz` is the reference for GHz_detuning. InputError "origin:line: ..." naming the column.
std::vector<EmitterLines> parseEmitterLinesCsv(const std::string& text, const std::string& origin, double zplGHz);
std::vector<EmitterLines> readEmitterLinesCsv(const std::string& path, double zplGHz);

}  // namespace finestra
