// Read-out points of shell toe stations: walk on the plate, locate in the host
// cell, check the normals, read.
#include "shell_toe_detail.hpp"
#include "toehold/common/error.hpp"
#include "toehold/shell/normal_check.hpp"
#include "toehold/shell/shell_cell.hpp"

#include <cmath>
#include <set>
#include <sstream>

namespace toehold {
namespace {

constexpr double kPi = 3.14159265358979323846;
constexpr double kOutsideSlack =
    1e-6; // parametric distance outside a cell still taken as inside

// The plate cell holding x (mm, on facet f's plane): f's own cell, else the
// neighbouring cell of the same plate (facet planes within the kink limit) that
// holds it best: least parametric overshoot, then least distance.
Host host_of(const ShellSurface &surface, const FacetFilter &plate, int f,
             const Vec3 &x, double cos_limit) {
  vtkUnstructuredGrid *grid = surface.shells().grid();
  double outside = 0.0;
  Host best = locate_in_shell_cell(grid, surface.facet(f).cell, x, &outside);
  if (outside <= kOutsideSlack)
    return best;
  const Vec3 &n0 = surface.facet(f).normal;
  std::set<long long> tried{best.cell};
  double best_outside = outside;
  const std::vector<long long> points = best.points;
  for (long long p : points)
    for (int g : surface.facets_of_point(p)) {
      const long long c = surface.facet(g).cell;
      if (!plate(g) || std::abs(surface.facet(g).normal.dot(n0)) < cos_limit ||
          !tried.insert(c).second)
        continue;
      Host h = locate_in_shell_cell(grid, c, x, &outside);
      const bool better = outside < best_outside - kOutsideSlack ||
                          (outside < best_outside + kOutsideSlack &&
                           h.distance < best.distance);
      if (better)
        best = std::move(h), best_outside = outside;
    }
  return best;
}

// Cells the station uses: plate cells at its toe node (or start facet), walked
// over, hosting read-out points.
std::vector<long long> used_cells(const ShellSurface &surface,
                                  const FacetFilter &plate,
                                  const ShellStation &st, const ShellWalk &walk,
                                  double cos_limit) {
  std::set<long long> cells{surface.facet(st.facet).cell};
  const Vec3 &n0 = surface.facet(st.facet).normal;
  if (st.node >= 0) // the plate's cells at the toe node, on both sides of the
                    // line (not the attached plate)
    for (int f : surface.facets_of_point(st.node))
      if (plate(f) && std::abs(surface.facet(f).normal.dot(n0)) >= cos_limit)
        cells.insert(surface.facet(f).cell);
  for (int f : walk.facets)
    cells.insert(surface.facet(f).cell);
  for (const ShellReadoutPoint &p : st.points)
    cells.insert(p.host.cell);
  return {cells.begin(), cells.end()};
}

std::string station_name(const ShellToeSpec &spec, const ShellStation &st) {
  return spec.name + " station " + std::to_string(st.id);
}

} // namespace

void place_shell_readout(const ShellSurface &surface, const ShellToeSpec &spec,
                         ShellStation &station,
                         const std::vector<double> &distances_mm) {
  station.points.clear();
  station.path.clear();
  if (!station.problem.empty() || station.facet < 0)
    return;
  const FacetFilter plate = detail::plate_filter(surface, spec);
  const double cos_limit = std::cos(spec.kink_limit_deg * kPi / 180.0);
  std::vector<double> along;
  for (double d : distances_mm)
    along.push_back(station.offset + d);
  const ShellWalk walk =
      walk_shell(surface, plate, station.facet, station.x,
                 station.frame.readout, along, {spec.kink_limit_deg});
  station.path = walk.path;
  station.facet = walk.facets.front();
  for (std::size_t i = 0; i < walk.targets.size(); ++i) {
    const ShellPathPoint &t = walk.targets[i];
    station.points.push_back(
        {distances_mm[i], t.distance, t.x,
         host_of(surface, plate, t.facet, t.x, cos_limit)});
  }
  if (!walk.stop_reason.empty()) {
    std::ostringstream os;
    os.precision(4);
    os << station_name(spec, station) << ": " << walk.stop_reason
       << ", before the read-out point at " << distances_mm[walk.targets.size()]
       << " mm from the hot-spot location";
    station.problem = os.str();
  }
  const std::vector<NormalFlip> flips = find_normal_flips(
      surface, used_cells(surface, plate, station, walk, cos_limit),
      spec.kink_limit_deg);
  if (flips.empty())
    return;
  const std::string flip_text =
      station_name(spec, station) + ": " + describe(flips) +
      ", so their top and bottom layers are swapped against each other; give "
      "the plate's "
      "shell cells one node-order sense (consistent normals)";
  station.problem =
      station.problem.empty() ? flip_text : station.problem + "; " + flip_text;
}

std::vector<Tensor> shell_readings(const ShellStation &station,
                                   const ShellLayerStress &layers) {
  std::vector<Tensor> out;
  const StressField &field = layers.layer(station.layer);
  for (const ShellReadoutPoint &p : station.points)
    out.push_back(interpolate(field, p.host));
  return out;
}

ToeOrigin parse_toe_origin(std::string_view text, const std::string &where) {
  if (text == "intersection")
    return ToeOrigin::intersection;
  if (text == "weld-toe" || text == "weld_toe")
    return ToeOrigin::weld_toe;
  throw Error(where + ": unknown read-out origin '" + std::string(text) +
              "'; use intersection or weld-toe");
}

std::string to_string(ToeOrigin origin) {
  return origin == ToeOrigin::intersection ? "intersection" : "weld-toe";
}

} // namespace toehold
