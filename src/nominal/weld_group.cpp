#include "toehold/nominal/weld_group.hpp"

#include "toehold/common/error.hpp"
#include "toehold/nominal/names.hpp"

#include <cmath>
#include <numbers>
#include <optional>
#include <sstream>

namespace toehold::nominal {
namespace {

constexpr double kThroatPerLeg = 0.707;  // throat of an equal-leg fillet, Budynas and Nisbett 9th ed. sec. 9-2

std::string number(double v) {
  std::ostringstream os;
  os << v;
  return os.str();
}

std::string label_of(const WeldGroupShape& s) {
  std::string label = "weld group ";
  if (!s.name.empty()) label.append("'").append(s.name).append("' ");
  return label.append("(").append(to_string(s.layout)).append(" layout)");
}

void require_positive(const std::string& label, const char* what, double v, const char* advice) {
  if (std::isfinite(v) && v > 0.0) return;
  throw Error(label + ": " + what + " must be positive and finite, got " + number(v) + " mm; " + advice);
}

void check_shape(const WeldGroupShape& s, const std::string& label) {
  require_positive(label, "leg h", s.leg_mm, "give the fillet leg size in mm");
  const char* advice = "give the weld dimensions in mm";
  if (s.layout == WeldLayout::circle) return require_positive(label, "radius r", s.radius_mm, advice);
  require_positive(label, "depth d", s.depth_mm, advice);
  if (s.layout != WeldLayout::single) require_positive(label, "width b", s.width_mm, advice);
}

// Closed forms of one layout: line length L (mm), centroid (mm), I_u and J_u (mm^3), and the points where weld
// lines start and end, measured from the lower-left corner of the bounding box (mm).
struct ClosedForm {
  double length;
  Vec2 centroid;
  std::optional<double> unit_second_moment;
  double unit_polar_moment;
  std::vector<Vec2> corners;
};

// Budynas and Nisbett 9th ed. Table 9-1 (J_u) and Table 9-2 (I_u).
ClosedForm closed_form(const WeldGroupShape& s) {
  const double b = s.width_mm, d = s.depth_mm, r = s.radius_mm, pi = std::numbers::pi;
  const std::vector<Vec2> rectangle{{0, 0}, {b, 0}, {0, d}, {b, d}};
  switch (s.layout) {
    case WeldLayout::single: return {d, {0, d / 2}, d * d * d / 12, d * d * d / 12, {{0, 0}, {0, d}}};
    case WeldLayout::parallel_pair:
      return {2 * d, {b / 2, d / 2}, d * d * d / 6, d * (3 * b * b + d * d) / 6, rectangle};
    case WeldLayout::across_pair:
      return {2 * b, {b / 2, d / 2}, b * d * d / 2, b * (3 * d * d + b * b) / 6, rectangle};
    case WeldLayout::angle:
      return {b + d, {b * b / (2 * (b + d)), d * d / (2 * (b + d))}, std::nullopt,
              (std::pow(b + d, 4) - 6 * b * b * d * d) / (12 * (b + d)), {{0, 0}, {b, 0}, {0, d}}};
    case WeldLayout::channel:
      return {2 * b + d, {b * b / (2 * b + d), d / 2}, d * d * (6 * b + d) / 12,
              (8 * b * b * b + 6 * b * d * d + d * d * d) / 12 - std::pow(b, 4) / (2 * b + d), rectangle};
    case WeldLayout::box:
      return {2 * (b + d), {b / 2, d / 2}, d * d * (3 * b + d) / 6, std::pow(b + d, 3) / 6, rectangle};
    case WeldLayout::circle: break;
  }
  return {2 * pi * r, {r, r}, pi * r * r * r, 2 * pi * r * r * r, {}};
}

// Largest combined magnitude over a circular group: dense sampling, then golden-section refinement.
Vec2 circle_critical_point(const WeldGroupProperties& g, const WeldLoad& load) {
  const auto at = [&](double t) { return Vec2(g.radius_mm * std::cos(t), g.radius_mm * std::sin(t)); };
  const auto f = [&](double t) { return throat_stress_at(g, load, at(t)).norm(); };
  constexpr int samples = 1440;
  const double step = 2 * std::numbers::pi / samples;
  double best = 0.0, best_value = f(0.0);
  for (int i = 1; i < samples; ++i) {
    const double value = f(i * step);
    if (value > best_value) best = i * step, best_value = value;
  }
  double lo = best - step, hi = best + step;
  const double ratio = (std::sqrt(5.0) - 1) / 2;
  for (int i = 0; i < 60; ++i) {
    const double a = hi - ratio * (hi - lo), c = lo + ratio * (hi - lo);
    if (f(a) > f(c)) hi = c;
    else lo = a;
  }
  return at((lo + hi) / 2);
}

Vec2 line_critical_point(const WeldGroupProperties& g, const WeldLoad& load) {
  // The components are affine in the point, so their magnitude is convex along each weld line: its largest
  // value sits at a weld end or corner.
  Vec2 best = g.ends_mm.front();
  double best_value = -1.0;
  for (const Vec2& p : g.ends_mm) {
    const double value = throat_stress_at(g, load, p).norm();
    if (value > best_value) best = p, best_value = value;
  }
  return best;
}

}  // namespace

WeldGroupProperties weld_group_properties(const WeldGroupShape& shape) {
  WeldGroupProperties p;
  p.label = label_of(shape);
  check_shape(shape, p.label);
  p.layout = shape.layout;
  p.leg_mm = shape.leg_mm;
  p.throat_mm = kThroatPerLeg * shape.leg_mm;
  const ClosedForm f = closed_form(shape);
  p.length_mm = f.length;
  p.centroid_mm = f.centroid;
  p.unit_second_moment_mm3 = f.unit_second_moment;
  p.unit_polar_moment_mm3 = f.unit_polar_moment;
  p.area_mm2 = p.throat_mm * p.length_mm;  // A = 0.707 h L, Table 9-1/9-2 (1.414 h d = 2 x 0.707 h d)
  if (p.unit_second_moment_mm3) p.second_moment_mm4 = p.throat_mm * *p.unit_second_moment_mm3;
  p.polar_moment_mm4 = p.throat_mm * p.unit_polar_moment_mm3;  // J = 0.707 h J_u, sec. 9-3
  for (const Vec2& c : f.corners) p.ends_mm.push_back(c - p.centroid_mm);
  if (shape.layout == WeldLayout::circle) p.radius_mm = shape.radius_mm;
  return p;
}

Eigen::Vector3d throat_stress_at(const WeldGroupProperties& g, const WeldLoad& load, const Vec2& point_mm) {
  if (load.bending_Nmm != 0.0 && !g.second_moment_mm4)
    throw Error(g.label +
                ": a bending moment needs the unit second moment I_u, which the textbook table does not give for "
                "this layout; use a symmetric layout such as box or channel, or the hot-spot method");
  const double t = load.torsion_Nmm / g.polar_moment_mm4;
  const double m = load.bending_Nmm == 0.0 ? 0.0 : load.bending_Nmm / *g.second_moment_mm4;
  return {load.shear_x_N / g.area_mm2 - t * point_mm.y(), load.shear_y_N / g.area_mm2 + t * point_mm.x(),
          load.normal_N / g.area_mm2 + m * point_mm.y()};
}

ThroatStress throat_stress(const WeldGroupProperties& group, const WeldLoad& load) {
  ThroatStress s;
  s.point_mm = group.layout == WeldLayout::circle ? circle_critical_point(group, load)
                                                  : line_critical_point(group, load);
  s.primary_shear_MPa = std::hypot(load.shear_x_N, load.shear_y_N) / group.area_mm2;
  s.primary_normal_MPa = load.normal_N / group.area_mm2;
  s.torsion_MPa = std::abs(load.torsion_Nmm) * s.point_mm.norm() / group.polar_moment_mm4;
  if (group.second_moment_mm4) s.bending_MPa = load.bending_Nmm * s.point_mm.y() / *group.second_moment_mm4;
  s.components_MPa = throat_stress_at(group, load, s.point_mm);
  s.combined_MPa = s.components_MPa.norm();
  return s;
}

}  // namespace toehold::nominal
