// The damage kinds of loading: a series of steps rainflow-counted, a block spectrum, and unit load cases scaled
// by a load history. Every station ends with a Miner sum, life, equivalent range and its governing cycles.
#include "internal.hpp"
#include "parallel_for.hpp"

#include "toehold/common/error.hpp"

#include <cmath>
#include <limits>
#include <span>
#include <vector>

namespace toehold::detail {
namespace {

void store(StationResult& r, const SpectrumDamage& d, const ToeDamage& toe) {
  r.damage = d.damage;
  r.utilization = d.utilization * toe.required_repeats;
  r.life_repeats = d.life_repeats;
  r.life_years = d.life_years;
  r.life = d.cycles > 0 ? d.life_cycles : std::numeric_limits<double>::infinity();
  r.cycles_per_repeat = d.cycles;
  r.range = d.largest_range;
  r.equivalent_range = d.equivalent_range;
  r.allowable = toe.curve.reference_range() / toe.rules.gamma_M;
  r.governing = d.governing;
}

int step_of(std::size_t index, std::size_t steps) {
  return index < steps ? static_cast<int>(index) : -1;
}

}  // namespace

ToeDamage toe_damage(const Plan& plan, const ToePlan& toe, const SnCurve& curve) {
  const auto definition = parse_hot_spot_definition(toe.definition, "toe '" + toe.name + "'");
  ToeDamage d{HotSpotScalar(definition, definition_options(toe)), curve, DamageRules{}, ResidueRule::half_cycles};
  d.rules.gamma_F = plan.requirement.gamma_F;
  d.rules.gamma_M = plan.requirement.gamma_M;
  d.rules.damage_limit = toe.damage_limit;
  d.rules.repeats_per_year = plan.loading.repeats_per_year;
  d.rules.mean_stress = toe.mean_stress;
  d.residue = plan.loading.repeating_history ? ResidueRule::repeat_history : ResidueRule::half_cycles;
  if (plan.requirement.design_life_years > 0 && plan.loading.repeats_per_year > 0)
    d.required_repeats = plan.requirement.design_life_years * plan.loading.repeats_per_year;
  return d;
}

std::string toe_mean_stress(const ToePlan& toe) {
  return toe.mean_stress ? "IIW f(R) " + to_string(*toe.mean_stress) : "none";
}

void record_hot_spots(StationResult& r, const std::vector<InPlaneStress>& steps, const HotSpotScalar& scalar) {
  std::size_t invalid = 0;
  r.hot_spot.clear();
  for (const InPlaneStress& s : steps) {
    bool valid = true;
    r.hot_spot.push_back(scalar(s, &valid));
    if (!valid) ++invalid;
  }
  if (invalid > 0)
    r.notes.push_back("principal: no principal stress within the window at " + std::to_string(invalid) + " of " +
                      std::to_string(steps.size()) + " steps (taken as 0); the stress there runs along the toe");
}

void evaluate_series(StationResult& r, const std::vector<InPlaneStress>& steps, const ToeDamage& d) {
  record_hot_spots(r, steps, d.scalar);
  const std::vector<StressCycle> cycles = rainflow_count(r.hot_spot, d.residue);
  const SpectrumDamage damage = spectrum_damage(cycles, d.curve, d.rules);
  store(r, damage, d);
  if (!r.governing.empty()) {
    r.range_from = step_of(r.governing.front().cycle.first, steps.size());
    r.range_to = step_of(r.governing.front().cycle.last, steps.size());
  }
}

void evaluate_blocks(StationResult& r, const std::vector<InPlaneStress>& steps, const ToeDamage& d,
                     const std::vector<BlockPlan>& blocks) {
  record_hot_spots(r, steps, d.scalar);
  std::vector<StressCycle> cycles;
  for (const BlockPlan& b : blocks) {
    const auto from = static_cast<std::size_t>(b.from_step), to = static_cast<std::size_t>(b.to_step);
    const double range = std::abs(d.scalar(steps[to] - steps[from]));
    cycles.push_back(StressCycle{range, 0.5 * (r.hot_spot[from] + r.hot_spot[to]), b.cycles, from, to});
  }
  const SpectrumDamage damage = spectrum_damage(cycles, d.curve, d.rules);
  store(r, damage, d);
  if (!r.governing.empty()) {
    r.range_from = static_cast<int>(r.governing.front().cycle.first);
    r.range_to = static_cast<int>(r.governing.front().cycle.last);
  }
}

namespace {

// The station's hot-spot values of history rows [begin, end) into out[0, end - begin). Each row is computed
// alone by the same expression wherever it runs, so the values do not depend on the thread count or blocking.
struct UnitCaseRows {
  const std::vector<InPlaneStress>& cases;
  const std::vector<double>& h;  // hot-spot value of each unit case, MPa
  const ToeDamage& d;
  const LoadHistory& history;
  bool linear;                   // perpendicular definition: the value is sum_k c_k(t) h_k, no tensor per row

  void operator()(std::size_t begin, std::size_t end, double* out) const {
    const std::size_t k_count = cases.size();
    const double* c = history.factors.data() + begin * k_count;
    for (std::size_t t = begin; t < end; ++t, c += k_count, ++out) {
      if (linear) {
        double value = 0.0;
        for (std::size_t k = 0; k < k_count; ++k) value += c[k] * h[k];
        *out = value;
        continue;
      }
      InPlaneStress s;  // the definition applies to the combined in-plane stress of each row
      for (std::size_t k = 0; k < k_count; ++k) s += c[k] * cases[k];
      *out = d.scalar(s);
    }
  }
};

// All rows' values split over threads, then counted in order.
void count_all_rows(RainflowCounter& counter, const UnitCaseRows& rows, std::size_t row_count) {
  std::vector<double> values(row_count);
  parallel_for(row_count, 1 << 15, [&](std::size_t begin, std::size_t end) { rows(begin, end, values.data() + begin); });
  counter.push(values);
}

// Rows on this thread only (the stations already run in parallel): values in small blocks that stay in the
// cache, each counted as soon as it is made.
void count_rows_in_blocks(RainflowCounter& counter, const UnitCaseRows& rows, std::size_t row_count) {
  constexpr std::size_t kBlock = 4096;
  std::vector<double> block(std::min(kBlock, row_count));
  for (std::size_t begin = 0; begin < row_count; begin += kBlock) {
    const std::size_t end = std::min(row_count, begin + kBlock);
    rows(begin, end, block.data());
    counter.push(std::span<const double>(block.data(), end - begin));
  }
}

}  // namespace

void evaluate_unit_cases(StationResult& r, const std::vector<InPlaneStress>& cases, const ToeDamage& d,
                         const LoadHistory& history, HotSpotDefinition definition) {
  record_hot_spots(r, cases, d.scalar);
  const UnitCaseRows rows{cases, r.hot_spot, d, history, definition == HotSpotDefinition::perpendicular};
  RainflowCounter counter;
  if (inside_parallel_for()) count_rows_in_blocks(counter, rows, history.rows());
  else count_all_rows(counter, rows, history.rows());
  const std::vector<StressCycle> cycles = counter.finish(d.residue);
  store(r, spectrum_damage(cycles, d.curve, d.rules), d);
}

}  // namespace toehold::detail
