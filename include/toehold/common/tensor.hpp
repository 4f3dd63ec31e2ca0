// Symmetric stress tensors: the 3x3 matrix used everywhere inside toehold and its six-value Voigt form.
// Internal Voigt order is xx, yy, zz, xy, yz, xz; stresses are in MPa, tension positive.
#pragma once

#include <Eigen/Core>
#include <Eigen/Geometry>

#include <array>

namespace toehold {

using Vec3 = Eigen::Vector3d;
using Tensor = Eigen::Matrix3d;  // symmetric Cauchy stress, MPa
using Voigt = std::array<double, 6>;  // xx, yy, zz, xy, yz, xz in MPa

// Internal Voigt order as indices into the 3x3 matrix (row, column).
inline constexpr std::array<std::array<int, 2>, 6> kVoigtIndex{{{0, 0}, {1, 1}, {2, 2}, {0, 1}, {1, 2}, {0, 2}}};

inline Tensor tensor_from_voigt(const double* v) {
  Tensor s;
  s << v[0], v[3], v[5],  //
      v[3], v[1], v[4],   //
      v[5], v[4], v[2];
  return s;
}

inline Voigt voigt_from_tensor(const Tensor& s) {
  return {s(0, 0), s(1, 1), s(2, 2), s(0, 1), s(1, 2), s(0, 2)};
}

// Normal stress n.S.n on the plane with unit normal n (MPa).
inline double normal_stress(const Tensor& s, const Vec3& n) { return n.dot(s * n); }

}  // namespace toehold
