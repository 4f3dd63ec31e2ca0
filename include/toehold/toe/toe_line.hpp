// A weld toe as an ordered polyline on the model surface, from a node-marker array (nodes chained along surface
// edges) or from coordinates in the plan (snapped onto the surface). Open lines and closed loops both work.
#pragma once

#include "toehold/common/tensor.hpp"
#include "toehold/model/surface.hpp"

#include <string>
#include <vector>

namespace toehold {

struct ToeLine {
  std::vector<Vec3> points;      // mm, in order along the toe
  std::vector<long long> nodes;  // mesh point id of each point (marker toes); -1 where a point is not a node
  bool closed = false;           // true for a loop (last point joins the first)

  // Length along the polyline in mm (closing segment included for loops).
  double length() const;
};

// Chains the surface nodes `nodes` into one ordered polyline along surface edges. `what` names the toe in
// messages (e.g. "toe 2 (point array 'toe' = 2)"). Throws Error when there are fewer than two nodes, a node is not
// on the model surface, the nodes branch, or they form more than one separate line.
ToeLine chain_marker_nodes(const Surface& surface, const std::vector<long long>& nodes, const std::string& what);

// Snaps each coordinate (mm) onto the closest surface point. Throws Error naming the point when it lies more
// than `tolerance` mm from the surface, or when fewer than two points are given.
ToeLine snap_toe_points(const Surface& surface, const std::vector<Vec3>& points, bool closed, double tolerance,
                        const std::string& what);

}  // namespace toehold
