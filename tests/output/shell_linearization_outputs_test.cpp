// Shell stations and the through-thickness linearization in the outputs: stations.csv columns, stations.vtp
// arrays, results.json keys (validated against docs/results-schema.md), the report's station detail and toe
// sentence, and the console line. Values are set by hand on the sample assessment of sample_results.hpp; ratios,
// offsets and unit conversions are derived [D].
#include "output/sample_results.hpp"
#include "output/schema_check.hpp"
#include "support/support.hpp"
#include "toehold/output/json_results.hpp"
#include "toehold/output/provenance.hpp"
#include "toehold/output/report_html.hpp"
#include "toehold/output/results_writer.hpp"
#include "toehold/output/summary.hpp"

#include <vtkDoubleArray.h>
#include <vtkIntArray.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkPolyData.h>
#include <vtkXMLPolyDataReader.h>

#include <cmath>
#include <cstdio>
#include <fstream>
#include <sys/wait.h>

namespace toehold::test {
namespace {

// Toe 1 on a shell model: top layer, distances from the weld toe of an 8 mm attachment with a 6 mm leg, so the hot
// spot lies t_att/2 + leg = 4 + 6 = 10 mm from the intersection line along the read-out direction -y [D].
Assessment shell_sample(vtkUnstructuredGrid* grid) {
  Assessment a = sample_assessment(grid);
  a.plan.model.shell = ShellModelPlan{};
  ToeResult& toe = a.toes[0];
  toe.plan.shell = ShellToePlan{};
  for (StationResult& s : toe.stations) {
    ShellStationInfo i;
    i.layer = "top";
    i.origin = "weld-toe";
    i.offset = 10.0;
    i.hot_spot = s.station.x + Vec3(0.0, -10.0, 0.0);
    i.thickness = 12.0;
    i.from_intersection = {14.0, 20.0};  // 10 mm + the read-out distances 4 and 10 mm
    s.shell = i;
  }
  return a;
}

// Toe 1 linearized: station 1 structural range 75.375 MPa against the surface 150.75 (ratio 0.5), station 2 60
// against 50 (1.2), station 3 without a line (it leaves the model) [D].
Assessment line_sample(vtkUnstructuredGrid* grid) {
  Assessment a = sample_assessment(grid);
  ToeResult& toe = a.toes[0];
  toe.plan.through_thickness = ThroughThicknessPlan{};
  const double structural[] = {75.375, 60.0};
  for (std::size_t k = 0; k < toe.stations.size(); ++k) {
    ThroughThicknessResult l;
    l.rule = "gauss-lobatto";
    l.points = 9;
    l.thickness = 12.0;
    if (k < 2) {
      l.membrane = {20.0, -5.0};
      l.bending = {40.0, 10.0};
      l.structural = {60.0, 5.0};  // membrane + bending
      l.peak = {12.5, -1.5};
      l.hot_spot = l.structural;
      l.one_mm = {55.0, 4.0};
      l.structural_range = structural[k];
      l.range_from = 1;
      l.range_to = 0;
      l.one_mm_range = 51.0;
    } else {
      l.problem = "the line leaves the model 6.5 mm below the surface";
      l.stop_depth = 6.5;
    }
    toe.stations[k].through_thickness = l;
  }
  return a;
}

// The fields of one CSV line (RFC 4180 quotes).
std::vector<std::string> fields(const std::string& line) {
  std::vector<std::string> out(1);
  bool quoted = false;
  for (std::size_t i = 0; i < line.size(); ++i) {
    const char ch = line[i];
    if (ch == '"' && quoted && i + 1 < line.size() && line[i + 1] == '"') {
      out.back() += '"';
      ++i;
    } else if (ch == '"') {
      quoted = !quoted;
    } else if (ch == ',' && !quoted) {
      out.emplace_back();
    } else if (ch != '\r') {
      out.back() += ch;
    }
  }
  return out;
}

struct Csv {
  std::vector<std::string> header;
  std::vector<std::vector<std::string>> rows;
  std::size_t column(const std::string& name) const {
    for (std::size_t i = 0; i < header.size(); ++i)
      if (header[i] == name) return i;
    ADD_FAILURE() << "no column '" << name << "'";
    return 0;
  }
  const std::string& at(std::size_t row, const std::string& name) const { return rows.at(row).at(column(name)); }
  bool has(const std::string& name) const {
    for (const auto& h : header)
      if (h == name) return true;
    return false;
  }
};

Csv written_csv(const Assessment& a, vtkUnstructuredGrid* grid, const TempDir& dir) {
  write_results(a, Mesh(grid, "beam.vtu", LengthUnit::m), dir.file("out"), LengthUnit::m);
  std::ifstream in(dir.file("out") + "/stations.csv", std::ios::binary);
  Csv csv;
  std::string line;
  std::getline(in, line);
  csv.header = fields(line);
  while (std::getline(in, line)) csv.rows.push_back(fields(line));
  return csv;
}

vtkSmartPointer<vtkPolyData> read_stations_vtp(const TempDir& dir) {
  vtkNew<vtkXMLPolyDataReader> reader;
  reader->SetFileName((dir.file("out") + "/stations.vtp").c_str());
  reader->Update();
  return reader->GetOutput();
}

vtkDataArray* array(vtkPolyData* data, const std::string& name) {
  vtkDataArray* a = data->GetPointData()->GetArray(name.c_str());
  EXPECT_NE(a, nullptr) << "no point array '" << name << "'";
  return a;
}

TEST(ShellLinearizationOutputs, PlainCsvHasNeitherShellNorLinearizationColumns) {
  auto grid = sample_grid();
  TempDir dir;
  const Csv csv = written_csv(sample_assessment(grid), grid, dir);
  for (const auto& h : csv.header) {
    EXPECT_EQ(h.find("shell"), std::string::npos) << h;
    EXPECT_EQ(h.find("linearized"), std::string::npos) << h;
    EXPECT_EQ(h.find("1 mm below"), std::string::npos) << h;
  }
  const auto stations = read_stations_vtp(dir);
  EXPECT_EQ(stations->GetPointData()->GetArray("shell layer [1 = top, 2 = bottom]"), nullptr);
  EXPECT_EQ(stations->GetPointData()->GetArray("has linearization [1 = yes]"), nullptr);
}

TEST(ShellLinearizationOutputs, CsvHasTheShellColumnsInTheOutputUnit) {
  auto grid = sample_grid();
  const Assessment a = shell_sample(grid);
  TempDir dir;
  const Csv csv = written_csv(a, grid, dir);
  EXPECT_FALSE(csv.has("linearization problem"));
  const Vec3 x = a.toes[0].stations[1].station.x;
  EXPECT_EQ(csv.at(1, "shell layer"), "top");
  EXPECT_EQ(csv.at(1, "read-out origin"), "weld-toe");
  EXPECT_CLOSE(std::stod(csv.at(1, "offset from intersection line [m]")), 0.010, 1e-15);  // 10 mm in m [D]
  EXPECT_CLOSE(std::stod(csv.at(1, "hot-spot location x [m]")), x.x() / 1000.0, 1e-12);
  EXPECT_CLOSE(std::stod(csv.at(1, "hot-spot location y [m]")), (x.y() - 10.0) / 1000.0, 1e-12);
  EXPECT_CLOSE(std::stod(csv.at(1, "hot-spot location z [m]")), x.z() / 1000.0, 1e-12);
  EXPECT_EQ(csv.at(3, "shell layer"), "");  // toe 2 carries no shell info here
}

TEST(ShellLinearizationOutputs, CsvHasTheLinearizationColumns) {
  auto grid = sample_grid();
  TempDir dir;
  const Csv csv = written_csv(line_sample(grid), grid, dir);
  EXPECT_FALSE(csv.has("shell layer"));
  EXPECT_EQ(csv.at(0, "linearized structural stress range [MPa]"), "75.375");
  EXPECT_EQ(csv.at(0, "stress range 1 mm below surface [MPa]"), "51");
  EXPECT_EQ(csv.at(0, "ratio linearized to surface range [-]"), "0.5");  // 75.375 / 150.75 [D]
  EXPECT_EQ(csv.at(1, "ratio linearized to surface range [-]"), "1.2");  // 60 / 50 [D]
  EXPECT_EQ(csv.at(0, "linearization problem"), "");
  EXPECT_EQ(csv.at(2, "linearized structural stress range [MPa]"), "");
  EXPECT_EQ(csv.at(2, "linearization problem"), "the line leaves the model 6.5 mm below the surface");
  EXPECT_EQ(csv.at(3, "ratio linearized to surface range [-]"), "");  // toe 2 does not ask for it
}

TEST(ShellLinearizationOutputs, StationsVtpCarriesTheShellArrays) {
  auto grid = sample_grid();
  const Assessment a = shell_sample(grid);
  TempDir dir;
  written_csv(a, grid, dir);
  const auto stations = read_stations_vtp(dir);
  const Vec3 x = a.toes[0].stations[0].station.x;
  EXPECT_EQ(array(stations, "shell layer [1 = top, 2 = bottom]")->GetTuple1(0), 1.0);
  EXPECT_EQ(array(stations, "distances from weld toe [1 = yes]")->GetTuple1(0), 1.0);
  EXPECT_CLOSE(array(stations, "offset from intersection line [m]")->GetTuple1(0), 0.010, 1e-15);
  vtkDataArray* location = array(stations, "hot-spot location [m]");
  ASSERT_EQ(location->GetNumberOfComponents(), 3);
  EXPECT_CLOSE(location->GetComponent(0, 1), (x.y() - 10.0) / 1000.0, 1e-12);  // 10 mm off the station point
  EXPECT_CLOSE(stations->GetPoint(0)[1], x.y() / 1000.0, 1e-12);
  EXPECT_EQ(array(stations, "shell layer [1 = top, 2 = bottom]")->GetTuple1(3), 0.0);  // toe 2
  EXPECT_TRUE(std::isnan(location->GetComponent(3, 0)));
}

TEST(ShellLinearizationOutputs, StationsVtpCarriesTheLinearizationArrays) {
  auto grid = sample_grid();
  TempDir dir;
  written_csv(line_sample(grid), grid, dir);
  const auto stations = read_stations_vtp(dir);
  EXPECT_CLOSE(array(stations, "linearized structural stress range [MPa]")->GetTuple1(0), 75.375, 1e-12);
  EXPECT_CLOSE(array(stations, "stress range 1 mm below surface [MPa]")->GetTuple1(1), 51.0, 1e-12);
  EXPECT_CLOSE(array(stations, "ratio linearized to surface range [-]")->GetTuple1(1), 1.2, 1e-12);
  EXPECT_CLOSE(array(stations, "membrane stress hoist loaded [MPa]")->GetTuple1(0), 20.0, 1e-12);
  EXPECT_CLOSE(array(stations, "bending stress hoist loaded [MPa]")->GetTuple1(0), 40.0, 1e-12);
  EXPECT_CLOSE(array(stations, "linearized structural stress hoist loaded [MPa]")->GetTuple1(0), 60.0, 1e-12);
  EXPECT_EQ(array(stations, "has linearization [1 = yes]")->GetTuple1(1), 1.0);
  EXPECT_EQ(array(stations, "has linearization [1 = yes]")->GetTuple1(2), 0.0);  // the line leaves the model
  EXPECT_TRUE(std::isnan(array(stations, "linearized structural stress range [MPa]")->GetTuple1(2)));
}

TEST(ShellLinearizationOutputs, JsonCarriesShellAndLinearizationAndValidates) {
  auto grid = sample_grid();
  for (const Assessment& a : {shell_sample(grid), line_sample(grid)}) {
    const std::string json = format_results_json(a, collect_provenance(a), LengthUnit::mm);
    std::string said;
    EXPECT_EQ(check_schema(json, said), 0) << said;
  }
  const Assessment shell = shell_sample(grid);
  const std::string s = format_results_json(shell, collect_provenance(shell), LengthUnit::mm);
  EXPECT_NE(s.find("\"origin\": \"weld-toe\""), std::string::npos);
  EXPECT_NE(s.find("\"offset\": 10,"), std::string::npos);
  EXPECT_NE(s.find("\"from_intersection\": [14, 20]"), std::string::npos) << s;
  EXPECT_EQ(s.find("\"through_thickness\""), std::string::npos);
  const Assessment line = line_sample(grid);
  const std::string l = format_results_json(line, collect_provenance(line), LengthUnit::mm);
  EXPECT_NE(l.find("\"ratio_to_surface\": 0.5"), std::string::npos);
  EXPECT_NE(l.find("\"ratio_to_surface\": 1.2"), std::string::npos);
  EXPECT_NE(l.find("\"problem\": \"the line leaves the model 6.5 mm below the surface\""), std::string::npos);
  EXPECT_NE(l.find("\"stop_depth_mm\": 6.5"), std::string::npos);
  EXPECT_EQ(l.find("\"shell\""), std::string::npos);
}

TEST(ShellLinearizationOutputs, ReportShowsTheLayerAndTheLinearizationBesideTheSurface) {
  auto grid = sample_grid();
  const Assessment shell = shell_sample(grid);
  const std::string s = format_report_html(shell, collect_provenance(shell), LengthUnit::m);
  EXPECT_NE(s.find("Shell model: the toe reads the <b>top</b> layer of the carrying plate, read-out distances from "
                   "the weld toe (hot spot 10 mm from the intersection line)."),
            std::string::npos);
  EXPECT_NE(s.find("<p class=\"shell\">Shell model: layer <b>top</b>"), std::string::npos);
  const Assessment line = line_sample(grid);
  const std::string l = format_report_html(line, collect_provenance(line), LengthUnit::m);
  EXPECT_NE(l.find("Through-thickness linearization (ASME BPVC VIII-2 Annex 5-A)"), std::string::npos);
  // The worst station of toe 1 (station 1) has a detail section: its membrane, bending and ratio.
  EXPECT_NE(l.find("<td class=\"v-line-membrane\">20.0</td><td class=\"v-line-bending\">40.0</td>"),
            std::string::npos);
  EXPECT_NE(l.find("<td class=\"v-line-ratio\">0.500</td>"), std::string::npos);  // 75.375 / 150.75 [D]
  EXPECT_EQ(s.find("Through-thickness linearization"), std::string::npos);
  EXPECT_EQ(l.find("Shell model"), std::string::npos);
}

TEST(ShellLinearizationOutputs, SummaryHasOneLinearizationLinePerToe) {
  auto grid = sample_grid();
  const std::string text = format_assessment_summary(line_sample(grid), "", {});
  EXPECT_NE(text.find("  toe 'north, flange': largest ratio linearized / surface range 1.200 at station 2; 1 of 3 "
                      "stations without a linearized value\n"),
            std::string::npos)
      << text;
  EXPECT_EQ(text.find("toe 'ring': largest ratio"), std::string::npos);
  EXPECT_EQ(format_assessment_summary(sample_assessment(grid), "", {}).find("linearization"), std::string::npos);
}

}  // namespace
}  // namespace toehold::test
