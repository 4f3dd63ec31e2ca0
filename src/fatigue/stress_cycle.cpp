#include "toehold/fatigue/stress_cycle.hpp"

#include "toehold/common/error.hpp"
#include "toehold/fatigue/number_text.hpp"

#include <algorithm>
#include <cmath>
#include <functional>
#include <map>

namespace toehold {

using fatigue_detail::number_text;
namespace {

// Accumulates count and count-weighted mean per range; std::greater gives largest range first.
using RangeTable = std::map<double, StressCycle, std::greater<double>>;

void add(RangeTable& table, double range, const StressCycle& c) {
  StressCycle& slot = table.try_emplace(range, StressCycle{range, 0.0, 0.0, kNoIndex, kNoIndex}).first->second;
  const double total = slot.count + c.count;
  slot.mean = total > 0.0 ? (slot.mean * slot.count + c.mean * c.count) / total : c.mean;
  slot.count = total;
}

std::vector<StressCycle> to_list(const RangeTable& table) {
  std::vector<StressCycle> out;
  out.reserve(table.size());
  for (const auto& [range, c] : table) out.push_back(c);
  return out;
}

}  // namespace

double total_count(std::span<const StressCycle> cycles) {
  double sum = 0.0;
  for (const StressCycle& c : cycles) sum += c.count;
  return sum;
}

std::vector<StressCycle> merge_equal_ranges(std::span<const StressCycle> cycles) {
  RangeTable table;
  for (const StressCycle& c : cycles) add(table, c.range, c);
  return to_list(table);
}

std::vector<StressCycle> bin_ranges(std::span<const StressCycle> cycles, double bin_width) {
  if (!std::isfinite(bin_width) || bin_width <= 0.0)
    throw Error("range bins: bin width " + number_text(bin_width) + " must be finite and > 0");
  RangeTable table;
  for (const StressCycle& c : cycles) add(table, std::ceil(c.range / bin_width) * bin_width, c);
  return to_list(table);
}

}  // namespace toehold
