#include "internal.hpp"
#include "through_thickness.hpp"

#include "toehold/common/error.hpp"
#include "toehold/toe/fitness.hpp"
#include "toehold/toe/surface_walk.hpp"

#include <vtkCellData.h>
#include <vtkDataArray.h>
#include <vtkIdList.h>
#include <vtkNew.h>
#include <vtkPointData.h>

#include <cmath>
#include <set>
#include <sstream>

namespace toehold::detail {
namespace {

std::string toe_label(const ToePlan& toe) { return "toe '" + toe.name + "'"; }

vtkDataArray* integer_array(vtkFieldData* data, const std::string& name, const std::string& kind,
                            const Mesh& mesh, const std::string& who) {
  vtkDataArray* array = data->GetArray(name.c_str());
  if (!array)
    throw Error(who + ": " + mesh.source() + " has no " + kind + " array '" + name +
                "'; run 'toehold inspect' on the model to see its arrays");
  if (array->GetNumberOfComponents() != 1)
    throw Error(who + ": " + kind + " array '" + name + "' in " + mesh.source() + " has " +
                std::to_string(array->GetNumberOfComponents()) + " components; a marker array has one");
  return array;
}

ToeLine toe_line(const ModelGeometry& g, const ToePlan& toe) {
  const std::string who = toe_label(toe);
  if (!toe.marker_array.empty())
    return chain_marker_nodes(g.surface, marked_nodes(g.mesh, toe),
                              who + " (point array '" + toe.marker_array + "' = " +
                                  std::to_string(toe.marker_value) + ")");
  return snap_toe_points(g.surface, toe.points, toe.closed, 0.25 * toe.thickness, who);
}

WeldSide weld_side(const ModelGeometry& g, const ToePlan& toe, const std::string& region_array) {
  WeldSide side;
  if (!toe.weld_regions.empty()) {
    side.cell_region = g.cell_region;
    side.weld_values = toe.weld_regions;
    side.description = "cell array '" + region_array + "'";
  }
  side.point = toe.weld_point;
  if (toe.weld_point) side.description += std::string(side.description.empty() ? "" : " and ") + "the weld point";
  return side;
}

std::string at_mm(const char* what, double d) {
  std::ostringstream os;
  os.precision(4);
  os << "read-out point at " << d << " mm " << what;
  return os.str();
}

// Which mesh points belong to a weld cell (empty when the weld side has no region values).
std::vector<char> weld_points(vtkUnstructuredGrid* grid, const WeldSide& weld) {
  if (!weld.has_regions()) return {};
  std::vector<char> on_weld(static_cast<std::size_t>(grid->GetNumberOfPoints()), 0);
  vtkNew<vtkIdList> ids;
  for (vtkIdType c = 0; c < grid->GetNumberOfCells(); ++c) {
    if (!weld.is_weld_cell(c)) continue;
    grid->GetCellPoints(c, ids);
    for (vtkIdType i = 0; i < ids->GetNumberOfIds(); ++i) on_weld[static_cast<std::size_t>(ids->GetId(i))] = 1;
  }
  return on_weld;
}

// True when a cell that shares a point with `cell` is a weld cell: one of its points is a weld cell's.
bool touches_weld(vtkUnstructuredGrid* grid, const std::vector<char>& on_weld, long long cell) {
  vtkNew<vtkIdList> ids;
  grid->GetCellPoints(cell, ids);
  for (vtkIdType i = 0; i < ids->GetNumberOfIds(); ++i)
    if (on_weld[static_cast<std::size_t>(ids->GetId(i))]) return true;
  return false;
}

// The mesh-fitness checks that fail (toe/fitness.hpp) and read-out cells that touch the weld, as station notes.
void add_fitness_notes(const ModelGeometry& g, const ReadoutScheme& scheme, const std::vector<char>& on_weld,
                       double thickness, PlacedStation& placed) {
  StationResult& r = placed.result;
  std::vector<long long> cells;
  for (const Host& h : placed.hosts) cells.push_back(h.cell);
  const long long toe_cell = g.surface.facets()[static_cast<std::size_t>(r.station.facet)].owner;
  for (const FitnessCheck& c : check_station_fitness(g.mesh, scheme, thickness, r.station.frame.readout, toe_cell, cells))
    if (!c.passed) r.notes.push_back("mesh check '" + c.name + "' fails: " + c.detail);
  if (on_weld.empty()) return;
  for (std::size_t k = 0; k < cells.size(); ++k)
    if (touches_weld(g.mesh.grid(), on_weld, cells[k]))
      r.notes.push_back(at_mm("lies in a cell that touches the weld: nodal-averaged stresses there mix weld and plate",
                              r.points[k].distance));
}

PlacedStation place_station(const ModelGeometry& g, const Station& station, const ReadoutScheme& scheme,
                            const WeldSide& weld, const std::vector<char>& on_weld, double thickness) {
  PlacedStation placed;
  StationResult& r = placed.result;
  r.station = station;
  if (!station.problem.empty()) {
    r.problem = station.problem;
    return placed;
  }
  const Walk walk = walk_surface(g.surface, weld, station.facet, station.x, station.frame.readout, scheme.distances);
  r.path = walk.path;
  const double tolerance = 0.05 * thickness;
  const auto refuse_weld = [&weld](long long cell) { return weld.is_weld_cell(cell); };
  for (const SurfacePoint& target : walk.targets) {
    auto host = g.locator.locate(target.x, tolerance);
    if (!host) {
      r.problem = at_mm("lies off the model", target.distance);
      break;
    }
    if (weld.is_weld_cell(host->cell)) {  // on the face between weld and plate cells the plate cell is the host
      const auto plate = g.locator.locate(target.x, tolerance, refuse_weld);
      if (plate && plate->distance <= 1e-9 * thickness) host = plate;
    }
    if (weld.is_weld_cell(host->cell)) {
      r.problem = at_mm(("falls in weld cell " + std::to_string(host->cell)).c_str(), target.distance);
      break;
    }
    ReadoutPoint point;
    point.distance = target.distance;
    point.x = target.x;
    point.cell = host->cell;
    point.pcoords = host->pcoords;
    point.off_model = host->distance;
    r.points.push_back(point);
    placed.hosts.push_back(*host);
  }
  if (r.problem.empty() && !walk.stop_reason.empty()) r.problem = walk.stop_reason;
  if (r.problem.empty()) add_fitness_notes(g, scheme, on_weld, thickness, placed);
  return placed;
}

}  // namespace

ModelGeometry::ModelGeometry(Mesh m, std::optional<NearCells> near_toes)
    : mesh(std::move(m)), near(std::move(near_toes)), surface(mesh, near ? &*near : nullptr),
      locator(mesh, near ? &*near : nullptr) {}

std::vector<long long> marked_nodes(const Mesh& mesh, const ToePlan& toe) {
  const std::string who = toe_label(toe);
  vtkDataArray* array = integer_array(mesh.grid()->GetPointData(), toe.marker_array, "point", mesh, who);
  std::vector<long long> nodes;
  std::set<long long> values;
  for (vtkIdType i = 0; i < array->GetNumberOfTuples(); ++i) {
    const double v = array->GetComponent(i, 0);
    if (values.size() < 20) values.insert(std::llround(v));
    if (v == toe.marker_value) nodes.push_back(i);
  }
  if (nodes.empty()) {
    std::string found;
    for (long long v : values) found += (found.empty() ? "" : ", ") + std::to_string(v);
    throw Error(who + ": no node has value " + std::to_string(toe.marker_value) + " in point array '" +
                toe.marker_array + "' of " + mesh.source() + " (values found: " + found + ")");
  }
  return nodes;
}


std::vector<int> read_cell_region(const Mesh& mesh, const std::string& name) {
  if (name.empty()) return {};
  vtkDataArray* array = integer_array(mesh.grid()->GetCellData(), name, "cell", mesh, "model.region_array");
  std::vector<int> region(static_cast<std::size_t>(array->GetNumberOfTuples()));
  for (vtkIdType i = 0; i < array->GetNumberOfTuples(); ++i)
    region[static_cast<std::size_t>(i)] = static_cast<int>(std::lround(array->GetComponent(i, 0)));
  return region;
}

ReadoutScheme toe_scheme(const ToePlan& toe, double thickness_mm) {
  return toe.scheme == SchemeKind::user ? make_user_scheme(toe.user_distances, toe.type, toe.user_factor)
                                        : make_scheme(toe.scheme, toe.type, thickness_mm);
}

WeldSide toe_weld_side(const ModelGeometry& g, const ToePlan& toe, const std::string& region_array) {
  return weld_side(g, toe, region_array);
}

PlacedToe place_toe(const ModelGeometry& g, const ToePlan& toe, const std::string& region_array, Reporter& reporter) {
  PlacedToe placed;
  ToeResult& r = placed.result;
  r.plan = toe;
  r.scheme = toe_scheme(toe, toe.thickness);
  r.line = toe_line(g, toe);
  const WeldSide weld = weld_side(g, toe, region_array);
  const std::vector<char> on_weld = weld_points(g.mesh.grid(), weld);
  const std::vector<Station> stations = make_stations(g.surface, r.line, weld, toe.spacing, toe_label(toe));
  for (const Station& s : stations)
    placed.stations.push_back(place_station(g, s, r.scheme, weld, on_weld, toe.thickness));
  std::ostringstream os;
  os.precision(4);
  os << toe_label(toe) << ": " << stations.size() << " stations along " << r.line.length() << " mm"
     << (r.line.closed ? " (closed loop)" : "");
  reporter.info(os.str());
  return placed;
}

}  // namespace toehold::detail
