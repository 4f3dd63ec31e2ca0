// Point location and interpolation: Newton-refined parametric coordinates, exact reproduction of fields in the
// cells' interpolation spaces, the closest-cell fallback and concurrent use.
#include "toehold/common/error.hpp"
#include "toehold/model/locator.hpp"

#include "support/grid.hpp"
#include "support/support.hpp"

#include <Eigen/Geometry>
#include <vtkGenericCell.h>
#include <vtkNew.h>
#include <vtkStaticCellLocator.h>

#include <numeric>
#include <random>
#include <thread>

namespace toehold {
namespace {

using test::GridCell;
using test::GridSpec;

const Vec3 kBox(30.0, 20.0, 10.0);  // mm

GridSpec box_spec(GridCell cell, double jitter = 0.0, double curve = 0.0) {
  GridSpec spec;
  spec.lx = kBox.x();
  spec.ly = kBox.y();
  spec.lz = kBox.z();
  spec.nx = 3;
  spec.ny = 2;
  spec.nz = 2;
  spec.cell = cell;
  spec.jitter = jitter;
  spec.curve = curve;
  return spec;
}

Eigen::Matrix3d rotation() {
  return (Eigen::AngleAxisd(0.7, Vec3(1.0, 2.0, 3.0).normalized())).toRotationMatrix();
}
const Vec3 kShift(120.0, -45.0, 30.0);  // mm

// A complete quadratic polynomial in x (mm), different in every component (MPa).
Voigt quadratic_field(const Vec3& x) {
  const double a = x.x() / 10.0, b = x.y() / 10.0, c = x.z() / 10.0;
  return {100 + 20 * a - 5 * b + 3 * c + 4 * a * a - 2 * a * b + 1.5 * c * c,
          -40 + 7 * b + 2 * a * c - 3 * b * b,
          15 - 6 * c + a * b + 2.5 * b * c,
          8 * a - 3 * c * c + 0.5 * a * a,
          -12 + 4 * a * c - b * c,
          30 - 9 * a * b + 2 * b * b - c};
}

// A linear polynomial in x (mm), MPa.
Voigt linear_field(const Vec3& x) {
  return {100 + 2 * x.x() - 0.5 * x.y() + 0.3 * x.z(), -40 + 0.7 * x.y(), 15 - 0.6 * x.z(), 0.8 * x.x(),
          -12 + 0.4 * x.z() - 0.1 * x.y(), 30 - 0.9 * x.x()};
}

StressField point_field(vtkUnstructuredGrid* grid, const test::StressFunction& f) {
  std::vector<double> values;
  for (vtkIdType p = 0; p < grid->GetNumberOfPoints(); ++p)
    for (double v : f(test::grid_point(grid, p))) values.push_back(v);
  return {Association::point, std::move(values)};
}

// n points uniformly inside the unmoved box, moved by the rigid motion (rotation, shift).
std::vector<Vec3> random_points(int n, const Eigen::Matrix3d& r, const Vec3& shift, unsigned seed = 7) {
  std::mt19937 random(seed);
  std::uniform_real_distribution<double> unit(0.001, 0.999);
  std::vector<Vec3> out;
  for (int i = 0; i < n; ++i)
    out.push_back(r * Vec3(unit(random), unit(random), unit(random)).cwiseProduct(kBox) + shift);
  return out;
}

Vec3 mapped_position(vtkUnstructuredGrid* grid, const Host& host) {
  Vec3 x = Vec3::Zero();
  for (std::size_t i = 0; i < host.points.size(); ++i) x += host.weights[i] * test::grid_point(grid, host.points[i]);
  return x;
}

void expect_tensor(const Tensor& actual, const Voigt& expected, double tol) {
  const Voigt a = voigt_from_tensor(actual);
  for (std::size_t c = 0; c < 6; ++c) EXPECT_CLOSE(a[c], expected[c], tol) << "component " << c;
}

class QuadraticCells : public ::testing::TestWithParam<GridCell> {};

// Exact reproduction of a complete quadratic field by quadratic cells with an affine geometric map: the field
// lies in the interpolation space of tet10, wedge15, hex20 and hex27 (derived [D], isoparametric completeness).
// Tets are jittered (still affine per cell); hexes and wedges use the rotated, shifted regular box.
TEST_P(QuadraticCells, ReproduceQuadraticFieldExactly) {
  const GridCell kind = GetParam();
  const bool tets = kind == GridCell::tet10 || kind == GridCell::lagrange_tet10;
  auto grid = test::make_box_grid(box_spec(kind, tets ? 0.15 : 0.0));
  test::move_grid(grid, rotation(), kShift);
  const Mesh mesh = test::mesh_of(grid);
  const Locator locator(mesh);
  const StressField field = point_field(grid, quadratic_field);
  for (const Vec3& x : random_points(200, rotation(), kShift)) {
    const auto host = locator.locate(x, 0.0);
    ASSERT_TRUE(host) << x.transpose();
    EXPECT_EQ(host->distance, 0.0);
    expect_tensor(interpolate(field, *host), quadratic_field(x), 1e-10);
  }
}

// On curved quadratic cells (interior mid-edge nodes moved off the straight edge) the located parametric point
// maps back onto the query point to round-off, so a linear field (reproduced by any isoparametric cell, [D]) is
// exact; VTK's own FindCell/EvaluatePosition weights are measurably worse (VTK-NOTES: its Newton stops early).
TEST_P(QuadraticCells, NewtonRefinementBeatsVtkOnCurvedCells) {
  const GridCell kind = GetParam();
  auto grid = test::make_box_grid(box_spec(kind, 0.1, 0.12));
  const Mesh mesh = test::mesh_of(grid);
  const Locator locator(mesh);
  const StressField field = point_field(grid, linear_field);
  vtkNew<vtkStaticCellLocator> vtk_locator;
  vtk_locator->SetDataSet(grid);
  vtk_locator->BuildLocator();
  vtkNew<vtkGenericCell> cell;
  std::vector<double> weights(static_cast<std::size_t>(grid->GetMaxCellSize()));
  double ours = 0.0, theirs = 0.0;
  for (Vec3 x : random_points(300, Eigen::Matrix3d::Identity(), Vec3::Zero(), 11)) {
    const auto host = locator.locate(x, 1e-6);
    ASSERT_TRUE(host) << x.transpose();
    ours = std::max(ours, (mapped_position(grid, *host) - x).norm());
    expect_tensor(interpolate(field, *host), linear_field(x), 1e-10);
    double pc[3];
    const vtkIdType id = vtk_locator->FindCell(x.data(), 0.0, cell, pc, weights.data());
    if (id < 0) continue;
    Vec3 vtk_x = Vec3::Zero();
    for (vtkIdType i = 0; i < cell->GetNumberOfPoints(); ++i)
      vtk_x += weights[static_cast<std::size_t>(i)] * test::grid_point(grid, cell->GetPointId(static_cast<int>(i)));
    theirs = std::max(theirs, (vtk_x - x).norm());
  }
  EXPECT_LT(ours, 1e-12 * kBox.norm());
  EXPECT_GT(theirs, 100.0 * ours) << "VTK's own error " << theirs << " mm, ours " << ours << " mm";
}

INSTANTIATE_TEST_SUITE_P(Locator, QuadraticCells,
                         ::testing::Values(GridCell::tet10, GridCell::hex20, GridCell::hex27, GridCell::wedge15,
                                           GridCell::lagrange_tet10, GridCell::lagrange_hex27),
                         [](const auto& param_info) { return test::to_string(param_info.param); });

class LinearCells : public ::testing::TestWithParam<GridCell> {};

// Linear cells reproduce a linear field exactly, also on distorted (non-affine) hexahedra [D].
TEST_P(LinearCells, ReproduceLinearFieldOnDistortedCells) {
  auto grid = test::make_box_grid(box_spec(GetParam(), 0.2));
  test::move_grid(grid, rotation(), kShift);
  const Mesh mesh = test::mesh_of(grid);
  const Locator locator(mesh);
  const StressField field = point_field(grid, linear_field);
  for (const Vec3& x : random_points(200, rotation(), kShift)) {
    const auto host = locator.locate(x, 0.0);
    ASSERT_TRUE(host);
    EXPECT_CLOSE(std::accumulate(host->weights.begin(), host->weights.end(), 0.0), 1.0, 1e-13);
    expect_tensor(interpolate(field, *host), linear_field(x), 1e-10);
  }
}

INSTANTIATE_TEST_SUITE_P(Locator, LinearCells, ::testing::Values(GridCell::hex8, GridCell::tet4, GridCell::wedge6),
                         [](const auto& param_info) { return test::to_string(param_info.param); });

TEST(Locator, FiveTetSplitLocatesEverywhere) {
  GridSpec spec = box_spec(GridCell::tet10, 0.1);
  spec.tets = test::TetSplit::five;
  auto grid = test::make_box_grid(spec);
  const Mesh mesh = test::mesh_of(grid);
  const Locator locator(mesh);
  const StressField field = point_field(grid, quadratic_field);
  for (const Vec3& x : random_points(200, Eigen::Matrix3d::Identity(), Vec3::Zero(), 3)) {
    const auto host = locator.locate(x, 0.0);
    ASSERT_TRUE(host);
    expect_tensor(interpolate(field, *host), quadratic_field(x), 1e-10);
  }
}

// Round-off scales with the coordinates, not with the cell: 0.1 mm cells 2000 mm from the origin still hold every
// point inside the box (no spurious fall-back to "outside" with a zero tolerance).
TEST(Locator, FindsPointsInSmallCellsFarFromTheOrigin) {
  for (GridCell kind : {GridCell::hex8, GridCell::tet10}) {
    GridSpec spec;
    spec.lx = spec.ly = spec.lz = 1.0;
    spec.nx = spec.ny = spec.nz = 10;
    spec.cell = kind;
    spec.jitter = 0.1;
    auto grid = test::make_box_grid(spec);
    const Vec3 shift(1000.0, 2000.0, -500.0);
    test::move_grid(grid, Eigen::Matrix3d::Identity(), shift);
    const Mesh mesh = test::mesh_of(grid);
    const Locator locator(mesh);
    std::mt19937 random(2);
    std::uniform_real_distribution<double> unit(0.001, 0.999);
    for (int i = 0; i < 500; ++i) {
      const Vec3 x = shift + Vec3(unit(random), unit(random), unit(random));
      const auto host = locator.locate(x, 0.0);
      ASSERT_TRUE(host) << test::to_string(kind) << " " << x.transpose();
      EXPECT_EQ(host->distance, 0.0);
      EXPECT_LT((mapped_position(grid, *host) - x).norm(), 1e-11);
    }
  }
}

// A point 0.05 mm beyond the face x = 30 of the box: no cell holds it, the closest cell within the tolerance is
// taken, its parametric point projected onto the cell face (hand calculation: foot of the normal at x = 30).
TEST(Locator, PointSlightlyOutsideTakesClosestCell) {
  for (GridCell kind : {GridCell::hex8, GridCell::hex20, GridCell::tet10, GridCell::wedge15}) {
    auto grid = test::make_box_grid(box_spec(kind));
    const Mesh mesh = test::mesh_of(grid);
    const Locator locator(mesh);
    const StressField field = point_field(grid, linear_field);
    const Vec3 outside(30.05, 7.0, 4.0), foot(30.0, 7.0, 4.0);
    const auto host = locator.locate(outside, 0.1);
    ASSERT_TRUE(host);
    EXPECT_CLOSE(host->distance, 0.05, 1e-9);
    EXPECT_CLOSE(mapped_position(grid, *host).x(), foot.x(), 1e-9);
    EXPECT_GT(test::cell_centroid(grid, host->cell).x(), 20.0);
    expect_tensor(interpolate(field, *host), linear_field(foot), 1e-9);
    EXPECT_FALSE(locator.locate(outside, 0.01)) << "0.05 mm away is beyond a 0.01 mm tolerance";
  }
}

// A hair outside (1e-7 mm): VTK's own parametric tolerance calls it inside its cell; the refined location is
// the face point and the distance is recorded.
TEST(Locator, HairOutsideRecordsDistance) {
  auto grid = test::make_box_grid(box_spec(GridCell::tet10));
  const Mesh mesh = test::mesh_of(grid);
  const Locator locator(mesh);
  const auto host = locator.locate(Vec3(12.0, -1e-7, 3.0), 1e-3);
  ASSERT_TRUE(host);
  EXPECT_CLOSE(host->distance, 1e-7, 1e-12);
  EXPECT_CLOSE(mapped_position(grid, *host).y(), 0.0, 1e-12);
}

TEST(Locator, CellDataGivesTheCellTensor) {
  auto grid = test::make_box_grid(box_spec(GridCell::hex20));
  const Mesh mesh = test::mesh_of(grid);
  const Locator locator(mesh);
  std::vector<double> values;
  for (vtkIdType c = 0; c < grid->GetNumberOfCells(); ++c)
    for (double v : quadratic_field(test::cell_centroid(grid, c))) values.push_back(v);
  const StressField field(Association::cell, values);
  const auto host = locator.locate(Vec3(14.0, 3.0, 8.0), 0.0);
  ASSERT_TRUE(host);
  expect_tensor(interpolate(field, *host), quadratic_field(test::cell_centroid(grid, host->cell)), 1e-14);
}

TEST(Locator, ConcurrentQueriesMatchSerialOnes) {
  auto grid = test::make_box_grid(box_spec(GridCell::hex27, 0.1, 0.1));
  const Mesh mesh = test::mesh_of(grid);
  const Locator locator(mesh);
  const std::vector<Vec3> points = random_points(2000, Eigen::Matrix3d::Identity(), Vec3::Zero(), 5);
  std::vector<Host> serial, parallel(points.size());
  for (const Vec3& x : points) serial.push_back(*locator.locate(x, 1e-6));
  std::vector<std::thread> threads;
  for (std::size_t t = 0; t < 4; ++t)
    threads.emplace_back([&, t] {
      for (std::size_t i = t; i < points.size(); i += 4) parallel[i] = *locator.locate(points[i], 1e-6);
    });
  for (auto& thread : threads) thread.join();
  for (std::size_t i = 0; i < points.size(); ++i) {
    EXPECT_EQ(parallel[i].cell, serial[i].cell);
    EXPECT_EQ(parallel[i].weights, serial[i].weights);
  }
}

TEST(Locator, EmptyMeshIsRejected) {
  const Mesh mesh(vtkSmartPointer<vtkUnstructuredGrid>::New(), "empty.vtu", LengthUnit::mm);
  try {
    const Locator locator(mesh);
    FAIL() << "expected an Error";
  } catch (const Error& e) {
    EXPECT_STREQ("cannot locate points in model 'empty.vtu': it has no volume cells; give a model with 3D cells",
                 e.what());
  }
}

TEST(Locator, FieldOfAnotherMeshIsRejected) {
  auto grid = test::make_box_grid(box_spec(GridCell::hex8));
  const Mesh mesh = test::mesh_of(grid);
  const Locator locator(mesh);
  const StressField small(Association::point, std::vector<double>(6 * 4, 1.0));
  const auto host = locator.locate(Vec3(29.0, 19.0, 9.0), 0.0);
  ASSERT_TRUE(host);
  try {
    interpolate(small, *host);
    FAIL() << "expected an Error";
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()).rfind("stress field has 4 point tensors but the located cell uses point ", 0), 0u)
        << e.what();
  }
}

}  // namespace
}  // namespace toehold
