// Rainflow cycle counting after ASTM E1049-85 (reapproved 2011) sec. 5.4.4, with the residue rule of sec. 5.4.4
// (half cycles) or sec. 5.4.5 (repeating history). Streaming: values go in one at a time, O(1) amortised each.
#pragma once

#include "toehold/fatigue/stress_cycle.hpp"

#include <cstddef>
#include <span>
#include <string>
#include <string_view>
#include <vector>

namespace toehold {

// What to do with the ranges left open at the end of the history.
enum class ResidueRule {
  half_cycles,     // ASTM E1049-85 sec. 5.4.4: each range left in the residue counts as half a cycle
  repeat_history,  // sec. 5.4.5: the history repeats; counted as if started at its largest absolute peak, so
                   // every cycle is a full cycle
};

std::string to_string(ResidueRule rule);  // the string users type: "half_cycles", "repeat_history"
ResidueRule parse_residue_rule(std::string_view text, const std::string& where);
std::string describe(ResidueRule rule);  // the rule with its ASTM section, for reports

// Counts cycles from a stress history fed in order. Turning points are found first (plateaus and points inside
// monotone runs drop out; the first and last values are turning points). Full cycles close as soon as the
// history allows (four-point form, identical in result to the three-point steps of sec. 5.4.4); the open
// ranges stay in a residue that finish() counts by the chosen rule. Memory: the residue, plus the closed cycles
// until take_closed_cycles() collects them.
class RainflowCounter {
public:
  // Next value of the history (finite, any stress unit; ranges come out in the same unit). Throws Error naming
  // the value's index (0-based count of values pushed) if it is not finite.
  void push(double value);
  void push(std::span<const double> values);

  // Full cycles closed so far, moved out; later calls return only newer ones.
  std::vector<StressCycle> take_closed_cycles();

  // Ends the history: returns the closed cycles not yet taken plus the residue counted by rule, and resets
  // the counter for a new history.
  std::vector<StressCycle> finish(ResidueRule rule);

  std::size_t values_pushed() const { return next_index_; }

private:
  struct Point {
    double value;
    std::size_t index;
  };

  void push_finite(std::span<const double> values);
  void push_point(double value, std::size_t index);
  void add_turning_point(const Point& p);
  void flush_pending();
  void count_residue_as_half_cycles(std::vector<StressCycle>& out) const;
  void count_residue_as_repeating(std::vector<StressCycle>& out) const;

  std::vector<Point> stack_;   // turning points whose ranges are still open (the residue so far)
  Point pending_{0.0, 0};      // extreme of the current monotone run, not yet known to be a turning point
  bool has_pending_ = false;
  int direction_ = 0;          // +1 rising, -1 falling, 0 not known yet
  std::size_t next_index_ = 0;
  std::vector<StressCycle> closed_;
};

// Whole-history convenience: counts history (stress values in time order, finite) by the given residue rule.
std::vector<StressCycle> rainflow_count(std::span<const double> history,
                                        ResidueRule rule = ResidueRule::half_cycles);

// Indices of the turning points of history (first and last value included, plateaus kept at their first index).
std::vector<std::size_t> turning_point_indices(std::span<const double> history);

}  // namespace toehold
