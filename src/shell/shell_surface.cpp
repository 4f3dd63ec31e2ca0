#include "toehold/shell/shell_surface.hpp"

#include <vtkCellType.h>

#include <algorithm>
#include <cmath>

namespace toehold {
namespace {

using Quad = std::array<int, 4>; // cell-local node numbers of a facet, [3] = -1
                                 // for a triangle

// Facets of a shell cell in its local node numbers, wound like the cell. VTK
// numbers quadratic and order-2 Lagrange faces corners first, then mid-edges
// 01, 12, 23 (20), 30, then the centre.
std::vector<Quad> split_cell(int type, long long nodes) {
  if (nodes == 3)
    return {{0, 1, 2, -1}};
  if (nodes == 4)
    return {{0, 1, 2, 3}};
  if (nodes == 6)
    return {{0, 3, 5, -1}, {3, 1, 4, -1}, {5, 4, 2, -1}, {3, 4, 5, -1}};
  if (type == VTK_QUADRATIC_QUAD)
    return {{0, 4, 7, -1},
            {4, 1, 5, -1},
            {5, 2, 6, -1},
            {7, 6, 3, -1},
            {4, 5, 6, 7}};
  return {{0, 4, 8, 7},
          {4, 1, 5, 8},
          {8, 5, 2, 6},
          {7, 8, 6, 3}}; // 9-node quadrilateral
}

Vec3 closest_on_triangle(const Vec3 &p, const Vec3 &a, const Vec3 &b,
                         const Vec3 &c) {
  // Ericson, Real-Time Collision Detection, sec. 5.1.5 (read in the source
  // [S2]: the standard Voronoi-region test).
  const Vec3 ab = b - a, ac = c - a, ap = p - a;
  const double d1 = ab.dot(ap), d2 = ac.dot(ap);
  if (d1 <= 0 && d2 <= 0)
    return a;
  const Vec3 bp = p - b;
  const double d3 = ab.dot(bp), d4 = ac.dot(bp);
  if (d3 >= 0 && d4 <= d3)
    return b;
  const double vc = d1 * d4 - d3 * d2;
  if (vc <= 0 && d1 >= 0 && d3 <= 0)
    return a + d1 / (d1 - d3) * ab;
  const Vec3 cp = p - c;
  const double d5 = ab.dot(cp), d6 = ac.dot(cp);
  if (d6 >= 0 && d5 <= d6)
    return c;
  const double vb = d5 * d2 - d1 * d6;
  if (vb <= 0 && d2 >= 0 && d6 <= 0)
    return a + d2 / (d2 - d6) * ac;
  const double va = d3 * d6 - d5 * d4;
  if (va <= 0 && (d4 - d3) >= 0 && (d5 - d6) >= 0)
    return b + (d4 - d3) / ((d4 - d3) + (d5 - d6)) * (c - b);
  const double denom = 1.0 / (va + vb + vc);
  return a + ab * (vb * denom) + ac * (vc * denom);
}

} // namespace

ShellSurface::ShellSurface(const ShellMesh &shells)
    : shells_(&shells), point_facets_(static_cast<std::size_t>(
                            shells.grid()->GetNumberOfPoints())) {
  vtkUnstructuredGrid *grid = shells.grid();
  for (vtkIdType c = 0; c < grid->GetNumberOfCells(); ++c) {
    vtkIdType n = 0;
    const vtkIdType *pts = nullptr;
    grid->GetCellPoints(c, n, pts);
    cell_first_.push_back(static_cast<int>(facets_.size()));
    for (const Quad &q : split_cell(grid->GetCellType(c), n)) {
      ShellFacet f;
      for (int k = 0; k < 4; ++k)
        f.points[static_cast<std::size_t>(k)] =
            q[static_cast<std::size_t>(k)] < 0
                ? -1
                : pts[q[static_cast<std::size_t>(k)]];
      f.cell = c;
      const int m = f.corner_count();
      Vec3 normal = Vec3::Zero(); // Newell's method
      for (int k = 0; k < m; ++k)
        normal +=
            point(f.points[static_cast<std::size_t>(k)])
                .cross(point(f.points[static_cast<std::size_t>((k + 1) % m)]));
      f.normal =
          normal.norm() > 0 ? Vec3(normal.normalized()) : shells.normal(c);
      const int id = static_cast<int>(facets_.size());
      for (int k = 0; k < m; ++k) {
        const long long a = f.points[static_cast<std::size_t>(k)],
                        b = f.points[static_cast<std::size_t>((k + 1) % m)];
        point_facets_[static_cast<std::size_t>(a)].push_back(id);
        edge_facets_[key(a, b)].push_back(id);
      }
      facets_.push_back(f);
    }
  }
  cell_first_.push_back(static_cast<int>(facets_.size()));
}

const std::vector<int> &ShellSurface::facets_on_edge(long long a,
                                                     long long b) const {
  static const std::vector<int> none;
  const auto found = edge_facets_.find(key(a, b));
  return found == edge_facets_.end() ? none : found->second;
}

const std::vector<int> &ShellSurface::facets_of_point(long long p) const {
  return point_facets_[static_cast<std::size_t>(p)];
}

std::vector<long long> ShellSurface::edge_neighbours(long long p) const {
  std::vector<long long> out;
  for (int fi : facets_of_point(p)) {
    const ShellFacet &f = facet(fi);
    const int m = f.corner_count();
    for (int k = 0; k < m; ++k) {
      if (f.points[static_cast<std::size_t>(k)] != p)
        continue;
      out.push_back(f.points[static_cast<std::size_t>((k + 1) % m)]);
      out.push_back(f.points[static_cast<std::size_t>((k + m - 1) % m)]);
    }
  }
  std::sort(out.begin(), out.end());
  out.erase(std::unique(out.begin(), out.end()), out.end());
  return out;
}

bool ShellSurface::on_junction(long long p) const {
  for (long long q : edge_neighbours(p))
    if (junction_edge(p, q))
      return true;
  return false;
}

bool ShellSurface::runs_forward(int fi, long long a, long long b) const {
  const ShellFacet &f = facet(fi);
  const int m = f.corner_count();
  for (int k = 0; k < m; ++k)
    if (f.points[static_cast<std::size_t>(k)] == a &&
        f.points[static_cast<std::size_t>((k + 1) % m)] == b)
      return true;
  return false;
}

Vec3 ShellSurface::centroid(int fi) const {
  const ShellFacet &f = facet(fi);
  Vec3 c = Vec3::Zero();
  for (int k = 0; k < f.corner_count(); ++k)
    c += point(f.points[static_cast<std::size_t>(k)]);
  return c / f.corner_count();
}

double ShellSurface::size(int fi) const {
  const ShellFacet &f = facet(fi);
  const int m = f.corner_count();
  double longest = 0.0;
  for (int k = 0; k < m; ++k)
    longest = std::max(longest,
                       (point(f.points[static_cast<std::size_t>(k)]) -
                        point(f.points[static_cast<std::size_t>((k + 1) % m)]))
                           .norm());
  return longest;
}

Vec3 ShellSurface::closest_on_facet(int fi, const Vec3 &x) const {
  const ShellFacet &f = facet(fi);
  auto p = [&](int k) { return point(f.points[static_cast<std::size_t>(k)]); };
  const Vec3 first = closest_on_triangle(x, p(0), p(1), p(2));
  if (f.corner_count() == 3)
    return first;
  const Vec3 second = closest_on_triangle(x, p(0), p(2), p(3));
  return (first - x).norm() <= (second - x).norm() ? first : second;
}

} // namespace toehold
