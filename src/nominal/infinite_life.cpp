#include "toehold/nominal/infinite_life.hpp"

#include "toehold/common/error.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <sstream>
#include <string>

namespace toehold::nominal {
namespace {

constexpr double kInfinity = std::numeric_limits<double>::infinity();

std::string number(double v) {
  std::ostringstream os;
  os << v;
  return os.str();
}

void check_stresses(const char* criterion, double alternating, double mean) {
  if (!std::isfinite(alternating) || alternating < 0.0)
    throw Error(std::string(criterion) + ": stress amplitude must be zero or positive, got " + number(alternating) +
                " MPa; give half the stress range");
  if (!std::isfinite(mean))
    throw Error(std::string(criterion) + ": mean stress is missing; give it in MPa");
}

void check_strength(const char* criterion, const char* what, double v) {
  if (!std::isfinite(v) || v <= 0.0)
    throw Error(std::string(criterion) + ": " + what + " must be positive and finite, got " + number(v) + " MPa");
}

// Compressive mean: the fatigue criteria reduce to the horizontal line s_a = S_e / n.
double compressive_mean_factor(double alternating, double endurance) {
  return alternating == 0.0 ? kInfinity : endurance / alternating;
}

double fatigue_factor(const WeldCheck& c) {
  switch (c.criterion) {
    case Criterion::goodman: return c.goodman;
    case Criterion::gerber: return c.gerber;
    case Criterion::asme_elliptic: return c.asme_elliptic;
    case Criterion::first_cycle_yield: break;
  }
  return c.first_cycle_yield;
}

void fill_factors(WeldCheck& c) {
  const double sa = c.alternating_MPa, sm = c.mean_MPa, se = c.endurance.endurance_MPa;
  c.goodman = goodman_factor(sa, sm, se, c.ultimate_MPa);
  c.gerber = gerber_factor(sa, sm, se, c.ultimate_MPa);
  c.asme_elliptic = asme_elliptic_factor(sa, sm, se, c.yield_MPa);
  c.first_cycle_yield = first_cycle_yield_factor(sa, sm, c.yield_MPa);
  const double fatigue = fatigue_factor(c);
  c.governing = c.first_cycle_yield < fatigue ? Criterion::first_cycle_yield : c.criterion;
  c.factor_of_safety = std::min(fatigue, c.first_cycle_yield);
}

}  // namespace

double goodman_factor(double alternating_MPa, double mean_MPa, double endurance_MPa, double ultimate_MPa) {
  check_stresses("Goodman criterion", alternating_MPa, mean_MPa);
  check_strength("Goodman criterion", "endurance limit S_e", endurance_MPa);
  check_strength("Goodman criterion", "ultimate strength S_ut", ultimate_MPa);
  if (mean_MPa < 0.0) return compressive_mean_factor(alternating_MPa, endurance_MPa);
  const double inverse = alternating_MPa / endurance_MPa + mean_MPa / ultimate_MPa;
  return inverse == 0.0 ? kInfinity : 1.0 / inverse;
}

double gerber_factor(double alternating_MPa, double mean_MPa, double endurance_MPa, double ultimate_MPa) {
  check_stresses("Gerber criterion", alternating_MPa, mean_MPa);
  check_strength("Gerber criterion", "endurance limit S_e", endurance_MPa);
  check_strength("Gerber criterion", "ultimate strength S_ut", ultimate_MPa);
  if (mean_MPa <= 0.0) return compressive_mean_factor(alternating_MPa, endurance_MPa);
  if (alternating_MPa == 0.0) return ultimate_MPa / mean_MPa;  // limit of the formula for s_a -> 0
  const double ratio = ultimate_MPa / mean_MPa;
  const double x = 2.0 * mean_MPa * endurance_MPa / (ultimate_MPa * alternating_MPa);
  const double root_term = x * x / (1.0 + std::sqrt(1.0 + x * x));  // = -1 + sqrt(1 + x^2), without cancellation
  return 0.5 * ratio * ratio * (alternating_MPa / endurance_MPa) * root_term;
}

double asme_elliptic_factor(double alternating_MPa, double mean_MPa, double endurance_MPa, double yield_MPa) {
  check_stresses("ASME-elliptic criterion", alternating_MPa, mean_MPa);
  check_strength("ASME-elliptic criterion", "endurance limit S_e", endurance_MPa);
  check_strength("ASME-elliptic criterion", "yield strength S_y", yield_MPa);
  if (mean_MPa < 0.0) return compressive_mean_factor(alternating_MPa, endurance_MPa);
  const double h = std::hypot(alternating_MPa / endurance_MPa, mean_MPa / yield_MPa);
  return h == 0.0 ? kInfinity : 1.0 / h;
}

double first_cycle_yield_factor(double alternating_MPa, double mean_MPa, double yield_MPa) {
  check_stresses("first-cycle yield check", alternating_MPa, mean_MPa);
  check_strength("first-cycle yield check", "yield strength S_y", yield_MPa);
  const double peak = alternating_MPa + std::abs(mean_MPa);
  return peak == 0.0 ? kInfinity : yield_MPa / peak;
}

WeldCheck check_weld_infinite_life(const WeldCheckInput& input, double nominal_alternating_MPa,
                                   double nominal_mean_MPa) {
  if (input.criterion == Criterion::first_cycle_yield)
    throw Error("weld check: the fatigue criterion must be goodman, gerber or asme-elliptic; first-cycle yield "
                "is always checked beside it");
  check_stresses("weld check", nominal_alternating_MPa, nominal_mean_MPa);
  check_material(input.material);
  WeldCheck c;
  c.material = input.material;
  c.shear = input.marin.load == LoadKind::torsion_shear;
  c.ultimate_MPa = c.shear ? shear_ultimate(c.material.ultimate_MPa) : c.material.ultimate_MPa;
  c.yield_MPa = c.shear ? shear_yield(c.material.yield_MPa) : c.material.yield_MPa;
  c.endurance = endurance_limit(c.material.ultimate_MPa, input.marin);
  c.concentration_factor = weld_fatigue_concentration(input.detail);
  c.nominal_alternating_MPa = nominal_alternating_MPa;
  c.nominal_mean_MPa = c.shear ? std::abs(nominal_mean_MPa) : nominal_mean_MPa;
  c.alternating_MPa = c.concentration_factor * c.nominal_alternating_MPa;  // sec. 9-7: K_fs on both
  c.mean_MPa = c.concentration_factor * c.nominal_mean_MPa;
  c.criterion = input.criterion;
  fill_factors(c);
  return c;
}

WeldCheck check_weld_infinite_life(const WeldCheckInput& input, const WeldGroupProperties& group,
                                   const WeldLoad& alternating, const WeldLoad& mean) {
  const ThroatStress a = throat_stress(group, alternating);
  const ThroatStress m = throat_stress(group, mean);
  WeldCheck c = check_weld_infinite_life(input, a.combined_MPa, m.combined_MPa);
  c.alternating_throat = a;
  c.mean_throat = m;
  return c;
}

}  // namespace toehold::nominal
