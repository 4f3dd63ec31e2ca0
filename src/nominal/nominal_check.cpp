#include "toehold/nominal/nominal_check.hpp"

#include "toehold/common/error.hpp"
#include "toehold/common/name_table.hpp"

#include <array>
#include <cmath>
#include <cstdio>
#include <limits>
#include <sstream>
#include <utility>

namespace toehold::nominal {
namespace {

constexpr double kInfinity = std::numeric_limits<double>::infinity();
constexpr double kTie = 1e-9;  // relative difference of two utilizations still taken as a tie (curve round-off)

std::string number(double v) {
  std::ostringstream os;
  os << v;
  return os.str();
}

// Three significant digits, for the one-line verdict.
std::string short_number(double v) {
  char buffer[32];
  std::snprintf(buffer, sizeof buffer, "%.3g", v);
  return buffer;
}

constexpr std::array<std::pair<const char*, Interaction>, 2> kInteractions{{
    {"iiw", Interaction::iiw_quadratic},
    {"en", Interaction::en_damage_sum},
}};
constexpr std::array<std::pair<const char*, Proportionality>, 2> kProportionality{{
    {"proportional", Proportionality::proportional},
    {"non-proportional", Proportionality::non_proportional},
}};
constexpr std::array<std::pair<const char*, Method>, 2> kMethods{{
    {"nominal", Method::nominal},
    {"hot-spot", Method::hot_spot},
}};

void check_requirement(const RangeRequirement& r, const std::string& what) {
  if (std::isnan(r.cycles) || r.cycles <= 0.0)
    throw Error(what + ": the required number of cycles must be positive, got " + number(r.cycles) +
                "; give the cycles the range is applied");
  for (const auto& [name, value] : {std::pair{"gamma_M", r.gamma_M}, std::pair{"gamma_F", r.gamma_F}})
    if (!(std::isfinite(value) && value > 0.0))
      throw Error(what + ": the partial safety factor " + name + " must be positive and finite, got " +
                  number(value) + "; use 1 for none");
}

std::string kind_words(StressKind kind) { return to_string(kind) + " stress"; }

void require_kind(const RangeCheck& c, StressKind kind, const std::string& role) {
  if (c.kind == kind) return;
  throw Error(c.what + ": the " + role + " check must be a " + kind_words(kind) + " check, but its curve '" +
              c.curve + "' is for " + kind_words(c.kind));
}

double interaction_term(const RangeCheck& c, Interaction rule) {
  return rule == Interaction::iiw_quadratic ? c.utilization * c.utilization : c.damage;
}

std::string verdict_of(const MethodComparison& c) {
  const bool hot = c.governing == Method::hot_spot;
  const RangeCheck& first = hot ? c.hot_spot : c.nominal;
  const RangeCheck& second = hot ? c.nominal : c.hot_spot;
  auto side = [](const RangeCheck& r, const char* name) {
    return short_number(r.utilization) + " by " + name + " (" + short_number(r.range_MPa) + " MPa, " + r.curve + ")";
  };
  std::string line = c.label + ": " + to_string(c.governing) + " governs, utilization " +
                     side(first, hot ? "hot spot" : "nominal") + " against " +
                     side(second, hot ? "nominal" : "hot spot");
  line += c.concentration_factor ? "; stress concentration factor " + short_number(*c.concentration_factor)
                                 : "; no stress concentration factor (nominal range 0 or shear)";
  return line;
}

}  // namespace

RangeCheck check_range(const SnCurve& curve, double range_MPa, const RangeRequirement& requirement,
                       const std::string& what) {
  if (!(std::isfinite(range_MPa) && range_MPa >= 0.0))
    throw Error(what + ": the stress range must be zero or positive and finite, got " + number(range_MPa) +
                " MPa; give the range (maximum minus minimum) in MPa");
  check_requirement(requirement, what);
  RangeCheck c;
  c.what = what;
  c.curve = curve.name();
  c.curve_source = curve.source();
  c.kind = curve.kind();
  c.requirement = requirement;
  c.range_MPa = range_MPa;
  c.design_range_MPa = requirement.gamma_F * range_MPa;
  c.allowable_MPa = curve.allowable_range(requirement.cycles, requirement.amplitude) / requirement.gamma_M;
  c.utilization = c.design_range_MPa == 0.0 ? 0.0
                  : c.allowable_MPa > 0.0   ? c.design_range_MPa / c.allowable_MPa
                                            : kInfinity;
  c.life = curve.cycles_to_failure(c.design_range_MPa * requirement.gamma_M, requirement.amplitude);
  c.damage = std::isinf(c.life) ? 0.0 : requirement.cycles / c.life;
  return c;
}

RangeCheck check_nominal(const SnCurve& curve, const NominalRange& range, const RangeRequirement& requirement,
                         const std::string& what) {
  if (range.kind != curve.kind()) {
    const char* example = range.kind == StressKind::shear ? "\"IIW FAT 80 shear\"" : "\"IIW FAT 71\"";
    throw Error(what + ": the nominal range is a " + kind_words(range.kind) + " range but the curve '" +
                curve.name() + "' is for " + kind_words(curve.kind()) + "; give a " + kind_words(range.kind) +
                " detail class, e.g. " + example);
  }
  return check_range(curve, range.range_MPa, requirement, what);
}

std::string to_string(Interaction rule) { return name_in(kInteractions, rule); }
Interaction parse_interaction(std::string_view text, const std::string& where) {
  return parse_from(kInteractions, text, where, "interaction rule");
}
std::string to_string(Proportionality p) { return name_in(kProportionality, p); }
Proportionality parse_proportionality(std::string_view text, const std::string& where) {
  return parse_from(kProportionality, text, where, "load proportionality");
}
std::string to_string(Method method) { return name_in(kMethods, method); }

double iiw_comparison_value(Proportionality p) { return p == Proportionality::proportional ? 1.0 : 0.5; }

CombinedCheck check_combined(const RangeCheck& normal, const RangeCheck& shear, Interaction rule,
                             Proportionality proportionality) {
  require_kind(normal, StressKind::normal, "normal-stress");
  require_kind(shear, StressKind::shear, "shear");
  CombinedCheck c;
  c.normal = normal;
  c.shear = shear;
  c.rule = rule;
  const double a = interaction_term(normal, rule), b = interaction_term(shear, rule);
  c.value = a + b;
  c.limit = rule == Interaction::iiw_quadratic ? iiw_comparison_value(proportionality) : 1.0;
  c.utilization = c.value / c.limit;
  std::ostringstream f;
  if (rule == Interaction::iiw_quadratic)
    f << "(" << normal.utilization << ")^2 + (" << shear.utilization << ")^2 = " << c.value << " against CV = "
      << c.limit;
  else
    f << "D_normal + D_shear = " << a << " + " << b << " = " << c.value << " against 1";
  c.formula = f.str();
  return c;
}

MethodComparison compare_methods(const RangeCheck& nominal, const RangeCheck& hot_spot, const std::string& label) {
  if (hot_spot.kind != StressKind::normal)
    throw Error(label + ": the hot-spot check must use a normal-stress curve, but '" + hot_spot.curve +
                "' is for " + kind_words(hot_spot.kind) + "; give a hot-spot FAT class such as \"IIW FAT 90\"");
  MethodComparison c;
  c.label = label;
  c.nominal = nominal;
  c.hot_spot = hot_spot;
  if (nominal.kind == StressKind::normal && nominal.range_MPa > 0.0)
    c.concentration_factor = hot_spot.range_MPa / nominal.range_MPa;
  c.governing = nominal.utilization > hot_spot.utilization * (1.0 + kTie) ? Method::nominal : Method::hot_spot;
  c.verdict = verdict_of(c);
  return c;
}

}  // namespace toehold::nominal
