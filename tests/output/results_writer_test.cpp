// The result files read back with VTK's own readers: every array and value of stations.vtp, readout.vtp and
// model.vtu, coordinates converted from mm to the model's unit, the .pvd collection, and the storage format.
// Expected values are the hand-made inputs of sample_results.hpp; conversions are derived [D] (1 m = 1000 mm).
#include "output/sample_results.hpp"
#include "support/support.hpp"
#include "toehold/common/error.hpp"
#include "toehold/output/results_writer.hpp"

#include <vtkCellArray.h>
#include <vtkDataArray.h>
#include <vtkDoubleArray.h>
#include <vtkFieldData.h>
#include <vtkIdList.h>
#include <vtkIntArray.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkPolyData.h>
#include <vtkSmartPointer.h>
#include <vtkStringArray.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLPolyDataReader.h>
#include <vtkXMLUnstructuredGridReader.h>

#include <cmath>
#include <filesystem>
#include <fstream>
#include <regex>
#include <sstream>

namespace toehold::test {
namespace {

vtkSmartPointer<vtkPolyData> read_vtp(const std::string& path) {
  vtkNew<vtkXMLPolyDataReader> reader;
  reader->SetFileName(path.c_str());
  reader->Update();
  return reader->GetOutput();
}

vtkSmartPointer<vtkUnstructuredGrid> read_vtu(const std::string& path) {
  vtkNew<vtkXMLUnstructuredGridReader> reader;
  reader->SetFileName(path.c_str());
  reader->Update();
  return reader->GetOutput();
}

vtkDoubleArray* doubles(vtkDataSet* data, const std::string& name) {
  auto* a = vtkDoubleArray::SafeDownCast(data->GetPointData()->GetAbstractArray(name.c_str()));
  EXPECT_NE(a, nullptr) << "no Float64 point array '" << name << "'";
  return a;
}

vtkIntArray* ints(vtkDataSet* data, const std::string& name) {
  auto* a = vtkIntArray::SafeDownCast(data->GetPointData()->GetAbstractArray(name.c_str()));
  EXPECT_NE(a, nullptr) << "no Int32 point array '" << name << "'";
  return a;
}

std::vector<std::string> strings(vtkDataObject* data, const std::string& name) {
  auto* a = vtkStringArray::SafeDownCast(data->GetFieldData()->GetAbstractArray(name.c_str()));
  EXPECT_NE(a, nullptr) << "no field data '" << name << "'";
  std::vector<std::string> out;
  if (a)
    for (vtkIdType i = 0; i < a->GetNumberOfValues(); ++i) out.push_back(a->GetValue(i));
  return out;
}

std::vector<vtkIdType> cell_ids(vtkCellArray* cells, vtkIdType cell) {
  vtkNew<vtkIdList> ids;
  cells->GetCellAtId(cell, ids);
  std::vector<vtkIdType> out;
  for (vtkIdType i = 0; i < ids->GetNumberOfIds(); ++i) out.push_back(ids->GetId(i));
  return out;
}

std::string file_text(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  std::ostringstream os;
  os << in.rdbuf();
  return os.str();
}

// The sample written once into a fresh folder, in metres.
class WrittenResults : public ::testing::Test {
protected:
  void SetUp() override {
    grid = sample_grid();
    a = sample_assessment(grid);
    folder = dir.file("results");
    files = write_results(a, Mesh(grid, "beam.vtu", LengthUnit::m), folder, LengthUnit::m);
  }
  std::string file(const std::string& name) const { return folder + "/" + name; }
  const StationResult& station(int toe, int index) const {
    return a.toes[static_cast<std::size_t>(toe)].stations[static_cast<std::size_t>(index)];
  }

  TempDir dir;
  vtkSmartPointer<vtkUnstructuredGrid> grid;
  Assessment a;
  std::string folder;
  std::vector<std::string> files;
};

TEST_F(WrittenResults, ReturnsEveryFileInsideTheFolder) {
  const std::vector<std::string> expected{file("stations.vtp"), file("readout.vtp"), file("model.vtu"),
                                          file("results.pvd"), file("stations.csv"), file("results.json"),
                                          file("report.html"), file("view_results.py")};
  EXPECT_EQ(files, expected);
  for (const auto& f : files) EXPECT_TRUE(std::filesystem::is_regular_file(f)) << f;
  EXPECT_TRUE(std::filesystem::is_regular_file(file(OutputFolder::kMarkerName)));
}

TEST_F(WrittenResults, StationPointsAreInModelUnitsAndLinesFollowEachToe) {
  auto data = read_vtp(file("stations.vtp"));
  ASSERT_EQ(data->GetNumberOfPoints(), 6);
  EXPECT_EQ(data->GetPoints()->GetDataType(), VTK_DOUBLE);
  int row = 0;
  for (int t = 0; t < 2; ++t)
    for (int s = 0; s < 3; ++s, ++row) {
      double x[3];
      data->GetPoint(row, x);
      for (int k = 0; k < 3; ++k) EXPECT_DOUBLE_EQ(x[k], station(t, s).station.x[k] / 1000.0);  // mm -> m [D]
    }
  EXPECT_EQ(data->GetNumberOfVerts(), 6);
  ASSERT_EQ(data->GetNumberOfLines(), 2);
  EXPECT_EQ(cell_ids(data->GetLines(), 0), (std::vector<vtkIdType>{0, 1, 2}));     // open toe
  EXPECT_EQ(cell_ids(data->GetLines(), 1), (std::vector<vtkIdType>{3, 4, 5, 3}));  // loop closes on its start
}

TEST_F(WrittenResults, StationArraysCarryEveryResult) {
  auto data = read_vtp(file("stations.vtp"));
  ASSERT_EQ(data->GetNumberOfPoints(), 6);
  auto* toe = ints(data, "toe number");
  auto* id = ints(data, "station id");
  auto* arc = doubles(data, "arc length [m]");
  auto* hot0 = doubles(data, "hot-spot stress hoist loaded [MPa]");
  auto* hot1 = doubles(data, "hot-spot stress lift, 'swung' [MPa]");  // VTK names cannot hold '"'
  auto* range = doubles(data, "hot-spot stress range [MPa]");
  auto* allowable = doubles(data, "allowable stress range [MPa]");
  auto* util = doubles(data, "utilization [-]");
  auto* life = doubles(data, "life [cycles]");
  auto* exceeds = ints(data, "exceeds allowable [1 = yes]");
  auto* has = ints(data, "has result [1 = yes]");
  ASSERT_TRUE(toe && id && arc && hot0 && hot1 && range && allowable && util && life && exceeds && has);
  int row = 0;
  for (int t = 0; t < 2; ++t)
    for (int s = 0; s < 3; ++s, ++row) {
      const StationResult& in = station(t, s);
      EXPECT_EQ(toe->GetValue(row), t + 1);
      EXPECT_EQ(id->GetValue(row), s + 1);
      EXPECT_DOUBLE_EQ(arc->GetValue(row), in.station.arc / 1000.0);  // mm -> m [D]
      EXPECT_EQ(has->GetValue(row), in.ok() ? 1 : 0);
      EXPECT_EQ(exceeds->GetValue(row), in.ok() && in.utilization > 1.0 ? 1 : 0);
      if (!in.ok()) {
        for (auto* a_ : {hot0, hot1, range, allowable, util, life}) EXPECT_TRUE(std::isnan(a_->GetValue(row)));
        continue;
      }
      EXPECT_EQ(hot0->GetValue(row), in.hot_spot[0]);
      EXPECT_EQ(hot1->GetValue(row), in.hot_spot[1]);
      EXPECT_EQ(range->GetValue(row), in.range);
      EXPECT_EQ(allowable->GetValue(row), in.allowable);
      EXPECT_EQ(util->GetValue(row), in.utilization);
      EXPECT_EQ(life->GetValue(row), in.life);
    }
  EXPECT_EQ(exceeds->GetValue(0), 1);              // utilization 1.675 > 1
  EXPECT_TRUE(std::isinf(life->GetValue(1)));      // no damage: +inf survives the binary file
  EXPECT_STREQ(data->GetPointData()->GetScalars()->GetName(), "utilization [-]");
}

TEST_F(WrittenResults, StationFramesAreVectorsAndNaNWithoutFrame) {
  auto data = read_vtp(file("stations.vtp"));
  auto* tangent = doubles(data, "toe tangent [unit vector]");
  auto* normal = doubles(data, "surface normal [unit vector]");
  auto* readout = doubles(data, "read-out direction [unit vector]");
  ASSERT_TRUE(tangent && normal && readout);
  EXPECT_EQ(tangent->GetNumberOfComponents(), 3);
  const double* t0 = tangent->GetTuple3(0);
  const double* n0 = normal->GetTuple3(0);
  EXPECT_EQ(Vec3(t0[0], t0[1], t0[2]), Vec3(1, 0, 0));
  EXPECT_EQ(Vec3(n0[0], n0[1], n0[2]), Vec3(0, 0, 1));
  const double* r0 = readout->GetTuple3(0);
  EXPECT_EQ(Vec3(r0[0], r0[1], r0[2]), Vec3(0, -1, 0));
  EXPECT_TRUE(std::isnan(readout->GetComponent(5, 0)));  // toe 2 station 3 has no frame
}

TEST_F(WrittenResults, FieldDataNamesToesStepsAndProvenance) {
  auto data = read_vtp(file("stations.vtp"));
  EXPECT_EQ(strings(data, "toe names"), (std::vector<std::string>{"north, flange", "ring"}));
  EXPECT_EQ(strings(data, "load steps"), (std::vector<std::string>{"hoist loaded", "lift, \"swung\""}));
  for (const std::string name : {"stations.vtp", "readout.vtp"}) {
    const auto lines = strings(read_vtp(file(name)), "toehold provenance");
    ASSERT_GE(lines.size(), 5u) << name;  // then platform, hashes, defaults, plan lines (provenance_fields_test)
    EXPECT_EQ(lines[0], std::string("toehold ") + TOEHOLD_VERSION);
    EXPECT_EQ(lines[1], "plan: /plans/crane, beam.toml");
    EXPECT_EQ(lines[2], "input: /models/beam.vtu");
    EXPECT_TRUE(std::regex_match(lines[3], std::regex("written: \\d{4}-\\d\\d-\\d\\dT\\d\\d:\\d\\d:\\d\\dZ"))) << lines[3];
  }
  EXPECT_GE(strings(read_vtu(file("model.vtu")), "toehold provenance").size(), 5u);
}

TEST_F(WrittenResults, ReadoutPointsAndPathsInModelUnits) {
  auto data = read_vtp(file("readout.vtp"));
  // 5 stations with a frame (2 read-out points + 3 path points each) [D]
  ASSERT_EQ(data->GetNumberOfPoints(), 25);
  EXPECT_EQ(data->GetNumberOfVerts(), 10);
  EXPECT_EQ(data->GetNumberOfLines(), 5);
  auto* toe = ints(data, "toe number");
  auto* id = ints(data, "station id");
  auto* is_point = ints(data, "read-out point [1 = yes]");
  auto* distance = doubles(data, "distance from toe [m]");
  auto* outside = doubles(data, "distance outside model [m]");
  auto* s0 = doubles(data, "normal stress hoist loaded [MPa]");
  auto* s1 = doubles(data, "normal stress lift, 'swung' [MPa]");
  ASSERT_TRUE(toe && id && is_point && distance && outside && s0 && s1);
  // Toe 1 station 1 comes first: read-out points at 4 and 10 mm, then its path 0, 6, 14 mm.
  const StationResult& first = station(0, 0);
  for (int p = 0; p < 2; ++p) {
    const ReadoutPoint& in = first.points[static_cast<std::size_t>(p)];
    double x[3];
    data->GetPoint(p, x);
    for (int k = 0; k < 3; ++k) EXPECT_DOUBLE_EQ(x[k], in.x[k] / 1000.0);
    EXPECT_EQ(toe->GetValue(p), 1);
    EXPECT_EQ(id->GetValue(p), 1);
    EXPECT_EQ(is_point->GetValue(p), 1);
    EXPECT_DOUBLE_EQ(distance->GetValue(p), in.distance / 1000.0);
    EXPECT_DOUBLE_EQ(outside->GetValue(p), in.off_model / 1000.0);
    EXPECT_EQ(s0->GetValue(p), in.normal_stress[0]);
    EXPECT_EQ(s1->GetValue(p), in.normal_stress[1]);
  }
  const double walked[3] = {0.0, 0.006, 0.014};  // m: 6 mm along -y, then 8 mm along -z [D]
  for (int p = 2; p < 5; ++p) {
    EXPECT_EQ(is_point->GetValue(p), 0);
    EXPECT_DOUBLE_EQ(distance->GetValue(p), walked[p - 2]);
    EXPECT_TRUE(std::isnan(s0->GetValue(p)));
  }
  EXPECT_EQ(cell_ids(data->GetLines(), 0), (std::vector<vtkIdType>{2, 3, 4}));
  EXPECT_EQ(toe->GetValue(24), 2);  // last path belongs to toe 2, station 2
  EXPECT_EQ(id->GetValue(24), 2);
}

TEST_F(WrittenResults, ModelCopyKeepsItsArraysAndShowsStationUtilization) {
  auto model = read_vtu(file("model.vtu"));
  ASSERT_EQ(model->GetNumberOfPoints(), grid->GetNumberOfPoints());
  ASSERT_EQ(model->GetNumberOfCells(), grid->GetNumberOfCells());
  for (vtkIdType p = 0; p < grid->GetNumberOfPoints(); ++p) {
    const Vec3 mm = grid_point(grid, p);
    double x[3];
    model->GetPoint(p, x);
    for (int k = 0; k < 3; ++k) EXPECT_DOUBLE_EQ(x[k], mm[k] / 1000.0);  // mm -> m [D]
  }
  auto* temperature = ints(model, "temperature [K]");
  auto* util = doubles(model, "station utilization [-]");
  auto* toe = ints(model, "toe number");
  ASSERT_TRUE(temperature && util && toe);
  EXPECT_EQ(temperature->GetValue(2), 290 + static_cast<int>(grid_point(grid, 2).x() / 1000.0));
  for (vtkIdType p = 0; p < model->GetNumberOfPoints(); ++p) {
    if (p >= 9 && p <= 13) continue;
    EXPECT_TRUE(std::isnan(util->GetValue(p))) << p;
    EXPECT_EQ(toe->GetValue(p), 0) << p;
  }
  EXPECT_EQ(util->GetValue(9), 1.675);
  EXPECT_EQ(util->GetValue(11), station(0, 2).utilization);
  EXPECT_EQ(util->GetValue(12), 0.4);
  EXPECT_TRUE(std::isnan(util->GetValue(13)));  // station without result
  EXPECT_EQ(toe->GetValue(10), 1);
  EXPECT_EQ(toe->GetValue(13), 2);
  EXPECT_EQ(grid->GetPointData()->GetNumberOfArrays(), 1);  // the model itself is left alone
  EXPECT_EQ(grid_point(grid, 9)[2], 1000.0);
}

TEST_F(WrittenResults, CollectionListsTheThreeVtkFilesAsParts) {
  const auto entries = read_pvd(file("results.pvd"));
  ASSERT_EQ(entries.size(), 3u);
  const std::vector<std::string> names{"model.vtu", "stations.vtp", "readout.vtp"};
  for (std::size_t i = 0; i < 3; ++i) {
    EXPECT_EQ(entries[i].part, static_cast<int>(i));
    EXPECT_EQ(entries[i].time, 0.0);
    EXPECT_EQ(std::filesystem::path(entries[i].file).filename().string(), names[i]);
    EXPECT_TRUE(std::filesystem::is_regular_file(entries[i].file)) << entries[i].file;
  }
}

// Inline binary (not raw appended): ParaView 5.11 on Debian 12's expat refuses raw appended data as malformed XML.
TEST_F(WrittenResults, VtkFilesAreInlineBinaryFloat64) {
  for (const std::string name : {"stations.vtp", "readout.vtp", "model.vtu"}) {
    const std::string text = file_text(file(name));
    EXPECT_NE(text.find("format=\"binary\""), std::string::npos) << name;
    EXPECT_EQ(text.find("format=\"appended\""), std::string::npos) << name;
    EXPECT_EQ(text.find("compressor="), std::string::npos) << name;
    EXPECT_NE(text.find("<Points>\n        <DataArray type=\"Float64\""), std::string::npos) << name;
  }
}

TEST(ResultsWriter, MillimetreModelKeepsCoordinates) {
  TempDir dir;
  auto grid = sample_grid();
  const Assessment a = sample_assessment(grid);
  write_results(a, mesh_of(grid), dir.file("out"), LengthUnit::mm);
  auto data = read_vtp(dir.file("out/stations.vtp"));
  double x[3];
  data->GetPoint(0, x);
  EXPECT_EQ(Vec3(x[0], x[1], x[2]), a.toes[0].stations[0].station.x);
  EXPECT_NE(data->GetPointData()->GetArray("arc length [mm]"), nullptr);
}

TEST(ResultsWriter, InchModelDividesBy25point4) {
  TempDir dir;
  auto grid = sample_grid();
  const Assessment a = sample_assessment(grid);
  write_results(a, mesh_of(grid), dir.file("out"), LengthUnit::in);
  auto data = read_vtp(dir.file("out/readout.vtp"));
  auto* distance = doubles(data, "distance from toe [in]");
  ASSERT_NE(distance, nullptr);
  EXPECT_DOUBLE_EQ(distance->GetValue(1), 10.0 / 25.4);  // 1 in = 25.4 mm exactly, NIST SP 811 appendix B, from memory [M]
}

// VTK 9.1 writes array names into XML attributes without escaping them: names with '"', '<' or '&' would make the
// file unreadable, so they are replaced in the copy (and only there).
TEST(ResultsWriter, NamesThatWouldBreakTheXmlAreReplaced) {
  TempDir dir;
  auto grid = sample_grid();
  add_point_ints(grid, "a&b <\"c\">", [](const Vec3&) { return 7; });
  Assessment a = sample_assessment(grid);
  a.steps = {"x<y", "p&q"};
  write_results(a, mesh_of(grid), dir.file("out"), LengthUnit::mm);
  auto model = read_vtu(dir.file("out/model.vtu"));
  ASSERT_NE(ints(model, "a+b ('c')"), nullptr);
  EXPECT_EQ(ints(model, "a+b ('c')")->GetValue(0), 7);
  EXPECT_NE(grid->GetPointData()->GetArray("a&b <\"c\">"), nullptr);  // the model keeps its own name
  auto stations = read_vtp(dir.file("out/stations.vtp"));
  EXPECT_NE(doubles(stations, "hot-spot stress x(y [MPa]"), nullptr);
  EXPECT_NE(doubles(stations, "hot-spot stress p+q [MPa]"), nullptr);
  EXPECT_EQ(strings(stations, "load steps"), (std::vector<std::string>{"x<y", "p&q"}));  // values stay as given
}

TEST(ResultsWriter, AssessmentWithoutStationsWritesEmptyFiles) {
  TempDir dir;
  auto grid = sample_grid();
  Assessment a;
  a.steps = {"only"};
  const auto files = write_results(a, mesh_of(grid), dir.file("out"), LengthUnit::mm);
  EXPECT_EQ(files.size(), 8u);  // the VTK files, CSV, JSON, report and ParaView script
  EXPECT_EQ(read_vtp(dir.file("out/stations.vtp"))->GetNumberOfPoints(), 0);
  EXPECT_EQ(read_vtp(dir.file("out/readout.vtp"))->GetNumberOfPoints(), 0);
  EXPECT_EQ(read_vtu(dir.file("out/model.vtu"))->GetNumberOfPoints(), grid->GetNumberOfPoints());
}

TEST(ResultsWriter, RepeatedStepNameIsRefused) {
  TempDir dir;
  auto grid = sample_grid();
  Assessment a = sample_assessment(grid);
  a.steps = {"hoist loaded", "hoist loaded"};
  try {
    write_results(a, mesh_of(grid), dir.file("out"), LengthUnit::mm);
    FAIL() << "no error";
  } catch (const Error& e) {
    EXPECT_STREQ(e.what(), "load step name 'hoist loaded' is used twice; give each step of the plan its own name");
  }
  EXPECT_FALSE(std::filesystem::exists(dir.file("out")));
}

}  // namespace
}  // namespace toehold::test
