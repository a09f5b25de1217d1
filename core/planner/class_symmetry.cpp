#include "core/planner/class_symmetry.h"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <numbers>
#include <numeric>

namespace finestra {
namespace {

constexpr double kTieTolerance = 1e-9;

Vec3 axisVector(int cls) {
  const auto a = classAxisIndices(cls);
  return Vec3(a[0], a[1], a[2]);
}

// Why equal |cos| is an exact equivalence (docs/physics.md, Orientation classes). For two ⟨111⟩
// axes a, b the vectors a − b and a + b are 2·⟨110⟩ and 2·⟨100⟩ (e.g. [111] ∓ [1-1-1] = [022],
// [200]). If B·a = s B·b, the field lies in the plane normal to a − s b, and the reflection in
// that plane, a symmetry of the cubic diamond lattice (point group m-3m; the {100} reflections are
// glide planes of the space group, which also map the lattice onto itself), maps axis a onto s b:
// it carries a centre of one class onto a centre of the other. The field, an axial vector in the
// mirror plane, goes to −B; time reversal (Kramers) then gives the same levels, lines and decay
// ratios at +B. So every figure built from levels and optical dipoles (qubit, gaps, cyclicity,
// positions of lines) is equal for the two classes, for the strain-free centre of any model with
// the crystal's symmetry — not only for the axially symmetric Hamiltonian of Hepp et al., Phys.
// Rev. Lett. 112, 036405 (2014), where the figures depend on |cos| alone. Conversely unequal |cos|
// means unequal axis angles, so no symmetry can exchange the two. The microwave drive is a matrix
// element of b̂ (axial, like B), equal when the reflection maps b̂ to ±b̂: b̂ in the plane or
// along its normal. A strain that the reflection does not preserve lifts the equivalence.
std::array<int, 3> mirrorNormal(int i, int j, double si, double sj) {
  const Vec3 a = axisVector(i), b = axisVector(j);
  double s = (si * sj >= 0) ? 1.0 : -1.0;
  if (std::abs(si) < kTieTolerance && std::abs(sj) < kTieTolerance) {
    // Both perpendicular to the field: both reflections contain it; prefer the {110} mirror.
    const Vec3 minus = a - b;
    s = (std::abs(minus.x()) > 0.5) + (std::abs(minus.y()) > 0.5) + (std::abs(minus.z()) > 0.5) == 2 ? 1.0 : -1.0;
  }
  Vec3 n = (a - s * b) / 2.0;
  const int lead = std::abs(n.x()) > 0.5 ? 0 : (std::abs(n.y()) > 0.5 ? 1 : 2);
  if (n[lead] < 0) n = -n;  // a plane's indices up to sign: first non-zero index positive
  return {static_cast<int>(std::lround(n.x())), static_cast<int>(std::lround(n.y())),
          static_cast<int>(std::lround(n.z()))};
}

std::string indices(const std::array<int, 3>& v) {
  std::string out;
  for (int k : v) out += std::to_string(k);
  return out;
}

// Integer indices of v when it is a low-index direction, scaled to the smallest integers.
std::optional<std::array<int, 3>> lowIndices(const Vec3& v) {
  if (!v.allFinite() || v.norm() == 0) return std::nullopt;
  const double largest = v.cwiseAbs().maxCoeff();
  for (int scale = 1; scale <= 6; ++scale) {
    const Vec3 w = v / largest * scale;
    std::array<int, 3> n{};
    bool integral = true;
    for (int k = 0; k < 3; ++k) {
      n[static_cast<std::size_t>(k)] = static_cast<int>(std::lround(w[k]));
      if (std::abs(w[k] - n[static_cast<std::size_t>(k)]) > 1e-6 * scale) integral = false;
    }
    if (!integral) continue;
    const int g = std::gcd(std::gcd(std::abs(n[0]), std::abs(n[1])), std::abs(n[2]));
    for (int& x : n) x /= g;
    return n;
  }
  return std::nullopt;
}

std::string decimals(const Vec3& v) {
  const Vec3 u = v.normalized();
  char buf[96];
  std::snprintf(buf, sizeof buf, "%.3f %.3f %.3f", u.x(), u.y(), u.z());
  return buf;
}

std::string directionIndicesText(const Vec3& v) {
  const auto n = lowIndices(v);
  return n ? indices(*n) : decimals(v);
}

// Appended, not concatenated: GCC 12 warns falsely (-Wrestrict) on operator+ with a char literal.
std::string enclosed(char open, const std::string& body, char close) {
  std::string text(1, open);
  text += body;
  text += close;
  return text;
}

int findRoot(std::array<int, kClassCount>& parent, int k) {
  while (parent[static_cast<std::size_t>(k)] != k) k = parent[static_cast<std::size_t>(k)];
  return k;
}

}  // namespace

std::string millerPlane(const Vec3& normalCrystal) {
  return enclosed('(', directionIndicesText(normalCrystal), ')');
}

std::string millerDirection(const Vec3& directionCrystal) {
  return enclosed('[', directionIndicesText(directionCrystal), ']');
}

ClassSymmetry classSymmetryAt(const Vec3& fieldCrystal, const std::vector<int>& classes,
                              const std::optional<Vec3>& driveCrystal) {
  ClassSymmetry out;
  const Vec3 b = fieldCrystal.normalized();
  std::array<double, kClassCount> cosine{};  // B̂·â with â the unit axis
  for (int c = 0; c < kClassCount; ++c) cosine[static_cast<std::size_t>(c)] = b.dot(axisVector(c)) / std::sqrt(3.0);
  std::array<int, kClassCount> parent{0, 1, 2, 3};
  for (std::size_t x = 0; x < classes.size(); ++x)
    for (std::size_t y = x + 1; y < classes.size(); ++y) {
      const int i = std::min(classes[x], classes[y]), j = std::max(classes[x], classes[y]);
      const double ci = cosine[static_cast<std::size_t>(i)], cj = cosine[static_cast<std::size_t>(j)];
      if (std::abs(std::abs(ci) - std::abs(cj)) > kTieTolerance) continue;
      ClassTie tie;
      tie.first = i;
      tie.second = j;
      tie.mirrorNormal = mirrorNormal(i, j, ci, cj);
      tie.axisAngleDeg = std::acos(std::min(1.0, std::abs(ci))) * 180.0 / std::numbers::pi;
      if (driveCrystal && driveCrystal->norm() > 0) {
        const Vec3 d = driveCrystal->normalized();
        const Vec3 n = Vec3(tie.mirrorNormal[0], tie.mirrorNormal[1], tie.mirrorNormal[2]).normalized();
        tie.driveAlsoEqual = std::abs(d.dot(n)) < 1e-9 || d.cross(n).norm() < 1e-9;
      }
      out.ties.push_back(tie);
      parent[static_cast<std::size_t>(findRoot(parent, j))] = findRoot(parent, i);
    }
  std::vector<int> sorted = classes;
  std::sort(sorted.begin(), sorted.end());
  for (int c : sorted) {
    if (findRoot(parent, c) != c) continue;
    std::vector<int> group;
    for (int d : sorted)
      if (findRoot(parent, d) == c) group.push_back(d);
    out.groups.push_back(group);
  }
  std::sort(out.groups.begin(), out.groups.end());
  return out;
}

std::vector<int> groupOf(const ClassSymmetry& s, int cls) {
  for (const auto& g : s.groups)
    if (std::find(g.begin(), g.end(), cls) != g.end()) return g;
  return {cls};
}

std::string describeTie(const ClassTie& tie) {
  char angle[32];
  std::snprintf(angle, sizeof angle, "%.1f", tie.axisAngleDeg);
  const Vec3 n(tie.mirrorNormal[0], tie.mirrorNormal[1], tie.mirrorNormal[2]);
  return "classes " + std::to_string(tie.first) + " and " + std::to_string(tie.second) +
         " are mirror images in the " + millerPlane(n) + " plane, which contains the field: same angle to the field (" +
         angle + " deg), same levels, lines and cyclicity" +
         (tie.driveAlsoEqual ? " and the same drive" : "; the drive may differ (microwave direction off the mirror)");
}

std::string describeGroup(const ClassSymmetry& s, const std::vector<int>& group) {
  std::vector<const ClassTie*> ties;
  for (const ClassTie& t : s.ties)
    if (std::find(group.begin(), group.end(), t.first) != group.end()) ties.push_back(&t);
  if (ties.empty()) return "";
  if (group.size() == 2) return describeTie(*ties.front());
  std::string names, mirrors;
  bool driveEqual = true;
  for (std::size_t k = 0; k < group.size(); ++k)
    names += (k == 0 ? "" : (k + 1 == group.size() ? " and " : ", ")) + std::to_string(group[k]);
  for (const ClassTie* t : ties) {
    mirrors += (mirrors.empty() ? "" : ", ") + std::to_string(t->first) + "-" + std::to_string(t->second) + " in " +
               millerPlane(Vec3(t->mirrorNormal[0], t->mirrorNormal[1], t->mirrorNormal[2]));
    driveEqual = driveEqual && t->driveAlsoEqual;
  }
  char angle[32];
  std::snprintf(angle, sizeof angle, "%.1f", ties.front()->axisAngleDeg);
  return "classes " + names + " have the same angle to the field (" + angle +
         " deg): pairwise mirror images in crystal planes that contain the field (" + mirrors +
         "), so the same levels, lines and cyclicity" +
         (driveEqual ? " and the same drive" : "; the drive may differ for some pairs (microwave direction off their mirror)");
}

ReachSymmetry targetSymmetryOverReach(const std::vector<Vec3>& directionsCrystal, const std::vector<double>& weights,
                                      int targetClass, const std::vector<int>& classes) {
  ReachSymmetry out;
  if (directionsCrystal.empty()) return out;
  std::vector<int> always;
  for (int c : classes)
    if (c != targetClass) always.push_back(c);
  std::optional<std::array<int, 3>> commonMirror;
  bool mirrorShared = true;
  for (std::size_t k = 0; k < directionsCrystal.size(); ++k) {
    const ClassSymmetry s = classSymmetryAt(directionsCrystal[k], classes);
    const std::vector<int> group = groupOf(s, targetClass);
    if (group.size() == 1) out.targetAloneShare += weights.at(k);
    std::erase_if(always, [&](int c) { return std::find(group.begin(), group.end(), c) == group.end(); });
  }
  // The mirror behind the first permanent partner, when it is the same at every direction.
  for (std::size_t k = 0; k < directionsCrystal.size() && !always.empty(); ++k)
    for (const ClassTie& t : classSymmetryAt(directionsCrystal[k], classes).ties) {
      if (std::minmax(t.first, t.second) != std::minmax(targetClass, always.front())) continue;
      if (!commonMirror) commonMirror = t.mirrorNormal;
      else if (*commonMirror != t.mirrorNormal) mirrorShared = false;
    }
  out.alwaysTiedWith = always;
  if (out.targetAloneShare > 0) return out;
  std::string text = "class " + std::to_string(targetClass) + " cannot be singled out anywhere in the reachable set: ";
  if (!always.empty()) {
    text += "at every reachable direction it has the same angle to the field as class " + std::to_string(always.front());
    if (mirrorShared && commonMirror)
      text += " (mirror images in the " +
              millerPlane(Vec3((*commonMirror)[0], (*commonMirror)[1], (*commonMirror)[2])) +
              " plane, which contains every reachable field)";
  } else {
    text += "at every reachable direction another class has the same angle to the field";
  }
  text += "; a field tilted toward its own axis " + millerDirection(axisVector(targetClass)) +
          " singles it out (along the axis the other classes are at 70.5 deg)";
  out.warning = text;
  return out;
}

}  // namespace finestra
