#include "toehold/hotspot/linearization.hpp"
#include "toehold/toe/thickness_line.hpp"
#include "support/grid.hpp"
#include "support/support.hpp"

namespace toehold {
namespace {

using test::GridCell;

Mesh plate(GridCell cell) { return test::mesh_of(test::make_box_grid({60, 60, 10, 6, 6, 4, cell})); }

TEST(ThicknessLine, LocatesEveryDepthThroughThePlate) {
  const Mesh mesh = plate(GridCell::hex20);
  const Locator locator(mesh);
  const auto depths = linearization_stations(10.0, 9);
  const ThicknessLine line = place_thickness_line(locator, WeldSide{}, Vec3(30, 30, 10), Vec3::UnitZ(), 10.0, depths, 0.1);
  EXPECT_TRUE(line.problem.empty()) << line.problem;
  EXPECT_TRUE(line.note.empty()) << line.note;
  EXPECT_EQ(line.hosts.size(), depths.size());
}

TEST(ThicknessLine, SaysWhereItLeavesTheModelOrEntersTheWeld) {
  const Mesh mesh = plate(GridCell::hex8);
  const Locator locator(mesh);
  const std::vector<double> depths{0.0, 6.0, 12.0};
  EXPECT_EQ(place_thickness_line(locator, WeldSide{}, Vec3(30, 30, 10), Vec3::UnitZ(), 12.0, depths, 0.1).problem,
            "the through-thickness line leaves the model at 12 mm below the surface");
  WeldSide weld;
  weld.weld_values = {3};
  for (vtkIdType c = 0; c < mesh.grid()->GetNumberOfCells(); ++c)
    weld.cell_region.push_back(test::cell_centroid(mesh.grid(), c).z() < 5 ? 3 : 1);
  EXPECT_EQ(place_thickness_line(locator, weld, Vec3(30, 30, 10), Vec3::UnitZ(), 10.0, {0.0, 2.0, 6.0}, 0.1).problem,
            "the through-thickness line enters the weld at 6 mm below the surface");
  const ThicknessLine short_line =
      place_thickness_line(locator, WeldSide{}, Vec3(30, 30, 10), Vec3::UnitZ(), 8.0, {0.0, 4.0, 8.0}, 0.1);
  EXPECT_EQ(short_line.note,
            "the model goes on beyond the plate thickness along the surface normal: check t");
}

// A plate in pure bending, s_yy = 120 (z - 5) / 5 MPa (top z = 10 at +120, bottom at -120), read at the located
// points with the cells' own shape functions and linearized (ASME BPVC VIII-2 Annex 5-A): membrane 0, bending
// +120 at the surface, peak 0 (derived). Quadratic hexes hold the linear field exactly.
TEST(ThicknessLine, PurePlateBendingLinearizesToMembraneZeroAndTheBendingStress) {
  auto grid = test::make_box_grid({60, 60, 10, 6, 6, 3, GridCell::hex20});
  test::add_point_stress(grid, "s", [](const Vec3& x) { return Voigt{0, 120.0 * (x.z() - 5.0) / 5.0, 0, 0, 0, 0}; });
  const Mesh mesh = test::mesh_of(grid);
  const StressField field = read_stress(mesh, StressSpec{"s", {}, ""}, StressUnit::MPa);
  const Locator locator(mesh);
  const auto depths = linearization_stations(10.0, 21, ThroughThicknessRule::simpson);
  const ThicknessLine line = place_thickness_line(locator, WeldSide{}, Vec3(31, 29, 10), Vec3::UnitZ(), 10.0, depths, 0.1);
  ASSERT_TRUE(line.problem.empty());
  std::vector<double> s;
  for (const Host& h : line.hosts) s.push_back(interpolate(field, h)(1, 1));
  const Linearized lin = linearize(depths, s, 10.0, ThroughThicknessRule::simpson);
  EXPECT_NEAR(lin.membrane, 0.0, 1e-9);
  EXPECT_CLOSE(lin.bending, 120.0, 1e-9);
  EXPECT_NEAR(lin.peak, 0.0, 1e-6);
  EXPECT_CLOSE(*lin.one_mm_below, 96.0, 1e-9);  // 120 (9 - 5) / 5
}

}  // namespace
}  // namespace toehold
