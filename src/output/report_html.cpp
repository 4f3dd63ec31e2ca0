// report.html put together: page frame and style, the summary, the worst stations, the toe and critical-station
// sections (report_toe.cpp, report_station.cpp), the diagnostics and the provenance.
#include "toehold/output/report_html.hpp"

#include "report_parts.hpp"
#include "toehold/output/summary.hpp"
#include "toehold/output/svg_plot.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <numeric>
#include <sstream>

namespace toehold {
namespace report {

std::string fixed(double v, int decimals) {
  if (std::isnan(v)) return "-";
  if (std::isinf(v)) return v > 0 ? "no damage" : "-inf";
  char buffer[64];
  std::snprintf(buffer, sizeof buffer, "%.*f", decimals, v);
  return buffer;
}

std::string sig(double v, int digits) {
  if (std::isnan(v)) return "-";
  if (std::isinf(v)) return v > 0 ? "no damage" : "-inf";
  char buffer[64];
  std::snprintf(buffer, sizeof buffer, "%.*g", digits, v);
  return buffer;
}

std::string esc(const std::string& text) { return xml_escaped(text); }

std::vector<std::size_t> plotted_steps(const Assessment& a, const StationResult& s) {
  std::vector<std::size_t> steps;
  if (a.steps.size() <= 4) {
    for (std::size_t k = 0; k < a.steps.size(); ++k) steps.push_back(k);
    return steps;
  }
  for (int k : {s.range_from, s.range_to})
    if (k >= 0 && static_cast<std::size_t>(k) < a.steps.size()) steps.push_back(static_cast<std::size_t>(k));
  if (steps.empty() || (steps.size() == 2 && steps[0] == steps[1])) steps = {0, 1};
  return steps;
}

const char* series_colour(std::size_t i) {
  static const char* const kColours[] = {"#1f5fa8", "#c0392b", "#2e8b57", "#7d3c98", "#b9770e", "#117a8b"};
  return kColours[i % 6];
}

std::string status_word(const StationResult& s) {
  if (!s.ok()) return "no result";
  return s.exceeds() ? "exceeds" : "ok";
}

std::string toe_anchor(std::size_t toe) { return "toe-" + std::to_string(toe + 1); }
std::string station_anchor(std::size_t toe, int station_id) {
  return toe_anchor(toe) + "-station-" + std::to_string(station_id);
}

namespace {

constexpr const char* kStyle = R"(
body { font-family: "DejaVu Sans", "Liberation Sans", Arial, sans-serif; font-size: 14px; color: #1d1d1d;
       max-width: 1180px; margin: 0 auto; padding: 12px 20px 40px; background: #fafafa; }
h1 { font-size: 24px; margin: 8px 0 4px; }
h2 { font-size: 19px; border-bottom: 2px solid #1f5fa8; padding-bottom: 3px; margin-top: 30px; }
h3 { font-size: 16px; margin: 20px 0 6px; }
.caution { border: 2px solid #b9770e; background: #fff6e0; padding: 8px 12px; margin: 12px 0; font-weight: bold; }
table { border-collapse: collapse; margin: 6px 0 12px; background: #ffffff; }
th, td { border: 1px solid #c8c8c8; padding: 3px 7px; text-align: right; vertical-align: top; }
th { background: #e8eef6; text-align: center; }
td.text, th.text { text-align: left; }
table.facts td:first-child { text-align: left; font-weight: bold; background: #f2f2f2; }
table.facts td { text-align: left; }
table.stations { font-size: 12px; }
tr.exceeds td { background: #fde2df; }
tr.no-result td { background: #eeeeee; color: #555555; }
.badge { display: inline-block; padding: 1px 8px; border-radius: 3px; color: #ffffff; font-weight: bold; }
.badge.ok { background: #2e8b57; } .badge.exceeds { background: #c0392b; } .badge.none { background: #777777; }
.plots { display: flex; flex-wrap: wrap; gap: 12px; }
svg.plot { background: #ffffff; border: 1px solid #d0d0d0; }
pre { background: #ffffff; border: 1px solid #c8c8c8; padding: 8px; overflow-x: auto; font-size: 12px; }
.note { color: #444444; font-size: 13px; }
.mono { font-family: "DejaVu Sans Mono", monospace; font-size: 12px; }
)";

std::string fact(const std::string& name, const std::string& value_html) {
  return "<tr><td>" + esc(name) + "</td><td>" + value_html + "</td></tr>\n";
}

std::string requirement_text(const Assessment& a) {
  const RequirementPlan& r = a.plan.requirement;
  std::string text;
  if (a.plan.loading.kind == LoadingKind::range)
    text = sig(r.cycles, 4) + " cycles of the hot-spot stress range";
  else
    text = "Miner sum of the load history within each toe's damage limit";
  if (r.design_life_years > 0) text += "; design life " + sig(r.design_life_years, 4) + " years";
  return text + "; gamma_M = " + sig(r.gamma_M, 4) + ", gamma_F = " + sig(r.gamma_F, 4);
}

std::string loading_text(const Assessment& a) {
  std::string text = to_string(a.plan.loading.kind);
  if (!a.counting.empty()) text += " (" + a.counting + ")";
  if (a.plan.loading.repeats_per_year > 0) text += "; " + sig(a.plan.loading.repeats_per_year, 4) + " repeats per year";
  return text;
}

std::string summary_facts(const Context& c) {
  const Assessment& a = c.a;
  std::ostringstream os;
  os << "<table class=\"facts\">\n";
  os << fact("plan", "<span class=\"mono\">" + esc(a.plan.path) + "</span>");
  os << fact("model", "<span class=\"mono\">" + esc(a.plan.model.file) + "</span>, " +
                          std::to_string(a.model_points) + " points, " + std::to_string(a.model_cells) +
                          " volume cells");
  os << fact("units", "model in " + to_string(a.plan.model.length_unit) + " and " +
                          to_string(a.plan.model.stress_unit) + "; this report: lengths in " + esc(c.unit) +
                          ", stresses in MPa");
  std::string steps;
  for (const auto& s : a.steps) steps += (steps.empty() ? "" : ", ") + esc("'" + s + "'");
  os << fact("load steps", std::to_string(a.steps.size()) + ": " + steps);
  os << fact("loading", esc(loading_text(a)));
  os << fact("requirement", esc(requirement_text(a)));
  os << "</table>\n";
  return os.str();
}

std::string methods_table(const Context& c) {
  std::ostringstream os;
  os << "<table><tr><th class=\"text\">toe</th><th class=\"text\">read-out scheme</th><th>t [mm]</th>"
     << "<th class=\"text\">hot-spot stress</th><th class=\"text\">S-N curve and source</th><th>f(t)</th></tr>\n";
  for (std::size_t t = 0; t < c.a.toes.size(); ++t) {
    const ToeResult& toe = c.a.toes[t];
    os << "<tr><td class=\"text\"><a href=\"#" << toe_anchor(t) << "\">" << esc(toe.plan.name) << "</a></td>"
       << "<td class=\"text\">" << esc(toe.scheme.label) << "<br><span class=\"note\">" << esc(toe.scheme.source)
       << "</span></td><td>" << sig(toe.plan.thickness, 4) << "</td><td class=\"text\">" << esc(toe.definition)
       << "</td><td class=\"text\">" << esc(toe.curve) << "<br><span class=\"note\">" << esc(toe.curve_source)
       << "</span></td><td>" << fixed(toe.thickness_factor, 3) << "</td></tr>\n";
  }
  os << "</table>\n";
  return os.str();
}

std::string counts(const Assessment& a) {
  const int total = a.stations(), exceed = a.stations_exceeding(), none = a.stations_without_result();
  std::ostringstream os;
  os << "<p id=\"counts\">" << total << " stations: <span class=\"badge ok\">" << total - exceed - none
     << " pass</span> <span class=\"badge exceeds\">" << exceed << " exceed</span> <span class=\"badge none\">"
     << none << " without result</span></p>\n";
  return os.str();
}

// The worst stations across all toes, by utilization.
std::string worst_table(const Context& c, std::size_t how_many) {
  std::vector<std::pair<std::size_t, std::size_t>> all;  // toe, station index
  for (std::size_t t = 0; t < c.a.toes.size(); ++t)
    for (std::size_t s = 0; s < c.a.toes[t].stations.size(); ++s)
      if (c.a.toes[t].stations[s].ok()) all.emplace_back(t, s);
  const auto util = [&](const std::pair<std::size_t, std::size_t>& i) {
    return c.a.toes[i.first].stations[i.second].utilization;
  };
  std::stable_sort(all.begin(), all.end(), [&](const auto& l, const auto& r) { return util(l) > util(r); });
  if (all.size() > how_many) all.resize(how_many);
  std::ostringstream os;
  os << "<table id=\"worst\"><tr><th class=\"text\">toe</th><th>station</th><th>arc length [" << esc(c.unit)
     << "]</th><th>hot-spot stress range [MPa]</th><th>allowable range [MPa]</th><th>utilization [-]</th>"
     << "<th class=\"text\">status</th></tr>\n";
  for (const auto& [t, s] : all) {
    const StationResult& r = c.a.toes[t].stations[s];
    os << "<tr class=\"" << (r.exceeds() ? "exceeds" : "ok") << "\"><td class=\"text\">" << esc(c.a.toes[t].plan.name)
       << "</td><td><a href=\"#" << station_anchor(t, r.station.id) << "\">" << r.station.id << "</a></td><td>"
       << sig(c.length(r.station.arc), 6) << "</td><td>" << fixed(r.range, 1) << "</td><td>" << fixed(r.allowable, 1)
       << "</td><td>" << fixed(r.utilization, 3) << "</td><td class=\"text\">" << status_word(r) << "</td></tr>\n";
  }
  os << "</table>\n";
  return os.str();
}

std::string diagnostics(const Assessment& a) {
  std::ostringstream os;
  os << "<h2 id=\"diagnostics\">Diagnostics</h2>\n";
  if (a.warnings.empty()) {
    os << "<p>No warnings.</p>\n";
    return os.str();
  }
  os << "<p>" << a.warnings.size() << " warnings, as collected during the run:</p>\n<ul>\n";
  for (const auto& w : a.warnings) os << "<li>" << esc(w) << "</li>\n";
  os << "</ul>\n";
  return os.str();
}

std::string provenance_section(const Provenance& p) {
  std::ostringstream os;
  os << "<h2 id=\"provenance\">Provenance</h2>\n<table class=\"facts\">\n";
  os << fact("tool", "toehold " + esc(p.tool_version)) << fact("written (UTC)", esc(p.written_utc))
     << fact("platform", esc(p.platform)) << "</table>\n";
  os << "<h3>Input files</h3>\n<table id=\"inputs\"><tr><th class=\"text\">role</th><th class=\"text\">path</th>"
     << "<th>size [bytes]</th><th class=\"text\">SHA-256</th></tr>\n";
  for (const auto& f : p.files) {
    os << "<tr><td class=\"text\">" << esc(f.role) << "</td><td class=\"text mono\">" << esc(f.path) << "</td><td>"
       << (f.read() ? std::to_string(f.size_bytes) : "-") << "</td><td class=\"text mono\">"
       << (f.read() ? esc(f.sha256) : esc("not available: " + f.problem)) << "</td></tr>\n";
  }
  os << "</table>\n<h3>Defaults applied</h3>\n";
  if (p.defaults_applied.empty()) os << "<p>None: the plan gave every value.</p>\n";
  else {
    os << "<ul id=\"defaults\">\n";
    for (const auto& d : p.defaults_applied) os << "<li>" << esc(d) << "</li>\n";
    os << "</ul>\n";
  }
  os << "<h3>The plan, verbatim</h3>\n<pre id=\"plan-text\">" << esc(p.plan_text) << "</pre>\n";
  return os.str();
}

std::string contents(const Context& c) {
  std::ostringstream os;
  os << "<p class=\"note\">Contents: <a href=\"#summary\">summary</a>";
  for (std::size_t t = 0; t < c.a.toes.size(); ++t)
    os << " &middot; <a href=\"#" << toe_anchor(t) << "\">" << esc(c.a.toes[t].plan.name) << "</a>";
  os << " &middot; <a href=\"#diagnostics\">diagnostics</a> &middot; <a href=\"#provenance\">provenance</a></p>\n";
  return os.str();
}

std::string head(const Context& c) {
  const std::string title = c.a.plan.title.empty() ? c.a.plan.path : c.a.plan.title;
  std::ostringstream os;
  os << "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n"
     << "<meta name=\"generator\" content=\"toehold " << esc(c.p.tool_version) << "\">\n<title>"
     << esc("Fatigue assessment: " + title) << "</title>\n<style>" << kStyle << "</style>\n</head>\n<body>\n"
     << "<h1>Weld-toe fatigue assessment</h1>\n<p><b>" << esc(title) << "</b><br><span class=\"note\">toehold "
     << esc(c.p.tool_version) << ", written " << esc(c.p.written_utc) << "</span></p>\n"
     << "<p class=\"caution\" id=\"caution\">" << esc(kCaution) << "</p>\n";
  return os.str();
}

}  // namespace
}  // namespace report

std::vector<std::size_t> critical_stations(const ToeResult& toe, int how_many) {
  std::vector<std::size_t> order;
  for (std::size_t i = 0; i < toe.stations.size(); ++i)
    if (toe.stations[i].ok()) order.push_back(i);
  std::stable_sort(order.begin(), order.end(), [&](std::size_t l, std::size_t r) {
    return toe.stations[l].utilization > toe.stations[r].utilization;
  });
  if (how_many >= 0 && order.size() > static_cast<std::size_t>(how_many)) order.resize(static_cast<std::size_t>(how_many));
  for (int id : toe.plan.report_stations)  // stations the plan names, after the worst ones, each once
    for (std::size_t i = 0; i < toe.stations.size(); ++i)
      if (toe.stations[i].station.id == id && toe.stations[i].ok() &&
          std::find(order.begin(), order.end(), i) == order.end())
        order.push_back(i);
  return order;
}

std::string format_report_html(const Assessment& a, const Provenance& p, LengthUnit out_unit) {
  const report::Context c{a, p, mm_per(out_unit), to_string(out_unit)};
  std::ostringstream os;
  os << report::head(c) << report::contents(c) << "<h2 id=\"summary\">Summary</h2>\n"
     << report::summary_facts(c) << report::counts(a) << "<h3>Methods</h3>\n"
     << report::methods_table(c) << "<h3>Worst stations across all toes</h3>\n" << report::worst_table(c, 10);
  for (std::size_t t = 0; t < a.toes.size(); ++t) {
    os << report::toe_section(c, t);
    for (std::size_t s : critical_stations(a.toes[t], kCriticalStationsPerToe))
      os << report::critical_station_section(c, t, s);
  }
  os << report::diagnostics(a) << report::provenance_section(p)
     << "<p class=\"caution\">" << report::esc(kCaution) << "</p>\n</body>\n</html>\n";
  return os.str();
}

}  // namespace toehold
