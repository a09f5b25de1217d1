#include "core/optics/line_grid.h"

#include "core/common/errors.h"
#include "core/common/parallel.h"
#include "core/common/simd.h"
#include "core/crystal/frames.h"

namespace finestra {

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
                      std::vector<LineGridPoint>& out, const ProgressControl& control) {
  for (int cls : classes)
    if (cls < 0 || cls > 3) throw InputError("classes", "orientation class must be 0..3");
  const LineGridKernel kernel(model);
  const auto nc = static_cast<long>(classes.size());
  out.resize(fields.size() * classes.size());
  parallelChunks(static_cast<long>(fields.size()), [&](long begin, long end) {
    for (long k = begin; k < end; ++k) {
      if ((k & 255) == 0) control.throwIfCancelled();
      for (long c = 0; c < nc; ++c)
        kernel.evaluate(classes[static_cast<std::size_t>(c)], fields[static_cast<std::size_t>(k)],
                        out[static_cast<std::size_t>(k * nc + c)]);
    }
  });
}

}  // namespace finestra
