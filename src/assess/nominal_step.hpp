// The nominal-stress method of a toe inside the assessment (private to src/assess): set up once the toe is placed,
// fed every load step's stress field, evaluated once the hot-spot results are in.
#pragma once

#include "internal.hpp"

#include "toehold/nominal/nominal_check.hpp"

#include <optional>

namespace toehold::detail {

// What one toe's nominal check keeps between the steps.
struct NominalToeState {
  ToeNominalPlan plan;
  SnCurve curve;                        // the nominal detail class (catalogue or [[curve]])
  const Mesh* mesh = nullptr;           // geometry the section is cut on; outlives the assessment's toes
  std::vector<double> toe_values;       // section: membrane stress per step, MPa
  std::string description;              // where the nominal stress is measured (set in prepare, refined per step)
  // surface-distance, per station (same order as PlacedToe::stations):
  std::vector<std::optional<Host>> hosts;  // host of the sample point; none when it could not be placed
  std::vector<Vec3> samples;               // sample point, mm
  std::vector<std::string> problems;       // why a station's sample has no host ("" when it has one)
  std::vector<std::vector<double>> station_values;  // readout . S . readout at the sample per step, MPa
  explicit NominalToeState(const ToeNominalPlan& p, SnCurve c) : plan(p), curve(std::move(c)) {}
};

// After place_toe: locates what the toe's [toe.nominal] source needs in the model. No-op without [toe.nominal].
// `weld` is the toe's weld side (toe_weld_side), which the surface-distance samples walk away from.
void prepare_nominal(const Plan& plan, const ModelGeometry& geometry, const WeldSide& weld, PlacedToe& toe);

// Per load step (unit case), after the stations have recorded the step.
void record_nominal_step(PlacedToe& toe, const StressField& field);

// After the stations have been evaluated: the nominal range, its check, and the side-by-side comparison.
void evaluate_nominal(const Plan& plan, PlacedToe& toe, const std::optional<LoadHistory>& history);

// ---- nominal_damage.cpp: one nominal history checked by the plan's loading kind ----

// The rules the toe's nominal check uses: the plan's requirement and loading, the nominal curve.
struct NominalRules {
  SnCurve curve;
  nominal::RangeRequirement requirement;  // range kind: the plan's cycles, gamma_M, gamma_F, constant amplitude
  DamageRules damage;                     // damage kinds: gamma_F, gamma_M, damage limit of the nominal curve, f(R)
  ResidueRule residue = ResidueRule::half_cycles;
  double required_repeats = 1.0;          // as ToeDamage::required_repeats
};
NominalRules nominal_rules(const Plan& plan, const ToePlan& toe, const SnCurve& curve);

// Signed nominal values per load step (unit case) checked by the plan's loading kind. `what` labels errors.
NominalCheckResult check_nominal_values(const Plan& plan, const NominalRules& rules, std::vector<double> values,
                                        const std::optional<LoadHistory>& history, const std::string& what);
// A range the plan gives (loading kind range only).
NominalCheckResult check_nominal_range(const NominalRules& rules, double range_MPa, const std::string& what);
// A weld group under its loads per step: range kind over every pair of steps, blocks block by block.
NominalCheckResult check_weld_group(const Plan& plan, const NominalRules& rules, const WeldGroupPlan& group,
                                    const std::string& what);

// The (alternating, mean) nominal stress pairs of a history, MPa, with the steps they come from.
struct NominalCycle {
  double alternating_MPa = 0.0, mean_MPa = 0.0;
  int from = -1, to = -1;
};
std::vector<NominalCycle> nominal_cycles(const Plan& plan, const std::vector<double>& values,
                                         const std::optional<LoadHistory>& history);

}  // namespace toehold::detail
