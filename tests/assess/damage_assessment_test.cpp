// The damage kinds of loading end to end on a plate with uniform stress fields (so every station's hot-spot
// stress is the field's value exactly): series, blocks and unit cases times a load history, against hand
// calculations, and unit-case superposition against the assessment of the combined FE results.
#include "toehold/assess/assessment.hpp"
#include "toehold/common/error.hpp"
#include "toehold/fatigue/rainflow.hpp"
#include "support/grid.hpp"
#include "support/support.hpp"

#include <vtkXMLUnstructuredGridWriter.h>

#include <algorithm>
#include <cmath>
#include <fstream>
#include <map>

namespace toehold {
namespace {

// A 60 x 60 x 10 mm plate, weld region 3 for y < 20, toe along x at y = 20 on the top face (z = 10).
vtkSmartPointer<vtkUnstructuredGrid> plate(int nx = 6) {
  auto grid = test::make_box_grid(test::GridSpec{60, 60, 10, nx, 12, 2, test::GridCell::hex8});
  test::add_cell_regions(grid, "region", [](const Vec3& x) { return x.y() < 20 ? 3 : 1; });
  test::add_point_ints(grid, "toe", [](const Vec3& x) {
    return std::abs(x.z() - 10) < 1e-9 && std::abs(x.y() - 20) < 1e-9 ? 1 : 0;
  });
  return grid;
}

// Uniform stress: s_yy across the toe, s_xx along it, s_xy in-plane shear (MPa).
void add_uniform(vtkUnstructuredGrid* grid, const std::string& name, double across, double along = 0,
                 double shear = 0) {
  test::add_point_stress(grid, name, [=](const Vec3&) { return Voigt{along, across, 0, shear, 0, 0}; });
}

std::string write(vtkUnstructuredGrid* grid, const std::string& path) {
  auto writer = vtkSmartPointer<vtkXMLUnstructuredGridWriter>::New();
  writer->SetFileName(path.c_str());
  writer->SetInputData(grid);
  writer->Write();
  return path;
}

Plan plan_on(const std::string& file, LoadingKind kind, const std::vector<std::string>& arrays) {
  Plan plan;
  plan.path = "test plan";
  plan.model.file = file;
  plan.model.stress.array = arrays.front();
  plan.model.region_array = "region";
  for (const auto& a : arrays) plan.steps.push_back(StepPlan{a, file, -1, StressSpec{a, {}, ""}});
  plan.loading.kind = kind;
  ToePlan toe;
  toe.name = "toe";
  toe.marker_array = "toe";
  toe.marker_value = 1;
  toe.weld_regions = {3};
  toe.thickness = 10.0;
  toe.curve = "IIW FAT 90";
  toe.damage_limit = 0.5;
  plan.toes = {toe};
  return plan;
}

Assessment run(const Plan& plan) {
  NullReporter quiet;
  return run_assessment(plan, quiet);
}

const StationResult& first_station(const Assessment& a) {
  const StationResult& s = a.toes.at(0).stations.at(0);
  EXPECT_TRUE(s.ok()) << s.problem;
  return s;
}

TEST(DamageAssessment, ConstantAmplitudeSeriesDamageIsCyclesOverCyclesToFailure) {
  test::TempDir dir;
  auto grid = plate();
  add_uniform(grid, "low", 0.0);
  add_uniform(grid, "high", 120.0);
  const std::string file = write(grid, dir.file("plate.vtu"));
  Plan plan = plan_on(file, LoadingKind::series, {"low"});
  plan.steps.clear();
  for (int i = 0; i < 5; ++i) {  // low, high, low, high, ..., low: 5 cycles of 120 MPa
    plan.steps.push_back(StepPlan{"low " + std::to_string(i), file, -1, StressSpec{"low", {}, ""}});
    plan.steps.push_back(StepPlan{"high " + std::to_string(i), file, -1, StressSpec{"high", {}, ""}});
  }
  plan.steps.push_back(StepPlan{"low end", file, -1, StressSpec{"low", {}, ""}});
  plan.loading.repeating_history = true;
  plan.loading.repeats_per_year = 1000;
  const Assessment a = run(plan);
  EXPECT_EQ(a.counting, describe(ResidueRule::repeat_history));
  for (const StationResult& s : a.toes[0].stations) {
    ASSERT_TRUE(s.ok()) << s.problem;
    // IIW FAT 90 [M]: N(120 MPa) = 2e6 (90/120)^3 = 843750 cycles; D = 5 / 843750 (derived [D]).
    EXPECT_CLOSE(s.damage, 5.0 / 843750.0, 1e-12);
    EXPECT_CLOSE(s.cycles_per_repeat, 5.0, 0);
    EXPECT_CLOSE(s.range, 120.0, 1e-9);
    EXPECT_CLOSE(s.utilization, s.damage / 0.5, 1e-12);
    EXPECT_CLOSE(s.life_repeats, 0.5 * 843750.0 / 5.0, 1e-9);
    EXPECT_CLOSE(s.life_years, 0.5 * 843750.0 / 5.0 / 1000.0, 1e-9);
    EXPECT_CLOSE(s.life, 0.5 * 843750.0, 1e-9);
    EXPECT_CLOSE(s.allowable, 90.0, 1e-12);
    ASSERT_FALSE(s.governing.empty());
    EXPECT_CLOSE(s.governing[0].cycle.range, 120.0, 1e-9);
  }
  EXPECT_EQ(a.toes[0].damage_limit, 0.5);
}

TEST(DamageAssessment, BlockSpectrumTwoSlopeDamageByHand) {
  test::TempDir dir;
  auto grid = plate();
  add_uniform(grid, "zero", 0.0);
  add_uniform(grid, "gust", 100.0);
  add_uniform(grid, "wave", -40.0);
  Plan plan = plan_on(write(grid, dir.file("plate.vtu")), LoadingKind::blocks, {"zero", "gust", "wave"});
  plan.loading.blocks = {BlockPlan{"zero", "gust", 0, 1, 1e5, 1}, BlockPlan{"wave", "zero", 2, 0, 1e7, 2}};
  const StationResult& s = first_station(run(plan));
  // Hand calculation [D], IIW FAT 90 (IIW 2016 sec. 3.7 [M]): knee ds_k = 90 (2e6/1e7)^(1/3) = 52.63 MPa;
  // 100 MPa: N1 = 2e6 (90/100)^3 = 1.458e6; 40 MPa: N2 = 1e7 (52.632/40)^5 = 3.9442e7 (m2 = 5).
  // D = 1e5/1.458e6 + 1e7/3.9442e7 = 0.068587 + 0.253535 = 0.322122.
  const double knee = 90.0 * std::cbrt(2e6 / 1e7);
  EXPECT_CLOSE(s.damage, 1e5 / (2e6 * std::pow(0.9, 3)) + 1e7 / (1e7 * std::pow(knee / 40.0, 5)), 1e-12);
  EXPECT_CLOSE(s.damage, 0.322122, 1e-5);
  EXPECT_EQ(s.range_from, 2);  // the governing block: wave to zero
  EXPECT_EQ(s.range_to, 0);
}

TEST(DamageAssessment, SeriesRotatedToStartAtItsPeakGivesTheSameDamage) {
  test::TempDir dir;
  auto grid = plate();
  const std::vector<double> values{10, 80, -20, 150, 30, 90, -60, 40};
  std::vector<std::string> names;
  for (std::size_t i = 0; i < values.size(); ++i) {
    names.push_back("v" + std::to_string(i));
    add_uniform(grid, names.back(), values[i]);
  }
  const std::string file = write(grid, dir.file("plate.vtu"));
  Plan plan = plan_on(file, LoadingKind::series, names);
  plan.loading.repeating_history = true;
  Plan rotated = plan;
  std::rotate(rotated.steps.begin(), rotated.steps.begin() + 3, rotated.steps.end());  // starts at 150 MPa
  const double a = first_station(run(plan)).damage, b = first_station(run(rotated)).damage;
  EXPECT_GT(a, 0.0);
  EXPECT_CLOSE(a, b, 1e-14);
}

// History rows (a_t, b_t) of two unit cases; the combined FE results c_t = a_t u1 + b_t u2 are built with VTK.
const std::vector<std::pair<double, double>> kRows{{0, 0},   {1, 0.5},   {-0.5, 1}, {2, -1},  {0.3, 2},
                                                   {-1, 0.2}, {1.5, -0.7}, {0.8, 0.8}, {0, 0}};

Plan superposition_plan(const test::TempDir& dir, LoadingKind kind, const std::string& definition) {
  auto grid = plate(4);
  add_uniform(grid, "u1", 50, 20, 10);
  add_uniform(grid, "u2", -30, 60, -25);
  std::vector<std::string> combined;
  for (std::size_t t = 0; t < kRows.size(); ++t) {
    const auto [a, b] = kRows[t];
    combined.push_back("c" + std::to_string(t));
    add_uniform(grid, combined.back(), 50 * a - 30 * b, 20 * a + 60 * b, 10 * a - 25 * b);
  }
  const std::string file = write(grid, dir.file("plate.vtu"));
  Plan plan = plan_on(file, kind, kind == LoadingKind::unit_cases ? std::vector<std::string>{"u1", "u2"} : combined);
  plan.toes[0].definition = definition;
  if (kind == LoadingKind::unit_cases) {
    plan.loading.history_file = dir.file("history.csv");
    std::ofstream out(plan.loading.history_file);
    out << "time,u2,u1\n";
    for (std::size_t t = 0; t < kRows.size(); ++t) out << t << "," << kRows[t].second << "," << kRows[t].first << "\n";
  }
  return plan;
}

TEST(DamageAssessment, UnitCasesTimesHistoryEqualTheCombinedFeResults) {
  for (const char* definition : {"perpendicular", "principal", "effective"}) {
    test::TempDir dir;
    const Assessment units = run(superposition_plan(dir, LoadingKind::unit_cases, definition));
    const Assessment combined = run(superposition_plan(dir, LoadingKind::series, definition));
    EXPECT_EQ(units.history_rows, kRows.size());
    ASSERT_EQ(units.toes[0].stations.size(), combined.toes[0].stations.size());
    for (std::size_t i = 0; i < units.toes[0].stations.size(); ++i) {
      const StationResult& u = units.toes[0].stations[i];
      const StationResult& c = combined.toes[0].stations[i];
      ASSERT_TRUE(u.ok() && c.ok());
      EXPECT_GT(c.damage, 0.0) << definition;
      EXPECT_CLOSE(u.damage, c.damage, 1e-12) << definition;
      EXPECT_CLOSE(u.equivalent_range, c.equivalent_range, 1e-9) << definition;
      EXPECT_CLOSE(u.cycles_per_repeat, c.cycles_per_repeat, 0) << definition;
    }
  }
}

TEST(DamageAssessment, HistoryColumnsThatDoNotMatchTheUnitCasesAreAnError) {
  test::TempDir dir;
  Plan plan = superposition_plan(dir, LoadingKind::unit_cases, "perpendicular");
  plan.steps[1].name = "crane";
  try {
    run(plan);
    FAIL();
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()), "load history '" + plan.loading.history_file +
                                         "' line 1: column 'u2' is not a unit case of the plan; name the columns "
                                         "after the [[step]] names (u1, crane) or 'time'");
  }
}

TEST(DamageAssessment, PvdStepOnAnotherMeshIsAnError) {
  test::TempDir dir;
  auto first = plate(6), second = plate(5);
  add_uniform(first, "s", 10);
  add_uniform(second, "s", 20);
  write(first, dir.file("t0.vtu"));
  write(second, dir.file("t1.vtu"));
  {
    std::ofstream pvd(dir.file("series.pvd"));
    pvd << "<?xml version=\"1.0\"?>\n<VTKFile type=\"Collection\" version=\"0.1\">\n<Collection>\n"
        << "<DataSet timestep=\"0\" file=\"t0.vtu\"/>\n<DataSet timestep=\"1\" file=\"t1.vtu\"/>\n"
        << "</Collection>\n</VTKFile>\n";
  }
  const std::string pvd = dir.file("series.pvd");
  Plan plan = plan_on(pvd, LoadingKind::series, {"s"});
  plan.steps = {StepPlan{"s 0", pvd, 0, StressSpec{"s", {}, ""}}, StepPlan{"s 1", pvd, 1, StressSpec{"s", {}, ""}}};
  auto points = [](vtkUnstructuredGrid* g) { return std::to_string(g->GetNumberOfPoints()); };
  try {
    run(plan);
    FAIL();
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()), "load step 's 1': " + dir.file("t1.vtu") + " has " + points(second) +
                                         " points and 120 volume cells, the model (" + dir.file("t0.vtu") + ") has " +
                                         points(first) + " and 144; every load step must be on the same mesh");
  }
}

}  // namespace
}  // namespace toehold
