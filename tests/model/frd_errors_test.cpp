// Bad .frd files are refused with messages that name the file and the line; the short (5-digit) format reads.
#include "support/support.hpp"
#include "toehold/common/error.hpp"
#include "toehold/model/frd_reader.hpp"

#include <vtkCellData.h>
#include <vtkCellType.h>
#include <vtkDataArray.h>
#include <vtkPointData.h>

#include <fstream>
#include <functional>
#include <sstream>

namespace toehold {
namespace {

using test::error_of;

using test::TempDir;

const std::string kDir = std::string(TOEHOLD_SOURCE_DIR) + "/meshes/calculix/";

std::vector<std::string> lines_of(const std::string& path) {
  std::ifstream in(path);
  std::vector<std::string> out;
  for (std::string line; std::getline(in, line);) out.push_back(line);
  return out;
}

std::string write_lines(const TempDir& dir, const std::string& name, const std::vector<std::string>& lines) {
  const std::string path = dir.file(name);
  std::ofstream out(path);
  for (const std::string& l : lines) out << l << "\n";
  return path;
}

TEST(FrdErrors, TruncatedFileNamesTheBlockAndLine) {
  TempDir dir;
  std::vector<std::string> lines = lines_of(kDir + "steps_hex8.frd");
  ASSERT_EQ(lines[267].substr(0, 7), "  100CL");  // line 268: the DISP block of step 2
  lines.resize(300);
  const std::string path = write_lines(dir, "cut.frd", lines);
  EXPECT_EQ(error_of([&] { read_frd(path, 0); }),
            path + ", line 300: the file ends inside the result block that starts at line 268: it is truncated; let "
                   "the solver finish writing it, or run the analysis again");
}

TEST(FrdErrors, MissingEndRecordIsTruncation) {
  TempDir dir;
  std::vector<std::string> lines = lines_of(kDir + "block_wedge15.frd");
  ASSERT_EQ(lines.back(), " 9999");
  lines.pop_back();
  const std::string path = write_lines(dir, "noend.frd", lines);
  EXPECT_EQ(error_of([&] { read_frd(path, 0); }),
            path + ", line " + std::to_string(lines.size()) + ": the file ends without its closing '9999' record: it "
                   "is truncated; let the solver finish writing it, or run the analysis again");
}

TEST(FrdErrors, UnknownElementTypeNamesTheElement) {
  TempDir dir;
  std::vector<std::string> lines = lines_of(kDir + "block_wedge15.frd");
  ASSERT_EQ(lines[50], " -1       101    5    0    1");
  lines[50] = " -1       101   13    0    1";
  const std::string path = write_lines(dir, "type.frd", lines);
  EXPECT_EQ(error_of([&] { read_frd(path, 0); }),
            path + ", line 51: element 101 has .frd element type 13, which toehold does not know; it reads types 1 "
                   "to 12 (hexahedra, wedges, tetrahedra of first and second order, and surface and beam elements, "
                   "which it drops)");
}

TEST(FrdErrors, StepWithoutStressSaysHowToRequestIt) {
  TempDir dir;
  std::vector<std::string> lines = lines_of(kDir + "block_wedge15.frd"), kept;
  bool in_stress = false;
  for (std::size_t i = 0; i < lines.size(); ++i) {
    if (i + 1 < lines.size() && lines[i + 1].rfind(" -4  STRESS", 0) == 0) in_stress = true;
    if (!in_stress) kept.push_back(lines[i]);
    if (in_stress && lines[i] == " -3") in_stress = false;
  }
  ASSERT_LT(kept.size(), lines.size());
  int first_header = 0;
  for (std::size_t i = 0; i < kept.size() && first_header == 0; ++i)
    if (kept[i].rfind("  100C", 0) == 0) first_header = static_cast<int>(i) + 1;
  const std::string path = write_lines(dir, "nostress.frd", kept);
  EXPECT_EQ(error_of([&] { read_frd(path, 0); }),
            path + ", line " + std::to_string(first_header) + ": result step 0 (step value 1) has no STRESS block (it "
                   "has DISP, ERROR); request the stresses in the deck with *EL FILE and S (or *NODE FILE and S) and "
                   "run the analysis again");
}

TEST(FrdErrors, BinaryBlockIsRefused) {
  TempDir dir;
  std::vector<std::string> lines = lines_of(kDir + "block_wedge15.frd");
  ASSERT_EQ(lines[11].substr(0, 6), "    2C");
  lines[11].back() = '2';  // the format field of the node block header: 2 = binary
  const std::string path = write_lines(dir, "binary.frd", lines);
  EXPECT_EQ(error_of([&] { read_frd(path, 0); }),
            path + ", line 12: the node block is written in binary (format 2); toehold reads ASCII .frd files only: "
                   "write the results as ASCII");
}

TEST(FrdErrors, NotAnFrdFile) {
  TempDir dir;
  const std::string path = write_lines(dir, "other.frd", {"hello"});
  EXPECT_EQ(error_of([&] { read_frd(path, 0); }),
            path + ", line 1: is not a CalculiX .frd result file (it does not start with a '    1C' record)");
}

// Stress component k written for node `id` in the hand-written file: exact in 6 digits, every other one negative.
double stress_value(int id, int k) { return (k % 2 ? -1.0 : 1.0) * (10.0 * id + k + 0.5); }

// A hand-written file in the short format (format 0: numbers 5 digits wide, 15 node numbers a line): one 4-node
// tetrahedron with sparse node numbers, one unused node (9), the stresses written as below.
TEST(FrdErrors, ShortFormatTetrahedronReads) {
  TempDir dir;
  auto value = [](double v) {
    char b[16];
    std::snprintf(b, sizeof b, "%12.5E", v);
    return std::string(b);
  };
  auto header = [](const char* key, int count) {  // block header: key, count in columns 25-36, format 0 last
    char b[96];
    std::snprintf(b, sizeof b, "%-24s%12d%37s%1d", key, count, "", 0);
    return std::string(b);
  };
  std::vector<std::string> lines = {"    1C", header("    2C", 5)};
  const int ids[5] = {7, 3, 9, 11, 5};
  const double xyz[5][3] = {{0, 0, 0}, {2, 0, 0}, {5, 5, 5}, {0, 2, 0}, {0, 0, 2}};
  for (int i = 0; i < 5; ++i) {
    char b[8];
    std::snprintf(b, sizeof b, "%5d", ids[i]);
    lines.push_back(std::string(" -1") + b + value(xyz[i][0]) + value(xyz[i][1]) + value(xyz[i][2]));
  }
  char result_header[96];  // key, set name, step value, node count, text, type, step number, analysis, format
  std::snprintf(result_header, sizeof result_header, "%7s%6s%12.5E%12d%20s%2d%5d%10s%2d", "  100CL", "  101", 1.0, 5, "",
                0, 1, "", 0);
  lines.insert(lines.end(), {" -3", header("    3C", 1), " -1   42    3    0    4", " -2    7    3   11    5", " -3",
                             result_header, " -4  STRESS      6    1"});
  for (const char* c : {"SXX", "SYY", "SZZ", "SXY", "SYZ", "SZX"}) lines.push_back(std::string(" -5  ") + c + "         1    4    1    1");
  for (int i = 0; i < 5; ++i) {
    char b[8];
    std::snprintf(b, sizeof b, "%5d", ids[i]);
    std::string l = std::string(" -1") + b;
    for (int k = 0; k < 6; ++k) l += value(stress_value(ids[i], k));  // negative values run into the field before
    lines.push_back(l);
  }
  lines.insert(lines.end(), {" -3", " 9999"});
  const std::string path = write_lines(dir, "short.frd", lines);
  const FrdModel frd = read_frd(path, -1);
  EXPECT_EQ(frd.unused_nodes, 1);
  ASSERT_EQ(frd.grid->GetNumberOfCells(), 1);
  EXPECT_EQ(frd.grid->GetCellType(0), VTK_TETRA);
  EXPECT_EQ(frd.grid->GetNumberOfPoints(), 4);
  vtkDataArray* s = frd.grid->GetPointData()->GetArray("stress");
  vtkDataArray* n = frd.grid->GetPointData()->GetArray("frd node");
  EXPECT_EQ(frd.grid->GetCellData()->GetArray("frd material")->GetTuple1(0), 4.0);
  for (vtkIdType p = 0; p < 4; ++p)
    for (int k = 0; k < 6; ++k) EXPECT_DOUBLE_EQ(s->GetComponent(p, k), stress_value(static_cast<int>(n->GetTuple1(p)), k));
  const double* x1 = frd.grid->GetPoint(frd.grid->GetCell(0)->GetPointId(1));
  EXPECT_DOUBLE_EQ(x1[0], 2.0);  // element node 2 of the record is node 3 at (2, 0, 0)
}

}  // namespace
}  // namespace toehold
