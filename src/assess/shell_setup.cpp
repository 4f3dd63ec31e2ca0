// Shell toes as assessment toes: the plan's toe keys become a ShellToeSpec, the traced stations become
// PlacedStations with their read-out hosts in the shell cells, and each load step's layers are read.
#include "shell_setup.hpp"

#include "toehold/common/error.hpp"
#include "toehold/shell/shell_toe.hpp"

#include <sstream>

namespace toehold::detail {
namespace {

std::string toe_label(const ToePlan& toe) { return "toe '" + toe.name + "'"; }

ShellToeSpec spec_of(const ToePlan& toe, const std::string& region_array) {
  const ShellToePlan& shell = *toe.shell;
  ShellToeSpec spec;
  spec.name = toe_label(toe);
  spec.marker_array = toe.marker_array;
  spec.marker_value = toe.marker_value;
  spec.points = toe.points;
  spec.tolerance_mm = 0.25 * toe.thickness;  // as the solid path snaps points: a quarter of t
  if (shell.plate_region) {
    spec.region_array = region_array;
    spec.plate_value = *shell.plate_region;
  }
  spec.plate_point = shell.plate_point;
  spec.layer = shell.layer;
  spec.origin = shell.origin;
  spec.weld_leg_mm = shell.weld_leg;
  spec.spacing_mm = toe.spacing;
  spec.kink_limit_deg = shell.kink_limit_deg;
  return spec;
}

// The shell layer reports a station's problem as "<toe> station <id>: ..."; the assessment adds that itself.
std::string without_prefix(std::string text, const std::string& prefix) {
  for (std::size_t at = text.find(prefix); at != std::string::npos; at = text.find(prefix, at))
    text.erase(at, prefix.size());
  return text;
}

Station station_of(const ShellStation& st) {
  Station s;
  s.id = st.id;
  s.x = st.x;
  s.arc = st.arc;
  s.node = st.node;
  s.frame = st.frame;
  s.facet = st.facet;
  return s;
}

ShellStationInfo info_of(const ShellStation& st, const ShellToeSpec& spec) {
  ShellStationInfo info;
  info.layer = to_string(st.layer);
  info.origin = to_string(spec.origin);
  info.offset = st.offset;
  info.hot_spot = st.hot_spot;
  info.thickness = st.thickness;
  for (const ShellReadoutPoint& p : st.points) info.from_intersection.push_back(p.from_intersection);
  return info;
}

PlacedStation placed_station(const ShellStation& st, const ShellToeSpec& spec) {
  PlacedStation placed;
  StationResult& r = placed.result;
  r.station = station_of(st);
  const std::string prefix = spec.name + " station " + std::to_string(st.id) + ": ";
  r.problem = without_prefix(st.problem, prefix);
  r.station.problem = st.facet < 0 ? r.problem : "";
  for (const std::string& note : st.notes) r.notes.push_back(without_prefix(note, prefix));
  r.path = st.path;
  for (const ShellReadoutPoint& p : st.points) {
    ReadoutPoint point;
    point.distance = p.distance;
    point.x = p.x;
    point.cell = p.host.cell;
    point.pcoords = p.host.pcoords;
    point.off_model = p.host.distance;
    r.points.push_back(point);
    placed.hosts.push_back(p.host);
  }
  r.shell = info_of(st, spec);
  return placed;
}

}  // namespace

std::unique_ptr<ShellGeometry> read_shell_geometry(const Plan& plan, Reporter& reporter) {
  const auto [file, step] = geometry_source(plan);
  const ShellModelPlan& shell = *plan.model.shell;
  return std::make_unique<ShellGeometry>(
      read_shell_mesh(file, step, plan.model.length_unit, {shell.thickness, shell.thickness_array}, reporter));
}

PlacedShellToe place_shell_toe(const ShellGeometry& g, const ToePlan& toe, const std::string& region_array,
                               Reporter& reporter) {
  PlacedShellToe out;
  ToeResult& r = out.toe.result;
  r.plan = toe;
  r.scheme = toe_scheme(toe, toe.thickness);
  const ShellToeSpec spec = spec_of(toe, region_array);
  ShellToe traced = trace_shell_toe(g.surface, spec);
  r.line = traced.line;
  for (ShellStation& st : traced.stations) {
    // The station's own plate thickness places its points; the extrapolation weights are the toe's (r.scheme):
    // every scheme scales all its distances by t or none, so the weights do not depend on t.
    const double t = st.thickness > 0 ? st.thickness : toe.thickness;
    try {
      place_shell_readout(g.surface, spec, st, toe_scheme(toe, t).distances);
    } catch (const Error& e) {
      throw Error(toe_label(toe) + ", station " + std::to_string(st.id) + ": " + e.what());
    }
    out.toe.stations.push_back(placed_station(st, spec));
    out.layers.push_back(st.layer);
  }
  std::ostringstream os;
  os.precision(4);
  os << toe_label(toe) << ": " << traced.stations.size() << " stations along " << r.line.length()
     << " mm of a shell intersection line (read-out from the " << to_string(spec.origin) << ")";
  reporter.info(os.str());
  return out;
}

ShellStepReader::ShellStepReader(const Plan& plan, const ShellMesh& geometry, Reporter& reporter)
    : plan_(plan), geometry_(geometry), reporter_(reporter) {
  files_.push_back(geometry.source());
}

const ShellMesh& ShellStepReader::mesh_for(const StepPlan& step) {
  const auto key = std::make_pair(step.file, step.step);
  if (key == geometry_source(plan_)) return geometry_;
  if (auto found = meshes_.find(key); found != meshes_.end()) return found->second;
  // Only the layer arrays are read from a step's own file: its thickness is the geometry's (1 mm stands in).
  ShellMesh mesh = read_shell_mesh(step.file, step.step, plan_.model.length_unit, {1.0, ""}, reporter_);
  const auto points = mesh.grid()->GetNumberOfPoints();
  if (points != geometry_.grid()->GetNumberOfPoints() || mesh.cell_count() != geometry_.cell_count())
    throw Error("load step '" + step.name + "': " + mesh.source() + " has " + std::to_string(points) +
                " points and " + std::to_string(mesh.cell_count()) + " shell cells, the model (" +
                geometry_.source() + ") has " + std::to_string(geometry_.grid()->GetNumberOfPoints()) + " and " +
                std::to_string(geometry_.cell_count()) + "; every load step must be on the same mesh");
  files_.push_back(mesh.source());
  meshes_.clear();  // steps are read in order: keep only the latest extra mesh
  return meshes_.emplace(key, std::move(mesh)).first->second;
}

ShellLayerStress ShellStepReader::read(std::size_t index) {
  const StepPlan& step = plan_.steps[index];
  if (step.unloaded) {
    const StressField zero(Association::cell, std::vector<double>(6 * static_cast<std::size_t>(geometry_.cell_count()), 0.0));
    return ShellLayerStress{zero, zero, "unloaded step (zero stress)"};
  }
  const ShellMesh& mesh = mesh_for(step);
  try {
    return read_shell_layers(mesh, step.layers, plan_.model.stress_unit);
  } catch (const Error& e) {
    throw Error("load step '" + step.name + "': " + e.what());
  }
}

}  // namespace toehold::detail
