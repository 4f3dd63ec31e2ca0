// The critical-station sections of report.html: the stress along the read-out path with the read-out points, the
// extrapolation line and the hot-spot value; the station on the S-N diagram; its read-out points and diagnostics.
#include "report_parts.hpp"
#include "toehold/common/error.hpp"
#include "toehold/fatigue/sn_catalogue.hpp"
#include "toehold/output/svg_plot.hpp"

#include <algorithm>
#include <cmath>
#include <optional>
#include <sstream>

namespace toehold::report {
namespace {

// The Lagrange polynomial through (d_i, s_i) at distance x (same units as d).
double lagrange_at(const std::vector<double>& d, const std::vector<double>& s, double x) {
  double sum = 0.0;
  for (std::size_t i = 0; i < d.size(); ++i) {
    double w = 1.0;
    for (std::size_t j = 0; j < d.size(); ++j)
      if (j != i) w *= (x - d[j]) / (d[i] - d[j]);
    sum += w * s[i];
  }
  return sum;
}

// Read-out series for step k: the points, and the extrapolation line from the toe to the farthest point.
void readout_series(const Context& c, const StationResult& s, std::size_t k, std::size_t colour, Plot& p) {
  std::vector<double> d_mm, stress;
  for (const auto& pt : s.points)
    if (k < pt.normal_stress.size()) {
      d_mm.push_back(pt.distance);
      stress.push_back(pt.normal_stress[k]);
    }
  const std::string step = c.a.steps[k];
  PlotSeries points{"read-out '" + step + "'", {}, stress, series_colour(colour), false};
  for (double d : d_mm) points.x.push_back(c.length(d));
  points.marker = MarkerShape::circle;
  if (d_mm.size() >= 2) {
    PlotSeries line{"", {}, {}, series_colour(colour)};
    line.dashed = true;
    const double far = d_mm.back();
    for (int i = 0; i <= 40; ++i) {
      const double x = far * i / 40.0;
      line.x.push_back(c.length(x));
      line.y.push_back(lagrange_at(d_mm, stress, x));
    }
    p.series.push_back(line);
  }
  p.series.push_back(points);
  if (k < s.hot_spot.size()) {
    PlotSeries hot{"hot spot '" + step + "'", {0.0}, {s.hot_spot[k]}, series_colour(colour), false};
    hot.marker = MarkerShape::diamond;
    hot.marker_size = 5.0;
    p.series.push_back(hot);
    p.notes.push_back({0.0, s.hot_spot[k], fixed(s.hot_spot[k], 1) + " MPa", series_colour(colour)});
  }
}

std::string readout_plot(const Context& c, std::size_t t, const StationResult& s) {
  Plot p;
  p.id = station_anchor(t, s.station.id) + "-readout";
  p.title = "Read-out path of station " + std::to_string(s.station.id);
  p.description = "normal stress in the read-out direction at the read-out points against distance from the toe, "
                  "the extrapolation to the toe (dashed) and the hot-spot stress at the toe";
  p.x.label = "distance from the toe along the surface [" + c.unit + "]";
  p.y.label = "normal stress in read-out direction [MPa]";
  p.x.min = 0.0;
  const auto steps = plotted_steps(c.a, s);
  for (std::size_t i = 0; i < steps.size(); ++i) readout_series(c, s, steps[i], i, p);
  p.guides.push_back({false, 0.0, "", "#666666"});
  return render_svg(p);
}

Amplitude amplitude_of(const Context& c) {
  return c.damage_kind() ? Amplitude::variable : Amplitude::constant;
}

std::optional<SnCurve> plotted_curve(const Context& c, const ToeResult& toe, std::string& why_not) {
  try {
    SnCurve curve = find_curve(c.a.plan, toe.plan.curve);
    if (toe.thickness_factor != 1.0) curve = curve.scaled(toe.thickness_factor, "f(t)");
    return curve;
  } catch (const Error& e) {
    why_not = e.what();
    return std::nullopt;
  }
}

void curve_series(const Context& c, const SnCurve& curve, double n_lo, double n_hi, Plot& p) {
  const double gamma_M = c.a.plan.requirement.gamma_M;
  PlotSeries characteristic{"S-N curve (with f(t))", {}, {}, "#1d1d1d"};
  PlotSeries design{"design curve (/ gamma_M)", {}, {}, "#2e8b57"};
  design.dashed = true;
  const double a = std::log10(n_lo), b = std::log10(n_hi);
  for (int i = 0; i <= 120; ++i) {
    const double n = std::pow(10.0, a + (b - a) * i / 120.0);
    const double ds = curve.allowable_range(n, amplitude_of(c));
    characteristic.x.push_back(n);
    characteristic.y.push_back(ds);
    design.x.push_back(n);
    design.y.push_back(ds / gamma_M);
  }
  p.series.push_back(characteristic);
  if (gamma_M != 1.0) p.series.push_back(design);
  std::vector<SnKnee> knees = curve.knees();
  if (amplitude_of(c) == Amplitude::constant) {
    knees.clear();
    if (const auto ca = curve.constant_amplitude_knee()) knees.push_back(*ca);
    for (const auto& k : curve.knees())
      if (!curve.constant_amplitude_knee() || k.cycles < curve.constant_amplitude_knee()->cycles) knees.push_back(k);
  }
  PlotSeries knee_marks{"knee", {}, {}, "#1d1d1d", false};
  knee_marks.marker = MarkerShape::square;
  for (const auto& k : knees) {
    knee_marks.x.push_back(k.cycles);
    knee_marks.y.push_back(k.range);
    p.notes.push_back({k.cycles, k.range, "knee " + sig(k.cycles, 3), "#444444"});
  }
  if (!knee_marks.x.empty()) p.series.push_back(knee_marks);
}

void station_marks(const Context& c, const StationResult& s, Plot& p) {
  const RequirementPlan& r = c.a.plan.requirement;
  PlotSeries station{"", {}, {}, "#c0392b", false};
  station.marker = MarkerShape::circle;
  station.marker_size = 5.0;
  PlotSeries allowable{"allowable range", {}, {}, "#2e8b57", false};
  allowable.marker = MarkerShape::diamond;
  allowable.marker_size = 5.0;
  const double n = c.damage_kind() ? kReferenceCycles : r.cycles;
  const double ds = c.damage_kind() ? s.equivalent_range : r.gamma_F * s.range;
  station.name = c.damage_kind() ? "equivalent range" : "gamma_F x range";
  station.x = {n};
  station.y = {ds};
  allowable.x = {n};
  allowable.y = {s.allowable};
  p.series.push_back(allowable);
  p.series.push_back(station);
  const bool allowable_lower = s.allowable <= ds;
  p.notes.push_back({n, ds, fixed(ds, 1) + " MPa", "#c0392b", !allowable_lower});
  p.notes.push_back({n, s.allowable, "allowable " + fixed(s.allowable, 1) + " MPa", "#2e8b57", allowable_lower});
  p.guides.push_back({true, n, c.damage_kind() ? "2e6 cycles" : "required " + sig(n, 3), "#8a8a8a"});
  if (!c.damage_kind() && std::isfinite(s.life) && s.life > 0) {
    PlotSeries life{"life (gamma_F gamma_M range)", {s.life}, {r.gamma_F * r.gamma_M * s.range}, "#7d3c98", false};
    life.marker = MarkerShape::cross;
    life.marker_size = 5.0;
    p.series.push_back(life);
  }
}

std::string sn_plot(const Context& c, std::size_t t, const StationResult& s) {
  const ToeResult& toe = c.a.toes[t];
  std::string why_not;
  const auto curve = plotted_curve(c, toe, why_not);
  if (!curve) return "<p class=\"note\">No S-N diagram: " + esc(why_not) + "</p>\n";
  Plot p;
  p.id = station_anchor(t, s.station.id) + "-sn";
  p.title = "S-N diagram, " + toe.curve;
  p.description = "the toe's S-N curve on log-log axes with its knee, the allowable range and the station's range";
  p.x.label = "cycles to failure N [-]";
  p.y.label = "stress range [MPa]";
  p.x.scale = p.y.scale = AxisScale::log10;
  double n_lo = 1e4, n_hi = 1e9;
  const double n_req = c.damage_kind() ? kReferenceCycles : c.a.plan.requirement.cycles;
  if (n_req > 0) n_lo = std::min(n_lo, n_req / 10.0), n_hi = std::max(n_hi, n_req * 10.0);
  if (!c.damage_kind() && std::isfinite(s.life) && s.life > 0) n_lo = std::min(n_lo, s.life / 2), n_hi = std::max(n_hi, s.life * 2);
  p.x.min = std::pow(10.0, std::floor(std::log10(n_lo)));
  p.x.max = std::pow(10.0, std::ceil(std::log10(n_hi)));
  curve_series(c, *curve, p.x.min, p.x.max, p);
  station_marks(c, s, p);
  return render_svg(p);
}

std::string point_table(const Context& c, const StationResult& s) {
  const auto steps = plotted_steps(c.a, s);
  std::ostringstream os;
  os << "<table class=\"points\"><tr><th>distance [" << esc(c.unit) << "]</th><th>x [" << esc(c.unit)
     << "]</th><th>y [" << esc(c.unit) << "]</th><th>z [" << esc(c.unit) << "]</th><th>host cell</th>"
     << "<th>outside model [" << esc(c.unit) << "]</th>";
  for (std::size_t k : steps) os << "<th>normal stress '" << esc(c.a.steps[k]) << "' [MPa]</th>";
  os << "</tr>\n";
  for (const auto& pt : s.points) {
    os << "<tr><td>" << sig(c.length(pt.distance), 6) << "</td><td>" << sig(c.length(pt.x.x()), 6) << "</td><td>"
       << sig(c.length(pt.x.y()), 6) << "</td><td>" << sig(c.length(pt.x.z()), 6) << "</td><td>" << pt.cell
       << "</td><td>" << sig(c.length(pt.off_model), 3) << "</td>";
    for (std::size_t k : steps)
      os << "<td>" << (k < pt.normal_stress.size() ? fixed(pt.normal_stress[k], 2) : "-") << "</td>";
    os << "</tr>\n";
  }
  os << "</table>\n";
  return os.str();
}

std::string range_text(const Context& c, const StationResult& s) {
  const auto n = static_cast<int>(c.a.steps.size());
  std::string text = fixed(s.range, 1) + " MPa";
  if (s.range_from >= 0 && s.range_to >= 0 && s.range_from < n && s.range_to < n)
    text += " between '" + c.a.steps[static_cast<std::size_t>(s.range_from)] + "' and '" +
            c.a.steps[static_cast<std::size_t>(s.range_to)] + "'";
  return text;
}

std::string station_facts(const Context& c, const ToeResult& toe, const StationResult& s) {
  std::ostringstream os;
  os << "<p>At (" << sig(c.length(s.station.x.x()), 6) << ", " << sig(c.length(s.station.x.y()), 6) << ", "
     << sig(c.length(s.station.x.z()), 6) << ") " << esc(c.unit) << ", " << sig(c.length(s.station.arc), 6) << " "
     << esc(c.unit) << " along the toe. Hot-spot stress range " << esc(range_text(c, s)) << "; allowable "
     << fixed(s.allowable, 1) << " MPa; utilization <b>" << fixed(s.utilization, 3) << "</b>";
  if (c.damage_kind())
    os << "; Miner sum per repeat " << sig(s.damage, 4) << " (limit " << sig(toe.damage_limit, 3) << "), life "
       << sig(s.life_repeats, 4) << " repeats" << (std::isnan(s.life_years) ? "" : ", " + sig(s.life_years, 4) + " years")
       << ", equivalent range " << fixed(s.equivalent_range, 1) << " MPa at 2e6 cycles";
  else
    os << "; life " << sig(s.life, 4) << " cycles";
  os << ". <span class=\"badge " << (s.exceeds() ? "exceeds" : "ok") << "\">" << status_word(s) << "</span></p>\n";
  return os.str();
}

std::string station_diagnostics(const Context& c, const ToeResult& toe, const StationResult& s) {
  std::vector<std::string> lines = s.notes;
  for (const auto& pt : s.points)
    if (pt.off_model > 0)
      lines.push_back("read-out point at " + sig(c.length(pt.distance), 4) + " " + c.unit + " lies " +
                      sig(c.length(pt.off_model), 3) + " " + c.unit + " outside its host cell");
  if (s.points.size() < toe.scheme.distances.size())
    lines.push_back(std::to_string(toe.scheme.distances.size() - s.points.size()) + " read-out points could not be placed");
  if (toe.definition != "perpendicular")
    lines.push_back("the plot shows the normal stress in the read-out direction; the hot-spot value marked at the "
                    "toe is by the '" + toe.definition + "' definition");
  for (const auto& g : s.governing)
    lines.push_back("governing cycle: range " + fixed(g.cycle.range, 1) + " MPa, mean " + fixed(g.cycle.mean, 1) +
                    " MPa, count " + sig(g.cycle.count, 4) + ", " + fixed(100.0 * g.share, 1) + " % of the damage");
  std::ostringstream os;
  os << "<p><b>Diagnostics:</b> " << (lines.empty() ? "none." : "") << "</p>\n";
  if (lines.empty()) return os.str();
  os << "<ul>\n";
  for (const auto& l : lines) os << "<li>" << esc(l) << "</li>\n";
  os << "</ul>\n";
  return os.str();
}

}  // namespace

std::string critical_station_section(const Context& c, std::size_t t, std::size_t index) {
  const ToeResult& toe = c.a.toes[t];
  const StationResult& s = toe.stations[index];
  std::ostringstream os;
  os << "<section class=\"critical\">\n<h3 id=\"detail-" << station_anchor(t, s.station.id) << "\">'"
     << esc(toe.plan.name) << "', station " << s.station.id << "</h3>\n" << station_facts(c, toe, s)
     << shell_station_facts(c, s) << linearization_table(c, s);
  os << "<div class=\"plots\">\n" << readout_plot(c, t, s) << sn_plot(c, t, s) << "</div>\n";
  os << "<p class=\"note\">Read-out points (" << esc(toe.scheme.label) << ", " << esc(toe.scheme.source) << "):</p>\n"
     << point_table(c, s) << station_diagnostics(c, toe, s) << "</section>\n";
  return os.str();
}

}  // namespace toehold::report
