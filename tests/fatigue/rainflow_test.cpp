#include "toehold/common/error.hpp"
#include "toehold/fatigue/miner.hpp"
#include "toehold/fatigue/rainflow.hpp"
#include "toehold/fatigue/sn_catalogue.hpp"
#include "support/support.hpp"

#include <algorithm>
#include <cmath>
#include <cstdlib>
#include <map>
#include <random>
#include <vector>

namespace toehold {
namespace {

std::map<double, double> counts_by_range(const std::vector<StressCycle>& cycles) {
  std::map<double, double> out;
  for (const StressCycle& c : cycles) out[c.range] += c.count;
  return out;
}

const std::vector<double> kAstmHistory{-2, 1, -3, 5, -1, 3, -4, 4, -2};

std::vector<double> random_history(unsigned seed, std::size_t n) {
  std::mt19937 gen(seed);
  std::uniform_int_distribution<int> dist(-50, 50);  // integers: exact ties and plateaus occur
  std::vector<double> h(n);
  for (double& v : h) v = dist(gen);
  return h;
}

// The history rotated to start at its largest absolute value and closed with that value again.
std::vector<double> started_at_peak(const std::vector<double>& h) {
  const auto peak = std::max_element(h.begin(), h.end(), [](double a, double b) { return std::abs(a) < std::abs(b); });
  std::vector<double> out(peak, h.end());
  out.insert(out.end(), h.begin(), peak + 1);
  return out;
}

}  // namespace

// ASTM E1049-85 sec. 5.4.4, Fig. 6 example (REFERENCE-VALUES [S2]).
TEST(Rainflow, AstmExampleCounts) {
  const std::vector<StressCycle> cycles = rainflow_count(kAstmHistory, ResidueRule::half_cycles);
  const std::map<double, double> expected{{3, 0.5}, {4, 1.5}, {6, 0.5}, {8, 1.0}, {9, 0.5}};
  EXPECT_EQ(counts_by_range(cycles), expected);
  EXPECT_EQ(total_count(cycles), 4.0);
}

// ASTM E1049-85 sec. 5.4.5, the same history repeating, started at its largest peak (REFERENCE-VALUES [D]).
TEST(Rainflow, AstmRepeatingHistoryCountsFullCycles) {
  const std::vector<StressCycle> cycles = rainflow_count(kAstmHistory, ResidueRule::repeat_history);
  const std::map<double, double> expected{{3, 1.0}, {4, 1.0}, {7, 1.0}, {9, 1.0}};
  EXPECT_EQ(counts_by_range(cycles), expected);
  for (const StressCycle& c : cycles) EXPECT_EQ(c.count, 1.0);
}

// Hand-traced from the ASTM example: the full cycle of range 4 is -1 -> 3 (indices 4, 5), mean 1 [D].
TEST(Rainflow, CyclesCarryMeanAndIndices) {
  const std::vector<StressCycle> cycles = rainflow_count(kAstmHistory);
  const auto full = std::find_if(cycles.begin(), cycles.end(), [](const StressCycle& c) { return c.count == 1.0; });
  ASSERT_NE(full, cycles.end());
  EXPECT_EQ(full->range, 4.0);
  EXPECT_EQ(full->mean, 1.0);
  EXPECT_EQ(full->first, 4u);
  EXPECT_EQ(full->last, 5u);
}

// Points inside monotone runs and plateaus are not turning points (ASTM E1049-85 sec. 5.4.4 step 1) [D].
TEST(Rainflow, TurningPointsDropPlateausAndRuns) {
  const std::vector<double> h{0, 1, 2, 2, 3, 1, 1, -1, 0};
  EXPECT_EQ(turning_point_indices(h), (std::vector<std::size_t>{0, 4, 7, 8}));
  const std::map<double, double> expected{{1, 0.5}, {3, 0.5}, {4, 0.5}};
  EXPECT_EQ(counts_by_range(rainflow_count(h)), expected);
}

TEST(Rainflow, ShortHistories) {
  EXPECT_TRUE(rainflow_count(std::vector<double>{}).empty());
  EXPECT_TRUE(rainflow_count(std::vector<double>{5.0}).empty());
  EXPECT_TRUE(rainflow_count(std::vector<double>{5.0, 5.0}).empty());
  const std::vector<StressCycle> one = rainflow_count(std::vector<double>{-1.0, 3.0}, ResidueRule::repeat_history);
  ASSERT_EQ(one.size(), 1u);
  EXPECT_EQ(one[0].range, 4.0);
  EXPECT_EQ(one[0].count, 1.0);
}

// Feeding values one at a time and collecting as it goes gives the same cycles as the whole-history call.
TEST(Rainflow, StreamingEqualsWholeHistory) {
  const std::vector<double> h = random_history(7, 5000);
  RainflowCounter counter;
  std::vector<StressCycle> streamed;
  for (std::size_t i = 0; i < h.size(); ++i) {
    counter.push(h[i]);
    if (i % 97 == 0) {
      const std::vector<StressCycle> part = counter.take_closed_cycles();
      streamed.insert(streamed.end(), part.begin(), part.end());
    }
  }
  const std::vector<StressCycle> rest = counter.finish(ResidueRule::half_cycles);
  streamed.insert(streamed.end(), rest.begin(), rest.end());
  EXPECT_EQ(counts_by_range(streamed), counts_by_range(rainflow_count(h)));
  EXPECT_EQ(counter.values_pushed(), 0u);  // finish resets the counter
}

// Each range between successive turning points is half of a cycle: total count = (turning points - 1) / 2 [D].
TEST(Rainflow, TotalCountIsHalfTheNumberOfReversals) {
  for (unsigned seed = 1; seed <= 20; ++seed) {
    const std::vector<double> h = random_history(seed, 300);
    const double reversals = static_cast<double>(turning_point_indices(h).size() - 1);
    EXPECT_EQ(total_count(rainflow_count(h)), 0.5 * reversals);
  }
}

// A repeating history has no start: counted by sec. 5.4.5, by 5.4.4 after rotating it to start and end at its
// largest peak, or from any other starting point, the damage is the same [D].
TEST(Rainflow, RotatingARepeatingHistoryToItsPeakLeavesDamageUnchanged) {
  const SnCurve curve = iiw_fat(90.0);
  for (unsigned seed = 1; seed <= 30; ++seed) {
    std::vector<double> h = random_history(seed, 200);
    for (double& v : h) v *= 3.0;  // ranges up to 300 MPa, on both sides of the knee
    const double repeating = miner_damage(curve, rainflow_count(h, ResidueRule::repeat_history));
    const std::vector<double> at_peak = started_at_peak(h);
    EXPECT_CLOSE(miner_damage(curve, rainflow_count(at_peak, ResidueRule::half_cycles)), repeating, 1e-12);
    std::vector<double> shifted = h;
    std::rotate(shifted.begin(), shifted.begin() + 1 + static_cast<long>(seed), shifted.end());
    EXPECT_CLOSE(miner_damage(curve, rainflow_count(shifted, ResidueRule::repeat_history)), repeating, 1e-12);
    EXPECT_EQ(counts_by_range(rainflow_count(at_peak, ResidueRule::repeat_history)),
              counts_by_range(rainflow_count(h, ResidueRule::repeat_history)));
  }
}

// Millions of points in one pass (O(n)); a sine-like history of 2e6 points with 1e6 reversals [D].
TEST(Rainflow, MillionsOfPoints) {
  std::vector<double> h(2'000'000);
  for (std::size_t i = 0; i < h.size(); ++i) h[i] = (i % 2 == 0 ? 100.0 : -100.0) + static_cast<double>(i % 7);
  const std::vector<StressCycle> cycles = rainflow_count(h);
  EXPECT_EQ(total_count(cycles), 0.5 * static_cast<double>(h.size() - 1));
}

TEST(Rainflow, MergeAndBinRanges) {
  const std::vector<StressCycle> merged = merge_equal_ranges(rainflow_count(kAstmHistory));
  ASSERT_EQ(merged.size(), 5u);
  EXPECT_EQ(merged[0].range, 9.0);
  EXPECT_EQ(merged[3].range, 4.0);
  EXPECT_EQ(merged[3].count, 1.5);
  EXPECT_EQ(merged[3].first, kNoIndex);
  // Ranges 3, 4, 6, 8, 9 in bins of 5: 3 and 4 -> 5 (2.0 cycles), 6, 8, 9 -> 10 (2.0 cycles) [D].
  const std::vector<StressCycle> binned = bin_ranges(rainflow_count(kAstmHistory), 5.0);
  ASSERT_EQ(binned.size(), 2u);
  EXPECT_EQ(binned[0].range, 10.0);
  EXPECT_EQ(binned[0].count, 2.0);
  EXPECT_EQ(binned[1].range, 5.0);
  EXPECT_EQ(binned[1].count, 2.0);
}

TEST(Rainflow, BadInputsAreErrors) {
  RainflowCounter counter;
  counter.push(std::vector<double>{1.0, 2.0, 3.0});
  try {
    counter.push(std::numeric_limits<double>::infinity());
    FAIL();
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()),
              "rainflow count: history value inf at index 3 is not finite; remove or repair that value");
  }
  try {
    parse_residue_rule("drop", "plan key loading.residue");
    FAIL();
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()),
              "plan key loading.residue: unknown residue rule 'drop'; use one of half_cycles, repeat_history");
  }
  EXPECT_THROW(bin_ranges(std::vector<StressCycle>{}, 0.0), Error);
  EXPECT_EQ(parse_residue_rule("repeat_history", "x"), ResidueRule::repeat_history);
  EXPECT_EQ(describe(ResidueRule::half_cycles), "ASTM E1049-85 sec. 5.4.4, residue counted as half cycles");
}

}  // namespace toehold
