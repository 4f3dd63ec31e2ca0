// The whole assessment on a shell T-joint (gmsh's plate with attachment, meshes/shell/) with prescribed analytic
// layer stresses: the hot-spot stress and range come out as the hand calculation says, from the intersection line
// and from the weld toe; swapping top and bottom with every normal flipped, and writing the model in metres,
// change nothing; bad input is reported word for word.
#include "toehold/assess/assessment.hpp"
#include "toehold/common/error.hpp"
#include "toehold/plan/plan.hpp"
#include "support/support.hpp"

#include <vtkCellData.h>
#include <vtkDoubleArray.h>
#include <vtkIdList.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkUnstructuredGridReader.h>
#include <vtkXMLUnstructuredGridWriter.h>

#include <cmath>
#include <fstream>
#include <functional>

namespace toehold {
namespace {

// Base plate z = 0 (t = 10 mm), attachment y = 0 standing at +z; the toe runs along x from -50 to 50 mm on the
// intersection line, the read-out goes to -y. Surface stresses (MPa), linear in |y| on each side of the line so the
// quadratic cells reproduce them exactly [D]:
//   step A, +z surface: s_yy = 200 - 1.5|y| + 0.1x; -z surface: s_yy = -50 + 0.5|y|; s_xx = 40 and 10.
//   step B is step A times -0.5.
Tensor surface_stress(const Vec3& x, bool plus_z, double factor) {
  Tensor s = Tensor::Zero();
  s(1, 1) = plus_z ? 200.0 - 1.5 * std::abs(x.y()) + 0.1 * x.x() : -50.0 + 0.5 * std::abs(x.y());
  s(0, 0) = plus_z ? 40.0 : 10.0;
  return factor * s;
}

struct ShellCase {
  bool flipped = false;  // every cell's node order reversed, the layer arrays swapped with it
  bool metres = false;   // points written in m (stresses stay MPa)
};

void reverse_cell(vtkUnstructuredGrid* grid, vtkIdType c) {
  vtkNew<vtkIdList> ids;
  grid->GetCellPoints(c, ids);
  const std::vector<int> quad8{0, 3, 2, 1, 7, 6, 5, 4};
  std::vector<vtkIdType> flipped;
  for (int k : quad8) flipped.push_back(ids->GetId(k));
  grid->ReplaceCell(c, 8, flipped.data());
}

void add_tensor(vtkUnstructuredGrid* grid, const char* name, const std::function<Tensor(const Vec3&)>& f) {
  vtkNew<vtkDoubleArray> a;
  a->SetName(name);
  a->SetNumberOfComponents(6);
  const char* names[6] = {"XX", "YY", "ZZ", "XY", "YZ", "XZ"};
  for (int k = 0; k < 6; ++k) a->SetComponentName(k, names[k]);
  a->SetNumberOfTuples(grid->GetNumberOfPoints());
  for (vtkIdType p = 0; p < grid->GetNumberOfPoints(); ++p) {
    Vec3 x;
    grid->GetPoint(p, x.data());
    const Voigt v = voigt_from_tensor(f(x));
    a->SetTuple(p, v.data());
  }
  grid->GetPointData()->AddArray(a);
}

// The gmsh model with the layers of steps A and B as point data, written as a .vtu. "top" is the base plate cells'
// +normal side: +z as gmsh wrote them (the cells' normals point along +z), -z once they are flipped.
std::string write_shell_model(const ShellCase& c, const test::TempDir& dir) {
  vtkNew<vtkUnstructuredGridReader> reader;
  reader->SetFileName((std::string(TOEHOLD_SOURCE_DIR) + "/meshes/shell/plate_attachment_quad8.vtk").c_str());
  reader->Update();
  vtkSmartPointer<vtkUnstructuredGrid> grid = reader->GetOutput();
  if (c.flipped)
    for (vtkIdType k = 0; k < grid->GetNumberOfCells(); ++k)
      if (grid->GetCellType(k) == VTK_QUADRATIC_QUAD) reverse_cell(grid, k);
  const bool top_is_plus_z = !c.flipped;
  for (const auto& [name, top, factor] : {std::tuple{"top_A", true, 1.0}, std::tuple{"bot_A", false, 1.0},
                                          std::tuple{"top_B", true, -0.5}, std::tuple{"bot_B", false, -0.5}})
    add_tensor(grid, name, [&, top = top, factor = factor](const Vec3& x) {
      return surface_stress(x, top == top_is_plus_z, factor);
    });
  if (c.metres)
    for (vtkIdType p = 0; p < grid->GetNumberOfPoints(); ++p) {
      Vec3 x;
      grid->GetPoint(p, x.data());
      x *= 1e-3;
      grid->GetPoints()->SetPoint(p, x.data());
    }
  const std::string path = dir.file("plate.vtu");
  vtkNew<vtkXMLUnstructuredGridWriter> writer;
  writer->SetFileName(path.c_str());
  writer->SetInputData(grid);
  writer->Write();
  return path;
}

std::string plan_text(const ShellCase& c, const std::string& toe_extra, const std::string& step_a_layers) {
  const double u = c.metres ? 1e-3 : 1.0;
  const auto num = [u](double mm) { return std::to_string(mm * u); };
  return "[model]\nfile = \"plate.vtu\"\nlength_unit = \"" + std::string(c.metres ? "m" : "mm") +
         "\"\nstress_unit = \"MPa\"\nshell = true\nthickness = " + num(10) +
         "\nstress_top = \"top_A\"\nstress_bottom = \"bot_A\"\n"
         "[[step]]\nname = \"A\"\n" + step_a_layers +
         "[[step]]\nname = \"B\"\nstress_top = \"top_B\"\nstress_bottom = \"bot_B\"\n"
         "[[toe]]\nname = \"joint\"\npoints = [[" + num(-50) + ", 0, 0], [" + num(50) + ", 0, 0]]\n"
         "plate_point = [0, " + num(-30) + ", 0]\ncurve = \"IIW FAT 90\"\n" + toe_extra +
         "[requirement]\ncycles = 2e6\n";
}

Assessment run_case(const ShellCase& c, const std::string& toe_extra = "", const std::string& step_a_layers = "") {
  test::TempDir dir;
  write_shell_model(c, dir);
  const std::string plan_path = dir.file("plan.toml");
  std::ofstream(plan_path) << plan_text(c, toe_extra, step_a_layers);
  NullReporter quiet;
  return run_assessment(read_plan(plan_path), quiet);
}

TEST(ShellAssessment, HotSpotFromTheIntersectionLineMatchesTheHandCalculation) {
  const Assessment a = run_case({});
  ASSERT_EQ(a.toes.size(), 1u);
  const ToeResult& toe = a.toes[0];
  ASSERT_EQ(toe.stations.size(), 21u);  // 10 mm quadratic cells over 100 mm: 21 nodes on the line
  EXPECT_EQ(a.model_cells, 344);        // the shell mesh is the model (gmsh's lines and vertices left out)
  for (const StationResult& s : toe.stations) {
    ASSERT_TRUE(s.ok()) << s.problem;
    const double x = s.station.x.x();
    // fine-linear, t = 10: read-out at 4 and 10 mm on the +z (weld-side) surface, extrapolated to the line:
    // A: 200 + 0.1x, B: -100 - 0.05x; range 300 + 0.15x [D].
    ASSERT_EQ(s.hot_spot.size(), 2u);
    EXPECT_CLOSE(s.hot_spot[0], 200.0 + 0.1 * x, 1e-9);
    EXPECT_CLOSE(s.hot_spot[1], -100.0 - 0.05 * x, 1e-9);
    EXPECT_CLOSE(s.range, 300.0 + 0.15 * x, 1e-9);
    EXPECT_CLOSE(s.allowable, 90.0, 1e-9);  // IIW FAT 90 at 2e6 cycles, Hobbacher 2016 Table 3.1 [S]
    EXPECT_CLOSE(s.utilization, (300.0 + 0.15 * x) / 90.0, 1e-9);
    ASSERT_TRUE(s.shell);
    EXPECT_EQ(s.shell->layer, "top");
    EXPECT_EQ(s.shell->origin, "intersection");
    EXPECT_CLOSE(s.shell->offset, 0.0, 1e-12);
    EXPECT_CLOSE(s.shell->hot_spot.z(), 5.0, 1e-9);  // t/2 above the mid-surface
    EXPECT_CLOSE(s.points[0].distance, 4.0, 1e-12);
    EXPECT_FALSE(s.through_thickness);
  }
}

TEST(ShellAssessment, WeldToeOriginShiftsTheHotSpotByHalfTheAttachmentPlusTheLeg) {
  const Assessment a = run_case({}, "origin = \"weld-toe\"\nweld_leg = 6\n");
  for (const StationResult& s : a.toes[0].stations) {
    ASSERT_TRUE(s.ok()) << s.problem;
    const double x = s.station.x.x();
    // Offset a = 10/2 + 6 = 11 mm [D]; read-out at 15 and 21 mm from the line, extrapolated to 11 mm:
    // A: 200 - 16.5 + 0.1x, B: -0.5 of it; range 1.5 (183.5 + 0.1x) [D].
    EXPECT_CLOSE(s.shell->offset, 11.0, 1e-12);
    EXPECT_CLOSE(s.shell->from_intersection[0], 15.0, 1e-9);
    EXPECT_CLOSE(s.hot_spot[0], 183.5 + 0.1 * x, 1e-9);
    EXPECT_CLOSE(s.range, 1.5 * (183.5 + 0.1 * x), 1e-9);
  }
}

TEST(ShellAssessment, BottomLayerOnRequest) {
  const Assessment a = run_case({}, "layer = \"bottom\"\n");
  for (const StationResult& s : a.toes[0].stations) {
    ASSERT_TRUE(s.ok()) << s.problem;
    // -z surface: s_yy = -50 + 0.5|y| extrapolates to -50 (A) and 25 (B): range 75 [D].
    EXPECT_EQ(s.shell->layer, "bottom");
    EXPECT_CLOSE(s.hot_spot[0], -50.0, 1e-9);
    EXPECT_CLOSE(s.range, 75.0, 1e-9);
  }
}

TEST(ShellAssessment, TopBottomSwapWithFlippedNormalsAndMetresGiveTheSameAnswer) {
  const Assessment plain = run_case({});
  for (const ShellCase& c : {ShellCase{true, false}, ShellCase{false, true}, ShellCase{true, true}}) {
    const Assessment other = run_case(c);
    ASSERT_EQ(other.toes[0].stations.size(), plain.toes[0].stations.size());
    for (std::size_t i = 0; i < plain.toes[0].stations.size(); ++i) {
      const StationResult& a = plain.toes[0].stations[i];
      const StationResult& b = other.toes[0].stations[i];
      ASSERT_TRUE(b.ok()) << b.problem;
      EXPECT_CLOSE(b.range, a.range, 1e-9);
      EXPECT_CLOSE(b.hot_spot[0], a.hot_spot[0], 1e-9);
      EXPECT_EQ(b.shell->layer, c.flipped ? "bottom" : "top");  // the weld side, seen from the flipped normals
    }
  }
}

TEST(ShellAssessment, NoNodalAverageWarningForShellModels) {
  const Assessment a = run_case({});
  for (const std::string& w : a.warnings) EXPECT_EQ(w.find("nodal averages"), std::string::npos) << w;
}

TEST(ShellAssessment, MissingLayerArrayNamesTheStepFileAndArray) {
  const std::string message = test::error_of([] { run_case({}, "", "stress_top = \"S_missing\"\nstress_bottom = \"bot_A\"\n"); });
  EXPECT_EQ(message.rfind("load step 'A': ", 0), 0u) << message;
  EXPECT_NE(message.find("plate.vtu: has no numeric point or cell array named 'S_missing'; its point arrays are: "),
            std::string::npos)
      << message;
}

}  // namespace
}  // namespace toehold
