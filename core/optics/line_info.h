#pragma once
// Descriptions of single optical lines for hover boxes and tables, polarisation character, and
// the lookup of predicted lines nearest to a measured peak.
#include <optional>
#include <string>
#include <vector>

#include "core/project/project.h"

namespace finestra {

/// Fraction of a line's dipole strength along its class's symmetry axis, |a·ẑ|²/|a|² (0..1).
/// At zero field B and C lines give 1, A and D lines 0 (docs/physics.md, Optical transitions). NaN for a dark line.
double axisParallelFraction(const OpticalLine& line, int cls);

/// "∥ axis 97 %" / "⊥ axis 88 %" (the larger share), "dark" for a line with no dipole strength.
std::string polarisationText(const OpticalLine& line, int cls);

/// Multi-line text: class and axis, label, levels, frequency in every spectral unit (detuning
/// from `zplGHz`), intensity and polarisation.
std::string describeLine(int cls, const OpticalLine& line, double zplGHz);

/// A predicted line near a measured position.
struct LineCandidate {
  int cls = 0;
  OpticalLine line;
  double distanceGHz = 0;    ///< predicted − measured
  double distanceSigma = 0;  ///< |distance| / σ (σ converted to GHz)
};

/// The `count` lines of `classes` closest in frequency to `frequencyGHz`, nearest first.
std::vector<LineCandidate> nearestLines(const std::vector<ClassSolution>& classes, double frequencyGHz,
                                        double sigmaGHz, std::size_t count);

/// Absolute frequency and its uncertainty (GHz) of a measured peak; `zplGHz` for detuning units.
struct PeakFrequency {
  double frequencyGHz = 0;
  double sigmaGHz = 0;
};
PeakFrequency peakFrequency(const MeasuredPeak& peak, double zplGHz);

/// Predicted lines nearest to one measured peak: the project's classes are solved at the field of
/// the measurement (its magnet setting), then ranked by distance.
std::vector<LineCandidate> nearestLinesForPeak(const CentreModel& model, const Project& project,
                                               const MeasurementSet& measurement, const MeasuredPeak& peak,
                                               std::size_t count);

/// Position of a magnet setting on a sweep's axis: |B| for a magnitude sweep, the angle (deg) of
/// the field in the sweep plane for an angle sweep; none for a strain or temperature sweep or a zero field in an
/// angle sweep.
std::optional<double> sweepCoordinate(const SweepSpec& sweep, const LabFrame& lab, const FieldSetting& field);

}  // namespace finestra
