// report.html of the hand-made sample assessment (sample_results.hpp): every toe and station, the numbers as the
// documented formats show them, the critical stations, self-containment and escaping. Expected texts are the
// sample's inputs formatted by hand [D].
#include "output/sample_results.hpp"
#include "support/support.hpp"
#include "toehold/output/provenance.hpp"
#include "toehold/output/report_html.hpp"
#include "toehold/output/summary.hpp"

#include <regex>
#include <string>

namespace toehold::test {
namespace {

class SampleReport : public ::testing::Test {
protected:
  void SetUp() override {
    grid = sample_grid();
    a = sample_assessment(grid);
    a.plan.title = "Crane beam <north>";
    a.plan.text = "title = \"Crane beam <north>\"\n[model]\nfile = \"beam.vtu\"\n";
    a.plan.requirement.cycles = 2e6;
    a.plan.requirement.gamma_M = 1.15;
    a.toes[0].plan.curve = "IIW FAT 90";
    a.toes[0].scheme.distances = {4.0, 10.0};
    a.toes[0].definition = "perpendicular";
    a.toes[1].plan.curve = "IIW FAT 100";
    a.toes[1].definition = "perpendicular";
    a.plan.defaults_applied = {"toe 'ring': spacing = 0 (a station at every toe node)"};
    p = collect_provenance(a);
    html = format_report_html(a, p, LengthUnit::m);
  }
  // The text of the table row with this id.
  std::string row(const std::string& id) const {
    const auto at = html.find("<tr id=\"" + id + "\"");
    if (at == std::string::npos) return "";
    return html.substr(at, html.find("</tr>", at) - at);
  }

  vtkSmartPointer<vtkUnstructuredGrid> grid;
  Assessment a;
  Provenance p;
  std::string html;
};

TEST_F(SampleReport, HasEveryToeAndStation) {
  EXPECT_NE(html.find("<h2 id=\"toe-1\">Toe 1: north, flange</h2>"), std::string::npos);
  EXPECT_NE(html.find("<h2 id=\"toe-2\">Toe 2: ring</h2>"), std::string::npos);
  for (int t = 1; t <= 2; ++t)
    for (int s = 1; s <= 3; ++s)
      EXPECT_FALSE(row("toe-" + std::to_string(t) + "-station-" + std::to_string(s)).empty()) << t << " " << s;
  EXPECT_TRUE(row("toe-1-station-4").empty());
}

TEST_F(SampleReport, StandsAloneWithTheCaution) {
  EXPECT_EQ(html.rfind("<!DOCTYPE html>", 0), 0u);
  EXPECT_NE(html.find("<style>"), std::string::npos);
  for (const char* banned : {"<script", "http://", "https://", "<link", "<img", "<iframe"})
    EXPECT_EQ(html.find(banned), std::string::npos) << banned;
  EXPECT_NE(html.find("checked by a qualified engineer under the governing code and local regulations"),
            std::string::npos);
  EXPECT_EQ(html.find("<north>"), std::string::npos);  // escaped everywhere
  EXPECT_NE(html.find("Crane beam &lt;north&gt;"), std::string::npos);
}

TEST_F(SampleReport, StationRowsShowTheValuesInTheDocumentedFormats) {
  const std::string first = row("toe-1-station-1");
  // 150.75 MPa to 1 decimal, 1.675 to 3 decimals, 452000 cycles to 4 significant digits [D]
  EXPECT_NE(first.find("<td class=\"v-range\">150.8</td>"), std::string::npos) << first;
  EXPECT_NE(first.find("<td class=\"v-allowable\">90.0</td>"), std::string::npos);
  EXPECT_NE(first.find("<td class=\"v-utilization\">1.675</td>"), std::string::npos);
  EXPECT_NE(first.find("<td class=\"v-life\">4.52e+05</td>"), std::string::npos);
  EXPECT_NE(first.find("<td class=\"v-hot-spot-0\">120.5</td>"), std::string::npos);
  EXPECT_NE(first.find("class=\"exceeds\""), std::string::npos);
  EXPECT_NE(row("toe-1-station-2").find("<td class=\"v-life\">no damage</td>"), std::string::npos);
  // Arc length 1000 mm shown in metres [D]
  EXPECT_NE(row("toe-1-station-2").find("<td class=\"v-arc\">1</td>"), std::string::npos);
  EXPECT_NE(row("toe-2-station-2").find("no result: read-out path stops at a plate edge"), std::string::npos);
}

TEST_F(SampleReport, CriticalStationsAreTheWorstWithAResult) {
  // Toe 1 utilizations 1.675, 0.556, 0.896 -> stations 1 and 3 first; toe 2 has one station with a result [D]
  EXPECT_EQ(critical_stations(a.toes[0], 2), (std::vector<std::size_t>{0, 2}));
  EXPECT_EQ(critical_stations(a.toes[0], 5), (std::vector<std::size_t>{0, 2, 1}));
  EXPECT_EQ(critical_stations(a.toes[1], 3), (std::vector<std::size_t>{0}));
  EXPECT_NE(html.find("id=\"detail-toe-1-station-1\""), std::string::npos);
  EXPECT_NE(html.find("id=\"detail-toe-2-station-1\""), std::string::npos);
  EXPECT_EQ(html.find("id=\"detail-toe-2-station-2\""), std::string::npos);
}

TEST_F(SampleReport, StationsThePlanNamesAreDetailedToo) {
  // Toe 1: the worst one is station 1; the plan also names station 2 (the best) and station 2 again.
  Assessment named = a;
  named.toes[0].plan.report_stations = {2, 2};
  EXPECT_EQ(critical_stations(named.toes[0], 1), (std::vector<std::size_t>{0, 1}));
  const std::string text = format_report_html(named, collect_provenance(named), LengthUnit::mm);
  EXPECT_NE(text.find("id=\"detail-toe-1-station-2\""), std::string::npos);
}

TEST_F(SampleReport, CriticalStationShowsReadoutAndSnDiagram) {
  EXPECT_NE(html.find("Read-out path of station 1"), std::string::npos);
  EXPECT_NE(html.find("S-N diagram, IIW FAT 90"), std::string::npos);
  // IIW FAT classes: knee at 1e7 cycles (IIW 2016 sec. 3.7, from memory [M]); label "%.3g" of 1e7 [D]
  EXPECT_NE(html.find("knee 1e+07"), std::string::npos);
  // Hot-spot value 120.5 MPa marked at the toe; allowable 90.0 MPa marked [D]
  EXPECT_NE(html.find(">120.5 MPa</text>"), std::string::npos);
  EXPECT_NE(html.find(">allowable 90.0 MPa</text>"), std::string::npos);
  EXPECT_NE(html.find("distance from the toe along the surface [m]"), std::string::npos);
  EXPECT_NE(html.find("cycles to failure N [-]"), std::string::npos);
  // Read-out point 2 of the sample lies 0.25 mm outside its cell: a diagnostic, in metres [D]
  EXPECT_NE(html.find("read-out point at 0.01 m lies 0.00025 m outside its host cell"), std::string::npos);
}

TEST_F(SampleReport, ShowsProvenanceAndThePlanVerbatim) {
  EXPECT_NE(html.find("<pre id=\"plan-text\">title = &quot;Crane beam &lt;north&gt;&quot;\n[model]\n"),
            std::string::npos);
  EXPECT_NE(html.find("toe &#39;ring&#39;: spacing = 0 (a station at every toe node)"), std::string::npos);
  EXPECT_NE(html.find("/models/beam.vtu"), std::string::npos);
  EXPECT_NE(html.find("not available: cannot open file &#39;/models/beam.vtu&#39;"), std::string::npos);
  EXPECT_NE(html.find(p.written_utc), std::string::npos);
}

TEST_F(SampleReport, StepNamesAreEscaped) {
  EXPECT_NE(html.find("hot-spot stress 'lift, &quot;swung&quot;' [MPa]"), std::string::npos);
  EXPECT_EQ(html.find("\"swung\""), std::string::npos);
}

}  // namespace
}  // namespace toehold::test
