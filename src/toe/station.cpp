#include "toehold/toe/station.hpp"

#include "facet_geometry.hpp"

#include <algorithm>
#include <cmath>
#include <set>
#include <span>
#include <sstream>

namespace toehold {
namespace {

struct Place {
  Vec3 x;
  double arc;
  long long node;
  Vec3 tangent;
};

Vec3 segment_direction(const ToeLine& toe, std::size_t i) {
  const std::size_t n = toe.points.size();
  const std::size_t j = (i + 1) % n;
  return (toe.points[j] - toe.points[i]).normalized();
}

// Unit tangent at toe point i: mean of the adjacent segment directions.
Vec3 point_tangent(const ToeLine& toe, std::size_t i) {
  const std::size_t n = toe.points.size();
  const bool has_before = toe.closed || i > 0, has_after = toe.closed || i + 1 < n;
  Vec3 t = Vec3::Zero();
  if (has_before) t += segment_direction(toe, (i + n - 1) % n);
  if (has_after) t += segment_direction(toe, i);
  if (t.squaredNorm() < 1e-24) t = segment_direction(toe, i);
  return t.normalized();
}

std::vector<Place> places_at_points(const ToeLine& toe) {
  std::vector<Place> places;
  double arc = 0.0;
  for (std::size_t i = 0; i < toe.points.size(); ++i) {
    if (i > 0) arc += (toe.points[i] - toe.points[i - 1]).norm();
    places.push_back({toe.points[i], arc, toe.nodes.empty() ? -1 : toe.nodes[i], point_tangent(toe, i)});
  }
  return places;
}

std::vector<Place> places_by_spacing(const ToeLine& toe, double spacing) {
  const double length = toe.length();
  const std::size_t segments = toe.closed ? toe.points.size() : toe.points.size() - 1;
  int count = std::max(1, static_cast<int>(std::lround(length / spacing)));
  const double step = length / count;
  if (!toe.closed) ++count;
  std::vector<Place> places;
  std::size_t seg = 0;
  double seg_start = 0.0;
  for (int k = 0; k < count; ++k) {
    const double arc = std::min(k * step, length);
    auto seg_length = [&](std::size_t s) { return (toe.points[(s + 1) % toe.points.size()] - toe.points[s]).norm(); };
    while (seg + 1 < segments && arc > seg_start + seg_length(seg)) seg_start += seg_length(seg++);
    const double u = std::clamp((arc - seg_start) / std::max(seg_length(seg), 1e-300), 0.0, 1.0);
    const Vec3& a = toe.points[seg];
    const Vec3& b = toe.points[(seg + 1) % toe.points.size()];
    places.push_back({a + u * (b - a), arc, -1, segment_direction(toe, seg)});
  }
  return places;
}

// Facets that touch x: those of the nodes of the closest facet, within a small distance.
std::vector<int> facets_at(const Surface& surface, const Place& place) {
  if (place.node >= 0) {
    const std::span<const int> at_node = surface.facets_of_point(place.node);
    return {at_node.begin(), at_node.end()};
  }
  const SurfaceHit hit = surface.closest(place.x);
  std::set<int> ring;
  if (hit.facet < 0) return {};
  const Facet& f = surface.facets()[static_cast<std::size_t>(hit.facet)];
  for (int i = 0; i < f.corner_count(); ++i)
    for (int g : surface.facets_of_point(f.points[static_cast<std::size_t>(i)])) ring.insert(g);
  const double tol = 1e-6 * detail::facet_size(surface, hit.facet);
  std::vector<int> touching;
  for (int g : ring)
    if ((detail::closest_on_facet(surface, g, place.x) - place.x).norm() <= tol) touching.push_back(g);
  return touching;
}

Vec3 across(const Vec3& v, const Vec3& tangent) { return v - tangent * tangent.dot(v); }

// Plate facets on the side away from the weld; empty when the weld side cannot be told. A facet counts when its
// centroid lies within 60 degrees of straight away from the weld (seen along the toe) and its normal is not along
// the toe (that excludes the end faces of a plate the toe runs into). Of those, the ones whose normals lie within
// 30 degrees of the most directly opposed facet's normal form the plate surface.
std::vector<int> away_facets(const Surface& surface, const std::vector<int>& facets, const Place& place,
                             const WeldSide& weld) {
  Vec3 weld_dir = Vec3::Zero();
  std::vector<int> plate;
  for (int f : facets) {
    const Vec3 v = across(detail::facet_centroid(surface, f) - place.x, place.tangent);
    if (weld.is_weld_cell(surface.facets()[static_cast<std::size_t>(f)].owner))
      weld_dir += v.normalized();
    else
      plate.push_back(f);
  }
  if (weld_dir.squaredNorm() < 1e-12 && weld.point) weld_dir = across(*weld.point - place.x, place.tangent);
  if (weld_dir.squaredNorm() < 1e-24) return {};
  weld_dir.normalize();
  std::vector<std::pair<int, double>> candidates;
  for (int f : plate) {
    const Vec3& n = surface.facets()[static_cast<std::size_t>(f)].normal;
    const double c = across(detail::facet_centroid(surface, f) - place.x, place.tangent).normalized().dot(weld_dir);
    if (c < -0.5 && std::abs(n.dot(place.tangent)) < 0.7) candidates.push_back({f, c});
  }
  if (candidates.empty()) return {};
  const auto most = std::min_element(candidates.begin(), candidates.end(),
                                     [](const auto& a, const auto& b) { return a.second < b.second; });
  const Vec3 n0 = surface.facets()[static_cast<std::size_t>(most->first)].normal;
  std::vector<int> away;
  for (const auto& [f, c] : candidates)
    if (surface.facets()[static_cast<std::size_t>(f)].normal.dot(n0) > std::cos(30.0 * 3.14159265358979323846 / 180))
      away.push_back(f);
  return away;
}

// The away facet the read-out ray enters first: the one containing a point a little way along it.
int start_facet(const Surface& surface, const std::vector<int>& away, const Place& place, const Vec3& readout) {
  int best = away.front();
  double best_gap = 1e300;
  for (int f : away) {
    const Vec3 probe = place.x + 1e-3 * detail::facet_size(surface, f) * readout;
    const double gap = (detail::closest_on_facet(surface, f, probe) - probe).norm();
    if (gap < best_gap) best = f, best_gap = gap;
  }
  return best;
}

Station station_at(const Surface& surface, const Place& place, const WeldSide& weld, const std::string& what,
                   int id) {
  Station s;
  s.id = id;
  s.x = place.x;
  s.arc = place.arc;
  s.node = place.node;
  const std::vector<int> touching = facets_at(surface, place);
  const std::vector<int> away = away_facets(surface, touching, place, weld);
  if (away.empty()) {
    std::ostringstream os;
    os << what << ", station " << id << ": no plate surface found on the side away from the weld ("
       << touching.size() << " surface facets touch the station; weld side from "
       << (weld.description.empty() ? "nothing given" : weld.description) << ")";
    s.problem = os.str();
    return s;
  }
  Vec3 normal = Vec3::Zero(), side = Vec3::Zero();
  for (int f : away) {
    normal += detail::facet_area(surface, f) * surface.facets()[static_cast<std::size_t>(f)].normal;
    side += across(detail::facet_centroid(surface, f) - place.x, place.tangent).normalized();
  }
  normal.normalize();
  Vec3 tangent = (place.tangent - normal * normal.dot(place.tangent)).normalized();
  Vec3 readout = normal.cross(tangent).normalized();
  if (readout.dot(side) < 0) readout = -readout;
  s.frame = ToeFrame{tangent, normal, readout};
  s.facet = start_facet(surface, away, place, readout);
  return s;
}

}  // namespace

std::vector<Station> make_stations(const Surface& surface, const ToeLine& toe, const WeldSide& weld,
                                   double spacing_mm, const std::string& what) {
  const std::vector<Place> places = spacing_mm > 0 ? places_by_spacing(toe, spacing_mm) : places_at_points(toe);
  std::vector<Station> stations;
  stations.reserve(places.size());
  for (std::size_t i = 0; i < places.size(); ++i)
    stations.push_back(station_at(surface, places[i], weld, what, static_cast<int>(i) + 1));
  return stations;
}

}  // namespace toehold
