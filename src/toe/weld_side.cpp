#include "toehold/toe/weld_side.hpp"

#include <algorithm>

namespace toehold {

bool WeldSide::is_weld_cell(long long cell) const {
  if (!has_regions() || cell < 0 || static_cast<std::size_t>(cell) >= cell_region.size()) return false;
  const int value = cell_region[static_cast<std::size_t>(cell)];
  return std::find(weld_values.begin(), weld_values.end(), value) != weld_values.end();
}

}  // namespace toehold
