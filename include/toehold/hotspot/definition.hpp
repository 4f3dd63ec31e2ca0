// Which stress at the toe counts as the structural hot-spot stress: the normal stress across the toe, the
// principal stress acting roughly across the toe, or the offshore effective stress. Also: ranges between two
// load steps, formed from the tensor difference first.
#pragma once

#include "toehold/common/tensor.hpp"
#include "toehold/hotspot/toe_frame.hpp"

#include <string>
#include <string_view>

namespace toehold {

enum class HotSpotDefinition {
  perpendicular,  // readout . S . readout: the normal stress perpendicular to the toe line
  principal,      // the in-plane principal stress within +-window of the read-out direction (IIW)
  effective,      // DNVGL-RP-C203 2016 sec. 4.3.4 effective hot-spot stress (a magnitude, never negative)
};

struct DefinitionOptions {
  // principal: half-width of the angular window around the read-out direction, degrees, in (0, 90].
  // 60 deg = principal stress acting between 30 and 90 deg to the toe line (Niemi, Fricke, Maddox 2018 ch. 2).
  double window_deg = 60.0;
  // effective: factor alpha on the principal stresses, dimensionless, in (0, 1]. DNVGL-RP-C203 2016 sec. 4.3.4
  // (from memory): 0.90 detail class C2, 0.80 C1, 0.72 C. Default 0.90, the largest and so the conservative one.
  double alpha = 0.90;
};

// alpha for the effective hot-spot stress from the detail class the weld has for stress along it: "C2" 0.90,
// "C1" 0.80, "C" 0.72 (DNVGL-RP-C203 2016 sec. 4.3.4, from memory). Throws Error naming `where` otherwise.
double effective_alpha(std::string_view detail_class, const std::string& where);

struct HotSpotValue {
  double value = 0;      // MPa; 0 when not valid
  bool valid = true;     // false when the definition has no answer (principal: no candidate in the window)
  double angle_deg = 0;  // direction of the governing stress, degrees from readout towards tangent, in (-90, 90]
  std::string note;      // why not valid, or a remark on the choice made; empty when nothing to say
};

// In-plane principal stresses of s in the plane spanned by readout and tangent (the plate surface; the
// components along the surface normal are ignored, the surface being traction-free). s1 >= s2, MPa; angles in
// degrees from readout towards tangent, in (-90, 90]. Equal principal values: s1 along readout.
struct InPlanePrincipal {
  double s1 = 0, s2 = 0;
  double angle1_deg = 0, angle2_deg = 0;
};
InPlanePrincipal in_plane_principal(const Tensor& s, const ToeFrame& frame);

// The hot-spot stress of tensor s (MPa, model coordinates, tension positive) at a toe point with frame `frame`.
//   perpendicular: value = readout . s . readout, angle 0.
//   principal: candidates are the in-plane principal stresses whose direction lies within +-window_deg of readout
//     (bounds included) and which are not zero (below 1e-9 of the larger one). One candidate: taken. Two: the one
//     of larger magnitude (equal magnitudes: the tensile one), with a note. None: valid = false, value 0, and a
//     note naming both principal stresses. A note also flags a larger principal stress outside the window.
//   effective: value = max{ sqrt(s_perp^2 + 0.81 tau_par^2), alpha |s1|, alpha |s2| } with s_perp =
//     readout . s . readout, tau_par = readout . s . tangent (DNVGL-RP-C203 2016 sec. 4.3.4, from memory); the
//     note says which term governs.
// Throws Error for non-finite components, a frame that is not orthonormal, or options out of range.
HotSpotValue evaluate(HotSpotDefinition definition, const Tensor& s, const ToeFrame& frame,
                      const DefinitionOptions& options);

// Range between two load steps A and B (tensors as for evaluate).
struct HotSpotRange {
  HotSpotValue range;   // the definition applied to the tensor difference B - A (signed, except effective)
  HotSpotValue step_a;  // the definition applied to A alone
  HotSpotValue step_b;  // the definition applied to B alone
};
// The range comes from the difference tensor, not from the difference of the two steps' values: when the
// principal direction turns between the steps, the two differ. For perpendicular, range.value equals
// step_b.value - step_a.value.
HotSpotRange evaluate_range(HotSpotDefinition definition, const Tensor& step_a, const Tensor& step_b,
                            const ToeFrame& frame, const DefinitionOptions& options);

// The strings users type, in one place: perpendicular, principal, effective. Throws Error naming `where` and
// listing them.
HotSpotDefinition parse_hot_spot_definition(std::string_view text, const std::string& where);
std::string to_string(HotSpotDefinition definition);

}  // namespace toehold
