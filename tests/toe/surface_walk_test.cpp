#include "toehold/model/surface.hpp"
#include "toehold/toe/surface_walk.hpp"
#include "support/grid.hpp"
#include "support/support.hpp"

#include <vtkPoints.h>

#include <cmath>

namespace toehold {
namespace {

using test::GridCell;
using test::GridSpec;

constexpr double kPi = 3.14159265358979323846;

// Facet of `surface` that contains x with the largest normal component along `up`.
int facet_at(const Surface& surface, const Vec3& x, const Vec3& up) {
  const int best = surface.closest(x).facet;
  return best >= 0 && surface.facets()[static_cast<std::size_t>(best)].normal.dot(up) > 0.5 ? best : -1;
}

TEST(SurfaceWalk, FlatPlatePointsSitAtTheirDistances) {
  const Mesh mesh = test::mesh_of(test::make_box_grid(GridSpec{60, 60, 10, 12, 12, 2, GridCell::tet4}));
  const Surface surface(mesh);
  const Vec3 start(31.0, 20.0, 10.0);
  const int facet = facet_at(surface, start, Vec3::UnitZ());
  ASSERT_GE(facet, 0);
  const Vec3 direction = Vec3(1, 1, 0).normalized();
  const Walk walk = walk_surface(surface, WeldSide{}, facet, start, direction, {4.0, 10.0, 14.0});
  ASSERT_TRUE(walk.stop_reason.empty()) << walk.stop_reason;
  ASSERT_EQ(walk.targets.size(), 3u);
  for (const auto& t : walk.targets) {
    EXPECT_CLOSE((t.x - start).norm(), t.distance, 1e-12);
    EXPECT_CLOSE((t.x - start).normalized().dot(direction), 1.0, 1e-12);
    EXPECT_CLOSE(t.x.z(), 10.0, 1e-12);
  }
}

TEST(SurfaceWalk, StopsAtThePlateEdgeAndSaysWhere) {
  const Mesh mesh = test::mesh_of(test::make_box_grid(GridSpec{60, 60, 10, 12, 12, 2, GridCell::hex8}));
  const Surface surface(mesh);
  const Vec3 start(30.0, 50.0, 10.0);
  const int facet = facet_at(surface, start + Vec3(0, 1, 0), Vec3::UnitZ());
  const Walk walk = walk_surface(surface, WeldSide{}, facet, start, Vec3::UnitY(), {4.0, 8.0, 12.0});
  EXPECT_EQ(walk.targets.size(), 2u);
  EXPECT_EQ(walk.stop_reason,
            "the read-out path reaches a plate edge 10 mm from the toe (the surface turns by 90 degrees)");
}

// A tube of mean radius 100 mm: a box grid bent around the z axis (x -> angle, z -> radius, y -> axis).
Mesh tube(GridCell cell, double outer_radius) {
  auto grid = test::make_box_grid(GridSpec{100, 40, 10, 40, 8, 2, cell});
  vtkPoints* points = grid->GetPoints();
  for (vtkIdType p = 0; p < points->GetNumberOfPoints(); ++p) {
    double x[3];
    points->GetPoint(p, x);
    const double r = outer_radius - 10.0 + x[2], angle = x[0] / outer_radius;
    points->SetPoint(p, r * std::cos(angle), r * std::sin(angle), x[1]);
  }
  return test::mesh_of(grid);
}

TEST(SurfaceWalk, PointsWalkAlongCurvedSurface) {
  // 40 facets over 1 rad on the outer surface (R = 100 mm): a read-out path round the tube must keep to the
  // surface, and its length along the facets equals the arc length within the chord error of a 1.43 degree facet
  // (1 - sin(a/2)/(a/2) = 2.6e-5, derived).
  const double radius = 100.0;
  const Mesh mesh = tube(GridCell::hex20, radius);
  const Surface surface(mesh);
  const Vec3 start(radius, 0.0, 20.0);  // angle 0, outer surface, mid-length
  const int facet = facet_at(surface, start + Vec3(0.5, 0.5, 0), Vec3::UnitX());
  ASSERT_GE(facet, 0);
  const Walk walk = walk_surface(surface, WeldSide{}, facet, start, Vec3::UnitY(), {12.0, 30.0, 60.0});
  ASSERT_TRUE(walk.stop_reason.empty()) << walk.stop_reason;
  ASSERT_EQ(walk.targets.size(), 3u);
  for (const auto& t : walk.targets) {
    const double r = std::hypot(t.x.x(), t.x.y());
    EXPECT_LT(radius - r, radius * (1 - std::cos(0.5 / 40.0 * 1.0)) + 1e-9);  // within the facet sagitta
    EXPECT_CLOSE(t.x.z(), 20.0, 1e-9);  // stays at the same axial position
    const double arc = radius * std::atan2(t.x.y(), t.x.x());
    EXPECT_NEAR(arc, t.distance, 3e-5 * t.distance);
  }
}

}  // namespace
}  // namespace toehold
