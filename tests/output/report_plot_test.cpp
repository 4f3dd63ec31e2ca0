// The SVG plots of the report: tick values, the data-to-pixel mapping, log axes, escaping. Expected values are
// worked out by hand from the documented rules [D].
#include "support/support.hpp"
#include "toehold/output/svg_plot.hpp"

#include <regex>
#include <string>
#include <vector>

namespace toehold::test {
namespace {

int count(const std::string& text, const std::string& what) {
  int n = 0;
  for (auto at = text.find(what); at != std::string::npos; at = text.find(what, at + what.size())) ++n;
  return n;
}

TEST(ReportPlot, LinearTicksStepOneTwoOrFive) {
  // [0, 9.3] in about 6 ticks: raw step 1.86 -> 2 [D]
  EXPECT_EQ(linear_ticks(0.0, 9.3), (std::vector<double>{0, 2, 4, 6, 8, 10}));
  // [-3, 47]: raw step 10 -> 10, from -10 to 50 [D]
  EXPECT_EQ(linear_ticks(-3.0, 47.0), (std::vector<double>{-10, 0, 10, 20, 30, 40, 50}));
  // [0, 1.2]: raw step 0.24 -> 0.5 [D]
  const auto small = linear_ticks(0.0, 1.2);
  ASSERT_EQ(small.size(), 4u);
  EXPECT_CLOSE(small[3], 1.5, 1e-12);
}

TEST(ReportPlot, DecadeTicksCoverTheRange) {
  EXPECT_EQ(decade_ticks(3e4, 2e8), (std::vector<double>{1e4, 1e5, 1e6, 1e7, 1e8, 1e9}));
  EXPECT_EQ(decade_ticks(1e4, 1e6), (std::vector<double>{1e4, 1e5, 1e6}));
}

TEST(ReportPlot, PointsMapLinearlyIntoThePlotArea) {
  Plot p;
  p.id = "t";
  p.x.min = 0.0;
  p.x.max = 10.0;
  p.y.min = 0.0;
  p.y.max = 100.0;
  PlotSeries s{"", {5.0}, {25.0}, "#000000", false};
  s.marker = MarkerShape::circle;
  p.series = {s};
  const std::string svg = render_svg(p);
  // Plot area x from 70 to 540 - 18 = 522 px: x = 5 -> 70 + 0.5 * 452 = 296 [D]. y from 330 - 50 = 280 (y = 0) up
  // to 30 (y = 100): y = 25 -> 280 - 0.25 * 250 = 217.5 [D].
  EXPECT_NE(svg.find("<circle cx=\"296.00\" cy=\"217.50\""), std::string::npos) << svg;
}

TEST(ReportPlot, LogAxisPutsDecadesEvenlyAndLabelsPowers) {
  Plot p;
  p.id = "sn";
  p.x.scale = p.y.scale = AxisScale::log10;
  p.x.label = "cycles to failure N [-]";
  p.y.label = "stress range [MPa]";
  PlotSeries s{"curve", {1e4, 1e6}, {100.0, 10.0}};
  s.marker = MarkerShape::square;
  p.series = {s};
  const std::string svg = render_svg(p);
  // x decades 1e4..1e6 over 452 px: 1e5 sits at 70 + 226 = 296 [D]
  EXPECT_NE(svg.find("x1=\"296.00\""), std::string::npos);
  EXPECT_NE(svg.find("10<tspan dy=\"-7\" font-size=\"10\">5</tspan>"), std::string::npos);
  EXPECT_NE(svg.find("cycles to failure N [-]"), std::string::npos);
  EXPECT_NE(svg.find("stress range [MPa]"), std::string::npos);
  // Non-positive values are left out on log axes rather than drawn at minus infinity.
  p.series[0].x.push_back(0.0);
  p.series[0].y.push_back(5.0);
  // Square markers of half-width 4 px are 8 px wide: 2 in the plot and 1 in the legend, none for x = 0.
  EXPECT_EQ(count(render_svg(p), "width=\"8.00\""), 3);
}

TEST(ReportPlot, TextIsEscapedAndEveryElementCloses) {
  Plot p;
  p.id = "e";
  p.title = "toe \"A\" & <B>";
  p.x.label = "x";
  p.y.label = "y";
  p.series = {{"it's", {0, 1}, {0, 1}}};
  p.guides = {{false, 0.5, "limit <1>"}};
  p.notes = {{1, 1, "a&b"}};
  const std::string svg = render_svg(p);
  EXPECT_NE(svg.find("toe &quot;A&quot; &amp; &lt;B&gt;"), std::string::npos);
  EXPECT_NE(svg.find("it&#39;s"), std::string::npos);
  EXPECT_NE(svg.find("limit &lt;1&gt;"), std::string::npos);
  EXPECT_NE(svg.find("a&amp;b"), std::string::npos);
  EXPECT_EQ(svg.find("<B>"), std::string::npos);
  EXPECT_EQ(count(svg, "<svg"), count(svg, "</svg>"));
  EXPECT_EQ(count(svg, "<text"), count(svg, "</text>"));
  EXPECT_EQ(count(svg, "<g "), count(svg, "</g>"));
}

TEST(ReportPlot, EmptyPlotStillHasAxes) {
  Plot p;
  p.id = "none";
  p.x.label = "distance [mm]";
  p.y.label = "stress [MPa]";
  const std::string svg = render_svg(p);
  EXPECT_NE(svg.find("distance [mm]"), std::string::npos);
  EXPECT_TRUE(std::regex_search(svg, std::regex("<text[^>]*>0</text>")));
}

}  // namespace
}  // namespace toehold::test
