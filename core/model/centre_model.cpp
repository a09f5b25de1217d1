#include "core/model/centre_model.h"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <sstream>

#include "core/centre/parameter_table.h"
#include "core/common/errors.h"
#include "core/common/limits.h"
#include "core/model/dipole.h"
#include "core/model/tracking.h"
#include "core/units/linewidth.h"

namespace finestra {
namespace {

constexpr double kMaxTemperatureK = 1000.0;

void validateConditions(const DetectionConditions& c) {
  if (!std::isfinite(c.temperatureK)) throw InputError("conditions.temperature_K", "not a finite number");
  if (c.temperatureK < 0) throw InputError("conditions.temperature_K", "must not be negative");
  if (c.temperatureK > kMaxTemperatureK)
    throw InputError("conditions.temperature_K", "above the limit of 1000 K (the phonon model is for cryogenic to room temperature)");
  if (!std::isfinite(c.extraBroadeningGHz) || c.extraBroadeningGHz < 0)
    throw InputError("conditions.broadening_GHz", "must be a finite, non-negative number");
  if (c.bathT2StarS && !(std::isfinite(*c.bathT2StarS) && *c.bathT2StarS > 0))
    throw InputError("conditions.bath_t2star_s", "must be a finite, positive number of seconds");
  if (!c.collectionLab.allFinite() || c.collectionLab.norm() < 1e-12)
    throw InputError("conditions.collection_lab", "must be a non-zero finite vector");
  if (c.analyserLab && (!c.analyserLab->allFinite() || c.analyserLab->norm() < 1e-12))
    throw InputError("conditions.analyser_lab", "must be a non-zero finite vector or null");
}

std::string shortNumber(double x) {
  std::ostringstream out;
  out << x;
  return out.str();
}

void validateStrain(const StrainSetting& s) {
  if (!s.crystal.allFinite()) throw InputError("strain.crystal", "component is not a finite number");
  if (s.crystal.cwiseAbs().maxCoeff() > kMaxStrain)
    throw InputError("strain.crystal", "component above 0.05 (5 % strain) is outside the model");
  if ((s.crystal - s.crystal.transpose()).cwiseAbs().maxCoeff() > 1e-15)
    throw InputError("strain.crystal", "tensor must be symmetric");
  for (const EgStrain* e : {&s.extraGround, &s.extraExcited})
    if (!std::isfinite(e->magnitudeGHz) || !std::isfinite(e->angleDeg) || e->magnitudeGHz < 0)
      throw InputError("strain.eg", "E-strain magnitude must be finite and non-negative, angle finite");
}

StrainTerms addEg(StrainTerms s, const EgStrain& extra) {
  const double a = extra.angleDeg * std::numbers::pi / 180.0;
  s.egx += extra.magnitudeGHz * std::cos(a);
  s.egy += extra.magnitudeGHz * std::sin(a);
  return s;
}

}  // namespace

CentreModel::CentreModel(ModelSetup setup) : setup_(std::move(setup)) {
  const CentreParameters& p = setup_.centre.parameters;
  p.validateForComputation();
  validateConditions(setup_.conditions);
  validateStrain(setup_.strain);
  ground_ = manifoldModel(p, Manifold::Ground);
  excited_ = manifoldModel(p, Manifold::Excited);
  zplGHz_ = p.get(Param::ZplTHz) * 1e3;
  // Optional thermal ZPL shift c (T / 1 K)^p (docs/physics.md, Phonons and linewidths); inactive when unknown.
  if (p.known(Param::ZplShiftCoef) && p.known(Param::ZplShiftPower) && setup_.conditions.temperatureK > 0)
    thermalShiftGHz_ = p.get(Param::ZplShiftCoef) * std::pow(setup_.conditions.temperatureK, p.get(Param::ZplShiftPower));
  if (!std::isfinite(thermalShiftGHz_) || std::abs(thermalShiftGHz_) > 1e6)
    throw InputError("zpl_shift_coef_GHz", "thermal ZPL shift at the project temperature exceeds 1e6 GHz: check the coefficient and zpl_shift_power");
  zplGHz_ += thermalShiftGHz_;
  dipoleRatio_ = p.get(Param::DipoleRatio);
  const auto& c = setup_.conditions;
  if (c.analyserLab) {
    analysers_[0] = setup_.lab.toCrystal(c.analyserLab->normalized());
    analyserCount_ = 1;
  } else {
    const Vec3 k = setup_.lab.toCrystal(c.collectionLab.normalized());
    analysers_[0] = k.unitOrthogonal();
    analysers_[1] = k.cross(analysers_[0]);
    analyserCount_ = 2;
  }
}

double CentreModel::linewidthGHz() const {
  return lifetimeLimitedFwhmGHz(setup_.centre.parameters.get(Param::LifetimeNs)) +
         setup_.conditions.extraBroadeningGHz;
}

StrainTerms CentreModel::strainFor(Manifold m, int cls, const Mat3* strainOverride) const {
  const Mat3& crystal = strainOverride ? *strainOverride : setup_.strain.crystal;
  const Mat3 defect = rotateTensor(defectFrame(cls), crystal);
  const bool g = m == Manifold::Ground;
  return addEg(strainTerms(manifold(m), defect), g ? setup_.strain.extraGround : setup_.strain.extraExcited);
}

ManifoldEigen CentreModel::levels(Manifold m, int cls, const Vec3& fieldCrystal, const Mat3* strainOverride) const {
  if (!(fieldCrystal.norm() <= kMaxFieldT))
    throw InputError("field", "magnitude " + shortNumber(fieldCrystal.norm()) +
                                  " T is too large for this model (at most " + shortNumber(kMaxFieldT) + " T)");
  if (strainOverride && !(strainOverride->cwiseAbs().maxCoeff() <= kMaxStrain))
    throw InputError("strain", "a strain component is not finite or above 0.05 (5 % strain)");
  ManifoldEigen out = diagonalise(manifold(m), strainFor(m, cls, strainOverride), defectFrame(cls) * fieldCrystal);
  if (!out.energies.allFinite() || !out.vectors.allFinite())
    throw InputError("centre.parameters", "the computation gave non-finite energies (a value is far too large)");
  return out;
}

std::vector<OpticalLine> CentreModel::lines(int cls, const ManifoldEigen& g, const ManifoldEigen& u) const {
  const auto amps = dipoleAmplitudesDefect<MatrixXc>(g.vectors, u.vectors, dipoleRatio_);
  const Mat3& frame = defectFrame(cls);
  std::vector<OpticalLine> out;
  out.reserve(static_cast<std::size_t>(g.energies.size() * u.energies.size()));
  for (Eigen::Index i = 0; i < u.energies.size(); ++i) {
    for (Eigen::Index j = 0; j < g.energies.size(); ++j) {
      OpticalLine line;
      line.upper = static_cast<int>(i);
      line.lower = static_cast<int>(j);
      line.frequencyGHz = zplGHz_ + u.energies[i] - g.energies[j];
      line.amplitudeCrystal = crystalAmplitude(amps, frame, j, i);
      for (int c = 0; c < 3; ++c) line.intensityCrystal[c] = std::norm(line.amplitudeCrystal[c]);
      line.intensity = analysedIntensity(line.amplitudeCrystal, analysers_, analyserCount_);
      out.push_back(line);
    }
  }
  return out;
}

std::vector<int> branchesAtField(const CentreModel& model, Manifold m, int cls, const Vec3& field,
                                 const Mat3* strainOverride, int steps) {
  ManifoldEigen previous = model.levels(m, cls, Vec3::Zero(), strainOverride);
  std::vector<int> branch = zeroFieldBranches(previous.energies.size());
  if (field.norm() == 0.0) return branch;
  steps = std::max(steps, 1);
  for (int k = 1; k <= steps; ++k) {
    ManifoldEigen current = model.levels(m, cls, field * (static_cast<double>(k) / steps), strainOverride);
    const std::vector<int> from = matchStates(previous.vectors, current.vectors);
    std::vector<int> next(branch.size());
    for (std::size_t c = 0; c < next.size(); ++c) next[c] = branch[static_cast<std::size_t>(from[c])];
    branch = std::move(next);
    previous = std::move(current);
  }
  return branch;
}

void labelLines(std::vector<OpticalLine>& lines, const std::vector<int>& groundBranch,
                const std::vector<int>& excitedBranch) {
  auto parentOf = [&](const OpticalLine& l) {
    const bool upperExcited = excitedBranch[static_cast<std::size_t>(l.upper)] == 1;
    const bool upperGround = groundBranch[static_cast<std::size_t>(l.lower)] == 1;
    if (upperExcited) return upperGround ? 'B' : 'A';
    return upperGround ? 'D' : 'C';
  };
  for (auto& l : lines) l.parent = parentOf(l);
  for (char parent : {'A', 'B', 'C', 'D'}) {
    std::vector<OpticalLine*> group;
    for (auto& l : lines)
      if (l.parent == parent) group.push_back(&l);
    std::stable_sort(group.begin(), group.end(),
                     [](const OpticalLine* a, const OpticalLine* b) { return a->frequencyGHz < b->frequencyGHz; });
    for (std::size_t k = 0; k < group.size(); ++k) group[k]->subIndex = static_cast<int>(k) + 1;
  }
}

ClassSolution CentreModel::solve(int cls, const Vec3& fieldCrystal, int labelSteps) const {
  return solve(cls, fieldCrystal, setup_.strain.crystal, labelSteps);
}

ClassSolution CentreModel::solve(int cls, const Vec3& fieldCrystal, const Mat3& strainCrystal, int labelSteps) const {
  if (cls < 0 || cls >= kClassCount) throw InputError("classes", "orientation class must be 0..3");
  if (!fieldCrystal.allFinite()) throw InputError("field", "field has a non-finite component");
  ClassSolution out;
  out.cls = cls;
  out.ground = levels(Manifold::Ground, cls, fieldCrystal, &strainCrystal);
  out.excited = levels(Manifold::Excited, cls, fieldCrystal, &strainCrystal);
  out.groundBranch = branchesAtField(*this, Manifold::Ground, cls, fieldCrystal, &strainCrystal, labelSteps);
  out.excitedBranch = branchesAtField(*this, Manifold::Excited, cls, fieldCrystal, &strainCrystal, labelSteps);
  out.lines = lines(cls, out.ground, out.excited);
  labelLines(out.lines, out.groundBranch, out.excitedBranch);
  return out;
}

}  // namespace finestra
