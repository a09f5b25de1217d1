#pragma once
// The maxima of every size a user controls, in one place. Each is derived from memory or time on an
// ordinary workstation (8 GB, a few cores) so that a mistyped value stops with a message naming the
// key and the limit instead of exhausting memory or running for hours. Readers and the CLI check
// against these constants; a message states the limit.
#include <cstddef>

namespace finestra::limits {

/// Bytes of one text input (project JSON, plan request, peaks CSV, spectrum CSV). A parsed JSON
/// document costs about ten times its text in memory, so 16 MiB of text stays below ~200 MB. The
/// largest realistic input, a measured spectrum, holds about 800 000 rows of two numbers in 16 MiB.
inline constexpr std::size_t kMaxInputFileBytes = 16u * 1024u * 1024u;

/// Peak rows of a peaks CSV and peaks of one project. The assignment is a dense linear assignment
/// (cost ~ n^3 per measurement set and start); 10 000 peaks in total keep a fit within minutes.
inline constexpr std::size_t kMaxPeakRows = 10000;

/// Bytes of a name (measurement set, sweep). A name is shown in tables and copied into every row
/// of a report; 256 bytes is a long sentence.
inline constexpr std::size_t kMaxNameBytes = 256;

/// Field magnitude (T) every reader accepts, the limit the model enforces (core/model): far beyond
/// any laboratory magnet; past it the linear Zeeman model means nothing.
inline constexpr double kMaxFieldT = 1000.0;

/// Largest strain component the model accepts. Strain enters through susceptibilities of order
/// 1 PHz per unit strain (docs/physics.md, Strain): a first-order expansion that at 50 % would move
/// the ZPL by hundreds of THz, past zero. 5 % is ten times the strain of strained membranes and
/// cantilevers and about half the largest elastic strain reported for diamond at all (~9 % in
/// nanoneedles, Banerjee et al., Science 360, 300 (2018), from memory).
inline constexpr double kMaxStrain = 0.05;

/// Extra E-strain splitting (GHz) a project may give. Strain susceptibilities are of order
/// 1 PHz per unit strain (docs/physics.md, Strain), so the 5 % strain limit of the model
/// (core/model) corresponds to about 5 × 10^4 GHz; 10^5 GHz leaves a factor of two.
inline constexpr double kMaxEgStrainGHz = 1.0e5;

/// Points of one sweep. A sweep keeps every point's levels and lines for all classes (about 66 kB
/// per point without an isotope, four times that with the 2I+1 = 2 nuclear states of 29Si) and its
/// JSON output about as much again: 10 000 points stay below ~3 GB in the worst case.
inline constexpr int kMaxSweepPoints = 10000;

/// Coarse samples of 0..|B| per direction and class in the planner's smallest-gap scan. Each sample
/// is one 4x4 diagonalisation; at 10^5 directions × 4 classes, 1000 samples take about an hour on
/// one core, which is the most a plan should ever cost.
inline constexpr int kMaxGapScanSamples = 1000;

/// Directions of the planner's reachable set. Each direction holds figures of every class (well
/// under 1 kB), so 10^6 directions stay below ~1 GB; a sphere at a step of 0.25° has 1.04 × 10^6.
inline constexpr std::size_t kMaxPlannerDirections = 1100000;

/// Centres of a planner strain population. Every reachable direction is evaluated for each centre
/// (and each direction of an alignment cone, up to 105), so the cost of a plan grows with this
/// number: 4096 centres take about 10 s per thousand directions on two cores without a cone
/// (tests/bench/planner_population_bench.cpp: 64 centres × 650 directions in ~0.1 s), ~40 times
/// that with a 1° cone.
inline constexpr int kMaxStrainSamples = 4096;

/// Half-angle (deg) of the alignment cone: a magnet's angular uncertainty. Beyond 10° the set
/// direction no longer describes the field (core/planner/alignment_cone.h samples rings up to 10°).
inline constexpr double kMaxAlignmentToleranceDeg = 10.0;

/// Cells of the planner's direction map (polar × azimuth). One cell holds a handful of doubles per
/// class; 2 × 10^6 cells ≈ 0.5 GB. A 0.25° map has 721 × 1441 ≈ 1.04 × 10^6 cells.
inline constexpr std::size_t kMaxMapCells = 2000000;
/// The smallest map step that keeps a full-sphere map within kMaxMapCells.
inline constexpr double kMinMapStepDeg = 0.25;

}  // namespace finestra::limits
