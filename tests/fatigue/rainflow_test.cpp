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
#include <span>
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

// Real-valued history: a slow sine with noise, some values repeated (plateaus) and some runs (drop-outs).
std::vector<double> random_real_history(unsigned seed, std::size_t n) {
  std::mt19937 gen(seed);
  std::normal_distribution<double> noise(0.0, 30.0);
  std::uniform_int_distribution<int> pick(0, 9);
  std::vector<double> h(n);
  for (std::size_t i = 0; i < n; ++i) {
    const int p = pick(gen);
    if (i > 0 && p == 0) h[i] = h[i - 1];
    else if (i > 0 && p == 1) h[i] = h[i - 1] + 1.0;
    else h[i] = 100.0 * std::sin(0.01 * static_cast<double>(i)) + noise(gen);
  }
  return h;
}

// The history pushed one value at a time (the plain per-value path), counted by rule.
std::vector<StressCycle> counted_value_by_value(const std::vector<double>& h, ResidueRule rule) {
  RainflowCounter counter;
  for (double v : h) counter.push(v);
  return counter.finish(rule);
}

// The history pushed as spans of random lengths 0..max_chunk (the bulk path), counted by rule.
std::vector<StressCycle> counted_in_chunks(const std::vector<double>& h, ResidueRule rule, unsigned seed,
                                           std::size_t max_chunk) {
  std::mt19937 gen(seed);
  std::uniform_int_distribution<std::size_t> length(0, max_chunk);
  RainflowCounter counter;
  std::vector<StressCycle> out;
  for (std::size_t at = 0; at < h.size();) {
    const std::size_t n = std::min(length(gen), h.size() - at);
    counter.push(std::span<const double>(h).subspan(at, n));
    at += n;
    if (n % 3 == 0) {
      const std::vector<StressCycle> part = counter.take_closed_cycles();
      out.insert(out.end(), part.begin(), part.end());
    }
  }
  const std::vector<StressCycle> rest = counter.finish(rule);
  out.insert(out.end(), rest.begin(), rest.end());
  return out;
}

// Same cycles in the same order: ranges, means, counts and indices all bit for bit.
void expect_same_cycles(const std::vector<StressCycle>& actual, const std::vector<StressCycle>& expected) {
  ASSERT_EQ(actual.size(), expected.size());
  for (std::size_t i = 0; i < actual.size(); ++i) {
    EXPECT_EQ(actual[i].range, expected[i].range) << "cycle " << i;
    EXPECT_EQ(actual[i].mean, expected[i].mean) << "cycle " << i;
    EXPECT_EQ(actual[i].count, expected[i].count) << "cycle " << i;
    EXPECT_EQ(actual[i].first, expected[i].first) << "cycle " << i;
    EXPECT_EQ(actual[i].last, expected[i].last) << "cycle " << i;
  }
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

// The bulk push of a span (tight turning-point loop) gives exactly the cycles of pushing the values one by one,
// whatever the span lengths, for integer histories full of ties and plateaus and for real-valued ones.
TEST(Rainflow, BulkPushEqualsValueByValue) {
  for (unsigned seed = 1; seed <= 40; ++seed) {
    std::vector<double> h = seed % 2 ? random_history(seed, 3000) : random_real_history(seed, 3000);
    if (seed % 5 == 0) h.insert(h.begin(), 7, h.front());  // a plateau before the first run has a direction
    for (ResidueRule rule : {ResidueRule::half_cycles, ResidueRule::repeat_history}) {
      const std::vector<StressCycle> plain = counted_value_by_value(h, rule);
      expect_same_cycles(counted_in_chunks(h, rule, seed, 1), plain);
      expect_same_cycles(counted_in_chunks(h, rule, seed, 50), plain);
      expect_same_cycles(rainflow_count(h, rule), plain);
    }
  }
}

// A bad value inside a span: the values before it are counted, the error names its index in the history.
TEST(Rainflow, BulkPushStopsAtTheFirstBadValue) {
  RainflowCounter counter;
  counter.push(std::vector<double>{1.0, 2.0, 3.0});
  std::vector<double> more(600, 1.0);
  for (std::size_t i = 0; i < more.size(); ++i) more[i] = static_cast<double>(i % 5);
  more[517] = std::nan("");
  more[590] = std::numeric_limits<double>::infinity();
  EXPECT_EQ(test::error_of([&] { counter.push(more); }),
            "rainflow count: history value nan at index 520 is not finite; remove or repair that value");
  EXPECT_EQ(counter.values_pushed(), 520u);
  std::vector<double> first_520{1.0, 2.0, 3.0};
  first_520.insert(first_520.end(), more.begin(), more.begin() + 517);
  expect_same_cycles(counter.finish(ResidueRule::half_cycles), rainflow_count(first_520));
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
