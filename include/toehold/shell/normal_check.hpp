// Are neighbouring shell normals consistent? Two cells of one plate that share
// an edge must run along it in opposite directions (their node orders then give
// normals to the same side); where they do not, the cells' top and bottom
// layers are swapped against each other and a layer stress read across them
// mixes the two surfaces.
#pragma once

#include "toehold/shell/shell_surface.hpp"

#include <string>
#include <vector>

namespace toehold {

struct NormalFlip {
  long long cell_a = -1, cell_b = -1;   // the two shell cells, cell_a < cell_b
  long long point_a = -1, point_b = -1; // the shared edge's points
};

// Flips between each cell in `cells` and its neighbours across edges shared by
// exactly two facets whose planes meet at no more than `kink_limit_deg` degrees
// (one plate; junctions and folds are not compared). Each pair once, ordered by
// (cell_a, cell_b).
std::vector<NormalFlip> find_normal_flips(const ShellSurface &surface,
                                          const std::vector<long long> &cells,
                                          double kink_limit_deg);

// "shell normals flip between cells 3 and 4 (edge of points 10-11)", joined by
// "; " for several.
std::string describe(const std::vector<NormalFlip> &flips);

} // namespace toehold
