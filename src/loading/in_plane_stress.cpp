#include "toehold/loading/in_plane_stress.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>

namespace toehold {
namespace {

// Same constants as the hot-spot definitions (src/hotspot/definition.cpp): DNVGL-RP-C203 2016 sec. 4.3.4 shear
// factor (from memory [M]), the negligible-principal fraction and the window slack.
constexpr double kShearFactor = 0.81;
constexpr double kNegligible = 1e-9;
constexpr double kAngleSlack = 1e-9;

double wrap_axis(double deg) {
  while (deg <= -90.0) deg += 180.0;
  while (deg > 90.0) deg -= 180.0;
  return deg;
}

struct Principal {
  double s1, s2, angle1, angle2;
};

// Mohr's circle in the (readout, tangent) plane, as in_plane_principal does it.
Principal principal_of(const InPlaneStress& s) {
  const double centre = 0.5 * (s.rr + s.tt), half = 0.5 * (s.rr - s.tt);
  const double radius = std::hypot(half, s.rt);
  const double angle1 = wrap_axis(0.5 * std::atan2(s.rt, half) * 180.0 / std::numbers::pi);
  return {centre + radius, centre - radius, angle1, wrap_axis(angle1 + 90.0)};
}

}  // namespace

InPlaneStress in_plane(const Tensor& s, const ToeFrame& frame) {
  const Vec3 sr = s * frame.readout;
  return {frame.readout.dot(sr), frame.tangent.dot(s * frame.tangent), frame.tangent.dot(sr)};
}

Tensor tensor_of(const InPlaneStress& s, const ToeFrame& frame) {
  const Vec3& r = frame.readout;
  const Vec3& t = frame.tangent;
  return s.rr * r * r.transpose() + s.tt * t * t.transpose() + s.rt * (r * t.transpose() + t * r.transpose());
}

HotSpotScalar::HotSpotScalar(HotSpotDefinition definition, const DefinitionOptions& options)
    : definition_(definition), options_(options) {
  evaluate(definition, Tensor::Zero(), ToeFrame{}, options);  // throws for options out of range
}

double HotSpotScalar::operator()(const InPlaneStress& s, bool* valid) const {
  if (valid != nullptr) *valid = true;
  switch (definition_) {
    case HotSpotDefinition::perpendicular: return s.rr;
    case HotSpotDefinition::principal: return principal(s, valid);
    case HotSpotDefinition::effective: return effective(s);
  }
  return s.rr;
}

double HotSpotScalar::principal(const InPlaneStress& s, bool* valid) const {
  const Principal p = principal_of(s);
  const double scale = std::max(std::abs(p.s1), std::abs(p.s2));
  if (scale == 0) return 0.0;
  const auto in_window = [&](double value, double angle) {
    return std::abs(angle) <= options_.window_deg + kAngleSlack && std::abs(value) > kNegligible * scale;
  };
  const bool in1 = in_window(p.s1, p.angle1), in2 = in_window(p.s2, p.angle2);
  if (in1 && in2) return std::abs(p.s1) >= std::abs(p.s2) ? p.s1 : p.s2;
  if (in1) return p.s1;
  if (in2) return p.s2;
  if (valid != nullptr) *valid = false;
  return 0.0;
}

double HotSpotScalar::effective(const InPlaneStress& s) const {
  const Principal p = principal_of(s);
  const double combined = std::sqrt(s.rr * s.rr + kShearFactor * s.rt * s.rt);
  return std::max({combined, options_.alpha * std::abs(p.s1), options_.alpha * std::abs(p.s2)});
}

}  // namespace toehold
