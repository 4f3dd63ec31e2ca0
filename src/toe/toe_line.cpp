#include "toehold/toe/toe_line.hpp"

#include "toehold/common/error.hpp"

#include <algorithm>
#include <map>
#include <set>
#include <sstream>
#include <unordered_map>
#include <unordered_set>

namespace toehold {
namespace {

using Graph = std::unordered_map<long long, std::vector<long long>>;

std::string where_is(const Surface& surface, long long node) {
  const Vec3 x = surface.point(node);
  std::ostringstream os;
  os << "node " << node << " at (" << x.x() << ", " << x.y() << ", " << x.z() << ") mm";
  return os.str();
}

Graph toe_edges(const Surface& surface, const std::vector<long long>& nodes, const std::string& what) {
  const std::unordered_set<long long> members(nodes.begin(), nodes.end());
  Graph graph;
  for (long long p : nodes) {
    if (!surface.on_surface(p))
      throw Error(what + ": " + where_is(surface, p) +
                  " is not on the model surface; mark only nodes on the plate surface along the weld toe");
    auto& adjacent = graph[p];
    for (long long q : surface.edge_neighbours(p))
      if (members.count(q)) adjacent.push_back(q);
  }
  return graph;
}

void remove_edge(Graph& graph, long long a, long long b) {
  auto drop = [&](long long from, long long to) {
    auto& v = graph[from];
    v.erase(std::remove(v.begin(), v.end(), to), v.end());
  };
  drop(a, b);
  drop(b, a);
}

// Where three toe nodes are mutually joined (a facet with all corners on the toe, as at a corner of a
// wrap-around weld), the longest of the three edges is a short cut across the corner: drop it.
void drop_short_cuts(const Surface& surface, Graph& graph) {
  std::vector<std::array<long long, 3>> triangles;
  for (const auto& [a, adjacent] : graph)
    for (long long b : adjacent)
      for (long long c : adjacent)
        if (a < b && b < c && std::count(graph[b].begin(), graph[b].end(), c)) triangles.push_back({a, b, c});
  for (const auto& t : triangles) {
    const std::array<std::pair<long long, long long>, 3> edges{{{t[0], t[1]}, {t[1], t[2]}, {t[0], t[2]}}};
    auto length = [&](const std::pair<long long, long long>& e) {
      return (surface.point(e.first) - surface.point(e.second)).norm();
    };
    const auto longest = *std::max_element(edges.begin(), edges.end(),
                                           [&](const auto& l, const auto& r) { return length(l) < length(r); });
    remove_edge(graph, longest.first, longest.second);
  }
}

void check_no_branch(const Surface& surface, const Graph& graph, const std::string& what) {
  for (const auto& [p, adjacent] : graph)
    if (adjacent.size() > 2)
      throw Error(what + ": the toe branches at " + where_is(surface, p) + " (" + std::to_string(adjacent.size()) +
                  " neighbouring toe nodes); give each branch its own marker value");
}

std::vector<long long> walk_chain(const Graph& graph, long long start) {
  std::vector<long long> chain{start};
  long long previous = -1, current = start;
  while (chain.size() <= graph.size()) {
    long long next = -1;
    for (long long q : graph.at(current))
      if (q != previous) next = q;
    if (next < 0 || next == start) break;
    chain.push_back(next);
    previous = current;
    current = next;
  }
  return chain;
}

}  // namespace

double ToeLine::length() const {
  double total = 0.0;
  for (std::size_t i = 1; i < points.size(); ++i) total += (points[i] - points[i - 1]).norm();
  if (closed && points.size() > 2) total += (points.front() - points.back()).norm();
  return total;
}

ToeLine chain_marker_nodes(const Surface& surface, const std::vector<long long>& marked, const std::string& what) {
  std::vector<long long> nodes;  // one id per position: element-nodal files repeat a node once per cell
  for (long long p : marked) nodes.push_back(surface.canonical(p));
  std::sort(nodes.begin(), nodes.end());
  nodes.erase(std::unique(nodes.begin(), nodes.end()), nodes.end());
  if (nodes.size() < 2)
    throw Error(what + ": " + std::to_string(nodes.size()) +
                " marked node(s); a toe needs at least two nodes along the weld toe");
  Graph graph = toe_edges(surface, nodes, what);
  drop_short_cuts(surface, graph);
  check_no_branch(surface, graph, what);
  long long start = nodes.front();
  int ends = 0;
  for (const auto& [p, adjacent] : graph) {
    if (adjacent.empty())
      throw Error(what + ": " + where_is(surface, p) +
                  " is not joined to any other toe node by a surface edge; mark consecutive nodes along the toe");
    if (adjacent.size() == 1 && (ends++ == 0 || p < start)) start = p;
  }
  if (ends == 0) start = *std::min_element(nodes.begin(), nodes.end());
  ToeLine line;
  line.nodes = walk_chain(graph, start);
  if (line.nodes.size() != graph.size())
    throw Error(what + ": the marked nodes form more than one separate line (" + std::to_string(line.nodes.size()) +
                " of " + std::to_string(graph.size()) + " nodes chained from " + where_is(surface, start) +
                "); give each line its own marker value");
  line.closed = ends == 0;
  for (long long p : line.nodes) line.points.push_back(surface.point(p));
  return line;
}

ToeLine snap_toe_points(const Surface& surface, const std::vector<Vec3>& points, bool closed, double tolerance,
                        const std::string& what) {
  if (points.size() < 2)
    throw Error(what + ": " + std::to_string(points.size()) + " point(s); a toe needs at least two points");
  ToeLine line;
  line.closed = closed;
  for (std::size_t i = 0; i < points.size(); ++i) {
    const SurfaceHit hit = surface.closest(points[i]);
    if (hit.facet < 0 || hit.distance > tolerance) {
      std::ostringstream os;
      os << what << ": point " << i + 1 << " (" << points[i].x() << ", " << points[i].y() << ", " << points[i].z()
         << ") mm is " << hit.distance << " mm from the model surface (allowed " << tolerance
         << " mm); check the coordinates and the model's length unit";
      throw Error(os.str());
    }
    line.points.push_back(hit.x);
    line.nodes.push_back(-1);
  }
  return line;
}

}  // namespace toehold
