// Parsing the ASCII CalculiX .frd format, record by record. Record layouts follow the format description that
// comes with CalculiX GraphiX (cgx 2.20 manual, "Result Format", from memory [M]) and were checked against the
// files ccx 2.20 writes (meshes/calculix/): fixed-width fields, numbers 5 (format 0) or 10 (format 1) digits wide,
// values E12.5 with no space between them, blocks ended by a "-3" record, the file by "9999".
#include "frd_parse.hpp"

#include "toehold/common/error.hpp"

#include <vtkCellType.h>

#include <algorithm>
#include <cctype>
#include <charconv>
#include <fstream>
#include <sstream>
#include <string_view>

namespace toehold::detail {
namespace {

// .frd to VTK node order. Hexahedra and tetrahedra follow the solver's deck order except the 20-node hexahedron,
// whose .frd lists the four vertical edges before the four top edges (VTK = frd[0:12] + frd[16:20] + frd[12:16]);
// the 15-node wedge does the same with its three top and three vertical edges. Wedges are also turned over: the
// deck's base triangle 1-2-3 runs anticlockwise seen from the top triangle, VTK's runs clockwise (VTK's faces of a
// wedge in deck order point inwards; checked with vtkWedge::GetFace), so VTK = (1, 3, 2, 4, 6, 5) in deck numbers.
const FrdElementType kTypes[] = {
    {1, VTK_HEXAHEDRON, 8, {0, 1, 2, 3, 4, 5, 6, 7}, "8-node hexahedron"},
    {2, VTK_WEDGE, 6, {0, 2, 1, 3, 5, 4}, "6-node wedge"},
    {3, VTK_TETRA, 4, {0, 1, 2, 3}, "4-node tetrahedron"},
    {4, VTK_QUADRATIC_HEXAHEDRON, 20, {0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 16, 17, 18, 19, 12, 13, 14, 15},
     "20-node hexahedron"},
    {5, VTK_QUADRATIC_WEDGE, 15, {0, 2, 1, 3, 5, 4, 8, 7, 6, 14, 13, 12, 9, 11, 10}, "15-node wedge"},
    {6, VTK_QUADRATIC_TETRA, 10, {0, 1, 2, 3, 4, 5, 6, 7, 8, 9}, "10-node tetrahedron"},
    // Surface and line elements: read so that cleaning can drop and count them like any cell of dimension < 3.
    {7, VTK_TRIANGLE, 3, {0, 1, 2}, "3-node triangle"},
    {8, VTK_QUADRATIC_TRIANGLE, 6, {0, 1, 2, 3, 4, 5}, "6-node triangle"},
    {9, VTK_QUAD, 4, {0, 1, 2, 3}, "4-node quadrilateral"},
    {10, VTK_QUADRATIC_QUAD, 8, {0, 1, 2, 3, 4, 5, 6, 7}, "8-node quadrilateral"},
    {11, VTK_LINE, 2, {0, 1}, "2-node beam"},
    {12, VTK_QUADRATIC_EDGE, 3, {0, 1, 2}, "3-node beam"},
};

constexpr std::size_t kValueWidth = 12;  // E12.5

std::string_view trimmed(std::string_view s) {
  while (!s.empty() && std::isspace(static_cast<unsigned char>(s.front()))) s.remove_prefix(1);
  while (!s.empty() && std::isspace(static_cast<unsigned char>(s.back()))) s.remove_suffix(1);
  return s;
}

// Reads the file line by line and turns every problem into an Error that names the file and the line.
class Parser {
public:
  Parser(const std::string& path, int keep_step) : path_(path), keep_step_(keep_step) {}

  FrdData run() {
    load();
    while (next()) top_level();
    if (!ended_)
      fail(line_no_, "the file ends without its closing '9999' record: it is truncated; let the solver finish "
                     "writing it, or run the analysis again");
    if (data_.node_ids.empty() || data_.elements.empty())
      fail(line_no_, "the file has no node block (2C) or no element block (3C); write the mesh with the results "
                     "(ccx does unless told otherwise)");
    return std::move(data_);
  }

private:
  [[noreturn]] void fail(int line, const std::string& what) const {
    throw Error(path_ + ", line " + std::to_string(line) + ": " + what);
  }

  void load() {
    std::ifstream in(path_, std::ios::binary);
    if (!in) throw Error(path_ + ": cannot be opened; check the path and its permissions");
    std::ostringstream text;
    text << in.rdbuf();
    text_ = text.str();
    const auto binary = std::find_if(text_.begin(), text_.end(), [](char c) {
      const auto u = static_cast<unsigned char>(c);
      return u == 0 || (u < 32 && c != '\n' && c != '\r' && c != '\t');
    });
    if (binary != text_.end()) {
      const int line = 1 + static_cast<int>(std::count(text_.begin(), binary, '\n'));
      fail(line, "holds binary data; toehold reads ASCII .frd files only: write the results as ASCII");
    }
    if (text_.rfind("    1C", 0) != 0)
      fail(1, "is not a CalculiX .frd result file (it does not start with a '    1C' record)");
  }

  // Moves to the next line; false at the end of the file.
  bool next() {
    if (pos_ >= text_.size()) return false;
    const std::size_t end = std::min(text_.find('\n', pos_), text_.size());
    line_ = std::string_view(text_).substr(pos_, end - pos_);
    if (!line_.empty() && line_.back() == '\r') line_.remove_suffix(1);
    pos_ = end + 1;
    ++line_no_;
    return true;
  }

  // Next line inside the block `what` that started at `start`; Error when the file ends first.
  void next_in(const char* what, int start) {
    if (!next())
      fail(line_no_, std::string("the file ends inside the ") + what + " that starts at line " +
                         std::to_string(start) + ": it is truncated; let the solver finish writing it, or run the "
                         "analysis again");
  }

  std::string_view field(std::size_t start, std::size_t width, const char* what) const {
    if (line_.size() < start + width)
      fail(line_no_, std::string("the record is too short for its ") + what + " (" + std::to_string(line_.size()) +
                         " characters, " + std::to_string(start + width) +
                         " needed); the file is truncated or corrupt: write it again from the solver");
    return line_.substr(start, width);
  }

  long long integer(std::size_t start, std::size_t width, const char* what) const {
    const std::string_view s = trimmed(field(start, width, what));
    long long v = 0;
    const auto [end, ec] = std::from_chars(s.data(), s.data() + s.size(), v);
    if (s.empty() || ec != std::errc() || end != s.data() + s.size())
      fail(line_no_, std::string("its ") + what + " '" + std::string(s) + "' is not an integer; the file is corrupt");
    return v;
  }

  double real(std::size_t start, const char* what) const {
    const std::string_view s = trimmed(field(start, kValueWidth, what));
    double v = 0.0;
    const auto [end, ec] = std::from_chars(s.data(), s.data() + s.size(), v);
    if (s.empty() || ec != std::errc() || end != s.data() + s.size())
      fail(line_no_, std::string("its ") + what + " '" + std::string(s) + "' is not a number; the file is corrupt");
    return v;
  }

  bool key_is(std::string_view key) const { return line_.size() >= 3 && line_.substr(0, 3) == key; }

  // The number width of a block from the format field of its header (0: 5 digits, 1: 10, 2: binary).
  std::size_t number_width(std::size_t column, const char* block) const {
    const long long format = line_.size() > column ? integer(column, line_.size() - column, "format number") : 1;
    if (format == 2)
      fail(line_no_, std::string("the ") + block + " is written in binary (format 2); toehold reads ASCII .frd "
                                                   "files only: write the results as ASCII");
    if (format != 0 && format != 1)
      fail(line_no_, std::string("the ") + block + " has format " + std::to_string(format) +
                         "; .frd blocks are format 0 (short) or 1 (long)");
    return format == 0 ? 5 : 10;
  }

  void top_level() {
    if (line_.rfind("    1UMAT", 0) == 0) {
      read_material();
    } else if (line_.rfind("    2C", 0) == 0) {
      read_nodes();
    } else if (line_.rfind("    3C", 0) == 0) {
      read_elements();
    } else if (line_.rfind("  100C", 0) == 0) {
      read_result();
    } else if (trimmed(line_) == "9999") {
      ended_ = true;
    }
  }

  void read_material() {
    const long long number = integer(9, 5, "material number");
    data_.materials[static_cast<int>(number)] = std::string(trimmed(line_.substr(14)));
  }

  void read_nodes() {
    const int start = line_no_;
    const long long count = integer(24, 12, "node count");
    const std::size_t w = number_width(36, "node block");
    for (next_in("node block", start); !key_is(" -3"); next_in("node block", start)) {
      if (!key_is(" -1")) fail(line_no_, "a node record must start with ' -1'; the file is corrupt");
      data_.node_ids.push_back(integer(3, w, "node number"));
      data_.xyz.push_back({real(3 + w, "x coordinate"), real(3 + w + kValueWidth, "y coordinate"),
                           real(3 + w + 2 * kValueWidth, "z coordinate")});
    }
    check_count(start, "node", count, static_cast<long long>(data_.node_ids.size()));
  }

  void check_count(int start, const char* what, long long declared, long long read) const {
    if (declared != read)
      fail(start, std::string("the ") + what + " block declares " + std::to_string(declared) + " " + what +
                      "s and holds " + std::to_string(read) + "; the file is corrupt: write it again from the solver");
  }

  void read_elements() {
    const int start = line_no_;
    const long long count = integer(24, 12, "element count");
    const std::size_t w = number_width(36, "element block");
    const std::size_t before = data_.elements.size();
    for (next_in("element block", start); !key_is(" -3"); next_in("element block", start)) {
      if (!key_is(" -1")) fail(line_no_, "an element record must start with ' -1'; the file is corrupt");
      read_element(w, start);
    }
    check_count(start, "element", count, static_cast<long long>(data_.elements.size() - before));
  }

  void read_element(std::size_t w, int start) {
    FrdElement e;
    e.line = line_no_;
    e.number = integer(3, w, "element number");
    e.type = static_cast<int>(integer(3 + w, 5, "element type"));
    e.material = static_cast<int>(integer(13 + w, 5, "material number"));
    const FrdElementType* type = frd_element_type(e.type);
    if (!type)
      fail(line_no_, "element " + std::to_string(e.number) + " has .frd element type " + std::to_string(e.type) +
                         ", which toehold does not know; it reads types 1 to 12 (hexahedra, wedges, tetrahedra of "
                         "first and second order, and surface and beam elements, which it drops)");
    const std::size_t per_line = w == 5 ? 15 : 10;
    while (e.nodes.size() < static_cast<std::size_t>(type->nodes)) {
      next_in("element block", start);
      if (!key_is(" -2"))
        fail(line_no_, "element " + std::to_string(e.number) + " needs " + std::to_string(type->nodes) +
                           " node numbers on ' -2' records; the file is corrupt");
      const std::size_t left = static_cast<std::size_t>(type->nodes) - e.nodes.size();
      for (std::size_t k = 0; k < std::min(per_line, left); ++k) e.nodes.push_back(integer(3 + k * w, w, "node number"));
    }
    data_.elements.push_back(std::move(e));
  }

  // Adds a block to its step: a new FrdStep when the header's step number differs from the last step's.
  int add_to_step(int number, double value, const std::string& name, int start) {
    if (data_.steps.empty() || data_.steps.back().number != number) data_.steps.push_back({number, value, {}, start});
    data_.steps.back().blocks.push_back(name);
    return static_cast<int>(data_.steps.size()) - 1;
  }

  void read_result() {
    const int start = line_no_;
    const std::size_t w = number_width(74, "result block");
    const int number = static_cast<int>(integer(59, 5, "step number"));
    const double value = real(13, "step value");
    next_in("result block", start);
    if (!key_is(" -4")) fail(line_no_, "a result block needs a ' -4' record after its header; the file is corrupt");
    FrdBlock block;
    block.name = std::string(trimmed(field(5, 8, "block name")));
    block.line = start;
    const int step = add_to_step(number, value, block.name, start);
    block.components = stored_components(start);
    const bool keep = step == keep_step_ && (block.name == "DISP" || block.name == "STRESS") &&
                      std::none_of(data_.kept.begin(), data_.kept.end(),
                                   [&](const FrdBlock& b) { return b.name == block.name; });
    read_values(block, w, start, keep);
    if (keep) data_.kept.push_back(std::move(block));
  }

  // Reads the ' -5' component records; components with IEXIST = 1 (such as ALL) are derived and not stored.
  int stored_components(int start) {
    int stored = 0;
    for (next_in("result block", start); key_is(" -5"); next_in("result block", start)) {
      const bool derived = line_.size() >= 38 && integer(33, 5, "component flag") == 1;
      if (!derived) ++stored;
    }
    return stored;
  }

  // Reads ' -1' value records (with ' -2' continuations beyond six values) up to ' -3'; the current line is the
  // first value record.
  void read_values(FrdBlock& block, std::size_t w, int start, bool keep) {
    const auto n = static_cast<std::size_t>(block.components);
    for (; !key_is(" -3"); next_in("result block", start)) {
      if (!key_is(" -1")) fail(line_no_, "a result record must start with ' -1'; the file is corrupt");
      const long long node = integer(3, w, "node number");
      if (keep) block.row.emplace(node, block.values.size() / std::max<std::size_t>(n, 1));
      for (std::size_t k = 0; k < n; ++k) {
        if (k > 0 && k % 6 == 0) {
          next_in("result block", start);
          if (!key_is(" -2")) fail(line_no_, "a result record with more than six values continues on ' -2'");
        }
        const double v = real(3 + w + (k % 6) * kValueWidth, "value");
        if (keep) block.values.push_back(v);
      }
    }
  }

  std::string path_;
  int keep_step_;
  std::string text_;
  std::size_t pos_ = 0;
  std::string_view line_;
  int line_no_ = 0;
  bool ended_ = false;
  FrdData data_;
};

}  // namespace

const FrdElementType* frd_element_type(int code) {
  for (const FrdElementType& t : kTypes)
    if (t.code == code) return &t;
  return nullptr;
}

FrdData parse_frd(const std::string& path, int keep_step) { return Parser(path, keep_step).run(); }

}  // namespace toehold::detail
