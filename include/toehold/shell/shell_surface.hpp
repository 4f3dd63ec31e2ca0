// The mid-surface of a shell model as linear facets that know their shell cell,
// wound like the cell (so a facet normal is the cell's normal). Quadratic cells
// are split through their mid-edge (and centre) nodes. Knows which facet edges
// are plate junctions (three or more facets meet) for toes and for ending
// read-out walks.
#pragma once

#include "toehold/common/tensor.hpp"
#include "toehold/shell/shell_mesh.hpp"

#include <array>
#include <map>
#include <utility>
#include <vector>

namespace toehold {

struct ShellFacet {
  std::array<long long, 4> points{
      -1, -1, -1,
      -1}; // mesh point ids in the cell's winding; [3] = -1 for triangles
  long long cell = -1; // shell cell id
  Vec3 normal =
      Vec3::Zero(); // unit, right-hand rule on `points` (the cell's top side)
  int corner_count() const { return points[3] < 0 ? 3 : 4; }
};

class ShellSurface {
public:
  explicit ShellSurface(
      const ShellMesh &shells); // `shells` must outlive the ShellSurface

  const ShellMesh &shells() const { return *shells_; }
  const std::vector<ShellFacet> &facets() const { return facets_; }
  const ShellFacet &facet(int f) const {
    return facets_[static_cast<std::size_t>(f)];
  }
  // Facets that use the edge (a, b) (either order), in facet order.
  const std::vector<int> &facets_on_edge(long long a, long long b) const;
  // Facets of shell cell c: ids first_facet(c) .. first_facet(c + 1) - 1
  // (facets are stored cell by cell).
  int first_facet(long long c) const {
    return cell_first_[static_cast<std::size_t>(c)];
  }
  // Facets that use point p (empty when no shell cell does).
  const std::vector<int> &facets_of_point(long long p) const;
  // Points joined to p by a facet edge.
  std::vector<long long> edge_neighbours(long long p) const;
  // True when three or more facets share the edge (a, b): two or more plates
  // meet there.
  bool junction_edge(long long a, long long b) const {
    return facets_on_edge(a, b).size() > 2;
  }
  // True when p lies on a junction edge.
  bool on_junction(long long p) const;
  // True when facet f runs a -> b (not b -> a) along its boundary.
  bool runs_forward(int f, long long a, long long b) const;
  Vec3 point(long long p) const { return shells_->point(p); }
  Vec3 centroid(int f) const;
  double size(int f) const; // longest edge, mm
  // Closest point to x on facet f (quads as two triangles), mm.
  Vec3 closest_on_facet(int f, const Vec3 &x) const;

private:
  static std::pair<long long, long long> key(long long a, long long b) {
    return {std::min(a, b), std::max(a, b)};
  }

  const ShellMesh *shells_;
  std::vector<ShellFacet> facets_;
  std::vector<std::vector<int>> point_facets_;
  std::vector<int> cell_first_; // per cell, and one past the last cell
  std::map<std::pair<long long, long long>, std::vector<int>> edge_facets_;
};

} // namespace toehold
