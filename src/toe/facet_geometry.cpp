#include "facet_geometry.hpp"

#include <algorithm>
#include <limits>

namespace toehold::detail {

std::vector<Vec3> facet_corners(const Surface& surface, int facet) {
  const Facet& f = surface.facets()[static_cast<std::size_t>(facet)];
  std::vector<Vec3> corners;
  for (int i = 0; i < f.corner_count(); ++i) corners.push_back(surface.point(f.points[static_cast<std::size_t>(i)]));
  return corners;
}

Vec3 facet_centroid(const Surface& surface, int facet) {
  const auto corners = facet_corners(surface, facet);
  Vec3 sum = Vec3::Zero();
  for (const Vec3& c : corners) sum += c;
  return sum / static_cast<double>(corners.size());
}

double facet_area(const Surface& surface, int facet) {
  const auto c = facet_corners(surface, facet);
  double area = 0.5 * (c[1] - c[0]).cross(c[2] - c[0]).norm();
  if (c.size() == 4) area += 0.5 * (c[2] - c[0]).cross(c[3] - c[0]).norm();
  return area;
}

Vec3 closest_on_triangle(const Vec3& p, const Vec3& a, const Vec3& b, const Vec3& c) {
  const Vec3 ab = b - a, ac = c - a, ap = p - a;
  const double d1 = ab.dot(ap), d2 = ac.dot(ap);
  if (d1 <= 0 && d2 <= 0) return a;
  const Vec3 bp = p - b;
  const double d3 = ab.dot(bp), d4 = ac.dot(bp);
  if (d3 >= 0 && d4 <= d3) return b;
  const double vc = d1 * d4 - d3 * d2;
  if (vc <= 0 && d1 >= 0 && d3 <= 0) return a + ab * (d1 / (d1 - d3));
  const Vec3 cp = p - c;
  const double d5 = ab.dot(cp), d6 = ac.dot(cp);
  if (d6 >= 0 && d5 <= d6) return c;
  const double vb = d5 * d2 - d1 * d6;
  if (vb <= 0 && d2 >= 0 && d6 <= 0) return a + ac * (d2 / (d2 - d6));
  const double va = d3 * d6 - d5 * d4;
  if (va <= 0 && (d4 - d3) >= 0 && (d5 - d6) >= 0) return b + (c - b) * ((d4 - d3) / ((d4 - d3) + (d5 - d6)));
  const double denom = 1.0 / (va + vb + vc);
  return a + ab * (vb * denom) + ac * (vc * denom);
}

Vec3 closest_on_facet(const Surface& surface, int facet, const Vec3& x) {
  const auto c = facet_corners(surface, facet);
  Vec3 best = closest_on_triangle(x, c[0], c[1], c[2]);
  if (c.size() == 4) {
    const Vec3 other = closest_on_triangle(x, c[0], c[2], c[3]);
    if ((other - x).squaredNorm() < (best - x).squaredNorm()) best = other;
  }
  return best;
}

double facet_size(const Surface& surface, int facet) {
  const auto c = facet_corners(surface, facet);
  double size = 0.0;
  for (std::size_t i = 0; i < c.size(); ++i) size = std::max(size, (c[(i + 1) % c.size()] - c[i]).norm());
  return size;
}

}  // namespace toehold::detail
