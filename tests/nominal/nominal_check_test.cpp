// The nominal-stress S-N check, combined normal and shear, nominal ranges from load steps and weld groups, and
// the side-by-side comparison with the hot-spot method. Every expected value is a hand calculation written out
// here from the formula it cites.
#include "toehold/common/error.hpp"
#include "toehold/fatigue/sn_catalogue.hpp"
#include "toehold/nominal/nominal_check.hpp"
#include "toehold/nominal/nominal_source.hpp"

#include "support/support.hpp"

#include <cmath>
#include <functional>
#include <limits>
#include <numbers>

namespace toehold::nominal {
namespace {

using test::error_of;

RangeRequirement cycles(double n, double gamma_m = 1.0, double gamma_f = 1.0) {
  RangeRequirement r;
  r.cycles = n;
  r.gamma_M = gamma_m;
  r.gamma_F = gamma_f;
  return r;
}

// IIW 2016 sec. 3.7 (from memory [M]): N = 2e6 (FAT/ds)^3 up to 1e7 for normal stress.
// FAT 71, ds = 100 MPa, 2e6 cycles: allowable 71 MPa, utilization 100/71, life 2e6 (71/100)^3 = 715 822 [D].
TEST(NominalCheck, FatClassAtReferenceCycles) {
  const RangeCheck c = check_range(parse_sn_curve("IIW FAT 71"), 100.0, cycles(2e6), "detail A");
  EXPECT_CLOSE(c.allowable_MPa, 71.0, 1e-12);
  EXPECT_CLOSE(c.utilization, 100.0 / 71.0, 1e-12);
  EXPECT_CLOSE(c.life, 2e6 * std::pow(71.0 / 100.0, 3), 1e-12);
  EXPECT_CLOSE(c.damage, 2e6 / c.life, 1e-12);
  EXPECT_EQ(c.kind, StressKind::normal);
  EXPECT_EQ(c.what, "detail A");
  EXPECT_EQ(c.curve, "IIW FAT 71 (steel, normal stress)");
}

// With gamma_M = 1.15 (IIW 2016 sec. 6.3 safe-life low consequence, from memory [M]) and gamma_F = 1.1 [D]:
// allowable 71 / 1.15 = 61.739 MPa, design range 110 MPa, utilization 110 / 61.739 = 1.7817,
// life 2e6 (71 / (1.1 x 1.15 x 100))^3 = 2e6 (71 / 126.5)^3.
TEST(NominalCheck, PartialSafetyFactorsScaleRangeAndResistance) {
  const RangeCheck c = check_range(parse_sn_curve("IIW FAT 71"), 100.0, cycles(2e6, 1.15, 1.1), "detail A");
  EXPECT_CLOSE(c.allowable_MPa, 71.0 / 1.15, 1e-12);
  EXPECT_CLOSE(c.design_range_MPa, 110.0, 1e-12);
  EXPECT_CLOSE(c.utilization, 110.0 * 1.15 / 71.0, 1e-12);
  EXPECT_CLOSE(c.life, 2e6 * std::pow(71.0 / 126.5, 3), 1e-12);
}

// Shear class, IIW 2016 sec. 3.7 (from memory [M]): N = 2e6 (FAT/dt)^5 up to 1e8. FAT 80 shear, dt = 60 MPa,
// 1e6 cycles: allowable 80 (2e6/1e6)^(1/5) = 91.896 MPa, utilization 60/91.896 = 0.65292,
// life 2e6 (80/60)^5 = 8.428e6 [D].
TEST(NominalCheck, ShearDetailClass) {
  const SnCurve curve = parse_sn_curve("IIW FAT 80 shear");
  const NominalRange r = given_range(60.0, StressKind::shear, "bracket weld");
  const RangeCheck c = check_nominal(curve, r, cycles(1e6), "bracket weld");
  EXPECT_CLOSE(c.allowable_MPa, 80.0 * std::pow(2.0, 0.2), 1e-12);
  EXPECT_CLOSE(c.utilization, 60.0 / (80.0 * std::pow(2.0, 0.2)), 1e-12);
  EXPECT_CLOSE(c.life, 2e6 * std::pow(80.0 / 60.0, 5), 1e-12);
  EXPECT_EQ(c.kind, StressKind::shear);
}

// EN 1993-1-9:2005 sec. 7.1 (REFERENCE-VALUES.md [S via reference pages, D]): ds_D = (2/5)^(1/3) ds_C at 5e6;
// constant amplitude: no damage below ds_D. Category 71, ds = 50 MPa < ds_D = 52.32 MPa, 1e9 cycles:
// allowable = ds_D, utilization 50 / 52.32 = 0.9556, infinite life, no damage.
TEST(NominalCheck, EnCategoryBelowConstantAmplitudeFatigueLimit) {
  const RangeCheck c = check_range(parse_sn_curve("EN 71"), 50.0, cycles(1e9), "flange butt weld");
  const double ds_d = std::cbrt(2.0 / 5.0) * 71.0;
  EXPECT_CLOSE(c.allowable_MPa, ds_d, 1e-9);
  EXPECT_CLOSE(c.utilization, 50.0 / ds_d, 1e-9);
  EXPECT_TRUE(std::isinf(c.life));
  EXPECT_EQ(c.damage, 0.0);
}

// IIW check value from REFERENCE-VALUES.md [D]: FAT 90 at 1e7 cycles -> 52.63 MPa; ds = 100 MPa -> N = 1.458e6.
TEST(NominalCheck, PublishedFat90Values) {
  const RangeCheck at_knee = check_range(parse_sn_curve("IIW FAT 90"), 40.0, cycles(1e7), "x");
  EXPECT_CLOSE(at_knee.allowable_MPa, 52.63, 1e-4);
  const RangeCheck at_100 = check_range(parse_sn_curve("IIW FAT 90"), 100.0, cycles(1e6), "x");
  EXPECT_CLOSE(at_100.life, 1.458e6, 1e-3);
}

TEST(NominalCheck, ZeroRangeHasZeroUtilizationAndNoDamage) {
  const RangeCheck c = check_range(parse_sn_curve("IIW FAT 71"), 0.0, cycles(2e6), "idle");
  EXPECT_EQ(c.utilization, 0.0);
  EXPECT_TRUE(std::isinf(c.life));
  EXPECT_EQ(c.damage, 0.0);
}

TEST(NominalCheck, BadInputIsRefusedWithClearMessages) {
  const SnCurve fat71 = parse_sn_curve("IIW FAT 71");
  EXPECT_EQ(error_of([&] { check_range(fat71, -5.0, cycles(2e6), "toe 'T1' nominal"); }),
            "toe 'T1' nominal: the stress range must be zero or positive and finite, got -5 MPa; give the range "
            "(maximum minus minimum) in MPa");
  EXPECT_EQ(error_of([&] { check_range(fat71, 50.0, cycles(0.0), "toe 'T1' nominal"); }),
            "toe 'T1' nominal: the required number of cycles must be positive, got 0; give the cycles the range is "
            "applied");
  EXPECT_EQ(error_of([&] { check_range(fat71, 50.0, cycles(2e6, -1.0), "toe 'T1' nominal"); }),
            "toe 'T1' nominal: the partial safety factor gamma_M must be positive and finite, got -1; use 1 for none");
  const NominalRange shear = given_range(40.0, StressKind::shear, "bracket weld");
  EXPECT_EQ(error_of([&] { check_nominal(fat71, shear, cycles(2e6), "bracket weld"); }),
            "bracket weld: the nominal range is a shear stress range but the curve 'IIW FAT 71 (steel, normal "
            "stress)' is for normal stress; give a shear stress detail class, e.g. \"IIW FAT 80 shear\"");
  EXPECT_EQ(error_of([] { given_range(std::numeric_limits<double>::quiet_NaN(), StressKind::normal, "toe 'T2'"); }),
            "toe 'T2': the nominal stress range must be zero or positive and finite, got nan MPa; give the range "
            "(maximum minus minimum) in MPa");
  EXPECT_EQ(error_of([] { parse_nominal_source("membrane", "plan key toe.nominal.source"); }),
            "plan key toe.nominal.source: unknown nominal stress source 'membrane'; use one of 'given', 'section', "
            "'surface-distance', 'weld-group'");
}

// Load steps 20, -30, 50, 10 MPa: range 50 - (-30) = 80 MPa from step 2 to step 3 (1-based) [D].
TEST(NominalSource, RangeOverLoadSteps) {
  const NominalRange r = range_over_steps({20.0, -30.0, 50.0, 10.0}, StressKind::normal, NominalSource::section,
                                          "toe 'T1' nominal");
  EXPECT_CLOSE(r.range_MPa, 80.0, 1e-15);
  EXPECT_EQ(r.from, 1);
  EXPECT_EQ(r.to, 2);
  EXPECT_EQ(r.note, "toe 'T1' nominal: normal stress range 80 MPa (section, from -30 MPa at step 2 to 50 MPa at "
                    "step 3)");
  EXPECT_EQ(error_of([] { range_over_steps({5.0}, StressKind::normal, NominalSource::given, "toe 'T1'"); }),
            "toe 'T1': a nominal stress range needs values of at least two load steps, got 1; give one value per "
            "load step");
  EXPECT_EQ(to_string(NominalSource::surface_distance), "surface-distance");
  EXPECT_EQ(parse_throat_measure("shear", "x"), ThroatMeasure::shear);
}

// Two parallel fillet welds (Budynas and Nisbett 9th ed. Table 9-1 [S], REFERENCE-VALUES.md): h = 6, d = 100,
// b = 80 mm. A = 1.414 h d = 848.4 mm^2; J_u = d (3 b^2 + d^2) / 6 = 486 666.7 mm^3, J = 0.707 h J_u.
// Load range: F_y 5 -> 25 kN (20 kN), T 0 -> 1e6 N mm. At the corner (40, 50) from the centroid:
// tau = (0, F_y/A) + (T/J)(-y, x) = (-T 50/J, F_y/A + T 40/J); the corners at x = +40 give the largest magnitude.
TEST(NominalSource, ParallelWeldGroupShearRangeUnderTorsion) {
  WeldGroupShape shape;
  shape.layout = WeldLayout::parallel_pair;
  shape.leg_mm = 6.0, shape.depth_mm = 100.0, shape.width_mm = 80.0, shape.name = "bracket";
  WeldLoad first, second;
  first.shear_y_N = 5000.0;
  second.shear_y_N = 25000.0;
  second.torsion_Nmm = 1e6;
  const WeldGroupRange r = weld_group_range(shape, first, second, ThroatMeasure::shear);
  const double area = 1.414 * 6.0 * 100.0, polar = 0.707 * 6.0 * 100.0 * (3 * 80.0 * 80.0 + 100.0 * 100.0) / 6.0;
  const double tx = -1e6 * 50.0 / polar, ty = 20000.0 / area + 1e6 * 40.0 / polar;
  EXPECT_CLOSE(r.group.area_mm2, area, 1e-12);
  EXPECT_CLOSE(r.range.range_MPa, std::hypot(tx, ty), 1e-12);
  EXPECT_CLOSE(std::abs(r.throat.point_mm.x()), 40.0, 1e-12);
  EXPECT_CLOSE(r.throat.point_mm.x(), 40.0, 1e-12);
  EXPECT_CLOSE(r.load_range.shear_y_N, 20000.0, 1e-12);
  EXPECT_EQ(r.range.kind, StressKind::shear);
  EXPECT_EQ(r.range.source, NominalSource::weld_group);
  // Checked with a shear class: FAT 80 shear at 2e6 cycles, utilization = range / 80 [M].
  const RangeCheck c = check_nominal(parse_sn_curve("IIW FAT 80 shear"), r.range, cycles(2e6), "bracket");
  EXPECT_CLOSE(c.utilization, std::hypot(tx, ty) / 80.0, 1e-12);
}

// Same group, bending range 2e6 N mm about x (Table 9-2 [S]): I_u = d^3/6, I = 0.707 h I_u = 707 000 mm^4;
// sigma = M y / I at y = 50: 141.44 MPa, the normal measure [D].
TEST(NominalSource, WeldGroupNormalRangeUnderBending) {
  WeldGroupShape shape;
  shape.layout = WeldLayout::parallel_pair;
  shape.leg_mm = 6.0, shape.depth_mm = 100.0, shape.width_mm = 80.0;
  WeldLoad zero, bent;
  bent.bending_Nmm = 2e6;
  bent.shear_y_N = 10000.0;
  const WeldGroupRange r = weld_group_range(shape, zero, bent, ThroatMeasure::normal);
  const double inertia = 0.707 * 6.0 * 1e6 / 6.0;
  EXPECT_CLOSE(r.range.range_MPa, 2e6 * 50.0 / inertia, 1e-12);
  EXPECT_EQ(r.range.kind, StressKind::normal);
  // Combined: sqrt(sigma^2 + (F/A)^2) at the same fibre [D].
  const WeldGroupRange all = weld_group_range(shape, zero, bent, ThroatMeasure::combined);
  EXPECT_CLOSE(all.range.range_MPa, std::hypot(2e6 * 50.0 / inertia, 10000.0 / (1.414 * 600.0)), 1e-12);
}

// Circle (Table 9-1 [S]): r = 50, h = 5 mm, A = 1.414 pi h r, J = 0.707 h 2 pi r^3. Shear range under F_x = 10 kN
// and T = 1e6 N mm: the largest magnitude is where the torsion shear lines up with F: F/A + T r / J [D].
TEST(NominalSource, CircularWeldGroupFindsThePointRoundTheCircle) {
  WeldGroupShape shape;
  shape.layout = WeldLayout::circle;
  shape.leg_mm = 5.0, shape.radius_mm = 50.0;
  WeldLoad zero, load;
  load.shear_x_N = 10000.0;
  load.torsion_Nmm = 1e6;
  const WeldGroupRange r = weld_group_range(shape, zero, load, ThroatMeasure::shear);
  const double area = 1.414 * std::numbers::pi * 5.0 * 50.0, polar = 0.707 * 5.0 * 2.0 * std::numbers::pi * 125000.0;
  EXPECT_CLOSE(r.range.range_MPa, 10000.0 / area + 1e6 * 50.0 / polar, 1e-9);
  EXPECT_CLOSE(r.throat.point_mm.y(), -50.0, 1e-5);  // tau_x of torsion is -(T/J) y: aligned with +x at y = -r
}

TEST(NominalSource, ZeroLengthWeldGroupIsRefused) {
  WeldGroupShape shape;
  shape.layout = WeldLayout::parallel_pair;
  shape.leg_mm = 6.0, shape.depth_mm = 0.0, shape.width_mm = 80.0, shape.name = "bracket";
  EXPECT_EQ(error_of([&] { weld_group_range(shape, WeldLoad{}, WeldLoad{}, ThroatMeasure::combined); }),
            "weld group 'bracket' (parallel-pair layout): depth d must be positive and finite, got 0 mm; give the "
            "weld dimensions in mm");
}

// IIW Gough-Pollard interaction (from memory [M]): FAT 71 normal with ds = 50 MPa and FAT 80 shear with
// dt = 40 MPa, both at 2e6 cycles: (50/71)^2 + (40/80)^2 = 0.49593 + 0.25 = 0.74593; CV = 1.0 proportional,
// 0.5 non-proportional (utilization 1.4919) [D].
TEST(CombinedCheck, IiwQuadraticInteraction) {
  const RangeCheck n = check_range(parse_sn_curve("IIW FAT 71"), 50.0, cycles(2e6), "web weld");
  const RangeCheck s = check_range(parse_sn_curve("IIW FAT 80 shear"), 40.0, cycles(2e6), "web weld");
  const double value = std::pow(50.0 / 71.0, 2) + 0.25;
  const CombinedCheck p = check_combined(n, s, Interaction::iiw_quadratic, Proportionality::proportional);
  EXPECT_CLOSE(p.value, value, 1e-12);
  EXPECT_CLOSE(p.utilization, value, 1e-12);
  const CombinedCheck q = check_combined(n, s, Interaction::iiw_quadratic, Proportionality::non_proportional);
  EXPECT_CLOSE(q.limit, 0.5, 1e-15);
  EXPECT_CLOSE(q.utilization, value / 0.5, 1e-12);
}

// EN 1993-1-9 Eq. 8.3 (from memory [M]) at 1e6 cycles, category 71 with ds = 60 MPa (above ds_D = 52.3 MPa, so
// on the m = 3 line) and shear 100 with dt = 60 MPa: ds_E2 = 60 (1e6/2e6)^(1/3), (ds_E2/71)^3 = 0.30176;
// dt_E2 = 60 (1e6/2e6)^(1/5), (dt_E2/100)^5 = 0.03888 [D].
TEST(CombinedCheck, EnDamageSumEqualsEquation83) {
  const RangeCheck n = check_range(parse_sn_curve("EN 71"), 60.0, cycles(1e6), "web weld");
  const RangeCheck s = check_range(parse_sn_curve("EN 100 shear"), 60.0, cycles(1e6), "web weld");
  const double term_n = std::pow(60.0 * std::cbrt(0.5) / 71.0, 3);
  const double term_s = std::pow(60.0 * std::pow(0.5, 0.2) / 100.0, 5);
  const CombinedCheck c = check_combined(n, s, Interaction::en_damage_sum);
  EXPECT_CLOSE(c.value, term_n + term_s, 1e-12);
  EXPECT_CLOSE(c.limit, 1.0, 1e-15);
  EXPECT_EQ(error_of([&] { check_combined(s, n, Interaction::en_damage_sum); }),
            "web weld: the normal-stress check must be a normal stress check, but its curve 'EN 1993-1-9 detail "
            "category 100 (shear stress)' is for shear stress");
  EXPECT_EQ(parse_interaction("en", "x"), Interaction::en_damage_sum);
  EXPECT_EQ(to_string(Proportionality::non_proportional), "non-proportional");
}

// Nominal 100 MPa on FAT 80 and hot spot 150 MPa on FAT 100 at 2e6 cycles (IIW [M]): utilizations 1.25 and 1.5,
// concentration factor 1.5; the hot spot governs [D].
TEST(MethodComparison, HotSpotGovernsWithItsVerdict) {
  const RangeCheck n = check_range(parse_sn_curve("IIW FAT 80"), 100.0, cycles(2e6), "nominal");
  const RangeCheck h = check_range(parse_sn_curve("IIW FAT 100"), 150.0, cycles(2e6), "hot spot");
  const MethodComparison c = compare_methods(n, h, "toe 'T1' station 4");
  EXPECT_EQ(c.governing, Method::hot_spot);
  ASSERT_TRUE(c.concentration_factor.has_value());
  EXPECT_CLOSE(*c.concentration_factor, 1.5, 1e-15);
  EXPECT_EQ(c.verdict,
            "toe 'T1' station 4: hot-spot governs, utilization 1.5 by hot spot (150 MPa, IIW FAT 100 (steel, normal "
            "stress)) against 1.25 by nominal (100 MPa, IIW FAT 80 (steel, normal stress)); stress concentration "
            "factor 1.5");
}

// Nominal 100 MPa on FAT 50 (utilization 2.0) against hot spot 120 MPa on FAT 100 (1.2): nominal governs [D].
// Equal utilizations (100 on FAT 80 and 125 on FAT 100: both 1.25, up to the round-off of the curve arithmetic)
// go to the hot spot.
TEST(MethodComparison, NominalGovernsOnlyWhenStrictlyLarger) {
  const RangeRequirement req = cycles(2e6);
  const MethodComparison a = compare_methods(check_range(parse_sn_curve("IIW FAT 50"), 100.0, req),
                                             check_range(parse_sn_curve("IIW FAT 100"), 120.0, req), "toe A");
  EXPECT_EQ(a.governing, Method::nominal);
  EXPECT_CLOSE(a.nominal.utilization, 2.0, 1e-12);
  const MethodComparison tie = compare_methods(check_range(parse_sn_curve("IIW FAT 80"), 100.0, req),
                                               check_range(parse_sn_curve("IIW FAT 100"), 125.0, req), "toe B");
  EXPECT_CLOSE(tie.nominal.utilization, tie.hot_spot.utilization, 1e-12);
  EXPECT_EQ(tie.governing, Method::hot_spot);
}

TEST(MethodComparison, ShearOrZeroNominalHasNoConcentrationFactor) {
  const RangeRequirement req = cycles(2e6);
  const RangeCheck h = check_range(parse_sn_curve("IIW FAT 90"), 90.0, req, "hot spot");
  const MethodComparison shear = compare_methods(check_range(parse_sn_curve("IIW FAT 80 shear"), 40.0, req), h, "t");
  EXPECT_FALSE(shear.concentration_factor.has_value());
  const MethodComparison zero = compare_methods(check_range(parse_sn_curve("IIW FAT 80"), 0.0, req), h, "t");
  EXPECT_FALSE(zero.concentration_factor.has_value());
  EXPECT_EQ(error_of([&] { compare_methods(h, check_range(parse_sn_curve("IIW FAT 80 shear"), 1.0, req), "toe C"); }),
            "toe C: the hot-spot check must use a normal-stress curve, but 'IIW FAT 80 (steel, shear stress)' is "
            "for shear stress; give a hot-spot FAT class such as \"IIW FAT 90\"");
}

}  // namespace
}  // namespace toehold::nominal
