// Small geometric helpers on surface facets used by the toe layer (private to src/toe).
#pragma once

#include "toehold/common/tensor.hpp"
#include "toehold/model/surface.hpp"

#include <vector>

namespace toehold::detail {

std::vector<Vec3> facet_corners(const Surface& surface, int facet);
Vec3 facet_centroid(const Surface& surface, int facet);
double facet_area(const Surface& surface, int facet);
// Closest point to x on the facet (triangles; quads as two triangles), mm.
Vec3 closest_on_facet(const Surface& surface, int facet, const Vec3& x);
// Closest point to x on triangle (a, b, c) (Ericson, Real-Time Collision Detection, sec. 5.1.5).
Vec3 closest_on_triangle(const Vec3& x, const Vec3& a, const Vec3& b, const Vec3& c);
// Longest edge of the facet, mm: the local length scale for tolerances.
double facet_size(const Surface& surface, int facet);

}  // namespace toehold::detail
