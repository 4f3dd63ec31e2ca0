#include "toehold/common/error.hpp"
#include "toehold/nominal/names.hpp"
#include "toehold/nominal/weld_group.hpp"
#include "support/support.hpp"

#include <cmath>
#include <numbers>
#include <vector>

namespace toehold::nominal {
namespace {

WeldGroupProperties group(WeldLayout layout, double h, double b, double d, double r = 0.0) {
  return weld_group_properties({layout, h, b, d, r, ""});
}

std::string error_of(const WeldGroupShape& shape) {
  try {
    weld_group_properties(shape);
  } catch (const Error& e) {
    return e.what();
  }
  return "no error";
}

// Independent line-integral properties of straight weld lines (each line: length l, midpoint m, run (dx, dy)):
// L = sum l, centroid = sum l m / L, I_x = sum l [(m_y - ybar)^2 + dy^2/12], I_y likewise, J_u = I_x + I_y.
struct Line {
  Vec2 a, b;
};
struct LineProperties {
  double length = 0;
  Vec2 centroid = Vec2::Zero();
  double ix = 0, j = 0;
};

LineProperties integrate(const std::vector<Line>& lines) {
  LineProperties p;
  for (const Line& l : lines) p.length += (l.b - l.a).norm();
  for (const Line& l : lines) p.centroid += (l.b - l.a).norm() * (l.a + l.b) / 2 / p.length;
  for (const Line& l : lines) {
    const double len = (l.b - l.a).norm();
    const Vec2 m = (l.a + l.b) / 2 - p.centroid, run = l.b - l.a;
    const double ix = len * (m.y() * m.y() + run.y() * run.y() / 12);
    const double iy = len * (m.x() * m.x() + run.x() * run.x() / 12);
    p.ix += ix;
    p.j += ix + iy;
  }
  return p;
}

std::vector<Line> lines_of(WeldLayout layout, double b, double d, double r) {
  const Vec2 o(0, 0), bx(b, 0), dy(0, d), bd(b, d);
  switch (layout) {
    case WeldLayout::single: return {{o, dy}};
    case WeldLayout::parallel_pair: return {{o, dy}, {bx, bd}};
    case WeldLayout::across_pair: return {{o, bx}, {dy, bd}};
    case WeldLayout::angle: return {{o, bx}, {o, dy}};
    case WeldLayout::channel: return {{o, dy}, {o, bx}, {dy, bd}};
    case WeldLayout::box: return {{o, bx}, {bx, bd}, {bd, dy}, {dy, o}};
    case WeldLayout::circle: break;
  }
  std::vector<Line> polygon;  // 3600-sided polygon round the centre (r, r)
  const auto at = [&](int i) {
    const double t = 2 * std::numbers::pi * i / 3600;
    return Vec2(r + r * std::cos(t), r + r * std::sin(t));
  };
  for (int i = 0; i < 3600; ++i) polygon.push_back({at(i), at(i + 1)});
  return polygon;
}

}  // namespace

// Budynas and Nisbett 9th ed. Tables 9-1/9-2 [S]: two parallel welds, A = 1.414 h d, I_u = d^3/6,
// J_u = d(3b^2 + d^2)/6, J = 0.707 h J_u. Hand calculation, h = 6, d = 50, b = 80 mm:
//   A = 1.414 x 6 x 50 = 424.2 mm^2; I_u = 50^3/6 = 20833.33 mm^3;
//   J_u = 50 (3 x 6400 + 2500)/6 = 50 x 21700/6 = 180833.33 mm^3; J = 0.707 x 6 x 180833.33 = 767095.0 mm^4.
TEST(WeldGroup, ParallelPairMatchesTextbookFormulas) {
  const WeldGroupProperties g = group(WeldLayout::parallel_pair, 6, 80, 50);
  EXPECT_CLOSE(g.throat_mm, 4.242, 1e-12);
  EXPECT_CLOSE(g.area_mm2, 424.2, 1e-12);
  EXPECT_CLOSE(*g.unit_second_moment_mm3, 20833.333333, 1e-9);
  EXPECT_CLOSE(g.unit_polar_moment_mm3, 180833.333333, 1e-9);
  EXPECT_CLOSE(g.polar_moment_mm4, 767095.0, 1e-9);
  EXPECT_CLOSE(g.centroid_mm.x(), 40.0, 1e-12);
  EXPECT_CLOSE(g.centroid_mm.y(), 25.0, 1e-12);
}

// Same source [S]: one weld, A = 0.707 h d: h = 5, d = 120 -> 0.707 x 5 x 120 = 424.2 mm^2.
// Box, A = 1.414 h (b + d): h = 10, b = 60, d = 90 -> 1.414 x 10 x 150 = 2121 mm^2.
// Circle, A = 1.414 pi h r, J_u = 2 pi r^3: h = 6, r = 40 -> A = 1.414 x pi x 240 = 1066.1309 mm^2,
//   J_u = 2 pi 64000 = 402123.86 mm^3.
TEST(WeldGroup, SingleBoxAndCircleAreasMatchTextbook) {
  EXPECT_CLOSE(group(WeldLayout::single, 5, 0, 120).area_mm2, 424.2, 1e-12);
  EXPECT_CLOSE(group(WeldLayout::box, 10, 60, 90).area_mm2, 2121.0, 1e-12);
  const WeldGroupProperties c = group(WeldLayout::circle, 6, 0, 0, 40);
  EXPECT_CLOSE(c.area_mm2, 1.414 * std::numbers::pi * 240, 1e-12);
  EXPECT_CLOSE(c.area_mm2, 1066.1309, 1e-7);
  EXPECT_CLOSE(c.unit_polar_moment_mm3, 402123.86, 1e-7);
}

// Textbook Table 9-1 from memory [M]: L-shaped group, centroid (b^2/(2(b+d)), d^2/(2(b+d))),
// J_u = ((b+d)^4 - 6 b^2 d^2)/(12 (b+d)). b = 60, d = 40: xbar = 3600/200 = 18, ybar = 1600/200 = 8,
// J_u = (1e8 - 6 x 3600 x 1600)/1200 = (1e8 - 34 560 000)/1200 = 54533.33 mm^3.
TEST(WeldGroup, AngleCentroidAndPolarMoment) {
  const WeldGroupProperties g = group(WeldLayout::angle, 5, 60, 40);
  EXPECT_CLOSE(g.centroid_mm.x(), 18.0, 1e-12);
  EXPECT_CLOSE(g.centroid_mm.y(), 8.0, 1e-12);
  EXPECT_CLOSE(g.unit_polar_moment_mm3, 54533.333333, 1e-9);
  EXPECT_FALSE(g.unit_second_moment_mm3.has_value());
}

// Property check, derived [D]: every closed form equals the line integrals of its own weld lines.
TEST(WeldGroup, ClosedFormsAgreeWithLineIntegralsForEveryLayout) {
  const double h = 7, b = 70, d = 110, r = 45;
  for (WeldLayout layout : {WeldLayout::single, WeldLayout::parallel_pair, WeldLayout::across_pair,
                            WeldLayout::angle, WeldLayout::channel, WeldLayout::box, WeldLayout::circle}) {
    SCOPED_TRACE(to_string(layout));
    const WeldGroupProperties g = group(layout, h, b, d, r);
    const LineProperties ref = integrate(lines_of(layout, b, d, r));
    const double tol = layout == WeldLayout::circle ? 1e-6 : 1e-12;
    EXPECT_CLOSE(g.length_mm, ref.length, tol);
    EXPECT_CLOSE(g.area_mm2, 0.707 * h * ref.length, tol);
    EXPECT_CLOSE(g.centroid_mm.x(), ref.centroid.x(), tol);
    EXPECT_CLOSE(g.centroid_mm.y(), ref.centroid.y(), tol);
    EXPECT_CLOSE(g.unit_polar_moment_mm3, ref.j, tol);
    EXPECT_CLOSE(g.polar_moment_mm4, 0.707 * h * ref.j, tol);
    if (g.unit_second_moment_mm3) {
      EXPECT_CLOSE(*g.unit_second_moment_mm3, ref.ix, tol);
    }
  }
}

// Cantilever bracket welded all round (box, h = 6, b = 50, d = 100 mm) carrying 5 kN downwards 150 mm in front
// of the weld plane. Hand calculation (textbook sec. 9-4 method, Table 9-2 box I_u = d^2(3b + d)/6 [M]):
//   A = 1.414 x 6 x 150 = 1272.6 mm^2;  primary shear tau' = 5000/1272.6 = 3.92896 MPa
//   I_u = 100^2 (150 + 100)/6 = 416666.67 mm^3;  I = 0.707 x 6 x I_u = 1 767 500 mm^4
//   M = 5000 x 150 = 750 000 N mm;  tau'' = M c/I = 750000 x 50/1767500 = 21.21641 MPa (top, tension)
//   tau = sqrt(3.92896^2 + 21.21641^2) = 21.57713 MPa.
TEST(WeldGroup, BoxUnderShearAndBendingCombinesAsVectors) {
  const WeldGroupProperties g = group(WeldLayout::box, 6, 50, 100);
  WeldLoad load;
  load.shear_y_N = -5000;
  load.bending_Nmm = 750000;
  const ThroatStress s = throat_stress(g, load);
  EXPECT_CLOSE(s.primary_shear_MPa, 3.92896, 1e-5);
  // Top (tension) and bottom (compression) corners tie in magnitude; either may be reported.
  EXPECT_CLOSE(std::abs(s.bending_MPa), 21.21641, 1e-6);
  EXPECT_CLOSE(s.combined_MPa, 21.57713, 1e-6);
  EXPECT_CLOSE(std::abs(s.point_mm.y()), 50.0, 1e-12);
}

// Circular weld (h = 6, r = 40 mm) with 2 kN shear and 400 N m torsion. The torsion shear (T/J) r turns with
// the radius, so at one point it lines up with the primary shear and the magnitudes add [D]:
//   A = 1066.1309 mm^2, tau' = 2000/1066.1309 = 1.87594 MPa;  J = 0.707 x 6 x 402123.86 = 1 705 809.4 mm^4,
//   tau'' = 400000 x 40/1705809.4 = 9.37971 MPa;  tau = 11.25565 MPa.
TEST(WeldGroup, CircleCriticalPointAddsAlignedShears) {
  const WeldGroupProperties g = group(WeldLayout::circle, 6, 0, 0, 40);
  WeldLoad load;
  load.shear_x_N = 2000;
  load.torsion_Nmm = 400000;
  const ThroatStress s = throat_stress(g, load);
  EXPECT_CLOSE(s.combined_MPa, 11.25565, 1e-6);
  EXPECT_CLOSE(s.torsion_MPa, 9.37971, 1e-6);
  // tau_torsion = (T/J)(-y, x) points along +x at (0, -r).
  EXPECT_CLOSE(s.point_mm.x(), 0.0, 1e-4);  // the magnitude is flat at its maximum: the angle is known to ~1e-7
  EXPECT_CLOSE(s.point_mm.y(), -40.0, 1e-9);
}

TEST(WeldGroup, NormalForceAndBendingAddOnTheTensionSide) {
  // Two welds across (h = 5, b = 80, d = 60): A = 1.414 x 5 x 80 = 565.6 mm^2, I_u = b d^2/2 = 144000 mm^3
  // ([M]), I = 3.535 x 144000 = 509040 mm^4. F_z = 10 kN, M = 1 kN m:
  //   sigma = 10000/565.6 + 1e6 x 30/509040 = 17.68034 + 58.93446 = 76.61480 MPa at y = +30 mm.
  const WeldGroupProperties g = group(WeldLayout::across_pair, 5, 80, 60);
  WeldLoad load;
  load.normal_N = 10000;
  load.bending_Nmm = 1e6;
  const ThroatStress s = throat_stress(g, load);
  EXPECT_CLOSE(s.combined_MPa, 76.61480, 1e-6);
  EXPECT_CLOSE(s.primary_normal_MPa, 17.68034, 1e-6);
}

TEST(WeldGroup, BadDimensionsNameTheWeldGroup) {
  EXPECT_EQ(error_of({WeldLayout::box, 0, 50, 100, 0, "bracket weld"}),
            "weld group 'bracket weld' (box layout): leg h must be positive and finite, got 0 mm; give the fillet "
            "leg size in mm");
  EXPECT_EQ(error_of({WeldLayout::parallel_pair, 6, -20, 100, 0, ""}),
            "weld group (parallel-pair layout): width b must be positive and finite, got -20 mm; give the weld "
            "dimensions in mm");
  EXPECT_EQ(error_of({WeldLayout::circle, 6, 0, 0, 0, "hub"}),
            "weld group 'hub' (circle layout): radius r must be positive and finite, got 0 mm; give the weld "
            "dimensions in mm");
  EXPECT_EQ(error_of({WeldLayout::single, 6, 0, -1, 0, "lug"}),
            "weld group 'lug' (single layout): depth d must be positive and finite, got -1 mm; give the weld "
            "dimensions in mm");
}

TEST(WeldGroup, BendingOnAngleLayoutIsAnError) {
  const WeldGroupProperties g = weld_group_properties({WeldLayout::angle, 5, 60, 40, 0, "corner"});
  WeldLoad load;
  load.bending_Nmm = 1000;
  try {
    throat_stress(g, load);
    FAIL();
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()),
              "weld group 'corner' (angle layout): a bending moment needs the unit second moment I_u, which the "
              "textbook table does not give for this layout; use a symmetric layout such as box or channel, or "
              "the hot-spot method");
  }
}

}  // namespace toehold::nominal
