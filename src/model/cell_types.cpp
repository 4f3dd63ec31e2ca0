#include "toehold/model/cell_types.hpp"

#include <vtkCellType.h>

#include <array>

namespace toehold {
namespace {

// One row per VTK cell type toehold knows. Lagrange rows carry order 0 (the node count says it).
constexpr int kVaries = 0;

struct Row {
  int type;
  int dimension;
  int order;
  int corners;
  bool lagrange;
  const char* name;
};

constexpr std::array<Row, 47> kRows{{
    // 0D and 1D
    {VTK_VERTEX, 0, 1, 1, false, "vertex"},
    {VTK_POLY_VERTEX, 0, 1, kVaries, false, "poly-vertex"},
    {VTK_LINE, 1, 1, 2, false, "line"},
    {VTK_POLY_LINE, 1, 1, kVaries, false, "poly-line"},
    {VTK_QUADRATIC_EDGE, 1, 2, 2, false, "quadratic edge"},
    {VTK_CUBIC_LINE, 1, 3, 2, false, "cubic line"},
    {VTK_LAGRANGE_CURVE, 1, kVaries, 2, true, "Lagrange curve"},
    // 2D
    {VTK_TRIANGLE, 2, 1, 3, false, "triangle"},
    {VTK_TRIANGLE_STRIP, 2, 1, kVaries, false, "triangle strip"},
    {VTK_POLYGON, 2, 1, kVaries, false, "polygon"},
    {VTK_PIXEL, 2, 1, 4, false, "pixel"},
    {VTK_QUAD, 2, 1, 4, false, "quadrilateral"},
    {VTK_QUADRATIC_TRIANGLE, 2, 2, 3, false, "quadratic triangle"},
    {VTK_QUADRATIC_QUAD, 2, 2, 4, false, "quadratic quadrilateral"},
    {VTK_QUADRATIC_POLYGON, 2, 2, kVaries, false, "quadratic polygon"},
    {VTK_BIQUADRATIC_QUAD, 2, 2, 4, false, "biquadratic quadrilateral"},
    {VTK_QUADRATIC_LINEAR_QUAD, 2, 2, 4, false, "quadratic-linear quadrilateral"},
    {VTK_BIQUADRATIC_TRIANGLE, 2, 2, 3, false, "biquadratic triangle"},
    {VTK_LAGRANGE_TRIANGLE, 2, kVaries, 3, true, "Lagrange triangle"},
    {VTK_LAGRANGE_QUADRILATERAL, 2, kVaries, 4, true, "Lagrange quadrilateral"},
    // 3D linear
    {VTK_TETRA, 3, 1, 4, false, "tetrahedron"},
    {VTK_VOXEL, 3, 1, 8, false, "voxel"},
    {VTK_HEXAHEDRON, 3, 1, 8, false, "hexahedron"},
    {VTK_WEDGE, 3, 1, 6, false, "wedge"},
    {VTK_PYRAMID, 3, 1, 5, false, "pyramid"},
    {VTK_PENTAGONAL_PRISM, 3, 1, 10, false, "pentagonal prism"},
    {VTK_HEXAGONAL_PRISM, 3, 1, 12, false, "hexagonal prism"},
    // 3D quadratic (serendipity), bi- and triquadratic
    {VTK_QUADRATIC_TETRA, 3, 2, 4, false, "quadratic tetrahedron"},
    {VTK_QUADRATIC_HEXAHEDRON, 3, 2, 8, false, "quadratic hexahedron"},
    {VTK_QUADRATIC_WEDGE, 3, 2, 6, false, "quadratic wedge"},
    {VTK_QUADRATIC_PYRAMID, 3, 2, 5, false, "quadratic pyramid"},
    {VTK_TRIQUADRATIC_HEXAHEDRON, 3, 2, 8, false, "triquadratic hexahedron"},
    {VTK_TRIQUADRATIC_PYRAMID, 3, 2, 5, false, "triquadratic pyramid"},
    {VTK_QUADRATIC_LINEAR_WEDGE, 3, 2, 6, false, "quadratic-linear wedge"},
    {VTK_BIQUADRATIC_QUADRATIC_WEDGE, 3, 2, 6, false, "biquadratic-quadratic wedge"},
    {VTK_BIQUADRATIC_QUADRATIC_HEXAHEDRON, 3, 2, 8, false, "biquadratic-quadratic hexahedron"},
    // 3D Lagrange (VTK 9.1 has no Lagrange pyramid cell: see kNamedOnly)
    {VTK_LAGRANGE_TETRAHEDRON, 3, kVaries, 4, true, "Lagrange tetrahedron"},
    {VTK_LAGRANGE_HEXAHEDRON, 3, kVaries, 8, true, "Lagrange hexahedron"},
    {VTK_LAGRANGE_WEDGE, 3, kVaries, 6, true, "Lagrange wedge"},
    // Types toehold can name but not use: dimension -1 is set for them below.
    {VTK_EMPTY_CELL, -1, 0, 0, false, "empty cell"},
    {VTK_CONVEX_POINT_SET, -1, 0, 0, false, "convex point set"},
    {VTK_POLYHEDRON, -1, 0, 0, false, "polyhedron"},
    {VTK_LAGRANGE_PYRAMID, -1, 0, 5, true, "Lagrange pyramid"},
    {VTK_BEZIER_TETRAHEDRON, -1, 0, 4, false, "Bezier tetrahedron"},
    {VTK_BEZIER_HEXAHEDRON, -1, 0, 8, false, "Bezier hexahedron"},
    {VTK_BEZIER_WEDGE, -1, 0, 6, false, "Bezier wedge"},
    {VTK_BEZIER_PYRAMID, -1, 0, 5, false, "Bezier pyramid"},
}};

// The order p whose node count `count(p)` equals `nodes`, or 0 when none does (p = 1..10).
template <class Count>
int order_from_count(int nodes, Count count) {
  for (int p = 1; p <= 10; ++p)
    if (count(p) == nodes) return p;
  return 0;
}

int lagrange_order(int vtk_type, int n) {
  switch (vtk_type) {
    case VTK_LAGRANGE_CURVE: return order_from_count(n, [](int p) { return p + 1; });
    case VTK_LAGRANGE_TRIANGLE: return order_from_count(n, [](int p) { return (p + 1) * (p + 2) / 2; });
    case VTK_LAGRANGE_QUADRILATERAL: return order_from_count(n, [](int p) { return (p + 1) * (p + 1); });
    case VTK_LAGRANGE_TETRAHEDRON:
      return order_from_count(n, [](int p) { return (p + 1) * (p + 2) * (p + 3) / 6; });
    case VTK_LAGRANGE_HEXAHEDRON: return order_from_count(n, [](int p) { return (p + 1) * (p + 1) * (p + 1); });
    case VTK_LAGRANGE_WEDGE:
      if (n == 21) return 2;  // VTK's quadratic wedge with face-centre nodes
      return order_from_count(n, [](int p) { return (p + 1) * (p + 1) * (p + 2) / 2; });
    default: return 0;
  }
}

}  // namespace

CellTypeInfo cell_type_info(int vtk_type) {
  for (const Row& row : kRows) {
    if (row.type != vtk_type) continue;
    return CellTypeInfo{row.type, row.dimension, row.order, row.corners, row.lagrange, row.name};
  }
  CellTypeInfo unknown;
  unknown.vtk_type = vtk_type;
  unknown.name = "VTK cell type " + std::to_string(vtk_type);
  return unknown;
}

int cell_order(int vtk_type, int node_count) {
  const CellTypeInfo info = cell_type_info(vtk_type);
  if (info.lagrange) return lagrange_order(vtk_type, node_count);
  return info.order;
}

}  // namespace toehold
