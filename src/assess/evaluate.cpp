// Per-station evaluation: hot-spot stress per step from the located read-out points, the range, and the check
// against the toe's S-N curve.
#include "internal.hpp"

#include "toehold/common/error.hpp"
#include "toehold/fatigue/corrections.hpp"
#include "toehold/fatigue/sn_catalogue.hpp"
#include "toehold/hotspot/definition.hpp"
#include "toehold/nominal/nominal_check.hpp"

#include <cmath>
#include <limits>
#include <sstream>

namespace toehold::detail {

// The extrapolated stress tensor at the toe for one step: sum of scheme weights times the read-out tensors.
Tensor toe_tensor(const PlacedStation& s, const ReadoutScheme& scheme, const StressField& field) {
  Tensor t = Tensor::Zero();
  for (std::size_t k = 0; k < s.hosts.size(); ++k) t += scheme.weights[k] * interpolate(field, s.hosts[k]);
  return t;
}

void record_step(PlacedStation& s, const ReadoutScheme& scheme, const StressField& field,
                 std::vector<InPlaneStress>& steps) {
  if (!s.result.ok()) return;
  const Vec3& n = s.result.station.frame.readout;
  Tensor t = Tensor::Zero();
  for (std::size_t k = 0; k < s.hosts.size(); ++k) {
    const Tensor at = interpolate(field, s.hosts[k]);
    s.result.points[k].normal_stress.push_back(normal_stress(at, n));
    t += scheme.weights[k] * at;
  }
  steps.push_back(in_plane(t, s.result.station.frame));
}

DefinitionOptions definition_options(const ToePlan& toe) {
  DefinitionOptions options;
  if (!toe.detail_class.empty())
    options.alpha = effective_alpha(toe.detail_class, "toe '" + toe.name + "' key detail_class");
  return options;
}

// Hot-spot values per step and the largest range over all pairs of steps.
void evaluate_range(StationResult& r, const std::vector<InPlaneStress>& steps, HotSpotDefinition definition,
                    const DefinitionOptions& options) {
  const ToeFrame& frame = r.station.frame;
  std::vector<Tensor> tensors;
  for (const InPlaneStress& s : steps) tensors.push_back(tensor_of(s, frame));
  for (const Tensor& t : tensors) r.hot_spot.push_back(evaluate(definition, t, frame, options).value);
  bool any = false;
  std::string why, note;  // note: the remark of the governing pair (principal window choices, ...)
  for (std::size_t i = 0; i < tensors.size(); ++i)
    for (std::size_t j = i + 1; j < tensors.size(); ++j) {
      const HotSpotRange range = evaluate_range(definition, tensors[i], tensors[j], frame, options);
      if (!range.range.valid) {
        why = range.range.note;
        continue;
      }
      if (!any || std::abs(range.range.value) > r.range) {
        any = true;
        r.range = std::abs(range.range.value);
        r.range_from = static_cast<int>(i);
        r.range_to = static_cast<int>(j);
        r.range_angle_deg = range.range.angle_deg;
        note = range.range.note;
      }
    }
  if (!any) r.problem = tensors.size() < 2 ? "fewer than two load steps" : "no valid range: " + why;
  if (any && !note.empty()) r.notes.push_back(note);  // after the mesh-fitness remarks of the station
}

SnCurve toe_curve(const Plan& plan, const ToePlan& toe, double& thickness_factor) {
  SnCurve curve = find_curve(plan, toe.curve);
  thickness_factor = 1.0;
  if (toe.thickness_exponent) {
    thickness_factor = iiw_thickness_factor(toe.thickness, *toe.thickness_exponent);
  } else if (curve.thickness()) {
    thickness_factor = 1.0 / dnv_thickness_factor(toe.thickness, curve.thickness()->reference_mm,
                                                  curve.thickness()->exponent);
  }
  if (thickness_factor != 1.0) {
    std::ostringstream os;
    os.precision(4);
    os << "thickness factor " << thickness_factor << " for t = " << toe.thickness << " mm";
    curve = curve.scaled(thickness_factor, os.str());
  }
  // IIW 2016 sec. 3.8.2 [M]: the hot-spot classes cover k_m = 1.05; a larger k_m raises the ranges by k_m / 1.05,
  // which for the check is the same as lowering the curve's ranges by that factor.
  if (const double k = toe.misalignment_km / kMisalignmentInHotSpotClasses; k > 1.0) {
    std::ostringstream os;
    os.precision(4);
    os << "misalignment k_m = " << toe.misalignment_km << " (k_m / 1.05 = " << k << ")";
    curve = curve.scaled(1.0 / k, os.str());
  }
  return curve;
}

// The one stress-range check of toehold, shared with the nominal method (nominal/nominal_check.hpp).
void check_range(StationResult& r, const SnCurve& curve, const RequirementPlan& req) {
  if (!r.ok()) return;
  const nominal::RangeRequirement requirement{req.cycles, req.gamma_M, req.gamma_F, Amplitude::constant};
  const nominal::RangeCheck c = nominal::check_range(curve, r.range, requirement, "station " +
                                                                                       std::to_string(r.station.id));
  r.allowable = c.allowable_MPa;
  r.utilization = c.utilization;
  r.life = c.life;
}

}  // namespace toehold::detail
