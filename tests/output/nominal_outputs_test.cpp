// The nominal-stress method beside the hot-spot method in the outputs: console table, stations.csv columns,
// results.json keys (validated against docs/results-schema.md) and the report section. The nominal values are set
// by hand on the sample assessment of sample_results.hpp; ratios derived [D].
#include "output/sample_results.hpp"
#include "output/schema_check.hpp"
#include "support/support.hpp"
#include "toehold/nominal/material.hpp"
#include "toehold/output/json_results.hpp"
#include "toehold/output/provenance.hpp"
#include "toehold/output/report_html.hpp"
#include "toehold/output/results_writer.hpp"
#include "toehold/output/summary.hpp"

#include <cstdio>
#include <fstream>
#include <sstream>
#include <sys/wait.h>
#include <vector>

namespace toehold::test {
namespace {

// Toe 1 gets a given nominal range of 100 MPa on IIW FAT 80: allowable 80, utilization 1.25, life 1.024e6.
// Station ranges 150.75, 50 and 80.625 MPa give SCFs 1.5075, 0.5 and 0.80625 [D]; the hot spot governs where its
// utilization (1.675) is larger, the nominal method elsewhere (0.5556 and 0.8958 < 1.25).
Assessment nominal_sample(vtkUnstructuredGrid* grid) {
  Assessment a = sample_assessment(grid);
  ToeResult& toe = a.toes[0];
  ToeNominalResult n;
  n.source = "given";
  n.description = "range 100 MPa given in the plan";
  n.curve = "IIW FAT 80 (steel, normal stress)";
  n.curve_source = "IIW 2016";
  n.stress_kind = "normal";
  n.check.range = 100.0;
  n.check.allowable = 80.0;
  n.check.utilization = 1.25;
  n.check.life = 1.024e6;
  n.governing = "hot-spot";
  nominal::WeldCheckInput input;
  input.material = nominal::find_material("ASTM A36");
  input.detail = nominal::WeldDetail::reinforced_butt;
  input.marin.load = nominal::LoadKind::axial;
  n.infinite_life = InfiniteLifeResult{nominal::check_weld_infinite_life(input, 50.0, 10.0), -1, -1,
                                       "the range and mean given in the plan"};
  for (StationResult& s : toe.stations) {
    StationNominal sn;
    sn.check = n.check;
    sn.concentration_factor = s.range / 100.0;
    sn.governing = s.utilization > 1.25 ? "hot-spot" : "nominal";
    s.nominal = sn;
  }
  toe.nominal = n;
  return a;
}

TEST(NominalOutputs, JsonCarriesTheNominalMethodAndValidates) {
  auto grid = sample_grid();
  const Assessment a = nominal_sample(grid);
  const std::string json = format_results_json(a, collect_provenance(a), LengthUnit::m);
  std::string said;
  EXPECT_EQ(check_schema(json, said), 0) << said;
  EXPECT_NE(json.find("\"schema_version\": \"1.2\""), std::string::npos);
  EXPECT_NE(json.find("\"source\": \"given\""), std::string::npos);
  EXPECT_NE(json.find("\"concentration_factor\": 1.5075"), std::string::npos);
  EXPECT_NE(json.find("\"governing\": \"nominal\""), std::string::npos);
  EXPECT_NE(json.find("\"concentration_factor\": 1.2"), std::string::npos);  // K_fs of a reinforced butt [S]
}

TEST(NominalOutputs, JsonWithoutNominalHasNoNominalKey) {
  auto grid = sample_grid();
  const Assessment a = sample_assessment(grid);
  EXPECT_EQ(format_results_json(a, collect_provenance(a), LengthUnit::m).find("\"nominal\""), std::string::npos);
}

TEST(NominalOutputs, SummaryHasTheSideBySideTable) {
  auto grid = sample_grid();
  const std::string text = format_assessment_summary(nominal_sample(grid), "", {});
  EXPECT_NE(text.find("Nominal-stress method beside the hot-spot method"), std::string::npos) << text;
  // toe, source, nominal 100.0, hot spot 150.8 (worst station), SCF 1.51, 1.250 against 1.675, hot-spot governs
  const auto at = text.find("\nnorth, flange   given ");
  ASSERT_NE(at, std::string::npos) << text;
  std::istringstream line(text.substr(at + 15, text.find('\n', at + 1) - at - 15));
  std::vector<std::string> words;
  for (std::string w; line >> w;) words.push_back(w);
  EXPECT_EQ(words, (std::vector<std::string>{"given", "100.0", "150.8", "1.51", "1.250", "1.675", "hot-spot"}));
  EXPECT_NE(text.find("infinite-life weld check: factor of safety"), std::string::npos);
}

TEST(NominalOutputs, CsvHasTheNominalColumns) {
  auto grid = sample_grid();
  const Assessment a = nominal_sample(grid);
  TempDir dir;
  write_results(a, Mesh(grid, "beam.vtu", LengthUnit::m), dir.file("out"), LengthUnit::m);
  std::ifstream in(dir.file("out") + "/stations.csv", std::ios::binary);
  std::string header, row;
  std::getline(in, header);
  std::getline(in, row);
  EXPECT_NE(header.find("nominal source,nominal S-N curve,nominal stress range [MPa],nominal range between steps,"
                        "nominal allowable stress range [MPa],nominal utilization [-],nominal life [cycles],"
                        "structural stress concentration factor [-],governing method"),
            std::string::npos)
      << header;
  EXPECT_NE(row.find("given,\"IIW FAT 80 (steel, normal stress)\",100,,80,1.25,1024000,1.5075,hot-spot"),
            std::string::npos)
      << row;
}

TEST(NominalOutputs, ReportHasTheNominalSection) {
  auto grid = sample_grid();
  const Assessment a = nominal_sample(grid);
  const std::string html = format_report_html(a, collect_provenance(a), LengthUnit::m);
  EXPECT_NE(html.find("Nominal-stress method beside the hot-spot method"), std::string::npos);
  EXPECT_NE(html.find("Textbook infinite-life weld check"), std::string::npos);
  EXPECT_NE(html.find("<td class=\"v-nominal-factor\">0.500</td>"), std::string::npos);  // station 2: 50 / 100
}

}  // namespace
}  // namespace toehold::test
