#include "toehold/nominal/marin.hpp"

#include "toehold/common/error.hpp"

#include <array>
#include <cmath>
#include <sstream>
#include <string>
#include <utility>

namespace toehold::nominal {
namespace {

std::string number(double v) {
  std::ostringstream os;
  os << v;
  return os.str();
}

void require_strength(const char* what, double v) {
  if (!std::isfinite(v) || v <= 0.0)
    throw Error(std::string(what) + " must be positive and finite, got " + number(v) + " MPa");
}

void require_factor(const char* what, double v, double upper, const char* why) {
  if (std::isfinite(v) && v > 0.0 && v <= upper) return;
  throw Error(std::string(what) + " must be above 0 and at most " + number(upper) + " (" + why + "), got " +
              number(v));
}

// 9th ed. Table 6-5: reliability in percent and k_e = 1 - 0.08 z_a as tabulated.
constexpr std::array<std::pair<double, double>, 8> kReliability{{{50, 1.000},
                                                                 {90, 0.897},
                                                                 {95, 0.868},
                                                                 {99, 0.814},
                                                                 {99.9, 0.753},
                                                                 {99.99, 0.702},
                                                                 {99.999, 0.659},
                                                                 {99.9999, 0.620}}};

}  // namespace

double specimen_endurance_limit(double ultimate_MPa) {
  require_strength("ultimate strength S_ut", ultimate_MPa);
  return ultimate_MPa <= 1400.0 ? 0.5 * ultimate_MPa : 700.0;
}

double surface_factor(Surface surface, double ultimate_MPa) {
  require_strength("ultimate strength S_ut", ultimate_MPa);
  double a = 1.0, b = 0.0;
  switch (surface) {
    case Surface::ground: a = 1.58, b = -0.085; break;
    case Surface::machined: a = 4.51, b = -0.265; break;
    case Surface::hot_rolled: a = 57.7, b = -0.718; break;
    case Surface::as_forged: a = 272.0, b = -0.995; break;
  }
  return a * std::pow(ultimate_MPa, b);
}

double size_factor_round(double diameter_mm) {
  if (!std::isfinite(diameter_mm) || diameter_mm < 2.79 || diameter_mm > 254.0)
    throw Error("size factor k_b: diameter " + number(diameter_mm) +
                " mm is outside the textbook fit (2.79 to 254 mm); give a diameter in that range");
  return diameter_mm <= 51.0 ? 1.24 * std::pow(diameter_mm, -0.107) : 1.51 * std::pow(diameter_mm, -0.157);
}

double equivalent_diameter_rectangle(double height_mm, double width_mm) {
  if (!(std::isfinite(height_mm) && height_mm > 0.0 && std::isfinite(width_mm) && width_mm > 0.0))
    throw Error("equivalent diameter: section " + number(height_mm) + " x " + number(width_mm) +
                " mm must have positive sides");
  return 0.808 * std::sqrt(height_mm * width_mm);
}

double load_factor(LoadKind load) {
  switch (load) {
    case LoadKind::bending: return 1.0;
    case LoadKind::axial: return 0.85;
    case LoadKind::torsion_shear: return 0.59;
  }
  return 1.0;
}

double reliability_factor(double reliability_percent) {
  for (const auto& [percent, factor] : kReliability)
    if (std::abs(reliability_percent - percent) < 1e-9) return factor;
  throw Error("reliability " + number(reliability_percent) +
              " % is not in the table; use one of 50, 90, 95, 99, 99.9, 99.99, 99.999, 99.9999");
}

double weld_fatigue_concentration(WeldDetail detail) {
  switch (detail) {
    case WeldDetail::reinforced_butt: return 1.2;
    case WeldDetail::transverse_fillet_toe: return 1.5;
    case WeldDetail::parallel_fillet_end: return 2.7;
    case WeldDetail::t_butt_sharp_corners: return 2.0;
  }
  return 1.0;
}

double shear_ultimate(double ultimate_MPa) {
  require_strength("ultimate strength S_ut", ultimate_MPa);
  return 0.67 * ultimate_MPa;
}

double shear_yield(double yield_MPa) {
  require_strength("yield strength S_y", yield_MPa);
  return 0.577 * yield_MPa;
}

EnduranceLimit endurance_limit(double ultimate_MPa, const MarinInput& in) {
  require_factor("temperature factor k_d", in.temperature_factor, 1.025, "the largest value of Table 6-4");
  require_factor("miscellaneous factor k_f", in.misc_factor, 1.0, "it only reduces the endurance limit");
  EnduranceLimit e;
  e.specimen_MPa = specimen_endurance_limit(ultimate_MPa);
  e.k_a = surface_factor(in.surface, ultimate_MPa);
  e.k_b = (in.load == LoadKind::axial || !in.diameter_mm) ? 1.0 : size_factor_round(*in.diameter_mm);
  e.k_c = load_factor(in.load);
  e.k_d = in.temperature_factor;
  e.k_e = reliability_factor(in.reliability_percent);
  e.k_f = in.misc_factor;
  e.endurance_MPa = e.k_a * e.k_b * e.k_c * e.k_d * e.k_e * e.k_f * e.specimen_MPa;
  return e;
}

}  // namespace toehold::nominal
