#pragma once
// Body of the lane kernel (line_lanes.h), compiled once per instruction set by line_lanes_avx2.cpp
// and line_lanes_avx512.cpp. It is the scalar closed form of core/hamiltonian/linear4.cpp written
// for kLanes field directions at once, with two changes that keep it branch-free:
// - the largest root of the resolvent cubic comes from Newton's iteration started at Samuelson's
//   upper bound for a polynomial with real roots (mean + √(n−1)·standard deviation of the roots;
//   P. A. Samuelson, J. Am. Stat. Assoc. 63, 1522 (1968)) instead of the trigonometric form,
//   which would need vector acos/cos. From above the largest root Newton's iteration decreases
//   monotonically to it; it is stopped when the step falls below 1e-14 of the root.
// - every lane where the scalar path would branch (near-degenerate levels, ill-conditioned
//   elimination) is reported to the caller, who evaluates it with the
//   scalar path (and that path's solver fallback at degeneracies).
// All arithmetic is double precision: the kernel reports absolute line frequencies.
#include "core/common/simd_lanes.h"
#include "core/optics/line_lanes.h"

namespace finestra {
namespace {

/// Eigenpairs of one manifold for every lane: energies ascending (GHz); vectors[n][i] is
/// component n (basis 2·orbital + spin) of level i.
struct ManifoldLanes {
  Lanes energy[4];
  ComplexLanes vectors[4][4];
};

void compareExchange(Lanes& a, Lanes& b) {
  const Lanes low = min(a, b);
  b = max(a, b);
  a = low;
}

// Largest root of y³ + a2 y² + a1 y + a0 whose three roots are real and non-negative (the
// resolvent of linear4.cpp); `failed` gains the lanes where the iteration did not settle.
Lanes largestResolventRoot(Lanes a2, Lanes a1, Lanes a0, LaneMask& failed) {
  // Roots' mean −a2/3 and mean square (a2² − 2 a1)/3 give Samuelson's bound mean + √2 σ.
  const Lanes mean = splat(-1.0 / 3.0) * a2;
  const Lanes variance = splat(1.0 / 3.0) * (a2 * a2 - splat(2.0) * a1) - mean * mean;
  Lanes y = mean + sqrt(splat(2.0) * max(variance, splat(0.0)));
  LaneMask settled = noLanes();
  for (int iteration = 0; iteration < 80; ++iteration) {
    const Lanes value = ((y + a2) * y + a1) * y + a0;
    const Lanes slope = (splat(3.0) * y + splat(2.0) * a2) * y + a1;
    const Lanes step = select(slope > splat(0.0), value / slope, splat(0.0));
    y = y - step;
    settled = abs(step) <= splat(1e-14) * abs(y);  // false for NaN lanes
    if (bits(settled) == (1u << kLanes) - 1u) break;
  }
  failed = failed | ~settled;
  return y;
}

/// The resolvent of one manifold at the lanes' fields (linear4.cpp): Pauli components v, the
/// depressed quartic x⁴ + p x² + q x + r of K = H − e0, S = tr(K²)/4 and the resolvent's roots
/// y1 ≥ y2 ≥ y3 ≥ 0.
struct ResolventLanes {
  Lanes v[8];
  Lanes S, p, q, r;
  Lanes y1, y2, y3;
};

void resolventAt(const LanePauliForm& f, Lanes bx, Lanes by, Lanes bz, ResolventLanes& out, LaneMask& failed) {
  Lanes* v = out.v;
  for (int k = 0; k < 8; ++k)
    v[k] = splat(f.value[k]) + splat(f.gradient[k][0]) * bx + splat(f.gradient[k][1]) * by +
           splat(f.gradient[k][2]) * bz;
  const Lanes ox = v[1], oy = v[2], oz = v[3], sx = v[4], sy = v[5], sz = v[6], c = v[7];
  const Lanes o2 = ox * ox + oy * oy + oz * oz, s2 = sx * sx + sy * sy + sz * sz, c2 = c * c;
  const Lanes S = o2 + s2 + c2;
  const Lanes P = o2 * s2 + c2 * (oy * oy + sz * sz);
  const Lanes p = splat(-2.0) * S, q = splat(-8.0) * c * oy * sz, r = S * S - splat(4.0) * P;
  const Lanes a1 = splat(16.0) * P;
  const Lanes y1 = largestResolventRoot(splat(2.0) * p, a1, -(q * q), failed);
  // The two smaller resolvent roots from Vieta's relations (y1 y2 y3 = q², Σ y_i y_j = 16P).
  const Lanes safeY1 = max(y1, splat(1e-300));
  const Lanes product = q * q / safeY1;
  const Lanes sum = max((a1 - product) / safeY1, splat(0.0));
  const Lanes larger = splat(0.5) * (sum + sqrt(max(sum * sum - splat(4.0) * product, splat(0.0))));
  const Lanes smaller = select(larger > splat(0.0), product / max(larger, splat(1e-300)), splat(0.0));
  out.S = S, out.p = p, out.q = q, out.r = r;
  out.y1 = max(y1, splat(0.0)), out.y2 = larger, out.y3 = smaller;
}

/// E2 − E1 at the lanes' fields (quarticMiddleGap in linear4.cpp): √y1 − √y2.
Lanes middleGap(const LanePauliForm& f, Lanes bx, Lanes by, Lanes bz, LaneMask& failed) {
  ResolventLanes res;
  resolventAt(f, bx, by, bz, res, failed);
  const Lanes sum = sqrt(res.y1) + sqrt(res.y2);
  return select(sum > splat(0.0), (res.y1 - res.y2) / max(sum, splat(1e-300)), splat(0.0));
}

// Eigenpairs of one manifold at the lanes' fields; `failed` gains the lanes the scalar path must do.
void solveManifold(const LanePauliForm& f, Lanes bx, Lanes by, Lanes bz, ManifoldLanes& out, LaneMask& failed) {
  ResolventLanes res;
  resolventAt(f, bx, by, bz, res, failed);
  const Lanes* v = res.v;
  const Lanes e0 = v[0], ox = v[1], oy = v[2], oz = v[3], sx = v[4], sy = v[5], sz = v[6], c = v[7];
  const Lanes S = res.S, p = res.p, q = res.q, r = res.r, y1 = res.y1, larger = res.y2, smaller = res.y3;
  failed = failed | notGreater(y1, splat(0.0));
  const Lanes r1 = sqrt(max(y1, splat(0.0))), r2 = sqrt(larger), r3abs = sqrt(smaller);
  const Lanes r3 = select(q > splat(0.0), -r3abs, r3abs);  // sign of −q: √y1 √y2 √y3 = −q
  Lanes x[4] = {splat(0.5) * (-r1 - r2 + r3), splat(0.5) * (-r1 + r2 - r3), splat(0.5) * (r1 - r2 - r3),
                splat(0.5) * (r1 + r2 + r3)};
  compareExchange(x[0], x[1]), compareExchange(x[2], x[3]), compareExchange(x[0], x[2]);
  compareExchange(x[1], x[3]), compareExchange(x[1], x[2]);
  // tr(K²) = 4S: the rms level is the manifold's scale; near-degenerate levels go to the solver.
  const Lanes scale = sqrt(S);
  failed = failed | notGreater(scale, splat(0.0));
  for (int i = 0; i < 3; ++i) failed = failed | notGreater(x[i + 1] - x[i], splat(1e-7) * scale);
  // One Newton step on the quartic polishes the roots.
  for (int i = 0; i < 4; ++i) {
    const Lanes xi = x[i], xx = xi * xi;
    const Lanes value = (xx + p) * xx + q * xi + r;
    const Lanes slope = splat(4.0) * xx * xi + splat(2.0) * p * xi + q;
    x[i] = select((slope > splat(0.0)) | (slope < splat(0.0)), xi - value / slope, xi);
  }
  // Where the roots' rounding would show in the vectors (~ε X⁴/|f'(x_i)| against the gap, as in
  // closedFormEigen4), Rayleigh quotients replace the roots and the vectors are built again.
  const Lanes largest = max(abs(x[0]), abs(x[3]));
  const Lanes rounding = splat(4.0 * 2.220446049250313e-16) * (largest * largest) * (largest * largest);
  LaneMask refine = noLanes();
  for (int i = 0; i < 4; ++i) {
    Lanes slope = splat(1.0), gap = splat(1e308);
    for (int m = 0; m < 4; ++m)
      if (m != i) slope = slope * (x[i] - x[m]), gap = min(gap, abs(x[i] - x[m]));
    refine = refine | (rounding > splat(1e-12) * abs(slope) * gap);
  }
  // Eigenvectors by eliminating the y-orbital half (blockVectors in linear4.cpp): the blocks of K
  // are A = oz + s·σ, D = −oz + s·σ and B = diag(u, w).
  const ComplexLanes u{ox, -(oy + c)}, w{ox, -(oy - c)}, pp{sx, -sy};
  const ComplexLanes uw = u * w;
  const Lanes scale2 = scale * scale, scale4 = scale2 * scale2;
  failed = failed | (norm(uw) < splat(1e-6) * scale4);
  const Lanes u2 = norm(u), w2 = norm(w), p2 = norm(pp);
  const Lanes k00 = oz + sz, k11 = oz - sz, k22 = -oz + sz, k33 = -oz - sz;
  const auto blockVectors = [&](const Lanes* roots, ComplexLanes (*vectors)[4]) {
    for (int i = 0; i < 4; ++i) {
      const Lanes a00 = k00 - roots[i], a11 = k11 - roots[i], d00 = k22 - roots[i], d11 = k33 - roots[i];
      const ComplexLanes n00 = (u2 - a00 * d00) * w - p2 * u, n01 = -(pp * (d00 * w + a11 * u));
      const ComplexLanes n10 = -(conj(pp) * (a00 * w + d11 * u)), n11 = (w2 - a11 * d11) * u - p2 * w;
      const Lanes row0 = norm(n00) + norm(n01), row1 = norm(n10) + norm(n11);
      const LaneMask second = row1 > row0;
      const ComplexLanes alpha0 = select(second, n11, n01), alpha1 = select(second, -n10, -n00);
      failed = failed | notGreater(max(row0, row1), splat(1e-18) * scale4 * scale2);
      const ComplexLanes beta0 = -(w * (a00 * alpha0 + pp * alpha1));
      const ComplexLanes beta1 = -(u * (conj(pp) * alpha0 + a11 * alpha1));
      const ComplexLanes top0 = uw * alpha0, top1 = uw * alpha1;
      const Lanes length2 = norm(top0) + norm(top1) + norm(beta0) + norm(beta1);
      const Lanes inverse = splat(1.0) / sqrt(max(length2, splat(1e-300)));
      vectors[0][i] = inverse * top0, vectors[1][i] = inverse * top1;
      vectors[2][i] = inverse * beta0, vectors[3][i] = inverse * beta1;
    }
  };
  blockVectors(x, out.vectors);
  if (bits(refine) != 0) {
    // Rayleigh quotients Re(v† K v) with K's zero entries K03 = K12 = 0 skipped.
    Lanes refined[4];
    for (int i = 0; i < 4; ++i) {
      const ComplexLanes v0 = out.vectors[0][i], v1 = out.vectors[1][i], v2 = out.vectors[2][i], v3 = out.vectors[3][i];
      const ComplexLanes kv0 = k00 * v0 + pp * v1 + u * v2, kv1 = conj(pp) * v0 + k11 * v1 + w * v3;
      const ComplexLanes kv2 = conj(u) * v0 + k22 * v2 + pp * v3, kv3 = conj(w) * v1 + conj(pp) * v2 + k33 * v3;
      const auto realDot = [](const ComplexLanes& a, const ComplexLanes& b) { return a.re * b.re + a.im * b.im; };
      refined[i] = select(refine, realDot(v0, kv0) + realDot(v1, kv1) + realDot(v2, kv2) + realDot(v3, kv3), x[i]);
    }
    ComplexLanes again[4][4];
    blockVectors(refined, again);
    for (int i = 0; i < 4; ++i) {
      x[i] = refined[i];
      for (int n = 0; n < 4; ++n) out.vectors[n][i] = select(refine, again[n][i], out.vectors[n][i]);
    }
  }
  for (int i = 0; i < 4; ++i) out.energy[i] = x[i] + e0;
}

// conj(g_n)·u_m summed into `acc` (the overlap of components n of g and m of u).
void addOverlap(const ComplexLanes& g, const ComplexLanes& u, ComplexLanes& acc) {
  acc.re += g.re * u.re + g.im * u.im;
  acc.im += g.re * u.im - g.im * u.re;
}

unsigned middleGapLanes(const LanePauliForm& form, const double* bxs, const double* bys, const double* bzs,
                        double* gaps) {
  LaneMask failed = noLanes();
  store(gaps, middleGap(form, load(bxs), load(bys), load(bzs), failed));
  return bits(failed);
}

unsigned lineLanes(const LaneClassInput& in, const double* bxs, const double* bys, const double* bzs,
                   double* const* out) {
  const Lanes bx = load(bxs), by = load(bys), bz = load(bzs);
  LaneMask failed = noLanes();
  ManifoldLanes g, u;
  solveManifold(in.ground, bx, by, bz, g, failed);
  solveManifold(in.excited, bx, by, bz, u, failed);
  // ⟨g_j| d_k |u_i⟩ with d_x = r σ_z, d_y = −r σ_x, d_z = 1 on the orbital index, then
  // a_c = Σ_k F(k, c) A_k for the crystal axes c (as LineGridKernel::evaluate).
  alignas(64) double result[kLinePointDoubles][kLanes];
  const double rr = in.dipoleRatio;
  for (int i = 0; i < 4; ++i)
    for (int j = 0; j < 4; ++j) {
      const ComplexLanes zero{splat(0.0), splat(0.0)};
      ComplexLanes top = zero, bottom = zero, cross = zero;
      addOverlap(g.vectors[0][j], u.vectors[0][i], top), addOverlap(g.vectors[1][j], u.vectors[1][i], top);
      addOverlap(g.vectors[2][j], u.vectors[2][i], bottom), addOverlap(g.vectors[3][j], u.vectors[3][i], bottom);
      addOverlap(g.vectors[0][j], u.vectors[2][i], cross), addOverlap(g.vectors[1][j], u.vectors[3][i], cross);
      addOverlap(g.vectors[2][j], u.vectors[0][i], cross), addOverlap(g.vectors[3][j], u.vectors[1][i], cross);
      const ComplexLanes difference = top - bottom, total = top + bottom;
      const int line = 4 * i + j;
      store(result[line], splat(in.zplGHz) + u.energy[i] - g.energy[j]);
      for (int axis = 0; axis < 3; ++axis) {
        const Lanes fx = splat(rr * in.frame[0][axis]), fy = splat(-rr * in.frame[1][axis]);
        const Lanes fz = splat(in.frame[2][axis]);
        const Lanes re = fx * difference.re + fy * cross.re + fz * total.re;
        const Lanes im = fx * difference.im + fy * cross.im + fz * total.im;
        store(result[16 + 3 * line + axis], re * re + im * im);
      }
    }
  for (int lane = 0; lane < kLanes; ++lane)
    for (int k = 0; k < kLinePointDoubles; ++k) out[lane][k] = result[k][lane];
  return bits(failed);
}

}  // namespace
}  // namespace finestra
