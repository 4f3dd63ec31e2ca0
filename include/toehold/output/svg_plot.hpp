// Small x-y plots as inline SVG for the HTML report: linear or log10 axes with ticks, labels and units, line and
// marker series, reference lines and text notes. No plotting runtime: the SVG text is complete and static.
#pragma once

#include <limits>
#include <string>
#include <string_view>
#include <vector>

namespace toehold {

enum class AxisScale {
  linear,  // evenly spaced ticks at 1, 2 or 5 times a power of ten
  log10,   // ticks at the decades; every value must be > 0 (others are left out)
};

struct PlotAxis {
  std::string label;  // with its unit, e.g. "distance from the toe [mm]"
  AxisScale scale = AxisScale::linear;
  double min = std::numeric_limits<double>::quiet_NaN();  // NaN: from the data (rounded out to ticks)
  double max = std::numeric_limits<double>::quiet_NaN();
};

enum class MarkerShape { none, circle, square, diamond, cross };

struct PlotSeries {
  std::string name;                // legend text; "" leaves the series out of the legend
  std::vector<double> x, y;        // data coordinates, same length; non-finite points are left out
  std::string colour = "#1f4e79";  // any SVG colour
  bool line = true;                // join the points
  bool dashed = false;
  double line_width = 1.5;         // px
  MarkerShape marker = MarkerShape::none;
  double marker_size = 4.0;        // px, half the marker's width
};

// A straight reference line across the whole plot at a data value, with a short label at its end.
struct PlotGuide {
  bool vertical = false;  // true: x = at; false: y = at
  double at = 0.0;
  std::string label;
  std::string colour = "#8a8a8a";
};

// Text placed at a data point (x, y), to the right of it, above the point or (below = true) under it.
struct PlotNote {
  double x = 0.0, y = 0.0;
  std::string text;
  std::string colour = "#222222";
  bool below = false;
};

struct Plot {
  std::string id;           // unique in the page (names the clip path)
  std::string title;
  std::string description;  // for readers that cannot see the plot (SVG <desc>)
  PlotAxis x, y;
  std::vector<PlotSeries> series;  // the named ones make the legend, below the plot
  std::vector<PlotGuide> guides;
  std::vector<PlotNote> notes;
  int width = 540, height = 330;  // px, without the legend (which adds 16 px per row)
};

// The plot as one <svg> element. Axis ranges come from the data, guides and notes unless the axis gives them.
std::string render_svg(const Plot& plot);

// Tick values covering [lo, hi] at a step of 1, 2 or 5 times a power of ten, about `target` of them; the first
// tick is <= lo and the last >= hi. lo < hi, both finite.
std::vector<double> linear_ticks(double lo, double hi, int target = 6);
// The powers of ten from the largest <= lo to the smallest >= hi. 0 < lo < hi.
std::vector<double> decade_ticks(double lo, double hi);

// `text` with &, <, >, " and ' replaced by XML character references.
std::string xml_escaped(std::string_view text);

}  // namespace toehold
