#pragma once
// finestra-cli thermal: phonon rates, linewidths and the spin coherence limit of every selected
// class at a list of temperatures (issue 12), at the project's field and strain.
#include <vector>

#include "app/cli/commands.h"

namespace CLI {
class App;
}

namespace finestra::cli {

struct ThermalOptions {
  std::vector<double> temperaturesK;  ///< empty: the project's temperature
};

void addThermalOptions(CLI::App* command, ThermalOptions& options);
int runThermal(const CommonOptions& common, const ThermalOptions& options);

}  // namespace finestra::cli
