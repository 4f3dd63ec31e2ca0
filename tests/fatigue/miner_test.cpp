#include "toehold/common/error.hpp"
#include "toehold/fatigue/miner.hpp"
#include "toehold/fatigue/rainflow.hpp"
#include "toehold/fatigue/sn_catalogue.hpp"
#include "support/support.hpp"

#include <algorithm>
#include <cmath>
#include <functional>
#include <limits>
#include <random>
#include <string>
#include <vector>

namespace toehold {
namespace {

std::string error_of(const std::function<void()>& fn) {
  try {
    fn();
  } catch (const Error& e) {
    return e.what();
  }
  return "no error";
}

StressCycle cycles_of(double range, double count) { return {range, 0.0, count, kNoIndex, kNoIndex}; }

// Random cycle list: ranges 0..300 MPa on a 0.5 MPa grid (so equal damages, ties, occur), counts 0.5 or 1 or a
// block count, means anywhere.
std::vector<StressCycle> random_cycles(unsigned seed, std::size_t n) {
  std::mt19937 gen(seed);
  std::uniform_int_distribution<int> half_mpa(0, 600), kind(0, 2);
  std::uniform_real_distribution<double> mean(-100.0, 100.0), block(0.0, 1e4);
  std::vector<StressCycle> out(n);
  for (std::size_t i = 0; i < n; ++i) {
    const int k = kind(gen);
    out[i] = {0.5 * half_mpa(gen), mean(gen), k == 0 ? 0.5 : k == 1 ? 1.0 : block(gen), i, i + 1};
  }
  return out;
}

// The plain reference: every cycle's n / N, summed in list order, and the whole list sorted by damage
// (descending, earlier position first on ties).
struct PlainMiner {
  double sum = 0.0;
  std::vector<CycleDamage> sorted;
};

PlainMiner plain_miner(const SnCurve& curve, const std::vector<StressCycle>& cycles) {
  PlainMiner p;
  for (std::size_t i = 0; i < cycles.size(); ++i) {
    const double n = curve.cycles_to_failure(cycles[i].range, Amplitude::variable);
    const double d = std::isinf(n) ? 0.0 : cycles[i].count / n;
    p.sum += d;
    p.sorted.push_back({cycles[i], i, d, 0.0});
  }
  std::stable_sort(p.sorted.begin(), p.sorted.end(),
                   [](const CycleDamage& a, const CycleDamage& b) { return a.damage > b.damage; });
  return p;
}

}  // namespace

// Constant amplitude: D = n / N exactly. FAT 90, 1e6 cycles of 100 MPa: N = 2e6 (0.9)^3 = 1.458e6,
// D = 1e6 / 1.458e6 = 0.685871 [D].
TEST(Miner, ConstantAmplitudeDamageIsNOverN) {
  const SnCurve c = iiw_fat(90.0);
  EXPECT_EQ(constant_amplitude_damage(c, 100.0, 1e6), 1e6 / c.cycles_to_failure(100.0, Amplitude::constant));
  EXPECT_CLOSE(constant_amplitude_damage(c, 100.0, 1e6), 1e6 / 1.458e6, 1e-14);
  EXPECT_CLOSE(constant_amplitude_damage(c, 100.0, 1.458e6), 1.0, 1e-14);
  // Below the EN fatigue limit ds_D constant amplitude does no damage (EN 1993-1-9 sec. 7.1 [S via ref]).
  EXPECT_EQ(constant_amplitude_damage(en_1993_detail(71.0), 50.0, 1e9), 0.0);
}

// Two-slope hand calculation, IIW FAT 90, variable amplitude (m1 = 3 to 1e7, m2 = 5 beyond), [D]:
//   knee ds_k = 90 (2e6/1e7)^(1/3) = 52.632 MPa
//   1e5 cycles at 120 MPa: N = 2e6 (90/120)^3 = 843 750        -> d = 0.118519
//   1e6 cycles at  60 MPa: N = 2e6 (90/60)^3  = 6.75e6         -> d = 0.148148
//   1e7 cycles at  30 MPa: N = 1e7 (52.632/30)^5 = 1.66210e8   -> d = 0.060165
//   D = 0.326832
TEST(Miner, TwoSlopeDamageHandCalculation) {
  const std::vector<StressCycle> spectrum{cycles_of(120.0, 1e5), cycles_of(60.0, 1e6), cycles_of(30.0, 1e7)};
  const double ds_k = 90.0 * std::cbrt(2e6 / 1e7);
  const double expected = 1e5 / 843750.0 + 1e6 / 6.75e6 + 1e7 / (1e7 * std::pow(ds_k / 30.0, 5.0));
  EXPECT_CLOSE(miner_damage(iiw_fat(90.0), spectrum), expected, 1e-13);
  EXPECT_CLOSE(miner_damage(iiw_fat(90.0), spectrum), 0.326832, 1e-5);
}

// IIW 2016 sec. 4.3.1 [M]: ds_eq = [(sum n_i ds_i^3 + ds_k^(3-5) sum n_j ds_j^5) / 2e6]^(1/3), equal to
// FAT D^(1/3) = 90 x 0.326832^(1/3) = 61.994 MPa for the spectrum above [D].
TEST(Miner, EquivalentRangeAt2e6MatchesIiwFormula) {
  const std::vector<StressCycle> spectrum{cycles_of(120.0, 1e5), cycles_of(60.0, 1e6), cycles_of(30.0, 1e7)};
  const double ds_k = 90.0 * std::cbrt(2e6 / 1e7);
  const double sum = 1e5 * std::pow(120.0, 3) + 1e6 * std::pow(60.0, 3) + std::pow(ds_k, -2.0) * 1e7 * std::pow(30.0, 5);
  EXPECT_CLOSE(equivalent_range(iiw_fat(90.0), spectrum), std::cbrt(sum / 2e6), 1e-13);
  EXPECT_CLOSE(equivalent_range(iiw_fat(90.0), spectrum), 61.994, 1e-4);
  // Relative to the total number of cycles, a single constant range is its own equivalent [D].
  const std::vector<StressCycle> one{cycles_of(80.0, 3e5)};
  EXPECT_CLOSE(equivalent_range(iiw_fat(90.0), one, total_count(one)), 80.0, 1e-13);
}

// Allowable Miner sums (REFERENCE-VALUES [M]): IIW 0.5, 0.2 for widely varying mean stress, EN and DNV 1.0.
TEST(Miner, AllowableDamageSums) {
  EXPECT_EQ(allowable_damage_sum(MinerLimit::iiw), 0.5);
  EXPECT_EQ(allowable_damage_sum(MinerLimit::iiw_varying_mean), 0.2);
  EXPECT_EQ(allowable_damage_sum(MinerLimit::eurocode), 1.0);
  EXPECT_EQ(allowable_damage_sum(MinerLimit::dnv), 1.0);
  EXPECT_EQ(parse_miner_limit("iiw_varying_mean", "x"), MinerLimit::iiw_varying_mean);
  EXPECT_EQ(to_string(MinerLimit::eurocode), "eurocode");
}

// Life in repeats = D_allow / D per repeat; no damage -> infinite life [D].
TEST(Miner, LifeInRepeats) {
  EXPECT_CLOSE(life_in_repeats(0.001, 0.5), 500.0, 1e-14);
  EXPECT_EQ(life_in_repeats(0.0), std::numeric_limits<double>::infinity());
  // Hand check through rainflow: the ASTM history (in MPa x 10) repeating, on FAT 90: full cycles of 90, 70,
  // 40, 30 MPa; D = sum 1 / N_i with the two-slope curve [D].
  std::vector<double> h{-2, 1, -3, 5, -1, 3, -4, 4, -2};
  for (double& v : h) v *= 10.0;
  const SnCurve c = iiw_fat(90.0);
  const double ds_k = 90.0 * std::cbrt(0.2);
  const double d = 1.0 / 2e6 + 1.0 / (2e6 * std::pow(90.0 / 70.0, 3)) + 1.0 / (1e7 * std::pow(ds_k / 40.0, 5)) +
                   1.0 / (1e7 * std::pow(ds_k / 30.0, 5));
  const double per_repeat = miner_damage(c, rainflow_count(h, ResidueRule::repeat_history));
  EXPECT_CLOSE(per_repeat, d, 1e-13);
  EXPECT_CLOSE(life_in_repeats(per_repeat, 0.5), 0.5 / d, 1e-13);
}

// In the two-slope spectrum above the 60 MPa block governs (0.148148 / 0.326832 = 45.3 %), then the
// 120 MPa block (36.3 %) [D].
TEST(Miner, GoverningCyclesAreTheMostDamaging) {
  const std::vector<StressCycle> spectrum{cycles_of(120.0, 1e5), cycles_of(60.0, 1e6), cycles_of(30.0, 1e7)};
  const std::vector<CycleDamage> top = governing_cycles(iiw_fat(90.0), spectrum, 2);
  ASSERT_EQ(top.size(), 2u);
  EXPECT_EQ(top[0].position, 1u);
  EXPECT_CLOSE(top[0].share, 0.148148 / 0.326832, 1e-5);
  EXPECT_EQ(top[1].position, 0u);
  EXPECT_CLOSE(top[1].damage, 0.118519, 1e-5);
  EXPECT_EQ(governing_cycles(iiw_fat(90.0), spectrum, 10).size(), 3u);
}

// The one-pass tally (miner_damage, governing_cycles, MinerTally) against the plain sum and full sort above, on
// random lists with many ties: the same sum bit for bit, the same governing cycles in the same order.
TEST(Miner, OnePassTallyEqualsPlainSumAndSort) {
  const std::vector<SnCurve> curves{iiw_fat(90.0), user_segment_curve("cut", {SnSegment::through(3.0, 90.0, 2e6)}, 40.0)};
  for (unsigned seed = 1; seed <= 20; ++seed) {
    const std::vector<StressCycle> cycles = random_cycles(seed, 2000);
    for (const SnCurve& curve : curves) {
      const PlainMiner plain = plain_miner(curve, cycles);
      EXPECT_EQ(miner_damage(curve, cycles), plain.sum);
      EXPECT_EQ(equivalent_range(curve, cycles), equivalent_range_of_damage(curve, plain.sum));
      for (std::size_t how_many : {0u, 1u, 3u, 25u, 5000u}) {
        const std::vector<CycleDamage> top = governing_cycles(curve, cycles, how_many);
        ASSERT_EQ(top.size(), std::min(how_many, cycles.size()));
        for (std::size_t i = 0; i < top.size(); ++i) {
          EXPECT_EQ(top[i].position, plain.sorted[i].position);
          EXPECT_EQ(top[i].damage, plain.sorted[i].damage);
          EXPECT_EQ(top[i].share, plain.sorted[i].damage / plain.sum);
          EXPECT_EQ(top[i].cycle.range, cycles[top[i].position].range);
        }
      }
    }
  }
}

// The equivalent range from a known Miner sum: FAT 90 D^(1/3) (IIW 2016 sec. 4.3.1 [M]; 90 x 0.125^(1/3) = 45
// MPa, derived [D]).
TEST(Miner, EquivalentRangeOfAKnownDamage) {
  EXPECT_CLOSE(equivalent_range_of_damage(iiw_fat(90.0), 0.125), 45.0, 1e-13);
  EXPECT_EQ(equivalent_range_of_damage(iiw_fat(90.0), 0.0), 0.0);
  EXPECT_EQ(error_of([] { equivalent_range_of_damage(iiw_fat(90.0), 0.5, 0.0); }),
            "Miner sum on S-N curve 'IIW FAT 90 (steel, normal stress)': reference number of cycles 0 for the "
            "equivalent range must be finite and > 0");
}

TEST(Miner, BadCyclesAreErrors) {
  const SnCurve c = iiw_fat(90.0);
  EXPECT_EQ(error_of([&] { miner_damage(c, std::vector<StressCycle>{cycles_of(50.0, 1.0), cycles_of(50.0, -1.0)}); }),
            "Miner sum on S-N curve 'IIW FAT 90 (steel, normal stress)': cycle 2 has count -1; counts must be "
            "finite and >= 0");
  EXPECT_EQ(error_of([&] { miner_damage(c, std::vector<StressCycle>{cycles_of(std::nan(""), 1.0)}); }),
            "Miner sum on S-N curve 'IIW FAT 90 (steel, normal stress)': cycle 1 has stress range nan MPa; ranges "
            "must be finite and >= 0 (check the stress history)");
  EXPECT_EQ(error_of([&] { constant_amplitude_damage(c, 100.0, -5.0); }),
            "Miner sum on S-N curve 'IIW FAT 90 (steel, normal stress)': number of cycles -5 must be finite and >= 0");
  EXPECT_EQ(error_of([] { life_in_repeats(0.1, 0.0); }),
            "life in repeats: allowable Miner sum 0 must be finite and > 0");
  EXPECT_EQ(error_of([] { parse_miner_limit("bs7608", "plan key fatigue.miner_limit"); }),
            "plan key fatigue.miner_limit: unknown Miner sum limit 'bs7608'; use one of iiw (0.5), iiw_varying_mean "
            "(0.2), eurocode (1.0), dnv (1.0)");
}

}  // namespace toehold
