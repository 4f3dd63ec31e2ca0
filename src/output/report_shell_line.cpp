// The shell and linearization parts of report.html: which layer and origin a shell toe reads, and at a critical
// station the through-thickness linearization (membrane, bending, structural, peak, 1 mm below) beside the surface
// extrapolation.
#include "report_parts.hpp"
#include "result_files.hpp"

#include <cmath>
#include <sstream>

namespace toehold::report {
namespace {

std::string td(const std::string& name, const std::string& text) {
  return "<td class=\"v-line-" + name + "\">" + text + "</td>";
}

std::string at(const std::vector<double>& values, std::size_t k, int decimals) {
  return k < values.size() ? fixed(values[k], decimals) : "-";
}

std::string origin_words(const std::string& origin) {
  return origin == "weld-toe" ? "the weld toe" : "the plate intersection line";
}

std::string step_rows(const Context& c, const StationResult& s) {
  const ThroughThicknessResult& l = *s.through_thickness;
  std::ostringstream os;
  for (std::size_t k : plotted_steps(c.a, s)) {
    os << "<tr><td class=\"text\">" << esc(c.a.steps[k]) << "</td>" << td("membrane", at(l.membrane, k, 1))
       << td("bending", at(l.bending, k, 1)) << td("structural", at(l.structural, k, 1))
       << td("peak", at(l.peak, k, 1)) << td("hot-spot", at(l.hot_spot, k, 1)) << td("one-mm", at(l.one_mm, k, 1))
       << td("surface", s.ok() ? at(s.hot_spot, k, 1) : "-") << "</tr>\n";
  }
  return os.str();
}

std::string range_row(const StationResult& s) {
  const ThroughThicknessResult& l = *s.through_thickness;
  const double ratio = detail::linearized_ratio(s);
  std::ostringstream os;
  os << "<tr><td class=\"text\">range</td><td>-</td><td>-</td><td>-</td><td>-</td>"
     << td("structural-range", fixed(l.structural_range, 1)) << td("one-mm-range", fixed(l.one_mm_range, 1))
     << td("surface-range", s.ok() ? fixed(s.range, 1) : "-") << "</tr>\n";
  os << "<tr><td class=\"text\">ratio linearized / surface range [-]</td>"
     << td("ratio", std::isfinite(ratio) ? fixed(ratio, 3) : "-") << "</tr>\n";
  return os.str();
}

}  // namespace

std::string shell_toe_sentence(const ToeResult& toe) {
  for (const auto& s : toe.stations) {
    if (!s.shell) continue;
    std::ostringstream os;
    os << " Shell model: the toe reads the <b>" << esc(s.shell->layer) << "</b> layer of the carrying plate, read-out "
       << "distances from " << origin_words(s.shell->origin) << " (hot spot " << sig(s.shell->offset, 4)
       << " mm from the intersection line).";
    return os.str();
  }
  return toe.plan.shell ? " Shell model: no station has a layer." : "";
}

std::string shell_station_facts(const Context& c, const StationResult& s) {
  if (!s.shell) return "";
  const ShellStationInfo& i = *s.shell;
  std::ostringstream os;
  os << "<p class=\"shell\">Shell model: layer <b>" << esc(i.layer) << "</b>, distances from "
     << origin_words(i.origin) << ", hot-spot location (" << sig(c.length(i.hot_spot.x()), 6) << ", "
     << sig(c.length(i.hot_spot.y()), 6) << ", " << sig(c.length(i.hot_spot.z()), 6) << ") " << esc(c.unit) << ", "
     << sig(i.offset, 4) << " mm from the intersection line; plate thickness " << sig(i.thickness, 4) << " mm.</p>\n";
  return os.str();
}

std::string linearization_table(const Context& c, const StationResult& s) {
  if (!s.through_thickness) return "";
  const ThroughThicknessResult& l = *s.through_thickness;
  std::ostringstream os;
  os << "<p class=\"note\">Through-thickness linearization (ASME BPVC VIII-2 Annex 5-A) over " << sig(l.thickness, 4)
     << " mm, " << l.points << " points (" << esc(l.rule) << "), beside the surface extrapolation";
  if (!l.ok()) {
    os << ": no linearized value, " << esc(l.problem) << ".</p>\n";
    return os.str();
  }
  os << (l.note.empty() ? "" : "; " + esc(l.note)) << ":</p>\n<table class=\"linearization\"><tr><th class=\"text\">"
     << "step</th><th>membrane [MPa]</th><th>bending [MPa]</th><th>structural [MPa]</th><th>peak [MPa]</th>"
     << "<th>linearized hot-spot [MPa]</th><th>1 mm below surface [MPa]</th><th>surface extrapolation [MPa]</th>"
     << "</tr>\n" << step_rows(c, s) << range_row(s) << "</table>\n";
  return os.str();
}

}  // namespace toehold::report
