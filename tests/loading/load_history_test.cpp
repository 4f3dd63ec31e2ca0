// Load history CSV: columns matched to the unit cases by name in any order, a time column skipped, and every
// bad input named by file and line.
#include "toehold/common/error.hpp"
#include "toehold/loading/load_history.hpp"
#include "support/support.hpp"

#include <fstream>

namespace toehold {
namespace {

std::string error_of(const std::string& text, const std::vector<std::string>& cases = {"crane", "wind"}) {
  try {
    parse_load_history(text, "loads.csv", cases);
  } catch (const Error& e) {
    return e.what();
  }
  return "no error";
}

TEST(LoadHistory, ColumnsFollowTheUnitCasesWhateverTheFileOrder) {
  const LoadHistory h =
      parse_load_history("time, wind, crane\r\n0, 0.5, 1\n# a comment\n\n1, -2e-1, +3\n", "loads.csv", {"crane", "wind"});
  ASSERT_EQ(h.rows(), 2u);
  EXPECT_EQ(h.channels, (std::vector<std::string>{"crane", "wind"}));
  EXPECT_CLOSE(h.at(0, 0), 1.0, 0);
  EXPECT_CLOSE(h.at(0, 1), 0.5, 0);
  EXPECT_CLOSE(h.at(1, 0), 3.0, 0);
  EXPECT_CLOSE(h.at(1, 1), -0.2, 0);
}

TEST(LoadHistory, QuotedHeaderNamesAreAccepted) {
  const LoadHistory h = parse_load_history("\"crane\",\"wind\"\n1,2\n", "loads.csv", {"crane", "wind"});
  EXPECT_EQ(h.rows(), 1u);
}

TEST(LoadHistory, ColumnThatIsNoUnitCaseIsAnError) {
  EXPECT_EQ(error_of("crane,wind,snow\n1,2,3\n"),
            "load history 'loads.csv' line 1: column 'snow' is not a unit case of the plan; name the columns after "
            "the [[step]] names (crane, wind) or 'time'");
}

TEST(LoadHistory, UnitCaseWithoutColumnIsAnError) {
  EXPECT_EQ(error_of("crane\n1\n"),
            "load history 'loads.csv' line 1: no column for unit case 'wind'; add one (one column per [[step]])");
}

TEST(LoadHistory, RepeatedColumnIsAnError) {
  EXPECT_EQ(error_of("crane,wind,crane\n1,2,3\n"),
            "load history 'loads.csv' line 1: column 'crane' appears twice; give each unit case one column");
}

TEST(LoadHistory, NonNumericFieldNamesFileLineAndColumn) {
  EXPECT_EQ(error_of("crane,wind\n1,2\n\n3,abc\n"),
            "load history 'loads.csv' line 4, column 'wind': 'abc' is not a finite number; write load factors as "
            "plain numbers (e.g. 0.5, -1.2e3)");
  EXPECT_EQ(error_of("crane,wind\n1,nan\n"),
            "load history 'loads.csv' line 2, column 'wind': 'nan' is not a finite number; write load factors as "
            "plain numbers (e.g. 0.5, -1.2e3)");
  EXPECT_EQ(error_of("crane,wind\n1,\n"),
            "load history 'loads.csv' line 2, column 'wind': '' is not a finite number; write load factors as "
            "plain numbers (e.g. 0.5, -1.2e3)");
}

TEST(LoadHistory, RowWithTheWrongFieldCountIsAnError) {
  EXPECT_EQ(error_of("crane,wind\n1,2,3\n"),
            "load history 'loads.csv' line 2: 3 fields, the header has 2 columns; give one value per column");
  EXPECT_EQ(error_of("crane,wind\n1\n"),
            "load history 'loads.csv' line 2: 1 fields, the header has 2 columns; give one value per column");
}

TEST(LoadHistory, EmptyHistoriesAreErrors) {
  EXPECT_EQ(error_of(""),
            "load history 'loads.csv' is empty; it needs a header line naming the unit cases (crane, wind) and at "
            "least one row of load factors");
  EXPECT_EQ(error_of("# only a comment\ncrane,wind\n"),
            "load history 'loads.csv' has a header but no rows; add at least one row of load factors");
}

TEST(LoadHistory, MissingFileIsAnErrorNamingIt) {
  test::TempDir dir;
  const std::string path = dir.file("none.csv");
  try {
    read_load_history(path, {"a"});
    FAIL();
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()),
              "cannot read load history '" + path + "': no such file; check loading.history in the plan");
  }
}

TEST(LoadHistory, ReadsAFileWithManyRows) {
  test::TempDir dir;
  const std::string path = dir.file("long.csv");
  {
    std::ofstream out(path);
    out << "a,b\n";
    for (int i = 0; i < 100000; ++i) out << i << "," << -0.5 * i << "\n";
  }
  const LoadHistory h = read_load_history(path, {"a", "b"});
  ASSERT_EQ(h.rows(), 100000u);
  EXPECT_CLOSE(h.at(99999, 0), 99999.0, 0);
  EXPECT_CLOSE(h.at(99999, 1), -49999.5, 0);
}

}  // namespace
}  // namespace toehold
