// A load history table: named load channels (columns) over time (rows), read from a CSV file. Each channel scales
// one unit load case; the station's stress history is the sum of the unit cases times their channels.
#pragma once

#include <cstddef>
#include <string>
#include <string_view>
#include <vector>

namespace toehold {

struct LoadHistory {
  std::string source;                 // the file read (for messages)
  std::vector<std::string> channels;  // unit case names, in the order the caller asked for (not file order)
  std::vector<double> factors;        // row-major: rows() x channels.size() load factors, dimensionless

  std::size_t rows() const { return channels.empty() ? 0 : factors.size() / channels.size(); }
  // Load factor of `channel` (index into channels) at `row` (0-based data row).
  double at(std::size_t row, std::size_t channel) const { return factors[row * channels.size() + channel]; }
};

// Name of a column the reader skips: the time (or any other abscissa) of each row.
inline constexpr std::string_view kTimeColumn = "time";

// Reads a comma-separated history. Line 1 names the columns: every unit case in `expected` exactly once, in any
// order, plus optionally a column named "time" that is ignored. Every further line is one instant: one finite
// number per column. Blank lines and lines starting with '#' are skipped; spaces around fields and CRLF line
// ends are allowed; header names may be in double quotes. Throws Error naming the file and line for a missing
// file, an empty file, a header without data rows, a column that is not a unit case, a unit case without a
// column, a row with the wrong number of fields, and a field that is not a finite number.
LoadHistory read_load_history(const std::string& path, const std::vector<std::string>& expected);

// The same from text; `source` names it in messages.
LoadHistory parse_load_history(std::string_view text, const std::string& source,
                               const std::vector<std::string>& expected);

}  // namespace toehold
