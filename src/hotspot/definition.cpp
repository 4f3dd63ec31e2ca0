#include "toehold/hotspot/definition.hpp"

#include "toehold/common/error.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <numbers>
#include <sstream>
#include <utility>

namespace toehold {
namespace {

constexpr std::array<std::pair<std::string_view, HotSpotDefinition>, 3> kDefinitionNames{{
    {"perpendicular", HotSpotDefinition::perpendicular},
    {"principal", HotSpotDefinition::principal},
    {"effective", HotSpotDefinition::effective},
}};
// DNVGL-RP-C203 2016 sec. 4.3.4 (from memory).
constexpr std::array<std::pair<std::string_view, double>, 3> kAlpha{{{"C2", 0.90}, {"C1", 0.80}, {"C", 0.72}}};
constexpr double kShearFactor = 0.81;   // on tau_par^2, DNVGL-RP-C203 2016 sec. 4.3.4 (from memory)
constexpr double kNegligible = 1e-9;    // principal stress below this fraction of the larger one counts as zero
constexpr double kAngleSlack = 1e-9;    // degrees, so that a direction exactly on the window bound is inside

std::string number(double v) {
  std::ostringstream os;
  os << v;
  return os.str();
}

template <class Table>
std::string spellings(const Table& table) {
  std::string out;
  for (const auto& [name, value] : table) out += (out.empty() ? "" : ", ") + std::string(name);
  return out;
}

double degrees(double radians) { return radians * 180.0 / std::numbers::pi; }

// Maps an axis direction (angle mod 180) into (-90, 90].
double wrap_axis(double deg) {
  while (deg <= -90.0) deg += 180.0;
  while (deg > 90.0) deg -= 180.0;
  return deg;
}

void check_inputs(HotSpotDefinition d, const Tensor& s, const ToeFrame& frame, const DefinitionOptions& o) {
  const std::string what = "hot-spot definition '" + to_string(d) + "'";
  if (!s.allFinite()) throw Error(what + ": stress tensor has a component that is not a finite number");
  check_toe_frame(frame, what);
  if (d == HotSpotDefinition::principal && !(o.window_deg > 0 && o.window_deg <= 90))
    throw Error(what + ": window " + number(o.window_deg) +
                " deg is outside (0, 90]; give the half-width of the window around the read-out direction in degrees");
  if (d == HotSpotDefinition::effective && !(o.alpha > 0 && o.alpha <= 1))
    throw Error(what + ": alpha " + number(o.alpha) +
                " is outside (0, 1]; use 0.90, 0.80 or 0.72 (detail class C2, C1, C) or your own value");
}

std::string principal_pair(const InPlanePrincipal& p) {
  return "s1 = " + number(p.s1) + " MPa at " + number(p.angle1_deg) + " deg, s2 = " + number(p.s2) + " MPa at " +
         number(p.angle2_deg) + " deg";
}

HotSpotValue perpendicular(const Tensor& s, const ToeFrame& f) { return {normal_stress(s, f.readout), true, 0, ""}; }

using Candidate = std::pair<double, double>;  // principal value (MPa), direction (deg from readout)

HotSpotValue no_candidate(const InPlanePrincipal& p, const std::string& win) {
  return {0, false, std::abs(p.s1) >= std::abs(p.s2) ? p.angle1_deg : p.angle2_deg,
          "no nonzero in-plane principal stress lies within " + win + " of the read-out direction (" +
              principal_pair(p) + "); the stress runs along the toe, which the hot-spot method does not cover"};
}

// Both in the window: the larger magnitude; equal magnitudes give s1, the tensile one.
HotSpotValue larger_candidate(const InPlanePrincipal& p, const std::string& win) {
  const bool first = std::abs(p.s1) >= std::abs(p.s2);
  return {first ? p.s1 : p.s2, true, first ? p.angle1_deg : p.angle2_deg,
          "both in-plane principal stresses lie within " + win + " of the read-out direction (" + principal_pair(p) +
              "); took the one of larger magnitude"};
}

HotSpotValue only_candidate(const Candidate& pick, const Candidate& other, const std::string& win) {
  HotSpotValue v{pick.first, true, pick.second, ""};
  if (std::abs(other.first) > std::abs(pick.first))
    v.note = "the larger principal stress, " + number(other.first) + " MPa at " + number(other.second) +
             " deg, lies outside the " + win + " window (stress along the toe); check the weld for loading along it";
  return v;
}

HotSpotValue principal(const Tensor& s, const ToeFrame& f, double window) {
  const InPlanePrincipal p = in_plane_principal(s, f);
  const double scale = std::max(std::abs(p.s1), std::abs(p.s2));
  if (scale == 0) return {0, true, 0, "no in-plane stress"};
  const Candidate c1{p.s1, p.angle1_deg}, c2{p.s2, p.angle2_deg};
  const auto in_window = [&](const Candidate& c) {
    return std::abs(c.second) <= window + kAngleSlack && std::abs(c.first) > kNegligible * scale;
  };
  const std::string win = "+-" + number(window) + " deg";
  const bool in1 = in_window(c1), in2 = in_window(c2);
  if (in1 && in2) return larger_candidate(p, win);
  if (in1) return only_candidate(c1, c2, win);
  if (in2) return only_candidate(c2, c1, win);
  return no_candidate(p, win);
}

HotSpotValue effective(const Tensor& s, const ToeFrame& f, double alpha) {
  const InPlanePrincipal p = in_plane_principal(s, f);
  const double perp = normal_stress(s, f.readout);
  const double tau = f.readout.dot(s * f.tangent);
  const double combined = std::sqrt(perp * perp + kShearFactor * tau * tau);
  const double a1 = alpha * std::abs(p.s1);
  const double a2 = alpha * std::abs(p.s2);
  if (combined >= a1 && combined >= a2) return {combined, true, 0, "sqrt(s_perp^2 + 0.81 tau_par^2) governs"};
  const bool first = a1 >= a2;
  return {first ? a1 : a2, true, first ? p.angle1_deg : p.angle2_deg,
          "alpha x |" + std::string(first ? "s1" : "s2") + "| governs (alpha " + number(alpha) + ")"};
}

}  // namespace

double effective_alpha(std::string_view detail_class, const std::string& where) {
  for (const auto& [name, value] : kAlpha)
    if (name == detail_class) return value;
  throw Error(where + ": no effective hot-spot alpha for detail class '" + std::string(detail_class) +
              "'; use one of " + spellings(kAlpha) + " or give alpha itself");
}

InPlanePrincipal in_plane_principal(const Tensor& s, const ToeFrame& f) {
  const double a = normal_stress(s, f.readout);
  const double b = normal_stress(s, f.tangent);
  const double tau = f.readout.dot(s * f.tangent);
  const double centre = 0.5 * (a + b);
  const double half = 0.5 * (a - b);
  const double radius = std::hypot(half, tau);
  const double angle1 = wrap_axis(degrees(0.5 * std::atan2(tau, half)));
  return {centre + radius, centre - radius, angle1, wrap_axis(angle1 + 90.0)};
}

HotSpotValue evaluate(HotSpotDefinition definition, const Tensor& s, const ToeFrame& frame,
                      const DefinitionOptions& options) {
  check_inputs(definition, s, frame, options);
  switch (definition) {
    case HotSpotDefinition::perpendicular: return perpendicular(s, frame);
    case HotSpotDefinition::principal: return principal(s, frame, options.window_deg);
    case HotSpotDefinition::effective: return effective(s, frame, options.alpha);
  }
  return {};
}

HotSpotRange evaluate_range(HotSpotDefinition definition, const Tensor& step_a, const Tensor& step_b,
                            const ToeFrame& frame, const DefinitionOptions& options) {
  HotSpotRange r;
  r.step_a = evaluate(definition, step_a, frame, options);
  r.step_b = evaluate(definition, step_b, frame, options);
  r.range = evaluate(definition, step_b - step_a, frame, options);
  return r;
}

HotSpotDefinition parse_hot_spot_definition(std::string_view text, const std::string& where) {
  for (const auto& [name, value] : kDefinitionNames)
    if (name == text) return value;
  throw Error(where + ": unknown hot-spot definition '" + std::string(text) + "'; use one of " +
              spellings(kDefinitionNames));
}

std::string to_string(HotSpotDefinition definition) {
  for (const auto& [name, value] : kDefinitionNames)
    if (value == definition) return std::string(name);
  return "?";
}

}  // namespace toehold
