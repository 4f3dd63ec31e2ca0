#include "toehold/assess/assessment.hpp"

#include "internal.hpp"
#include "nominal_step.hpp"
#include "toehold/common/error.hpp"
#include "toehold/fatigue/sn_catalogue.hpp"
#include "toehold/hotspot/definition.hpp"

#include "toehold/fatigue/rainflow.hpp"
#include "toehold/loading/load_history.hpp"

#include <algorithm>
#include <optional>
#include <sstream>

namespace toehold {
namespace {

using detail::PlacedToe;

void finish_toe(PlacedToe& toe, Assessment& out) {
  ToeResult& r = toe.result;
  for (auto& s : toe.stations) r.stations.push_back(std::move(s.result));
  for (std::size_t i = 0; i < r.stations.size(); ++i) {
    const StationResult& s = r.stations[i];
    if (!s.ok()) {
      out.warnings.push_back("toe '" + r.plan.name + "', station " + std::to_string(s.station.id) + ": " + s.problem);
      continue;
    }
    if (r.worst < 0 || s.utilization > r.stations[static_cast<std::size_t>(r.worst)].utilization)
      r.worst = static_cast<int>(i);
  }
  if (r.worst < 0) out.warnings.push_back("toe '" + r.plan.name + "': no station has a result");
  const auto noted = std::count_if(r.stations.begin(), r.stations.end(), [](const auto& s) { return !s.notes.empty(); });
  const auto first = std::find_if(r.stations.begin(), r.stations.end(), [](const auto& s) { return !s.notes.empty(); });
  if (noted > 0)
    out.warnings.push_back("toe '" + r.plan.name + "': " + std::to_string(noted) +
                           " stations carry remarks (report.html, results.json), e.g. station " +
                           std::to_string(first->station.id) + ": " + first->notes.front());
}

}  // namespace

int Assessment::stations() const {
  int n = 0;
  for (const auto& t : toes) n += static_cast<int>(t.stations.size());
  return n;
}

int Assessment::stations_without_result() const {
  int n = 0;
  for (const auto& t : toes)
    n += static_cast<int>(std::count_if(t.stations.begin(), t.stations.end(), [](const auto& s) { return !s.ok(); }));
  return n;
}

int Assessment::stations_exceeding() const {
  int n = 0;
  for (const auto& t : toes)
    n += static_cast<int>(
        std::count_if(t.stations.begin(), t.stations.end(), [](const auto& s) { return s.exceeds(); }));
  return n;
}

namespace {

using StepValues = std::vector<std::vector<std::vector<InPlaneStress>>>;  // per toe, per station, per step

std::string counting_rule(const Plan& plan) {
  switch (plan.loading.kind) {
    case LoadingKind::range: return "";
    case LoadingKind::blocks: return "block spectrum: cycles of each block as given in the plan";
    default: break;
  }
  return describe(plan.loading.repeating_history ? ResidueRule::repeat_history : ResidueRule::half_cycles);
}

std::vector<PlacedToe> place_toes(const Plan& plan, const detail::ModelGeometry& geometry,
                                  std::vector<SnCurve>& curves, Reporter& reporter) {
  std::vector<PlacedToe> toes;
  for (const ToePlan& toe : plan.toes) {
    double factor = 1.0;
    try {
      curves.push_back(detail::toe_curve(plan, toe, factor));
    } catch (const Error& e) {
      throw Error("toe '" + toe.name + "': " + e.what());
    }
    toes.push_back(detail::place_toe(geometry, toe, plan.model.region_array, reporter));
    detail::prepare_nominal(plan, geometry, toes.back());
    ToeResult& r = toes.back().result;
    r.thickness_factor = factor;
    r.curve = curves.back().name();
    r.curve_source = curves.back().source();
    r.definition = to_string(parse_hot_spot_definition(toe.definition, "toe '" + toe.name + "'"));
    if (plan.loading.kind != LoadingKind::range) {
      r.damage_limit = toe.damage_limit;
      r.mean_stress = detail::toe_mean_stress(toe);
    }
  }
  return toes;
}

// Reads every step once and keeps, per station, the read-out normal stresses and the in-plane toe stress.
StepValues read_steps(const Plan& plan, const Mesh& geometry, std::vector<PlacedToe>& toes, Assessment& out,
                      Reporter& reporter) {
  StepValues values(toes.size());
  for (std::size_t t = 0; t < toes.size(); ++t) values[t].resize(toes[t].stations.size());
  detail::StepReader steps(plan, geometry, reporter);
  for (std::size_t k = 0; k < plan.steps.size(); ++k) {
    reporter.progress("load steps", k, plan.steps.size());
    const StressField field = steps.read(k);
    for (std::size_t t = 0; t < toes.size(); ++t) {
      for (std::size_t s = 0; s < toes[t].stations.size(); ++s)
        detail::record_step(toes[t].stations[s], toes[t].result.scheme, field, values[t][s]);
      detail::record_nominal_step(toes[t], field);
    }
  }
  reporter.progress("load steps", plan.steps.size(), plan.steps.size());
  out.input_files = steps.files();
  return values;
}

std::optional<LoadHistory> read_history(const Plan& plan, Reporter& reporter) {
  if (plan.loading.kind != LoadingKind::unit_cases) return std::nullopt;
  std::vector<std::string> names;
  for (const auto& s : plan.steps) names.push_back(s.name);
  reporter.info("reading load history " + plan.loading.history_file);
  return read_load_history(plan.loading.history_file, names);
}

// One station by the plan's loading kind.
void evaluate_station(const Plan& plan, StationResult& r, const std::vector<InPlaneStress>& steps,
                      const detail::ToeDamage& damage, HotSpotDefinition definition, const ToePlan& toe,
                      const SnCurve& curve, const std::optional<LoadHistory>& history) {
  switch (plan.loading.kind) {
    case LoadingKind::range:
      detail::evaluate_range(r, steps, definition, detail::definition_options(toe));
      detail::check_range(r, curve, plan.requirement);
      return;
    case LoadingKind::series: detail::evaluate_series(r, steps, damage); return;
    case LoadingKind::blocks: detail::evaluate_blocks(r, steps, damage, plan.loading.blocks); return;
    case LoadingKind::unit_cases: detail::evaluate_unit_cases(r, steps, damage, *history, definition); return;
  }
}

std::size_t count_stations(const std::vector<PlacedToe>& toes) {
  std::size_t n = 0;
  for (const auto& t : toes) n += t.stations.size();
  return n;
}

}  // namespace

Assessment run_assessment(const Plan& plan, Reporter& reporter) {
  Assessment out;
  out.plan = plan;
  out.counting = counting_rule(plan);
  for (const auto& s : plan.steps) out.steps.push_back(s.name);
  const std::optional<LoadHistory> history = read_history(plan, reporter);
  out.history_rows = history ? history->rows() : plan.loading.kind == LoadingKind::series ? plan.steps.size() : 0;
  const auto [geometry_file, geometry_step] = detail::geometry_source(plan);
  detail::ModelGeometry geometry(read_mesh(geometry_file, geometry_step, plan.model.length_unit, reporter));
  out.model_points = geometry.mesh.grid()->GetNumberOfPoints();
  out.model_cells = geometry.mesh.grid()->GetNumberOfCells();
  geometry.cell_region = detail::read_cell_region(geometry.mesh, plan.model.region_array);

  std::vector<SnCurve> curves;
  std::vector<PlacedToe> toes = place_toes(plan, geometry, curves, reporter);
  const StepValues values = read_steps(plan, geometry.mesh, toes, out, reporter);
  out.model = geometry.mesh;

  const std::size_t total = count_stations(toes);
  std::size_t done = 0;
  const std::string what = history ? "load history at stations" : "stations";
  for (std::size_t t = 0; t < toes.size(); ++t) {
    const ToePlan& toe = plan.toes[t];
    const auto definition = parse_hot_spot_definition(toe.definition, "toe '" + toe.name + "'");
    const detail::ToeDamage damage = detail::toe_damage(plan, toe, curves[t]);
    for (std::size_t s = 0; s < toes[t].stations.size(); ++s, ++done) {
      if (history && done % 16 == 0) reporter.progress(what, done, total);
      StationResult& r = toes[t].stations[s].result;
      if (r.ok()) evaluate_station(plan, r, values[t][s], damage, definition, toe, curves[t], history);
    }
    detail::evaluate_nominal(plan, toes[t], history);
    finish_toe(toes[t], out);
    out.toes.push_back(std::move(toes[t].result));
  }
  if (history) reporter.progress(what, total, total);
  return out;
}

}  // namespace toehold
