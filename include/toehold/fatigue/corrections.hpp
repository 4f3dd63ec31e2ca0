// Corrections applied to fatigue resistance or to the stress range: plate thickness (IIW, DNV), IIW mean-stress
// enhancement f(R), axial misalignment k_m, and partial safety factors gamma_F, gamma_M. Each function says
// whether it multiplies the resistance (the FAT / S-N ranges) or the applied stress range.
#pragma once

#include <string>
#include <string_view>
#include <vector>

namespace toehold {

// IIW 2016 sec. 3.5.2 thickness exponent n by joint category [M].
enum class IiwThicknessCategory {
  as_welded_transverse,     // n = 0.3: cruciform, T-joints, transverse attachments, ends of longitudinal stiffeners
  toe_ground_or_butt,       // n = 0.2: toe ground cruciform/T-joints, transverse butt welds as welded
  butt_ground_longitudinal, // n = 0.1: butt welds ground flush, base material, longitudinal welds, attachments
};

double iiw_thickness_exponent(IiwThicknessCategory category);
std::string to_string(IiwThicknessCategory category);
IiwThicknessCategory parse_iiw_thickness_category(std::string_view text, const std::string& where);

// IIW 2016 sec. 3.5.2: effective thickness for a toe-to-toe distance L [M]: t_eff = 0.5 L when L/t <= 2,
// otherwise t (continuous at L = 2t). t_mm: plate thickness, mm, > 0; toe_distance_mm: L, mm, > 0.
double iiw_effective_thickness(double t_mm, double toe_distance_mm);
// IIW 2016 sec. 3.5.2: f(t) = (25 mm / t_eff)^n for t_eff > 25 mm, 1 otherwise. Multiplies the FAT class.
// t_eff_mm: effective plate thickness, mm, > 0; n: exponent, >= 0.
double iiw_thickness_factor(double t_eff_mm, double n);
double iiw_thickness_factor(double t_eff_mm, IiwThicknessCategory category);

// DNVGL-RP-C203 2016 sec. 2.4.3: (t / t_ref)^k for t > t_ref, 1 otherwise. Multiplies the stress range (or
// divides the resistance). t_mm, t_ref_mm: mm, > 0; k: exponent, >= 0 (SnCurve::thickness() carries k, t_ref).
double dnv_thickness_factor(double t_mm, double t_ref_mm, double k);

// IIW 2016 sec. 3.5.3 residual-stress cases for the mean-stress enhancement [M].
enum class IiwMeanStressCase {
  stress_relieved,         // case I: unwelded base material and wrought products, stress-relieved welds
  small_residual_stress,   // case II: small-scale thin-walled simple structural elements, short welds
  high_residual_stress,    // case III: complex two- or three-dimensional welded components, thick walls
};

std::string to_string(IiwMeanStressCase c);
IiwMeanStressCase parse_iiw_mean_stress_case(std::string_view text, const std::string& where);

// IIW 2016 sec. 3.5.3: enhancement f(R) >= 1 that multiplies the FAT class. R = s_min / s_max (finite).
//   case I:   1.6 for R < -1;  1.2 - 0.4 R for -1 <= R <= 0.5;  1.0 above
//   case II:  1.3 for R < -1;  0.9 - 0.4 R for -1 <= R, never below 1.0 (= 1.0 from R = -0.25 on)
//   case III: 1.0
double iiw_mean_stress_factor(double stress_ratio, IiwMeanStressCase c);
// Stress ratio R = s_min / s_max of a cycle (MPa, s_max != 0, s_min <= s_max).
double stress_ratio(double s_min, double s_max);

// IIW 2016 sec. 3.8.2 [M]: k_m = 1 + 3 e / t for an axial offset e between equal plates, unrestrained
// (lambda = 6, l1 = l2). Multiplies the stress range. e_mm: offset, mm, >= 0; t_mm: thickness, mm, > 0.
double axial_misalignment_factor(double e_mm, double t_mm);
// IIW 2016 sec. 3.8.2 [M]: the misalignment factor already covered by the structural hot-spot FAT classes.
inline constexpr double kMisalignmentInHotSpotClasses = 1.05;

// Consequence of failure, as both IIW and EN 1993-1-9 classify it.
enum class FailureConsequence {
  low,   // low consequence: no loss of life, limited damage
  high,  // high consequence
};

// How the structure is designed against fatigue.
enum class FatigueDesignConcept {
  fail_safe,  // damage tolerant (EN) / fail-safe (IIW): cracks are found and repaired before failure
  safe_life,  // safe life: no inspection relied on
};

std::string to_string(FailureConsequence c);
std::string to_string(FatigueDesignConcept c);

// IIW 2016 sec. 6.3 gamma_M [M]: fail-safe 1.00 / 1.15, safe-life 1.15 / 1.30 (low / high consequence).
double iiw_gamma_m(FatigueDesignConcept concept_, FailureConsequence consequence);
// EN 1993-1-9:2005 Table 3.1 gamma_Mf [M]: damage tolerant 1.00 / 1.15, safe life 1.15 / 1.35.
double en_gamma_mf(FatigueDesignConcept concept_, FailureConsequence consequence);

// One row of a partial-safety-factor table, for listing in reports and docs.
struct NamedFactor {
  std::string name;  // e.g. "IIW gamma_M, fail-safe, high consequence"
  double value = 1.0;
};
std::vector<NamedFactor> iiw_gamma_m_table();
std::vector<NamedFactor> en_gamma_mf_table();

// Partial safety factors: the design stress range is gamma_F ds and the design resistance is ds_R / gamma_M,
// so the check compares gamma_F gamma_M ds with the S-N curve. Both >= 1 in design; > 0 is required.
struct PartialSafetyFactors {
  double gamma_f = 1.0;  // load (stress range) factor
  double gamma_m = 1.0;  // resistance factor

  // Factor on the applied stress range equivalent to both: gamma_F gamma_M. Throws Error if either is <= 0.
  double on_stress_range() const;
};

}  // namespace toehold
