#include "toehold/common/error.hpp"
#include "toehold/nominal/marin.hpp"
#include "support/support.hpp"

#include <cmath>

namespace toehold::nominal {
namespace {

template <class F>
std::string error_of(F&& f) {
  try {
    f();
  } catch (const Error& e) {
    return e.what();
  }
  return "no error";
}

}  // namespace

// Budynas and Nisbett 9th ed. Table 6-2 check [S]: S_ut = 520 MPa, machined k_a = 0.860, as-forged 0.540.
TEST(Marin, SurfaceFactorMatchesTextbookCheck) {
  EXPECT_CLOSE(surface_factor(Surface::machined, 520), 0.860, 5e-4);
  EXPECT_CLOSE(surface_factor(Surface::as_forged, 520), 0.540, 5e-4);
}

// Same table [S] applied by hand, derived [D]: hot-rolled 57.7 x 520^-0.718 = 57.7 x exp(-0.718 x 6.253829)
// = 57.7 x 0.0112178 = 0.64727; ground 1.58 x 520^-0.085 = 1.58 x exp(-0.531575) = 1.58 x 0.587678 = 0.92853.
TEST(Marin, HotRolledAndGroundByHand) {
  EXPECT_CLOSE(surface_factor(Surface::hot_rolled, 520), 0.64727, 1e-5);
  EXPECT_CLOSE(surface_factor(Surface::ground, 520), 0.92853, 1e-5);
}

// S'e = 0.5 S_ut up to 1400 MPa, 700 MPa above (from memory [M]).
TEST(Marin, SpecimenEnduranceLimitCapsAt700) {
  EXPECT_CLOSE(specimen_endurance_limit(551), 275.5, 1e-12);
  EXPECT_CLOSE(specimen_endurance_limit(1400), 700, 1e-12);
  EXPECT_CLOSE(specimen_endurance_limit(1600), 700, 1e-12);
}

// Size factor [S]: k_b = 1.24 d^-0.107 for 2.79-51 mm; d = 25: ln 25 = 3.218876, x 0.107 = 0.344420,
// exp(-0.344420) = 0.708631, x 1.24 = 0.87870. The 51-254 mm branch 1.51 d^-0.157, same equation, from
// memory [M]: d = 100: 100^-0.157 = exp(-0.723012) = 0.485289, x 1.51 = 0.73279.
TEST(Marin, SizeFactorBranches) {
  EXPECT_CLOSE(size_factor_round(25), 0.87870, 1e-5);
  EXPECT_CLOSE(size_factor_round(100), 0.73279, 1e-5);
  EXPECT_EQ(error_of([] { size_factor_round(300); }),
            "size factor k_b: diameter 300 mm is outside the textbook fit (2.79 to 254 mm); give a diameter in "
            "that range");
  EXPECT_EQ(error_of([] { size_factor_round(2); }),
            "size factor k_b: diameter 2 mm is outside the textbook fit (2.79 to 254 mm); give a diameter in "
            "that range");
}

// Load factor [S]: 1 bending, 0.85 axial, 0.59 torsion/shear. Reliability (Table 6-5): 90 % 0.897, 99 % 0.814,
// 99.9 % 0.753 [S2]; 50 % 1.000, 95 % 0.868, 99.99 % 0.702 from memory [M].
TEST(Marin, LoadAndReliabilityFactors) {
  EXPECT_CLOSE(load_factor(LoadKind::bending), 1.0, 1e-15);
  EXPECT_CLOSE(load_factor(LoadKind::axial), 0.85, 1e-15);
  EXPECT_CLOSE(load_factor(LoadKind::torsion_shear), 0.59, 1e-15);
  EXPECT_CLOSE(reliability_factor(90), 0.897, 1e-15);
  EXPECT_CLOSE(reliability_factor(99), 0.814, 1e-15);
  EXPECT_CLOSE(reliability_factor(99.9), 0.753, 1e-15);
  EXPECT_CLOSE(reliability_factor(50), 1.000, 1e-15);
  EXPECT_CLOSE(reliability_factor(95), 0.868, 1e-15);
  EXPECT_CLOSE(reliability_factor(99.99), 0.702, 1e-15);
  EXPECT_EQ(error_of([] { reliability_factor(80); }),
            "reliability 80 % is not in the table; use one of 50, 90, 95, 99, 99.9, 99.99, 99.999, 99.9999");
}

// K_fs, textbook Table 9-5 after Carvill p. 24 [S]; S_su = 0.67 S_ut [S2]; S_sy = 0.577 S_y [M].
TEST(Marin, WeldConcentrationAndShearStrengths) {
  EXPECT_CLOSE(weld_fatigue_concentration(WeldDetail::reinforced_butt), 1.2, 1e-15);
  EXPECT_CLOSE(weld_fatigue_concentration(WeldDetail::transverse_fillet_toe), 1.5, 1e-15);
  EXPECT_CLOSE(weld_fatigue_concentration(WeldDetail::parallel_fillet_end), 2.7, 1e-15);
  EXPECT_CLOSE(weld_fatigue_concentration(WeldDetail::t_butt_sharp_corners), 2.0, 1e-15);
  EXPECT_CLOSE(shear_ultimate(400), 268, 1e-12);
  EXPECT_CLOSE(shear_yield(300), 173.1, 1e-12);
}

// Axial loading: k_b = 1 whatever the diameter. Hand calculation for S_ut = 520 MPa, machined, axial, 99 %:
//   S'e = 260; k_a = 4.51 x 520^-0.265 = 0.85988; k_c = 0.85; k_e = 0.814; k_d = 0.95 (given);
//   S_e = 0.85988 x 0.85 x 0.95 x 0.814 x 260 (0.85988 x 0.85 = 0.730894, x 0.95 = 0.694350,
//   x 0.814 = 0.565201, x 260 = 146.952 MPa).
TEST(Marin, EnduranceLimitMultipliesAllFactors) {
  MarinInput in;
  in.surface = Surface::machined;
  in.load = LoadKind::axial;
  in.diameter_mm = 30;
  in.temperature_factor = 0.95;
  in.reliability_percent = 99;
  const EnduranceLimit e = endurance_limit(520, in);
  EXPECT_CLOSE(e.specimen_MPa, 260, 1e-12);
  EXPECT_CLOSE(e.k_b, 1.0, 1e-15);
  EXPECT_CLOSE(e.endurance_MPa, 146.952, 1e-5);
}

TEST(Marin, OutOfRangeFactorsAreErrors) {
  MarinInput in;
  in.temperature_factor = 1.2;
  EXPECT_EQ(error_of([&] { endurance_limit(400, in); }),
            "temperature factor k_d must be above 0 and at most 1.025 (the largest value of Table 6-4), got 1.2");
  in.temperature_factor = 1.0;
  in.misc_factor = 0;
  EXPECT_EQ(error_of([&] { endurance_limit(400, in); }),
            "miscellaneous factor k_f must be above 0 and at most 1 (it only reduces the endurance limit), got 0");
  EXPECT_EQ(error_of([] { specimen_endurance_limit(-400); }),
            "ultimate strength S_ut must be positive and finite, got -400 MPa");
}

}  // namespace toehold::nominal
