#include "toehold/common/error.hpp"
#include "toehold/nominal/infinite_life.hpp"
#include "toehold/nominal/names.hpp"
#include "support/support.hpp"

#include <cmath>
#include <limits>

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

// Budynas and Nisbett 9th ed. Tables 6-6/6-7 [S] (elliptic [S2]); numbers derived [D] in the reference file:
// S_e 276, S_y 413, S_ut 551 MPa, s_a 172, s_m 178.40 MPa -> Goodman 1.0560, Gerber 1.3141, elliptic 1.3188.
TEST(InfiniteLife, CriteriaMatchReferenceValues) {
  EXPECT_CLOSE(goodman_factor(172, 178.40, 276, 551), 1.0560, 5e-5);
  EXPECT_CLOSE(gerber_factor(172, 178.40, 276, 551), 1.3141, 5e-5);
  EXPECT_CLOSE(asme_elliptic_factor(172, 178.40, 276, 413), 1.3188, 5e-5);
}

// Langer first-cycle yield [S]: n_y = 413/(172 + 178.40) = 413/350.40 = 1.17865 [D].
TEST(InfiniteLife, FirstCycleYield) { EXPECT_CLOSE(first_cycle_yield_factor(172, 178.40, 413), 1.17865, 1e-5); }

// Limits of the formulas, derived [D]: no mean -> S_e/s_a for all three; no amplitude -> S_ut/s_m (Goodman,
// Gerber) and S_y/s_m (elliptic); compressive mean -> S_e/s_a (textbook sec. 6-12, from memory [M]).
TEST(InfiniteLife, LimitsOfTheCriteria) {
  EXPECT_CLOSE(goodman_factor(100, 0, 250, 500), 2.5, 1e-12);
  EXPECT_CLOSE(gerber_factor(100, 0, 250, 500), 2.5, 1e-12);
  EXPECT_CLOSE(asme_elliptic_factor(100, 0, 250, 400), 2.5, 1e-12);
  EXPECT_CLOSE(goodman_factor(0, 100, 250, 500), 5.0, 1e-12);
  EXPECT_CLOSE(gerber_factor(0, 100, 250, 500), 5.0, 1e-12);
  EXPECT_CLOSE(asme_elliptic_factor(0, 100, 250, 400), 4.0, 1e-12);
  EXPECT_CLOSE(goodman_factor(100, -80, 250, 500), 2.5, 1e-12);
  EXPECT_CLOSE(gerber_factor(100, -80, 250, 500), 2.5, 1e-12);
  EXPECT_CLOSE(first_cycle_yield_factor(100, -80, 360), 2.0, 1e-12);
  EXPECT_TRUE(std::isinf(goodman_factor(0, 0, 250, 500)));
  EXPECT_TRUE(std::isinf(first_cycle_yield_factor(0, 0, 300)));
}

// Derived [D]: tiny amplitude with a large mean approaches S_ut/s_m without loss of digits, and a tiny mean
// approaches S_e/s_a: both ends of the stable form of -1 + sqrt(1 + x^2).
TEST(InfiniteLife, GerberIsStableNearBothAxes) {
  EXPECT_CLOSE(gerber_factor(1e-9, 100, 250, 500), 5.0, 1e-9);
  EXPECT_CLOSE(gerber_factor(100, 1e-9, 250, 500), 2.5, 1e-9);
}

// Property [D]: the Gerber parabola lies outside the Goodman line for every load line in the first quadrant.
TEST(InfiniteLife, GerberIsNeverBelowGoodman) {
  for (double sa = 10; sa <= 300; sa += 29)
    for (double sm = 5; sm <= 400; sm += 37)
      EXPECT_GE(gerber_factor(sa, sm, 200, 600), goodman_factor(sa, sm, 200, 600) * (1 - 1e-12));
}

TEST(InfiniteLife, BadStressesAreErrors) {
  EXPECT_EQ(error_of([] { goodman_factor(-5, 10, 200, 400); }),
            "Goodman criterion: stress amplitude must be zero or positive, got -5 MPa; give half the stress range");
  EXPECT_EQ(error_of([] { gerber_factor(5, 10, 0, 400); }),
            "Gerber criterion: endurance limit S_e must be positive and finite, got 0 MPa");
  EXPECT_EQ(error_of([] { asme_elliptic_factor(5, std::numeric_limits<double>::quiet_NaN(), 200, 300); }),
            "ASME-elliptic criterion: mean stress is missing; give it in MPa");
}

TEST(InfiniteLife, WeldCheckRefusesYieldAsTheFatigueCriterion) {
  WeldCheckInput in{find_material("ASTM A36"), WeldDetail::transverse_fillet_toe, {}, Criterion::first_cycle_yield};
  EXPECT_EQ(error_of([&] { check_weld_infinite_life(in, 10, 10); }),
            "weld check: the fatigue criterion must be goodman, gerber or asme-elliptic; first-cycle yield is always "
            "checked beside it");
}

// A butt weld in axial loading uses the tensile strengths. Hand calculation, ASTM A36 (S_ut 400, S_y 250 MPa
// [S]), reinforced butt K_fs = 1.2 [S], hot-rolled surface, axial, 50 % reliability, Gerber:
//   S'e = 200; k_a = 57.7 x 400^-0.718 = 57.7 x exp(-0.718 x 5.991465) = 57.7 x 0.0135432 = 0.781442;
//   k_b = 1 (axial); k_c = 0.85; S_e = 0.781442 x 0.85 x 200 = 132.845 MPa.
//   Nominal s_a = 40, s_m = 30 -> s_a = 48, s_m = 36 MPa after K_fs.
//   Gerber: x = 2 x 36 x 132.845/(400 x 48) = 0.498169; -1 + sqrt(1 + x^2) = 0.117216;
//     n = 0.5 (400/36)^2 (48/132.845) 0.117216 = 0.5 x 123.4568 x 0.361323 x 0.117216 = 2.61438.
//   Yield: 250/(48 + 36) = 2.97619. Gerber governs.
TEST(InfiniteLife, AxialButtWeldUsesTensileStrengths) {
  WeldCheckInput in;
  in.material = find_material("ASTM A36");
  in.detail = WeldDetail::reinforced_butt;
  in.marin.surface = Surface::hot_rolled;
  in.marin.load = LoadKind::axial;
  in.criterion = Criterion::gerber;
  const WeldCheck c = check_weld_infinite_life(in, 40, 30);
  EXPECT_FALSE(c.shear);
  EXPECT_CLOSE(c.endurance.k_a, 0.781442, 1e-6);
  EXPECT_CLOSE(c.endurance.endurance_MPa, 132.845, 1e-5);
  EXPECT_CLOSE(c.alternating_MPa, 48, 1e-12);
  EXPECT_CLOSE(c.mean_MPa, 36, 1e-12);
  EXPECT_CLOSE(c.gerber, 2.61438, 1e-5);
  EXPECT_CLOSE(c.first_cycle_yield, 2.97619, 1e-5);
  EXPECT_EQ(c.governing, Criterion::gerber);
  EXPECT_CLOSE(c.factor_of_safety, c.gerber, 1e-15);
}

TEST(NominalNames, EveryChoiceHasOneSpelling) {
  EXPECT_EQ(parse_weld_layout("across-pair", "x"), WeldLayout::across_pair);
  EXPECT_EQ(parse_surface("as-forged", "x"), Surface::as_forged);
  EXPECT_EQ(parse_load_kind("torsion-shear", "x"), LoadKind::torsion_shear);
  EXPECT_EQ(parse_weld_detail("parallel-fillet-end", "x"), WeldDetail::parallel_fillet_end);
  EXPECT_EQ(parse_criterion("asme-elliptic", "x"), Criterion::asme_elliptic);
  EXPECT_EQ(to_string(Criterion::first_cycle_yield), "first-cycle-yield");
  EXPECT_EQ(to_string(WeldLayout::parallel_pair), "parallel-pair");
  EXPECT_EQ(error_of([] { parse_surface("polished", "plan key nominal.surface"); }),
            "plan key nominal.surface: unknown surface finish 'polished'; use one of ground, machined, hot-rolled, "
            "as-forged");
}

}  // namespace toehold::nominal
