#pragma once
// Level populations used to weight lines in emission (PL) and excitation (PLE) spectra.
#include "core/common/types.h"

namespace finestra {

enum class PopulationModel { Thermal, Equal };

/// Boltzmann populations of levels with energies `energiesGHz` at temperature T (K), normalised to
/// sum 1. T = 0 puts the weight equally on the levels degenerate with the lowest (within 1e-9 GHz).
/// Equal gives 1/n each.
VectorXr levelPopulations(const VectorXr& energiesGHz, double temperatureK, PopulationModel model);

}  // namespace finestra
