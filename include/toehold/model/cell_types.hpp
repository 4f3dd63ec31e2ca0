// Everything toehold knows about VTK cell-type codes, in one place: dimension, order, corner count, name.
// Covers linear, quadratic (serendipity) and Lagrange cells; other layers ask here instead of switching on codes.
#pragma once

#include <string>

namespace toehold {

struct CellTypeInfo {
  int vtk_type = 0;       // VTK cell-type code (VTK_TETRA = 10, ...)
  int dimension = -1;     // 0 vertex, 1 line, 2 surface, 3 volume; -1 when toehold does not know the type
  int order = 0;          // 1 linear, 2 quadratic; Lagrange cells: order implied by node count, 0 when it varies
  int corners = 0;        // number of corner nodes (4 for any tetrahedron)
  bool lagrange = false;  // one of VTK's arbitrary-order Lagrange types (68-74)
  std::string name;       // e.g. "quadratic tetrahedron"
};

// Facts about `vtk_type`; dimension -1 for types toehold does not know.
CellTypeInfo cell_type_info(int vtk_type);

// Polynomial order of a cell given its node count (needed for Lagrange cells, whose code does not say it).
int cell_order(int vtk_type, int node_count);

}  // namespace toehold
