// Palmgren-Miner damage: the Miner sum of a cycle list on an S-N curve, its allowable value by standard, the
// equivalent constant-amplitude stress range, life in repeats of the history, and the most damaging cycles.
#pragma once

#include "toehold/fatigue/sn_curve.hpp"
#include "toehold/fatigue/stress_cycle.hpp"

#include <cstddef>
#include <span>
#include <string>
#include <string_view>
#include <vector>

namespace toehold {

// Allowable Miner sum D by standard.
enum class MinerLimit {
  iiw,               // 0.5: IIW 2016 sec. 4.3.1, steel and aluminium [M]
  iiw_varying_mean,  // 0.2: IIW 2016 sec. 4.3.1, spectra with widely varying mean stress [M]
  eurocode,          // 1.0: EN 1993-1-9:2005 Annex A
  dnv,               // 1.0: DNVGL-RP-C203 (2016) sec. 2.2 (design fatigue factors are applied separately)
};

double allowable_damage_sum(MinerLimit limit);
std::string to_string(MinerLimit limit);  // the string users type: "iiw", "iiw_varying_mean", "eurocode", "dnv"
MinerLimit parse_miner_limit(std::string_view text, const std::string& where);

// Miner sum D = sum n_i / N_i with N_i from the curve under the variable-amplitude rule (VA segments beyond
// the knee, no damage below the cut-off). cycles: ranges in MPa, counts >= 0. Throws Error naming the cycle
// (1-based position) whose range or count is not a finite number >= 0.
double miner_damage(const SnCurve& curve, std::span<const StressCycle> cycles);

// Damage of n cycles of one constant range under the constant-amplitude rule: exactly n / N(ds).
// range_mpa: MPa, finite, >= 0; cycles: n, finite, >= 0.
double constant_amplitude_damage(const SnCurve& curve, double range_mpa, double cycles);

// Equivalent constant-amplitude stress range (MPa): the range that, applied reference_cycles times on the
// curve's first segment (slope m1, extended if needed), gives the same Miner sum D as the cycles:
//   ds_eq = ds_1(N_ref) D^(1/m1),  ds_1(N_ref) = the first segment's range at N_ref.
// With N_ref = 2e6 on an IIW curve this is FAT D^(1/m1), the same as IIW 2016 sec. 4.3.1 [M]
//   ds_eq = [ (sum_i n_i ds_i^m1 + ds_k^(m1 - m2) sum_j n_j ds_j^m2) / N_ref ]^(1/m1)
// (i: ranges above the knee range ds_k, j: below). Pass N_ref = total_count(cycles) for the IIW form that
// relates ds_eq to the total number of cycles. reference_cycles: > 0, finite.
double equivalent_range(const SnCurve& curve, std::span<const StressCycle> cycles,
                        double reference_cycles = kReferenceCycles);
// The same from a Miner sum already known: ds_1(N_ref) D^(1/m1). damage: D >= 0; reference_cycles as above.
double equivalent_range_of_damage(const SnCurve& curve, double damage, double reference_cycles = kReferenceCycles);

// Repeats of the history until the Miner sum reaches allowable_damage: allowable / D.
// Infinity when the history does no damage. damage_per_repeat >= 0, allowable_damage > 0.
double life_in_repeats(double damage_per_repeat, double allowable_damage = 1.0);

// A cycle with its share of the damage.
struct CycleDamage {
  StressCycle cycle;
  std::size_t position = 0;  // 0-based position in the list given
  double damage = 0.0;       // n / N of this cycle
  double share = 0.0;        // damage / total damage (0 when the total is 0)
};

// The how_many most damaging cycles, most damaging first (ties: earlier position first).
std::vector<CycleDamage> governing_cycles(const SnCurve& curve, std::span<const StressCycle> cycles,
                                          std::size_t how_many);

// Miner sum and governing cycles in one pass, n / N evaluated once per cycle: cycles are added in list order
// and the results are those of miner_damage and governing_cycles on the same list (the same sum, in the same
// order). Memory: the how_many most damaging cycles only.
class MinerTally {
public:
  // curve: outlives the tally. how_many: governing cycles to keep (0: the sum only).
  MinerTally(const SnCurve& curve, std::size_t how_many);

  // Next cycle of the list (range MPa, count >= 0, both finite); position: its 0-based place in the list, for
  // the governing cycles and the Error naming the cycle (as miner_damage).
  void add(const StressCycle& cycle, std::size_t position);

  double damage() const { return sum_; }  // D = sum n / N so far
  std::vector<CycleDamage> governing() const;  // most damaging first, shares of the sum so far

private:
  void keep_if_governing(const StressCycle& cycle, std::size_t position, double damage);

  const SnCurve* curve_;
  std::size_t how_many_;
  double sum_ = 0.0;
  std::vector<CycleDamage> top_;  // at most how_many_, most damaging first (ties: earlier position first)
};

}  // namespace toehold
