// What a station of a shell model adds to a station result: which stress layer it reads and where its hot spot
// lies relative to the plate intersection line (docs/shell-models.md).
#pragma once

#include "toehold/common/tensor.hpp"

#include <string>
#include <vector>

namespace toehold {

struct ShellStationInfo {
  std::string layer;                      // "top" or "bottom": the surface read, seen from the carrying cells' normal
  std::string origin;                     // "intersection" or "weld-toe": where the read-out distances start
  double offset = 0.0;                    // mm from the intersection line to the hot-spot location (0 or t_att/2 + leg)
  Vec3 hot_spot = Vec3::Zero();           // mm: the hot-spot location on the layer surface
  double thickness = 0.0;                 // mm: plate thickness of the carrying cell at the toe (the model's)
  std::vector<double> from_intersection;  // mm per read-out point: distance from the intersection line
};

}  // namespace toehold
