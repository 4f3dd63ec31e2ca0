#include "toehold/loading/spectrum_damage.hpp"

#include "toehold/common/error.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <string>

namespace toehold {
namespace {

double mean_stress_factor(const StressCycle& c, const std::optional<IiwMeanStressCase>& mean_stress) {
  if (!mean_stress) return 1.0;
  const double s_max = c.mean + 0.5 * c.range, s_min = c.mean - 0.5 * c.range;
  if (!(s_max > 0.0)) return 1.0;
  return iiw_mean_stress_factor(stress_ratio(s_min, s_max), *mean_stress);
}

void check_cycle(const StressCycle& c, std::size_t i) {
  if (!(std::isfinite(c.range) && c.range >= 0.0 && std::isfinite(c.count) && c.count >= 0.0))
    throw Error("cycle " + std::to_string(i + 1) + ": range " + std::to_string(c.range) + " MPa and count " +
                std::to_string(c.count) + " must be finite numbers of 0 or more");
}

// The cycle as the curve sees it: range gamma_F gamma_M ds / f(R).
StressCycle factored(const StressCycle& c, const DamageRules& rules) {
  StressCycle out = c;
  out.range *= rules.gamma_F * rules.gamma_M / mean_stress_factor(c, rules.mean_stress);
  return out;
}

}  // namespace

// Every input cycle is checked before any is factored (the order of the errors), then each factored cycle's
// n / N is evaluated once for the sum, the equivalent range and the governing cycles.
SpectrumDamage spectrum_damage(std::span<const StressCycle> cycles, const SnCurve& curve, const DamageRules& rules) {
  if (!(rules.damage_limit > 0.0)) throw Error("allowable damage sum must be greater than 0");
  SpectrumDamage d;
  for (std::size_t i = 0; i < cycles.size(); ++i) {
    check_cycle(cycles[i], i);
    d.largest_range = std::max(d.largest_range, cycles[i].range);
  }
  MinerTally tally(curve, rules.governing);
  for (std::size_t i = 0; i < cycles.size(); ++i) tally.add(factored(cycles[i], rules), i);
  d.damage = tally.damage();
  d.utilization = d.damage / rules.damage_limit;
  d.life_repeats = life_in_repeats(d.damage, rules.damage_limit);
  d.life_years = rules.repeats_per_year > 0 ? d.life_repeats / rules.repeats_per_year
                                            : std::numeric_limits<double>::quiet_NaN();
  d.cycles = total_count(cycles);
  d.life_cycles = d.life_repeats * d.cycles;
  d.equivalent_range = cycles.empty() ? 0.0 : equivalent_range_of_damage(curve, d.damage) / rules.gamma_M;
  d.governing = tally.governing();
  for (CycleDamage& g : d.governing) g.cycle = cycles[g.position];
  return d;
}

}  // namespace toehold
