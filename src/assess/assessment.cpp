#include "toehold/assess/assessment.hpp"

#include "internal.hpp"
#include "nominal_step.hpp"
#include "parallel_for.hpp"
#include "shell_setup.hpp"
#include "through_thickness.hpp"
#include "toehold/common/error.hpp"
#include "toehold/fatigue/sn_catalogue.hpp"
#include "toehold/hotspot/definition.hpp"

#include "toehold/fatigue/rainflow.hpp"
#include "toehold/loading/load_history.hpp"

#include <algorithm>
#include <memory>
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

// What every toe's result carries besides its stations: curve, definition, damage settings.
void describe_toe(const Plan& plan, const ToePlan& toe, const SnCurve& curve, double factor, ToeResult& r) {
  r.thickness_factor = factor;
  r.curve = curve.name();
  r.curve_source = curve.source();
  r.definition = to_string(parse_hot_spot_definition(toe.definition, "toe '" + toe.name + "'"));
  if (plan.loading.kind != LoadingKind::range) {
    r.damage_limit = toe.damage_limit;
    r.mean_stress = detail::toe_mean_stress(toe);
  }
}

std::vector<SnCurve> toe_curves(const Plan& plan, std::vector<double>& factors) {
  std::vector<SnCurve> curves;
  for (const ToePlan& toe : plan.toes) {
    double factor = 1.0;
    try {
      curves.push_back(detail::toe_curve(plan, toe, factor));
    } catch (const Error& e) {
      throw Error("toe '" + toe.name + "': " + e.what());
    }
    factors.push_back(factor);
  }
  return curves;
}

// True when some point is used by two cells: point data on such a mesh are nodal averages. Element-nodal results
// repeat the nodes per cell, so no point is shared there.
bool shares_nodes(vtkUnstructuredGrid* grid) {
  std::vector<unsigned char> used(static_cast<std::size_t>(grid->GetNumberOfPoints()), 0);
  for (vtkIdType c = 0; c < grid->GetNumberOfCells(); ++c) {
    vtkIdType n = 0;
    const vtkIdType* pts = nullptr;
    grid->GetCellPoints(c, n, pts);
    for (vtkIdType i = 0; i < n; ++i) {
      unsigned char& u = used[static_cast<std::size_t>(pts[i])];
      if (u != 0) return true;
      u = 1;
    }
  }
  return false;
}

const char* const kNodalAverages =
    "the stresses are point data on nodes that neighbouring cells share, so they are nodal averages: smoothed "
    "across cell boundaries, also across the weld/plate boundary where weld and plate cells share nodes; cell data "
    "or element-nodal values (nodes repeated per cell) avoid this";

// The toes placed on the model, their linearization state and every step's values per station.
struct PlacedRun {
  std::vector<PlacedToe> toes;
  std::vector<detail::ThicknessToe> linear;  // per toe
  StepValues values;
};

// Holds the messages of a try that may be redone, and passes them on only when it succeeds.
class HeldReporter final : public Reporter {
public:
  void info(const std::string& message) override { held_.push_back({false, message}); }
  void warn(const std::string& message) override { held_.push_back({true, message}); }
  void progress(const std::string&, std::size_t, std::size_t) override {}
  void release(Reporter& to) const {
    for (const auto& [warning, message] : held_) warning ? to.warn(message) : to.info(message);
  }

private:
  std::vector<std::pair<bool, std::string>> held_;
};

// Toe lines, stations, read-out points, nominal samples and linearization lines of every toe.
PlacedRun place_solid(const Plan& plan, const detail::ModelGeometry& geometry, Reporter& reporter) {
  PlacedRun run;
  for (const ToePlan& toe : plan.toes) {
    run.toes.push_back(detail::place_toe(geometry, toe, plan.model.region_array, reporter));
    const WeldSide weld = detail::toe_weld_side(geometry, toe, plan.model.region_array);
    detail::prepare_nominal(plan, geometry, weld, run.toes.back());
    run.linear.push_back(detail::prepare_through_thickness(geometry, toe, weld, run.toes.back()));
  }
  return run;
}

// The geometry near the toes when that is enough, else the whole model's. A placement that fails near the
// toes is redone on the whole model, so every error names what the whole model shows.
PlacedRun place_on_model(const Plan& plan, std::unique_ptr<detail::ModelGeometry>& geometry, Mesh mesh,
                         Reporter& reporter) {
  std::optional<NearCells> near = detail::toe_neighbourhood(plan, mesh);
  if (near) {
    geometry = std::make_unique<detail::ModelGeometry>(mesh, std::move(near));
    geometry->cell_region = detail::read_cell_region(geometry->mesh, plan.model.region_array);
    HeldReporter held;
    try {
      PlacedRun run = place_solid(plan, *geometry, held);
      held.release(reporter);
      return run;
    } catch (const Error&) {
      geometry.reset();
    }
  }
  geometry = std::make_unique<detail::ModelGeometry>(std::move(mesh), std::nullopt);
  geometry->cell_region = detail::read_cell_region(geometry->mesh, plan.model.region_array);
  return place_solid(plan, *geometry, reporter);
}

// The points and cells whose stresses the placed toes read: the hosts of every read-out point, nominal sample
// and linearization sample. None (read everything) when a nominal section is cut, which reads every cell it
// crosses.
StressSubsets read_entities(const PlacedRun& run, const Mesh& mesh) {
  std::vector<long long> points, cells;
  const auto add = [&](const Host& h) {
    cells.push_back(h.cell);
    points.insert(points.end(), h.points.begin(), h.points.end());
  };
  for (std::size_t t = 0; t < run.toes.size(); ++t) {
    const PlacedToe& toe = run.toes[t];
    if (toe.nominal && toe.nominal->plan.source == nominal::NominalSource::section) return {};
    for (const detail::PlacedStation& s : toe.stations)
      for (const Host& h : s.hosts) add(h);
    if (toe.nominal)
      for (const auto& h : toe.nominal->hosts)
        if (h) add(*h);
    for (const detail::ThicknessStation& s : run.linear[t].stations)
      for (const Host& h : s.line.hosts) add(h);
  }
  vtkUnstructuredGrid* grid = mesh.grid();
  return {std::make_shared<EntitySubset>(std::move(points), static_cast<std::size_t>(grid->GetNumberOfPoints())),
          std::make_shared<EntitySubset>(std::move(cells), static_cast<std::size_t>(grid->GetNumberOfCells()))};
}

// Every load step's values at the placed stations, nominal samples and linearization lines.
void record_solid(const Plan& plan, const detail::ModelGeometry& geometry, PlacedRun& run, Assessment& out,
                  Reporter& reporter) {
  run.values.resize(run.toes.size());
  for (std::size_t t = 0; t < run.toes.size(); ++t) run.values[t].resize(run.toes[t].stations.size());
  detail::StepReader steps(plan, geometry.mesh, reporter);
  steps.convert_only(read_entities(run, geometry.mesh));
  bool checked = false;  // the nodal-average remark is decided on the first step with point data
  for (std::size_t k = 0; k < plan.steps.size(); ++k) {
    reporter.progress("load steps", k, plan.steps.size());
    const StressField field = steps.read(k);
    if (!checked && field.where() == Association::point) {
      checked = true;
      if (shares_nodes(geometry.mesh.grid())) out.warnings.push_back(kNodalAverages);
    }
    for (std::size_t t = 0; t < run.toes.size(); ++t) {
      for (std::size_t s = 0; s < run.toes[t].stations.size(); ++s)
        detail::record_step(run.toes[t].stations[s], run.toes[t].result.scheme, field, run.values[t][s]);
      detail::record_nominal_step(run.toes[t], field);
      detail::record_through_thickness_step(run.linear[t], field);
    }
  }
  reporter.progress("load steps", plan.steps.size(), plan.steps.size());
  out.input_files = steps.files();
}

// The shell path: toes on plate intersection lines, every step's layer stresses read once, each station reading
// its own layer. [toe.nominal] is refused on shell models by the plan, so the nominal hooks are not called.
PlacedRun run_shell(const Plan& plan, const detail::ShellGeometry& geometry, Assessment& out, Reporter& reporter) {
  PlacedRun run;
  std::vector<std::vector<ShellLayer>> layers;
  for (const ToePlan& toe : plan.toes) {
    detail::PlacedShellToe placed = detail::place_shell_toe(geometry, toe, plan.model.region_array, reporter);
    run.toes.push_back(std::move(placed.toe));
    layers.push_back(std::move(placed.layers));
    run.linear.emplace_back();
  }
  run.values.resize(run.toes.size());
  for (std::size_t t = 0; t < run.toes.size(); ++t) run.values[t].resize(run.toes[t].stations.size());
  detail::ShellStepReader steps(plan, geometry.shells, reporter);
  for (std::size_t k = 0; k < plan.steps.size(); ++k) {
    reporter.progress("load steps", k, plan.steps.size());
    const ShellLayerStress stress = steps.read(k);
    for (std::size_t t = 0; t < run.toes.size(); ++t)
      for (std::size_t s = 0; s < run.toes[t].stations.size(); ++s)
        detail::record_step(run.toes[t].stations[s], run.toes[t].result.scheme, stress.layer(layers[t][s]),
                            run.values[t][s]);
  }
  reporter.progress("load steps", plan.steps.size(), plan.steps.size());
  out.input_files = steps.files();
  return run;
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
  try {
    switch (plan.loading.kind) {
      case LoadingKind::range:
        detail::evaluate_range(r, steps, definition, detail::definition_options(toe));
        detail::check_range(r, curve, plan.requirement);
        return;
      case LoadingKind::series: detail::evaluate_series(r, steps, damage); return;
      case LoadingKind::blocks: detail::evaluate_blocks(r, steps, damage, plan.loading.blocks); return;
      case LoadingKind::unit_cases: detail::evaluate_unit_cases(r, steps, damage, *history, definition); return;
    }
  } catch (const Error& e) {
    throw Error("toe '" + toe.name + "', station " + std::to_string(r.station.id) + ": " + e.what());
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
  std::vector<double> factors;
  const std::vector<SnCurve> curves = toe_curves(plan, factors);
  PlacedRun run;
  std::unique_ptr<detail::ShellGeometry> shells;    // kept for the whole run, as the toes' states may refer to them
  std::unique_ptr<detail::ModelGeometry> geometry;
  if (plan.model.shell) {
    shells = detail::read_shell_geometry(plan, reporter);
    out.model = shells->shells.mesh();
    run = run_shell(plan, *shells, out, reporter);
  } else {
    const auto [geometry_file, geometry_step] = detail::geometry_source(plan);
    run = place_on_model(plan, geometry, read_mesh(geometry_file, geometry_step, plan.model.length_unit, reporter),
                         reporter);
    out.model = geometry->mesh;
    record_solid(plan, *geometry, run, out, reporter);
  }
  out.model_points = out.model.grid()->GetNumberOfPoints();
  out.model_cells = out.model.grid()->GetNumberOfCells();
  std::vector<PlacedToe>& toes = run.toes;
  for (std::size_t t = 0; t < toes.size(); ++t) describe_toe(plan, plan.toes[t], curves[t], factors[t], toes[t].result);
  const StepValues& values = run.values;

  const std::size_t total = count_stations(toes);
  std::size_t done = 0;
  const std::string what = history ? "load history at stations" : "stations";
  for (std::size_t t = 0; t < toes.size(); ++t) {
    const ToePlan& toe = plan.toes[t];
    const auto definition = parse_hot_spot_definition(toe.definition, "toe '" + toe.name + "'");
    const detail::ToeDamage damage = detail::toe_damage(plan, toe, curves[t]);
    std::vector<detail::PlacedStation>& stations = toes[t].stations;
    if (history) reporter.progress(what, done, total);
    // Each station writes only its own result; everything shared is read-only (the reporter is not called).
    detail::parallel_for(stations.size(), 1, [&](std::size_t begin, std::size_t end) {
      for (std::size_t s = begin; s < end; ++s) {
        StationResult& r = stations[s].result;
        if (r.ok()) evaluate_station(plan, r, values[t][s], damage, definition, toe, curves[t], history);
      }
    });
    done += stations.size();
    if (!run.linear[t].stations.empty())
      detail::evaluate_through_thickness(run.linear[t], toes[t], definition, detail::definition_options(toe),
                                         plan.loading.kind);
    detail::evaluate_nominal(plan, toes[t], history);
    finish_toe(toes[t], out);
    out.toes.push_back(std::move(toes[t].result));
  }
  if (history) reporter.progress(what, total, total);
  return out;
}

}  // namespace toehold
