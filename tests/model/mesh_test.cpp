// Reading every supported file format to the same mesh and stress, solver quirks cleaned, bad inputs refused.
#include "support/support.hpp"
#include "toehold/common/error.hpp"
#include "toehold/model/mesh.hpp"
#include "toehold/model/stress_field.hpp"

#include <vtkCellData.h>
#include <vtkCellType.h>
#include <vtkDoubleArray.h>
#include <vtkIntArray.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkPolyData.h>
#include <vtkPolyDataWriter.h>
#include <vtkUnsignedCharArray.h>
#include <vtkUnstructuredGridWriter.h>
#include <vtkXMLPolyDataWriter.h>
#include <vtkXMLUnstructuredGridWriter.h>

#include <filesystem>
#include <fstream>
#include <map>

namespace toehold {
namespace {

using test::TempDir;

class RecordingReporter final : public Reporter {
public:
  void info(const std::string& m) override { infos.push_back(m); }
  void warn(const std::string& m) override { warnings.push_back(m); }
  void progress(const std::string&, std::size_t, std::size_t) override {}
  std::vector<std::string> infos, warnings;
};

// The test model: two hexahedra side by side, x in {0, 500, 1000} mm, y in {0, 250} mm, z in {0, 125} mm.
// Point p = i + 3 (j + 2 k) sits at (500 i, 250 j, 125 k). All coordinates are exact in Float32, mm and m.
struct BoxOptions {
  double file_per_mm = 1.0;    // file length units per mm (0.001 for a file in metres)
  double file_per_mpa = 1.0;   // file stress units per MPa (1e6 for a file in pascals)
  bool float32 = false;        // Float32 points, as FreeFEM writes them
  bool triangles = false;      // two boundary triangles mixed into the grid, as FreeFEM writes them
  double stress_factor = 1.0;  // scales the stress (a second load step)
};

// Stress of the test model at x (mm), MPa, internal Voigt order: a linear field, exact in binary.
Voigt box_stress(const Vec3& x) {
  return {1 + x[0] / 125, 2 + x[1] / 125, 3 + x[2] / 125, 4 + x[0] / 250, 5.0, 6 - x[2] / 125};
}

Vec3 box_point(int p) { return {500.0 * (p % 3), 250.0 * ((p / 3) % 2), 125.0 * (p / 6)}; }

std::array<vtkIdType, 8> hex_points(int c) {
  const vtkIdType i = c;
  return {i, i + 1, i + 4, i + 3, i + 6, i + 7, i + 10, i + 9};
}

vtkSmartPointer<vtkUnstructuredGrid> make_box(const BoxOptions& o) {
  auto grid = vtkSmartPointer<vtkUnstructuredGrid>::New();
  auto points = vtkSmartPointer<vtkPoints>::New();
  points->SetDataType(o.float32 ? VTK_FLOAT : VTK_DOUBLE);
  auto stress = vtkSmartPointer<vtkDoubleArray>::New();
  stress->SetName("S");
  stress->SetNumberOfComponents(6);
  const char* names[6] = {"XX", "YY", "ZZ", "XY", "YZ", "XZ"};
  for (int k = 0; k < 6; ++k) stress->SetComponentName(k, names[k]);
  for (int p = 0; p < 12; ++p) {
    const Vec3 x = box_point(p);
    points->InsertNextPoint(x[0] * o.file_per_mm, x[1] * o.file_per_mm, x[2] * o.file_per_mm);
    Voigt v = box_stress(x);
    for (double& s : v) s *= o.file_per_mpa * o.stress_factor;
    stress->InsertNextTuple(v.data());
  }
  grid->SetPoints(points);
  grid->GetPointData()->AddArray(stress);
  auto region = vtkSmartPointer<vtkIntArray>::New();
  region->SetName("region");
  for (int c = 0; c < 2; ++c) {
    grid->InsertNextCell(VTK_HEXAHEDRON, 8, hex_points(c).data());
    region->InsertNextValue(c + 1);
    if (!o.triangles) continue;
    const vtkIdType tri[3] = {c, c + 1, c + 4};
    grid->InsertNextCell(VTK_TRIANGLE, 3, tri);
    region->InsertNextValue(7);
  }
  grid->GetCellData()->AddArray(region);
  return grid;
}

enum class XmlMode { ascii, binary, appended_raw, appended_base64, zlib };

void write_vtu(vtkUnstructuredGrid* grid, const std::string& path, XmlMode mode) {
  auto w = vtkSmartPointer<vtkXMLUnstructuredGridWriter>::New();
  w->SetFileName(path.c_str());
  w->SetInputData(grid);
  w->SetCompressorTypeToNone();
  if (mode == XmlMode::ascii) w->SetDataModeToAscii();
  if (mode == XmlMode::binary || mode == XmlMode::zlib) w->SetDataModeToBinary();
  if (mode == XmlMode::zlib) w->SetCompressorTypeToZLib();
  if (mode == XmlMode::appended_raw || mode == XmlMode::appended_base64) w->SetDataModeToAppended();
  w->SetEncodeAppendedData(mode == XmlMode::appended_base64);
  ASSERT_EQ(w->Write(), 1);
}

void write_legacy(vtkUnstructuredGrid* grid, const std::string& path, bool binary) {
  auto w = vtkSmartPointer<vtkUnstructuredGridWriter>::New();
  w->SetFileName(path.c_str());
  w->SetInputData(grid);
  if (binary) w->SetFileTypeToBinary();
  ASSERT_EQ(w->Write(), 1);
}

// Checks the mesh is the two-hex test model in mm with the box stress, whatever order its points come in.
void expect_box(const Mesh& mesh, double stress_factor = 1.0) {
  vtkUnstructuredGrid* g = mesh.grid();
  ASSERT_EQ(g->GetNumberOfCells(), 2);
  ASSERT_EQ(g->GetNumberOfPoints(), 12);
  EXPECT_EQ(g->GetPoints()->GetDataType(), VTK_DOUBLE);
  std::map<std::array<double, 3>, int> where;  // exact position -> expected point index
  for (int p = 0; p < 12; ++p) where[{box_point(p)[0], box_point(p)[1], box_point(p)[2]}] = p;
  const StressField field = read_stress(mesh, StressSpec{"S", {}, ""}, StressUnit::MPa);
  ASSERT_EQ(field.size(), 12u);
  std::vector<int> file_index(12, -1);
  for (vtkIdType p = 0; p < 12; ++p) {
    std::array<double, 3> x{};
    g->GetPoint(p, x.data());
    ASSERT_EQ(where.count(x), 1u) << "point " << p << " at " << x[0] << " " << x[1] << " " << x[2];
    file_index[static_cast<std::size_t>(p)] = where[x];
    const Voigt expected = box_stress(box_point(where[x]));
    for (std::size_t k = 0; k < 6; ++k) EXPECT_CLOSE(field.voigt(p)[k], stress_factor * expected[k], 1e-12);
  }
  for (vtkIdType c = 0; c < 2; ++c) {
    EXPECT_EQ(g->GetCellType(c), VTK_HEXAHEDRON);
    vtkIdType n = 0;
    const vtkIdType* pts = nullptr;
    g->GetCellPoints(c, n, pts);
    ASSERT_EQ(n, 8);
    const int first = file_index[static_cast<std::size_t>(pts[0])];  // 0 or 1: which hex this is
    const auto expected = hex_points(first);
    for (int k = 0; k < 8; ++k) EXPECT_EQ(file_index[static_cast<std::size_t>(pts[k])], expected[k]);
  }
}

Mesh read_quietly(const std::string& path, int step = -1, LengthUnit unit = LengthUnit::mm) {
  NullReporter none;
  return read_mesh(path, step, unit, none);
}

TEST(ReadMesh, EveryXmlEncodingReadsToTheSameMesh) {
  TempDir dir;
  const auto grid = make_box({});
  for (XmlMode mode : {XmlMode::ascii, XmlMode::binary, XmlMode::appended_raw, XmlMode::appended_base64, XmlMode::zlib}) {
    const std::string path = dir.file("box" + std::to_string(static_cast<int>(mode)) + ".vtu");
    write_vtu(grid, path, mode);
    SCOPED_TRACE(path);
    expect_box(read_quietly(path));
  }
}

TEST(ReadMesh, LegacyAsciiAndBinaryReadToTheSameMesh) {
  TempDir dir;
  const auto grid = make_box({});
  for (bool binary : {false, true}) {
    const std::string path = dir.file(binary ? "box_bin.vtk" : "box_ascii.vtk");
    write_legacy(grid, path, binary);
    SCOPED_TRACE(path);
    expect_box(read_quietly(path));
  }
}

TEST(ReadMesh, MetresAndPascalsGiveTheSameInternalValues) {
  TempDir dir;
  write_vtu(make_box({0.001, 1e6}), dir.file("si.vtu"), XmlMode::binary);
  NullReporter none;
  const Mesh mesh = read_mesh(dir.file("si.vtu"), -1, LengthUnit::m, none);
  EXPECT_EQ(mesh.length_unit(), LengthUnit::m);
  ASSERT_EQ(mesh.grid()->GetNumberOfPoints(), 12);
  const StressField field = read_stress(mesh, StressSpec{"S", {}, ""}, StressUnit::Pa);
  for (vtkIdType p = 0; p < 12; ++p) {
    // 0.5 m * 1000 = 500 mm exactly [D]; 1e6 Pa = 1 MPa [D].
    for (int k = 0; k < 3; ++k) EXPECT_CLOSE(mesh.grid()->GetPoint(p)[k], box_point(static_cast<int>(p))[k], 1e-12);
    const Voigt expected = box_stress(box_point(static_cast<int>(p)));
    for (std::size_t k = 0; k < 6; ++k) EXPECT_CLOSE(field.voigt(p)[k], expected[k], 1e-12);
  }
}

TEST(ReadMesh, Float32PointsAndBoundaryTrianglesAreCleaned) {
  TempDir dir;
  BoxOptions o;
  o.float32 = true;
  o.triangles = true;
  write_vtu(make_box(o), dir.file("freefem.vtu"), XmlMode::binary);
  RecordingReporter rec;
  const Mesh mesh = read_mesh(dir.file("freefem.vtu"), -1, LengthUnit::mm, rec);
  expect_box(mesh);
  // Cell data follows the kept cells: regions 1, 2 (the triangles' 7 are gone).
  vtkDataArray* region = mesh.grid()->GetCellData()->GetArray("region");
  ASSERT_NE(region, nullptr);
  EXPECT_EQ(region->GetNumberOfTuples(), 2);
  EXPECT_EQ(region->GetTuple1(0), 1.0);
  EXPECT_EQ(region->GetTuple1(1), 2.0);
  ASSERT_EQ(rec.infos.size(), 1u);
  EXPECT_EQ(rec.infos[0], "freefem.vtu: dropped 2 cells of dimension < 3 (2 triangle); Float32 points converted to double");
}

// Two pieces as a partitioned solver writes them: each piece holds both hexes, one of them as a ghost, with
// its own point numbering; the .pvtu lists every piece twice (once per function written, like DOLFINx).
void write_partitioned(const TempDir& dir) {
  const auto whole = make_box({});
  for (int piece = 0; piece < 2; ++piece) {
    auto grid = vtkSmartPointer<vtkUnstructuredGrid>::New();
    auto points = vtkSmartPointer<vtkPoints>::New();
    points->SetDataTypeToDouble();
    auto stress = vtkSmartPointer<vtkDoubleArray>::New();
    stress->DeepCopy(whole->GetPointData()->GetArray("S"));
    for (vtkIdType p = 0; p < 12; ++p) {  // piece 1 numbers its points backwards
      const vtkIdType from = piece == 0 ? p : 11 - p;
      points->InsertNextPoint(whole->GetPoint(from));
      stress->SetTuple(p, whole->GetPointData()->GetArray("S")->GetTuple(from));
    }
    grid->SetPoints(points);
    grid->GetPointData()->AddArray(stress);
    auto ghost = vtkSmartPointer<vtkUnsignedCharArray>::New();
    ghost->SetName("vtkGhostType");
    for (int c = 0; c < 2; ++c) {
      auto ids = hex_points(c);
      if (piece == 1)
        for (auto& id : ids) id = 11 - id;
      grid->InsertNextCell(VTK_HEXAHEDRON, 8, ids.data());
      ghost->InsertNextValue(c == piece ? 0 : 1);
    }
    grid->GetCellData()->AddArray(ghost);
    write_vtu(grid, dir.file("part_p" + std::to_string(piece) + ".vtu"), XmlMode::ascii);
  }
  std::ofstream(dir.file("part.pvtu")) << R"(<?xml version="1.0"?>
<VTKFile type="PUnstructuredGrid" version="0.1">
  <PUnstructuredGrid GhostLevel="1">
    <PPoints><PDataArray type="Float64" NumberOfComponents="3"/></PPoints>
    <PPointData><PDataArray type="Float64" Name="S" NumberOfComponents="6"/></PPointData>
    <PCellData><PDataArray type="UInt8" Name="vtkGhostType"/></PCellData>
    <Piece Source="part_p0.vtu"/>
    <Piece Source="part_p1.vtu"/>
    <Piece Source="part_p0.vtu"/>
    <Piece Source="./part_p1.vtu"/>
  </PUnstructuredGrid>
</VTKFile>
)";
}

std::string read_error(const std::string& path);

TEST(ReadMesh, PvtuDropsRepeatedPiecesAndGhostsAndMergesPieces) {
  TempDir dir;
  write_partitioned(dir);
  RecordingReporter rec;
  const Mesh mesh = read_mesh(dir.file("part.pvtu"), -1, LengthUnit::mm, rec);
  expect_box(mesh);
  EXPECT_EQ(mesh.grid()->GetCellData()->GetArray("vtkGhostType"), nullptr);
  // Each piece: 8 points of its own hex kept, 4 used only by its ghost; piece 1 shares 4 points with piece 0 [D].
  ASSERT_EQ(rec.infos.size(), 1u);
  EXPECT_EQ(rec.infos[0], "part.pvtu: dropped 2 repeated pieces, 2 ghost cells, 8 points used by no kept cell; "
                          "merged 4 points shared by pieces");
}

TEST(ReadMesh, PvtuWithAMissingPieceNamesIt) {
  TempDir dir;
  write_partitioned(dir);
  std::filesystem::remove(dir.file("part_p1.vtu"));
  EXPECT_EQ(read_error(dir.file("part.pvtu")),
            dir.file("part.pvtu") + ": its piece 'part_p1.vtu' (" + dir.file("part_p1.vtu") + ") does not exist");
}

void write_pvd(const TempDir& dir) {
  BoxOptions second;
  second.stress_factor = 2.0;
  write_vtu(make_box({}), dir.file("run_000000.vtu"), XmlMode::appended_raw);
  write_vtu(make_box(second), dir.file("run_000001.vtu"), XmlMode::appended_raw);
  std::ofstream(dir.file("run.pvd")) << R"(<?xml version="1.0"?>
<VTKFile type="Collection" version="0.1">
  <Collection>
    <DataSet timestep="0" part="0" file="run_000000.vtu"/>
    <DataSet timestep="1.5" part="0" file="run_000001.vtu"/>
  </Collection>
</VTKFile>
)";
}

TEST(ReadMesh, PvdStepsResolveToTheirFiles) {
  TempDir dir;
  write_pvd(dir);
  const auto entries = read_pvd(dir.file("run.pvd"));
  ASSERT_EQ(entries.size(), 2u);
  EXPECT_EQ(entries[1].time, 1.5);
  EXPECT_EQ(entries[1].part, 0);
  EXPECT_EQ(entries[1].file, dir.file("run_000001.vtu"));
  EXPECT_EQ(resolve_series_file(dir.file("box.vtu"), 3), dir.file("box.vtu"));
  expect_box(read_quietly(dir.file("run.pvd"), 0), 1.0);
  expect_box(read_quietly(dir.file("run.pvd"), 1), 2.0);
}

TEST(ReadMesh, PvdStepErrors) {
  TempDir dir;
  write_pvd(dir);
  const std::string pvd = dir.file("run.pvd");
  try {
    resolve_series_file(pvd, -1);
    FAIL() << "no error";
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()), pvd + ": has 2 steps; name the step to use (steps 0 to 1)");
  }
  try {
    resolve_series_file(pvd, 2);
    FAIL() << "no error";
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()), pvd + ": has no step 2; it has steps 0 to 1");
  }
  std::ofstream(dir.file("parts.pvd")) << R"(<VTKFile type="Collection" version="0.1"><Collection>
    <DataSet timestep="0" part="0" file="run_000000.vtu"/><DataSet timestep="0" part="1" file="run_000001.vtu"/>
    </Collection></VTKFile>)";
  try {
    resolve_series_file(dir.file("parts.pvd"), 0);
    FAIL() << "no error";
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()), dir.file("parts.pvd") + ": step 0 is split into 2 parts; toehold reads one file "
                                                             "per step: write the step as one .vtu or .pvtu");
  }
}

std::string read_error(const std::string& path) {
  try {
    read_quietly(path);
  } catch (const Error& e) {
    return e.what();
  }
  return "no error";
}

TEST(ReadMesh, MissingFileAndFolderAreRefused) {
  TempDir dir;
  EXPECT_EQ(read_error(dir.file("nope.vtu")), dir.file("nope.vtu") + ": no such file; check the path and the current folder");
  EXPECT_EQ(read_error(dir.path().string()),
            dir.path().string() + ": is a folder, not a model file; name a .vtu, .pvtu, .vtk or .pvd file");
  std::ofstream(dir.file("model.inp")) << "*NODE\n";
  EXPECT_EQ(read_error(dir.file("model.inp")),
            dir.file("model.inp") + ": unknown model format '.inp'; toehold reads .vtu, .pvtu, .vtk (legacy "
                                    "unstructured grid) and .pvd files");
}

TEST(ReadMesh, FileWithoutVolumeCellsIsRefused) {
  TempDir dir;
  auto grid = make_box({});
  auto surface = vtkSmartPointer<vtkUnstructuredGrid>::New();
  surface->SetPoints(grid->GetPoints());
  const vtkIdType tri[3] = {0, 1, 4};
  surface->InsertNextCell(VTK_TRIANGLE, 3, tri);
  write_vtu(surface, dir.file("skin.vtu"), XmlMode::ascii);
  EXPECT_EQ(read_error(dir.file("skin.vtu")),
            dir.file("skin.vtu") + ": has no volume cells (only cells of dimension < 3 or ghost cells); toehold "
                                   "needs the solid mesh with its stresses");
}

TEST(ReadMesh, UnsupportedCellTypeIsNamedWithItsCell) {
  TempDir dir;
  auto grid = make_box({});
  auto cells = hex_points(0);
  grid->InsertNextCell(VTK_CONVEX_POINT_SET, 8, cells.data());
  grid->GetCellData()->GetArray("region")->InsertNextTuple1(3);
  write_vtu(grid, dir.file("odd.vtu"), XmlMode::ascii);
  EXPECT_EQ(read_error(dir.file("odd.vtu")),
            dir.file("odd.vtu") + ": cell 2 is a convex point set (VTK cell type 41), which toehold cannot use; mesh "
                                  "the model with tetrahedra, hexahedra, wedges or pyramids (linear, quadratic or "
                                  "Lagrange)");
}

TEST(ReadMesh, OtherDataSetTypesAreNamed) {
  TempDir dir;
  auto poly = vtkSmartPointer<vtkPolyData>::New();
  poly->SetPoints(make_box({})->GetPoints());
  auto legacy = vtkSmartPointer<vtkPolyDataWriter>::New();
  legacy->SetInputData(poly);
  legacy->SetFileName(dir.file("skin.vtk").c_str());
  ASSERT_EQ(legacy->Write(), 1);
  EXPECT_EQ(read_error(dir.file("skin.vtk")),
            dir.file("skin.vtk") + ": holds a legacy VTK POLYDATA data set, not an UNSTRUCTURED_GRID; write the "
                                   "volume mesh as an unstructured grid");
  auto xml = vtkSmartPointer<vtkXMLPolyDataWriter>::New();
  xml->SetInputData(poly);
  xml->SetFileName(dir.file("skin.vtu").c_str());
  ASSERT_EQ(xml->Write(), 1);
  EXPECT_EQ(read_error(dir.file("skin.vtu")),
            dir.file("skin.vtu") + ": holds a VTK XML PolyData data set, not an unstructured grid; write the volume "
                                   "mesh as an UnstructuredGrid (.vtu)");
}

void cut_in_half(const std::string& path) {
  const auto size = std::filesystem::file_size(path);
  std::filesystem::resize_file(path, size / 2);
}

TEST(ReadMesh, TruncatedFilesGiveAnErrorAndPrintNothing) {
  TempDir dir;
  const auto grid = make_box({});
  std::vector<std::string> files;
  for (XmlMode mode : {XmlMode::ascii, XmlMode::binary, XmlMode::appended_raw, XmlMode::appended_base64, XmlMode::zlib}) {
    files.push_back(dir.file("cut" + std::to_string(static_cast<int>(mode)) + ".vtu"));
    write_vtu(grid, files.back(), mode);
  }
  files.push_back(dir.file("cut_ascii.vtk"));
  write_legacy(grid, files.back(), false);
  files.push_back(dir.file("cut_binary.vtk"));
  write_legacy(grid, files.back(), true);
  for (const std::string& f : files) {
    cut_in_half(f);
    SCOPED_TRACE(f);
    testing::internal::CaptureStderr();
    const std::string message = read_error(f);
    EXPECT_EQ(testing::internal::GetCapturedStderr(), "");
    EXPECT_EQ(message.rfind(f + ": cannot be read (", 0), 0u) << message;
    const std::string tail = "); the file may be truncated or corrupt: write it again from the solver";
    ASSERT_GE(message.size(), tail.size());
    EXPECT_EQ(message.substr(message.size() - tail.size()), tail) << message;
  }
}

TEST(ReadMesh, QuadraticAndLagrangeCellsSurvive) {
  TempDir dir;
  auto grid = vtkSmartPointer<vtkUnstructuredGrid>::New();
  auto points = vtkSmartPointer<vtkPoints>::New();
  // Corners of a unit tetrahedron and its six mid-edge nodes (VTK order: edges 01, 12, 20, 03, 13, 23).
  const double tet[10][3] = {{0, 0, 0}, {1, 0, 0}, {0, 1, 0}, {0, 0, 1}, {.5, 0, 0},
                             {.5, .5, 0}, {0, .5, 0}, {0, 0, .5}, {.5, 0, .5}, {0, .5, .5}};
  for (const auto& x : tet) points->InsertNextPoint(x);
  // A unit hexahedron at x in [2, 3]: its 27 nodes on the 3x3x3 lattice, in VTK's Lagrange order.
  const int lattice[27][3] = {{0, 0, 0}, {2, 0, 0}, {2, 2, 0}, {0, 2, 0}, {0, 0, 2}, {2, 0, 2}, {2, 2, 2}, {0, 2, 2},
                              {1, 0, 0}, {2, 1, 0}, {1, 2, 0}, {0, 1, 0}, {1, 0, 2}, {2, 1, 2}, {1, 2, 2}, {0, 1, 2},
                              {0, 0, 1}, {2, 0, 1}, {0, 2, 1}, {2, 2, 1}, {0, 1, 1}, {2, 1, 1}, {1, 0, 1}, {1, 2, 1},
                              {1, 1, 0}, {1, 1, 2}, {1, 1, 1}};
  for (const auto& n : lattice) points->InsertNextPoint(2 + 0.5 * n[0], 0.5 * n[1], 0.5 * n[2]);
  grid->SetPoints(points);
  std::vector<vtkIdType> ids(37);
  for (vtkIdType i = 0; i < 37; ++i) ids[static_cast<std::size_t>(i)] = i;
  grid->InsertNextCell(VTK_QUADRATIC_TETRA, 10, ids.data());
  grid->InsertNextCell(VTK_LAGRANGE_TETRAHEDRON, 10, ids.data());
  grid->InsertNextCell(VTK_LAGRANGE_TETRAHEDRON, 4, ids.data());
  grid->InsertNextCell(VTK_LAGRANGE_HEXAHEDRON, 27, ids.data() + 10);
  grid->InsertNextCell(VTK_LAGRANGE_HEXAHEDRON, 8, ids.data() + 10);
  write_vtu(grid, dir.file("high.vtu"), XmlMode::ascii);
  const Mesh mesh = read_quietly(dir.file("high.vtu"));
  vtkUnstructuredGrid* g = mesh.grid();
  ASSERT_EQ(g->GetNumberOfCells(), 5);
  EXPECT_EQ(g->GetNumberOfPoints(), 37);
  const int types[5] = {VTK_QUADRATIC_TETRA, VTK_LAGRANGE_TETRAHEDRON, VTK_LAGRANGE_TETRAHEDRON,
                        VTK_LAGRANGE_HEXAHEDRON, VTK_LAGRANGE_HEXAHEDRON};
  const vtkIdType sizes[5] = {10, 10, 4, 27, 8};
  for (vtkIdType c = 0; c < 5; ++c) {
    EXPECT_EQ(g->GetCellType(c), types[c]);
    EXPECT_EQ(g->GetCell(c)->GetNumberOfPoints(), sizes[c]);
  }
  EXPECT_EQ(g->GetPoint(36)[0], 2.5);  // hex body node at (2.5, 0.5, 0.5) [D]
}

}  // namespace
}  // namespace toehold
