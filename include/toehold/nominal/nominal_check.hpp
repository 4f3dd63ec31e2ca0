// The nominal-stress S-N check (a detail class from the catalogue: IIW FAT or EN 1993-1-9 category, normal or
// shear), combined normal and shear ranges, and the side-by-side comparison of the nominal and hot-spot methods
// at a toe. One stress-range check serves both methods; all curve arithmetic is SnCurve's (fatigue/sn_curve.hpp).
#pragma once

#include "toehold/fatigue/sn_curve.hpp"
#include "toehold/nominal/nominal_source.hpp"

#include <optional>
#include <string>
#include <string_view>

namespace toehold::nominal {

// What a stress range is checked for.
struct RangeRequirement {
  double cycles = 2e6;   // required number of cycles of the range, > 0 (infinity: the range that does no damage)
  double gamma_M = 1.0;  // partial safety factor on fatigue resistance, > 0: divides the allowable range
  double gamma_F = 1.0;  // partial safety factor on the load, > 0: multiplies the stress range
  Amplitude amplitude = Amplitude::constant;  // rule beyond the knee (constant: one range applied `cycles` times)
};

// One stress range against one S-N curve (IIW 2016 sec. 6.3 and EN 1993-1-9 sec. 8, from memory [M]:
// gamma_F ds <= ds_R(N) / gamma_M).
struct RangeCheck {
  std::string what;              // label from the call, e.g. "toe 'T1' nominal"
  std::string curve;             // curve name, e.g. "IIW FAT 71 (steel, normal stress)"
  std::string curve_source;      // document, edition and section of the curve
  StressKind kind = StressKind::normal;
  double range_MPa = 0.0;        // the applied range ds, MPa
  double design_range_MPa = 0.0; // gamma_F ds, MPa
  double allowable_MPa = 0.0;    // ds_R(cycles) / gamma_M, MPa
  double utilization = 0.0;      // gamma_F ds / allowable; infinity when the allowable is 0 and ds > 0
  double life = 0.0;             // cycles to failure of gamma_F gamma_M ds (infinity: no damage)
  double damage = 0.0;           // Miner damage of the required cycles: cycles / life (0 when life is infinite)
  RangeRequirement requirement;
};

// The check of any stress range, hot-spot or nominal: allowable = curve.allowable_range(cycles) / gamma_M,
// utilization = gamma_F ds / allowable, life = curve.cycles_to_failure(gamma_F gamma_M ds). Throws Error naming
// `what` for a negative or non-finite range, non-positive cycles, or a non-positive safety factor.
RangeCheck check_range(const SnCurve& curve, double range_MPa, const RangeRequirement& requirement,
                       const std::string& what = "stress range");

// The nominal check: check_range on range.range_MPa, labelled with `what`. Throws Error when the range's stress
// kind differs from the curve's (a shear range needs a shear class such as "IIW FAT 80 shear", a normal range a
// normal-stress class).
RangeCheck check_nominal(const SnCurve& curve, const NominalRange& range, const RangeRequirement& requirement,
                         const std::string& what);

// How a normal and a shear range acting together are combined.
enum class Interaction {
  iiw_quadratic,  // "iiw": (gamma_F ds / ds_R,d)^2 + (gamma_F dt / dt_R,d)^2 <= CV (IIW 2016, combined normal
                  // and shear stress; Gough-Pollard form; from memory [M])
  en_damage_sum,  // "en": (gamma_Ff ds_E2 / (ds_C/gamma_Mf))^3 + (gamma_Ff dt_E2 / (dt_C/gamma_Mf))^5 <= 1
                  // (EN 1993-1-9 Eq. 8.3, from memory [M]), evaluated as the sum of the two Miner damages
                  // cycles / N(gamma_F gamma_M ds) on the curves: equal to it on the m = 3 and m = 5 parts [D]
};

// Whether the normal and shear stresses rise and fall together (IIW's comparison value CV depends on it [M]).
enum class Proportionality {
  proportional,      // "proportional": CV = 1.0
  non_proportional,  // "non-proportional": CV = 0.5
};

std::string to_string(Interaction rule);
Interaction parse_interaction(std::string_view text, const std::string& where);
std::string to_string(Proportionality p);
Proportionality parse_proportionality(std::string_view text, const std::string& where);

// IIW comparison value CV (IIW 2016, combined normal and shear stress, from memory [M]): 1.0 proportional, 0.5 non-proportional.
double iiw_comparison_value(Proportionality p);

struct CombinedCheck {
  RangeCheck normal;       // the normal-stress part (kind normal)
  RangeCheck shear;        // the shear part (kind shear)
  Interaction rule = Interaction::iiw_quadratic;
  double value = 0.0;      // left-hand side of the interaction, dimensionless
  double limit = 1.0;      // right-hand side: CV (IIW) or 1.0 (EN)
  double utilization = 0.0;  // value / limit (a ratio of sums, not of stresses); <= 1 passes
  std::string formula;     // the interaction written out with its numbers, for reports
};

// Combines two checks made with check_range or check_nominal. Throws Error when `normal` is not a normal-stress
// check or `shear` not a shear check. `proportionality` only matters for iiw_quadratic.
CombinedCheck check_combined(const RangeCheck& normal, const RangeCheck& shear, Interaction rule,
                             Proportionality proportionality = Proportionality::proportional);

// The two methods compared at a toe.
enum class Method {
  nominal,   // "nominal"
  hot_spot,  // "hot-spot"
};
std::string to_string(Method method);

struct MethodComparison {
  std::string label;             // e.g. "toe 'T1' station 4"
  RangeCheck nominal;            // nominal range against the detail class
  RangeCheck hot_spot;           // hot-spot range against the hot-spot class
  // Structural stress concentration factor: hot-spot range / nominal range. None when the nominal range is 0 or
  // is a shear range (a ratio of a normal to a shear stress is no concentration factor).
  std::optional<double> concentration_factor;
  Method governing = Method::hot_spot;  // the larger utilization; equal ones (within 1e-9 relative): hot spot
  std::string verdict;           // one line: which governs, both utilizations, ranges and curves, the factor
};

// Side by side. Throws Error naming `label` when the hot-spot check is not a normal-stress check.
MethodComparison compare_methods(const RangeCheck& nominal, const RangeCheck& hot_spot, const std::string& label);

}  // namespace toehold::nominal
