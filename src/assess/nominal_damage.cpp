// The nominal stress history of a toe (or station) checked against the nominal detail class with the same machinery
// as the hot-spot stress: the one stress-range check (nominal/nominal_check) for loading kind range, rainflow
// counting and the Miner sum (loading/spectrum_damage) for series, unit-cases and blocks.
#include "nominal_step.hpp"
#include "toehold/fatigue/sn_catalogue.hpp"

#include "toehold/common/error.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

namespace toehold::detail {
namespace {

constexpr double kInfinity = std::numeric_limits<double>::infinity();

void store_range(NominalCheckResult& r, const nominal::RangeCheck& c) {
  r.range = c.range_MPa;
  r.allowable = c.allowable_MPa;
  r.utilization = c.utilization;
  r.life = c.life;
}

void store_damage(NominalCheckResult& r, const SpectrumDamage& d, const NominalRules& rules) {
  r.damage = d.damage;
  r.damage_limit = rules.damage.damage_limit;
  r.utilization = d.utilization * rules.required_repeats;
  r.life_repeats = d.life_repeats;
  r.life_years = d.life_years;
  r.life = d.cycles > 0 ? d.life_cycles : kInfinity;
  r.range = d.largest_range;
  r.equivalent_range = d.equivalent_range;
  r.allowable = rules.curve.reference_range() / rules.damage.gamma_M;
  if (!d.governing.empty()) {
    const StressCycle& g = d.governing.front().cycle;
    const auto steps = static_cast<std::size_t>(std::numeric_limits<int>::max());
    if (g.first < steps && g.last < steps) {
      r.range_from = static_cast<int>(g.first);
      r.range_to = static_cast<int>(g.last);
    }
  }
}

// The history row by row: sum over unit cases k of c_k(t) v_k (the nominal stress is linear in the unit cases).
std::vector<double> unit_case_history(const std::vector<double>& values, const LoadHistory& history) {
  const std::size_t k_count = values.size(), rows = history.rows();
  std::vector<double> out(rows, 0.0);
  const double* c = history.factors.data();
  for (std::size_t t = 0; t < rows; ++t, c += k_count)
    for (std::size_t k = 0; k < k_count; ++k) out[t] += c[k] * values[k];
  return out;
}

std::vector<StressCycle> block_cycles(const Plan& plan, const std::vector<double>& values) {
  std::vector<StressCycle> cycles;
  for (const BlockPlan& b : plan.loading.blocks) {
    const auto from = static_cast<std::size_t>(b.from_step), to = static_cast<std::size_t>(b.to_step);
    cycles.push_back({std::abs(values[to] - values[from]), 0.5 * (values[from] + values[to]), b.cycles, from, to});
  }
  return cycles;
}

std::vector<StressCycle> counted_cycles(const Plan& plan, const std::vector<double>& values,
                                        const std::optional<LoadHistory>& history) {
  const ResidueRule residue = plan.loading.repeating_history ? ResidueRule::repeat_history : ResidueRule::half_cycles;
  switch (plan.loading.kind) {
    case LoadingKind::series: return rainflow_count(values, residue);
    case LoadingKind::blocks: return block_cycles(plan, values);
    case LoadingKind::unit_cases: {
      std::vector<StressCycle> cycles = rainflow_count(unit_case_history(values, *history), residue);
      for (StressCycle& c : cycles) c.first = c.last = kNoIndex;  // rows, not steps
      return cycles;
    }
    case LoadingKind::range: break;
  }
  return {};
}

}  // namespace

NominalRules nominal_rules(const Plan& plan, const ToePlan& toe, const SnCurve& curve) {
  NominalRules r{curve, {}, {}, ResidueRule::half_cycles, 1.0};
  const RequirementPlan& req = plan.requirement;
  r.requirement = {req.cycles, req.gamma_M, req.gamma_F, Amplitude::constant};
  r.damage.gamma_F = req.gamma_F;
  r.damage.gamma_M = req.gamma_M;
  // The allowable Miner sum of the nominal curve, by the rule of ToePlan::damage_limit.
  std::string basis;
  r.damage.damage_limit = req.damage_limit_given ? req.damage_limit : default_damage_limit(curve, basis);
  r.damage.repeats_per_year = plan.loading.repeats_per_year;
  r.damage.mean_stress = toe.mean_stress;
  r.residue = plan.loading.repeating_history ? ResidueRule::repeat_history : ResidueRule::half_cycles;
  if (req.design_life_years > 0 && plan.loading.repeats_per_year > 0)
    r.required_repeats = req.design_life_years * plan.loading.repeats_per_year;
  return r;
}

NominalCheckResult check_nominal_range(const NominalRules& rules, double range_MPa, const std::string& what) {
  NominalCheckResult r;
  store_range(r, nominal::check_range(rules.curve, range_MPa, rules.requirement, what));
  return r;
}

NominalCheckResult check_nominal_values(const Plan& plan, const NominalRules& rules, std::vector<double> values,
                                        const std::optional<LoadHistory>& history, const std::string& what) {
  NominalCheckResult r;
  r.values = std::move(values);
  if (plan.loading.kind == LoadingKind::range) {
    const nominal::NominalRange range =
        nominal::range_over_steps(r.values, rules.curve.kind(), nominal::NominalSource::given, what);
    store_range(r, nominal::check_range(rules.curve, range.range_MPa, rules.requirement, what));
    r.range_from = range.from;
    r.range_to = range.to;
    return r;
  }
  const std::vector<StressCycle> cycles = counted_cycles(plan, r.values, history);
  store_damage(r, spectrum_damage(cycles, rules.curve, rules.damage), rules);
  return r;
}

NominalCheckResult check_weld_group(const Plan& plan, const NominalRules& rules, const WeldGroupPlan& group,
                                    const std::string& what) {
  const std::vector<nominal::WeldLoad>& loads = group.loads;
  const auto range = [&](std::size_t i, std::size_t j) {
    return nominal::weld_group_range(group.shape, loads[i], loads[j], group.measure).range.range_MPa;
  };
  NominalCheckResult r;
  if (plan.loading.kind == LoadingKind::blocks) {
    std::vector<StressCycle> cycles;
    for (const BlockPlan& b : plan.loading.blocks) {
      const auto from = static_cast<std::size_t>(b.from_step), to = static_cast<std::size_t>(b.to_step);
      cycles.push_back({range(from, to), 0.0, b.cycles, from, to});
    }
    store_damage(r, spectrum_damage(cycles, rules.curve, rules.damage), rules);
    return r;
  }
  double best = -1.0;
  for (std::size_t i = 0; i < loads.size(); ++i)
    for (std::size_t j = i + 1; j < loads.size(); ++j)
      if (const double v = range(i, j); v > best) {
        best = v;
        r.range_from = static_cast<int>(i);
        r.range_to = static_cast<int>(j);
      }
  store_range(r, nominal::check_range(rules.curve, std::max(best, 0.0), rules.requirement, what));
  return r;
}

std::vector<NominalCycle> nominal_cycles(const Plan& plan, const std::vector<double>& values,
                                         const std::optional<LoadHistory>& history) {
  std::vector<NominalCycle> out;
  const auto add = [&](const StressCycle& c) {
    const auto step = [&](std::size_t i) { return i < values.size() ? static_cast<int>(i) : -1; };
    out.push_back({0.5 * c.range, c.mean, step(c.first), step(c.last)});
  };
  if (plan.loading.kind == LoadingKind::range) {
    const auto [lo, hi] = std::minmax_element(values.begin(), values.end());
    add({*hi - *lo, 0.5 * (*hi + *lo), 1.0, static_cast<std::size_t>(lo - values.begin()),
         static_cast<std::size_t>(hi - values.begin())});
    return out;
  }
  for (const StressCycle& c : counted_cycles(plan, values, history)) add(c);
  return out;
}

}  // namespace toehold::detail
