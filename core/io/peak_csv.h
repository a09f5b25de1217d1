#pragma once
// Measured peaks from a CSV file (our layout). One header row naming the columns, any order:
//   measurement, field_T, polar_deg, azimuth_deg, position, unit, sigma   (required)
//   analyser_deg, temperature_K                                           (optional)
// field_T/polar_deg/azimuth_deg are the magnet setting in the lab frame (as in the project file);
// unit is a spectral unit key (GHz, THz, nm_vac, nm_air, meV, cm-1, GHz_detuning); sigma is the
// uncertainty in that unit; analyser_deg (empty = unpolarised) is a linear analyser in the lab xy
// plane at that angle from lab x. Rows with the same measurement name form one MeasurementSet and
// must share the field setting and temperature. Lines starting with '#' are comments.
#include <string>
#include <vector>

#include "core/project/project.h"

namespace finestra {

/// Parses CSV text; `origin` (a file name) prefixes errors as "origin:line". Throws InputError.
std::vector<MeasurementSet> parsePeakCsv(const std::string& text, const std::string& origin);
/// Reads a file (see parsePeakCsv).
std::vector<MeasurementSet> readPeakCsv(const std::string& path);

}  // namespace finestra
