#include "toehold/hotspot/toe_frame.hpp"

#include "toehold/common/error.hpp"

#include <Eigen/Geometry>

#include <cmath>

namespace toehold {
namespace {

// Relative size below which a vector counts as zero after a projection.
constexpr double kDegenerate = 1e-9;

Vec3 unit(const Vec3& v, const std::string& where, const char* what) {
  const double n = v.norm();
  if (!std::isfinite(n)) throw Error(where + ": toe frame " + what + " direction is not finite");
  if (n == 0) throw Error(where + ": toe frame " + what + " direction is zero; give a nonzero vector");
  return v / n;
}

}  // namespace

ToeFrame make_toe_frame(const Vec3& tangent, const Vec3& normal, const Vec3& away_from_weld, const std::string& where) {
  ToeFrame f;
  f.normal = unit(normal, where, "normal");
  const Vec3 t = unit(tangent, where, "tangent");
  const Vec3 in_plane = t - t.dot(f.normal) * f.normal;
  if (in_plane.norm() <= kDegenerate)
    throw Error(where + ": toe tangent is parallel to the surface normal; the toe must run along the surface");
  f.tangent = in_plane.normalized();
  const Vec3 away = unit(away_from_weld, where, "away-from-weld");
  f.readout = f.normal.cross(f.tangent);
  const double side = f.readout.dot(away);
  if (std::abs(side) <= kDegenerate)
    throw Error(where + ": the away-from-weld direction lies along the toe or the normal; give a vector pointing "
                        "from the weld into the plate");
  if (side < 0) f.readout = -f.readout;
  return f;
}

void check_toe_frame(const ToeFrame& f, const std::string& where, double tol) {
  const bool unit_lengths = std::abs(f.tangent.norm() - 1) <= tol && std::abs(f.normal.norm() - 1) <= tol &&
                            std::abs(f.readout.norm() - 1) <= tol;
  if (!unit_lengths) throw Error(where + ": toe frame vectors are not of unit length; build the frame with make_toe_frame");
  const bool orthogonal = std::abs(f.tangent.dot(f.normal)) <= tol && std::abs(f.tangent.dot(f.readout)) <= tol &&
                          std::abs(f.normal.dot(f.readout)) <= tol;
  if (!orthogonal)
    throw Error(where + ": toe frame vectors are not mutually perpendicular; build the frame with make_toe_frame");
}

}  // namespace toehold
