// Reading stress arrays straight from a .vtu: the values equal those VTK's own reader gives, bit for bit, for
// raw appended files; every other kind of file is "not handled"; a whole series assesses the same either way.
#include "support/grid.hpp"
#include "support/support.hpp"
#include "toehold/assess/assessment.hpp"
#include "toehold/common/error.hpp"
#include "toehold/model/vtu_array_reader.hpp"

#include <vtkCellData.h>
#include <vtkDoubleArray.h>
#include <vtkFloatArray.h>
#include <vtkIntArray.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkXMLUnstructuredGridReader.h>
#include <vtkXMLUnstructuredGridWriter.h>

#include <cmath>
#include <filesystem>
#include <fstream>
#include <limits>

namespace toehold {
namespace {

// How a test file is written by vtkXMLUnstructuredGridWriter.
enum class Layout { raw, appended_base64, binary, ascii };
struct Writing {
  Layout layout = Layout::raw;
  bool compressed = false;
  bool uint64_header = false;
  bool big_endian = false;
};

// Values with all mantissa bits in use, so a wrong conversion or byte would show: tuple i, component c.
double wild(vtkIdType i, int c) { return std::sin(0.37 * static_cast<double>(i) + 1.1 * c) * 1234.567 + 1.0 / (c + 3); }

template <class ArrayType>
void add_array(vtkDataSetAttributes* data, const char* name, int comps, vtkIdType n, bool names) {
  vtkNew<ArrayType> a;
  a->SetName(name);
  a->SetNumberOfComponents(comps);
  a->SetNumberOfTuples(n);
  static const char* kNames[] = {"Sxx", "Syy", "Szz", "Sxy", "Syz", "Sxz"};
  if (names && comps == 6)
    for (int c = 0; c < 6; ++c) a->SetComponentName(c, kNames[(c + 2) % 6]);  // stored in a rotated order
  for (vtkIdType i = 0; i < n; ++i)
    for (int c = 0; c < comps; ++c) a->SetComponent(i, c, wild(i, c) * (comps == 9 ? 1.0 + 0.01 * c : 1.0));
  data->AddArray(a);
}

// A 3 x 2 x 2 hex box with Float32 and Float64 point and cell arrays of 6, 9 and 1 components and an Int32 one.
vtkSmartPointer<vtkUnstructuredGrid> test_grid() {
  auto grid = test::make_box_grid(test::GridSpec{3, 2, 2, 3, 2, 2, test::GridCell::hex8});
  const vtkIdType np = grid->GetNumberOfPoints(), nc = grid->GetNumberOfCells();
  add_array<vtkFloatArray>(grid->GetPointData(), "s32", 6, np, true);
  add_array<vtkDoubleArray>(grid->GetPointData(), "s64", 6, np, true);
  add_array<vtkFloatArray>(grid->GetPointData(), "full", 9, np, false);
  add_array<vtkIntArray>(grid->GetPointData(), "ints", 6, np, true);
  add_array<vtkDoubleArray>(grid->GetCellData(), "c64", 6, nc, true);
  add_array<vtkFloatArray>(grid->GetCellData(), "c32", 6, nc, false);
  for (const char* name : {"sxx", "syy", "szz", "sxy", "syz", "sxz"})
    add_array<vtkDoubleArray>(grid->GetPointData(), name, 1, np, false);
  return grid;
}

std::string write(vtkUnstructuredGrid* grid, const std::string& path, const Writing& w) {
  vtkNew<vtkXMLUnstructuredGridWriter> writer;
  writer->SetFileName(path.c_str());
  writer->SetInputData(grid);
  if (w.layout == Layout::ascii) writer->SetDataModeToAscii();
  if (w.layout == Layout::binary) writer->SetDataModeToBinary();
  if (w.layout == Layout::raw || w.layout == Layout::appended_base64) writer->SetDataModeToAppended();
  if (w.layout == Layout::raw) writer->EncodeAppendedDataOff();
  if (!w.compressed) writer->SetCompressorTypeToNone();
  if (w.uint64_header) writer->SetHeaderTypeToUInt64();
  if (w.big_endian) writer->SetByteOrderToBigEndian();
  if (writer->Write() != 1) throw std::runtime_error("could not write " + path);
  return path;
}

// The file as VTK's own reader gives it, as a Mesh named after the file.
Mesh read_with_vtk(const std::string& path) {
  vtkNew<vtkXMLUnstructuredGridReader> reader;
  reader->SetFileName(path.c_str());
  reader->Update();
  return Mesh(vtkSmartPointer<vtkUnstructuredGrid>(reader->GetOutput()), path, LengthUnit::mm);
}

std::optional<std::vector<VtuArray>> read_direct(const std::string& path, const std::vector<std::string>& names,
                                                 vtkUnstructuredGrid* grid) {
  return read_vtu_arrays(path, names, grid->GetNumberOfPoints(), grid->GetNumberOfCells());
}

// The stress of `spec` through read_stress on VTK's grid and on the directly read arrays; both must agree exactly.
void expect_same_stress(const std::string& path, vtkUnstructuredGrid* grid, const StressSpec& spec,
                        const std::vector<std::string>& names) {
  const auto arrays = read_direct(path, names, grid);
  ASSERT_TRUE(arrays.has_value()) << path;
  std::vector<StressArrayView> views;
  for (const VtuArray& a : *arrays) views.push_back(stress_view(a));
  const StressField direct = read_stress(path, views, spec, StressUnit::Pa);
  const StressField reference = read_stress(read_with_vtk(path), spec, StressUnit::Pa);
  EXPECT_EQ(direct.where(), reference.where());
  EXPECT_EQ(direct.values(), reference.values());  // bit-identical, not merely close
}

// Values of a VTK array, as double.
std::vector<double> vtk_values(vtkDataArray* a) {
  std::vector<double> out;
  for (vtkIdType i = 0; i < a->GetNumberOfTuples(); ++i)
    for (int c = 0; c < a->GetNumberOfComponents(); ++c) out.push_back(a->GetComponent(i, c));
  return out;
}

std::vector<double> direct_values(const VtuArray& a) {
  return a.f32.empty() ? a.f64 : std::vector<double>(a.f32.begin(), a.f32.end());
}

TEST(VtuArrayReader, RawAppendedArraysEqualWhatVtkReads) {
  test::TempDir dir;
  auto grid = test_grid();
  for (const Writing w : {Writing{Layout::raw, false, false, false}, Writing{Layout::raw, false, true, false},
                          Writing{Layout::raw, false, false, true}, Writing{Layout::raw, false, true, true}}) {
    const std::string path = write(grid, dir.file("raw.vtu"), w);
    const Mesh reference = read_with_vtk(path);
    const auto arrays = read_direct(path, {"s32", "s64", "full", "c64", "c32"}, grid);
    ASSERT_TRUE(arrays.has_value()) << "UInt64 header " << w.uint64_header << ", big-endian " << w.big_endian;
    for (const VtuArray& a : *arrays) {
      vtkDataSetAttributes* data = a.where == Association::point
                                       ? static_cast<vtkDataSetAttributes*>(reference.grid()->GetPointData())
                                       : static_cast<vtkDataSetAttributes*>(reference.grid()->GetCellData());
      vtkDataArray* expected = data->GetArray(a.name.c_str());
      ASSERT_NE(expected, nullptr) << a.name;
      EXPECT_EQ(a.components, expected->GetNumberOfComponents());
      EXPECT_EQ(a.tuples, static_cast<std::size_t>(expected->GetNumberOfTuples()));
      EXPECT_EQ(a.f32.empty(), expected->GetDataType() != VTK_FLOAT) << a.name;
      EXPECT_EQ(direct_values(a), vtk_values(expected)) << a.name;
      for (int c = 0; c < a.components; ++c) {
        const char* name = expected->GetComponentName(c);
        EXPECT_EQ(a.component_names[static_cast<std::size_t>(c)], name ? name : "") << a.name << " " << c;
      }
    }
  }
}

TEST(VtuArrayReader, StressFromDirectArraysIsBitIdenticalToTheVtkPath) {
  test::TempDir dir;
  auto grid = test_grid();
  for (const bool uint64 : {false, true}) {
    const std::string path = write(grid, dir.file("raw.vtu"), Writing{Layout::raw, false, uint64, false});
    expect_same_stress(path, grid, StressSpec{"s32", {}, ""}, {"s32"});                  // order from names
    expect_same_stress(path, grid, StressSpec{"s64", {}, "xx,yy,zz,xy,yz,xz"}, {"s64"});  // declared order
    expect_same_stress(path, grid, StressSpec{"full", {}, ""}, {"full"});                 // 9 components
    expect_same_stress(path, grid, StressSpec{"c64", {}, ""}, {"c64"});                   // cell data
    expect_same_stress(path, grid, StressSpec{"c32", {}, "11 22 33 12 23 13"}, {"c32"});
    const std::array<std::string, 6> six{"sxx", "syy", "szz", "sxy", "syz", "sxz"};
    expect_same_stress(path, grid, StressSpec{"", six, ""}, {six.begin(), six.end()});
  }
}

TEST(VtuArrayReader, OtherFilesAreNotHandled) {
  test::TempDir dir;
  auto grid = test_grid();
  const std::vector<std::string> names{"s32"};
  for (const Writing w : {Writing{Layout::raw, true, false, false},
                          Writing{Layout::appended_base64, false, false, false},
                          Writing{Layout::binary, false, false, false}, Writing{Layout::ascii, false, false, false}}) {
    const std::string path = write(grid, dir.file("other.vtu"), w);
    EXPECT_FALSE(read_direct(path, names, grid).has_value()) << static_cast<int>(w.layout) << " " << w.compressed;
  }
  const std::string raw = write(grid, dir.file("raw.vtu"), Writing{});
  EXPECT_FALSE(read_direct(raw, {"no such array"}, grid).has_value());
  EXPECT_FALSE(read_direct(raw, {"ints"}, grid).has_value());  // Int32: VTK reads it
  EXPECT_FALSE(read_vtu_arrays(raw, names, grid->GetNumberOfPoints() + 1, grid->GetNumberOfCells()).has_value());
  EXPECT_FALSE(read_vtu_arrays(raw, names, grid->GetNumberOfPoints(), grid->GetNumberOfCells() - 1).has_value());
  EXPECT_FALSE(read_direct(dir.file("missing.vtu"), names, grid).has_value());
  // Cut off in the middle of the appended data: the arrays at the end are not all there.
  const auto size = std::filesystem::file_size(raw);
  std::filesystem::resize_file(raw, size / 2);
  EXPECT_FALSE(read_direct(raw, {"sxx", "syy", "szz", "sxy", "syz", "sxz"}, grid).has_value());
}

TEST(VtuArrayReader, HeaderLongerThanOneReadIsFollowedToTheAppendedData) {
  test::TempDir dir;
  auto grid = test_grid();
  // 1,000 small arrays with long names: an XML header of well over 64 kB, read in several pieces.
  for (int i = 0; i < 1000; ++i) {
    vtkNew<vtkFloatArray> a;
    a->SetName(("padding array with a rather long name to make the header long, number " + std::to_string(i)).c_str());
    a->SetNumberOfTuples(grid->GetNumberOfCells());
    a->Fill(static_cast<double>(i));
    grid->GetCellData()->AddArray(a);
  }
  const std::string path = write(grid, dir.file("long.vtu"), Writing{});
  std::ifstream in(path, std::ios::binary);
  std::string head(200000, '\0');
  in.read(head.data(), static_cast<std::streamsize>(head.size()));
  ASSERT_GT(head.find("<AppendedData"), std::size_t{128} << 10);
  expect_same_stress(path, grid, StressSpec{"s32", {}, ""}, {"s32"});
  expect_same_stress(path, grid, StressSpec{"c64", {}, ""}, {"c64"});
}

TEST(VtuArrayReader, NonFiniteValueGivesTheSameMessageBothWays) {
  test::TempDir dir;
  auto grid = test_grid();
  vtkDataArray* s = grid->GetPointData()->GetArray("s32");
  s->SetComponent(7, 4, std::numeric_limits<double>::quiet_NaN());
  const std::string path = write(grid, dir.file("nan.vtu"), Writing{});
  const auto arrays = read_direct(path, {"s32"}, grid);
  ASSERT_TRUE(arrays.has_value());
  const std::vector<StressArrayView> views{stress_view(arrays->front())};
  const StressSpec spec{"s32", {}, ""};
  const std::string direct = test::error_of([&] { read_stress(path, views, spec, StressUnit::MPa); });
  EXPECT_EQ(direct, path + ": array 's32' holds a non-finite value (nan) at point 7; fix the solver results or "
                           "write them again");
  EXPECT_EQ(direct, test::error_of([&] { read_stress(read_with_vtk(path), spec, StressUnit::MPa); }));
}

TEST(VtuArrayReader, MissingOrderGivesTheSameMessageBothWays) {
  test::TempDir dir;
  auto grid = test_grid();
  const std::string path = write(grid, dir.file("c32.vtu"), Writing{});
  const auto arrays = read_direct(path, {"c32"}, grid);
  ASSERT_TRUE(arrays.has_value());
  const std::vector<StressArrayView> views{stress_view(arrays->front())};
  const StressSpec spec{"c32", {}, ""};
  const std::string direct = test::error_of([&] { read_stress(path, views, spec, StressUnit::MPa); });
  EXPECT_EQ(direct, path + ": cannot tell the component order of 6-component array 'c32' (component names: (none), "
                           "(none), (none), (none), (none), (none)); declare its component order in the plan, e.g. "
                           "order = \"xx,yy,zz,xy,yz,xz\"");
  EXPECT_EQ(direct, test::error_of([&] { read_stress(read_with_vtk(path), spec, StressUnit::MPa); }));
}

// A 60 x 60 x 10 mm plate, weld region y < 20, toe along x at y = 20 on top; three load steps, each in its own
// file, with a Float32 point stress that varies with position and step.
std::vector<std::string> write_series(const test::TempDir& dir, const std::string& stem, const Writing& w) {
  auto grid = test::make_box_grid(test::GridSpec{60, 60, 10, 12, 24, 4, test::GridCell::hex8});
  test::add_cell_regions(grid, "region", [](const Vec3& x) { return x.y() < 20 ? 3 : 1; });
  test::add_point_ints(grid, "toe", [](const Vec3& x) {
    return std::abs(x.z() - 10) < 1e-9 && std::abs(x.y() - 20) < 1e-9 ? 1 : 0;
  });
  std::vector<std::string> files;
  for (int k = 0; k < 3; ++k) {
    vtkNew<vtkFloatArray> s;
    s->SetName("S");
    s->SetNumberOfComponents(6);
    s->SetNumberOfTuples(grid->GetNumberOfPoints());
    for (int c = 0; c < 6; ++c) s->SetComponentName(c, std::array{"XX", "YY", "ZZ", "XY", "YZ", "XZ"}[c]);
    for (vtkIdType p = 0; p < grid->GetNumberOfPoints(); ++p) {
      const Vec3 x = test::grid_point(grid, p);
      for (int c = 0; c < 6; ++c)
        s->SetComponent(p, c, (c == 1 ? 100.0 + 3.1 * x.y() : wild(p, c) * 0.01) * (1.0 - 0.7 * k));
    }
    grid->GetPointData()->AddArray(s);
    vtkNew<vtkFloatArray> half;  // the same stress halved (exact in Float32)
    half->DeepCopy(s);
    half->SetName("H");
    for (vtkIdType j = 0; j < half->GetNumberOfValues(); ++j) half->SetValue(j, 0.5f * s->GetValue(j));
    grid->GetPointData()->AddArray(half);
    files.push_back(write(grid, dir.file(stem + std::to_string(k) + ".vtu"), w));
  }
  return files;
}

Assessment assess_series(const std::vector<std::string>& files,
                         const std::vector<std::string>& arrays = {"S", "S", "S"}) {
  Plan plan;
  plan.path = "test plan";
  plan.model.file = files[0];
  plan.model.stress.array = "S";
  plan.model.region_array = "region";
  for (std::size_t k = 0; k < files.size(); ++k)
    plan.steps.push_back(StepPlan{"step " + std::to_string(k), files[k], -1, StressSpec{arrays[k], {}, ""}});
  plan.loading.kind = LoadingKind::series;
  ToePlan toe;
  toe.name = "toe";
  toe.marker_array = "toe";
  toe.marker_value = 1;
  toe.weld_regions = {3};
  toe.thickness = 10.0;
  toe.curve = "IIW FAT 90";
  plan.toes = {toe};
  plan.requirement.cycles = 2e6;
  NullReporter quiet;
  return run_assessment(plan, quiet);
}

TEST(VtuArrayReader, SeriesOfRawFilesAssessesExactlyAsTheVtkPath) {
  test::TempDir dir;
  const auto raw = write_series(dir, "raw", Writing{});
  const auto binary = write_series(dir, "binary", Writing{Layout::binary, false, false, false});
  auto probe = read_with_vtk(raw[1]);
  ASSERT_TRUE(read_direct(raw[1], {"S"}, probe.grid()).has_value());      // steps 2 and 3 take the direct path
  ASSERT_FALSE(read_direct(binary[1], {"S"}, probe.grid()).has_value());  // ... here VTK reads them
  const Assessment a = assess_series(raw), b = assess_series(binary);
  ASSERT_EQ(a.toes.size(), 1u);
  ASSERT_EQ(a.toes[0].stations.size(), b.toes[0].stations.size());
  ASSERT_GE(a.toes[0].stations.size(), 13u);
  for (std::size_t i = 0; i < a.toes[0].stations.size(); ++i) {
    const StationResult &x = a.toes[0].stations[i], &y = b.toes[0].stations[i];
    ASSERT_TRUE(x.ok()) << x.problem;
    EXPECT_EQ(x.hot_spot, y.hot_spot);
    EXPECT_EQ(x.range, y.range);
    EXPECT_EQ(x.damage, y.damage);
    EXPECT_EQ(x.utilization, y.utilization);
  }
  EXPECT_EQ(a.input_files.size(), b.input_files.size());
}

TEST(VtuArrayReader, TwoStepsOnOneFileReadEachTheirOwnArray) {
  // Steps 2 and 3 both use file 1, with different arrays; on either path step 3 must find its array, not reuse
  // what was read for step 2. Station values are linear in the nodal stress, so halving it halves them.
  test::TempDir dir;
  for (const Writing w : {Writing{}, Writing{Layout::binary, false, false, false}}) {
    const auto files = write_series(dir, w.layout == Layout::raw ? "raw" : "binary", w);
    const Assessment a = assess_series({files[0], files[1], files[1]}, {"S", "S", "H"});
    for (const StationResult& s : a.toes[0].stations) {
      ASSERT_TRUE(s.ok()) << s.problem;
      EXPECT_CLOSE(s.hot_spot[2], 0.5 * s.hot_spot[1], 1e-12);
    }
  }
}

}  // namespace
}  // namespace toehold
