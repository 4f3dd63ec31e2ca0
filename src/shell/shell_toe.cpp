// Toe lines on plate intersections, the plate that carries each toe segment,
// the weld side and the stations.
#include "toehold/shell/shell_toe.hpp"

#include "shell_toe_detail.hpp"
#include "toehold/common/error.hpp"

#include <vtkCellData.h>
#include <vtkDataArray.h>
#include <vtkPointData.h>

#include <algorithm>
#include <cmath>
#include <limits>
#include <map>
#include <set>

namespace toehold {
namespace detail {

bool intersection_edge(const ShellSurface &surface, long long a, long long b,
                       double kink_limit_deg) {
  const std::vector<int> &on = surface.facets_on_edge(a, b);
  if (on.size() > 2)
    return true;
  if (on.size() < 2)
    return false;
  const double c =
      std::abs(surface.facet(on[0]).normal.dot(surface.facet(on[1]).normal));
  return c < std::cos(kink_limit_deg * 3.14159265358979323846 / 180.0);
}

Vec3 inward(const ShellSurface &surface, int f, long long a, long long b) {
  const Vec3 pa = surface.point(a), e = (surface.point(b) - pa).normalized();
  Vec3 in = surface.facet(f).normal.cross(e);
  if (in.dot(surface.centroid(f) - pa) < 0)
    in = -in;
  return in.normalized();
}

vtkDataArray *region_array(const ShellSurface &surface,
                           const ShellToeSpec &spec) {
  if (spec.region_array.empty())
    return nullptr;
  vtkDataArray *a = surface.shells().grid()->GetCellData()->GetArray(
      spec.region_array.c_str());
  if (!a || a->GetNumberOfComponents() != 1)
    throw Error(spec.name + ": the shell model '" + surface.shells().source() +
                "' has no one-component cell array '" + spec.region_array +
                "'; name the cell array that marks the plates");
  return a;
}

FacetFilter plate_filter(const ShellSurface &surface,
                         const ShellToeSpec &spec) {
  vtkDataArray *region = region_array(surface, spec);
  if (!region)
    return [](int) { return true; };
  const int value = spec.plate_value;
  return [&surface, region, value](int f) {
    return std::lround(region->GetTuple1(
               static_cast<vtkIdType>(surface.facet(f).cell))) == value;
  };
}

} // namespace detail

namespace {

using detail::intersection_edge;
using detail::inward;

std::vector<long long> marker_nodes(const ShellSurface &surface,
                                    const ShellToeSpec &spec) {
  vtkDataArray *a = surface.shells().grid()->GetPointData()->GetArray(
      spec.marker_array.c_str());
  if (!a || a->GetNumberOfComponents() != 1)
    throw Error(spec.name + ": the shell model '" + surface.shells().source() +
                "' has no one-component point array '" + spec.marker_array +
                "'; name the point array that marks the toe nodes");
  std::vector<long long> nodes;
  for (vtkIdType p = 0; p < a->GetNumberOfTuples(); ++p) {
    if (std::lround(a->GetTuple1(p)) != spec.marker_value)
      continue;
    if (surface.facets_of_point(p).empty())
      throw Error(spec.name + ": node " + std::to_string(p) + " marked in '" +
                  spec.marker_array +
                  "' belongs to no shell cell; mark nodes of the plate "
                  "intersection line only");
    nodes.push_back(p);
  }
  return nodes;
}

double distance_to_polyline(const std::vector<Vec3> &line, const Vec3 &x) {
  double best = line.size() == 1 ? (x - line[0]).norm()
                                 : std::numeric_limits<double>::infinity();
  for (std::size_t i = 0; i + 1 < line.size(); ++i) {
    const Vec3 e = line[i + 1] - line[i];
    const double u =
        e.squaredNorm() > 0
            ? std::clamp((x - line[i]).dot(e) / e.squaredNorm(), 0.0, 1.0)
            : 0.0;
    best = std::min(best, (x - line[i] - u * e).norm());
  }
  return best;
}

std::vector<long long> coordinate_nodes(const ShellSurface &surface,
                                        const ShellToeSpec &spec) {
  if (spec.points.size() < 2)
    throw Error(spec.name + ": give a node-marker array or at least two points "
                            "along the plate intersection line");
  std::vector<long long> nodes;
  const auto count =
      static_cast<long long>(surface.shells().grid()->GetNumberOfPoints());
  for (long long p = 0; p < count; ++p) {
    if (surface.facets_of_point(p).empty())
      continue;
    if (distance_to_polyline(spec.points, surface.point(p)) > spec.tolerance_mm)
      continue;
    for (long long q : surface.edge_neighbours(p))
      if (intersection_edge(surface, p, q, spec.kink_limit_deg)) {
        nodes.push_back(p);
        break;
      }
  }
  return nodes;
}

// Toe nodes joined along intersection edges.
std::map<long long, std::vector<long long>>
toe_graph(const ShellSurface &surface, const std::vector<long long> &nodes,
          const ShellToeSpec &spec) {
  const std::set<long long> in(nodes.begin(), nodes.end());
  std::map<long long, std::vector<long long>> graph;
  for (long long p : nodes) {
    auto &next = graph[p];
    for (long long q : surface.edge_neighbours(p))
      if (in.count(q) && intersection_edge(surface, p, q, spec.kink_limit_deg))
        next.push_back(q);
    if (next.empty())
      throw Error(spec.name + ": toe node " + std::to_string(p) +
                  " is not joined to the other toe nodes along a plate "
                  "intersection line (where three or more shell facets meet, "
                  "or the plate folds); a shell toe must "
                  "follow the intersection of the plates");
    if (next.size() > 2)
      throw Error(spec.name + ": the toe branches at node " +
                  std::to_string(p) + "; give one line per toe");
  }
  return graph;
}

long long first_node(const std::map<long long, std::vector<long long>> &graph,
                     const ShellToeSpec &spec, const ShellSurface &surface) {
  long long best = graph.begin()->first;
  double best_gap = std::numeric_limits<double>::infinity();
  for (const auto &[p, next] : graph) {
    if (next.size() != 1)
      continue;
    const double gap = spec.points.empty()
                           ? static_cast<double>(p)
                           : (surface.point(p) - spec.points.front()).norm();
    if (gap < best_gap)
      best = p, best_gap = gap;
  }
  return best;
}

ToeLine chain(const ShellSurface &surface, const std::vector<long long> &nodes,
              const ShellToeSpec &spec) {
  if (nodes.size() < 2)
    throw Error(spec.name + ": found " + std::to_string(nodes.size()) +
                " toe node" + (nodes.size() == 1 ? "" : "s") +
                " on a plate intersection line; a toe needs at least two "
                "(check the marker array or the coordinates "
                "and their tolerance)");
  const auto graph = toe_graph(surface, nodes, spec);
  ToeLine line;
  long long previous = -1, p = first_node(graph, spec, surface);
  line.closed = graph.at(p).size() == 2;
  while (p >= 0 && line.nodes.size() < nodes.size()) {
    line.nodes.push_back(p);
    line.points.push_back(surface.point(p));
    const auto &next = graph.at(p);
    long long q = -1;
    for (long long n : next)
      if (n != previous && std::find(line.nodes.begin(), line.nodes.end(), n) ==
                               line.nodes.end())
        q = n;
    previous = p, p = q;
  }
  if (line.nodes.size() != nodes.size())
    throw Error(spec.name +
                ": the toe nodes form more than one separate line (" +
                std::to_string(line.nodes.size()) + " of " +
                std::to_string(nodes.size()) +
                " nodes chained); give one line per toe");
  return line;
}

// The plate facet carrying the toe along segment (a, b), and what stands on the
// plate there.
struct SegmentPlate {
  int facet = -1;
  std::vector<int> attached_top,
      attached_bottom; // facets of attached plates on the +normal / -normal
                       // side
};

std::string segment_name(const ShellToeSpec &spec, long long a, long long b) {
  return spec.name + " between nodes " + std::to_string(a) + " and " +
         std::to_string(b);
}

int carrying_facet(const ShellSurface &surface, const ShellToeSpec &spec,
                   const FacetFilter &plate, long long a, long long b) {
  std::vector<int> candidates;
  for (int f : surface.facets_on_edge(a, b))
    if (plate(f))
      candidates.push_back(f);
  if (candidates.empty())
    throw Error(segment_name(spec, a, b) + ": no cell of region " +
                std::to_string(spec.plate_value) + " in '" + spec.region_array +
                "' touches the toe; check the plate's region value");
  if (!spec.plate_point) {
    if (spec.region_array.empty())
      throw Error(spec.name + ": say which plate carries the toe: a region "
                              "array value or a point on the plate");
    if (candidates.size() > 1)
      throw Error(segment_name(spec, a, b) + ": the plate of region " +
                  std::to_string(spec.plate_value) +
                  " lies on both sides of the intersection line; give a point "
                  "on the plate on the read-out side");
    return candidates.front();
  }
  const Vec3 mid = 0.5 * (surface.point(a) + surface.point(b));
  int best = -1;
  double best_score = -2.0;
  for (int f : candidates) {
    const double score =
        inward(surface, f, a, b).dot((*spec.plate_point - mid).normalized());
    if (score > best_score)
      best = f, best_score = score;
  }
  return best;
}

SegmentPlate segment_plate(const ShellSurface &surface,
                           const ShellToeSpec &spec, const FacetFilter &plate,
                           long long a, long long b) {
  SegmentPlate out;
  out.facet = carrying_facet(surface, spec, plate, a, b);
  const Vec3 n = surface.facet(out.facet).normal,
             in = inward(surface, out.facet, a, b);
  const double cos_limit =
      std::cos(spec.kink_limit_deg * 3.14159265358979323846 / 180.0);
  for (int f : surface.facets_on_edge(a, b)) {
    if (f == out.facet)
      continue;
    const Vec3 w = inward(surface, f, a, b);
    if (w.dot(-in) > cos_limit)
      continue; // the plate itself, on the other side of the line
    (w.dot(n) > 0 ? out.attached_top : out.attached_bottom).push_back(f);
  }
  return out;
}

// The layer of a station and the attached plates on its side; `problem` when it
// cannot be told.
ShellLayer station_layer(const ShellToeSpec &spec, const SegmentPlate &seg,
                         std::string &problem) {
  if (spec.layer == LayerChoice::top)
    return ShellLayer::top;
  if (spec.layer == LayerChoice::bottom)
    return ShellLayer::bottom;
  const bool top = !seg.attached_top.empty(),
             bottom = !seg.attached_bottom.empty();
  if (top != bottom)
    return top ? ShellLayer::top : ShellLayer::bottom;
  problem = std::string("cannot tell the layer from the weld side (") +
            (top ? "attached plates stand on both sides of the plate"
                 : "no attached plate stands on the plate here") +
            "); say top or bottom in the plan";
  return ShellLayer::top;
}

double station_offset(const ShellSurface &surface, const ShellToeSpec &spec,
                      const SegmentPlate &seg, ShellLayer layer,
                      std::string &problem) {
  if (spec.origin == ToeOrigin::intersection)
    return 0.0;
  const std::vector<int> &side =
      layer == ShellLayer::top ? seg.attached_top : seg.attached_bottom;
  if (side.empty()) {
    problem = "no attached plate stands on the " + to_string(layer) +
              " side to take the weld toe position from";
    return 0.0;
  }
  // Weld toe of a fillet weld on a plate perpendicular to the carrying plate:
  // half the attached plate's thickness plus the leg from the attached plate's
  // mid-plane, i.e. from the intersection line [D].
  return 0.5 * surface.shells().thickness(surface.facet(side.front()).cell) +
         spec.weld_leg_mm;
}

ShellStation make_station(const ShellSurface &surface, const ShellToeSpec &spec,
                          const SegmentPlate &seg, long long a, long long b,
                          const Vec3 &x, const Vec3 &tangent) {
  ShellStation st;
  st.x = x;
  st.facet = seg.facet;
  st.layer = station_layer(spec, seg, st.problem);
  st.offset = station_offset(surface, spec, seg, st.layer, st.problem);
  st.thickness = surface.shells().thickness(surface.facet(seg.facet).cell);
  const Vec3 n = surface.facet(seg.facet).normal;
  try {
    st.frame =
        make_toe_frame(tangent, st.layer == ShellLayer::top ? n : Vec3(-n),
                       inward(surface, seg.facet, a, b), spec.name);
  } catch (const Error &e) {
    if (st.problem.empty())
      st.problem = e.what();
  }
  st.hot_spot =
      x + st.offset * st.frame.readout + 0.5 * st.thickness * st.frame.normal;
  return st;
}

void check_spec(const ShellToeSpec &spec) {
  if (spec.origin == ToeOrigin::weld_toe &&
      !(spec.weld_leg_mm > 0.0 && std::isfinite(spec.weld_leg_mm)))
    throw Error(spec.name + ": the read-out measured from the weld toe needs "
                            "the weld leg (a positive number of mm)");
}

std::vector<ShellStation> node_stations(const ShellSurface &surface,
                                        const ShellToeSpec &spec,
                                        const ToeLine &line,
                                        const std::vector<SegmentPlate> &segs) {
  std::vector<ShellStation> out;
  const std::size_t n = line.points.size();
  double arc = 0.0;
  for (std::size_t i = 0; i < n; ++i) {
    if (i > 0)
      arc += (line.points[i] - line.points[i - 1]).norm();
    const std::size_t k =
        i + 1 < n
            ? i
            : (line.closed ? i : i - 1); // segment k runs from node k to k + 1
    const std::size_t prev = i > 0 ? i - 1 : (line.closed ? n - 1 : 0),
                      next = i + 1 < n ? i + 1 : (line.closed ? 0 : i);
    ShellStation st = make_station(surface, spec, segs[k], line.nodes[k],
                                   line.nodes[(k + 1) % n], line.points[i],
                                   line.points[next] - line.points[prev]);
    st.node = line.nodes[i];
    st.arc = arc;
    out.push_back(std::move(st));
  }
  return out;
}

std::vector<ShellStation>
spaced_stations(const ShellSurface &surface, const ShellToeSpec &spec,
                const ToeLine &line, const std::vector<SegmentPlate> &segs) {
  std::vector<ShellStation> out;
  const std::size_t n = line.points.size(), segments = segs.size();
  const double length = line.length();
  const auto count =
      static_cast<std::size_t>(std::floor(length / spec.spacing_mm + 1e-9));
  double start = 0.0;
  std::size_t k = 0;
  for (std::size_t j = 0; j <= count; ++j) {
    const double s = std::min(static_cast<double>(j) * spec.spacing_mm, length);
    if (line.closed && j > 0 && s >= length - 1e-9)
      break;
    while (k + 1 < segments &&
           start + (line.points[(k + 1) % n] - line.points[k]).norm() < s)
      start += (line.points[(k + 1) % n] - line.points[k]).norm(), ++k;
    const Vec3 e = line.points[(k + 1) % n] - line.points[k];
    const Vec3 x =
        line.points[k] + std::clamp((s - start) / e.norm(), 0.0, 1.0) * e;
    ShellStation st = make_station(surface, spec, segs[k], line.nodes[k],
                                   line.nodes[(k + 1) % n], x, e);
    st.arc = s;
    out.push_back(std::move(st));
  }
  const bool end_missing =
      !line.closed && (out.empty() || out.back().arc < length - 1e-9);
  if (end_missing) {
    const std::size_t last = segments - 1;
    ShellStation st = make_station(surface, spec, segs[last], line.nodes[last],
                                   line.nodes[last + 1], line.points.back(),
                                   line.points.back() - line.points[last]);
    st.arc = length;
    st.node = line.nodes.back();
    out.push_back(std::move(st));
  }
  return out;
}

} // namespace

ShellToe trace_shell_toe(const ShellSurface &surface,
                         const ShellToeSpec &spec) {
  check_spec(spec);
  const std::vector<long long> nodes = spec.marker_array.empty()
                                           ? coordinate_nodes(surface, spec)
                                           : marker_nodes(surface, spec);
  ShellToe toe;
  toe.name = spec.name;
  toe.line = chain(surface, nodes, spec);
  const FacetFilter plate = detail::plate_filter(surface, spec);
  const std::size_t n = toe.line.nodes.size(),
                    segments = toe.line.closed ? n : n - 1;
  std::vector<SegmentPlate> segs;
  for (std::size_t k = 0; k < segments; ++k)
    segs.push_back(segment_plate(surface, spec, plate, toe.line.nodes[k],
                                 toe.line.nodes[(k + 1) % n]));
  toe.stations = spec.spacing_mm > 0
                     ? spaced_stations(surface, spec, toe.line, segs)
                     : node_stations(surface, spec, toe.line, segs);
  for (std::size_t i = 0; i < toe.stations.size(); ++i) {
    ShellStation &st = toe.stations[i];
    st.id = static_cast<int>(i) + 1;
    if (!st.problem.empty())
      st.problem =
          spec.name + " station " + std::to_string(st.id) + ": " + st.problem;
  }
  return toe;
}

} // namespace toehold
