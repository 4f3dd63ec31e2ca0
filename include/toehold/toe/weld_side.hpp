// Which side of a toe the weld is on: cells of a region array that mark weld (or attached-part) cells, or a
// point inside the weld or the attached part near the toe. The read-out goes the other way.
#pragma once

#include "toehold/common/tensor.hpp"

#include <optional>
#include <string>
#include <vector>

namespace toehold {

struct WeldSide {
  std::vector<int> cell_region;    // region value per mesh cell; empty when no region array is used
  std::vector<int> weld_values;    // region values that mark weld cells
  std::optional<Vec3> point;       // mm: a point inside the weld or the attached part, near the toe
  std::string description;         // for messages, e.g. "region array 'region' = 3"

  bool has_regions() const { return !cell_region.empty() && !weld_values.empty(); }
  // True when `cell` belongs to the weld region (always false without a region array).
  bool is_weld_cell(long long cell) const;
};

}  // namespace toehold
