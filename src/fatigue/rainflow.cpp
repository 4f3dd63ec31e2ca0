#include "toehold/fatigue/rainflow.hpp"

#include "toehold/common/error.hpp"
#include "toehold/common/finite.hpp"
#include "toehold/fatigue/number_text.hpp"

#include <algorithm>
#include <array>
#include <cassert>
#include <cmath>
#include <utility>

namespace toehold {

using fatigue_detail::number_text;
namespace {

constexpr std::array<std::pair<std::string_view, ResidueRule>, 2> kResidueRules{{
    {"half_cycles", ResidueRule::half_cycles},
    {"repeat_history", ResidueRule::repeat_history},
}};

int sign(double x) { return (x > 0.0) - (x < 0.0); }

StressCycle cycle_between(double a, std::size_t ia, double b, std::size_t ib, double count) {
  return {std::abs(b - a), 0.5 * (a + b), count, ia, ib};
}

}  // namespace

std::string to_string(ResidueRule rule) {
  for (const auto& [name, value] : kResidueRules)
    if (value == rule) return std::string(name);
  return "?";
}

ResidueRule parse_residue_rule(std::string_view text, const std::string& where) {
  for (const auto& [name, value] : kResidueRules)
    if (name == text) return value;
  throw Error(where + ": unknown residue rule '" + std::string(text) + "'; use one of half_cycles, repeat_history");
}

std::string describe(ResidueRule rule) {
  if (rule == ResidueRule::half_cycles) return "ASTM E1049-85 sec. 5.4.4, residue counted as half cycles";
  return "ASTM E1049-85 sec. 5.4.5, repeating history counted from its largest absolute peak, full cycles";
}

void RainflowCounter::push(double value) {
  if (!std::isfinite(value))
    throw Error("rainflow count: history value " + number_text(value) + " at index " +
                std::to_string(next_index_) + " is not finite; remove or repair that value");
  push_point(value, next_index_++);
}

// The finite run is counted by the tight loop; a bad value then throws through push(double), after the values
// before it have gone in (as pushing them one at a time would).
void RainflowCounter::push(std::span<const double> values) {
  const std::size_t good = first_non_finite(values.data(), values.size());
  push_finite(values.first(good));
  if (good < values.size()) push(values[good]);
}

// The same steps as push_point for every value, with the state in locals: once the first run has a direction,
// a value either extends the run (new extreme), repeats the extreme (plateau) or reverses it (turning point).
void RainflowCounter::push_finite(std::span<const double> values) {
  const std::size_t base = next_index_, n = values.size();
  std::size_t i = 0;
  for (; i < n && direction_ == 0; ++i) push_point(values[i], base + i);
  Point run = pending_;
  bool rising = direction_ > 0;
  for (; i < n; ++i) {
    const double v = values[i];
    if (rising ? v > run.value : v < run.value) {
      run = {v, base + i};
    } else if (v != run.value) {
      add_turning_point(run);
      rising = !rising;
      run = {v, base + i};
    }
  }
  if (direction_ != 0) {
    pending_ = run;
    direction_ = rising ? 1 : -1;
  }
  next_index_ = base + n;
}

// Turning-point extraction: a run's extreme becomes a turning point when the direction reverses.
void RainflowCounter::push_point(double value, std::size_t index) {
  if (!has_pending_) {
    pending_ = {value, index};
    has_pending_ = true;
    return;
  }
  const int step = sign(value - pending_.value);
  if (step == 0) return;  // plateau: keep the first index
  if (direction_ == 0 || step == direction_) {
    if (direction_ == 0) add_turning_point(pending_);  // the first value of the history
    direction_ = step;
    pending_ = {value, index};
    return;
  }
  add_turning_point(pending_);
  direction_ = step;
  pending_ = {value, index};
}

// Four-point closure: with turning points a, b, c, d on top of the stack, range b-c is a full cycle when it is
// no larger than both a-b and c-d; b and c are then removed.
void RainflowCounter::add_turning_point(const Point& p) {
  stack_.push_back(p);
  while (stack_.size() >= 4) {
    const std::size_t n = stack_.size();
    const Point& a = stack_[n - 4];
    const Point& b = stack_[n - 3];
    const Point& c = stack_[n - 2];
    const Point& d = stack_[n - 1];
    const double inner = std::abs(c.value - b.value);
    if (inner > std::abs(b.value - a.value) || inner > std::abs(d.value - c.value)) break;
    closed_.push_back(cycle_between(b.value, b.index, c.value, c.index, 1.0));
    stack_[n - 3] = d;
    stack_.resize(n - 2);
  }
}

void RainflowCounter::flush_pending() {
  if (has_pending_) add_turning_point(pending_);
  has_pending_ = false;
}

std::vector<StressCycle> RainflowCounter::take_closed_cycles() { return std::exchange(closed_, {}); }

void RainflowCounter::count_residue_as_half_cycles(std::vector<StressCycle>& out) const {
  for (std::size_t i = 0; i + 1 < stack_.size(); ++i)
    out.push_back(cycle_between(stack_[i].value, stack_[i].index, stack_[i + 1].value, stack_[i + 1].index, 0.5));
}

// Sec. 5.4.5: the closed cycles are the same wherever a repeating history starts, so only the residue needs
// re-counting: rotate it to start and end at its largest absolute value and count it again. Every range then
// closes, leaving the three points M, x, M: one more full cycle.
void RainflowCounter::count_residue_as_repeating(std::vector<StressCycle>& out) const {
  if (stack_.size() < 2) return;
  const auto peak = std::max_element(stack_.begin(), stack_.end(), [](const Point& l, const Point& r) {
    return std::abs(l.value) < std::abs(r.value);
  });
  const std::size_t k = static_cast<std::size_t>(peak - stack_.begin());
  RainflowCounter again;
  for (std::size_t j = 0; j <= stack_.size(); ++j) {
    const Point& p = stack_[(k + j) % stack_.size()];
    again.push_point(p.value, p.index);
  }
  again.flush_pending();
  out.insert(out.end(), again.closed_.begin(), again.closed_.end());
  const std::vector<Point>& rest = again.stack_;
  if (rest.size() == 3 && rest[0].value == rest[2].value) {
    out.push_back(cycle_between(rest[1].value, rest[1].index, rest[2].value, rest[2].index, 1.0));
    return;
  }
  assert(rest.size() <= 1 && "repeating residue must close");
  again.count_residue_as_half_cycles(out);
}

std::vector<StressCycle> RainflowCounter::finish(ResidueRule rule) {
  flush_pending();
  std::vector<StressCycle> out = std::exchange(closed_, {});
  if (rule == ResidueRule::half_cycles) count_residue_as_half_cycles(out);
  else count_residue_as_repeating(out);
  *this = RainflowCounter{};
  return out;
}

std::vector<StressCycle> rainflow_count(std::span<const double> history, ResidueRule rule) {
  RainflowCounter counter;
  counter.push(history);
  return counter.finish(rule);
}

std::vector<std::size_t> turning_point_indices(std::span<const double> history) {
  std::vector<std::size_t> out;
  int direction = 0;
  for (std::size_t i = 0; i < history.size(); ++i) {
    if (out.empty()) {
      out.push_back(i);
      continue;
    }
    const int step = sign(history[i] - history[out.back()]);
    if (step == 0) continue;
    if (step == direction) out.back() = i;
    else out.push_back(i);
    direction = step;
  }
  return out;
}

}  // namespace toehold
