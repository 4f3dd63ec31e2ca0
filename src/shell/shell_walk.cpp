#include "toehold/shell/shell_walk.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <sstream>

namespace toehold {
namespace {

constexpr double kPi = 3.14159265358979323846;

struct Exit {
  double s = std::numeric_limits<double>::infinity(); // mm along the direction
                                                      // to the edge
  long long a = -1, b = -1;                           // the edge's points
  long long vertex = -1; // the point when the path leaves through a corner
};

// The edge of facet f through which the ray x + s d (d in the facet's plane)
// leaves it.
Exit find_exit(const ShellSurface &surface, int f, const Vec3 &x,
               const Vec3 &d) {
  const ShellFacet &facet = surface.facet(f);
  const int n = facet.corner_count();
  const double size = surface.size(f);
  Exit best;
  for (int i = 0; i < n; ++i) {
    const long long ia = facet.points[static_cast<std::size_t>(i)];
    const long long ib = facet.points[static_cast<std::size_t>((i + 1) % n)];
    const Vec3 a = surface.point(ia), e = surface.point(ib) - a;
    const double denom = d.cross(e).dot(facet.normal);
    if (std::abs(denom) < 1e-14 * e.norm())
      continue; // parallel to the edge
    const double s = (a - x).cross(e).dot(facet.normal) / denom;
    const double u = (a - x).cross(d).dot(facet.normal) / denom;
    if (s > 1e-9 * size && s < 2.0 * size && u >= -1e-9 && u <= 1.0 + 1e-9 &&
        s < best.s)
      best = {s, ia, ib, u < 1e-7 ? ia : (u > 1.0 - 1e-7 ? ib : -1)};
  }
  return best;
}

// Angle between the planes of two facets, degrees, ignoring the sense of their
// normals.
double fold_deg(const ShellSurface &surface, int f, int g) {
  const double c =
      std::abs(surface.facet(f).normal.dot(surface.facet(g).normal));
  return std::acos(std::clamp(c, 0.0, 1.0)) * 180.0 / kPi;
}

// The direction d (leaving across edge a-b) continued into facet `to`, at the
// same angle to the edge.
Vec3 unfold(const ShellSurface &surface, int to, long long a, long long b,
            const Vec3 &d) {
  const Vec3 pa = surface.point(a), pb = surface.point(b);
  const Vec3 e = (pb - pa).normalized();
  Vec3 across = surface.facet(to).normal.cross(e);
  if (across.dot(surface.centroid(to) - 0.5 * (pa + pb)) < 0)
    across = -across;
  const double along = std::clamp(d.dot(e), -1.0, 1.0);
  return (along * e + std::sqrt(1.0 - along * along) * across).normalized();
}

// The plate facet around `vertex` (not `from`) that holds a point a little way
// along d, turning least.
int facet_past_vertex(const ShellSurface &surface, const FacetFilter &plate,
                      int from, long long vertex, const Vec3 &d,
                      double limit_deg) {
  const Vec3 v = surface.point(vertex);
  int best = -1;
  double best_fold = std::numeric_limits<double>::infinity();
  for (int f : surface.facets_of_point(vertex)) {
    if (f == from || !plate(f))
      continue;
    const Vec3 &n = surface.facet(f).normal;
    const Vec3 along = d - n * n.dot(d);
    if (along.squaredNorm() < 1e-12)
      continue;
    const double step = 1e-4 * surface.size(f);
    const Vec3 probe = v + step * along.normalized();
    if ((surface.closest_on_facet(f, probe) - probe).norm() > 1e-3 * step)
      continue;
    const double fold = fold_deg(surface, from, f);
    if (fold <= limit_deg && fold < best_fold)
      best = f, best_fold = fold;
  }
  return best;
}

// The plate facet the walk starts on: of `facet` and the plate facets touching
// the start point (a toe node or edge point is shared by several), the one that
// holds a point a little way along d, within the kink limit.
int start_facet(const ShellSurface &surface, const FacetFilter &plate,
                int facet, const Vec3 &start, const Vec3 &d, double limit_deg) {
  const double step = 1e-4 * surface.size(facet);
  int best = facet;
  double best_gap = std::numeric_limits<double>::infinity();
  std::vector<int> candidates{facet};
  const ShellFacet &f = surface.facet(facet);
  for (int k = 0; k < f.corner_count(); ++k)
    for (int g : surface.facets_of_point(f.points[static_cast<std::size_t>(k)]))
      candidates.push_back(g);
  for (int g : candidates) {
    if (!plate(g) || fold_deg(surface, facet, g) > limit_deg)
      continue;
    if ((surface.closest_on_facet(g, start) - start).norm() >
        1e-9 * surface.size(g))
      continue;
    const Vec3 &n = surface.facet(g).normal;
    const Vec3 probe = start + step * (d - n * n.dot(d)).normalized();
    const double gap = (surface.closest_on_facet(g, probe) - probe).norm();
    if (gap < best_gap - 1e-12 * step)
      best = g, best_gap = gap;
  }
  return best;
}

std::string at_distance(const std::string &what, double s) {
  std::ostringstream os;
  os.precision(4);
  os << what << " " << s << " mm from the start";
  return os.str();
}

struct Crossing {
  int facet = -1;
  Vec3 direction = Vec3::Zero();
  std::string stop; // why the walk ends ("" when it goes on)
};

// Where the walk goes on after leaving `facet` through `exit` in direction d.
Crossing cross(const ShellSurface &surface, const FacetFilter &plate,
               const ShellWalkOptions &options, int facet, const Exit &exit,
               const Vec3 &d) {
  Crossing c;
  if (exit.vertex >= 0) {
    if (surface.on_junction(exit.vertex))
      return {-1, d, "the read-out path reaches a plate junction"};
    c.facet = facet_past_vertex(surface, plate, facet, exit.vertex, d,
                                options.kink_limit_deg);
    if (c.facet < 0) {
      bool open = false;
      for (long long q : surface.edge_neighbours(exit.vertex))
        open = open || surface.facets_on_edge(exit.vertex, q).size() == 1;
      return {
          -1, d,
          open ? "the read-out path reaches an open edge of the plate"
               : "the read-out path reaches a fold or the edge of the plate"};
    }
    const Vec3 &n = surface.facet(c.facet).normal;
    c.direction = (d - n * n.dot(d)).normalized();
    return c;
  }
  const std::vector<int> &across = surface.facets_on_edge(exit.a, exit.b);
  if (across.size() > 2)
    return {-1, d, "the read-out path reaches a plate junction"};
  if (across.size() < 2)
    return {-1, d, "the read-out path reaches an open edge of the plate"};
  c.facet = across[0] == facet ? across[1] : across[0];
  if (!plate(c.facet))
    return {-1, d, "the read-out path leaves the plate"};
  if (fold_deg(surface, facet, c.facet) > options.kink_limit_deg)
    return {-1, d, "the read-out path reaches a fold of the plate"};
  c.direction = unfold(surface, c.facet, exit.a, exit.b, d);
  return c;
}

} // namespace

ShellWalk walk_shell(const ShellSurface &surface, const FacetFilter &plate,
                     int facet, const Vec3 &start, const Vec3 &direction,
                     const std::vector<double> &distances,
                     const ShellWalkOptions &options) {
  ShellWalk walk;
  walk.path.push_back(start);
  walk.facets.push_back(facet);
  Vec3 x = start;
  facet = start_facet(surface, plate, facet, start, direction,
                      options.kink_limit_deg);
  walk.facets.front() = facet;
  const Vec3 &n0 = surface.facet(facet).normal;
  Vec3 d = (direction - n0 * n0.dot(direction)).normalized();
  double travelled = 0.0;
  std::size_t next = 0;
  for (std::size_t step = 0; step < 100000 && next < distances.size(); ++step) {
    const Exit exit = find_exit(surface, facet, x, d);
    while (std::isfinite(exit.s) && next < distances.size() &&
           distances[next] <= travelled + exit.s) {
      walk.targets.push_back(
          {x + (distances[next] - travelled) * d, facet, distances[next]});
      ++next;
    }
    if (next == distances.size())
      break;
    if (!std::isfinite(exit.s)) {
      walk.stop_reason = at_distance(
          "the read-out path is lost in a degenerate facet", travelled);
      break;
    }
    x += exit.s * d;
    travelled += exit.s;
    walk.path.push_back(x);
    const Crossing c = cross(surface, plate, options, facet, exit, d);
    if (!c.stop.empty()) {
      walk.stop_reason = at_distance(c.stop, travelled);
      break;
    }
    facet = c.facet;
    d = c.direction;
    walk.facets.push_back(facet);
  }
  if (next < distances.size() && walk.stop_reason.empty())
    walk.stop_reason =
        at_distance("the read-out path crosses too many facets", travelled);
  walk.reached = next == distances.size() && !distances.empty()
                     ? distances.back()
                     : travelled;
  if (!walk.targets.empty() && walk.stop_reason.empty())
    walk.path.push_back(walk.targets.back().x);
  return walk;
}

} // namespace toehold
