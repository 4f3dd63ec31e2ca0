// stations.csv parsed back with an RFC 4180 reader written here: header with units, one row per station, quoted
// names, numbers that read back to the same doubles, empty fields and the status where a station has no result.
// Expected values are the hand-made inputs of sample_results.hpp; conversions derived [D] (1 m = 1000 mm).
#include "output/sample_results.hpp"
#include "support/support.hpp"
#include "toehold/output/results_writer.hpp"

#include <cmath>
#include <cstdlib>
#include <fstream>
#include <sstream>

namespace toehold::test {
namespace {

using Table = std::vector<std::vector<std::string>>;

// RFC 4180: records end in CRLF; a quoted field may hold commas, CRLF and doubled quotes. Sets `strict_crlf` false
// when a bare LF ends a record.
Table parse_csv(const std::string& text, bool& strict_crlf) {
  Table rows(1);
  std::string field;
  bool quoted = false, was_quoted = false;
  strict_crlf = true;
  for (std::size_t i = 0; i < text.size(); ++i) {
    const char ch = text[i];
    if (quoted) {
      if (ch == '"' && i + 1 < text.size() && text[i + 1] == '"') field += text[++i];
      else if (ch == '"') quoted = false;
      else field += ch;
    } else if (ch == '"' && field.empty() && !was_quoted) {
      quoted = was_quoted = true;
    } else if (ch == ',') {
      rows.back().push_back(field);
      field.clear();
      was_quoted = false;
    } else if (ch == '\r' || ch == '\n') {
      if (ch == '\n') strict_crlf = false;
      if (ch == '\r' && i + 1 < text.size() && text[i + 1] == '\n') ++i;
      rows.back().push_back(field);
      field.clear();
      was_quoted = false;
      rows.emplace_back();
    } else {
      field += ch;
    }
  }
  if (rows.back().empty()) rows.pop_back();
  return rows;
}

double number(const std::string& field) {
  char* end = nullptr;
  const double v = std::strtod(field.c_str(), &end);
  EXPECT_EQ(*end, '\0') << "not a number: '" << field << "'";
  return v;
}

class StationsCsv : public ::testing::Test {
protected:
  void SetUp() override {
    grid = sample_grid();
    a = sample_assessment(grid);
    write_results(a, Mesh(grid, "beam.vtu", LengthUnit::m), dir.file("out"), LengthUnit::m);
    std::ifstream in(dir.file("out/stations.csv"), std::ios::binary);
    std::ostringstream os;
    os << in.rdbuf();
    text = os.str();
    rows = parse_csv(text, crlf);
  }
  const StationResult& station(std::size_t toe, std::size_t s) const { return a.toes[toe].stations[s]; }

  TempDir dir;
  vtkSmartPointer<vtkUnstructuredGrid> grid;
  Assessment a;
  std::string text;
  Table rows;
  bool crlf = false;
};

TEST_F(StationsCsv, HeaderNamesEveryColumnWithItsUnit) {
  ASSERT_FALSE(rows.empty());
  const std::vector<std::string> expected{"toe", "toe name", "station id", "x [m]", "y [m]", "z [m]",
                                          "arc length [m]", "hot-spot stress hoist loaded [MPa]",
                                          "hot-spot stress lift, \"swung\" [MPa]", "hot-spot stress range [MPa]",
                                          "range between steps", "allowable stress range [MPa]", "utilization [-]",
                                          "life [cycles]", "status", "S-N curve"};
  EXPECT_EQ(rows[0], expected);
  // The step name with a comma and quotes is quoted and its quotes doubled (RFC 4180 sec. 2, items 6-7 [S]).
  EXPECT_NE(text.find(",\"hot-spot stress lift, \"\"swung\"\" [MPa]\","), std::string::npos);
  EXPECT_TRUE(crlf);  // RFC 4180 sec. 2 item 1: records end in CRLF [S]
}

TEST_F(StationsCsv, OneRowPerStationWithTheSameNumbers) {
  ASSERT_EQ(rows.size(), 7u);
  std::size_t row = 1;
  for (std::size_t t = 0; t < 2; ++t)
    for (std::size_t s = 0; s < 3; ++s, ++row) {
      const auto& r = rows[row];
      const StationResult& in = station(t, s);
      ASSERT_EQ(r.size(), 16u) << "row " << row;
      EXPECT_EQ(r[0], std::to_string(t + 1));
      EXPECT_EQ(r[1], a.toes[t].plan.name);
      EXPECT_EQ(r[2], std::to_string(s + 1));
      for (int k = 0; k < 3; ++k) EXPECT_EQ(number(r[3 + static_cast<std::size_t>(k)]), in.station.x[k] / 1000.0);
      EXPECT_EQ(number(r[6]), in.station.arc / 1000.0);
      EXPECT_EQ(r[15], a.toes[t].curve);
      if (!in.ok()) {
        for (std::size_t k = 7; k <= 13; ++k) EXPECT_EQ(r[k], "") << "column " << k;
        EXPECT_EQ(r[14], "no result: " + in.problem);
        continue;
      }
      EXPECT_EQ(number(r[7]), in.hot_spot[0]);
      EXPECT_EQ(number(r[8]), in.hot_spot[1]);
      EXPECT_EQ(number(r[9]), in.range);
      EXPECT_EQ(number(r[11]), in.allowable);
      EXPECT_EQ(number(r[12]), in.utilization);
      EXPECT_EQ(number(r[13]), in.life);
      EXPECT_EQ(r[14], in.utilization > 1.0 ? "exceeds" : "ok");
    }
}

TEST_F(StationsCsv, NamesTheStepsOfTheRangeAndWritesInfiniteLife) {
  ASSERT_EQ(rows.size(), 7u);
  EXPECT_EQ(rows[1][10], "lift, \"swung\" to hoist loaded");  // range_from 1, range_to 0
  EXPECT_EQ(rows[3][10], "hoist loaded to lift, \"swung\"");
  EXPECT_EQ(rows[2][13], "inf");
  EXPECT_TRUE(std::isinf(number(rows[2][13])));
  EXPECT_EQ(rows[1][1], "north, flange");
  EXPECT_EQ(rows[6][14], "no result: no plate facet beside the toe");
}

TEST_F(StationsCsv, NumbersUseTheShortestExactForm) {
  ASSERT_EQ(rows.size(), 7u);
  EXPECT_EQ(rows[1][12], "1.675");
  EXPECT_EQ(rows[2][12], "0.5555555555555556");  // 16 significant digits read back to the same double [D]
  EXPECT_EQ(rows[1][13], "452000");
}

}  // namespace
}  // namespace toehold::test
