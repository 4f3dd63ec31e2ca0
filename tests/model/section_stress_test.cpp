// Nominal stress on a cut through the FE model: a plate whose stress field is prescribed analytically (membrane,
// bending through the thickness and across the width, and a local concentration at a weld toe that decays away
// from it). All expected values are hand calculations written out beside the checks [D].
#include "toehold/common/error.hpp"
#include "toehold/fatigue/sn_catalogue.hpp"
#include "toehold/model/locator.hpp"
#include "toehold/model/section_stress.hpp"
#include "toehold/nominal/nominal_check.hpp"

#include "support/grid.hpp"
#include "support/support.hpp"

#include <Eigen/Geometry>

#include <cmath>
#include <numbers>
#include <string_view>

namespace toehold {
namespace {

using test::error_of;

using test::GridCell;
using test::GridSpec;

// The plate: 200 mm long (x, the load direction), 40 mm wide (y), t = 10 mm thick (z). Weld toe line at x = 100
// on the top face z = 10 (a transverse attachment).
constexpr double kLength = 200.0, kWidth = 40.0, kThick = 10.0, kToe = 100.0;
constexpr double kMembrane = 100.0;  // MPa
constexpr double kBending = 20.0;    // MPa at the top fibre, through the thickness
constexpr double kWidthSlope = 0.5;  // MPa/mm across the width, about the plate's strong axis
constexpr double kRise = 30.0;       // MPa: structural rise at the toe, decaying linearly to 0 at kReach
constexpr double kReach = 40.0;      // mm from the toe
constexpr double kNotch = 80.0;      // MPa: non-linear notch peak at the toe, gone 3 mm (0.3 t) from it

constexpr std::string_view kArray = "stress";  // name of the stress array in the test grids

double toe_distance(const Vec3& x) { return std::abs(x.x() - kToe); }

// sigma_xx of the prescribed field, MPa (position in mm). The concentration terms grow linearly from the bottom
// face (0) to the top face (full value), so the field is linear in z; they vanish for |x - 100| >= 40 mm.
double sigma_xx(const Vec3& x) {
  const double s = toe_distance(x), depth = x.z() / kThick;
  const double rise = s < kReach ? kRise * (1.0 - s / kReach) : 0.0;
  const double notch = s < 0.3 * kThick ? kNotch * std::pow(1.0 - s / (0.3 * kThick), 2) : 0.0;
  return kMembrane + kBending * (x.z() - kThick / 2) / (kThick / 2) + kWidthSlope * (x.y() - kWidth / 2) +
         (rise + notch) * depth;
}

// The full tensor: sigma_xx as above, a constant sigma_yy and tau_xy, and a tau_xz with zero mean over z.
Voigt plate_field(const Vec3& x) { return {sigma_xx(x), 5.0, 0.0, 7.0, 0.0, 3.0 * (x.z() - 5.0) / 5.0}; }

GridSpec plate(GridCell cell, int nx = 20) {
  GridSpec g;
  g.lx = kLength, g.ly = kWidth, g.lz = kThick;
  g.nx = nx, g.ny = 4, g.nz = 2;
  g.cell = cell;
  return g;
}

StressSpec stress_array() {
  StressSpec spec;
  spec.array = std::string(kArray);
  return spec;
}

StressField point_stress(const Mesh& mesh, const test::StressFunction& f) {
  test::add_point_stress(mesh.grid(), std::string(kArray), f);
  return read_stress(mesh, stress_array(), StressUnit::MPa);
}

SectionSpec far_field(double x) {
  SectionSpec s;
  s.name = "far field";
  s.point_mm = Vec3(x, 20.0, 5.0);
  s.normal = Vec3::UnitX();
  return s;
}

// Hand calculation [D] for the section x = const far from the toe (the concentration is zero there):
//   area A = 40 x 10 = 400 mm^2; membrane = area mean of sigma_xx = 100 MPa (the linear terms average to zero
//   about the centroid (y, z) = (20, 5));
//   weak axis (bending through the thickness): I = 40 x 10^3 / 12 = 3333.3 mm^4, gradient 20 / 5 = 4 MPa/mm,
//   extreme fibre 5 mm, bending 20 MPa; strong axis: I = 10 x 40^3 / 12 = 53333.3 mm^4, gradient 0.5 MPa/mm,
//   fibre 20 mm, bending 10 MPa; linear fit 100 +- 20 +- 10 at the corners: max 130, min 70 MPa;
//   mean tensor: xx 100, yy 5, xy 7, xz 0 (3 (z - 5)/5 averages to 0); traction on x: (100, 7, 0), shear 7 MPa.
void expect_far_field(const SectionStress& s) {
  EXPECT_CLOSE(s.area_mm2, 400.0, 1e-10);
  EXPECT_CLOSE(s.centroid_mm.y(), 20.0, 1e-10);
  EXPECT_CLOSE(s.centroid_mm.z(), 5.0, 1e-10);
  EXPECT_CLOSE(s.membrane_MPa, 100.0, 1e-10);
  EXPECT_CLOSE(s.bending[0].second_moment_mm4, 40.0 * 1000.0 / 12.0, 1e-10);
  EXPECT_CLOSE(std::abs(s.bending[0].across.z()), 1.0, 1e-12);
  EXPECT_CLOSE(s.bending[0].across.z() * s.bending[0].gradient_MPa_per_mm, 4.0, 1e-10);
  EXPECT_CLOSE(s.bending[0].fibre_max_mm, 5.0, 1e-10);
  EXPECT_CLOSE(s.bending[0].fibre_min_mm, -5.0, 1e-10);
  EXPECT_CLOSE(std::abs(s.bending[0].bending_MPa), 20.0, 1e-10);
  EXPECT_CLOSE(s.bending[0].bending_min_MPa, -s.bending[0].bending_MPa, 1e-10);
  EXPECT_CLOSE(s.bending[1].second_moment_mm4, 10.0 * 64000.0 / 12.0, 1e-10);
  EXPECT_CLOSE(std::abs(s.bending[1].bending_MPa), 10.0, 1e-10);
  EXPECT_CLOSE(s.fit_max_MPa, 130.0, 1e-10);
  EXPECT_CLOSE(s.fit_min_MPa, 70.0, 1e-10);
  EXPECT_CLOSE(s.mean_tensor(0, 0), 100.0, 1e-10);
  EXPECT_CLOSE(s.mean_tensor(1, 1), 5.0, 1e-10);
  EXPECT_CLOSE(s.mean_tensor(0, 1), 7.0, 1e-10);
  EXPECT_CLOSE(s.mean_tensor(0, 2), 0.0, 1e-10);
  EXPECT_CLOSE(s.mean_shear_MPa, 7.0, 1e-10);
}

class SectionOnEveryCell : public ::testing::TestWithParam<GridCell> {};

TEST_P(SectionOnEveryCell, FarFieldCutGivesPrescribedMembraneAndBending) {
  const Mesh mesh = test::mesh_of(test::make_box_grid(plate(GetParam())));
  const StressField field = point_stress(mesh, plate_field);
  const SectionStress s = section_stress(mesh, field, far_field(35.0));  // through the middle of a cell layer
  expect_far_field(s);
  EXPECT_EQ(s.name, "far field");
  EXPECT_GT(s.cut_cells, 0);
}

TEST_P(SectionOnEveryCell, PlaneThroughNodesCountsSharedFacesOnce) {
  const Mesh mesh = test::mesh_of(test::make_box_grid(plate(GetParam())));
  const StressField field = point_stress(mesh, plate_field);
  expect_far_field(section_stress(mesh, field, far_field(30.0)));  // x = 30 is a layer of nodes and faces
}

// A complete quadratic through the thickness, sigma_xx = z^2 (z in mm), on cells that hold it exactly [D]:
// mean = (1/10) int_0^10 z^2 dz = 100/3; first moment int_0^10 z^2 (z - 5) dz = 2500 - 5000/3 = 833.33 per unit
// width over I per unit width int_0^10 (z - 5)^2 dz = 250/3, gradient 10 MPa/mm, bending 50 MPa at 5 mm.
class SectionOnQuadraticCell : public ::testing::TestWithParam<GridCell> {};

TEST_P(SectionOnQuadraticCell, QuadraticFieldIsIntegratedExactlyWhereTheCellHoldsIt) {
  const Mesh mesh = test::mesh_of(test::make_box_grid(plate(GetParam())));
  const StressField field = point_stress(mesh, [](const Vec3& x) { return Voigt{x.z() * x.z(), 0, 0, 0, 0, 0}; });
  const SectionStress s = section_stress(mesh, field, far_field(35.0));
  EXPECT_CLOSE(s.membrane_MPa, 100.0 / 3.0, 1e-10);
  EXPECT_CLOSE(s.bending[0].across.z() * s.bending[0].gradient_MPa_per_mm, 10.0, 1e-10);
  EXPECT_CLOSE(std::abs(s.bending[0].bending_MPa), 50.0, 1e-10);
  EXPECT_CLOSE(s.bending[1].bending_MPa, 0.0, 1e-10);
  // Tilted 30 degrees about z: the cut still spans z = 0..10 uniformly, so the same values [D].
  SectionSpec tilted = far_field(35.0);
  tilted.normal = Vec3(std::cos(std::numbers::pi / 6.0), std::sin(std::numbers::pi / 6.0), 0.0);
  tilted.direction = Vec3::UnitX();
  const SectionStress t = section_stress(mesh, field, tilted);
  EXPECT_CLOSE(t.membrane_MPa, 100.0 / 3.0, 1e-10);
  EXPECT_CLOSE(std::abs(t.bending[0].bending_MPa), 50.0, 1e-10);
}

INSTANTIATE_TEST_SUITE_P(Cells, SectionOnEveryCell,
                         ::testing::Values(GridCell::hex8, GridCell::hex20, GridCell::hex27, GridCell::tet4,
                                           GridCell::tet10, GridCell::wedge6, GridCell::wedge15,
                                           GridCell::lagrange_tet10, GridCell::lagrange_hex27),
                         [](const auto& p) { return test::to_string(p.param); });
INSTANTIATE_TEST_SUITE_P(Cells, SectionOnQuadraticCell,
                         ::testing::Values(GridCell::hex20, GridCell::hex27, GridCell::tet10, GridCell::wedge15,
                                           GridCell::lagrange_tet10, GridCell::lagrange_hex27),
                         [](const auto& p) { return test::to_string(p.param); });

TEST(SectionStress, DistortedTetrahedraStillGiveTheExactLinearSection) {
  GridSpec g = plate(GridCell::tet4);
  g.jitter = 0.15;  // interior corners moved; each tet stays affine, so linear fields stay exact [D]
  const Mesh mesh = test::mesh_of(test::make_box_grid(g));
  expect_far_field(section_stress(mesh, point_stress(mesh, plate_field), far_field(35.0)));
}

// Rotating and moving the model (and the tensors with it) must not change the section [D].
TEST(SectionStress, RigidMotionOfModelAndStressLeavesTheSectionUnchanged) {
  const Eigen::Matrix3d r = Eigen::AngleAxisd(0.7, Vec3(1.0, 2.0, 3.0).normalized()).toRotationMatrix();
  const Vec3 shift(120.0, -45.0, 30.0);
  auto grid = test::make_box_grid(plate(GridCell::tet10));
  test::move_grid(grid, r, shift);
  const Mesh mesh = test::mesh_of(grid);
  const StressField field = point_stress(mesh, [&](const Vec3& x) {
    const Vec3 local = r.transpose() * (x - shift);
    const Tensor s = r * tensor_from_voigt(plate_field(local).data()) * r.transpose();
    return voigt_from_tensor(s);
  });
  SectionSpec spec = far_field(35.0);
  spec.point_mm = r * spec.point_mm + shift;
  spec.normal = r * Vec3(2.0, 0.0, 0.0);  // any length
  const SectionStress s = section_stress(mesh, field, spec);
  EXPECT_CLOSE(s.area_mm2, 400.0, 1e-9);
  EXPECT_CLOSE(s.membrane_MPa, 100.0, 1e-9);
  EXPECT_CLOSE(std::abs(s.bending[0].bending_MPa), 20.0, 1e-9);
  EXPECT_CLOSE(std::abs(s.bending[0].across.dot(r * Vec3::UnitZ())), 1.0, 1e-12);
  EXPECT_CLOSE(std::abs(s.bending[1].bending_MPa), 10.0, 1e-9);
  EXPECT_CLOSE(s.mean_shear_MPa, 7.0, 1e-9);
}

// An oblique cut (normal 30 degrees from x in the x-y plane) with the stress direction set to x [D]: the cut is
// 40 / cos 30 = 46.188 mm wide, area 461.88 mm^2; its centroid is at y = 20, so sigma_xx still averages to 100.
TEST(SectionStress, ObliqueCutWithGivenStressDirection) {
  const Mesh mesh = test::mesh_of(test::make_box_grid(plate(GridCell::tet10)));
  SectionSpec spec = far_field(35.0);
  const double a = std::numbers::pi / 6.0;
  spec.normal = Vec3(std::cos(a), std::sin(a), 0.0);
  spec.direction = Vec3::UnitX();
  const SectionStress s = section_stress(mesh, point_stress(mesh, plate_field), spec);
  EXPECT_CLOSE(s.area_mm2, 400.0 / std::cos(a), 1e-10);
  EXPECT_CLOSE(s.membrane_MPa, 100.0, 1e-10);
  EXPECT_CLOSE(s.direction.x(), 1.0, 1e-15);
}

// Cell data: two layers through the thickness, each with its centroid value 100 -+ 10 MPa [D]:
// membrane 100; first moment 40 x (110 - 90) x 12.5 = 10000 MPa mm^3 over I = 3333.3 mm^4: gradient 3 MPa/mm,
// bending 15 MPa at the 5 mm fibre (the least-squares line through two constant layers: 3/4 of the nodal 20).
TEST(SectionStress, CellDataUsesEachCellsValue) {
  for (GridCell cell : {GridCell::hex8, GridCell::wedge6}) {
    auto grid = test::make_box_grid(plate(cell));
    test::add_cell_stress(grid, std::string(kArray), [](const Vec3& x) {
      return Voigt{kMembrane + kBending * (x.z() - 5.0) / 5.0, 0, 0, 0, 0, 0};
    });
    const Mesh mesh = test::mesh_of(grid);
    const SectionStress s = section_stress(mesh, read_stress(mesh, stress_array(), StressUnit::MPa), far_field(35.0));
    EXPECT_CLOSE(s.membrane_MPa, 100.0, 1e-10) << test::to_string(cell);
    EXPECT_CLOSE(std::abs(s.bending[0].bending_MPa), 15.0, 1e-10) << test::to_string(cell);
  }
}

// Limits that keep half the width, y in [0, 20] [D]: area 200 mm^2, centroid y = 10, membrane
// 100 + 0.5 (10 - 20) = 95 MPa.
TEST(SectionStress, RegionDiscAndBoxLimitsPickThePlate) {
  auto grid = test::make_box_grid(plate(GridCell::hex8));
  test::add_cell_regions(grid, "part", [](const Vec3& x) { return x.y() < 20.0 ? 1 : 2; });
  const Mesh mesh = test::mesh_of(grid);
  const StressField field = point_stress(mesh, plate_field);
  SectionSpec by_region = far_field(35.0), by_disc = far_field(35.0), by_box = far_field(35.0);
  by_region.limits.region_array = "part";
  by_region.limits.region_values = {1};
  by_disc.limits.centre_mm = Vec3(0.0, 10.0, 5.0);  // projected onto the plane x = 35
  by_disc.limits.radius_mm = 12.0;  // cell cut-centroids at y = 5, 15 (5.6 mm away) in; y = 25 (15.2 mm) out
  by_box.limits.box = SectionBox{Vec3(0.0, -1.0, -1.0), Vec3(200.0, 20.0, 11.0)};
  for (const SectionSpec& spec : {by_region, by_disc, by_box}) {
    const SectionStress s = section_stress(mesh, field, spec);
    EXPECT_CLOSE(s.area_mm2, 200.0, 1e-10);
    EXPECT_CLOSE(s.centroid_mm.y(), 10.0, 1e-10);
    EXPECT_CLOSE(s.membrane_MPa, 95.0, 1e-10);
    EXPECT_EQ(s.cut_cells, 4);
  }
}

// The plate's known concentration [D]. Top-surface stress at distance s from the toe (z = 10, y = 20):
//   sigma(s) = 100 + 20 + 30 (1 - s/40) (+ the notch for s < 3 mm),
// so sigma(0.4 t = 4 mm) = 147 MPa and sigma(1.0 t = 10 mm) = 142.5 MPa. Linear extrapolation to the toe with
// IIW's type-a fine-mesh read-out points (IIW 2016 sec. 3.3, from memory [M]; exact weights 5/3 and -2/3 [D]):
//   hot spot = 5/3 x 147 - 2/3 x 142.5 = 245 - 95 = 150 MPa = 100 + 20 + 30: the notch does not enter.
// Nominal (far-field membrane) 100 MPa: structural stress concentration 150 / 100 = 1.5; against the
// membrane + bending of the section (the fit's top fibre along y = 20: 120 MPa) 1.25.
TEST(SectionStress, HotSpotOverNominalRatioComesOutAsDesigned) {
  const Mesh mesh = test::mesh_of(test::make_box_grid(plate(GridCell::hex8, 100)));  // 2 mm along x
  const StressField field = point_stress(mesh, plate_field);
  const Locator locator(mesh);
  auto top_stress = [&](double s) {
    const auto host = locator.locate(Vec3(kToe + s, 20.0, kThick), 1e-6);
    EXPECT_TRUE(host.has_value());
    return interpolate(field, *host)(0, 0);
  };
  const double s04 = top_stress(0.4 * kThick), s10 = top_stress(1.0 * kThick);
  EXPECT_CLOSE(s04, 147.0, 1e-10);
  EXPECT_CLOSE(s10, 142.5, 1e-10);
  const double hot_spot = 5.0 / 3.0 * s04 - 2.0 / 3.0 * s10;
  EXPECT_CLOSE(hot_spot, 150.0, 1e-10);

  const SectionStress nominal = section_stress(mesh, field, far_field(35.0));
  EXPECT_CLOSE(nominal.membrane_MPa, 100.0, 1e-10);
  EXPECT_CLOSE(hot_spot / nominal.membrane_MPa, 1.5, 1e-10);
  const double top_fibre = nominal.membrane_MPa + std::abs(nominal.bending[0].bending_MPa);
  EXPECT_CLOSE(hot_spot / top_fibre, 1.25, 1e-10);

  // The same joint side by side, loaded from 0 to this state (ranges = values). Nominal detail class FAT 80,
  // hot spot FAT 100, 2e6 cycles: utilizations 100/80 = 1.25 and 150/100 = 1.5 (IIW 2016 sec. 3.7 N = 2e6
  // (FAT/ds)^3 at the reference cycles [M]); the hot spot governs, concentration factor 1.5 [D].
  nominal::RangeRequirement req;
  req.cycles = 2e6;
  const auto by_nominal = nominal::check_range(parse_sn_curve("IIW FAT 80"), nominal.membrane_MPa, req);
  const auto by_hot_spot = nominal::check_range(parse_sn_curve("IIW FAT 100"), hot_spot, req);
  const nominal::MethodComparison c = nominal::compare_methods(by_nominal, by_hot_spot, "plate toe");
  EXPECT_CLOSE(c.nominal.utilization, 1.25, 1e-10);
  EXPECT_CLOSE(c.hot_spot.utilization, 1.5, 1e-10);
  ASSERT_TRUE(c.concentration_factor.has_value());
  EXPECT_CLOSE(*c.concentration_factor, 1.5, 1e-10);
  EXPECT_EQ(c.governing, nominal::Method::hot_spot);
}

TEST(SectionStress, ErrorsNameTheSectionAndSayWhatToDo) {
  const Mesh mesh = test::mesh_of(test::make_box_grid(plate(GridCell::hex8)));
  const StressField field = point_stress(mesh, plate_field);
  EXPECT_EQ(error_of([&] { section_stress(mesh, field, far_field(300.0)); }),
            "section 'far field': the cut plane through (300, 20, 5) mm with normal (1, 0, 0) misses the model "
            "test grid; put the point inside the plate and check that it is in mm");
  SectionSpec zero = far_field(35.0);
  zero.normal = Vec3::Zero();
  EXPECT_EQ(error_of([&] { section_stress(mesh, field, zero); }),
            "section 'far field': the plane normal (0, 0, 0) has no direction; give a non-zero normal vector");
  SectionSpec no_direction = far_field(35.0);
  no_direction.direction = Vec3::Zero();
  EXPECT_EQ(error_of([&] { section_stress(mesh, field, no_direction); }),
            "section 'far field': the stress direction (0, 0, 0) has no direction; give a non-zero direction or "
            "leave it out to use the plane normal");
  SectionSpec edge = far_field(0.0);  // the plane x + z = 210 touches the box only along its edge x = 200, z = 10
  edge.point_mm = Vec3(200.0, 20.0, 10.0);
  edge.normal = Vec3(1.0, 0.0, 1.0);
  EXPECT_EQ(error_of([&] { section_stress(mesh, field, edge); }),
            "section 'far field': the cut plane through (200, 20, 10) mm with normal (0.707107, 0, 0.707107) only "
            "touches edges or corners of the model, so the cut has zero area; move the point into the plate");
  SectionSpec disc = far_field(35.0);
  disc.limits.centre_mm = Vec3(35.0, 500.0, 5.0);
  disc.limits.radius_mm = 10.0;
  EXPECT_EQ(error_of([&] { section_stress(mesh, field, disc); }),
            "section 'far field': the cut plane through (35, 20, 5) mm with normal (1, 0, 0) cuts 8 cells but the "
            "limits keep none of them; widen the limits (region values, centre and radius, box) so they cover the "
            "plate's cross-section");
  disc.limits.radius_mm = 0.0;
  EXPECT_EQ(error_of([&] { section_stress(mesh, field, disc); }),
            "section 'far field': the radius around the centre must be positive, got 0 mm; give a radius that "
            "encloses the plate's cross-section");
  SectionSpec region = far_field(35.0);
  region.limits.region_array = "part";
  region.limits.region_values = {1};
  EXPECT_EQ(error_of([&] { section_stress(mesh, field, region); }),
            "section 'far field': cell array 'part' not found as a one-component cell array in test grid; give the "
            "name of an integer cell array of the model (e.g. a part id)");
}

}  // namespace
}  // namespace toehold
