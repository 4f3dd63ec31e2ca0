// Walks a straight (geodesic) path along the shell mid-surface from a toe
// station, unfolding the direction across each facet edge (as the solid-model
// walk of toe/surface_walk.hpp does on the outer surface). The walk stays on
// one plate: it stops at a plate junction, a plate edge or fold, an open edge,
// or a facet the plate filter refuses.
#pragma once

#include "toehold/common/tensor.hpp"
#include "toehold/shell/shell_surface.hpp"

#include <functional>
#include <string>
#include <vector>

namespace toehold {

struct ShellWalkOptions {
  double kink_limit_deg = 30.0; // degrees between neighbouring facet planes
                                // taken as a fold (plate edge)
};

struct ShellPathPoint {
  Vec3 x = Vec3::Zero(); // mm, on the mid-surface facets
  int facet = -1;
  double distance = 0.0; // mm along the mid-surface from the start
};

struct ShellWalk {
  std::vector<ShellPathPoint>
      targets; // one per requested distance that was reached, in order
  std::vector<Vec3>
      path; // the walked polyline (start, each edge crossing, end), mm
  std::vector<int>
      facets; // facets walked over, in order (the start facet first)
  std::string stop_reason; // empty when every distance was reached
  double reached = 0.0;    // mm walked before stopping (or the last distance)
};

// True when the walk may enter `facet` (it belongs to the plate carrying the
// toe).
using FacetFilter = std::function<bool(int facet)>;

// Walks from `start` (mm, on facet `facet`) in `direction` (tangent to the
// facet; made so) and places a point at each of `distances` (mm from the start,
// ascending). Facet planes are compared without their sense, so a cell with a
// flipped normal does not stop the walk (normal_check.hpp reports it).
ShellWalk walk_shell(const ShellSurface &surface, const FacetFilter &plate,
                     int facet, const Vec3 &start, const Vec3 &direction,
                     const std::vector<double> &distances,
                     const ShellWalkOptions &options = {});

} // namespace toehold
