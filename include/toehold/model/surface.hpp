// The outer surface of a volume mesh as linear facets that know the volume cell they belong to. Quadratic and
// Lagrange faces are split through their mid-edge (and centre) nodes so the facets pass through every surface
// node. Used to chain toe nodes along surface edges and to walk read-out paths along the surface.
#pragma once

#include "toehold/common/tensor.hpp"
#include "toehold/model/mesh.hpp"
#include "toehold/model/near_cells.hpp"

#include <array>
#include <memory>
#include <span>
#include <vector>

namespace toehold {

struct Facet {
  std::array<long long, 4> points{-1, -1, -1, -1};  // mesh point ids, counter-clockwise seen from outside; [3] = -1 for triangles
  long long owner = -1;                            // volume cell id
  Vec3 normal = Vec3::Zero();                      // unit outward normal (away from the owner cell)
  int corner_count() const { return points[3] < 0 ? 3 : 4; }
};

struct SurfaceHit {
  int facet = -1;
  Vec3 x = Vec3::Zero();   // closest point on that facet, mm
  double distance = 0.0;   // mm
};

class Surface {
public:
  // The whole outer surface of `mesh`, or with `near` only the facets within reach of its seeds (every one of
  // them on the whole mesh's surface, and every surface point within reach on one of them). `near` is used
  // during construction only.
  explicit Surface(const Mesh& mesh, const NearCells* near = nullptr);

  const std::vector<Facet>& facets() const { return facets_; }
  // Facets sharing the edge (a, b), in no particular order (two on a closed manifold surface).
  std::vector<int> facets_on_edge(long long a, long long b) const;
  // The facet across edge (a, b) of `facet`, or -1 when there is none.
  int neighbour(int facet, long long a, long long b) const;
  // Facets that use mesh point p (empty when p is not on the surface).
  std::span<const int> facets_of_point(long long p) const;
  bool on_surface(long long p) const { return !facets_of_point(p).empty(); }
  // Surface points joined to p by a facet edge.
  std::vector<long long> edge_neighbours(long long p) const;
  // Closest point on the surface to x (mm). Fast on large models (a locator over the facets, built lazily;
  // the build is thread-safe, concurrent queries are as safe as VTK's vtkStaticCellLocator::FindClosestPoint).
  SurfaceHit closest(const Vec3& x) const;
  // The id that stands for mesh point p on the surface: p itself, or, where the file repeats a node per cell
  // (element-nodal results), the lowest id of the points at p's position. Facets use these ids.
  long long canonical(long long p) const;
  // Position of mesh point p in mm.
  Vec3 point(long long p) const;

private:
  struct FacetIndex;  // the facets as VTK triangles and a locator over them, for closest()

  const Mesh* mesh_;  // must outlive the Surface
  std::vector<Facet> facets_;
  std::vector<long long> point_start_;  // by mesh point id, + 1: point p's facets are
                                       // point_facet_[point_start_[p] .. point_start_[p + 1])
  std::vector<int> point_facet_;
  std::vector<long long> canonical_;            // by mesh point id; empty when no two points coincide
  std::shared_ptr<FacetIndex> index_;
};

}  // namespace toehold
