#include "core/optics/line_grid.h"

#include "core/common/errors.h"
#include "core/common/parallel.h"
#include "core/common/simd.h"
#include "core/crystal/frames.h"

#include <algorithm>

namespace finestra {
namespace {

static_assert(sizeof(LineGridPoint) == kLinePointDoubles * sizeof(double), "lane kernel writes LineGridPoint as doubles");

LanePauliForm lanePauliForm(const PauliForm4& form) {
  LanePauliForm out{};
  for (std::size_t k = 0; k < 8; ++k) {
    out.value[k] = form.value[k];
    for (int a = 0; a < 3; ++a) out.gradient[k][a] = form.gradient[k][a];
  }
  return out;
}

using LaneFunction = unsigned (*)(const LaneClassInput&, const double*, const double*, const double*, double* const*);
constexpr int kMaxLanes = kLanesAvx512;

}  // namespace

bool laneSetSupported(LaneSet set) {
  switch (set) {
    case LaneSet::Scalar: return true;
#if defined(FINESTRA_LANE_KERNELS)
    case LaneSet::Avx2: return __builtin_cpu_supports("avx2") && __builtin_cpu_supports("fma");
    case LaneSet::Avx512: return __builtin_cpu_supports("avx512f") && __builtin_cpu_supports("fma");
#else
    default: return false;
#endif
  }
  return false;
}

LaneSet bestLaneSet() {
  static const LaneSet best = laneSetSupported(LaneSet::Avx512) ? LaneSet::Avx512
                              : laneSetSupported(LaneSet::Avx2)  ? LaneSet::Avx2
                                                                 : LaneSet::Scalar;
  return best;
}

LineGridKernel::LineGridKernel(const CentreModel& model) {
  if (model.setup().centre.parameters.hasNuclearSpin())
    throw InputError("centre.isotope", "the line grid covers the 4-state manifolds only; remove the isotope");
  for (int cls = 0; cls < 4; ++cls) {
    const auto c = static_cast<std::size_t>(cls);
    ground_[c].linear = LinearHamiltonian4::sample(model.manifold(Manifold::Ground),
                                                   model.strainFor(Manifold::Ground, cls), defectFrame(cls));
    excited_[c].linear = LinearHamiltonian4::sample(model.manifold(Manifold::Excited),
                                                    model.strainFor(Manifold::Excited, cls), defectFrame(cls));
    ground_[c].form = PauliForm4::fromLinear(ground_[c].linear);
    excited_[c].form = PauliForm4::fromLinear(excited_[c].linear);
  }
  zplGHz_ = model.zplGHz();
  dipoleRatio_ = model.setup().centre.parameters.get(Param::DipoleRatio);
  for (std::size_t c = 0; c < 4; ++c) {
    LaneClassInput& in = lanes_[c];
    in.ground = lanePauliForm(ground_[c].form);
    in.excited = lanePauliForm(excited_[c].form);
    in.zplGHz = zplGHz_;
    in.dipoleRatio = dipoleRatio_;
    const Mat3& frame = defectFrame(static_cast<int>(c));
    for (int row = 0; row < 3; ++row)
      for (int col = 0; col < 3; ++col) in.frame[row][col] = frame(row, col);
  }
}

long LineGridKernel::evaluateMany(int cls, const Vec3* fields, long count, LineGridPoint* out, long outStride,
                                  LaneSet set) const {
  const auto c = static_cast<std::size_t>(cls);
  LaneFunction lanes = nullptr;
  int width = 1;
#if defined(FINESTRA_LANE_KERNELS)
  if (set == LaneSet::Avx512) lanes = lineLanesAvx512, width = kLanesAvx512;
  if (set == LaneSet::Avx2) lanes = lineLanesAvx2, width = kLanesAvx2;
#endif
  // The lane kernel needs both manifolds in the Pauli form; otherwise every point is scalar.
  if (lanes == nullptr || !ground_[c].form.closedForm || !excited_[c].form.closedForm) {
    for (long k = 0; k < count; ++k) evaluate(cls, fields[k], out[k * outStride]);
    return count;
  }
  long scalarPoints = 0;
  LineGridPoint padding;  // destination of the lanes past `count` in the last batch
  for (long start = 0; start < count; start += width) {
    double bx[kMaxLanes], by[kMaxLanes], bz[kMaxLanes];
    double* destination[kMaxLanes];
    for (int l = 0; l < width; ++l) {
      const long k = std::min(start + l, count - 1);
      bx[l] = fields[k].x(), by[l] = fields[k].y(), bz[l] = fields[k].z();
      destination[l] = start + l < count ? out[(start + l) * outStride].frequencyGHz.data() : padding.frequencyGHz.data();
    }
    const unsigned handedBack = lanes(lanes_[c], bx, by, bz, destination);
    for (int l = 0; l < width && start + l < count; ++l)
      if (handedBack & (1u << l)) evaluate(cls, fields[start + l], out[(start + l) * outStride]), ++scalarPoints;
  }
  return scalarPoints;
}

FINESTRA_VECTOR_CLONES
void LineGridKernel::evaluate(int cls, const Vec3& field, LineGridPoint& out) const {
  const auto c = static_cast<std::size_t>(cls);
  ManifoldEigen4 g, u;
  eigen4(ground_[c].form, ground_[c].linear, field, g);
  eigen4(excited_[c].form, excited_[c].linear, field, u);
  // ⟨g_j| d_k |u_i⟩ with d_x = r σ_z, d_y = −r σ_x, d_z = 1 on the orbital (slow) index (dipole.h),
  // then a_c = Σ_k F(k, c) A_k for the crystal axes c. Real arithmetic over the four lower levels
  // j at once (structure of arrays), which the compiler turns into vector instructions.
  double gr[4][4], gi[4][4];  // [component n][level j]
  for (int j = 0; j < 4; ++j)
    for (int n = 0; n < 4; ++n) gr[n][j] = g.vectors(n, j).real(), gi[n][j] = g.vectors(n, j).imag();
  const Mat3& frame = defectFrame(cls);
  const double r = dipoleRatio_;
  // ⟨g|u⟩ restricted to the components (n of g, m of u): real and imaginary parts over j.
  const auto overlap = [&](const cplx* ui, int n, int m, double* re, double* im) {
    const double ur = ui[m].real(), uim = ui[m].imag();
    for (int j = 0; j < 4; ++j) {
      re[j] += gr[n][j] * ur + gi[n][j] * uim;
      im[j] += gr[n][j] * uim - gi[n][j] * ur;
    }
  };
  for (int i = 0; i < 4; ++i) {
    const cplx* ui = u.vectors.col(i).data();
    double topRe[4] = {}, topIm[4] = {}, botRe[4] = {}, botIm[4] = {}, crossRe[4] = {}, crossIm[4] = {};
    overlap(ui, 0, 0, topRe, topIm), overlap(ui, 1, 1, topRe, topIm);
    overlap(ui, 2, 2, botRe, botIm), overlap(ui, 3, 3, botRe, botIm);
    overlap(ui, 0, 2, crossRe, crossIm), overlap(ui, 1, 3, crossRe, crossIm);
    overlap(ui, 2, 0, crossRe, crossIm), overlap(ui, 3, 1, crossRe, crossIm);
    double intensity[3][4];
    for (int axis = 0; axis < 3; ++axis) {
      const double fx = r * frame(0, axis), fy = -r * frame(1, axis), fz = frame(2, axis);
      for (int j = 0; j < 4; ++j) {
        const double re = fx * (topRe[j] - botRe[j]) + fy * crossRe[j] + fz * (topRe[j] + botRe[j]);
        const double im = fx * (topIm[j] - botIm[j]) + fy * crossIm[j] + fz * (topIm[j] + botIm[j]);
        intensity[axis][j] = re * re + im * im;
      }
    }
    for (int j = 0; j < 4; ++j) {
      const auto k = static_cast<std::size_t>(4 * i + j);
      out.frequencyGHz[k] = zplGHz_ + u.energies[i] - g.energies[j];
      for (int axis = 0; axis < 3; ++axis)
        out.intensityCrystal[k][static_cast<std::size_t>(axis)] = intensity[axis][j];
    }
  }
}

void evaluateLineGrid(const CentreModel& model, const std::vector<Vec3>& fields, const std::vector<int>& classes,
                      std::vector<LineGridPoint>& out, const ProgressControl& control, LaneSet lanes) {
  if (!laneSetSupported(lanes)) throw InputError("lanes", "this CPU or build does not run the requested lane kernel");
  for (int cls : classes)
    if (cls < 0 || cls > 3) throw InputError("classes", "orientation class must be 0..3");
  const LineGridKernel kernel(model);
  const auto nc = static_cast<long>(classes.size());
  out.resize(fields.size() * classes.size());
  parallelChunks(static_cast<long>(fields.size()), [&](long begin, long end) {
    constexpr long kBlock = 256;  // points between cancellation checks
    for (long k = begin; k < end; k += kBlock) {
      control.throwIfCancelled();
      const long count = std::min(kBlock, end - k);
      for (long c = 0; c < nc; ++c)
        kernel.evaluateMany(classes[static_cast<std::size_t>(c)], fields.data() + k, count,
                            out.data() + k * nc + c, nc, lanes);
    }
  });
}

}  // namespace finestra
