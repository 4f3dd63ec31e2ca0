// Private to src/shell: geometry helpers shared by the shell toe tracing and
// the read-out placement.
#pragma once

#include "toehold/shell/shell_toe.hpp"
#include "toehold/shell/shell_walk.hpp"

#include <vtkDataArray.h>

namespace toehold::detail {

// True when (a, b) is a plate intersection edge: three or more facets meet
// there, or two at a fold.
bool intersection_edge(const ShellSurface &surface, long long a, long long b,
                       double kink_limit_deg);
// Unit vector in facet f's plane, perpendicular to its edge (a, b), pointing
// into the facet.
Vec3 inward(const ShellSurface &surface, int f, long long a, long long b);
// The spec's region array (nullptr when none is named); Error naming the toe
// and array when it is missing.
vtkDataArray *region_array(const ShellSurface &surface,
                           const ShellToeSpec &spec);
// The facets of the plate carrying the toe: those of the plate region, or all
// when no region is named.
FacetFilter plate_filter(const ShellSurface &surface, const ShellToeSpec &spec);

} // namespace toehold::detail
