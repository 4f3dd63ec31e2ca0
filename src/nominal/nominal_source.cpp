#include "toehold/nominal/nominal_source.hpp"

#include "toehold/common/error.hpp"
#include "toehold/common/name_table.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <numbers>
#include <sstream>
#include <utility>

namespace toehold::nominal {
namespace {

std::string number(double v) {
  std::ostringstream os;
  os << v;
  return os.str();
}

constexpr std::array<std::pair<const char*, NominalSource>, 4> kSources{{
    {"given", NominalSource::given},
    {"section", NominalSource::section},
    {"surface-distance", NominalSource::surface_distance},
    {"weld-group", NominalSource::weld_group},
}};

constexpr std::array<std::pair<const char*, ThroatMeasure>, 3> kMeasures{{
    {"combined", ThroatMeasure::combined},
    {"shear", ThroatMeasure::shear},
    {"normal", ThroatMeasure::normal},
}};

// The chosen measure of throat stress components (tau_x, tau_y, sigma_z), MPa.
double measure_of(const Eigen::Vector3d& c, ThroatMeasure measure) {
  if (measure == ThroatMeasure::shear) return c.head<2>().norm();
  if (measure == ThroatMeasure::normal) return std::abs(c.z());
  return c.norm();
}

double measure_round_circle(const WeldGroupProperties& g, const WeldLoad& load, ThroatMeasure m, double angle) {
  const Vec2 p(g.radius_mm * std::cos(angle), g.radius_mm * std::sin(angle));
  return measure_of(throat_stress_at(g, load, p), m);
}

// Angle round a circular group where the measure is largest: sampled every 0.1 degree, then refined by
// golden-section search between the neighbours of the best sample (the measure is smooth round the circle).
double circle_critical_angle(const WeldGroupProperties& g, const WeldLoad& load, ThroatMeasure m) {
  constexpr int kSamples = 3600;
  const double step = 2.0 * std::numbers::pi / kSamples;
  int best = 0;
  for (int i = 1; i < kSamples; ++i)
    if (measure_round_circle(g, load, m, i * step) > measure_round_circle(g, load, m, best * step)) best = i;
  double lo = (best - 1) * step, hi = (best + 1) * step;
  const double ratio = (std::sqrt(5.0) - 1.0) / 2.0;
  for (int it = 0; it < 60; ++it) {
    const double a = hi - ratio * (hi - lo), b = lo + ratio * (hi - lo);
    if (measure_round_circle(g, load, m, a) < measure_round_circle(g, load, m, b))
      lo = a;
    else
      hi = b;
  }
  return 0.5 * (lo + hi);
}

// The point of the group where the measure of the load's throat stress is largest: a weld end or corner (the
// components are affine along each straight weld, so the magnitude of any of them peaks at an end), or a point
// round a circle.
Vec2 critical_point(const WeldGroupProperties& g, const WeldLoad& load, ThroatMeasure m) {
  if (g.layout == WeldLayout::circle) {
    const double a = circle_critical_angle(g, load, m);
    return {g.radius_mm * std::cos(a), g.radius_mm * std::sin(a)};
  }
  Vec2 best = g.ends_mm.front();
  for (const Vec2& p : g.ends_mm)
    if (measure_of(throat_stress_at(g, load, p), m) > measure_of(throat_stress_at(g, load, best), m)) best = p;
  return best;
}

// The throat stress parts of `load` at `p` (weld_group.hpp's ThroatStress, evaluated at a given point).
ThroatStress throat_stress_at_point(const WeldGroupProperties& g, const WeldLoad& load, const Vec2& p) {
  ThroatStress s;
  s.point_mm = p;
  s.primary_shear_MPa = std::hypot(load.shear_x_N, load.shear_y_N) / g.area_mm2;
  s.primary_normal_MPa = load.normal_N / g.area_mm2;
  s.torsion_MPa = std::abs(load.torsion_Nmm) * p.norm() / g.polar_moment_mm4;
  s.bending_MPa = g.second_moment_mm4 ? load.bending_Nmm * p.y() / *g.second_moment_mm4 : 0.0;
  s.components_MPa = throat_stress_at(g, load, p);
  s.combined_MPa = s.components_MPa.norm();
  return s;
}

WeldLoad difference(const WeldLoad& a, const WeldLoad& b) {
  return {b.shear_x_N - a.shear_x_N, b.shear_y_N - a.shear_y_N, b.normal_N - a.normal_N,
          b.torsion_Nmm - a.torsion_Nmm, b.bending_Nmm - a.bending_Nmm};
}

}  // namespace

std::string to_string(NominalSource source) { return name_in(kSources, source); }
NominalSource parse_nominal_source(std::string_view text, const std::string& where) {
  return parse_from(kSources, text, where, "nominal stress source");
}
std::string to_string(ThroatMeasure measure) { return name_in(kMeasures, measure); }
ThroatMeasure parse_throat_measure(std::string_view text, const std::string& where) {
  return parse_from(kMeasures, text, where, "throat stress measure");
}
StressKind stress_kind_of(ThroatMeasure measure) {
  return measure == ThroatMeasure::shear ? StressKind::shear : StressKind::normal;
}

NominalRange given_range(double range_MPa, StressKind kind, const std::string& what) {
  if (!(std::isfinite(range_MPa) && range_MPa >= 0.0))
    throw Error(what + ": the nominal stress range must be zero or positive and finite, got " + number(range_MPa) +
                " MPa; give the range (maximum minus minimum) in MPa");
  NominalRange r;
  r.range_MPa = range_MPa;
  r.kind = kind;
  r.note = what + ": " + to_string(kind) + " stress range " + number(range_MPa) + " MPa, given";
  return r;
}

NominalRange range_over_steps(const std::vector<double>& values, StressKind kind, NominalSource source,
                              const std::string& what) {
  if (values.size() < 2)
    throw Error(what + ": a nominal stress range needs values of at least two load steps, got " +
                std::to_string(values.size()) + "; give one value per load step");
  for (std::size_t i = 0; i < values.size(); ++i)
    if (!std::isfinite(values[i]))
      throw Error(what + ": the nominal stress of load step " + std::to_string(i + 1) + " is not a finite number (" +
                  number(values[i]) + "); check the input of that step");
  const auto [lo, hi] = std::minmax_element(values.begin(), values.end());
  NominalRange r;
  r.kind = kind;
  r.source = source;
  r.from = static_cast<int>(lo - values.begin());
  r.to = static_cast<int>(hi - values.begin());
  r.from_MPa = *lo;
  r.to_MPa = *hi;
  r.range_MPa = *hi - *lo;
  r.note = what + ": " + to_string(kind) + " stress range " + number(r.range_MPa) + " MPa (" + to_string(source) +
           ", from " + number(*lo) + " MPa at step " + std::to_string(r.from + 1) + " to " + number(*hi) +
           " MPa at step " + std::to_string(r.to + 1) + ")";
  return r;
}

WeldGroupRange weld_group_range(const WeldGroupShape& shape, const WeldLoad& first, const WeldLoad& second,
                                ThroatMeasure measure) {
  WeldGroupRange out;
  out.group = weld_group_properties(shape);
  out.measure = measure;
  out.load_range = difference(first, second);
  if (measure == ThroatMeasure::combined) {
    out.throat = throat_stress(out.group, out.load_range);  // also refuses bending on an angle layout
  } else {
    throat_stress(out.group, out.load_range);  // the same checks of the load against the layout
    out.throat = throat_stress_at_point(out.group, out.load_range, critical_point(out.group, out.load_range, measure));
  }
  NominalRange& r = out.range;
  r.range_MPa = measure_of(out.throat.components_MPa, measure);
  r.kind = stress_kind_of(measure);
  r.source = NominalSource::weld_group;
  r.from = 0, r.to = 1;
  r.to_MPa = r.range_MPa;
  r.note = out.group.label + ": " + to_string(measure) + " throat stress range " + number(r.range_MPa) +
           " MPa at (" + number(out.throat.point_mm.x()) + ", " + number(out.throat.point_mm.y()) +
           ") mm from the centroid, throat area " + number(out.group.area_mm2) + " mm^2";
  return out;
}

}  // namespace toehold::nominal
