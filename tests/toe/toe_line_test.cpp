#include "toehold/common/error.hpp"
#include "toehold/model/surface.hpp"
#include "toehold/toe/toe_line.hpp"
#include "support/grid.hpp"
#include "support/support.hpp"

#include <cmath>

namespace toehold {
namespace {

using test::GridCell;
using test::GridSpec;

// Point ids of the grid whose position satisfies `pick`.
template <class Pick>
std::vector<long long> nodes_where(vtkUnstructuredGrid* grid, Pick pick) {
  std::vector<long long> ids;
  for (vtkIdType p = 0; p < grid->GetNumberOfPoints(); ++p)
    if (pick(test::grid_point(grid, p))) ids.push_back(p);
  return ids;
}

struct Plate {
  Mesh mesh;
  Surface surface;
  explicit Plate(GridCell cell)
      : mesh(test::mesh_of(test::make_box_grid(GridSpec{40, 40, 8, 8, 8, 2, cell}))), surface(mesh) {}
};

bool near(double a, double b) { return std::abs(a - b) < 1e-9; }

TEST(ToeLine, MarkedNodesChainIntoAnOrderedOpenLine) {
  for (GridCell cell : {GridCell::hex8, GridCell::tet4, GridCell::tet10, GridCell::hex20}) {
    Plate plate(cell);
    auto nodes = nodes_where(plate.mesh.grid(), [](const Vec3& x) { return near(x.z(), 8) && near(x.y(), 20); });
    std::reverse(nodes.begin(), nodes.end());
    const ToeLine line = chain_marker_nodes(plate.surface, nodes, "toe 1");
    EXPECT_FALSE(line.closed);
    EXPECT_EQ(line.points.size(), nodes.size());
    EXPECT_CLOSE(line.length(), 40.0, 1e-12);
    for (std::size_t i = 1; i < line.points.size(); ++i)  // monotonic along x: ordered, no short cuts
      EXPECT_GT(std::abs(line.points[i].x() - line.points[0].x()), std::abs(line.points[i - 1].x() - line.points[0].x()));
  }
}

TEST(ToeLine, RingOfNodesChainsIntoAClosedLoop) {
  for (GridCell cell : {GridCell::hex8, GridCell::tet4}) {
    Plate plate(cell);
    // The boundary of the square patch 10..30 x 10..30 on the top face.
    auto on_ring = [](const Vec3& x) {
      const bool inside = x.x() > 9.9 && x.x() < 30.1 && x.y() > 9.9 && x.y() < 30.1;
      const bool edge = near(x.x(), 10) || near(x.x(), 30) || near(x.y(), 10) || near(x.y(), 30);
      return near(x.z(), 8) && inside && edge;
    };
    const ToeLine line = chain_marker_nodes(plate.surface, nodes_where(plate.mesh.grid(), on_ring), "toe 1");
    EXPECT_TRUE(line.closed);
    EXPECT_CLOSE(line.length(), 80.0, 1e-12);
  }
}

TEST(ToeLine, BranchingMarkerIsAnErrorNamingTheNode) {
  Plate plate(GridCell::hex8);
  auto tee = [](const Vec3& x) { return near(x.z(), 8) && (near(x.y(), 20) || (near(x.x(), 20) && x.y() > 19)); };
  try {
    chain_marker_nodes(plate.surface, nodes_where(plate.mesh.grid(), tee), "toe 3 (point array 'toe' = 3)");
    FAIL();
  } catch (const Error& e) {
    EXPECT_NE(std::string(e.what()).find("toe 3 (point array 'toe' = 3): the toe branches at node "), std::string::npos)
        << e.what();
    EXPECT_NE(std::string(e.what()).find("at (20, 20, 8) mm (3 neighbouring toe nodes); give each branch its own "
                                         "marker value"),
              std::string::npos)
        << e.what();
  }
}

TEST(ToeLine, InteriorNodeIsNotOnTheSurface) {
  Plate plate(GridCell::hex8);
  auto nodes = nodes_where(plate.mesh.grid(), [](const Vec3& x) { return near(x.z(), 4) && near(x.y(), 20); });
  try {
    chain_marker_nodes(plate.surface, nodes, "toe 1");
    FAIL();
  } catch (const Error& e) {
    EXPECT_NE(std::string(e.what()).find(") mm is not on the model surface; mark only nodes on the plate surface"),
              std::string::npos)
        << e.what();
  }
}

TEST(ToeLine, TwoSeparateLinesAreAnError) {
  Plate plate(GridCell::hex8);
  auto two = [](const Vec3& x) { return near(x.z(), 8) && (near(x.y(), 10) || near(x.y(), 30)) && x.x() < 21; };
  EXPECT_THROW(chain_marker_nodes(plate.surface, nodes_where(plate.mesh.grid(), two), "toe 1"), Error);
  EXPECT_THROW(chain_marker_nodes(plate.surface, {5}, "toe 1"), Error);
}

TEST(ToeLine, CoordinatesSnapOntoTheSurface) {
  Plate plate(GridCell::tet4);
  const ToeLine line = snap_toe_points(plate.surface, {Vec3(5, 20, 8.3), Vec3(35, 20, 7.9)}, false, 1.0, "toe 'a'");
  EXPECT_CLOSE(line.points[0].z(), 8.0, 1e-12);
  EXPECT_CLOSE(line.points[1].z(), 8.0, 1e-12);
  try {
    snap_toe_points(plate.surface, {Vec3(0, 20, 8), Vec3(40, 20, 12)}, false, 1.0, "toe 'a'");
    FAIL();
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()),
              "toe 'a': point 2 (40, 20, 12) mm is 4 mm from the model surface (allowed 1 mm); check the coordinates "
              "and the model's length unit");
  }
}

}  // namespace
}  // namespace toehold
