// Read-out schemes for the structural hot-spot stress: where to read the surface stress (distances from the weld
// toe) and how to combine the readings into the hot-spot stress (weights), for IIW type a and type b hot spots,
// the ship-rule single point, and user-defined points. See docs/readout-schemes.md for the table and sources.
#pragma once

#include "toehold/common/tensor.hpp"

#include <string>
#include <string_view>
#include <vector>

namespace toehold {

// IIW 2016 sec. 3.3 (from memory): where the hot spot sits relative to the plate.
enum class HotSpotType {
  a,  // toe on the plate surface: read-out distances scale with the plate thickness t
  b,  // toe at the plate edge: read-out distances are fixed in mm, independent of t
};

// The read-out schemes toehold knows. Valid combinations with HotSpotType:
//   type a: fine_linear, fine_quadratic, coarse_linear, ship_single_point
//   type b: type_b_fine, type_b_coarse, ship_single_point
//   either: user (built by make_user_scheme only)
enum class SchemeKind {
  fine_linear,        // type a, fine mesh (<= 0.4t): 0.4t, 1.0t, linear extrapolation
  fine_quadratic,     // type a, fine mesh (<= 0.4t): 0.4t, 0.9t, 1.4t, quadratic extrapolation
  coarse_linear,      // type a, coarse mesh (t x t, higher-order elements): 0.5t, 1.5t, linear
  type_b_fine,        // type b, fine mesh (<= 4 mm): 4, 8, 12 mm, quadratic extrapolation
  type_b_coarse,      // type b, coarse mesh (10 x 10 mm): 5, 15 mm, linear extrapolation
  ship_single_point,  // ship rules, simplified: 1.12 x s(t/2) for type a, 1.12 x s(5 mm) for type b
  user,               // user-defined read-out distances (Lagrange extrapolation) or one point times a factor
};

struct ReadoutScheme {
  SchemeKind kind = SchemeKind::user;
  HotSpotType type = HotSpotType::a;
  std::vector<double> distances;  // mm from the toe, along the plate surface perpendicular to the toe, ascending
  std::vector<double> weights;    // hot-spot stress = sum_i weights[i] * s(distances[i]); one per distance
  std::string label;              // e.g. "IIW type a, fine mesh, linear (0.4t, 1.0t)"
  std::string source;             // e.g. "IIW 2016 sec. 3.3 (from memory)"
};

// The published scheme `kind` for hot-spot `type`.
//   thickness_mm: plate thickness t in mm (the plate whose surface carries the toe); used by type a schemes only
//   and ignored for type b, whose distances are fixed in mm.
// Weights come from lagrange_weights(0, distances), except the ship rule's single factor 1.12.
// Throws Error for SchemeKind::user (use make_user_scheme), for a kind that does not exist for `type` (the message
// lists the ones that do), and for a type a thickness that is not a positive finite number.
ReadoutScheme make_scheme(SchemeKind kind, HotSpotType type, double thickness_mm);

// A user-defined scheme.
//   distances_mm: read-out distances from the toe in mm, positive, finite, strictly ascending, at least one.
//   factor: multiplies the result (dimensionless, positive). With one distance the hot-spot stress is
//     factor x s(distance); with two or more it is factor x (Lagrange extrapolation to the toe).
// Throws Error naming the offending distance (zero or negative, not finite, repeated, out of order) or factor.
ReadoutScheme make_user_scheme(std::vector<double> distances_mm, HotSpotType type, double factor = 1.0);

// Hot-spot value from the stresses read at the scheme's distances (same order, one per distance), scalar (MPa)
// or full tensor (component-wise). Throws Error when the number of readings does not match.
double extrapolate(const ReadoutScheme& scheme, const std::vector<double>& readings);
Tensor extrapolate(const ReadoutScheme& scheme, const std::vector<Tensor>& readings);

// Recommended element size for the scheme, for mesh diagnostics.
struct MeshRule {
  double max_element_size_mm = 0;  // largest element edge at the toe that the scheme's source asks for, mm
  std::string text;                // the rule in words, with its source
};
// Rule: fine type a <= 0.4t, coarse type a t x t, type b fine 4 mm, type b coarse 10 x 10 mm, ship single point
// t x t (type a) or 10 x 10 mm (type b); user schemes get a common-practice bound (element no larger than the first
// read-out distance). t: plate thickness in mm, needed (positive) for type a schemes, ignored for type b.
MeshRule mesh_rule(const ReadoutScheme& scheme, double thickness_mm);

// The strings users type, in one place. Scheme names: fine-linear, fine-quadratic, coarse-linear, type-b-fine,
// type-b-coarse, ship-single-point, user (an underscore may stand for each hyphen). Types: a, b.
// Parsing throws Error naming `where` (e.g. "plan key toe.readout") and listing the accepted spellings.
SchemeKind parse_scheme_kind(std::string_view text, const std::string& where);
std::string to_string(SchemeKind kind);
HotSpotType parse_hot_spot_type(std::string_view text, const std::string& where);
std::string to_string(HotSpotType type);

}  // namespace toehold
