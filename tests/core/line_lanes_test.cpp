// The lane kernel (several field directions per call, AVX2 / AVX-512) against the scalar closed
// form it is written from (LineGridKernel::evaluate), on random fields and on the points where the
// closed form is delicate: exact Kramers degeneracy at B = 0, fields along the defect axis, and
// fields just beside level anticrossings. Every instruction set this CPU runs is checked; the
// double-precision lanes must agree to 1e-9 GHz.
#include <gtest/gtest.h>

#include <random>

#include "core/optics/middle_gaps.h"
#include "core/project/model_setup.h"
#include "core/optics/line_grid.h"

using namespace finestra;

namespace {

CentreModel centre(const std::string& preset) {
  Project p;
  p.centre.preset = preset;
  if (preset == "PbV-") {  // unknown in the preset; any value serves here
    p.centre.overrides["lambda_u_GHz"] = 12000.0;
    p.centre.overrides["lifetime_ns"] = 5.0;
  }
  p.strain.crystal = strainFromComponents(2e-5, -1e-5, 4e-6, 6e-6, -3e-6, 9e-6);
  return CentreModel(makeModelSetup(p));
}

std::vector<LaneSet> laneSets() {
  std::vector<LaneSet> sets;
  for (LaneSet s : {LaneSet::Avx2, LaneSet::Avx512})
    if (laneSetSupported(s)) sets.push_back(s);
  return sets;
}

// Smallest gap between neighbouring levels of either manifold of class `cls` at `field`.
double smallestGap(const CentreModel& model, int cls, const Vec3& field) {
  double gap = 1e300;
  for (Manifold m : {Manifold::Ground, Manifold::Excited}) {
    const auto h = LinearHamiltonian4::sample(model.manifold(m), model.strainFor(m, cls), defectFrame(cls));
    const Vector4r e = quarticLevels(PauliForm4::fromLinear(h), field);
    for (int i = 0; i < 3; ++i) gap = std::min(gap, e[i + 1] - e[i]);
  }
  return gap;
}

// Fields beside the narrowest approaches of levels along a few directions (|B| up to 40 T).
std::vector<Vec3> nearAnticrossings(const CentreModel& model, int cls, std::mt19937& rng) {
  std::normal_distribution<double> n;
  std::vector<Vec3> fields;
  for (int direction = 0; direction < 3; ++direction) {
    const Vec3 d = Vec3(n(rng), n(rng), n(rng)).normalized();
    double best = 1e300, bestMagnitude = 0;
    for (int k = 1; k <= 4000; ++k) {
      const double gap = smallestGap(model, cls, 0.01 * k * d);
      if (gap < best) best = gap, bestMagnitude = 0.01 * k;
    }
    for (double offset : {-1e-2, -1e-4, -1e-6, 0.0, 1e-6, 1e-4, 1e-2}) fields.push_back((bestMagnitude + offset) * d);
  }
  return fields;
}

void expectLanesEqualScalar(const LineGridKernel& kernel, int cls, const std::vector<Vec3>& fields, LaneSet set,
                            const std::string& what) {
  std::vector<LineGridPoint> lanes(fields.size());
  kernel.evaluateMany(cls, fields.data(), static_cast<long>(fields.size()), lanes.data(), 1, set);
  for (std::size_t k = 0; k < fields.size(); ++k) {
    LineGridPoint scalar;
    kernel.evaluate(cls, fields[k], scalar);
    for (std::size_t line = 0; line < 16; ++line) {
      ASSERT_NEAR(lanes[k].frequencyGHz[line], scalar.frequencyGHz[line], 1e-9)
          << what << " class " << cls << " field " << fields[k].transpose() << " line " << line;
      // Intensities come from eigenvectors, whose rounding grows as scale/gap: at mT fields a
      // PbV- Kramers pair is split by ~1e-5 of λ, leaving both paths about 1e-9 apart.
      for (std::size_t axis = 0; axis < 3; ++axis)
        ASSERT_NEAR(lanes[k].intensityCrystal[line][axis], scalar.intensityCrystal[line][axis], 1e-8)
            << what << " class " << cls << " field " << fields[k].transpose() << " line " << line;
    }
  }
}

}  // namespace

TEST(LineLanes, EqualScalarClosedFormOnRandomAndDegeneratePointsForEveryCentre) {
  const std::vector<LaneSet> sets = laneSets();
  if (sets.empty()) GTEST_SKIP() << "this CPU has neither AVX2 nor AVX-512";
  for (const std::string preset : {"SiV-", "GeV-", "SnV-", "PbV-"}) {
    const CentreModel model = centre(preset);
    const LineGridKernel kernel(model);
    std::mt19937 rng(17);
    std::normal_distribution<double> n;
    for (int cls = 0; cls < 4; ++cls) {
      std::vector<Vec3> random, special{Vec3::Zero()};
      for (int k = 0; k < 203; ++k)  // an odd count: the last batch is partly filled
        random.push_back(std::pow(10.0, -4.0 + 5.5 * (k % 11) / 10.0) * Vec3(n(rng), n(rng), n(rng)).normalized());
      const Vec3 axis = defectFrame(cls).row(2).transpose();
      for (double magnitude : {1e-6, 0.1, 1.0, 5.0, 17.1}) special.push_back(magnitude * axis);
      for (const Vec3& b : nearAnticrossings(model, cls, rng)) special.push_back(b);
      for (LaneSet set : sets) {
        expectLanesEqualScalar(kernel, cls, random, set, preset + " random");
        expectLanesEqualScalar(kernel, cls, special, set, preset + " degenerate/axis/anticrossing");
      }
    }
  }
}

// The lanes are a real kernel, not a pass-through to the scalar path: at generic fields nearly
// every point is finished in the lanes; at zero field (Kramers pairs) every point is handed back.
TEST(LineLanes, FinishGenericPointsAndHandBackKramersPairs) {
  const std::vector<LaneSet> sets = laneSets();
  if (sets.empty()) GTEST_SKIP() << "this CPU has neither AVX2 nor AVX-512";
  const CentreModel model = centre("SiV-");
  const LineGridKernel kernel(model);
  std::mt19937 rng(4);
  std::normal_distribution<double> n;
  std::vector<Vec3> generic, zero(16, Vec3::Zero());
  for (int k = 0; k < 1000; ++k) generic.push_back(0.5 * Vec3(n(rng), n(rng), n(rng)).normalized());
  std::vector<LineGridPoint> out(generic.size());
  for (LaneSet set : sets) {
    EXPECT_LT(kernel.evaluateMany(1, generic.data(), 1000, out.data(), 1, set), 20);
    EXPECT_EQ(kernel.evaluateMany(1, zero.data(), 16, out.data(), 1, set), 16);
  }
}

TEST(LineLanes, BestSetIsSupportedAndScalarAlwaysIs) {
  EXPECT_TRUE(laneSetSupported(LaneSet::Scalar));
  EXPECT_TRUE(laneSetSupported(bestLaneSet()));
}

// The planner's anticrossing scan: the batched middle gap equals the scalar quartic to 1e-9 GHz
// along rays through zero field, the axis and past anticrossings, for every centre.
TEST(LineLanes, MiddleGapsEqualTheScalarQuartic) {
  for (const std::string preset : {"SiV-", "GeV-", "SnV-", "PbV-"}) {
    const CentreModel model = centre(preset);
    std::mt19937 rng(23);
    std::normal_distribution<double> n;
    for (int cls = 0; cls < 4; ++cls)
      for (Manifold m : {Manifold::Ground, Manifold::Excited}) {
        const auto h = LinearHamiltonian4::sample(model.manifold(m), model.strainFor(m, cls), defectFrame(cls));
        const PauliForm4 form = PauliForm4::fromLinear(h);
        ASSERT_TRUE(form.closedForm);
        for (const Vec3& d : {Vec3(defectFrame(cls).row(2).transpose()), Vec3(n(rng), n(rng), n(rng)).normalized()}) {
          std::vector<Vec3> fields;
          for (int k = 0; k < 101; ++k) fields.push_back(0.4 * k * d);  // 0..40 T
          std::vector<double> gaps(fields.size());
          quarticMiddleGaps(form, fields.data(), static_cast<int>(fields.size()), gaps.data());
          for (std::size_t k = 0; k < fields.size(); ++k)
            ASSERT_NEAR(gaps[k], quarticMiddleGap(form, fields[k]), 1e-9) << preset << " class " << cls << " k " << k;
        }
      }
  }
}
