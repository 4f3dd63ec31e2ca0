// Walks a straight (geodesic) path along the faceted model surface from a toe station, unfolding the direction
// across each facet edge, so read-out points on curved plates and tubes sit at their true surface distance.
// The walk stops at a sharp model edge (a plate edge), an open surface edge, or a weld facet, and says which.
#pragma once

#include "toehold/common/tensor.hpp"
#include "toehold/model/surface.hpp"
#include "toehold/toe/weld_side.hpp"

#include <string>
#include <vector>

namespace toehold {

struct WalkOptions {
  double kink_limit_deg = 30.0;  // degrees between neighbouring facet normals taken as a plate edge
};

struct SurfacePoint {
  Vec3 x = Vec3::Zero();  // mm
  int facet = -1;
  double distance = 0.0;  // mm along the surface from the start
};

struct Walk {
  std::vector<SurfacePoint> targets;  // one per requested distance that was reached, in order
  std::vector<Vec3> path;             // the walked polyline (start, each edge crossing, end), mm
  std::string stop_reason;            // empty when every distance was reached
  double reached = 0.0;               // mm walked before stopping (or the last distance)
};

// Walks from `start` (mm, on facet `facet`) in direction `direction` (unit, tangent to the surface) and places a
// point at each of `distances` (mm, ascending). Facets owned by weld cells end the walk.
Walk walk_surface(const Surface& surface, const WeldSide& weld, int facet, const Vec3& start, const Vec3& direction,
                  const std::vector<double>& distances, const WalkOptions& options = {});

}  // namespace toehold
