// The whole assessment on plates with analytic stress fields: the hot-spot stress, range, allowable, utilization
// and life come out as the formulas say, and moving, re-scaling or mirroring the model changes nothing.
#include "toehold/assess/assessment.hpp"
#include "toehold/common/error.hpp"
#include "support/grid.hpp"
#include "support/support.hpp"

#include <vtkXMLUnstructuredGridWriter.h>

#include <cmath>

namespace toehold {
namespace {

using test::GridCell;

// A 60 x 60 mm plate, t = 10 mm (z from 0 to 10). The weld region (3) covers y < 20 (or y > 40 when mirrored);
// the toe runs along x on the top face at y = 20 (40). d is the distance from the toe into the plate.
struct Case {
  GridCell cell = GridCell::hex8;
  SchemeKind scheme = SchemeKind::fine_linear;
  HotSpotType type = HotSpotType::a;
  bool quadratic_field = false;
  bool mirrored = false;
  Eigen::Matrix3d rotation = Eigen::Matrix3d::Identity();
  Vec3 shift = Vec3::Zero();
  bool si_units = false;  // model written in m and Pa
  int ny = 24;            // bricks across the toe (2.5 mm each by default)
};

double distance_from_toe(const Case& c, const Vec3& x) { return c.mirrored ? 40.0 - x.y() : x.y() - 20.0; }

// Step A: s_across = 100 + 3 d (+ 0.05 d^2); step B: -20 - d (+ 0.02 d^2); plus constant in-plane stresses.
Tensor local_stress(const Case& c, double d, bool step_b) {
  const double q = c.quadratic_field ? (step_b ? 0.02 : 0.05) * d * d : 0.0;
  const double across = step_b ? -20.0 - d + q : 100.0 + 3.0 * d + q;
  Tensor s = Tensor::Zero();
  s(1, 1) = across;
  s(0, 0) = step_b ? 5.0 : 30.0;
  s(0, 1) = s(1, 0) = step_b ? -2.0 : 10.0;
  return s;
}

std::string write_model(const Case& c, const test::TempDir& dir) {
  auto grid = test::make_box_grid(test::GridSpec{60, 60, 10, 12, c.ny, 4, c.cell});
  const double length = c.si_units ? 1e-3 : 1.0, stress = c.si_units ? 1e6 : 1.0;
  auto field = [&](bool step_b) {
    return [&c, step_b, stress](const Vec3& x) {
      const Tensor s = c.rotation * local_stress(c, distance_from_toe(c, x), step_b) * c.rotation.transpose();
      Voigt v = voigt_from_tensor(s);
      for (double& value : v) value *= stress;
      return v;
    };
  };
  test::add_point_stress(grid, "sA", field(false));
  test::add_point_stress(grid, "sB", field(true));
  test::add_cell_regions(grid, "region", [&](const Vec3& x) { return distance_from_toe(c, x) < 0 ? 3 : 1; });
  test::add_point_ints(grid, "toe", [&](const Vec3& x) {
    return std::abs(x.z() - 10) < 1e-9 && std::abs(distance_from_toe(c, x)) < 1e-9 ? 1 : 0;
  });
  test::move_grid(grid, c.rotation, c.shift);
  test::move_grid(grid, Eigen::Matrix3d::Identity() * length, Vec3::Zero());
  const std::string path = dir.file("plate.vtu");
  auto writer = vtkSmartPointer<vtkXMLUnstructuredGridWriter>::New();
  writer->SetFileName(path.c_str());
  writer->SetInputData(grid);
  writer->Write();
  return path;
}

Plan plan_for(const Case& c, const std::string& file) {
  Plan plan;
  plan.path = "test plan";
  plan.model.file = file;
  plan.model.length_unit = c.si_units ? LengthUnit::m : LengthUnit::mm;
  plan.model.stress_unit = c.si_units ? StressUnit::Pa : StressUnit::MPa;
  plan.model.stress.array = "sA";
  plan.model.region_array = "region";
  plan.steps = {StepPlan{"A", file, -1, StressSpec{"sA", {}, ""}}, StepPlan{"B", file, -1, StressSpec{"sB", {}, ""}}};
  ToePlan toe;
  toe.name = "toe";
  toe.marker_array = "toe";
  toe.marker_value = 1;
  toe.weld_regions = {3};
  toe.thickness = 10.0;
  toe.type = c.type;
  toe.scheme = c.scheme;
  toe.curve = "IIW FAT 90";
  plan.toes = {toe};
  plan.requirement.cycles = 2e6;
  return plan;
}

Assessment assess(const Case& c) {
  test::TempDir dir;
  NullReporter quiet;
  return run_assessment(plan_for(c, write_model(c, dir)), quiet);
}

// The field's toe values are 100 and -20 MPa, so the range is 120 MPa whatever the scheme, when the scheme's
// polynomial order covers the field's. IIW FAT 90, m = 3 (IIW 2016 sec. 3.7, from memory): the allowable range at
// 2e6 cycles is 90 MPa, utilization 120/90, life 2e6 (90/120)^3 = 843750 cycles (derived).
void expect_analytic(const Assessment& a) {
  ASSERT_EQ(a.toes.size(), 1u);
  const ToeResult& toe = a.toes[0];
  // A station at every toe node: 13 corner nodes along 60 mm, plus the mid-edge nodes of quadratic cells.
  ASSERT_EQ(toe.stations.size(), toe.line.points.size());
  ASSERT_GE(toe.stations.size(), 13u);
  for (const StationResult& s : toe.stations) {
    ASSERT_TRUE(s.ok()) << "station " << s.station.id << ": " << s.problem;
    EXPECT_CLOSE(s.hot_spot[0], 100.0, 1e-9);
    EXPECT_CLOSE(s.hot_spot[1], -20.0, 1e-9);
    EXPECT_CLOSE(s.range, 120.0, 1e-9);
    EXPECT_CLOSE(s.allowable, 90.0, 1e-12);
    EXPECT_CLOSE(s.utilization, 120.0 / 90.0, 1e-9);
    EXPECT_CLOSE(s.life, 843750.0, 1e-8);
    for (const ReadoutPoint& p : s.points) {
      const double across = 100.0 + 3.0 * p.distance + (toe.scheme.kind == SchemeKind::fine_linear ? 0.0 : 0.05 * p.distance * p.distance);
      EXPECT_CLOSE(p.normal_stress[0], across, 1e-9);
    }
  }
}

TEST(Assessment, LinearFieldOnLinearHexesGivesTheAnalyticHotSpot) {
  expect_analytic(assess(Case{}));
}

TEST(Assessment, QuadraticFieldOnQuadraticCellsGivesTheAnalyticHotSpot) {
  for (GridCell cell : {GridCell::tet10, GridCell::hex20, GridCell::hex27, GridCell::wedge15}) {
    Case c;
    c.cell = cell;
    c.scheme = SchemeKind::fine_quadratic;
    c.quadratic_field = true;
    expect_analytic(assess(c));
  }
}

TEST(Assessment, TypeBSchemeOnQuadraticTets) {
  Case c;
  c.cell = GridCell::tet10;
  c.scheme = SchemeKind::type_b_fine;
  c.type = HotSpotType::b;
  c.quadratic_field = true;
  expect_analytic(assess(c));
}

TEST(Assessment, RotatingAndMovingTheModelChangesNothing) {
  Case c;
  c.cell = GridCell::tet10;
  c.scheme = SchemeKind::fine_quadratic;
  c.quadratic_field = true;
  c.rotation = (Eigen::AngleAxisd(0.7, Vec3(1, 2, 3).normalized())).toRotationMatrix();
  c.shift = Vec3(-250.0, 40.0, 1000.0);
  expect_analytic(assess(c));
}

TEST(Assessment, MetresAndPascalsGiveTheSameResultsAsMillimetresAndMegapascals) {
  Case c;
  c.si_units = true;
  expect_analytic(assess(c));
}

TEST(Assessment, MirroringTheWeldSideChangesNothing) {
  Case c;
  c.mirrored = true;
  c.cell = GridCell::tet4;
  expect_analytic(assess(c));
}

TEST(Assessment, StationFrameLiesInThePlateSurfaceAwayFromTheWeld) {
  const Assessment a = assess(Case{});
  for (const StationResult& s : a.toes[0].stations) {
    EXPECT_CLOSE(s.station.frame.normal.z(), 1.0, 1e-12);
    EXPECT_CLOSE(s.station.frame.readout.y(), 1.0, 1e-12);
    EXPECT_CLOSE(std::abs(s.station.frame.tangent.x()), 1.0, 1e-12);
  }
}

// IIW 2016 sec. 3.3 (from memory): the fine-mesh scheme wants elements no longer than 0.4t = 4 mm at the toe; 10 mm
// elements give every station a remark, and the console warnings say so.
TEST(Assessment, CoarseMeshAtTheToeGivesEveryStationARemark) {
  Case c;
  c.ny = 6;
  const Assessment a = assess(c);
  for (const StationResult& s : a.toes[0].stations) {
    ASSERT_FALSE(s.notes.empty()) << "station " << s.station.id;
    EXPECT_EQ(s.notes.front().rfind("mesh check 'element size' fails: element at the toe is 10 mm long", 0), 0u)
        << s.notes.front();
  }
  bool warned = false;
  for (const std::string& w : a.warnings) warned = warned || w.find("13 stations carry remarks") != std::string::npos;
  EXPECT_TRUE(warned);
  const Assessment fine = assess(Case{});  // named: a range-for over a temporary's member would dangle (C++20)
  for (const StationResult& s : fine.toes[0].stations) EXPECT_TRUE(s.notes.empty()) << s.notes.front();
}

TEST(Assessment, MarkerWithNoNodesIsAnErrorNamingToeAndArray) {
  test::TempDir dir;
  Plan plan = plan_for(Case{}, write_model(Case{}, dir));
  plan.toes[0].marker_value = 4;
  NullReporter quiet;
  try {
    run_assessment(plan, quiet);
    FAIL();
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()), "toe 'toe': no node has value 4 in point array 'toe' of " + plan.model.file +
                                         " (values found: 0, 1)");
  }
}

// IIW 2016 sec. 3.8.2 (from memory [M]): the hot-spot classes cover k_m = 1.05, so k_m = 1.26 raises the range
// by 1.26 / 1.05 = 1.2: FAT 90 allows 90 / 1.2 = 75 MPa at 2e6 cycles, utilization 120 / 75 = 1.6, life
// 2e6 (75 / 120)^3 = 488,281.25 cycles (derived [D]).
TEST(Assessment, MisalignmentBeyondWhatTheHotSpotClassesCoverRaisesTheRange) {
  test::TempDir dir;
  const Case c;
  Plan plan = plan_for(c, write_model(c, dir));
  plan.toes[0].misalignment_km = 1.26;
  NullReporter quiet;
  const Assessment a = run_assessment(plan, quiet);
  for (const StationResult& s : a.toes[0].stations) {
    ASSERT_TRUE(s.ok()) << s.problem;
    EXPECT_CLOSE(s.range, 120.0, 1e-9);
    EXPECT_CLOSE(s.allowable, 75.0, 1e-9);
    EXPECT_CLOSE(s.utilization, 1.6, 1e-9);
    EXPECT_CLOSE(s.life, 488281.25, 1e-8);
  }
  EXPECT_NE(a.toes[0].curve.find("misalignment k_m = 1.26"), std::string::npos) << a.toes[0].curve;
}

// A range from rest to the load: the unloaded step is zero everywhere, so the range is the loaded hot spot
// (100 MPa, derived [D]), and the geometry comes from the loaded step's file even when rest is listed first.
TEST(Assessment, RangeFromAnUnloadedStepIsTheLoadedHotSpot) {
  test::TempDir dir;
  const Case c;
  Plan plan = plan_for(c, write_model(c, dir));
  StepPlan rest;
  rest.name = "rest";
  rest.file = "no such file.vtu";
  rest.unloaded = true;
  plan.steps = {rest, plan.steps[0]};
  NullReporter quiet;
  const Assessment a = run_assessment(plan, quiet);
  for (const StationResult& s : a.toes[0].stations) {
    ASSERT_TRUE(s.ok()) << s.problem;
    EXPECT_CLOSE(s.hot_spot[0], 0.0, 1e-12);
    EXPECT_CLOSE(s.hot_spot[1], 100.0, 1e-9);
    EXPECT_CLOSE(s.range, 100.0, 1e-9);
  }
}

}  // namespace
}  // namespace toehold
