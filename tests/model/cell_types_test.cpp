// Cell-type facts, checked one type at a time against hand-written values and against VTK's own cell classes.
#include "support/support.hpp"
#include "toehold/model/cell_types.hpp"

#include <vtkCell.h>
#include <vtkCellType.h>
#include <vtkGenericCell.h>
#include <vtkSmartPointer.h>

namespace toehold {
namespace {

struct Expected {
  int type;
  int dimension;
  int order;
  int corners;
  bool lagrange;
  const char* name;
};

void expect_info(const Expected& e) {
  SCOPED_TRACE(e.name);
  const CellTypeInfo info = cell_type_info(e.type);
  EXPECT_EQ(info.vtk_type, e.type);
  EXPECT_EQ(info.dimension, e.dimension);
  EXPECT_EQ(info.order, e.order);
  EXPECT_EQ(info.corners, e.corners);
  EXPECT_EQ(info.lagrange, e.lagrange);
  EXPECT_EQ(info.name, e.name);
  if (e.dimension < 0) return;
  // VTK's own class for the type agrees on the dimension.
  auto cell = vtkSmartPointer<vtkGenericCell>::New();
  cell->SetCellType(e.type);
  EXPECT_EQ(cell->GetCellDimension(), e.dimension);
}

// Corner counts: a tetrahedron has 4 corners, a pyramid 5, a wedge 6, a hexahedron 8, whatever its order
// (geometry [D]). Node counts of the serendipity and Lagrange cells follow VTK's cell documentation [S].
TEST(CellTypes, LinearVolumeCells) {
  expect_info({VTK_TETRA, 3, 1, 4, false, "tetrahedron"});
  expect_info({VTK_VOXEL, 3, 1, 8, false, "voxel"});
  expect_info({VTK_HEXAHEDRON, 3, 1, 8, false, "hexahedron"});
  expect_info({VTK_WEDGE, 3, 1, 6, false, "wedge"});
  expect_info({VTK_PYRAMID, 3, 1, 5, false, "pyramid"});
  expect_info({VTK_PENTAGONAL_PRISM, 3, 1, 10, false, "pentagonal prism"});
  expect_info({VTK_HEXAGONAL_PRISM, 3, 1, 12, false, "hexagonal prism"});
}

TEST(CellTypes, QuadraticVolumeCells) {
  expect_info({VTK_QUADRATIC_TETRA, 3, 2, 4, false, "quadratic tetrahedron"});
  expect_info({VTK_QUADRATIC_HEXAHEDRON, 3, 2, 8, false, "quadratic hexahedron"});
  expect_info({VTK_QUADRATIC_WEDGE, 3, 2, 6, false, "quadratic wedge"});
  expect_info({VTK_QUADRATIC_PYRAMID, 3, 2, 5, false, "quadratic pyramid"});
  expect_info({VTK_TRIQUADRATIC_HEXAHEDRON, 3, 2, 8, false, "triquadratic hexahedron"});
  expect_info({VTK_TRIQUADRATIC_PYRAMID, 3, 2, 5, false, "triquadratic pyramid"});
  expect_info({VTK_QUADRATIC_LINEAR_WEDGE, 3, 2, 6, false, "quadratic-linear wedge"});
  expect_info({VTK_BIQUADRATIC_QUADRATIC_WEDGE, 3, 2, 6, false, "biquadratic-quadratic wedge"});
  expect_info({VTK_BIQUADRATIC_QUADRATIC_HEXAHEDRON, 3, 2, 8, false, "biquadratic-quadratic hexahedron"});
}

TEST(CellTypes, LagrangeCells) {
  expect_info({VTK_LAGRANGE_TETRAHEDRON, 3, 0, 4, true, "Lagrange tetrahedron"});
  expect_info({VTK_LAGRANGE_HEXAHEDRON, 3, 0, 8, true, "Lagrange hexahedron"});
  expect_info({VTK_LAGRANGE_WEDGE, 3, 0, 6, true, "Lagrange wedge"});
  expect_info({VTK_LAGRANGE_TRIANGLE, 2, 0, 3, true, "Lagrange triangle"});
  expect_info({VTK_LAGRANGE_QUADRILATERAL, 2, 0, 4, true, "Lagrange quadrilateral"});
  expect_info({VTK_LAGRANGE_CURVE, 1, 0, 2, true, "Lagrange curve"});
}

TEST(CellTypes, SurfaceLineAndPointCells) {
  expect_info({VTK_TRIANGLE, 2, 1, 3, false, "triangle"});
  expect_info({VTK_QUAD, 2, 1, 4, false, "quadrilateral"});
  expect_info({VTK_PIXEL, 2, 1, 4, false, "pixel"});
  expect_info({VTK_POLYGON, 2, 1, 0, false, "polygon"});
  expect_info({VTK_TRIANGLE_STRIP, 2, 1, 0, false, "triangle strip"});
  expect_info({VTK_QUADRATIC_TRIANGLE, 2, 2, 3, false, "quadratic triangle"});
  expect_info({VTK_QUADRATIC_QUAD, 2, 2, 4, false, "quadratic quadrilateral"});
  expect_info({VTK_BIQUADRATIC_QUAD, 2, 2, 4, false, "biquadratic quadrilateral"});
  expect_info({VTK_QUADRATIC_LINEAR_QUAD, 2, 2, 4, false, "quadratic-linear quadrilateral"});
  expect_info({VTK_BIQUADRATIC_TRIANGLE, 2, 2, 3, false, "biquadratic triangle"});
  expect_info({VTK_QUADRATIC_POLYGON, 2, 2, 0, false, "quadratic polygon"});
  expect_info({VTK_LINE, 1, 1, 2, false, "line"});
  expect_info({VTK_POLY_LINE, 1, 1, 0, false, "poly-line"});
  expect_info({VTK_QUADRATIC_EDGE, 1, 2, 2, false, "quadratic edge"});
  expect_info({VTK_CUBIC_LINE, 1, 3, 2, false, "cubic line"});
  expect_info({VTK_VERTEX, 0, 1, 1, false, "vertex"});
  expect_info({VTK_POLY_VERTEX, 0, 1, 0, false, "poly-vertex"});
}

TEST(CellTypes, TypesToeholdCannotUseHaveNoDimension) {
  expect_info({VTK_POLYHEDRON, -1, 0, 0, false, "polyhedron"});
  expect_info({VTK_CONVEX_POINT_SET, -1, 0, 0, false, "convex point set"});
  expect_info({VTK_LAGRANGE_PYRAMID, -1, 0, 5, true, "Lagrange pyramid"});  // no such cell class in VTK 9.1
  expect_info({VTK_BEZIER_TETRAHEDRON, -1, 0, 4, false, "Bezier tetrahedron"});
  expect_info({VTK_EMPTY_CELL, -1, 0, 0, false, "empty cell"});
  expect_info({99, -1, 0, 0, false, "VTK cell type 99"});
}

TEST(CellTypes, LagrangeOrderFollowsNodeCount) {
  // Node counts of order p: tetrahedron (p+1)(p+2)(p+3)/6, hexahedron (p+1)^3, wedge (p+1)^2(p+2)/2 [D].
  EXPECT_EQ(cell_order(VTK_LAGRANGE_TETRAHEDRON, 4), 1);
  EXPECT_EQ(cell_order(VTK_LAGRANGE_TETRAHEDRON, 10), 2);
  EXPECT_EQ(cell_order(VTK_LAGRANGE_TETRAHEDRON, 20), 3);
  EXPECT_EQ(cell_order(VTK_LAGRANGE_TETRAHEDRON, 11), 0);
  EXPECT_EQ(cell_order(VTK_LAGRANGE_HEXAHEDRON, 8), 1);
  EXPECT_EQ(cell_order(VTK_LAGRANGE_HEXAHEDRON, 27), 2);
  EXPECT_EQ(cell_order(VTK_LAGRANGE_HEXAHEDRON, 64), 3);
  EXPECT_EQ(cell_order(VTK_LAGRANGE_WEDGE, 6), 1);
  EXPECT_EQ(cell_order(VTK_LAGRANGE_WEDGE, 18), 2);
  EXPECT_EQ(cell_order(VTK_LAGRANGE_WEDGE, 21), 2);
  EXPECT_EQ(cell_order(VTK_LAGRANGE_TRIANGLE, 6), 2);
  EXPECT_EQ(cell_order(VTK_LAGRANGE_QUADRILATERAL, 9), 2);
  EXPECT_EQ(cell_order(VTK_LAGRANGE_CURVE, 4), 3);
  EXPECT_EQ(cell_order(VTK_QUADRATIC_TETRA, 10), 2);
  EXPECT_EQ(cell_order(VTK_TETRA, 4), 1);
}

}  // namespace
}  // namespace toehold
