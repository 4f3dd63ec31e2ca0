// Points inside one shell cell: the cell's own shape functions (VTK's), the
// mid-surface position and its two tangents at parametric coordinates, and the
// inverse map (Gauss-Newton on the shape functions) that gives the parametric
// coordinates and interpolation weights of a point on or near the cell.
#pragma once

#include "toehold/common/tensor.hpp"
#include "toehold/model/locator.hpp"

#include <vtkUnstructuredGrid.h>

#include <array>

namespace toehold {

// Mid-surface position (mm) and tangents dx/dr, dx/ds (mm per unit parametric
// coordinate) of a shell cell.
struct ShellCellMap {
  Vec3 x = Vec3::Zero();
  Vec3 dr = Vec3::Zero();
  Vec3 ds = Vec3::Zero();
};

// The map of `cell` of `grid` at parametric coordinates (r, s) (VTK's
// parametric domain: the unit triangle r, s >= 0, r + s <= 1 or the unit
// square).
ShellCellMap shell_cell_map(vtkUnstructuredGrid *grid, long long cell, double r,
                            double s);

// Unit normal dr x ds at the parametric centre (right-hand rule on the node
// order); zero for a degenerate cell.
Vec3 shell_cell_normal(vtkUnstructuredGrid *grid, long long cell);

// The point of `cell` closest to x (mm), kept inside the parametric domain:
// Gauss-Newton on the shape functions (at most 20 steps, stops when the
// parametric step is below 1e-12). Host::distance is |x - x(r, s)| in mm: the
// offset of x from the mid-surface plus any distance outside the cell.
// `outside` (>= 0) says by how much the unconstrained solution lay outside the
// parametric domain (0 when inside).
Host locate_in_shell_cell(vtkUnstructuredGrid *grid, long long cell,
                          const Vec3 &x, double *outside = nullptr);

} // namespace toehold
