// The stress at a toe point reduced to what the hot-spot definitions use: the in-plane components in the toe
// frame. Compact (3 numbers per station and step) and linear in the tensor, so unit load cases combine component
// by component; HotSpotScalar applies a definition to millions of combined values without allocating.
#pragma once

#include "toehold/common/tensor.hpp"
#include "toehold/hotspot/definition.hpp"
#include "toehold/hotspot/toe_frame.hpp"

namespace toehold {

// In-plane stress components at a toe point, MPa: rr = readout . S . readout (across the toe), tt = tangent . S .
// tangent (along it), rt = readout . S . tangent (in-plane shear).
struct InPlaneStress {
  double rr = 0.0, tt = 0.0, rt = 0.0;

  InPlaneStress& operator+=(const InPlaneStress& o) {
    rr += o.rr, tt += o.tt, rt += o.rt;
    return *this;
  }
  friend InPlaneStress operator*(double c, const InPlaneStress& s) { return {c * s.rr, c * s.tt, c * s.rt}; }
  friend InPlaneStress operator-(const InPlaneStress& a, const InPlaneStress& b) {
    return {a.rr - b.rr, a.tt - b.tt, a.rt - b.rt};
  }
};

// The components of `s` (MPa, model coordinates) in `frame` (orthonormal).
InPlaneStress in_plane(const Tensor& s, const ToeFrame& frame);
// A tensor with exactly these in-plane components in `frame` and zero components along the surface normal: every
// hot-spot definition gives the same value for it as for the tensor the components came from.
Tensor tensor_of(const InPlaneStress& s, const ToeFrame& frame);

// A hot-spot definition as a plain function of the in-plane components, equal to toehold::evaluate (same
// candidate rules and window for principal, same terms for effective) but without checks or notes, for long
// histories. Options are checked once, at construction (Error as evaluate would throw).
class HotSpotScalar {
public:
  HotSpotScalar(HotSpotDefinition definition, const DefinitionOptions& options);
  // The hot-spot stress, MPa. principal without a candidate in the window: 0, and `valid` (if given) false.
  double operator()(const InPlaneStress& s, bool* valid = nullptr) const;

private:
  double principal(const InPlaneStress& s, bool* valid) const;
  double effective(const InPlaneStress& s) const;
  HotSpotDefinition definition_;
  DefinitionOptions options_;
};

}  // namespace toehold
