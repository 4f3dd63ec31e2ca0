// Rendering a Plot to SVG: ranges from the data, ticks, grid, series, guides, notes and a legend.
#include "toehold/output/svg_plot.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <sstream>

namespace toehold {
namespace {

constexpr double kLeft = 70, kRight = 18, kTop = 30, kBottom = 50;  // px margins around the plot area

std::string num(double v) {
  char buffer[32];
  std::snprintf(buffer, sizeof buffer, "%.2f", v);
  return buffer;
}

// A tick label: up to 4 significant digits, no trailing zeros, no "-0".
std::string tick_text(double v, double step) {
  if (std::abs(v) < 1e-9 * std::max(1.0, std::abs(step))) v = 0.0;
  char buffer[32];
  std::snprintf(buffer, sizeof buffer, "%.4g", v);
  return buffer;
}

bool usable(double v, AxisScale scale) { return std::isfinite(v) && (scale == AxisScale::linear || v > 0); }

struct Range {
  double lo = std::numeric_limits<double>::infinity(), hi = -std::numeric_limits<double>::infinity();
  void add(double v) {
    lo = std::min(lo, v);
    hi = std::max(hi, v);
  }
  bool empty() const { return !(lo <= hi); }
};

Range data_range(const Plot& p, bool x_axis) {
  const AxisScale scale = x_axis ? p.x.scale : p.y.scale;
  Range r;
  for (const auto& s : p.series) {
    const auto& v = x_axis ? s.x : s.y;
    const auto& other = x_axis ? s.y : s.x;
    const AxisScale other_scale = x_axis ? p.y.scale : p.x.scale;
    for (std::size_t i = 0; i < v.size() && i < other.size(); ++i)
      if (usable(v[i], scale) && usable(other[i], other_scale)) r.add(v[i]);
  }
  for (const auto& g : p.guides)
    if (g.vertical == x_axis && usable(g.at, scale)) r.add(g.at);
  for (const auto& n : p.notes)
    if (usable(x_axis ? n.x : n.y, scale)) r.add(x_axis ? n.x : n.y);
  return r;
}

// An axis mapped to pixels: ticks and the transform.
struct Scale {
  AxisScale kind = AxisScale::linear;
  double lo = 0, hi = 1;        // data range (log10 of it for log axes)
  double p0 = 0, p1 = 1;        // pixel positions of lo and hi
  std::vector<double> ticks;    // data values
  double step = 1;              // linear tick step

  double t(double v) const { return kind == AxisScale::log10 ? std::log10(v) : v; }
  double px(double v) const { return p0 + (t(v) - lo) / (hi - lo) * (p1 - p0); }
};

Scale make_scale(const PlotAxis& axis, Range r, double p0, double p1) {
  Scale s;
  s.kind = axis.scale;
  s.p0 = p0;
  s.p1 = p1;
  if (usable(axis.min, axis.scale)) r.lo = axis.min;
  if (usable(axis.max, axis.scale)) r.hi = axis.max;
  if (r.empty()) r = axis.scale == AxisScale::log10 ? Range{1.0, 10.0} : Range{0.0, 1.0};
  if (axis.scale == AxisScale::log10) {
    if (r.hi <= r.lo) r = {r.lo / 10.0, r.hi * 10.0};
    s.ticks = decade_ticks(r.lo, r.hi);
    s.lo = std::log10(usable(axis.min, axis.scale) ? axis.min : s.ticks.front());
    s.hi = std::log10(usable(axis.max, axis.scale) ? axis.max : s.ticks.back());
    return s;
  }
  if (r.hi <= r.lo) r = {r.lo - std::max(1.0, std::abs(r.lo) * 0.1), r.hi + std::max(1.0, std::abs(r.hi) * 0.1)};
  s.ticks = linear_ticks(r.lo, r.hi);
  s.step = s.ticks.size() > 1 ? s.ticks[1] - s.ticks[0] : 1.0;
  s.lo = usable(axis.min, axis.scale) ? axis.min : s.ticks.front();
  s.hi = usable(axis.max, axis.scale) ? axis.max : s.ticks.back();
  return s;
}

std::string tick_label(const Scale& s, double v) {
  if (s.kind == AxisScale::linear) return tick_text(v, s.step);
  const int e = static_cast<int>(std::lround(std::log10(v)));
  return "10<tspan dy=\"-7\" font-size=\"10\">" + std::to_string(e) + "</tspan>";
}

void axes(std::ostringstream& os, const Plot& p, const Scale& x, const Scale& y) {
  const double w = p.width, h = p.height;
  os << "<rect x=\"" << kLeft << "\" y=\"" << kTop << "\" width=\"" << w - kLeft - kRight << "\" height=\""
     << h - kTop - kBottom << "\" fill=\"#ffffff\" stroke=\"#444444\"/>\n";
  for (double v : x.ticks) {
    if (x.t(v) < x.lo - 1e-9 || x.t(v) > x.hi + 1e-9) continue;
    const std::string px = num(x.px(v));
    os << "<line x1=\"" << px << "\" y1=\"" << kTop << "\" x2=\"" << px << "\" y2=\"" << h - kBottom
       << "\" stroke=\"#e3e3e3\"/>\n<text x=\"" << px << "\" y=\"" << h - kBottom + 16
       << "\" text-anchor=\"middle\">" << tick_label(x, v) << "</text>\n";
  }
  for (double v : y.ticks) {
    if (y.t(v) < y.lo - 1e-9 || y.t(v) > y.hi + 1e-9) continue;
    const std::string py = num(y.px(v));
    os << "<line x1=\"" << kLeft << "\" y1=\"" << py << "\" x2=\"" << w - kRight << "\" y2=\"" << py
       << "\" stroke=\"#e3e3e3\"/>\n<text x=\"" << kLeft - 6 << "\" y=\"" << py
       << "\" text-anchor=\"end\" dominant-baseline=\"middle\">" << tick_label(y, v) << "</text>\n";
  }
  os << "<text x=\"" << num((kLeft + w - kRight) / 2) << "\" y=\"" << h - 10 << "\" text-anchor=\"middle\">"
     << xml_escaped(p.x.label) << "</text>\n";
  os << "<text transform=\"translate(16," << num((kTop + h - kBottom) / 2)
     << ") rotate(-90)\" text-anchor=\"middle\">" << xml_escaped(p.y.label) << "</text>\n";
  os << "<text x=\"" << kLeft << "\" y=\"18\" font-weight=\"bold\">" << xml_escaped(p.title) << "</text>\n";
}

void marker(std::ostringstream& os, const PlotSeries& s, double px, double py) {
  const double r = s.marker_size;
  const std::string c = xml_escaped(s.colour);
  switch (s.marker) {
    case MarkerShape::none: return;
    case MarkerShape::circle:
      os << "<circle cx=\"" << num(px) << "\" cy=\"" << num(py) << "\" r=\"" << num(r) << "\" fill=\"" << c
         << "\"/>\n";
      return;
    case MarkerShape::square:
      os << "<rect x=\"" << num(px - r) << "\" y=\"" << num(py - r) << "\" width=\"" << num(2 * r) << "\" height=\""
         << num(2 * r) << "\" fill=\"" << c << "\"/>\n";
      return;
    case MarkerShape::diamond:
      os << "<polygon points=\"" << num(px) << "," << num(py - r * 1.4) << " " << num(px + r * 1.4) << "," << num(py)
         << " " << num(px) << "," << num(py + r * 1.4) << " " << num(px - r * 1.4) << "," << num(py) << "\" fill=\""
         << c << "\" stroke=\"#000000\" stroke-width=\"0.6\"/>\n";
      return;
    case MarkerShape::cross:
      os << "<path d=\"M" << num(px - r) << "," << num(py - r) << "L" << num(px + r) << "," << num(py + r) << "M"
         << num(px - r) << "," << num(py + r) << "L" << num(px + r) << "," << num(py - r) << "\" stroke=\"" << c
         << "\" stroke-width=\"2\"/>\n";
      return;
  }
}

// The lines of every series (drawn clipped to the plot area) or, with `markers`, their markers (drawn unclipped so
// a marker on the frame shows whole).
void series(std::ostringstream& os, const Plot& p, const Scale& x, const Scale& y, bool markers) {
  for (const auto& s : p.series) {
    std::ostringstream path;
    std::vector<std::pair<double, double>> at;
    for (std::size_t i = 0; i < s.x.size() && i < s.y.size(); ++i) {
      if (!usable(s.x[i], p.x.scale) || !usable(s.y[i], p.y.scale)) continue;
      at.emplace_back(x.px(s.x[i]), y.px(s.y[i]));
      path << (at.size() == 1 ? "" : " ") << num(at.back().first) << "," << num(at.back().second);
    }
    if (markers) {
      for (const auto& [px, py] : at) marker(os, s, px, py);
    } else if (s.line && at.size() >= 2) {
      os << "<polyline points=\"" << path.str() << "\" fill=\"none\" stroke=\"" << xml_escaped(s.colour)
         << "\" stroke-width=\"" << num(s.line_width) << "\"" << (s.dashed ? " stroke-dasharray=\"6,4\"" : "")
         << "/>\n";
    }
  }
}

void guides(std::ostringstream& os, const Plot& p, const Scale& x, const Scale& y) {
  for (const auto& g : p.guides) {
    if (!usable(g.at, g.vertical ? p.x.scale : p.y.scale)) continue;
    const double v = g.vertical ? x.px(g.at) : y.px(g.at);
    const double x1 = g.vertical ? v : kLeft, x2 = g.vertical ? v : p.width - kRight;
    const double y1 = g.vertical ? kTop : v, y2 = g.vertical ? p.height - kBottom : v;
    os << "<line x1=\"" << num(x1) << "\" y1=\"" << num(y1) << "\" x2=\"" << num(x2) << "\" y2=\"" << num(y2)
       << "\" stroke=\"" << xml_escaped(g.colour) << "\" stroke-dasharray=\"3,3\"/>\n";
    if (g.label.empty()) continue;
    const double tx = g.vertical ? v + 3 : p.width - kRight - 3, ty = g.vertical ? kTop + 11 : v - 4;
    os << "<text x=\"" << num(tx) << "\" y=\"" << num(ty) << "\" fill=\"" << xml_escaped(g.colour) << "\""
       << (g.vertical ? "" : " text-anchor=\"end\"") << ">" << xml_escaped(g.label) << "</text>\n";
  }
}

void notes(std::ostringstream& os, const Plot& p, const Scale& x, const Scale& y) {
  for (const auto& n : p.notes) {
    if (!usable(n.x, p.x.scale) || !usable(n.y, p.y.scale)) continue;
    os << "<text x=\"" << num(x.px(n.x) + 8) << "\" y=\"" << num(y.px(n.y) + (n.below ? 16 : -6)) << "\" fill=\""
       << xml_escaped(n.colour) << "\">" << xml_escaped(n.text) << "</text>\n";
  }
}

struct LegendEntry {
  const PlotSeries* series;
  double x, y;  // px, left end of the sample line and its baseline
};

// The legend sits below the x-axis label, entries left to right, wrapping to new rows.
std::vector<LegendEntry> legend_layout(const Plot& p) {
  std::vector<LegendEntry> entries;
  double x = kLeft, y = p.height + 6.0;
  for (const auto& s : p.series) {
    if (s.name.empty()) continue;
    const double w = 40 + 6.6 * static_cast<double>(s.name.size());
    if (x + w > p.width - kRight && x > kLeft) {
      x = kLeft;
      y += 16;
    }
    entries.push_back({&s, x, y});
    x += w;
  }
  return entries;
}

double legend_height(const std::vector<LegendEntry>& entries, const Plot& p) {
  return entries.empty() ? 0.0 : entries.back().y - p.height + 12.0;
}

void legend(std::ostringstream& os, const std::vector<LegendEntry>& entries) {
  for (const auto& e : entries) {
    const PlotSeries& s = *e.series;
    if (s.line)
      os << "<line x1=\"" << num(e.x) << "\" y1=\"" << num(e.y) << "\" x2=\"" << num(e.x + 22) << "\" y2=\""
         << num(e.y) << "\" stroke=\"" << xml_escaped(s.colour) << "\" stroke-width=\"" << num(s.line_width) << "\""
         << (s.dashed ? " stroke-dasharray=\"6,4\"" : "") << "/>\n";
    marker(os, s, e.x + 11, e.y);
    os << "<text x=\"" << num(e.x + 28) << "\" y=\"" << num(e.y) << "\" dominant-baseline=\"middle\">"
       << xml_escaped(s.name) << "</text>\n";
  }
}

}  // namespace

std::string xml_escaped(std::string_view text) {
  std::string out;
  for (char ch : text) {
    switch (ch) {
      case '&': out += "&amp;"; break;
      case '<': out += "&lt;"; break;
      case '>': out += "&gt;"; break;
      case '"': out += "&quot;"; break;
      case '\'': out += "&#39;"; break;
      default: out += ch;
    }
  }
  return out;
}

std::vector<double> linear_ticks(double lo, double hi, int target) {
  const double raw = (hi - lo) / std::max(1, target - 1);
  const double power = std::pow(10.0, std::floor(std::log10(raw)));
  double step = power;
  for (double m : {1.0, 2.0, 5.0, 10.0})
    if (m * power >= raw) {
      step = m * power;
      break;
    }
  std::vector<double> ticks;
  const double first = std::floor(lo / step + 1e-9), last = std::ceil(hi / step - 1e-9);
  for (double k = first; k <= last + 0.5; k += 1.0) ticks.push_back(k * step);
  return ticks;
}

std::vector<double> decade_ticks(double lo, double hi) {
  std::vector<double> ticks;
  const int first = static_cast<int>(std::floor(std::log10(lo) + 1e-9));
  const int last = static_cast<int>(std::ceil(std::log10(hi) - 1e-9));
  for (int e = first; e <= std::max(last, first + 1); ++e) ticks.push_back(std::pow(10.0, e));
  return ticks;
}

std::string render_svg(const Plot& p) {
  const Scale x = make_scale(p.x, data_range(p, true), kLeft, p.width - kRight);
  const Scale y = make_scale(p.y, data_range(p, false), p.height - kBottom, kTop);
  const std::vector<LegendEntry> entries = legend_layout(p);
  const double height = p.height + legend_height(entries, p);
  std::ostringstream os;
  os << "<svg class=\"plot\" width=\"" << p.width << "\" height=\"" << height
     << "\" viewBox=\"0 0 " << p.width << " " << height << "\" font-family=\"sans-serif\" font-size=\"12\">\n";
  os << "<title>" << xml_escaped(p.title) << "</title>\n<desc>" << xml_escaped(p.description) << "</desc>\n";
  os << "<defs><clipPath id=\"" << xml_escaped(p.id) << "-area\"><rect x=\"" << kLeft << "\" y=\"" << kTop
     << "\" width=\"" << p.width - kLeft - kRight << "\" height=\"" << p.height - kTop - kBottom
     << "\"/></clipPath></defs>\n";
  axes(os, p, x, y);
  os << "<g clip-path=\"url(#" << xml_escaped(p.id) << "-area)\">\n";
  guides(os, p, x, y);
  series(os, p, x, y, false);
  os << "</g>\n";
  series(os, p, x, y, true);
  notes(os, p, x, y);
  legend(os, entries);
  os << "</svg>\n";
  return os.str();
}

}  // namespace toehold
