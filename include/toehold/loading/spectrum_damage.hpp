// Damage of one station's stress spectrum (rainflow-counted cycles or block cycles) under the plan's rules:
// partial factors, optional IIW mean-stress enhancement f(R), Palmgren-Miner sum with the curve's variable-
// amplitude rule, life in repeats and years, equivalent constant-amplitude range and the governing cycles.
#pragma once

#include "toehold/fatigue/corrections.hpp"
#include "toehold/fatigue/miner.hpp"
#include "toehold/fatigue/sn_curve.hpp"
#include "toehold/fatigue/stress_cycle.hpp"

#include <cstddef>
#include <optional>
#include <span>
#include <vector>

namespace toehold {

struct DamageRules {
  double gamma_F = 1.0;           // partial factor on the load: multiplies every range, > 0
  double gamma_M = 1.0;           // partial factor on resistance: the curve's ranges are divided by it, >= 1
  double damage_limit = 0.5;      // allowable Miner sum D_allow, > 0
  double repeats_per_year = 0.0;  // repeats of the history (or block spectrum) per year; 0 = no life in years
  // IIW 2016 sec. 3.5.3 [M] enhancement f(R) per cycle (R = s_min / s_max of the cycle, s_max > 0; cycles with
  // s_max <= 0 get f = 1, the conservative choice); none = no mean-stress correction.
  std::optional<IiwMeanStressCase> mean_stress;
  std::size_t governing = 3;      // how many of the most damaging cycles to keep
};

struct SpectrumDamage {
  double damage = 0.0;            // Miner sum of one repeat of the history, with gamma_F, gamma_M and f(R)
  double utilization = 0.0;       // damage / damage_limit
  double life_repeats = 0.0;      // repeats until the sum reaches damage_limit (inf: no damage)
  double life_years = 0.0;        // life_repeats / repeats_per_year; NaN when repeats_per_year is 0
  double life_cycles = 0.0;       // life_repeats times the cycles of one repeat
  double cycles = 0.0;            // cycles in one repeat (half cycles count 0.5)
  double largest_range = 0.0;     // largest counted hot-spot stress range, MPa (no factors)
  // Equivalent constant-amplitude range at 2e6 cycles of the factored spectrum (gamma_F ds / f(R)) on the curve
  // divided by gamma_M: compare with the curve's 2e6 range / gamma_M (Miner's rule, see equivalent_range).
  double equivalent_range = 0.0;  // MPa
  std::vector<CycleDamage> governing;  // most damaging first; ranges and means as counted (MPa, no factors)
};

// `cycles`: ranges and means in MPa as counted from the hot-spot stress, counts >= 0 (Error naming the cycle
// otherwise). `curve`: the toe's curve with its thickness correction, without gamma_M.
SpectrumDamage spectrum_damage(std::span<const StressCycle> cycles, const SnCurve& curve, const DamageRules& rules);

}  // namespace toehold
