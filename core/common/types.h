#pragma once
// Scalar and small linear-algebra types shared by every core module.
#include <Eigen/Dense>
#include <complex>

namespace finestra {

using cplx = std::complex<double>;
using Vec3 = Eigen::Vector3d;
using Mat3 = Eigen::Matrix3d;
using CVec3 = Eigen::Matrix<cplx, 3, 1>;
using Matrix4c = Eigen::Matrix<cplx, 4, 4>;
using Vector4r = Eigen::Matrix<double, 4, 1>;
using MatrixXc = Eigen::MatrixXcd;
using VectorXr = Eigen::VectorXd;

/// The two electronic manifolds of a centre: ground (²E_g) and excited (²E_u).
enum class Manifold { Ground, Excited };

inline const char* manifoldSuffix(Manifold m) { return m == Manifold::Ground ? "g" : "u"; }

}  // namespace finestra
