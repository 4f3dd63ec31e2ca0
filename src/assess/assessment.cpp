#include "toehold/assess/assessment.hpp"

#include "internal.hpp"
#include "toehold/common/error.hpp"
#include "toehold/fatigue/sn_catalogue.hpp"
#include "toehold/hotspot/definition.hpp"

#include <algorithm>
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

Assessment run_assessment(const Plan& plan, Reporter& reporter) {
  if (plan.loading.kind != LoadingKind::range)
    throw Error(plan.path + ": loading kind '" + to_string(plan.loading.kind) +
                "' is not available in this version; use kind = \"range\"");
  Assessment out;
  out.plan = plan;
  for (const auto& s : plan.steps) out.steps.push_back(s.name);
  const auto [geometry_file, geometry_step] = detail::geometry_source(plan);
  detail::ModelGeometry geometry(read_mesh(geometry_file, geometry_step, plan.model.length_unit, reporter));
  out.model_points = geometry.mesh.grid()->GetNumberOfPoints();
  out.model_cells = geometry.mesh.grid()->GetNumberOfCells();
  geometry.cell_region = detail::read_cell_region(geometry.mesh, plan.model.region_array);

  std::vector<PlacedToe> toes;
  std::vector<SnCurve> curves;
  for (const ToePlan& toe : plan.toes) {
    double factor = 1.0;
    try {
      curves.push_back(detail::toe_curve(toe, factor));
    } catch (const Error& e) {
      throw Error("toe '" + toe.name + "': " + e.what());
    }
    toes.push_back(detail::place_toe(geometry, toe, plan.model.region_array, reporter));
    toes.back().result.thickness_factor = factor;
    toes.back().result.curve = curves.back().name();
    toes.back().result.curve_source = curves.back().source();
    toes.back().result.definition = to_string(parse_hot_spot_definition(toe.definition, "toe '" + toe.name + "'"));
  }

  // Tensors at the toe, per toe, per station, per step.
  std::vector<std::vector<std::vector<Tensor>>> tensors(toes.size());
  for (std::size_t t = 0; t < toes.size(); ++t) tensors[t].resize(toes[t].stations.size());
  detail::StepReader steps(plan, geometry.mesh, reporter);
  for (std::size_t k = 0; k < plan.steps.size(); ++k) {
    reporter.progress("load steps", k, plan.steps.size());
    const StressField field = steps.read(k);
    for (std::size_t t = 0; t < toes.size(); ++t)
      for (std::size_t s = 0; s < toes[t].stations.size(); ++s)
        detail::record_step(toes[t].stations[s], toes[t].result.scheme, field, tensors[t][s]);
  }
  reporter.progress("load steps", plan.steps.size(), plan.steps.size());
  out.input_files = steps.files();
  out.model = geometry.mesh;

  for (std::size_t t = 0; t < toes.size(); ++t) {
    const ToePlan& toe = plan.toes[t];
    const auto definition = parse_hot_spot_definition(toe.definition, "toe '" + toe.name + "'");
    const auto options = detail::definition_options(toe);
    for (std::size_t s = 0; s < toes[t].stations.size(); ++s) {
      StationResult& r = toes[t].stations[s].result;
      if (!r.ok()) continue;
      detail::evaluate_range(r, tensors[t][s], definition, options);
      detail::check_range(r, curves[t], plan.requirement);
    }
    finish_toe(toes[t], out);
    out.toes.push_back(std::move(toes[t].result));
  }
  return out;
}

}  // namespace toehold
