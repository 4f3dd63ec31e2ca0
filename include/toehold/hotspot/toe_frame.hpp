// The local frame at a point of the weld toe in which hot-spot stresses are defined: along the toe, the plate
// surface normal, and the read-out direction across the toe away from the weld.
#pragma once

#include "toehold/common/tensor.hpp"

#include <string>

namespace toehold {

// Three orthonormal vectors in model coordinates (dimensionless).
//   tangent: along the toe line (either sense).
//   normal:  outward normal of the plate surface that carries the toe.
//   readout: in the surface plane, perpendicular to the toe, pointing away from the weld (where the read-out
//            points lie).
// Handedness is not fixed: (readout, tangent, normal) may be right- or left-handed depending on the sense of the
// tangent. The hot-spot definitions use the frame only through quadratic forms and squared shear, so both
// senses give the same values; only the sign of a reported angle (measured from readout towards tangent) flips.
struct ToeFrame {
  Vec3 tangent = Vec3::UnitX();
  Vec3 normal = Vec3::UnitZ();
  Vec3 readout = Vec3::UnitY();
};

// Builds a frame from rough directions (model coordinates, any length):
//   tangent: along the toe; it is made perpendicular to the normal and keeps its sense.
//   normal: the plate surface normal, kept as given (normalized).
//   away_from_weld: any vector pointing from the weld towards the plate; only its side matters.
// readout = +-(normal x tangent), the sign chosen so that readout . away_from_weld > 0.
// Throws Error naming `where` when a vector is zero or not finite, the tangent is parallel to the normal, or
// away_from_weld lies along the toe (no side can be told).
ToeFrame make_toe_frame(const Vec3& tangent, const Vec3& normal, const Vec3& away_from_weld, const std::string& where);

// Throws Error naming `where` unless the three vectors are unit length and mutually perpendicular within `tol`
// (dimensionless, on lengths and dot products).
void check_toe_frame(const ToeFrame& frame, const std::string& where, double tol = 1e-6);

}  // namespace toehold
