// The cells of a mesh near a set of seed points (the weld toes): those whose bounding box comes within each
// seed's reach. The surface and the locator are built on these cells only, so their cost follows the toes'
// neighbourhood instead of the whole model. A box-based choice keeps every cell that holds a point within reach,
// and every boundary face near a seed is a true boundary face of the whole mesh (see Surface).
#pragma once

#include "toehold/common/tensor.hpp"
#include "toehold/model/mesh.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <vector>

namespace toehold {

struct Seed {
  Vec3 x = Vec3::Zero();  // mm, model coordinates
  double reach = 0.0;     // mm, > 0: cells and faces whose bounding box comes this close are near
};

// An axis-aligned box {xmin, xmax, ymin, ymax, zmin, zmax} in mm, VTK's bounds order.
using Box = std::array<double, 6>;

// The box that holds nothing yet; grow() widens a box to hold point x (mm).
constexpr Box kEmptyBox{HUGE_VAL, -HUGE_VAL, HUGE_VAL, -HUGE_VAL, HUGE_VAL, -HUGE_VAL};
inline void grow(Box& b, const double* x) {
  for (int a = 0; a < 3; ++a) {
    b[2 * a] = std::min(b[2 * a], x[a]);
    b[2 * a + 1] = std::max(b[2 * a + 1], x[a]);
  }
}

class NearCells {
public:
  // Selects the cells of `mesh` whose bounding box comes within reach of a seed. `seeds` must not be empty.
  NearCells(const Mesh& mesh, std::vector<Seed> seeds);

  // True when box `b` comes within reach of a seed (touching counts).
  bool near(const Box& b) const;
  // The selected cell ids, ascending.
  const std::vector<long long>& cells() const { return cells_; }
  // The cell count of the whole mesh.
  long long mesh_cells() const { return mesh_cells_; }

private:
  void index_seeds();
  bool near_seed(const Seed& s, const Box& b) const;

  std::vector<Seed> seeds_;
  double bin_ = 1.0;                      // mm, edge of a seed bin (the largest reach)
  Vec3 origin_ = Vec3::Zero();            // mm, corner of bin (0, 0, 0)
  std::array<long long, 3> bins_{1, 1, 1};
  std::vector<int> bin_start_;            // seeds_ sorted by bin; bin b holds [bin_start_[b], bin_start_[b + 1])
  std::vector<long long> cells_;
  long long mesh_cells_ = 0;
};

// The largest bounding-box diagonal (mm) of the cells that use each of `points` (mesh point ids), in the
// order given; 0 for a point no cell uses. One pass over the cells.
std::vector<double> largest_cell_size_at(const Mesh& mesh, const std::vector<long long>& points);

}  // namespace toehold
