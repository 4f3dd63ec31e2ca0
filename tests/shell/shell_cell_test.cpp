// Shape functions, normals and the inverse map of every shell cell type toehold
// reads.
#include "toehold/shell/shell_cell.hpp"
#include "toehold/shell/shell_mesh.hpp"

#include "support/support.hpp"

#include <vtkCellType.h>
#include <vtkIdList.h>
#include <vtkNew.h>
#include <vtkPoints.h>
#include <vtkUnstructuredGrid.h>

#include <vector>

namespace toehold {
namespace {

struct CellCase {
  int type;
  std::vector<std::array<double, 2>>
      nodes; // (u, v) in the cell's plane, mm, in VTK order
};

// One cell of each type in the plane z = 0.5 u + 0.25 v (tilted), wound
// counter-clockwise in (u, v).
std::vector<CellCase> cases() {
  const std::vector<std::array<double, 2>> tri6{{0, 0}, {4, 0},   {0, 3},
                                                {2, 0}, {2, 1.5}, {0, 1.5}};
  const std::vector<std::array<double, 2>> quad9{{0, 0}, {4, 0},   {4, 3},
                                                 {0, 3}, {2, 0},   {4, 1.5},
                                                 {2, 3}, {0, 1.5}, {2, 1.5}};
  return {{VTK_TRIANGLE, {tri6.begin(), tri6.begin() + 3}},
          {VTK_QUAD, {quad9.begin(), quad9.begin() + 4}},
          {VTK_QUADRATIC_TRIANGLE, tri6},
          {VTK_QUADRATIC_QUAD, {quad9.begin(), quad9.begin() + 8}},
          {VTK_BIQUADRATIC_QUAD, quad9},
          {VTK_LAGRANGE_TRIANGLE, tri6},
          {VTK_LAGRANGE_QUADRILATERAL, quad9}};
}

Vec3 on_plane(double u, double v) { return {u, v, 0.5 * u + 0.25 * v}; }

vtkSmartPointer<vtkUnstructuredGrid> one_cell(const CellCase &c) {
  auto grid = vtkSmartPointer<vtkUnstructuredGrid>::New();
  vtkNew<vtkPoints> points;
  vtkNew<vtkIdList> ids;
  for (const auto &uv : c.nodes) {
    const Vec3 x = on_plane(uv[0], uv[1]);
    ids->InsertNextId(points->InsertNextPoint(x.data()));
  }
  grid->SetPoints(points);
  grid->InsertNextCell(c.type, ids);
  return grid;
}

TEST(ShellCell, NormalFollowsNodeOrderByRightHandRule) {
  // Plane z = 0.5u + 0.25v has normal (-0.5, -0.25, 1) / |.|; counter-clockwise
  // in (u, v) points it up [D].
  const Vec3 expected = Vec3(-0.5, -0.25, 1.0).normalized();
  for (const CellCase &c : cases()) {
    const Vec3 n = shell_cell_normal(one_cell(c), 0);
    EXPECT_CLOSE((n - expected).norm(), 0.0, 1e-9) << "VTK type " << c.type;
  }
}

TEST(ShellCell, LocatesPointAndWeightsReproduceLinearField) {
  // Shape functions reproduce any linear field exactly (partition of unity and
  // linear completeness) [D].
  for (const CellCase &c : cases()) {
    auto grid = one_cell(c);
    const Vec3 target = on_plane(1.0, 0.8);
    double outside = -1.0;
    const Host host = locate_in_shell_cell(grid, 0, target, &outside);
    EXPECT_CLOSE(outside, 0.0, 1e-12) << "VTK type " << c.type;
    EXPECT_CLOSE(host.distance, 0.0, 1e-9);
    double sum = 0.0, field = 0.0;
    for (std::size_t i = 0; i < host.points.size(); ++i) {
      const auto &uv = c.nodes[static_cast<std::size_t>(host.points[i])];
      sum += host.weights[i];
      field += host.weights[i] * (3.0 + 2.0 * uv[0] - 5.0 * uv[1]);
    }
    EXPECT_CLOSE(sum, 1.0, 1e-12);
    EXPECT_CLOSE(field, 3.0 + 2.0 * 1.0 - 5.0 * 0.8, 1e-10)
        << "VTK type " << c.type;
  }
}

TEST(ShellCell, PointOffTheMidSurfaceProjectsOntoIt) {
  const CellCase c = cases()[3]; // 8-node quadrilateral
  const Vec3 n = Vec3(-0.5, -0.25, 1.0).normalized();
  const Host host =
      locate_in_shell_cell(one_cell(c), 0, on_plane(2.0, 1.0) + 0.7 * n);
  EXPECT_CLOSE(host.distance, 0.7, 1e-10); // the offset along the normal [D]
}

TEST(ShellCell, PointOutsideTheCellSaysHowFar) {
  const CellCase c =
      cases()[1]; // 4-node quadrilateral, u in [0, 4] -> r = u / 4
  double outside = 0.0;
  const Host host =
      locate_in_shell_cell(one_cell(c), 0, on_plane(5.0, 1.5), &outside);
  EXPECT_CLOSE(outside, 0.25, 1e-9); // r = 5/4 lies 0.25 beyond r = 1 [D]
  EXPECT_CLOSE(host.pcoords[0], 1.0, 1e-9);
}

TEST(ShellCell, KnowsWhichTypesAreShells) {
  EXPECT_TRUE(is_shell_cell(VTK_QUADRATIC_QUAD, 8));
  EXPECT_TRUE(is_shell_cell(VTK_LAGRANGE_QUADRILATERAL, 9));
  EXPECT_FALSE(is_shell_cell(VTK_LAGRANGE_QUADRILATERAL, 16)); // order 3
  EXPECT_FALSE(is_shell_cell(VTK_PIXEL, 4));
  EXPECT_FALSE(is_shell_cell(VTK_TETRA, 4));
}

} // namespace
} // namespace toehold
