// The engine against a second, deliberately plain transcription of docs/physics.md
// (Hamiltonian of one manifold, Optical transitions) written here
// with explicit Kronecker products (no shared code with core/hamiltonian or core/optics beyond the
// class frames, which symmetry_test pins separately).
#include <gtest/gtest.h>

#include <Eigen/Eigenvalues>
#include <unsupported/Eigen/KroneckerProduct>

#include "test_support.h"

using namespace finestra;
using finestra::testing::randomStrain;
using finestra::testing::randomVector;

namespace {
using M2 = Eigen::Matrix2cd;
using M4 = Eigen::Matrix4cd;
const cplx I1(0, 1);

M4 kron(const M2& a, const M2& b) { return Eigen::kroneckerProduct(a, b).eval(); }

struct Reference {
  double lambda, q, d, f, tperp, tpar;
};

M4 referenceHamiltonian(const Reference& r, const Vec3& b, const Mat3& e) {
  M2 sx, sy, sz, one = M2::Identity();
  sx << 0, 1, 1, 0;
  sy << 0, -I1, I1, 0;
  sz << 1, 0, 0, -1;
  const double muB = 13.996244936, gs = 2.00231930436;
  const double a1g = r.tperp * (e(0, 0) + e(1, 1)) + r.tpar * e(2, 2);
  const double egx = r.d * (e(0, 0) - e(1, 1)) + r.f * e(2, 0);
  const double egy = -2 * r.d * e(0, 1) + r.f * e(1, 2);
  return -(r.lambda / 2) * kron(sy, sz) + kron(a1g * one - egx * sz + egy * sx, one) + r.q * muB * b.z() * kron(sy, one) +
         (gs * muB / 2) * (b.x() * kron(one, sx) + b.y() * kron(one, sy) + b.z() * kron(one, sz));
}
}  // namespace

TEST(ReferenceModel, FrequenciesAndCrystalIntensitiesAgree) {
  std::mt19937 rng(21);
  const Reference ground{48, 0.1, 1.3e6, -1.7e6, 0, 0}, excited{259, 0.1, 1.8e6, -3.4e6, 0.078e6, -1.7e6};
  const CentreModel model(finestra::testing::setupFor("SiV-"));
  for (int trial = 0; trial < 20; ++trial) {
    const Vec3 field = randomVector(rng, 3.0);
    const Mat3 strain = randomStrain(rng, 2e-5);
    for (int cls = 0; cls < 4; ++cls) {
      const Mat3& F = defectFrame(cls);
      const Vec3 b = F * field;
      const Mat3 e = F * strain * F.transpose();
      Eigen::SelfAdjointEigenSolver<M4> g(referenceHamiltonian(ground, b, e)), u(referenceHamiltonian(excited, b, e));
      M2 sx, sz;
      sx << 0, 1, 1, 0;
      sz << 1, 0, 0, -1;
      const std::array<M4, 3> dipole{kron(sz, M2::Identity()), kron(-sx, M2::Identity()), M4::Identity()};
      const ManifoldEigen eg = model.levels(Manifold::Ground, cls, field, &strain);
      const ManifoldEigen eu = model.levels(Manifold::Excited, cls, field, &strain);
      const std::vector<OpticalLine> lines = model.lines(cls, eg, eu);
      for (const OpticalLine& l : lines) {
        const double expectedFrequency = 406774.0 + u.eigenvalues()[l.upper] - g.eigenvalues()[l.lower];
        EXPECT_NEAR(l.frequencyGHz, expectedFrequency, 1e-6);
        for (int c = 0; c < 3; ++c) {
          cplx amp = 0;
          for (int k = 0; k < 3; ++k)
            amp += F(k, c) * g.eigenvectors().col(l.lower).dot(dipole[k] * u.eigenvectors().col(l.upper));
          EXPECT_NEAR(l.intensityCrystal[c], std::norm(amp), 1e-9);
        }
      }
    }
  }
}
