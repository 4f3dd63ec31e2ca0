// Cells near seed points, and the surface and locator built on them: the same cells as a brute-force test of
// every cell's box, the same facets as the whole surface within reach, the same hosts as the whole locator.
#include "toehold/common/error.hpp"
#include "toehold/model/locator.hpp"
#include "toehold/model/near_cells.hpp"
#include "toehold/model/surface.hpp"

#include "support/grid.hpp"
#include "support/support.hpp"

#include <vtkUnstructuredGrid.h>

#include <cmath>
#include <random>

namespace toehold {
namespace {

using test::GridCell;

// A 60 x 40 x 10 mm plate, 12 x 8 x 2 bricks of 5 x 5 x 5 mm.
Mesh plate(GridCell cell, double jitter = 0.1) {
  test::GridSpec spec;
  spec.lx = 60.0;
  spec.ly = 40.0;
  spec.lz = 10.0;
  spec.nx = 12;
  spec.ny = 8;
  spec.nz = 2;
  spec.cell = cell;
  spec.jitter = jitter;
  spec.curve = cell == GridCell::hex8 || cell == GridCell::tet4 ? 0.0 : 0.1;
  return test::mesh_of(test::make_box_grid(spec));
}

// A toe-like row of seeds along y = 20 on the top face.
std::vector<Seed> row_of_seeds(double reach) {
  std::vector<Seed> seeds;
  for (int i = 0; i <= 12; ++i) seeds.push_back({Vec3(5.0 * i, 20.0, 10.0), reach});
  return seeds;
}

Box box_of(vtkUnstructuredGrid* grid, vtkIdType cell) {
  double b[6];
  grid->GetCellBounds(cell, b);
  return {b[0], b[1], b[2], b[3], b[4], b[5]};
}

// Distance from x to box b, written out: the gaps along each axis (zero inside), then Pythagoras.
double box_distance(const Vec3& x, const Box& b) {
  double d2 = 0.0;
  for (int a = 0; a < 3; ++a) {
    const double gap = std::max({b[2 * a] - x[a], x[a] - b[2 * a + 1], 0.0});
    d2 += gap * gap;
  }
  return std::sqrt(d2);
}

TEST(NearCells, SelectsTheCellsWhoseBoxComesWithinReach) {
  for (GridCell cell : {GridCell::hex8, GridCell::tet10}) {
    const Mesh mesh = plate(cell);
    const std::vector<Seed> seeds = row_of_seeds(7.0);
    const NearCells near(mesh, seeds);
    std::vector<long long> expected;  // brute force over every cell and every seed
    for (vtkIdType c = 0; c < mesh.grid()->GetNumberOfCells(); ++c) {
      const Box b = box_of(mesh.grid(), c);
      for (const Seed& s : seeds)
        if (box_distance(s.x, b) <= s.reach) {
          expected.push_back(c);
          break;
        }
    }
    EXPECT_EQ(near.cells(), expected) << test::to_string(cell);
    EXPECT_GT(expected.size(), 0u);
    EXPECT_LT(expected.size(), static_cast<std::size_t>(mesh.grid()->GetNumberOfCells()));
  }
}

TEST(NearCells, EachSeedHasItsOwnReach) {
  const Mesh mesh = plate(GridCell::hex8);
  // One seed at a brick corner with a reach too short to reach past the eight bricks around it [D].
  const NearCells one(mesh, {{Vec3(30.0, 20.0, 10.0), 1.0}});
  EXPECT_EQ(one.cells().size(), 4u);  // on the top face: four bricks share the corner
  const NearCells two(mesh, {{Vec3(30.0, 20.0, 10.0), 1.0}, {Vec3(0.0, 0.0, 0.0), 1.0}});
  EXPECT_EQ(two.cells().size(), 5u);  // and the corner brick of the box
}

TEST(NearCells, RefusesNoSeedsAndBadReach) {
  const Mesh mesh = plate(GridCell::hex8);
  EXPECT_EQ(test::error_of([&] { NearCells(mesh, {}); }),
            "cells near the toes of 'test grid': no seed points were given");
  EXPECT_EQ(test::error_of([&] { NearCells(mesh, {{Vec3::Zero(), 0.0}}); }),
            "cells near the toes of 'test grid': a seed point has no finite position or reach");
}

TEST(NearCells, LargestCellSizeAtPoints) {
  // Undistorted bricks of 5 x 5 x 5 mm: diagonal 5 sqrt(3) mm [D].
  const Mesh mesh = plate(GridCell::hex8, 0.0);
  const std::vector<double> size = largest_cell_size_at(mesh, {0});
  ASSERT_EQ(size.size(), 1u);
  EXPECT_CLOSE(size[0], 5.0 * std::sqrt(3.0), 1e-12);
}

bool same_facet(const Facet& a, const Facet& b) {
  return a.points == b.points && a.owner == b.owner && a.normal == b.normal;
}

TEST(NearCells, SurfaceKeepsExactlyTheWholeSurfaceFacetsWithinReach) {
  for (GridCell cell : {GridCell::hex8, GridCell::hex20, GridCell::tet10, GridCell::wedge15}) {
    const Mesh mesh = plate(cell);
    const NearCells near(mesh, row_of_seeds(8.0));
    const Surface whole(mesh), part(mesh, &near);
    std::vector<Facet> expected;
    for (const Facet& f : whole.facets()) {
      Box b = kEmptyBox;
      for (int k = 0; k < f.corner_count(); ++k) grow(b, whole.point(f.points[k]).data());
      if (near.near(b)) expected.push_back(f);
    }
    ASSERT_EQ(part.facets().size(), expected.size()) << test::to_string(cell);
    for (std::size_t i = 0; i < expected.size(); ++i)
      EXPECT_TRUE(same_facet(part.facets()[i], expected[i])) << test::to_string(cell) << " facet " << i;
    EXPECT_LT(part.facets().size(), whole.facets().size());
  }
}

TEST(NearCells, LocatorFindsTheSameHostsWithinReach) {
  for (GridCell cell : {GridCell::hex8, GridCell::tet10}) {
    const Mesh mesh = plate(cell);
    const NearCells near(mesh, row_of_seeds(8.0));
    const Locator whole(mesh), part(mesh, &near);
    std::mt19937 random(7);
    std::uniform_real_distribution<double> along(0.0, 60.0), across(-7.5, 7.5), depth(0.0, 10.0);
    for (int i = 0; i < 200; ++i) {
      const Vec3 x(along(random), 20.0 + across(random), depth(random));
      const auto a = whole.locate(x, 0.1), b = part.locate(x, 0.1);
      ASSERT_TRUE(a && b) << "point " << i;
      EXPECT_EQ(a->cell, b->cell);
      EXPECT_EQ(a->points, b->points);
      EXPECT_EQ(a->weights, b->weights);
    }
    // Far from every seed the part locator has no cell; the whole one has.
    EXPECT_TRUE(whole.locate(Vec3(30.0, 1.0, 5.0), 0.1));
    EXPECT_FALSE(part.locate(Vec3(30.0, 1.0, 5.0), 0.1));
  }
}

}  // namespace
}  // namespace toehold
