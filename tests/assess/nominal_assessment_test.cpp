// The nominal-stress method inside a whole assessment, on a plate whose stress field is prescribed so that the FE
// nominal section, the far-field surface stress and the extrapolated hot-spot stress are all known by hand.
#include "toehold/assess/assessment.hpp"
#include "toehold/common/error.hpp"
#include "support/grid.hpp"
#include "support/support.hpp"

#include <vtkXMLUnstructuredGridWriter.h>

#include <cmath>

namespace toehold {
namespace {

// A plate 60 (x) by 80 (y) by t = 10 mm (z from 0 to 10), hex8 bricks of 5 x 2.5 x 2.5 mm. The weld region (3) is
// y < 20; the toe runs along x on the top face at y = 20; d = y - 20 is the distance from the toe into the plate.
// Stress across the toe, s_yy = k [m + b (z - 5)/5 + r(d)]: membrane m = 100 MPa, bending b = 20 MPa at the faces,
// a structural rise r(d) = 30 (1 - d/40) MPa for 0 <= d <= 40 and 0 beyond; step A has k = 1, step B k = -0.2.
// The field is linear in z and piecewise linear in y with its kink on a node row (y = 60), so hex8 cells hold it
// exactly [D].
double across(const Vec3& x, double k) {
  const double d = x.y() - 20.0;
  const double rise = d >= 0.0 && d <= 40.0 ? 30.0 * (1.0 - d / 40.0) : 0.0;
  return k * (100.0 + 20.0 * (x.z() - 5.0) / 5.0 + rise);
}

std::string write_plate(const test::TempDir& dir) {
  auto grid = test::make_box_grid(test::GridSpec{60, 80, 10, 12, 32, 4, test::GridCell::hex8});
  for (const auto& [name, k] : {std::pair{"sA", 1.0}, std::pair{"sB", -0.2}})
    test::add_point_stress(grid, name, [k = k](const Vec3& x) {
      Voigt v{};
      v[1] = across(x, k);
      return v;
    });
  test::add_cell_regions(grid, "region", [](const Vec3& x) { return x.y() < 20.0 ? 3 : 1; });
  test::add_point_ints(grid, "toe", [](const Vec3& x) {
    return std::abs(x.z() - 10.0) < 1e-9 && std::abs(x.y() - 20.0) < 1e-9 ? 1 : 0;
  });
  const std::string path = dir.file("plate.vtu");
  auto writer = vtkSmartPointer<vtkXMLUnstructuredGridWriter>::New();
  writer->SetFileName(path.c_str());
  writer->SetInputData(grid);
  writer->Write();
  return path;
}

ToeNominalPlan section_nominal() {
  ToeNominalPlan n;
  n.source = nominal::NominalSource::section;
  n.curve = "IIW FAT 80";
  n.section.name = "nominal section";
  n.section.point_mm = Vec3(30, 70, 5);  // d = 50 mm: past the structural rise
  n.section.normal = Vec3::UnitY();
  return n;
}

Plan plate_plan(const std::string& file, const ToeNominalPlan& nominal) {
  Plan plan;
  plan.path = "test plan";
  plan.model.file = file;
  plan.model.stress.array = "sA";
  plan.model.region_array = "region";
  for (const char* name : {"A", "B"}) {
    StepPlan step;
    step.name = name;
    step.file = file;
    step.stress.array = std::string("s") + name;
    plan.steps.push_back(step);
  }
  ToePlan toe;
  toe.name = "rail";
  toe.marker_array = "toe";
  toe.marker_value = 1;
  toe.weld_regions = {3};
  toe.thickness = 10.0;
  toe.spacing = 20.0;
  toe.curve = "IIW FAT 90";
  toe.nominal = nominal;
  plan.toes = {toe};
  plan.requirement.cycles = 2e6;
  return plan;
}

Assessment assess(const Plan& plan) {
  NullReporter quiet;
  return run_assessment(plan, quiet);
}

// Hand values [D]. Hot spot (IIW type a, 0.4t and 1.0t, linear extrapolation, exact for a linear field): the top
// face (z = 10) at the toe, k (100 + 20 + 30) = 150 and -30 MPa, range 180 MPa. Section at d = 50: membrane
// k 100 = 100 and -20 MPa, range 120 MPa. Structural SCF 180 / 120 = 1.5.
// IIW 2016, FAT classes with m = 3 up to 1e7 cycles (from memory [M]): at 2e6 cycles the allowable is the FAT
// value; hot spot FAT 90: utilization 180/90 = 2, life 2e6 (90/180)^3 = 250000; nominal FAT 80: utilization
// 120/80 = 1.5, life 2e6 (80/120)^3 = 592592.59 cycles. The hot spot governs.
TEST(NominalAssessment, SectionNominalBesideTheHotSpotOnAPlateWithAKnownConcentration) {
  test::TempDir dir;
  const Assessment a = assess(plate_plan(write_plate(dir), section_nominal()));
  const ToeResult& toe = a.toes.at(0);
  ASSERT_TRUE(toe.nominal.has_value());
  const ToeNominalResult& n = *toe.nominal;
  EXPECT_EQ(n.source, "section");
  EXPECT_FALSE(n.per_station);
  ASSERT_TRUE(n.check.ok()) << n.check.problem;
  ASSERT_EQ(n.check.values.size(), 2u);
  EXPECT_CLOSE(n.check.values[0], 100.0, 1e-9);
  EXPECT_CLOSE(n.check.values[1], -20.0, 1e-9);
  EXPECT_CLOSE(n.check.range, 120.0, 1e-9);
  EXPECT_CLOSE(n.check.allowable, 80.0, 1e-12);
  EXPECT_CLOSE(n.check.utilization, 1.5, 1e-9);
  EXPECT_CLOSE(n.check.life, 2e6 * std::pow(80.0 / 120.0, 3), 1e-8);
  EXPECT_EQ(n.governing, "hot-spot");
  EXPECT_NE(n.description.find("600 mm2"), std::string::npos) << n.description;  // cut area 60 x 10 [D]
  ASSERT_FALSE(toe.stations.empty());
  for (const StationResult& s : toe.stations) {
    ASSERT_TRUE(s.ok()) << s.problem;
    EXPECT_CLOSE(s.range, 180.0, 1e-9);
    EXPECT_CLOSE(s.utilization, 2.0, 1e-9);
    EXPECT_CLOSE(s.life, 250000.0, 1e-8);
    ASSERT_TRUE(s.nominal.has_value());
    ASSERT_TRUE(s.nominal->concentration_factor.has_value());
    EXPECT_CLOSE(*s.nominal->concentration_factor, 1.5, 1e-9);
    EXPECT_EQ(s.nominal->governing, "hot-spot");
  }
}

// Surface stress 50 mm from the toe on the top face: k (100 + 20) = 120 and -24 MPa, range 144 MPa [D];
// SCF 180/144 = 1.25; FAT 80 utilization 144/80 = 1.8 [D]. Each station has its own sample point at y = 70.
TEST(NominalAssessment, SurfaceDistanceSamplesEachStationsReadoutPath) {
  test::TempDir dir;
  ToeNominalPlan n;
  n.source = nominal::NominalSource::surface_distance;
  n.curve = "IIW FAT 80";
  n.distance_mm = 50.0;
  const Assessment a = assess(plate_plan(write_plate(dir), n));
  const ToeResult& toe = a.toes.at(0);
  ASSERT_TRUE(toe.nominal && toe.nominal->per_station);
  EXPECT_GE(toe.nominal->worst, 0);
  for (const StationResult& s : toe.stations) {
    ASSERT_TRUE(s.nominal && s.nominal->check.ok()) << s.nominal->check.problem;
    ASSERT_TRUE(s.nominal->sample_x.has_value());
    EXPECT_CLOSE(s.nominal->sample_x->y(), 70.0, 1e-9);
    EXPECT_CLOSE(s.nominal->check.range, 144.0, 1e-9);
    EXPECT_CLOSE(s.nominal->check.utilization, 1.8, 1e-9);
    EXPECT_CLOSE(*s.nominal->concentration_factor, 1.25, 1e-9);
  }
}

// Series of the two steps: one half cycle (ASTM E1049 residue as half cycles) of 120 MPa nominal and 180 MPa hot
// spot. Miner: 0.5 / N, N = 2e6 (FAT/range)^3 (both above the knee at 1e7 cycles, IIW [M]): nominal
// 0.5 / 592592.59 = 8.4375e-7, hot spot 0.5 / 250000 = 2e-6 [D]. IIW allowable Miner sum 0.5 (sec. 4.3.1 [M]):
// nominal utilization 1.6875e-6.
TEST(NominalAssessment, SeriesUsesTheRainflowAndMinerMachinery) {
  test::TempDir dir;
  Plan plan = plate_plan(write_plate(dir), section_nominal());
  plan.loading.kind = LoadingKind::series;
  plan.toes[0].damage_limit = 0.5;
  const Assessment a = assess(plan);
  const NominalCheckResult& c = a.toes.at(0).nominal->check;
  ASSERT_TRUE(c.ok()) << c.problem;
  EXPECT_CLOSE(c.damage, 0.5 / (2e6 * std::pow(80.0 / 120.0, 3)), 1e-9);
  EXPECT_EQ(c.damage_limit, 0.5);
  EXPECT_CLOSE(c.utilization, c.damage / 0.5, 1e-12);
  EXPECT_CLOSE(a.toes[0].stations.at(0).damage, 2e-6, 1e-9);
  EXPECT_EQ(a.toes[0].nominal->governing, "hot-spot");
}

// The infinite-life check on the section's history (range kind): alternating 60, mean 40 MPa (from 100 and -20).
// ASTM A36 (S_ut 400, S_y 250 MPa), reinforced butt K_fs = 1.2 (B&N 9th ed. Table 9-5 [S]), axial: k_c = 0.85
// (Eq. 6-26 [S]), k_b = 1; as-forged k_a = 272 x 400^-0.995 (Table 6-2 [S]); S'e = 0.5 x 400 = 200 MPa (Eq. 6-8
// [M]). Goodman 1/n = 1.2 x 60 / S_e + 1.2 x 40 / 400 (Table 6-6 [S]); Langer n_y = 250 / (1.2 x 100) [S].
TEST(NominalAssessment, InfiniteLifeCheckTakesAlternatingAndMeanFromTheSteps) {
  test::TempDir dir;
  ToeNominalPlan n = section_nominal();
  InfiniteLifePlan life;
  life.input.material = nominal::find_material("ASTM A36");
  life.input.detail = nominal::WeldDetail::reinforced_butt;
  life.input.marin.load = nominal::LoadKind::axial;
  n.infinite_life = life;
  const Assessment a = assess(plate_plan(write_plate(dir), n));
  const auto& r = a.toes.at(0).nominal->infinite_life;
  ASSERT_TRUE(r.has_value());
  const double se = 272.0 * std::pow(400.0, -0.995) * 0.85 * 200.0;
  EXPECT_CLOSE(r->check.endurance.endurance_MPa, se, 1e-9);
  EXPECT_CLOSE(r->check.nominal_alternating_MPa, 60.0, 1e-9);
  EXPECT_CLOSE(r->check.nominal_mean_MPa, 40.0, 1e-9);
  EXPECT_CLOSE(r->check.goodman, 1.0 / (72.0 / se + 48.0 / 400.0), 1e-9);
  EXPECT_CLOSE(r->check.first_cycle_yield, 250.0 / 120.0, 1e-9);
  EXPECT_EQ(r->check.governing, nominal::Criterion::goodman);
  EXPECT_EQ(r->from, 1);  // the minimum (step B) to the maximum (step A)
  EXPECT_EQ(r->to, 0);
}

// Weld group, two parallel welds (B&N Table 9-1: A = 1.414 h d [S]) h = 6 mm, d = 100 mm, b = 80 mm, carrying
// 0 and 8485 N along y: primary shear range 8485 / (1.414 x 6 x 100) = 10.0 MPa [D], checked with FAT 80 shear.
TEST(NominalAssessment, WeldGroupRangeBetweenTheTwoSteps) {
  test::TempDir dir;
  ToeNominalPlan n;
  n.source = nominal::NominalSource::weld_group;
  n.curve = "IIW FAT 80 shear";
  WeldGroupPlan w;
  w.shape = {nominal::WeldLayout::parallel_pair, 6.0, 80.0, 100.0, 0.0, "rail lug"};
  w.measure = nominal::ThroatMeasure::shear;
  w.loads = {nominal::WeldLoad{}, nominal::WeldLoad{0.0, 8485.0, 0.0, 0.0, 0.0}};
  n.weld_group = w;
  const Assessment a = assess(plate_plan(write_plate(dir), n));
  const ToeNominalResult& r = *a.toes.at(0).nominal;
  EXPECT_EQ(r.stress_kind, "shear");
  EXPECT_CLOSE(r.check.range, 8485.0 / (0.707 * 6.0 * 200.0), 1e-9);
  EXPECT_FALSE(a.toes[0].stations.at(0).nominal->concentration_factor.has_value());  // shear: no SCF
}

TEST(NominalAssessment, CutThatMissesThePlateNamesTheToe) {
  test::TempDir dir;
  ToeNominalPlan n = section_nominal();
  n.section.point_mm = Vec3(30, 200, 5);
  const std::string file = write_plate(dir);
  EXPECT_EQ(test::error_of([&] { assess(plate_plan(file, n)); }),
            "toe 'rail' [toe.nominal]: section 'nominal section': the cut plane through (30, 200, 5) mm with normal "
            "(0, 1, 0) misses the model " + file + "; put the point inside the plate and check that it is in mm");
}

TEST(NominalAssessment, ValuesMustMatchTheLoadSteps) {
  test::TempDir dir;
  ToeNominalPlan n;
  n.curve = "IIW FAT 80";
  n.values_MPa = {1.0, 2.0, 3.0};
  EXPECT_EQ(test::error_of([&] { assess(plate_plan(write_plate(dir), n)); }),
            "toe 'rail' [toe.nominal]: key values has 3 values but the plan has 2 load steps; give one value per "
            "load step, in plan order");
}

TEST(NominalAssessment, SectionWithAShearClassIsRefused) {
  test::TempDir dir;
  ToeNominalPlan n = section_nominal();
  n.curve = "IIW FAT 80 shear";
  const std::string e = test::error_of([&] { assess(plate_plan(write_plate(dir), n)); });
  EXPECT_EQ(e.rfind("toe 'rail' [toe.nominal]: the nominal stress of source \"section\" is a normal stress but the "
                    "curve '",
                    0),
            0u)
      << e;
}

}  // namespace
}  // namespace toehold
