// A stress cycle as counted from a history (range, mean, count, where it came from), and the helpers that merge
// equal ranges or bin ranges into a spectrum. Rainflow produces these lists; Miner sums consume them.
#pragma once

#include <cstddef>
#include <limits>
#include <span>
#include <vector>

namespace toehold {

// Index value meaning "no position in the input history" (aggregated or hand-made cycles).
inline constexpr std::size_t kNoIndex = std::numeric_limits<std::size_t>::max();

struct StressCycle {
  double range = 0.0;  // stress range max - min, MPa (or the history's unit), >= 0
  double mean = 0.0;   // (max + min) / 2, same unit
  double count = 1.0;  // number of cycles: 0.5 for a half cycle, 1 for a full one, any >= 0 in a spectrum
  std::size_t first = kNoIndex;  // index in the input history of the turning point that opens the cycle
  std::size_t last = kNoIndex;   // index of the turning point that closes it (a repeating-history cycle that
                                 // wraps round the end of the history has last < first)
};

// Sum of the counts.
double total_count(std::span<const StressCycle> cycles);

// Cycles with exactly equal ranges merged into one: counts summed, mean = count-weighted mean, indices dropped.
// Sorted by range, largest first.
std::vector<StressCycle> merge_equal_ranges(std::span<const StressCycle> cycles);

// Ranges rounded up to the upper edge of bins of width bin_width (same unit as the ranges, > 0), then merged:
// a range r goes to k * bin_width with k = ceil(r / bin_width), so binning never lowers the damage.
// Sorted by range, largest first. Throws Error if bin_width is not finite and > 0.
std::vector<StressCycle> bin_ranges(std::span<const StressCycle> cycles, double bin_width);

}  // namespace toehold
