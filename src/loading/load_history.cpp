// Reading a load history CSV: header check against the unit cases, then a fast pass over the rows with
// std::from_chars (millions of rows are common for measured channels).
#include "toehold/loading/load_history.hpp"

#include "toehold/common/error.hpp"

#include <charconv>
#include <cmath>
#include <filesystem>
#include <fstream>
#include <map>
#include <sstream>

namespace toehold {
namespace {

std::string_view trim(std::string_view s) {
  while (!s.empty() && (s.front() == ' ' || s.front() == '\t')) s.remove_prefix(1);
  while (!s.empty() && (s.back() == ' ' || s.back() == '\t' || s.back() == '\r')) s.remove_suffix(1);
  return s;
}

std::string_view unquoted(std::string_view s) {
  s = trim(s);
  if (s.size() >= 2 && s.front() == '"' && s.back() == '"') s = s.substr(1, s.size() - 2);
  return s;
}

// Walks the text line by line, skipping blank and comment lines, counting 1-based line numbers.
class Lines {
public:
  explicit Lines(std::string_view text) : text_(text) {}
  bool next(std::string_view& line) {
    while (pos_ < text_.size()) {
      const std::size_t end = std::min(text_.find('\n', pos_), text_.size());
      line = trim(text_.substr(pos_, end - pos_));
      pos_ = end + 1;
      ++number_;
      if (!line.empty() && line.front() != '#') return true;
    }
    return false;
  }
  std::size_t number() const { return number_; }

private:
  std::string_view text_;
  std::size_t pos_ = 0;
  std::size_t number_ = 0;
};

std::vector<std::string_view> split(std::string_view line) {
  std::vector<std::string_view> fields;
  std::size_t start = 0;
  while (true) {
    const std::size_t comma = line.find(',', start);
    fields.push_back(line.substr(start, comma == std::string_view::npos ? std::string_view::npos : comma - start));
    if (comma == std::string_view::npos) return fields;
    start = comma + 1;
  }
}

std::string joined(const std::vector<std::string>& names) {
  std::string out;
  for (const auto& n : names) out += (out.empty() ? "" : ", ") + n;
  return out;
}

// Column slot of each header field: index into `expected`, or -1 for the time column.
std::vector<long> map_header(std::string_view line, const std::string& at, const std::vector<std::string>& expected) {
  std::map<std::string, std::size_t> wanted;
  for (std::size_t i = 0; i < expected.size(); ++i) wanted.emplace(expected[i], i);
  std::vector<long> slots;
  std::vector<bool> seen(expected.size(), false);
  bool time_seen = false;
  for (std::string_view field : split(line)) {
    const std::string name(unquoted(field));
    if (name == kTimeColumn && !time_seen) {
      time_seen = true;
      slots.push_back(-1);
      continue;
    }
    const auto it = wanted.find(name);
    if (it == wanted.end())
      throw Error(at + ": column '" + name + "' is not a unit case of the plan; name the columns after the " +
                  "[[step]] names (" + joined(expected) + ") or '" + std::string(kTimeColumn) + "'");
    if (seen[it->second]) throw Error(at + ": column '" + name + "' appears twice; give each unit case one column");
    seen[it->second] = true;
    slots.push_back(static_cast<long>(it->second));
  }
  for (std::size_t i = 0; i < expected.size(); ++i)
    if (!seen[i]) throw Error(at + ": no column for unit case '" + expected[i] + "'; add one (one column per [[step]])");
  return slots;
}

bool parse_number(std::string_view field, double& value) {
  field = trim(field);
  if (!field.empty() && field.front() == '+') field.remove_prefix(1);
  const auto [end, ec] = std::from_chars(field.data(), field.data() + field.size(), value);
  return ec == std::errc() && end == field.data() + field.size() && std::isfinite(value);
}

void read_row(std::string_view line, const std::string& source, std::size_t line_number,
              const std::vector<long>& slots, const std::vector<std::string>& expected, double* out) {
  std::size_t column = 0, start = 0;
  while (true) {
    const std::size_t comma = line.find(',', start);
    const std::string_view field = line.substr(start, comma == std::string_view::npos ? line.npos : comma - start);
    if (column < slots.size() && slots[column] >= 0) {
      double value = 0.0;
      if (!parse_number(field, value))
        throw Error("load history '" + source + "' line " + std::to_string(line_number) + ", column '" +
                    expected[static_cast<std::size_t>(slots[column])] + "': '" + std::string(trim(field)) +
                    "' is not a finite number; write load factors as plain numbers (e.g. 0.5, -1.2e3)");
      out[slots[column]] = value;
    }
    ++column;
    if (comma == std::string_view::npos) break;
    start = comma + 1;
  }
  if (column != slots.size())
    throw Error("load history '" + source + "' line " + std::to_string(line_number) + ": " + std::to_string(column) +
                " fields, the header has " + std::to_string(slots.size()) + " columns; give one value per column");
}

}  // namespace

LoadHistory parse_load_history(std::string_view text, const std::string& source,
                               const std::vector<std::string>& expected) {
  LoadHistory h;
  h.source = source;
  h.channels = expected;
  Lines lines(text);
  std::string_view line;
  if (!lines.next(line))
    throw Error("load history '" + source + "' is empty; it needs a header line naming the unit cases (" +
                joined(expected) + ") and at least one row of load factors");
  const std::vector<long> slots =
      map_header(line, "load history '" + source + "' line " + std::to_string(lines.number()), expected);
  h.factors.reserve(expected.size() * (text.size() / (8 * slots.size() + 1) + 1));
  while (lines.next(line)) {
    const std::size_t at = h.factors.size();
    h.factors.resize(at + expected.size());
    read_row(line, source, lines.number(), slots, expected, h.factors.data() + at);
  }
  if (h.factors.empty())
    throw Error("load history '" + source + "' has a header but no rows; add at least one row of load factors");
  h.factors.shrink_to_fit();
  return h;
}

LoadHistory read_load_history(const std::string& path, const std::vector<std::string>& expected) {
  std::error_code ec;
  if (!std::filesystem::is_regular_file(path, ec))
    throw Error("cannot read load history '" + path + "': no such file; check loading.history in the plan");
  std::ifstream in(path, std::ios::binary);
  if (!in) throw Error("cannot read load history '" + path + "': the file cannot be opened; check its permissions");
  std::string text;
  in.seekg(0, std::ios::end);
  text.resize(static_cast<std::size_t>(in.tellg()));
  in.seekg(0, std::ios::beg);
  in.read(text.data(), static_cast<std::streamsize>(text.size()));
  return parse_load_history(text, path, expected);
}

}  // namespace toehold
