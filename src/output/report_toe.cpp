// The toe sections of report.html: utilization and hot-spot stress range along the toe, and the station table.
#include "report_parts.hpp"
#include "toehold/output/svg_plot.hpp"

#include <sstream>

namespace toehold::report {
namespace {

struct AlongToe {
  std::vector<double> arc, util, range, allowable, flagged_arc, flagged_util;
};

AlongToe along(const Context& c, const ToeResult& toe) {
  AlongToe v;
  for (const auto& s : toe.stations) {
    if (!s.ok()) continue;
    v.arc.push_back(c.length(s.station.arc));
    v.util.push_back(s.utilization);
    v.range.push_back(c.damage_kind() ? s.equivalent_range : s.range);
    v.allowable.push_back(s.allowable);
    if (s.exceeds()) {
      v.flagged_arc.push_back(v.arc.back());
      v.flagged_util.push_back(s.utilization);
    }
  }
  return v;
}

std::string utilization_plot(const Context& c, std::size_t t, const AlongToe& v) {
  Plot p;
  p.id = toe_anchor(t) + "-utilization";
  p.title = "Utilization along '" + c.a.toes[t].plan.name + "'";
  p.description = "utilization of every station with a result against its arc length along the toe";
  p.x.label = "arc length along the toe [" + c.unit + "]";
  p.y.label = "utilization [-]";
  p.y.min = 0.0;
  PlotSeries all{"stations", v.arc, v.util};
  all.marker = MarkerShape::circle;
  all.marker_size = 2.5;
  PlotSeries flagged{"utilization > 1", v.flagged_arc, v.flagged_util, "#c0392b", false};
  flagged.marker = MarkerShape::circle;
  flagged.marker_size = 4.0;
  p.series = {all, flagged};
  p.guides.push_back({false, 1.0, "utilization = 1", "#c0392b"});
  return render_svg(p);
}

std::string range_plot(const Context& c, std::size_t t, const AlongToe& v) {
  Plot p;
  p.id = toe_anchor(t) + "-range";
  const std::string what = c.damage_kind() ? "equivalent range at 2e6 cycles" : "hot-spot stress range";
  p.title = "Hot-spot stress along '" + c.a.toes[t].plan.name + "'";
  p.description = what + " and allowable range of every station with a result against arc length";
  p.x.label = "arc length along the toe [" + c.unit + "]";
  p.y.label = "stress range [MPa]";
  p.y.min = 0.0;
  PlotSeries range{what, v.arc, v.range};
  range.marker = MarkerShape::circle;
  range.marker_size = 2.5;
  PlotSeries allowable{"allowable range", v.arc, v.allowable, "#2e8b57"};
  allowable.dashed = true;
  p.series = {range, allowable};
  return render_svg(p);
}

std::string header_row(const Context& c, const ToeResult&) {
  std::ostringstream os;
  os << "<tr><th>station</th><th>x [" << esc(c.unit) << "]</th><th>y [" << esc(c.unit) << "]</th><th>z ["
     << esc(c.unit) << "]</th><th>arc length [" << esc(c.unit) << "]</th>";
  if (c.a.steps.size() <= 6)
    for (const auto& step : c.a.steps) os << "<th>hot-spot stress '" << esc(step) << "' [MPa]</th>";
  os << "<th>hot-spot stress range [MPa]</th><th>allowable range [MPa]</th><th>utilization [-]</th>";
  if (c.damage_kind())
    os << "<th>Miner sum per repeat [-]</th><th>equivalent range [MPa]</th><th>life [repeats]</th>"
       << "<th>life [years]</th>";
  else
    os << "<th>life [cycles]</th>";
  os << "<th class=\"text\">status</th></tr>\n";
  return os.str();
}

std::string cell(const std::string& name, const std::string& text) {
  return "<td class=\"v-" + name + "\">" + text + "</td>";
}

std::string result_cells(const Context& c, const StationResult& s) {
  std::ostringstream os;
  if (c.a.steps.size() <= 6)
    for (std::size_t k = 0; k < c.a.steps.size(); ++k)
      os << cell("hot-spot-" + std::to_string(k), s.ok() && k < s.hot_spot.size() ? fixed(s.hot_spot[k], 1) : "-");
  if (!s.ok()) {
    const int empty = c.damage_kind() ? 7 : 4;
    for (int i = 0; i < empty; ++i) os << "<td>-</td>";
    return os.str();
  }
  os << cell("range", fixed(s.range, 1)) << cell("allowable", fixed(s.allowable, 1))
     << cell("utilization", fixed(s.utilization, 3));
  if (c.damage_kind())
    os << cell("damage", sig(s.damage, 4)) << cell("equivalent-range", fixed(s.equivalent_range, 1))
       << cell("life-repeats", sig(s.life_repeats, 4)) << cell("life-years", sig(s.life_years, 4));
  else
    os << cell("life", sig(s.life, 4));
  return os.str();
}

std::string station_row(const Context& c, std::size_t t, const StationResult& s) {
  std::ostringstream os;
  const std::string kind = !s.ok() ? "no-result" : s.exceeds() ? "exceeds" : "ok";
  os << "<tr id=\"" << station_anchor(t, s.station.id) << "\" class=\"" << kind << "\">" << cell("id", std::to_string(s.station.id))
     << cell("x", sig(c.length(s.station.x.x()), 6)) << cell("y", sig(c.length(s.station.x.y()), 6))
     << cell("z", sig(c.length(s.station.x.z()), 6)) << cell("arc", sig(c.length(s.station.arc), 6))
     << result_cells(c, s) << "<td class=\"text v-status\">" << esc(status_word(s))
     << (s.ok() ? "" : ": " + esc(s.problem)) << "</td></tr>\n";
  return os.str();
}

std::string toe_facts(const Context& c, const ToeResult& toe) {
  const int n = static_cast<int>(toe.stations.size());
  int exceed = 0, none = 0;
  for (const auto& s : toe.stations) {
    exceed += s.exceeds() ? 1 : 0;
    none += s.ok() ? 0 : 1;
  }
  std::ostringstream os;
  os << "<p>" << (toe.line.closed ? "Closed" : "Open") << " toe, " << sig(c.length(toe.line.length()), 5) << " "
     << esc(c.unit) << " long, plate thickness " << sig(toe.plan.thickness, 4) << " mm; " << esc(toe.scheme.label)
     << "; " << esc(toe.definition) << " hot-spot stress; " << esc(toe.curve) << ". " << n << " stations: "
     << n - exceed - none << " pass, " << exceed << " exceed, " << none << " without result."
     << shell_toe_sentence(toe);
  if (toe.worst >= 0) {
    const StationResult& w = toe.stations[static_cast<std::size_t>(toe.worst)];
    os << " Worst: station " << w.station.id << ", utilization " << fixed(w.utilization, 3) << ".";
  }
  os << "</p>\n";
  return os.str();
}

}  // namespace

std::string toe_section(const Context& c, std::size_t t) {
  const ToeResult& toe = c.a.toes[t];
  const AlongToe v = along(c, toe);
  std::ostringstream os;
  os << "<section class=\"toe\">\n<h2 id=\"" << toe_anchor(t) << "\">Toe " << t + 1 << ": " << esc(toe.plan.name)
     << "</h2>\n" << toe_facts(c, toe);
  os << "<div class=\"plots\">\n" << utilization_plot(c, t, v) << range_plot(c, t, v) << "</div>\n";
  os << nominal_section(c, t);
  os << "<h3>Stations of '" << esc(toe.plan.name) << "'</h3>\n<table class=\"stations\" data-toe=\"" << t + 1
     << "\">\n" << header_row(c, toe);
  for (const auto& s : toe.stations) os << station_row(c, t, s);
  os << "</table>\n</section>\n";
  return os.str();
}

}  // namespace toehold::report
