#include "toehold/toe/surface_walk.hpp"

#include "facet_geometry.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <sstream>

namespace toehold {
namespace {

constexpr double kPi = 3.14159265358979323846;

struct Exit {
  double s = std::numeric_limits<double>::infinity();  // mm along the direction to the edge
  long long a = -1, b = -1;                             // the edge's mesh points
  long long vertex = -1;                                // the mesh point when the path leaves through a corner
};

// The edge of `facet` through which the ray x + s d (d in the facet's plane) leaves it.
Exit find_exit(const Surface& surface, int facet, const Vec3& x, const Vec3& d) {
  const Facet& f = surface.facets()[static_cast<std::size_t>(facet)];
  const int n = f.corner_count();
  const double size = detail::facet_size(surface, facet);
  const double eps = 1e-9 * size;
  Exit best;
  for (int i = 0; i < n; ++i) {
    const long long ia = f.points[static_cast<std::size_t>(i)], ib = f.points[static_cast<std::size_t>((i + 1) % n)];
    const Vec3 a = surface.point(ia), e = surface.point(ib) - a;
    const double denom = d.cross(e).dot(f.normal);
    if (std::abs(denom) < 1e-14 * e.norm()) continue;  // parallel to the edge
    const double s = (a - x).cross(e).dot(f.normal) / denom;
    const double u = (a - x).cross(d).dot(f.normal) / denom;
    if (s > eps && s < 2.0 * size && u >= -1e-9 && u <= 1.0 + 1e-9 && s < best.s)
      best = {s, ia, ib, u < 1e-7 ? ia : (u > 1.0 - 1e-7 ? ib : -1)};
  }
  return best;
}

// The facet around mesh point `vertex` (other than `from`) that the direction d enters: of those holding a point
// a little way along d (projected onto each candidate's plane), the one turning least from `from`; failing that,
// the closest to holding it (so that a plate edge met at a corner is still seen as a kink). -1 when the point
// has no other facet. `holds` tells whether the facet returned holds the point.
int facet_past_vertex(const Surface& surface, int from, long long vertex, const Vec3& d, bool& holds) {
  const Vec3 v = surface.point(vertex);
  const Vec3& n_from = surface.facets()[static_cast<std::size_t>(from)].normal;
  int best = -1;
  double best_score = std::numeric_limits<double>::infinity();
  for (int f : surface.facets_of_point(vertex)) {
    if (f == from) continue;
    const Vec3& n = surface.facets()[static_cast<std::size_t>(f)].normal;
    const Vec3 along = d - n * n.dot(d);
    if (along.squaredNorm() < 1e-12) continue;
    const double step = 1e-4 * detail::facet_size(surface, f);
    const Vec3 probe = v + step * along.normalized();
    const double gap = (detail::closest_on_facet(surface, f, probe) - probe).norm() / step;
    const double score = gap < 1e-3 ? -n.dot(n_from) : 1.0 + gap;
    if (score < best_score) best = f, best_score = score;
  }
  holds = best_score < 1.0;
  return best;
}

// The direction d (leaving a facet across edge a-b) continued into facet `to`: same angle to the edge.
Vec3 unfold(const Surface& surface, int to, long long a, long long b, const Vec3& d) {
  const Vec3 pa = surface.point(a), pb = surface.point(b);
  const Vec3 e = (pb - pa).normalized();
  const Vec3& n_to = surface.facets()[static_cast<std::size_t>(to)].normal;
  Vec3 across = n_to.cross(e);
  if (across.dot(detail::facet_centroid(surface, to) - 0.5 * (pa + pb)) < 0) across = -across;
  const double along = std::clamp(d.dot(e), -1.0, 1.0);
  return (along * e + std::sqrt(1.0 - along * along) * across).normalized();
}

double angle_deg(const Vec3& u, const Vec3& v) {
  return std::acos(std::clamp(u.normalized().dot(v.normalized()), -1.0, 1.0)) * 180.0 / kPi;
}

std::string at_distance(const char* what, double s) {
  std::ostringstream os;
  os.precision(4);
  os << what << " " << s << " mm from the toe";
  return os.str();
}

struct Crossing {
  int facet = -1;          // the facet the walk goes on in
  Vec3 direction;          // the direction there
  std::string stop;        // why the walk ends here ("" when it goes on)
  std::string detail;      // appended to the stop message
};

std::string turning(double kink) {
  std::ostringstream os;
  os.precision(3);
  os << " (the surface turns by " << kink << " degrees)";
  return os.str();
}

// Largest angle between the normal of `from` and a facet around mesh point p, degrees.
double largest_kink(const Surface& surface, int from, long long p) {
  double kink = 0.0;
  for (int f : surface.facets_of_point(p))
    kink = std::max(kink, angle_deg(surface.facets()[static_cast<std::size_t>(from)].normal,
                                    surface.facets()[static_cast<std::size_t>(f)].normal));
  return kink;
}

// Where the walk goes on after leaving `facet` through `exit` in direction d. A path running along a plate edge
// that round-off tips over the edge slides along it instead (it meets the edge at under 0.5 degrees).
Crossing cross(const Surface& surface, const WeldSide& weld, const WalkOptions& options, int facet, const Exit& exit,
               const Vec3& d) {
  Crossing c;
  bool holds = true;
  c.facet = exit.vertex >= 0 ? facet_past_vertex(surface, facet, exit.vertex, d, holds)
                             : surface.neighbour(facet, exit.a, exit.b);
  if (c.facet >= 0 && !holds) {
    const double kink = largest_kink(surface, facet, exit.vertex);
    if (kink > options.kink_limit_deg) c.stop = "the read-out path reaches a plate edge", c.detail = turning(kink);
    else c.stop = "the read-out path reaches an open edge of the model surface";
    return c;
  }
  if (c.facet < 0) {
    c.stop = "the read-out path reaches an open edge of the model surface";
    return c;
  }
  const Facet& g = surface.facets()[static_cast<std::size_t>(c.facet)];
  if (weld.is_weld_cell(g.owner)) {
    c.stop = "the read-out path runs into the weld";
    return c;
  }
  const double kink = angle_deg(surface.facets()[static_cast<std::size_t>(facet)].normal, g.normal);
  if (kink > options.kink_limit_deg) {
    const Vec3 e = (surface.point(exit.b) - surface.point(exit.a)).normalized();
    if (exit.vertex < 0 && std::abs(d.dot(e)) > std::cos(0.5 * kPi / 180.0)) {
      c.facet = facet;
      c.direction = d.dot(e) > 0 ? e : Vec3(-e);
      return c;
    }
    c.stop = "the read-out path reaches a plate edge";
    c.detail = turning(kink);
    return c;
  }
  c.direction = exit.vertex >= 0 ? Vec3((d - g.normal * g.normal.dot(d)).normalized())
                                 : unfold(surface, c.facet, exit.a, exit.b, d);
  return c;
}

}  // namespace

Walk walk_surface(const Surface& surface, const WeldSide& weld, int facet, const Vec3& start, const Vec3& direction,
                  const std::vector<double>& distances, const WalkOptions& options) {
  Walk walk;
  walk.path.push_back(start);
  Vec3 x = start;
  const Vec3& n0 = surface.facets()[static_cast<std::size_t>(facet)].normal;
  Vec3 d = (direction - n0 * n0.dot(direction)).normalized();
  double travelled = 0.0;
  std::size_t next = 0;
  const std::size_t max_steps = 100000;
  for (std::size_t step = 0; step < max_steps && next < distances.size(); ++step) {
    const Exit exit = find_exit(surface, facet, x, d);
    while (next < distances.size() && distances[next] <= travelled + exit.s) {
      const double along = distances[next] - travelled;
      walk.targets.push_back({x + along * d, facet, distances[next]});
      ++next;
    }
    if (next == distances.size()) break;
    if (!std::isfinite(exit.s)) {
      walk.stop_reason = at_distance("the read-out path is lost in a degenerate facet", travelled);
      break;
    }
    x += exit.s * d;
    travelled += exit.s;
    walk.path.push_back(x);
    const Crossing c = cross(surface, weld, options, facet, exit, d);
    if (!c.stop.empty()) {
      walk.stop_reason = at_distance(c.stop.c_str(), travelled) + c.detail;
      break;
    }
    facet = c.facet;
    d = c.direction;
  }
  if (next < distances.size() && walk.stop_reason.empty())
    walk.stop_reason = at_distance("the read-out path crosses too many facets", travelled);
  walk.reached = next == distances.size() && !distances.empty() ? distances.back() : travelled;
  if (!walk.targets.empty() && walk.stop_reason.empty()) walk.path.push_back(walk.targets.back().x);
  return walk;
}

}  // namespace toehold
