// Infinite-life fatigue factors of safety (modified Goodman, Gerber, ASME-elliptic) with the first-cycle (Langer)
// yield check, and the full textbook hand check of a weld that keeps every intermediate value for a report.
// Source: Budynas and Nisbett, Mechanical Engineering Design, 9th ed. (2011), sec. 6-12 and 9-7.
#pragma once

#include "toehold/nominal/marin.hpp"
#include "toehold/nominal/material.hpp"
#include "toehold/nominal/weld_group.hpp"

#include <optional>

namespace toehold::nominal {

// Failure criteria for fluctuating stress; each gives a factor of safety n (load-line, s_a/s_m fixed).
enum class Criterion {
  goodman,            // modified Goodman: 1/n = s_a/S_e + s_m/S_ut (Table 6-6 [S])
  gerber,             // n = 0.5 (S_ut/s_m)^2 (s_a/S_e) [-1 + sqrt(1 + (2 s_m S_e/(S_ut s_a))^2)] (Table 6-7 [S])
  asme_elliptic,      // n = [(s_a/S_e)^2 + (s_m/S_y)^2]^-1/2 (Table 6-8 [S2])
  first_cycle_yield,  // Langer: n_y = S_y/(s_a + |s_m|) (Tables 6-6 to 6-8 [S])
};

// All four take the stress amplitude s_a >= 0 and the mean s_m, MPa, and strengths in MPa (> 0). A compressive
// mean (s_m < 0) gives n = S_e/s_a for the three fatigue criteria: the textbook's horizontal line for
// compressive means (sec. 6-12, from memory [M]). A zero stress state gives +infinity. Throws Error for a
// negative or non-finite amplitude, a non-finite mean or a non-positive strength.
double goodman_factor(double alternating_MPa, double mean_MPa, double endurance_MPa, double ultimate_MPa);
double gerber_factor(double alternating_MPa, double mean_MPa, double endurance_MPa, double ultimate_MPa);
double asme_elliptic_factor(double alternating_MPa, double mean_MPa, double endurance_MPa, double yield_MPa);
double first_cycle_yield_factor(double alternating_MPa, double mean_MPa, double yield_MPa);

// What the weld check needs besides the stresses.
struct WeldCheckInput {
  Material material;                         // strengths to check with, e.g. weaker_of(parent, weld metal)
  WeldDetail detail = WeldDetail::parallel_fillet_end;  // picks K_fs
  MarinInput marin;                          // defaults: as-forged surface, torsion/shear, k_b = 1 (direct shear)
  Criterion criterion = Criterion::goodman;  // the fatigue criterion compared with first-cycle yield
};

// The whole hand calculation. With LoadKind::torsion_shear (the fillet-throat case) the throat stress is a shear
// stress: the criteria use S_su = 0.67 S_ut and S_sy = 0.577 S_y, the sign of the mean is dropped, and k_c = 0.59
// turns S'e into the shear endurance limit. Otherwise the criteria use S_ut and S_y.
struct WeldCheck {
  Material material;
  bool shear = true;                  // throat stress treated as shear
  double ultimate_MPa = 0.0;          // S_su (shear) or S_ut used by Goodman and Gerber, MPa
  double yield_MPa = 0.0;             // S_sy (shear) or S_y used by ASME-elliptic and first-cycle yield, MPa
  EnduranceLimit endurance;           // S'e, k_a ... k_f and S_e (S_se in shear), MPa
  double concentration_factor = 1.0;  // K_fs
  double nominal_alternating_MPa = 0.0;  // throat stress amplitude before K_fs, MPa
  double nominal_mean_MPa = 0.0;         // throat mean stress before K_fs, MPa
  double alternating_MPa = 0.0;          // K_fs x nominal amplitude, MPa
  double mean_MPa = 0.0;                 // K_fs x nominal mean, MPa
  double goodman = 0.0, gerber = 0.0, asme_elliptic = 0.0, first_cycle_yield = 0.0;  // factors of safety
  Criterion criterion = Criterion::goodman;  // the fatigue criterion asked for
  Criterion governing = Criterion::goodman;  // that criterion or first_cycle_yield, whichever is lower
  double factor_of_safety = 0.0;             // the governing factor
  std::optional<ThroatStress> alternating_throat;  // set when the check started from loads
  std::optional<ThroatStress> mean_throat;
};

// From nominal throat stresses, MPa (amplitude >= 0). K_fs multiplies both the amplitude and the mean, as the
// textbook does for welds (9th ed. sec. 9-7 and its worked example, from memory [M]). Throws Error for bad input
// (material, Marin factors, a negative amplitude, or first_cycle_yield asked as the fatigue criterion).
WeldCheck check_weld_infinite_life(const WeldCheckInput& input, double nominal_alternating_MPa,
                                   double nominal_mean_MPa);

// From the alternating and mean loads on a weld group: the combined throat stress of each at its own critical
// point (conservative when the two critical points differ; the same point for proportional loading).
WeldCheck check_weld_infinite_life(const WeldCheckInput& input, const WeldGroupProperties& group,
                                   const WeldLoad& alternating, const WeldLoad& mean);

}  // namespace toehold::nominal
