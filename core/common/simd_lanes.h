#pragma once
// Packed double-precision lanes for kernels that evaluate several field directions at once
// (structure of arrays: lane l holds direction l). Include only from a translation unit compiled
// for one instruction set (core/CMakeLists.txt sets -mavx512f or -mavx2 -mfma per file); the
// width follows the compiler flags. Everything here has internal linkage, so the wide
// instructions never leak into code that runs on CPUs without them.
#include <immintrin.h>

namespace finestra {
namespace {  // internal linkage on purpose (see above)

#if defined(__AVX512F__)

constexpr int kLanes = 8;
struct Lanes {
  __m512d v;
};
struct LaneMask {
  __mmask8 m;
};
inline Lanes splat(double x) { return {_mm512_set1_pd(x)}; }
inline Lanes load(const double* p) { return {_mm512_loadu_pd(p)}; }
inline void store(double* p, Lanes a) { _mm512_storeu_pd(p, a.v); }
inline Lanes operator+(Lanes a, Lanes b) { return {_mm512_add_pd(a.v, b.v)}; }
inline Lanes operator-(Lanes a, Lanes b) { return {_mm512_sub_pd(a.v, b.v)}; }
inline Lanes operator*(Lanes a, Lanes b) { return {_mm512_mul_pd(a.v, b.v)}; }
inline Lanes operator/(Lanes a, Lanes b) { return {_mm512_div_pd(a.v, b.v)}; }
// The all-lanes masked forms: GCC 12's plain _mm512_sqrt_pd/min/max start from
// _mm512_undefined_pd() and trip -Wuninitialized (GCC bug 105593).
inline Lanes sqrt(Lanes a) { return {_mm512_mask_sqrt_pd(a.v, 0xFF, a.v)}; }
inline Lanes min(Lanes a, Lanes b) { return {_mm512_mask_min_pd(a.v, 0xFF, a.v, b.v)}; }
inline Lanes max(Lanes a, Lanes b) { return {_mm512_mask_max_pd(a.v, 0xFF, a.v, b.v)}; }
inline Lanes abs(Lanes a) { return {_mm512_abs_pd(a.v)}; }
inline LaneMask operator<(Lanes a, Lanes b) { return {_mm512_cmp_pd_mask(a.v, b.v, _CMP_LT_OQ)}; }
inline LaneMask operator>(Lanes a, Lanes b) { return {_mm512_cmp_pd_mask(a.v, b.v, _CMP_GT_OQ)}; }
inline LaneMask operator<=(Lanes a, Lanes b) { return {_mm512_cmp_pd_mask(a.v, b.v, _CMP_LE_OQ)}; }
/// True where a ≤ b is not known to hold (including NaN lanes): the safe test for "too small".
/// Comparisons are ordered (false where a lane is NaN) except notGreater.
inline LaneMask notGreater(Lanes a, Lanes b) { return {_mm512_cmp_pd_mask(a.v, b.v, _CMP_NGT_UQ)}; }
inline LaneMask operator|(LaneMask a, LaneMask b) { return {static_cast<__mmask8>(a.m | b.m)}; }
inline LaneMask operator&(LaneMask a, LaneMask b) { return {static_cast<__mmask8>(a.m & b.m)}; }
inline Lanes select(LaneMask m, Lanes whenTrue, Lanes whenFalse) {
  return {_mm512_mask_blend_pd(m.m, whenFalse.v, whenTrue.v)};
}
inline LaneMask operator~(LaneMask a) { return {static_cast<__mmask8>(~a.m)}; }
inline unsigned bits(LaneMask m) { return m.m; }
inline LaneMask noLanes() { return {0}; }

#elif defined(__AVX2__)

constexpr int kLanes = 4;
struct Lanes {
  __m256d v;
};
struct LaneMask {
  __m256d m;
};
inline Lanes splat(double x) { return {_mm256_set1_pd(x)}; }
inline Lanes load(const double* p) { return {_mm256_loadu_pd(p)}; }
inline void store(double* p, Lanes a) { _mm256_storeu_pd(p, a.v); }
inline Lanes operator+(Lanes a, Lanes b) { return {_mm256_add_pd(a.v, b.v)}; }
inline Lanes operator-(Lanes a, Lanes b) { return {_mm256_sub_pd(a.v, b.v)}; }
inline Lanes operator*(Lanes a, Lanes b) { return {_mm256_mul_pd(a.v, b.v)}; }
inline Lanes operator/(Lanes a, Lanes b) { return {_mm256_div_pd(a.v, b.v)}; }
inline Lanes sqrt(Lanes a) { return {_mm256_sqrt_pd(a.v)}; }
inline Lanes min(Lanes a, Lanes b) { return {_mm256_min_pd(a.v, b.v)}; }
inline Lanes max(Lanes a, Lanes b) { return {_mm256_max_pd(a.v, b.v)}; }
inline Lanes abs(Lanes a) { return {_mm256_andnot_pd(_mm256_set1_pd(-0.0), a.v)}; }
inline LaneMask operator<(Lanes a, Lanes b) { return {_mm256_cmp_pd(a.v, b.v, _CMP_LT_OQ)}; }
inline LaneMask operator>(Lanes a, Lanes b) { return {_mm256_cmp_pd(a.v, b.v, _CMP_GT_OQ)}; }
inline LaneMask operator<=(Lanes a, Lanes b) { return {_mm256_cmp_pd(a.v, b.v, _CMP_LE_OQ)}; }
inline LaneMask notGreater(Lanes a, Lanes b) { return {_mm256_cmp_pd(a.v, b.v, _CMP_NGT_UQ)}; }
inline LaneMask operator|(LaneMask a, LaneMask b) { return {_mm256_or_pd(a.m, b.m)}; }
inline LaneMask operator&(LaneMask a, LaneMask b) { return {_mm256_and_pd(a.m, b.m)}; }
inline Lanes select(LaneMask m, Lanes whenTrue, Lanes whenFalse) { return {_mm256_blendv_pd(whenFalse.v, whenTrue.v, m.m)}; }
inline LaneMask operator~(LaneMask a) { return {_mm256_xor_pd(a.m, _mm256_castsi256_pd(_mm256_set1_epi64x(-1)))}; }
inline unsigned bits(LaneMask m) { return static_cast<unsigned>(_mm256_movemask_pd(m.m)); }
inline LaneMask noLanes() { return {_mm256_setzero_pd()}; }

#else
#error "simd_lanes.h needs -mavx2 -mfma or -mavx512f (set per file in core/CMakeLists.txt)"
#endif

inline Lanes operator-(Lanes a) { return splat(0.0) - a; }
inline Lanes operator*(double s, Lanes a) { return splat(s) * a; }
inline Lanes& operator+=(Lanes& a, Lanes b) { return a = a + b; }
inline Lanes& operator-=(Lanes& a, Lanes b) { return a = a - b; }

/// A complex number per lane (real arithmetic only: real and imaginary parts side by side).
struct ComplexLanes {
  Lanes re, im;
};
inline ComplexLanes operator+(ComplexLanes a, ComplexLanes b) { return {a.re + b.re, a.im + b.im}; }
inline ComplexLanes operator-(ComplexLanes a, ComplexLanes b) { return {a.re - b.re, a.im - b.im}; }
inline ComplexLanes operator-(ComplexLanes a) { return {-a.re, -a.im}; }
inline ComplexLanes operator*(ComplexLanes a, ComplexLanes b) {
  return {a.re * b.re - a.im * b.im, a.re * b.im + a.im * b.re};
}
inline ComplexLanes operator*(Lanes s, ComplexLanes a) { return {s * a.re, s * a.im}; }
inline ComplexLanes conj(ComplexLanes a) { return {a.re, -a.im}; }
inline Lanes norm(ComplexLanes a) { return a.re * a.re + a.im * a.im; }  ///< |a|²
inline ComplexLanes select(LaneMask m, ComplexLanes t, ComplexLanes f) { return {select(m, t.re, f.re), select(m, t.im, f.im)}; }

}  // namespace
}  // namespace finestra
