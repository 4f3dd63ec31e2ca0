// Outer surface of box meshes of every cell kind: facet counts, outward normals, owners, facets through the
// mid-edge nodes, a closed orientable surface, edge neighbours and closest points.
#include "toehold/common/error.hpp"
#include "toehold/model/surface.hpp"

#include "support/grid.hpp"
#include "support/support.hpp"

#include <vtkIdList.h>
#include <vtkNew.h>
#include <vtkPoints.h>
#include <vtkUnstructuredGrid.h>

#include <Eigen/Geometry>
#include <algorithm>
#include <set>

namespace toehold {
namespace {

using test::GridCell;

const Vec3 kBox(20.0, 30.0, 10.0);  // mm, 2 x 3 x 1 bricks of 10 mm

struct Expected {
  GridCell cell;
  int triangles;  // facets with three corners
  int quads;      // facets with four corners
};

// Hand count [D]: the box has 2*2*3 + 2*3*1 + 2*2*1 = 22 brick faces on its outside. hex8: one quad each;
// hex20: quad8 -> 4 triangles + 1 quad; hex27: quad9 -> 4 quads; tets: 2 triangles per brick face, tri6 -> 4
// triangles; wedges: 12 top/bottom brick faces give 2 triangles each, 10 side faces one quad each.
const Expected kExpected[] = {
    {GridCell::hex8, 0, 22},           {GridCell::hex20, 88, 22},         {GridCell::hex27, 0, 88},
    {GridCell::tet4, 44, 0},           {GridCell::tet10, 176, 0},         {GridCell::wedge6, 24, 10},
    {GridCell::wedge15, 96 + 40, 10},  {GridCell::lagrange_tet10, 176, 0}, {GridCell::lagrange_hex27, 0, 88},
};

vtkSmartPointer<vtkUnstructuredGrid> box(GridCell cell, double jitter = 0.1, double curve = 0.1) {
  test::GridSpec spec;
  spec.lx = kBox.x();
  spec.ly = kBox.y();
  spec.lz = kBox.z();
  spec.nx = 2;
  spec.ny = 3;
  spec.nz = 1;
  spec.cell = cell;
  spec.jitter = jitter;
  spec.curve = curve;
  return test::make_box_grid(spec);
}

bool on_boundary(const Vec3& x) {
  for (int a = 0; a < 3; ++a)
    if (std::abs(x[a]) < 1e-9 || std::abs(x[a] - kBox[a]) < 1e-9) return true;
  return false;
}

// The outward unit normal of the box face all of `points` lie on (zero when they share none).
Vec3 box_face_normal(const std::vector<Vec3>& points) {
  for (int a = 0; a < 3; ++a)
    for (double side : {0.0, 1.0}) {
      const bool all = std::all_of(points.begin(), points.end(),
                                   [&](const Vec3& x) { return std::abs(x[a] - side * kBox[a]) < 1e-9; });
      if (all) return (side > 0 ? 1.0 : -1.0) * Vec3::Unit(a);
    }
  return Vec3::Zero();
}

std::vector<Vec3> corners_of(const Surface& surface, const Facet& f) {
  std::vector<Vec3> out;
  for (int k = 0; k < f.corner_count(); ++k) out.push_back(surface.point(f.points[k]));
  return out;
}

double facet_area(const std::vector<Vec3>& x) {
  Vec3 n = Vec3::Zero();
  for (std::size_t i = 0; i < x.size(); ++i) n += x[i].cross(x[(i + 1) % x.size()]);
  return 0.5 * n.norm();
}

class BoxSurface : public ::testing::TestWithParam<Expected> {};

TEST_P(BoxSurface, HasTheHandCountedFacets) {
  auto grid = box(GetParam().cell);
  const Mesh mesh = test::mesh_of(grid);
  const Surface surface(mesh);
  int triangles = 0, quads = 0;
  for (const Facet& f : surface.facets()) (f.corner_count() == 3 ? triangles : quads)++;
  EXPECT_EQ(triangles, GetParam().triangles);
  EXPECT_EQ(quads, GetParam().quads);
}

// Every facet lies on a box face, its stored normal is that face's outward normal, its winding gives the same
// normal, and its owner cell holds all its points and lies on the inner side.
TEST_P(BoxSurface, NormalsPointOutOfTheOwnerCell) {
  auto grid = box(GetParam().cell);
  const Mesh mesh = test::mesh_of(grid);
  const Surface surface(mesh);
  for (const Facet& f : surface.facets()) {
    const std::vector<Vec3> x = corners_of(surface, f);
    const Vec3 outward = box_face_normal(x);
    ASSERT_EQ(outward.norm(), 1.0) << "facet off the box faces";
    for (int a = 0; a < 3; ++a) EXPECT_CLOSE(f.normal[a], outward[a], 1e-12);
    const Vec3 wound = (x[1] - x[0]).cross(x[2] - x[0]);
    EXPECT_GT(wound.dot(outward), 0.0);
    vtkNew<vtkIdList> ids;
    grid->GetCellPoints(f.owner, ids);
    for (int k = 0; k < f.corner_count(); ++k) EXPECT_GE(ids->IsId(f.points[k]), 0);
    EXPECT_GT((x[0] - test::cell_centroid(grid, f.owner)).dot(outward), 0.0);
  }
}

// The facets pass through every mesh node on the box boundary (mid-edge and face-centre nodes included) and
// through no other node; their areas add up to the box's 2*(20*30 + 30*10 + 10*20) = 2200 mm^2 [D].
TEST_P(BoxSurface, FacetsGoThroughEverySurfaceNode) {
  auto grid = box(GetParam().cell);
  const Mesh mesh = test::mesh_of(grid);
  const Surface surface(mesh);
  std::set<long long> expected, used;
  for (vtkIdType p = 0; p < grid->GetNumberOfPoints(); ++p)
    if (on_boundary(test::grid_point(grid, p))) expected.insert(p);
  double area = 0.0;
  for (const Facet& f : surface.facets()) {
    for (int k = 0; k < f.corner_count(); ++k) used.insert(f.points[k]);
    area += facet_area(corners_of(surface, f));
  }
  EXPECT_EQ(used, expected);
  EXPECT_CLOSE(area, 2200.0, 1e-12);
  for (long long p : expected) EXPECT_TRUE(surface.on_surface(p));
}

// A closed, consistently oriented surface: each facet edge has exactly two facets, and the neighbour across it
// runs the edge the other way.
TEST_P(BoxSurface, IsClosedAndConsistentlyOriented) {
  auto grid = box(GetParam().cell);
  const Mesh mesh = test::mesh_of(grid);
  const Surface surface(mesh);
  for (int i = 0; i < static_cast<int>(surface.facets().size()); ++i) {
    const Facet& f = surface.facets()[static_cast<std::size_t>(i)];
    for (int k = 0; k < f.corner_count(); ++k) {
      const long long a = f.points[k], b = f.points[(k + 1) % f.corner_count()];
      EXPECT_EQ(surface.facets_on_edge(a, b).size(), 2u);
      const int other = surface.neighbour(i, a, b);
      ASSERT_GE(other, 0);
      const Facet& g = surface.facets()[static_cast<std::size_t>(other)];
      bool reversed = false;
      for (int m = 0; m < g.corner_count(); ++m)
        reversed = reversed || (g.points[m] == b && g.points[(m + 1) % g.corner_count()] == a);
      EXPECT_TRUE(reversed);
    }
  }
}

// Rotating and shifting the model rotates the normals and keeps the facets (property test).
TEST_P(BoxSurface, RigidMotionRotatesNormals) {
  auto grid = box(GetParam().cell);
  const Mesh mesh = test::mesh_of(grid);
  const Surface before(mesh);
  auto moved = box(GetParam().cell);
  const Eigen::Matrix3d r = Eigen::AngleAxisd(1.1, Vec3(0.3, -1.0, 0.5).normalized()).toRotationMatrix();
  test::move_grid(moved, r, Vec3(-40.0, 7.0, 300.0));
  const Mesh moved_mesh = test::mesh_of(moved);
  const Surface after(moved_mesh);
  ASSERT_EQ(after.facets().size(), before.facets().size());
  for (std::size_t i = 0; i < after.facets().size(); ++i) {
    EXPECT_EQ(after.facets()[i].points, before.facets()[i].points);
    EXPECT_EQ(after.facets()[i].owner, before.facets()[i].owner);
    const Vec3 expected = r * before.facets()[i].normal;
    for (int a = 0; a < 3; ++a) EXPECT_CLOSE(after.facets()[i].normal[a], expected[a], 1e-12);
  }
}

INSTANTIATE_TEST_SUITE_P(Surface, BoxSurface, ::testing::ValuesIn(kExpected),
                         [](const auto& param_info) { return test::to_string(param_info.param.cell); });

long long point_at(vtkUnstructuredGrid* grid, const Vec3& x) {
  for (vtkIdType p = 0; p < grid->GetNumberOfPoints(); ++p)
    if ((test::grid_point(grid, p) - x).norm() < 1e-9) return p;
  return -1;
}

// At the box corner (0,0,0) the surface edges run along the three box edges: to the next corner node on
// hexahedra, to the mid-edge node on quadratic hexahedra (hand reading of the brick layout [D]).
TEST(Surface, EdgeNeighboursOfABoxCorner) {
  for (auto [cell, step] : {std::pair{GridCell::hex8, 10.0}, std::pair{GridCell::hex20, 5.0}}) {
    auto grid = box(cell, 0.0, 0.0);
    const Mesh mesh = test::mesh_of(grid);
    const Surface surface(mesh);
    std::vector<long long> got = surface.edge_neighbours(point_at(grid, Vec3::Zero()));
    std::vector<long long> expected = {point_at(grid, Vec3(step, 0, 0)), point_at(grid, Vec3(0, step, 0)),
                                       point_at(grid, Vec3(0, 0, step))};
    std::sort(got.begin(), got.end());
    std::sort(expected.begin(), expected.end());
    EXPECT_EQ(got, expected) << test::to_string(cell);
  }
}

TEST(Surface, InteriorPointsHaveNoFacets) {
  auto grid = box(GridCell::hex27, 0.0, 0.0);
  const Mesh mesh = test::mesh_of(grid);
  const Surface surface(mesh);
  EXPECT_FALSE(surface.on_surface(point_at(grid, Vec3(5.0, 5.0, 5.0))));  // body-centre node of a brick
  EXPECT_TRUE(surface.on_surface(point_at(grid, Vec3(5.0, 5.0, 10.0))));  // face-centre node on the top
  EXPECT_TRUE(surface.facets_of_point(-1).empty());
  EXPECT_TRUE(surface.facets_of_point(grid->GetNumberOfPoints()).empty());
  EXPECT_EQ(surface.neighbour(0, -5, -6), -1);
}

// Closest points by hand: (25, 15, 5) is 5 mm outside the face x = 20, (19, 15, 5) 1 mm inside it [D].
TEST(Surface, ClosestPointOnTheBoxFace) {
  for (GridCell cell : {GridCell::hex8, GridCell::tet10, GridCell::hex27}) {
    auto grid = box(cell);
    const Mesh mesh = test::mesh_of(grid);
    const Surface surface(mesh);
    for (auto [x, d] : {std::pair{Vec3(25.0, 15.0, 5.0), 5.0}, std::pair{Vec3(19.0, 15.0, 5.0), 1.0}}) {
      const SurfaceHit hit = surface.closest(x);
      ASSERT_GE(hit.facet, 0);
      EXPECT_CLOSE(hit.distance, d, 1e-12);
      EXPECT_CLOSE(hit.x.x(), 20.0, 1e-12);
      EXPECT_CLOSE(hit.x.y(), 15.0, 1e-12);
      EXPECT_CLOSE(hit.x.z(), 5.0, 1e-12);
      EXPECT_CLOSE(surface.facets()[static_cast<std::size_t>(hit.facet)].normal.x(), 1.0, 1e-12);
    }
  }
}

TEST(Surface, LargeBoxHasTheHandCountedFacets) {
  test::GridSpec spec;
  spec.nx = spec.ny = spec.nz = 60;
  spec.cell = GridCell::tet4;
  auto grid = test::make_box_grid(spec);
  const Mesh mesh = test::mesh_of(grid);
  const Surface surface(mesh);
  EXPECT_EQ(surface.facets().size(), 6u * 60 * 60 * 2);  // 2 triangles per brick face [D]
}

// Element-nodal file: two 10 mm hex8 bricks side by side (x 0..10 and 10..20), each with its own 8 points, so the
// 4 points of the shared face x = 10 appear twice; one z = 0 corner is written as -0.0 in the second brick.
// Hand count [D]: 2 bricks have 10 outside faces (the shared face is inside); each repeated point stands for
// the lowest id at its place.
TEST(Surface, RepeatedNodesAreOnePointWithTheLowestId) {
  auto grid = vtkSmartPointer<vtkUnstructuredGrid>::New();
  vtkNew<vtkPoints> points;
  for (double x0 : {0.0, 10.0}) {
    const double zero = x0 > 0 ? -0.0 : 0.0;
    const double corner[8][3] = {{x0, 0, zero}, {x0 + 10, 0, 0}, {x0 + 10, 10, 0}, {x0, 10, 0},
                                 {x0, 0, 10},   {x0 + 10, 0, 10}, {x0 + 10, 10, 10}, {x0, 10, 10}};
    for (const auto& c : corner) points->InsertNextPoint(c);
  }
  grid->SetPoints(points);
  for (vtkIdType first : {0, 8}) {
    vtkIdType ids[8];
    for (vtkIdType k = 0; k < 8; ++k) ids[k] = first + k;
    grid->InsertNextCell(VTK_HEXAHEDRON, 8, ids);
  }
  const Mesh mesh = test::mesh_of(grid);
  const Surface surface(mesh);
  EXPECT_EQ(surface.facets().size(), 10u);
  EXPECT_EQ(surface.canonical(8), 1);   // (10, 0, -0.0) is (10, 0, 0), point 1
  EXPECT_EQ(surface.canonical(11), 2);  // (10, 10, 0)
  EXPECT_EQ(surface.canonical(12), 5);  // (10, 0, 10)
  EXPECT_EQ(surface.canonical(15), 6);  // (10, 10, 10)
  EXPECT_EQ(surface.canonical(9), 9);   // (20, 0, 0) appears once
  for (const Facet& f : surface.facets())
    for (int k = 0; k < f.corner_count(); ++k) EXPECT_NE(f.points[static_cast<std::size_t>(k)], 8);
  EXPECT_EQ(surface.facets_of_point(1).size(), 4u);  // bottom and front faces of both bricks
}

TEST(Surface, EmptyMeshIsRejected) {
  const Mesh mesh(vtkSmartPointer<vtkUnstructuredGrid>::New(), "empty.vtu", LengthUnit::mm);
  try {
    const Surface surface(mesh);
    FAIL() << "expected an Error";
  } catch (const Error& e) {
    EXPECT_STREQ("cannot find the surface of model 'empty.vtu': it has no volume cells; give a model with 3D cells",
                 e.what());
  }
}

}  // namespace
}  // namespace toehold
