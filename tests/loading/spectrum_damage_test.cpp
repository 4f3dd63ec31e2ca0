// Damage of a counted spectrum: Miner sums checked against hand calculations written out here, on IIW FAT 90
// (IIW 2016 sec. 3.7: N = 2e6 (FAT/ds)^3 to the knee at 1e7, m = 5 beyond, from memory [M]).
#include "toehold/common/error.hpp"
#include "toehold/fatigue/rainflow.hpp"
#include "toehold/fatigue/sn_catalogue.hpp"
#include "toehold/loading/spectrum_damage.hpp"
#include "support/support.hpp"

#include <cmath>
#include <random>
#include <vector>

namespace toehold {
namespace {

StressCycle cycles_of(double range, double count, double mean = 0.0) { return StressCycle{range, mean, count}; }

// The plain reference: the factored cycles (gamma_F gamma_M ds / f(R)) built as a list, then the separate Miner
// sum, equivalent range and governing-cycle calls on it.
SpectrumDamage separate_calls(const std::vector<StressCycle>& cycles, const SnCurve& curve, const DamageRules& rules) {
  std::vector<StressCycle> design = cycles;
  for (StressCycle& c : design) {
    double f = 1.0;
    const double s_max = c.mean + 0.5 * c.range, s_min = c.mean - 0.5 * c.range;
    if (rules.mean_stress && s_max > 0.0) f = iiw_mean_stress_factor(stress_ratio(s_min, s_max), *rules.mean_stress);
    c.range *= rules.gamma_F * rules.gamma_M / f;
  }
  SpectrumDamage d;
  d.damage = miner_damage(curve, design);
  d.equivalent_range = equivalent_range(curve, design) / rules.gamma_M;
  d.governing = governing_cycles(curve, design, rules.governing);
  return d;
}

TEST(SpectrumDamage, ConstantAmplitudeDamageIsCyclesOverCyclesToFailure) {
  const SnCurve curve = iiw_fat(90);
  const std::vector<StressCycle> c{cycles_of(120, 1000)};
  const SpectrumDamage d = spectrum_damage(c, curve, DamageRules{});
  const double n_allow = 2e6 * std::pow(90.0 / 120.0, 3);  // 843750, derived [D]
  EXPECT_CLOSE(d.damage, 1000.0 / n_allow, 1e-14);
  EXPECT_CLOSE(d.utilization, d.damage / 0.5, 1e-14);
  EXPECT_CLOSE(d.life_repeats, 0.5 / d.damage, 1e-14);
  EXPECT_CLOSE(d.life_cycles, 0.5 * n_allow, 1e-9);
  EXPECT_TRUE(std::isnan(d.life_years));
  // ds_eq^3 * 2e6 = 120^3 * 1000 (Miner on the m = 3 segment), derived [D]
  EXPECT_CLOSE(d.equivalent_range, 120.0 * std::cbrt(1000.0 / 2e6), 1e-12);
  ASSERT_EQ(d.governing.size(), 1u);
  EXPECT_CLOSE(d.governing[0].share, 1.0, 1e-15);
}

TEST(SpectrumDamage, TwoSlopeDamageByHand) {
  const SnCurve curve = iiw_fat(90);
  const std::vector<StressCycle> c{cycles_of(100, 1e5), cycles_of(40, 1e7)};
  DamageRules rules;
  rules.repeats_per_year = 4;
  const SpectrumDamage d = spectrum_damage(c, curve, rules);
  // Hand calculation [D] on IIW FAT 90 [M]:
  //   knee range ds_k = 90 (2e6 / 1e7)^(1/3) = 52.63 MPa
  //   100 MPa > ds_k: N1 = 2e6 (90/100)^3 = 1.458e6
  //    40 MPa < ds_k: N2 = 1e7 (ds_k/40)^5 = 1e7 x 1.31581^5 = 3.9442e7   (variable amplitude, m2 = 5)
  //   D = 1e5/N1 + 1e7/N2 = 0.068587 + 0.253535 = 0.322122
  const double knee = 90.0 * std::cbrt(2e6 / 1e7);
  const double n1 = 2e6 * std::pow(90.0 / 100.0, 3), n2 = 1e7 * std::pow(knee / 40.0, 5);
  EXPECT_CLOSE(d.damage, 1e5 / n1 + 1e7 / n2, 1e-12);
  EXPECT_CLOSE(d.damage, 0.322122, 1e-5);
  EXPECT_CLOSE(d.life_years, 0.5 / d.damage / 4.0, 1e-12);
  EXPECT_CLOSE(d.cycles, 1e5 + 1e7, 0);
  EXPECT_CLOSE(d.largest_range, 100.0, 0);
  ASSERT_EQ(d.governing.size(), 2u);
  EXPECT_CLOSE(d.governing[0].cycle.range, 40.0, 0);  // the many small cycles govern here
}

TEST(SpectrumDamage, PartialFactorsScaleTheRange) {
  DamageRules rules;
  rules.gamma_F = 1.1;
  rules.gamma_M = 1.15;
  rules.damage_limit = 1.0;
  const SpectrumDamage d = spectrum_damage(std::vector<StressCycle>{cycles_of(120, 1000)}, iiw_fat(90), rules);
  // N = 2e6 (90 / (1.1 * 1.15 * 120))^3, derived [D]
  EXPECT_CLOSE(d.damage, 1000.0 / (2e6 * std::pow(90.0 / (1.1 * 1.15 * 120.0), 3)), 1e-13);
  // The equivalent range carries gamma_F only; gamma_M stays with the allowable (derived [D]).
  EXPECT_CLOSE(d.equivalent_range, 1.1 * 120.0 * std::cbrt(1000.0 / 2e6), 1e-12);
}

TEST(SpectrumDamage, IiwMeanStressEnhancementRaisesTheResistance) {
  DamageRules rules;
  rules.mean_stress = IiwMeanStressCase::stress_relieved;
  // Fully reversed, R = -1: f(R) = 1.2 - 0.4 (-1) = 1.6 (IIW 2016 sec. 3.5.3, case I, from memory [M]).
  const SpectrumDamage reversed =
      spectrum_damage(std::vector<StressCycle>{cycles_of(100, 1000, 0.0)}, iiw_fat(90), rules);
  EXPECT_CLOSE(reversed.damage, 1000.0 / (2e6 * std::pow(1.6 * 90.0 / 100.0, 3)), 1e-13);
  // R = 0.5 (100 to 200 MPa): f = 1.0, no enhancement.
  const SpectrumDamage tensile =
      spectrum_damage(std::vector<StressCycle>{cycles_of(100, 1000, 150.0)}, iiw_fat(90), rules);
  EXPECT_CLOSE(tensile.damage, 1000.0 / (2e6 * std::pow(90.0 / 100.0, 3)), 1e-13);
  // Fully compressive: f = 1 (the conservative choice documented in spectrum_damage.hpp).
  const SpectrumDamage compressive =
      spectrum_damage(std::vector<StressCycle>{cycles_of(100, 1000, -150.0)}, iiw_fat(90), rules);
  EXPECT_CLOSE(compressive.damage, tensile.damage, 1e-15);
}

TEST(SpectrumDamage, NoCyclesDoNoDamage) {
  const SpectrumDamage d = spectrum_damage(std::vector<StressCycle>{}, iiw_fat(90), DamageRules{});
  EXPECT_CLOSE(d.damage, 0.0, 0);
  EXPECT_TRUE(std::isinf(d.life_repeats));
}

TEST(SpectrumDamage, NegativeCyclesAreAnError) {
  try {
    spectrum_damage(std::vector<StressCycle>{cycles_of(50, 10), cycles_of(100, -5)}, iiw_fat(90), DamageRules{});
    FAIL();
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()), "cycle 2: range 100.000000 MPa and count -5.000000 must be finite numbers of 0 or more");
  }
}

// One pass (n / N once per cycle) gives bit for bit the sum, equivalent range and governing cycles of the
// separate calls, with partial factors and the mean-stress enhancement, on rainflow-counted random histories.
TEST(SpectrumDamage, OnePassEqualsSeparateCalls) {
  const SnCurve curve = iiw_fat(71);
  for (unsigned seed = 1; seed <= 12; ++seed) {
    std::mt19937 gen(seed);
    std::normal_distribution<double> stress(40.0, 60.0);
    std::vector<double> history(5000);
    for (double& v : history) v = stress(gen);
    const std::vector<StressCycle> cycles = rainflow_count(history);
    DamageRules rules;
    rules.gamma_F = seed % 2 ? 1.0 : 1.1;
    rules.gamma_M = seed % 3 ? 1.0 : 1.25;
    if (seed % 4 < 2) rules.mean_stress = seed % 2 ? IiwMeanStressCase::stress_relieved : IiwMeanStressCase::small_residual_stress;
    rules.governing = seed;
    const SpectrumDamage a = spectrum_damage(cycles, curve, rules);
    const SpectrumDamage b = separate_calls(cycles, curve, rules);
    EXPECT_EQ(a.damage, b.damage);
    EXPECT_EQ(a.equivalent_range, b.equivalent_range);
    ASSERT_EQ(a.governing.size(), b.governing.size());
    for (std::size_t i = 0; i < a.governing.size(); ++i) {
      EXPECT_EQ(a.governing[i].position, b.governing[i].position);
      EXPECT_EQ(a.governing[i].damage, b.governing[i].damage);
      EXPECT_EQ(a.governing[i].share, b.governing[i].share);
      EXPECT_EQ(a.governing[i].cycle.range, cycles[a.governing[i].position].range);  // as counted, no factors
    }
  }
}

TEST(SpectrumDamage, RepeatingHistoryStartedAtItsPeakGivesTheSameDamage) {
  const std::vector<double> history{10, 80, -20, 150, 30, 90, -60, 40};
  const std::vector<double> rotated{150, 30, 90, -60, 40, 10, 80, -20};
  const SnCurve curve = iiw_fat(71);
  const SpectrumDamage a =
      spectrum_damage(rainflow_count(history, ResidueRule::repeat_history), curve, DamageRules{});
  const SpectrumDamage b =
      spectrum_damage(rainflow_count(rotated, ResidueRule::repeat_history), curve, DamageRules{});
  EXPECT_GT(a.damage, 0.0);
  EXPECT_CLOSE(a.damage, b.damage, 1e-14);
  EXPECT_CLOSE(a.cycles, b.cycles, 0);
}

}  // namespace
}  // namespace toehold
