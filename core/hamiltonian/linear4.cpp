#include "core/hamiltonian/linear4.h"

#include "core/common/simd.h"

#include <Eigen/Eigenvalues>
#include <algorithm>
#include <cmath>
#include <limits>

namespace finestra {
namespace {

using Mat2 = Eigen::Matrix<cplx, 2, 2>;

Mat2 pauli(int k) {
  Mat2 m = Mat2::Zero();
  const cplx i{0.0, 1.0};
  switch (k) {
    case 0: m << 1, 0, 0, 1; break;
    case 1: m << 0, 1, 1, 0; break;
    case 2: m << 0, -i, i, 0; break;
    default: m << 1, 0, 0, -1; break;
  }
  return m;
}

// σ_a ⊗ s_b with the basis index 2·orbital + spin (hamiltonian.h).
Matrix4c pauliProduct(int orbital, int spin) {
  const Mat2 a = pauli(orbital), b = pauli(spin);
  Matrix4c out;
  for (int r = 0; r < 2; ++r)
    for (int c = 0; c < 2; ++c) out.block<2, 2>(2 * r, 2 * c) = a(r, c) * b;
  return out;
}

// (orbital, spin) Pauli indices of the components kept in PauliForm4, in its order.
constexpr std::array<std::array<int, 2>, 8> kKept{{{0, 0}, {1, 0}, {2, 0}, {3, 0}, {0, 1}, {0, 2}, {0, 3}, {2, 3}}};

double component(const Matrix4c& h, const Matrix4c& p) { return (h * p).trace().real() / 4.0; }

Vector4r sorted(Vector4r v) {
  std::sort(v.data(), v.data() + 4);
  return v;
}

}  // namespace

LinearHamiltonian4 LinearHamiltonian4::sample(const ManifoldModel& m, const StrainTerms& s, const Mat3& frame) {
  LinearHamiltonian4 h;
  h.constant = electronicHamiltonian(m, s, Vec3::Zero());
  for (int c = 0; c < 3; ++c) h.perTesla[static_cast<std::size_t>(c)] = electronicHamiltonian(m, s, frame.col(c)) - h.constant;
  return h;
}

void LinearHamiltonian4::at(const Vec3& b, Matrix4c& out) const {
  out.noalias() = constant + b.x() * perTesla[0] + b.y() * perTesla[1] + b.z() * perTesla[2];
}

PauliForm4 PauliForm4::fromLinear(const LinearHamiltonian4& h) {
  PauliForm4 form;
  double scale = 0, stray = 0;
  for (int a = 0; a < 4; ++a)
    for (int b = 0; b < 4; ++b) {
      const Matrix4c p = pauliProduct(a, b);
      const double c0 = component(h.constant, p);
      const Vec3 grad(component(h.perTesla[0], p), component(h.perTesla[1], p), component(h.perTesla[2], p));
      const auto kept = std::find(kKept.begin(), kKept.end(), std::array<int, 2>{a, b});
      const double size = std::abs(c0) + grad.cwiseAbs().sum();
      scale = std::max(scale, size);
      if (kept == kKept.end()) {
        stray = std::max(stray, size);
        continue;
      }
      const auto k = static_cast<std::size_t>(kept - kKept.begin());
      form.value[k] = c0;
      form.gradient[k] = grad;
    }
  form.closedForm = stray <= 1e-12 * std::max(scale, 1.0);
  return form;
}

// For K = o·σ + b·s + c σ_y s_z (σ and s commute, each squares to 1):
//   K² = S + 2J,  J = (o·σ)(b·s) + c o_y s_z + c b_z σ_y,
//   J² = |o|²|b|² + c²(o_y² + b_z²) + 2c o_y b_z K,
// so (K² − S)² = 4P + 8 c o_y b_z K: the depressed quartic x⁴ + p x² + q x + r with p = −2S,
// q = −8 c o_y b_z, r = S² − 4P. Its resolvent cubic y³ + 2p y² + (p² − 4r) y − q² has the roots
// (x1+x2)², (x1+x3)², (x1+x4)², and x = (±√y1 ± √y2 ± √y3)/2 with √y1 √y2 √y3 = −q.
namespace {

struct ResolventRoots {
  double y1, y2, y3;  ///< descending, clamped at 0
  double p, q, r;      ///< the depressed quartic x⁴ + p x² + q x + r of K = H − e0
};

// Pauli components e0, ox, oy, oz, bx, by, bz, c of H at field b.
std::array<double, 8> componentsAt(const PauliForm4& f, const Vec3& b) {
  std::array<double, 8> v;
  for (std::size_t k = 0; k < 8; ++k) v[k] = f.value[k] + f.gradient[k].dot(b);
  return v;
}

ResolventRoots resolventRoots(const std::array<double, 8>& v) {
  const double ox = v[1], oy = v[2], oz = v[3], bx = v[4], by = v[5], bz = v[6], c = v[7];
  const double o2 = ox * ox + oy * oy + oz * oz, b2 = bx * bx + by * by + bz * bz;
  const double S = o2 + b2 + c * c;
  const double P = o2 * b2 + c * c * (oy * oy + bz * bz);
  const double p = -2.0 * S, q = -8.0 * c * oy * bz, r = S * S - 4.0 * P;
  // Trigonometric form of y³ + a2 y² + a1 y + a0 (three real roots); cos(θ − 2π/3) and
  // cos(θ + 2π/3) follow from cos θ and sin θ.
  const double a2 = 2.0 * p, a1 = 16.0 * P, a0 = -q * q;  // p² − 4r = 16P
  const double shift = a2 / 3.0;
  const double pp = a1 - a2 * shift;
  const double qq = 2.0 * shift * shift * shift - shift * a1 + a0;
  if (pp >= 0.0) return {std::max(-shift, 0.0), std::max(-shift, 0.0), std::max(-shift, 0.0), p, q, r};
  const double m = 2.0 * std::sqrt(-pp / 3.0);
  const double theta = std::acos(std::clamp(3.0 * qq / (pp * m), -1.0, 1.0)) / 3.0;  // in [0, π/3]
  double y1 = m * std::cos(theta) - shift;  // the largest root: relative accuracy ~ rounding
  // One Newton step on the cubic polishes y1 further.
  const double slope = (3.0 * y1 + 2.0 * a2) * y1 + a1;
  if (slope > 0.0) y1 -= (((y1 + a2) * y1 + a1) * y1 + a0) / slope;
  if (!(y1 > 0.0)) return {0.0, 0.0, 0.0, p, q, r};
  // The two smaller roots (small near Kramers pairs, where the trigonometric form loses half the
  // digits) from Vieta's relations without cancellation: y1 y2 y3 = q², and
  // y1 y2 + y1 y3 + y2 y3 = p² − 4r = 16P exactly.
  const double product = q * q / y1;
  const double sum = std::max((16.0 * P - product) / y1, 0.0);
  const double larger = 0.5 * (sum + std::sqrt(std::max(sum * sum - 4.0 * product, 0.0)));
  const double smaller = larger > 0.0 ? product / larger : 0.0;
  return {y1, larger, smaller, p, q, r};
}

// Roots of the depressed quartic from the resolvent's roots, ascending.
Vector4r shiftedRoots(const ResolventRoots& y) {
  const double s1 = std::sqrt(y.y1), s2 = std::sqrt(y.y2);
  const double s3 = std::copysign(std::sqrt(y.y3), -y.q);
  Vector4r x;
  x << (s1 + s2 + s3) / 2, (s1 - s2 - s3) / 2, (-s1 + s2 - s3) / 2, (-s1 - s2 + s3) / 2;
  return sorted(x);
}

// Eigenvectors as columns of the spectral projectors Π_{m≠i} (K − x_m)/(x_i − x_m) for the given
// (distinct) eigenvalues x of K; false when a projector column vanishes.
bool projectorVectors(const Matrix4c& k, const Matrix4c& k2, const Matrix4c& k3, const Vector4r& x, Matrix4c& vectors) {
  for (int i = 0; i < 4; ++i) {
    // Π_{m≠i} (K − x_m) = K³ − e1 K² + e2 K − e3 with e1, e2, e3 the elementary symmetric
    // polynomials of the other three roots; it equals Π_{m≠i}(x_i − x_m) |v_i⟩⟨v_i|.
    std::array<double, 3> o{};
    for (int m = 0, n = 0; m < 4; ++m)
      if (m != i) o[static_cast<std::size_t>(n++)] = x[m];
    const double e1 = o[0] + o[1] + o[2];
    const double e2 = o[0] * o[1] + o[1] * o[2] + o[2] * o[0];
    const double e3 = o[0] * o[1] * o[2];
    const double denominator = (x[i] - o[0]) * (x[i] - o[1]) * (x[i] - o[2]);
    int best = 0;
    double bestWeight = -1;
    for (int j = 0; j < 4; ++j) {  // P_jj = |v_i,j|²: take the column of the largest component
      const double weight = (k3(j, j).real() - e1 * k2(j, j).real() + e2 * k(j, j).real() - e3) / denominator;
      if (weight > bestWeight) bestWeight = weight, best = j;
    }
    Eigen::Vector4cd column = k3.col(best) - e1 * k2.col(best) + e2 * k.col(best);
    column[best] -= e3;
    const double norm = column.norm();
    if (!(norm > 0.0)) return false;
    vectors.col(i) = column / norm;
  }
  return true;
}

// K = H − e0 from its Pauli components (basis 2·orbital + spin): diagonal blocks A = oz + b·s and
// D = −oz + b·s, off-diagonal block B = (ox − i oy)·1 − i c s_z = diag(u, w).
Matrix4c pauliMatrix(const std::array<double, 8>& v) {
  const double ox = v[1], oy = v[2], oz = v[3], bx = v[4], by = v[5], bz = v[6], c = v[7];
  const cplx p(bx, -by), u(ox, -(oy + c)), w(ox, -(oy - c));
  Matrix4c k;
  k << oz + bz, p, u, 0.0,
       std::conj(p), oz - bz, 0.0, w,
       std::conj(u), 0.0, -oz + bz, p,
       0.0, std::conj(w), std::conj(p), -oz - bz;
  return k;
}

// Eigenvectors by eliminating the y-orbital half. With v = (α, β) and B = diag(u, w):
//   (A − x)α + Bβ = 0  ⇒  uw·β = −adj(B)(A − x)α,   and   B†α + (D − x)β = 0  ⇒  N α = 0 with
//   N = uw·B† − (D − x) adj(B) (A − x), a rank-one 2×2 matrix; α ⊥ its larger row. The vector
//   (uw·α, −adj(B)(A − x)α) is then normalised. False when uw or N is too small to trust.
bool blockVectors(const Matrix4c& k, const Vector4r& x, double scale, Matrix4c& vectors) {
  const cplx u = k(0, 2), w = k(1, 3), p = k(0, 1), uw = u * w;
  const double scale2 = scale * scale;
  if (std::norm(uw) < 1e-6 * scale2 * scale2) return false;  // |uw| < 1e-3 scale²
  const double u2 = std::norm(u), w2 = std::norm(w), p2 = std::norm(p);
  for (int i = 0; i < 4; ++i) {
    const double a00 = k(0, 0).real() - x[i], a11 = k(1, 1).real() - x[i];
    const double d00 = k(2, 2).real() - x[i], d11 = k(3, 3).real() - x[i];
    // N written out: N = [[w(|u|² − a00 d00) − |p|² u, −p(d00 w + u a11)],
    //                     [−p*(w a00 + u d11), u(|w|² − a11 d11) − |p|² w]].
    const cplx n00 = w * (u2 - a00 * d00) - p2 * u, n01 = -p * (d00 * w + u * a11);
    const cplx n10 = -std::conj(p) * (w * a00 + u * d11), n11 = u * (w2 - a11 * d11) - p2 * w;
    const double row0 = std::norm(n00) + std::norm(n01), row1 = std::norm(n10) + std::norm(n11);
    const cplx alpha0 = row0 >= row1 ? n01 : n11, alpha1 = row0 >= row1 ? -n00 : -n10;
    if (!(std::max(row0, row1) > 1e-18 * scale2 * scale2 * scale2)) return false;
    const cplx beta0 = -w * (a00 * alpha0 + p * alpha1), beta1 = -u * (std::conj(p) * alpha0 + a11 * alpha1);
    const cplx top0 = uw * alpha0, top1 = uw * alpha1;
    const double inverse = 1.0 / std::sqrt(std::norm(top0) + std::norm(top1) + std::norm(beta0) + std::norm(beta1));
    vectors(0, i) = top0 * inverse, vectors(1, i) = top1 * inverse;
    vectors(2, i) = beta0 * inverse, vectors(3, i) = beta1 * inverse;
  }
  return true;
}

// Eigenvectors for the (distinct) eigenvalues x of K: block elimination, or the spectral
// projectors where the off-diagonal block is nearly singular.
bool eigenvectorsFor(const Matrix4c& k, const Vector4r& x, double scale, Matrix4c& vectors) {
  if (blockVectors(k, x, scale, vectors)) return true;
  const Matrix4c k2 = k * k;
  const Matrix4c k3 = k2 * k;
  return projectorVectors(k, k2, k3, x, vectors);
}

}  // namespace

Vector4r quarticLevels(const PauliForm4& f, const Vec3& b) {
  const std::array<double, 8> v = componentsAt(f, b);
  return shiftedRoots(resolventRoots(v)).array() + v[0];
}

// With s1 = √y1 the largest, the roots are (s1 ± (s2+s3))/2 and (−s1 ± (s2−s3))/2, so the gap
// between the upper and the lower pair is s1 − max(|s2|, |s3|) = √y1 − √y2.
double quarticMiddleGap(const PauliForm4& f, const Vec3& b) {
  const ResolventRoots y = resolventRoots(componentsAt(f, b));
  const double s1 = std::sqrt(y.y1), s2 = std::sqrt(y.y2);
  return s1 + s2 > 0 ? (y.y1 - y.y2) / (s1 + s2) : 0.0;
}

void eigen4(const PauliForm4& form, const LinearHamiltonian4& h, const Vec3& field, ManifoldEigen4& out) {
  if (form.closedForm && closedFormEigen4(form, field, out)) return;
  Matrix4c m;
  h.at(field, m);
  const Eigen::SelfAdjointEigenSolver<Matrix4c> solver(m);
  out.energies = solver.eigenvalues();
  out.vectors = solver.eigenvectors();
}

FINESTRA_VECTOR_CLONES
bool closedFormEigen4(const PauliForm4& f, const Vec3& b, ManifoldEigen4& out, double relativeGap) {
  const std::array<double, 8> v = componentsAt(f, b);
  const ResolventRoots y = resolventRoots(v);
  const double scale = std::sqrt(std::max(-y.p / 2.0, 0.0));  // tr(K²) = 4S = −2p: the rms level
  if (!(scale > 0.0)) return false;
  Vector4r x = shiftedRoots(y);
  for (int i = 0; i < 3; ++i)
    if (x[i + 1] - x[i] < relativeGap * scale) return false;
  // One Newton step on x⁴ + p x² + q x + r polishes the roots.
  for (int i = 0; i < 4; ++i) {
    const double xi = x[i], x2 = xi * xi;
    const double value = (x2 + y.p) * x2 + y.q * xi + y.r;
    const double slope = 4.0 * x2 * xi + 2.0 * y.p * xi + y.q;
    if (slope != 0.0) x[i] = xi - value / slope;
  }
  const Matrix4c k = pauliMatrix(v);
  if (!eigenvectorsFor(k, x, scale, out.vectors)) return false;
  // The polished roots carry the characteristic polynomial's rounding, ~ε X⁴/|f'(x_i)| (X the
  // largest |x|), and the vectors inherit an error δ/gap from a root error δ. Where that may
  // exceed 1e-12, Rayleigh quotients (error quadratic in the vectors' error) replace the roots
  // and the vectors are built again.
  const double largest = std::max(std::abs(x[0]), std::abs(x[3]));
  const double largest2 = largest * largest;
  const double rounding = 4.0 * std::numeric_limits<double>::epsilon() * largest2 * largest2;
  bool refine = false;
  for (int i = 0; i < 4; ++i) {
    double slope = 1, gap = std::numeric_limits<double>::infinity();
    for (int m = 0; m < 4; ++m)
      if (m != i) slope *= x[i] - x[m], gap = std::min(gap, std::abs(x[i] - x[m]));
    refine = refine || rounding > 1e-12 * std::abs(slope) * gap;
  }
  if (refine) {
    for (int i = 0; i < 4; ++i) x[i] = out.vectors.col(i).dot(k * out.vectors.col(i)).real();
    if (!eigenvectorsFor(k, x, scale, out.vectors)) return false;
  }
  out.energies = x.array() + v[0];
  return true;
}

}  // namespace finestra
