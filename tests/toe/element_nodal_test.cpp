// Element-nodal results (a node repeated once per cell, as several solvers write unaveraged stresses): the surface
// and the toe treat coincident nodes as one, while each read-out value comes from its host cell's own copies.
#include "toehold/model/locator.hpp"
#include "toehold/model/surface.hpp"
#include "toehold/toe/toe_line.hpp"
#include "support/grid.hpp"
#include "support/support.hpp"

#include <vtkCellArray.h>
#include <vtkPoints.h>

namespace toehold {
namespace {

// Every cell of `grid` gets its own copy of each of its points.
vtkSmartPointer<vtkUnstructuredGrid> explode(vtkUnstructuredGrid* grid) {
  auto out = vtkSmartPointer<vtkUnstructuredGrid>::New();
  auto points = vtkSmartPointer<vtkPoints>::New();
  points->SetDataTypeToDouble();
  out->SetPoints(points);
  for (vtkIdType c = 0; c < grid->GetNumberOfCells(); ++c) {
    vtkIdType n = 0;
    const vtkIdType* pts = nullptr;
    grid->GetCellPoints(c, n, pts);
    std::vector<vtkIdType> copy;
    for (vtkIdType i = 0; i < n; ++i) copy.push_back(points->InsertNextPoint(grid->GetPoint(pts[i])));
    out->InsertNextCell(grid->GetCellType(c), n, copy.data());
  }
  return out;
}

TEST(ElementNodal, SurfaceAndToeTreatCoincidentNodesAsOne) {
  auto base = test::make_box_grid({40, 40, 8, 4, 4, 2, test::GridCell::hex8});
  const Mesh continuous = test::mesh_of(base);
  const Mesh exploded = test::mesh_of(explode(base));
  EXPECT_EQ(exploded.grid()->GetNumberOfPoints(), 8 * 32);
  EXPECT_EQ(Surface(exploded).facets().size(), Surface(continuous).facets().size());
  const Surface surface(exploded);
  std::vector<long long> marked;  // every copy of the top-face nodes on y = 20
  for (vtkIdType p = 0; p < exploded.grid()->GetNumberOfPoints(); ++p) {
    const Vec3 x = test::grid_point(exploded.grid(), p);
    if (std::abs(x.z() - 8) < 1e-9 && std::abs(x.y() - 20) < 1e-9) marked.push_back(p);
  }
  EXPECT_GT(marked.size(), 5u);
  const ToeLine line = chain_marker_nodes(surface, marked, "toe 1");
  EXPECT_EQ(line.points.size(), 5u);
  EXPECT_CLOSE(line.length(), 40.0, 1e-12);
}

TEST(ElementNodal, ReadoutValueComesFromTheHostCellOnly) {
  // Cells with y < 20 (the weld) carry 1000 MPa at their nodes, the plate cells 100 MPa: at a point on the shared
  // face the plate cell's own copies give 100 MPa when the weld cells are refused.
  auto grid = explode(test::make_box_grid({40, 40, 8, 4, 4, 2, test::GridCell::hex8}));
  std::vector<int> region;
  for (vtkIdType c = 0; c < grid->GetNumberOfCells(); ++c) region.push_back(test::cell_centroid(grid, c).y() < 20 ? 3 : 1);
  std::vector<double> voigt(static_cast<std::size_t>(6 * grid->GetNumberOfPoints()), 0.0);
  for (vtkIdType c = 0; c < grid->GetNumberOfCells(); ++c) {
    vtkIdType n = 0;
    const vtkIdType* pts = nullptr;
    grid->GetCellPoints(c, n, pts);
    for (vtkIdType i = 0; i < n; ++i) voigt[static_cast<std::size_t>(6 * pts[i] + 1)] = region[c] == 3 ? 1000.0 : 100.0;
  }
  const Mesh mesh = test::mesh_of(grid);
  const StressField field(Association::point, voigt);
  const Locator locator(mesh);
  const auto host = locator.locate(Vec3(15, 20, 8), 0.1, [&](long long c) { return region[static_cast<std::size_t>(c)] == 3; });
  ASSERT_TRUE(host);
  EXPECT_CLOSE(interpolate(field, *host)(1, 1), 100.0, 1e-12);
}

}  // namespace
}  // namespace toehold
