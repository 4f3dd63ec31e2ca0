// Endurance limit of a part: the rotating-beam specimen value S'e times the Marin factors k_a ... k_f; also the
// weld fatigue stress-concentration factors K_fs and the shear strengths used by the textbook weld check.
// Source: Budynas and Nisbett, Mechanical Engineering Design, 9th ed. (2011), sec. 6-7 to 6-10 and Table 9-5.
#pragma once

#include <optional>

namespace toehold::nominal {

// Rotating-beam endurance limit S'e, MPa, of a steel with ultimate strength S_ut, MPa: 0.5 S_ut up to 1400 MPa,
// 700 MPa above (9th ed. Eq. 6-8, from memory [M]). Throws Error when S_ut is not positive and finite.
double specimen_endurance_limit(double ultimate_MPa);

// Surface finish for k_a.
enum class Surface {
  ground,      // a = 1.58 MPa, b = -0.085
  machined,    // machined or cold-drawn: a = 4.51 MPa, b = -0.265
  hot_rolled,  // a = 57.7 MPa, b = -0.718
  as_forged,   // a = 272 MPa, b = -0.995; common practice for the rough surface at a weld
};

// Surface factor k_a = a S_ut^b, S_ut in MPa (9th ed. Table 6-2 [S]; later editions changed the table).
double surface_factor(Surface surface, double ultimate_MPa);

// Size factor k_b of a round bar in bending or torsion, diameter in mm: 1.24 d^-0.107 for 2.79 <= d <= 51,
// 1.51 d^-0.157 for 51 < d <= 254 (9th ed. Eq. 6-20; first branch [S], second from memory [M]). Throws
// Error outside 2.79-254 mm.
double size_factor_round(double diameter_mm);

// Equivalent round diameter, mm, of a rectangular section h x b (mm) in non-rotating bending: 0.808 sqrt(h b)
// (9th ed. Eq. 6-25, from memory [M]). Throws Error when h or b is not positive.
double equivalent_diameter_rectangle(double height_mm, double width_mm);

// Kind of loading the endurance limit is for.
enum class LoadKind {
  bending,        // k_c = 1
  axial,          // k_c = 0.85; no size effect (k_b = 1)
  torsion_shear,  // k_c = 0.59; torsion, or direct shear on a weld throat
};

// Load factor k_c (9th ed. Eq. 6-26 [S]).
double load_factor(LoadKind load);

// Reliability factor k_e for a reliability in percent: 50 -> 1.000, 90 -> 0.897, 95 -> 0.868, 99 -> 0.814,
// 99.9 -> 0.753, 99.99 -> 0.702, 99.999 -> 0.659, 99.9999 -> 0.620 (9th ed. Table 6-5; 90/99/99.9 [S2], the
// rest from memory [M]). Throws Error for a reliability not in the table.
double reliability_factor(double reliability_percent);

// Weld detail for the fatigue stress-concentration factor.
enum class WeldDetail {
  reinforced_butt,        // K_fs = 1.2
  transverse_fillet_toe,  // K_fs = 1.5
  parallel_fillet_end,    // K_fs = 2.7
  t_butt_sharp_corners,   // K_fs = 2.0
};

// K_fs (9th ed. Table 9-5, after Carvill, Mechanical Engineer's Data Handbook p. 24 [S]).
double weld_fatigue_concentration(WeldDetail detail);

// Ultimate shear strength S_su = 0.67 S_ut, MPa (9th ed. sec. 6-15 [S2]).
double shear_ultimate(double ultimate_MPa);
// Shear yield strength S_sy = 0.577 S_y, MPa (distortion-energy theory, 9th ed. Eq. 5-21, from memory [M]).
double shear_yield(double yield_MPa);

// What the Marin factors depend on besides S_ut.
struct MarinInput {
  Surface surface = Surface::as_forged;
  LoadKind load = LoadKind::torsion_shear;
  std::optional<double> diameter_mm;  // round (or equivalent) diameter, mm; none -> k_b = 1 (direct shear)
  double temperature_factor = 1.0;    // k_d, given by the analyst; 0 < k_d <= 1.025 (Table 6-4's largest value)
  double reliability_percent = 50.0;  // for k_e, one of the table's reliabilities, percent
  double misc_factor = 1.0;           // k_f, other reductions (corrosion, plating...); 0 < k_f <= 1
};

// The endurance limit and every factor that makes it, for a report to show.
struct EnduranceLimit {
  double specimen_MPa = 0.0;  // S'e, MPa
  double k_a = 1.0, k_b = 1.0, k_c = 1.0, k_d = 1.0, k_e = 1.0, k_f = 1.0;
  double endurance_MPa = 0.0;  // S_e = k_a k_b k_c k_d k_e k_f S'e, MPa (9th ed. Eq. 6-18)
};

// k_b is 1 for axial loading whatever the diameter. Throws Error for out-of-range factors or diameters.
EnduranceLimit endurance_limit(double ultimate_MPa, const MarinInput& input);

}  // namespace toehold::nominal
