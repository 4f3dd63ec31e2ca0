// The nominal-stress result of a toe once its stations are evaluated: the nominal check (per toe or per station),
// the side-by-side comparison with the hot-spot check at every station, and the textbook infinite-life check.
#include "nominal_step.hpp"

#include "toehold/common/error.hpp"

#include <cmath>
#include <limits>
#include <sstream>

namespace toehold::detail {
namespace {

using nominal::NominalSource;

std::string what_of(const ToePlan& toe) { return "toe '" + toe.name + "' nominal"; }

std::string step_name(const Plan& plan, int i) {
  return i >= 0 && static_cast<std::size_t>(i) < plan.steps.size() ? "'" + plan.steps[static_cast<std::size_t>(i)].name + "'"
                                                                    : "?";
}

// The per-toe check of the sources that have one nominal history for the whole toe.
NominalCheckResult toe_check(const Plan& plan, const NominalToeState& s, const NominalRules& rules,
                             const std::optional<LoadHistory>& history, const std::string& what) {
  const ToeNominalPlan& n = s.plan;
  switch (n.source) {
    case NominalSource::given:
      return n.range_MPa ? check_nominal_range(rules, *n.range_MPa, what)
                         : check_nominal_values(plan, rules, n.values_MPa, history, what);
    case NominalSource::section: return check_nominal_values(plan, rules, s.toe_values, history, what);
    case NominalSource::weld_group: return check_weld_group(plan, rules, *n.weld_group, what);
    case NominalSource::surface_distance: break;
  }
  return {};
}

NominalCheckResult station_check(const Plan& plan, const NominalToeState& s, const NominalRules& rules,
                                 const std::optional<LoadHistory>& history, std::size_t i, const StationResult& r,
                                 const ToePlan& toe) {
  NominalCheckResult c;
  if (!s.problems[i].empty()) {
    c.problem = s.problems[i];
    return c;
  }
  return check_nominal_values(plan, rules, s.station_values[i], history,
                              what_of(toe) + " station " + std::to_string(r.station.id));
}

nominal::RangeCheck as_range_check(const std::string& curve, StressKind kind, double range, double utilization) {
  nominal::RangeCheck c;
  c.curve = curve;
  c.kind = kind;
  c.range_MPa = range;
  c.utilization = utilization;
  return c;
}

// The station's two methods side by side (nominal::compare_methods: ratio, governing method, verdict).
void compare(const ToeResult& toe, const NominalToeState& s, StationResult& r, StationNominal& sn) {
  if (!r.ok() || !sn.check.ok()) return;
  const auto nominal = as_range_check(s.curve.name(), s.curve.kind(), sn.check.range, sn.check.utilization);
  const auto hot = as_range_check(toe.curve, StressKind::normal, r.range, r.utilization);
  const nominal::MethodComparison c =
      nominal::compare_methods(nominal, hot, "toe '" + toe.plan.name + "' station " + std::to_string(r.station.id));
  sn.concentration_factor = c.concentration_factor;
  sn.governing = nominal::to_string(c.governing);
  sn.verdict = c.verdict;
}

nominal::WeldLoad combine(const nominal::WeldLoad& a, const nominal::WeldLoad& b, double fa, double fb) {
  return {fa * a.shear_x_N + fb * b.shear_x_N, fa * a.shear_y_N + fb * b.shear_y_N, fa * a.normal_N + fb * b.normal_N,
          fa * a.torsion_Nmm + fb * b.torsion_Nmm, fa * a.bending_Nmm + fb * b.bending_Nmm};
}

void keep_lowest(std::optional<InfiniteLifeResult>& best, const nominal::WeldCheck& check, int from, int to,
                 const std::string& cycle) {
  if (best && best->check.factor_of_safety <= check.factor_of_safety) return;
  best = InfiniteLifeResult{check, from, to, cycle};
}

// Weld group: the loads' half difference and mean between the two steps of each cycle (the range kind's governing
// pair, or every block).
std::optional<InfiniteLifeResult> weld_group_life(const Plan& plan, const InfiniteLifePlan& p, const WeldGroupPlan& w,
                                                  const NominalCheckResult& check) {
  std::vector<std::pair<int, int>> pairs;
  if (plan.loading.kind == LoadingKind::blocks)
    for (const BlockPlan& b : plan.loading.blocks) pairs.emplace_back(b.from_step, b.to_step);
  else if (check.range_from >= 0)
    pairs.emplace_back(check.range_from, check.range_to);
  const nominal::WeldGroupProperties group = nominal::weld_group_properties(w.shape);
  std::optional<InfiniteLifeResult> best;
  for (const auto& [from, to] : pairs) {
    const auto& a = w.loads[static_cast<std::size_t>(from)];
    const auto& b = w.loads[static_cast<std::size_t>(to)];
    keep_lowest(best, nominal::check_weld_infinite_life(p.input, group, combine(b, a, 0.5, -0.5), combine(b, a, 0.5, 0.5)),
                from, to, "alternating and mean loads between steps " + step_name(plan, from) + " and " +
                              step_name(plan, to) + ", throat stress at each one's critical point");
  }
  return best;
}

// Stress sources: every (alternating, mean) pair of the nominal history; the lowest factor of safety governs.
std::optional<InfiniteLifeResult> values_life(const Plan& plan, const InfiniteLifePlan& p,
                                              const std::vector<double>& values,
                                              const std::optional<LoadHistory>& history) {
  std::optional<InfiniteLifeResult> best;
  const std::vector<NominalCycle> cycles = nominal_cycles(plan, values, history);
  for (const NominalCycle& c : cycles) {
    const std::string cycle =
        c.from >= 0 && c.to >= 0 ? "nominal stress between steps " + step_name(plan, c.from) + " and " + step_name(plan, c.to)
                                 : "the most severe of " + std::to_string(cycles.size()) + " counted cycles";
    keep_lowest(best, nominal::check_weld_infinite_life(p.input, c.alternating_MPa, c.mean_MPa), c.from, c.to, cycle);
  }
  return best;
}

std::optional<InfiniteLifeResult> infinite_life(const Plan& plan, const NominalToeState& s, const ToeNominalResult& t,
                                                const std::optional<LoadHistory>& history) {
  const InfiniteLifePlan& p = *s.plan.infinite_life;
  if (s.plan.weld_group) return weld_group_life(plan, p, *s.plan.weld_group, t.check);
  if (s.plan.range_MPa) {
    InfiniteLifeResult r{nominal::check_weld_infinite_life(p.input, 0.5 * *s.plan.range_MPa, *p.mean_MPa), -1, -1,
                         "the range and mean given in the plan"};
    return r;
  }
  if (!t.check.ok() || t.check.values.empty()) return std::nullopt;
  return values_life(plan, p, t.check.values, history);
}

double worst_hot_spot(const std::vector<PlacedStation>& stations) {
  double worst = -1.0;
  for (const PlacedStation& s : stations)
    if (s.result.ok()) worst = std::max(worst, s.result.utilization);
  return worst;
}

// The worst station by the nominal method (per-station sources), and which method governs at the toe.
void summarise(const PlacedToe& toe, ToeNominalResult& t) {
  for (std::size_t i = 0; t.per_station && i < toe.stations.size(); ++i) {
    const auto& sn = toe.stations[i].result.nominal;
    if (!sn || !sn->check.ok()) continue;
    if (t.worst < 0 ||
        sn->check.utilization > toe.stations[static_cast<std::size_t>(t.worst)].result.nominal->check.utilization)
      t.worst = static_cast<int>(i);
  }
  if (t.per_station && t.worst >= 0) t.check = toe.stations[static_cast<std::size_t>(t.worst)].result.nominal->check;
  if (t.per_station && t.worst < 0) t.check.problem = "no station has a nominal sample point with a result";
  const double hot = worst_hot_spot(toe.stations);
  if (t.check.ok() && hot >= 0 && (t.worst >= 0 || !t.per_station))
    t.governing = nominal::to_string(t.check.utilization > hot * (1.0 + 1e-9) ? nominal::Method::nominal
                                                                              : nominal::Method::hot_spot);
  if (t.stress_kind == "shear")
    t.notes.push_back("the nominal range is a shear range: no structural stress concentration factor");
}

ToeNominalResult toe_header(const NominalToeState& s) {
  ToeNominalResult t;
  t.source = nominal::to_string(s.plan.source);
  t.description = s.description;
  t.curve = s.curve.name();
  t.curve_source = s.curve.source();
  t.stress_kind = to_string(s.curve.kind());
  t.per_station = s.plan.source == NominalSource::surface_distance;
  return t;
}

}  // namespace

void evaluate_nominal(const Plan& plan, PlacedToe& toe, const std::optional<LoadHistory>& history) {
  if (!toe.nominal) return;
  const NominalToeState& s = *toe.nominal;
  const ToePlan& tp = toe.result.plan;
  const NominalRules rules = nominal_rules(plan, tp, s.curve);
  ToeNominalResult t = toe_header(s);
  if (!t.per_station) t.check = toe_check(plan, s, rules, history, what_of(tp));
  for (std::size_t i = 0; i < toe.stations.size(); ++i) {
    StationResult& r = toe.stations[i].result;
    StationNominal sn;
    if (t.per_station) {
      sn.check = station_check(plan, s, rules, history, i, r, tp);
      if (s.hosts[i]) sn.sample_x = s.samples[i];
    } else {
      sn.check = t.check;
    }
    compare(toe.result, s, r, sn);
    r.nominal = std::move(sn);
  }
  summarise(toe, t);
  if (s.plan.infinite_life) t.infinite_life = infinite_life(plan, s, t, history);
  toe.result.nominal = std::move(t);
}

}  // namespace toehold::detail
