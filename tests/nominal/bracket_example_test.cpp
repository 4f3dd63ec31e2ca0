// A worked scenario of our own, every step by hand: a cantilever bracket carrying a reciprocating feed-drive
// housing, fillet-welded to the flange of a machine frame column with two vertical welds.
#include "toehold/nominal/infinite_life.hpp"
#include "support/support.hpp"

namespace toehold::nominal {
namespace {

// Geometry: two parallel vertical fillet welds, leg h = 8 mm, length d = 150 mm, b = 100 mm apart.
WeldGroupProperties bracket_welds() {
  return weld_group_properties({WeldLayout::parallel_pair, 8, 100, 150, 0, "bracket to column"});
}

// The housing pushes down on the bracket in the weld plane, 200 mm to the right of the weld centroid, with a
// load that goes from 2 kN to 10 kN every stroke: amplitude P_a = 4 kN, mean P_m = 6 kN.
// Moving it to the centroid: F_y = -P, T = x F_y = 200 x (-P) N mm (clockwise, negative).
WeldLoad bracket_load(double p_N) {
  WeldLoad load;
  load.shear_y_N = -p_N;
  load.torsion_Nmm = 200.0 * -p_N;
  return load;
}

WeldCheckInput bracket_check() {
  WeldCheckInput in;
  // Column AISI 1020 HR (S_ut 380, S_y 210 MPa, textbook Table A-20 [S]); electrode E60xx (427/345 MPa,
  // Table 9-3 [M]); the weaker of the two, property by property (common practice, no source): 380 / 210 MPa.
  in.material = weaker_of(find_material("AISI 1020 HR"), find_material("E60xx"));
  in.detail = WeldDetail::parallel_fillet_end;  // K_fs = 2.7, textbook Table 9-5 [S]
  in.marin.surface = Surface::as_forged;         // rough weld surface (common practice, no source)
  in.marin.load = LoadKind::torsion_shear;       // throat shear: k_c = 0.59, k_b = 1 (direct shear)
  in.marin.reliability_percent = 90;             // k_e = 0.897 [S2]
  in.criterion = Criterion::goodman;
  return in;
}

}  // namespace

// Step 1, section properties (Budynas and Nisbett 9th ed. Table 9-1 [S]):
//   throat t = 0.707 x 8 = 5.656 mm; A = 1.414 h d = 1.414 x 8 x 150 = 1696.8 mm^2
//   J_u = d (3 b^2 + d^2)/6 = 150 (30 000 + 22 500)/6 = 1 312 500 mm^3; J = 5.656 x 1 312 500 = 7 423 500 mm^4
TEST(NominalBracketExample, WeldGroupProperties) {
  const WeldGroupProperties g = bracket_welds();
  EXPECT_CLOSE(g.area_mm2, 1696.8, 1e-12);
  EXPECT_CLOSE(g.unit_polar_moment_mm3, 1312500, 1e-12);
  EXPECT_CLOSE(g.polar_moment_mm4, 7423500, 1e-12);
}

// Step 2, throat stress from the alternating load P_a = 4 kN (textbook sec. 9-3 method):
//   primary shear tau' = 4000/1696.8 = 2.35738 MPa, downwards
//   corners at (+-50, +-75) mm from the centroid, r = sqrt(50^2 + 75^2) = 90.13878 mm
//   secondary tau'' = T r/J = 800 000 x 90.13878/7 423 500 = 9.71389 MPa
//   T/J = -800 000/7 423 500 = -0.107766 MPa/mm; torsion shear (T/J)(-y, x)
//   right corners (x = +50) are worst: tau_x = 0.107766 x 75 = 8.08244, tau_y = -2.35738 - 0.107766 x 50
//     = -2.35738 - 5.38829 = -7.74567 MPa; tau_a = sqrt(8.08244^2 + 7.74567^2) = 11.19470 MPa
//   mean load 6 kN is 1.5 times as large: tau_m = 1.5 x 11.19470 = 16.79205 MPa
TEST(NominalBracketExample, ThroatStresses) {
  const ThroatStress a = throat_stress(bracket_welds(), bracket_load(4000));
  EXPECT_CLOSE(a.primary_shear_MPa, 2.35738, 1e-5);
  EXPECT_CLOSE(a.torsion_MPa, 9.71389, 1e-6);
  EXPECT_CLOSE(a.point_mm.x(), 50.0, 1e-12);
  EXPECT_CLOSE(std::abs(a.components_MPa.x()), 8.08244, 1e-6);
  EXPECT_CLOSE(a.components_MPa.y(), -7.74567, 1e-6);
  EXPECT_CLOSE(a.combined_MPa, 11.19470, 1e-6);
  EXPECT_CLOSE(throat_stress(bracket_welds(), bracket_load(6000)).combined_MPa, 16.79205, 1e-6);
}

// Step 3, endurance limit in shear (textbook sec. 6-7 to 6-10; factors [S] unless noted):
//   S'e = 0.5 x 380 = 190 MPa [M]
//   k_a = 272 x 380^-0.995: ln 380 = 5.940171, x 0.995 = 5.910470, exp(-5.910470) = 0.00271091, x 272 = 0.737368
//   k_b = 1, k_c = 0.59, k_d = 1, k_e = 0.897, k_f = 1
//   S_se = 0.737368 x 0.59 x 0.897 x 190 = 0.435047 x 0.897 x 190 = 0.390237 x 190 = 74.1451 MPa
// Step 4, shear strengths: S_su = 0.67 x 380 = 254.6 MPa [S2]; S_sy = 0.577 x 210 = 121.17 MPa [M]
// Step 5, K_fs = 2.7 on both amplitude and mean (textbook sec. 9-7 [M]):
//   tau_a = 2.7 x 11.19470 = 30.22569 MPa; tau_m = 2.7 x 16.79205 = 45.33853 MPa
// Step 6, factors of safety (Tables 6-6 to 6-8):
//   Goodman: 1/n = 30.22569/74.1451 + 45.33853/254.6 = 0.407656 + 0.178078 = 0.585734, n = 1.70726
//   Gerber: (254.6/45.33853)^2 = 31.53420; x = 2 x 45.33853 x 74.1451/(254.6 x 30.22569) = 0.873665;
//     -1 + sqrt(1 + x^2) = 0.327890; n = 0.5 x 31.53420 x 0.407656 x 0.327890 = 2.10753
//   ASME-elliptic: (0.407656)^2 + (45.33853/121.17)^2 = 0.166183 + 0.140005 = 0.306188, n = 1.80720
//   first-cycle yield: 121.17/(30.22569 + 45.33853) = 121.17/75.56422 = 1.60354
//   Governing: first-cycle yield, 1.60 (below Goodman's 1.71).
TEST(NominalBracketExample, FullInfiniteLifeCheck) {
  const WeldCheck c =
      check_weld_infinite_life(bracket_check(), bracket_welds(), bracket_load(4000), bracket_load(6000));
  EXPECT_TRUE(c.shear);
  EXPECT_CLOSE(c.material.ultimate_MPa, 380, 1e-12);
  EXPECT_CLOSE(c.material.yield_MPa, 210, 1e-12);
  EXPECT_CLOSE(c.endurance.specimen_MPa, 190, 1e-12);
  EXPECT_CLOSE(c.endurance.k_a, 0.737368, 1e-6);
  EXPECT_CLOSE(c.endurance.k_b, 1.0, 1e-15);
  EXPECT_CLOSE(c.endurance.k_c, 0.59, 1e-15);
  EXPECT_CLOSE(c.endurance.k_e, 0.897, 1e-15);
  EXPECT_CLOSE(c.endurance.endurance_MPa, 74.1451, 1e-6);
  EXPECT_CLOSE(c.ultimate_MPa, 254.6, 1e-12);
  EXPECT_CLOSE(c.yield_MPa, 121.17, 1e-12);
  EXPECT_CLOSE(c.concentration_factor, 2.7, 1e-15);
  EXPECT_CLOSE(c.nominal_alternating_MPa, 11.19470, 1e-6);
  EXPECT_CLOSE(c.nominal_mean_MPa, 16.79205, 1e-6);
  EXPECT_CLOSE(c.alternating_MPa, 30.22569, 1e-6);
  EXPECT_CLOSE(c.mean_MPa, 45.33853, 1e-6);
  EXPECT_CLOSE(c.goodman, 1.70726, 1e-5);
  EXPECT_CLOSE(c.gerber, 2.10753, 1e-5);
  EXPECT_CLOSE(c.asme_elliptic, 1.80720, 1e-5);
  EXPECT_CLOSE(c.first_cycle_yield, 1.60354, 1e-5);
  EXPECT_EQ(c.governing, Criterion::first_cycle_yield);
  EXPECT_CLOSE(c.factor_of_safety, 1.60354, 1e-5);
  ASSERT_TRUE(c.alternating_throat.has_value());
  EXPECT_CLOSE(c.alternating_throat->combined_MPa, 11.19470, 1e-6);
}

}  // namespace toehold::nominal
