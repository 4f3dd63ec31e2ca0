// Through-thickness linearization inside the assessment: a plate in pure bending gives membrane 0 and the surface
// bending stress exactly, beside the surface extrapolation; a line that enters the weld voids the linearization of
// that station only; the key is refused on shell models; point stresses on shared nodes are said to be averages.
#include "toehold/assess/assessment.hpp"
#include "toehold/common/error.hpp"
#include "toehold/plan/plan.hpp"
#include "support/grid.hpp"
#include "support/support.hpp"

#include <gmock/gmock.h>
#include <vtkXMLUnstructuredGridWriter.h>

#include <cmath>
#include <fstream>

namespace toehold {
namespace {

using ::testing::HasSubstr;

// A 60 x 60 x 10 mm plate (z from 0 to 10), the toe along x on the top face at y = 20, the weld side towards -y
// (weld_point). Pure bending across the toe: s_yy = k (z - 5), k = 20 MPa/mm in step A and -10 in step B, so the
// top surface carries 100 and -50 MPa and the mid-plane nothing [D].
struct BendCase {
  test::GridCell cell = test::GridCell::hex20;
  bool cell_data = false;
  bool weld_pocket = false;  // region 3 under the toe for x < 20, z < 5 (a weld root reaching into the plate)
  std::string toe_extra = "through_thickness = true\n";
};

Voigt bending(const Vec3& x, double k) {
  Voigt v{};
  v[1] = k * (x.z() - 5.0);
  return v;
}

std::string write_plate(const BendCase& c, const test::TempDir& dir) {
  auto grid = test::make_box_grid(test::GridSpec{60, 60, 10, 12, 24, 4, c.cell});
  for (const auto& [name, k] : {std::pair{"sA", 20.0}, std::pair{"sB", -10.0}}) {
    const auto f = [k = k](const Vec3& x) { return bending(x, k); };
    if (c.cell_data)
      test::add_cell_stress(grid, name, f);
    else
      test::add_point_stress(grid, name, f);
  }
  test::add_cell_regions(grid, "region", [&](const Vec3& x) {
    return c.weld_pocket && x.x() < 20 && std::abs(x.y() - 20) < 2.5 && x.z() < 5 ? 3 : 1;
  });
  test::add_point_ints(grid, "toe",
                       [](const Vec3& x) { return std::abs(x.z() - 10) < 1e-9 && std::abs(x.y() - 20) < 1e-9; });
  const std::string path = dir.file("plate.vtu");
  vtkNew<vtkXMLUnstructuredGridWriter> writer;
  writer->SetFileName(path.c_str());
  writer->SetInputData(grid);
  writer->Write();
  return path;
}

Assessment run_bend(const BendCase& c) {
  test::TempDir dir;
  write_plate(c, dir);
  const std::string plan_path = dir.file("plan.toml");
  std::ofstream(plan_path) << "[model]\nfile = \"plate.vtu\"\nlength_unit = \"mm\"\nstress_unit = \"MPa\"\n"
                              "region_array = \"region\"\n"
                              "[[step]]\nname = \"A\"\nstress = \"sA\"\n[[step]]\nname = \"B\"\nstress = \"sB\"\n"
                              "[[toe]]\nname = \"bend\"\nmarker_array = \"toe\"\nmarker_value = 1\n"
                              "weld_point = [30, 15, 10.5]\nweld_regions = [3]\nthickness = 10\n"
                              "curve = \"IIW FAT 90\"\n"
                           << c.toe_extra << "[requirement]\ncycles = 2e6\n";
  NullReporter quiet;
  return run_assessment(read_plan(plan_path), quiet);
}

TEST(ThroughThickness, PureBendingGivesZeroMembraneAndTheSurfaceBendingStress) {
  for (const std::string& rule :
       {std::string("through_thickness = true\n"),
        std::string("through_thickness = true\nthrough_thickness_rule = \"simpson\"\nthrough_thickness_points = 21\n")}) {
    BendCase c;
    c.toe_extra = rule;
    const Assessment a = run_bend(c);
    ASSERT_EQ(a.toes[0].stations.size(), 25u);  // hex20 toe nodes every 2.5 mm from x = 0 to 60
    for (const StationResult& s : a.toes[0].stations) {
      ASSERT_TRUE(s.ok()) << s.problem;
      ASSERT_TRUE(s.through_thickness);
      const ThroughThicknessResult& tt = *s.through_thickness;
      ASSERT_TRUE(tt.ok()) << tt.problem;
      ASSERT_EQ(tt.structural.size(), 2u);
      // ASME BPVC VIII-2 Annex 5-A on s = k (z - 5): membrane 0, bending 5k at the top surface, peak 0 [D].
      EXPECT_CLOSE(tt.membrane[0], 0.0, 1e-9);
      EXPECT_CLOSE(tt.bending[0], 100.0, 1e-9);
      EXPECT_CLOSE(tt.structural[0], 100.0, 1e-9);
      EXPECT_CLOSE(tt.structural[1], -50.0, 1e-9);
      EXPECT_CLOSE(tt.peak[0], 0.0, 1e-9);
      EXPECT_CLOSE(tt.hot_spot[0], 100.0, 1e-9);
      EXPECT_CLOSE(tt.structural_range, 150.0, 1e-9);
      // 1 mm below the surface (Xiao and Yamada 2004): k (9 - 5) = 80 and -40, range 120 [D].
      EXPECT_CLOSE(tt.one_mm[0], 80.0, 1e-9);
      EXPECT_CLOSE(tt.one_mm_range, 120.0, 1e-9);
      EXPECT_TRUE(std::isnan(tt.stop_depth));
      // The surface route sees the same constant 100 / -50 across the toe.
      EXPECT_CLOSE(s.range, 150.0, 1e-9);
    }
  }
}

TEST(ThroughThickness, StationsWithoutTheKeyHaveNoLinearization) {
  BendCase c;
  c.toe_extra = "";
  const Assessment a = run_bend(c);
  for (const StationResult& s : a.toes[0].stations) EXPECT_FALSE(s.through_thickness);
}

TEST(ThroughThickness, LineEnteringTheWeldVoidsThatStationsLinearizationOnly) {
  BendCase c;
  c.weld_pocket = true;
  const Assessment a = run_bend(c);
  int voided = 0;
  for (const StationResult& s : a.toes[0].stations) {
    ASSERT_TRUE(s.ok()) << s.problem;  // the surface result stays
    EXPECT_CLOSE(s.range, 150.0, 1e-9);
    const ThroughThicknessResult& tt = *s.through_thickness;
    const double x = s.station.x.x();
    if (x > 22.5) {
      EXPECT_TRUE(tt.ok()) << "x = " << x << ": " << tt.problem;
    }
    if (x >= 17.5) continue;
    ++voided;
    EXPECT_THAT(tt.problem, HasSubstr("the through-thickness line enters the weld at "));
    EXPECT_GE(tt.stop_depth, 5.0 - 1e-9);  // the pocket starts 5 mm below the surface
    EXPECT_LE(tt.stop_depth, 7.0);         // ... and the next 9-point Gauss-Lobatto depth is 6.82 mm
    EXPECT_TRUE(tt.structural.empty());
    bool said = false;
    for (const std::string& n : s.notes)
      said = said || n.rfind("through-thickness linearization: the through-thickness line enters the weld", 0) == 0;
    EXPECT_TRUE(said);
  }
  EXPECT_EQ(voided, 7);  // x = 0, 2.5, ..., 15
}

TEST(ThroughThickness, NodalAveragesAreSaidOncePerRun) {
  const Assessment point = run_bend({});
  const std::string said =
      "the stresses are point data on nodes that neighbouring cells share, so they are nodal averages: smoothed "
      "across cell boundaries, also across the weld/plate boundary where weld and plate cells share nodes; cell "
      "data or element-nodal values (nodes repeated per cell) avoid this";
  EXPECT_EQ(std::count(point.warnings.begin(), point.warnings.end(), said), 1);
  BendCase cells;
  cells.cell_data = true;
  cells.cell = test::GridCell::hex8;
  const Assessment cell = run_bend(cells);
  EXPECT_EQ(std::count(cell.warnings.begin(), cell.warnings.end(), said), 0);
}

TEST(ThroughThickness, KeyOnAShellModelIsRefused) {
  const std::string plan =
      "[model]\nfile = \"p.vtu\"\nlength_unit = \"mm\"\nstress_unit = \"MPa\"\nshell = true\nthickness = 10\n"
      "stress_top = \"a\"\nstress_bottom = \"b\"\n[[step]]\nname = \"A\"\n[[step]]\nname = \"B\"\n"
      "[[toe]]\nname = \"t\"\npoints = [[0, 0, 0], [1, 0, 0]]\nplate_point = [0, -5, 0]\ncurve = \"IIW FAT 90\"\n"
      "through_thickness = true\n[requirement]\ncycles = 2e6\n";
  EXPECT_EQ(test::error_of([&] { parse_plan(plan, "plan.toml"); }),
            "plan.toml line 18: toe 't': key toe.through_thickness applies to solid models: a shell's layers are "
            "already its membrane and bending parts");
}

}  // namespace
}  // namespace toehold
