#pragma once
// finestra-cli microwave and lambda-systems: magnetic-dipole resonances with the nuclear spin, and
// Λ systems of the optical lines, at the project's field.
#include <string>
#include <vector>

#include "app/cli/commands.h"

namespace CLI {
class App;
}

namespace finestra::cli {

struct MicrowaveOptions {
  std::vector<double> driveLab{1, 0, 0};  ///< microwave field direction, lab frame
  std::string manifold = "ground";
  bool details = false;
  bool spectrum = false;      ///< print the simulated absorption spectrum (CSV or JSON) instead
  double linewidthMHz = 1.0;  ///< Lorentzian FWHM of every resonance in the spectrum
  double fromGHz = 0, toGHz = 0;
  int points = 2001;
};

struct LambdaOptions {
  std::string rankBy = "product";
  bool details = false;
  std::vector<int> pumpLine;  ///< EXCITED,GROUND of the pumped line (empty: no CPT dips)
  int pumpClass = -1;         ///< class of the pumped line (-1: the project's first class)
};

void addMicrowaveOptions(CLI::App* command, MicrowaveOptions& options);
void addLambdaOptions(CLI::App* command, LambdaOptions& options);
int runMicrowave(const CommonOptions& common, const MicrowaveOptions& options);
int runLambdaSystems(const CommonOptions& common, const LambdaOptions& options);

}  // namespace finestra::cli
