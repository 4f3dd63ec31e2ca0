#include "toehold/fatigue/miner.hpp"

#include "toehold/common/error.hpp"
#include "toehold/fatigue/number_text.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <limits>
#include <utility>

namespace toehold {

using fatigue_detail::number_text;
namespace {

constexpr std::array<std::pair<std::string_view, MinerLimit>, 4> kLimits{{
    {"iiw", MinerLimit::iiw},
    {"iiw_varying_mean", MinerLimit::iiw_varying_mean},
    {"eurocode", MinerLimit::eurocode},
    {"dnv", MinerLimit::dnv},
}};

std::string sum_label(const SnCurve& curve) { return "Miner sum on S-N curve '" + curve.name() + "'"; }

std::string cycle_label(const SnCurve& curve, std::size_t position) {
  return sum_label(curve) + ": cycle " + std::to_string(position + 1);
}

void check_cycle(const SnCurve& curve, const StressCycle& c, std::size_t position) {
  if (!std::isfinite(c.range) || c.range < 0.0)
    throw Error(cycle_label(curve, position) + " has stress range " + number_text(c.range) +
                " MPa; ranges must be finite and >= 0 (check the stress history)");
  if (!std::isfinite(c.count) || c.count < 0.0)
    throw Error(cycle_label(curve, position) + " has count " + number_text(c.count) +
                "; counts must be finite and >= 0");
}

void check_reference_cycles(const SnCurve& curve, double reference_cycles) {
  if (!std::isfinite(reference_cycles) || reference_cycles <= 0.0)
    throw Error(sum_label(curve) + ": reference number of cycles " + number_text(reference_cycles) +
                " for the equivalent range must be finite and > 0");
}

// n / N, with no damage where N is infinite.
double cycle_damage(const SnCurve& curve, const StressCycle& c) {
  const double n = curve.cycles_to_failure(c.range, Amplitude::variable);
  return std::isinf(n) ? 0.0 : c.count / n;
}

}  // namespace

double allowable_damage_sum(MinerLimit limit) {
  switch (limit) {
    case MinerLimit::iiw: return 0.5;
    case MinerLimit::iiw_varying_mean: return 0.2;
    case MinerLimit::eurocode: return 1.0;
    case MinerLimit::dnv: return 1.0;
  }
  return 1.0;
}

std::string to_string(MinerLimit limit) {
  for (const auto& [name, value] : kLimits)
    if (value == limit) return std::string(name);
  return "?";
}

MinerLimit parse_miner_limit(std::string_view text, const std::string& where) {
  for (const auto& [name, value] : kLimits)
    if (name == text) return value;
  throw Error(where + ": unknown Miner sum limit '" + std::string(text) +
              "'; use one of iiw (0.5), iiw_varying_mean (0.2), eurocode (1.0), dnv (1.0)");
}

double miner_damage(const SnCurve& curve, std::span<const StressCycle> cycles) {
  MinerTally tally(curve, 0);
  for (std::size_t i = 0; i < cycles.size(); ++i) tally.add(cycles[i], i);
  return tally.damage();
}

double constant_amplitude_damage(const SnCurve& curve, double range_mpa, double cycles) {
  if (!std::isfinite(cycles) || cycles < 0.0)
    throw Error(sum_label(curve) + ": number of cycles " + number_text(cycles) + " must be finite and >= 0");
  const double n = curve.cycles_to_failure(range_mpa, Amplitude::constant);
  return std::isinf(n) ? 0.0 : cycles / n;
}

double equivalent_range(const SnCurve& curve, std::span<const StressCycle> cycles, double reference_cycles) {
  check_reference_cycles(curve, reference_cycles);
  return equivalent_range_of_damage(curve, miner_damage(curve, cycles), reference_cycles);
}

double equivalent_range_of_damage(const SnCurve& curve, double damage, double reference_cycles) {
  check_reference_cycles(curve, reference_cycles);
  const SnSegment& first = curve.segments().front();
  return first.range_at(reference_cycles) * std::pow(damage, 1.0 / first.slope);
}

double life_in_repeats(double damage_per_repeat, double allowable_damage) {
  if (!std::isfinite(damage_per_repeat) || damage_per_repeat < 0.0)
    throw Error("life in repeats: damage per repeat " + number_text(damage_per_repeat) +
                " must be finite and >= 0");
  if (!std::isfinite(allowable_damage) || allowable_damage <= 0.0)
    throw Error("life in repeats: allowable Miner sum " + number_text(allowable_damage) +
                " must be finite and > 0");
  if (damage_per_repeat == 0.0) return std::numeric_limits<double>::infinity();
  return allowable_damage / damage_per_repeat;
}

std::vector<CycleDamage> governing_cycles(const SnCurve& curve, std::span<const StressCycle> cycles,
                                          std::size_t how_many) {
  MinerTally tally(curve, how_many);
  for (std::size_t i = 0; i < cycles.size(); ++i) tally.add(cycles[i], i);
  return tally.governing();
}

MinerTally::MinerTally(const SnCurve& curve, std::size_t how_many) : curve_(&curve), how_many_(how_many) {
  top_.reserve(std::min<std::size_t>(how_many, 64));
}

void MinerTally::add(const StressCycle& cycle, std::size_t position) {
  check_cycle(*curve_, cycle, position);
  const double damage = cycle_damage(*curve_, cycle);
  sum_ += damage;
  if (how_many_ > 0) keep_if_governing(cycle, position, damage);
}

// Positions only grow, so a new cycle goes before a kept one exactly when it does more damage: the kept list
// is what a sort by (damage descending, position ascending) would put first.
void MinerTally::keep_if_governing(const StressCycle& cycle, std::size_t position, double damage) {
  if (top_.size() == how_many_ && !(damage > top_.back().damage)) return;
  if (top_.size() == how_many_) top_.pop_back();
  auto at = top_.end();
  while (at != top_.begin() && damage > (at - 1)->damage) --at;
  top_.insert(at, CycleDamage{cycle, position, damage, 0.0});
}

std::vector<CycleDamage> MinerTally::governing() const {
  std::vector<CycleDamage> out = top_;
  for (CycleDamage& d : out) d.share = sum_ > 0.0 ? d.damage / sum_ : 0.0;
  return out;
}

}  // namespace toehold
