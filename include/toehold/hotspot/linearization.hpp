// Through-thickness linearization of the stress along a line across the plate at the toe (ASME BPVC VIII-2
// Annex 5-A): membrane, bending and peak parts, the structural stress at the toe surface, and the stress 1 mm
// below the surface (Xiao and Yamada, Int. J. Fatigue 26, 2004). Scalars or full tensors (component-wise).
#pragma once

#include "toehold/common/tensor.hpp"

#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace toehold {

// Where along the line to sample, and how the samples are integrated. x runs from 0 at the toe surface to t at
// the opposite surface; both rules include both surfaces.
enum class ThroughThicknessRule {
  gauss_lobatto,  // n Gauss-Lobatto points (3 <= n <= 64): exact for fields of degree <= 2n - 4
  simpson,        // n equally spaced points, n odd (3 <= n <= 100001): composite Simpson, exact to degree 2
};

// Sample positions x (mm, ascending, x[0] = 0, x[n-1] = t) for `n` stations on a line of length t (mm).
// Throws Error for t not positive and finite, or n outside the rule's range (even n for simpson).
std::vector<double> linearization_stations(double t, int n,
                                           ThroughThicknessRule rule = ThroughThicknessRule::gauss_lobatto);

// Linearized stress, MPa. Formulas (ASME BPVC VIII-2 Annex 5-A, x from the toe surface):
//   membrane   = (1/t) int_0^t s dx
//   bending    = (6/t^2) int_0^t s (t/2 - x) dx, the bending stress at x = 0: positive when bending puts the toe
//                surface in tension; the opposite surface carries membrane - bending
//   structural = membrane + bending (the hot-spot stress from linearization, at the toe surface)
//   peak       = s(0) - structural (the non-linear part at the toe surface)
//   one_mm_below = s(1 mm), interpolated through the samples (all of them for gauss_lobatto, the Simpson panel
//                around 1 mm for simpson); empty when t < 1 mm.
struct Linearized {
  double membrane = 0;
  double bending = 0;
  double structural = 0;
  double peak = 0;
  std::optional<double> one_mm_below;
};
struct LinearizedTensor {  // the same, each a tensor (MPa, model coordinates), component by component
  Tensor membrane = Tensor::Zero();
  Tensor bending = Tensor::Zero();
  Tensor structural = Tensor::Zero();
  Tensor peak = Tensor::Zero();
  std::optional<Tensor> one_mm_below;
};

// Linearizes samples s[i] (MPa) taken at x_mm[i], which must be linearization_stations(t, x_mm.size(), rule)
// (within 1e-6 t). Throws Error when the sizes differ, a sample is not at its station, or a value is not finite.
Linearized linearize(const std::vector<double>& x_mm, const std::vector<double>& s, double t,
                     ThroughThicknessRule rule = ThroughThicknessRule::gauss_lobatto);
LinearizedTensor linearize(const std::vector<double>& x_mm, const std::vector<Tensor>& s, double t,
                           ThroughThicknessRule rule = ThroughThicknessRule::gauss_lobatto);

// The strings users type, in one place: gauss-lobatto, simpson. Throws Error naming `where` and listing them.
ThroughThicknessRule parse_through_thickness_rule(std::string_view text, const std::string& where);
std::string to_string(ThroughThicknessRule rule);

}  // namespace toehold
