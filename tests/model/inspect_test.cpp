// Inspecting a model file: cell counts before cleaning, bounds, arrays and what they look like, quirks.
#include "support/support.hpp"
#include "toehold/model/inspect.hpp"

#include <vtkCellData.h>
#include <vtkCellType.h>
#include <vtkDoubleArray.h>
#include <vtkFloatArray.h>
#include <vtkIntArray.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLUnstructuredGridWriter.h>

#include <fstream>

namespace toehold {
namespace {

// A unit-free box 0..20 x 0..10 x 0..5 as one hexahedron, with one boundary triangle and Float32 points, like
// FreeFEM writes: six scalar stress arrays, an Int32 region marker per cell, a 6-component tensor.
vtkSmartPointer<vtkUnstructuredGrid> freefem_like() {
  auto grid = vtkSmartPointer<vtkUnstructuredGrid>::New();
  auto points = vtkSmartPointer<vtkPoints>::New();
  points->SetDataTypeToFloat();
  for (int p = 0; p < 8; ++p) points->InsertNextPoint(20.0 * ((p + 1) / 2 % 2), 10.0 * (p / 2 % 2), 5.0 * (p / 4));
  grid->SetPoints(points);
  const vtkIdType hex[8] = {0, 1, 2, 3, 4, 5, 6, 7};
  grid->InsertNextCell(VTK_HEXAHEDRON, 8, hex);
  const vtkIdType tri[3] = {0, 1, 2};
  grid->InsertNextCell(VTK_TRIANGLE, 3, tri);
  const char* names[6] = {"Sxx", "Syy", "Szz", "Sxy", "Syz", "Sxz"};
  for (int k = 0; k < 6; ++k) {
    auto a = vtkSmartPointer<vtkFloatArray>::New();
    a->SetName(names[k]);
    for (int p = 0; p < 8; ++p) a->InsertNextValue(static_cast<float>(k + p));
    grid->GetPointData()->AddArray(a);
  }
  auto tensor = vtkSmartPointer<vtkDoubleArray>::New();
  tensor->SetName("S");
  tensor->SetNumberOfComponents(6);
  const char* comps[6] = {"XX", "YY", "ZZ", "XY", "YZ", "XZ"};
  for (int k = 0; k < 6; ++k) tensor->SetComponentName(k, comps[k]);
  tensor->SetNumberOfTuples(8);
  tensor->Fill(0.0);
  grid->GetPointData()->AddArray(tensor);
  auto region = vtkSmartPointer<vtkIntArray>::New();
  region->SetName("region");
  region->InsertNextValue(2);
  region->InsertNextValue(7);
  grid->GetCellData()->AddArray(region);
  return grid;
}

void write(vtkUnstructuredGrid* grid, const std::string& path) {
  auto w = vtkSmartPointer<vtkXMLUnstructuredGridWriter>::New();
  w->SetInputData(grid);
  w->SetFileName(path.c_str());
  ASSERT_EQ(w->Write(), 1);
}

const ArrayInfo* find(const ModelSummary& s, const std::string& name) {
  for (const ArrayInfo& a : s.arrays)
    if (a.name == name) return &a;
  return nullptr;
}

TEST(InspectModel, CountsCellsBeforeCleaningAndRemarksOnQuirks) {
  test::TempDir dir;
  write(freefem_like(), dir.file("ff.vtu"));
  NullReporter none;
  const ModelSummary s = inspect_model(dir.file("ff.vtu"), none);
  ASSERT_EQ(s.cell_types.size(), 2u);
  EXPECT_EQ(s.cell_types[0].vtk_type, VTK_TRIANGLE);
  EXPECT_EQ(s.cell_types[0].count, 1);
  EXPECT_EQ(s.cell_types[1].name, "hexahedron");
  EXPECT_EQ(s.cells, 1);
  EXPECT_EQ(s.points, 8);
  EXPECT_EQ(s.bounds[1], 20.0);
  EXPECT_EQ(s.bounds[3], 10.0);
  EXPECT_EQ(s.bounds[5], 5.0);
  ASSERT_EQ(s.remarks.size(), 2u);
  EXPECT_EQ(s.remarks[0], "dropped 1 cell of dimension < 3 (1 triangle)");
  EXPECT_EQ(s.remarks[1], "Float32 points converted to double");
}

TEST(InspectModel, RecognisesTensorsComponentSetsAndMarkers) {
  test::TempDir dir;
  write(freefem_like(), dir.file("ff.vtu"));
  NullReporter none;
  const ModelSummary s = inspect_model(dir.file("ff.vtu"), none);
  const ArrayInfo* sxy = find(s, "Sxy");
  ASSERT_NE(sxy, nullptr);
  EXPECT_EQ(sxy->value_type, "Float32");
  EXPECT_EQ(sxy->min, 3.0);  // k + p with k = 3, p = 0..7
  EXPECT_EQ(sxy->max, 10.0);
  EXPECT_EQ(sxy->looks_like, "stress component xy (one of six scalar arrays 'S...')");
  const ArrayInfo* tensor = find(s, "S");
  ASSERT_NE(tensor, nullptr);
  EXPECT_EQ(tensor->components, 6);
  EXPECT_EQ(tensor->looks_like, "stress tensor (order from names: xx=XX, yy=YY, zz=ZZ, xy=XY, yz=YZ, xz=XZ)");
  const ArrayInfo* region = find(s, "region");
  ASSERT_NE(region, nullptr);
  EXPECT_FALSE(region->point_data);
  EXPECT_TRUE(region->integer);
  EXPECT_EQ(region->value_type, "Int32");
  EXPECT_EQ(region->looks_like, "toe or region marker (values 2)");  // the triangle's 7 is dropped with it
}

TEST(InspectModel, PvdCountsStepsAndShowsTheFirst) {
  test::TempDir dir;
  write(freefem_like(), dir.file("a.vtu"));
  write(freefem_like(), dir.file("b.vtu"));
  std::ofstream(dir.file("s.pvd")) << "<?xml version=\"1.0\"?>\n<VTKFile type=\"Collection\" version=\"0.1\">\n"
                                      "<Collection>\n<DataSet timestep=\"0\" file=\"a.vtu\"/>\n"
                                      "<DataSet timestep=\"1\" file=\"b.vtu\"/>\n</Collection>\n</VTKFile>\n";
  NullReporter none;
  const ModelSummary s = inspect_model(dir.file("s.pvd"), none);
  EXPECT_EQ(s.pvd_steps, 2);
  EXPECT_EQ(s.cells, 1);
  const std::string text = format_summary(s);
  EXPECT_NE(text.find("Steps in the .pvd: 2 (showing step 0)\n"), std::string::npos) << text;
  EXPECT_NE(text.find("  triangle (VTK 5): 1\n  hexahedron (VTK 12): 1\n"), std::string::npos) << text;
  EXPECT_NE(text.find("Bounds (file length unit): x 0 .. 20, y 0 .. 10, z 0 .. 5\n"), std::string::npos) << text;
  EXPECT_NE(text.find("  region  Int32, 1 component, range 2 .. 2\n      looks like: toe or region marker (values 2)\n"),
            std::string::npos)
      << text;
}

TEST(InspectModel, SurfaceOnlyFileIsDescribedWithAWarning) {
  test::TempDir dir;
  auto grid = freefem_like();
  auto surface = vtkSmartPointer<vtkUnstructuredGrid>::New();
  surface->SetPoints(grid->GetPoints());
  const vtkIdType tri[3] = {0, 1, 2};
  surface->InsertNextCell(VTK_TRIANGLE, 3, tri);
  write(surface, dir.file("skin.vtu"));
  struct Warnings final : Reporter {
    void info(const std::string&) override {}
    void warn(const std::string& m) override { seen.push_back(m); }
    void progress(const std::string&, std::size_t, std::size_t) override {}
    std::vector<std::string> seen;
  } rec;
  const ModelSummary s = inspect_model(dir.file("skin.vtu"), rec);
  EXPECT_EQ(s.cells, 1);
  ASSERT_EQ(rec.seen.size(), 1u);
  ASSERT_EQ(s.remarks.size(), 1u);
  EXPECT_EQ(s.remarks[0], "toehold cannot use this model as it is: " + rec.seen[0]);
}

}  // namespace
}  // namespace toehold
