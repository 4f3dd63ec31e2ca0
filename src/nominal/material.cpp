#include "toehold/nominal/material.hpp"

#include "toehold/common/error.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <sstream>
#include <utility>

namespace toehold::nominal {
namespace {

std::string number(double v) {
  std::ostringstream os;
  os << v;
  return os.str();
}

const std::string kTextbookSae =
    "Budynas and Nisbett, Mechanical Engineering Design 9th ed. (2011), Table A-20, SAE/ASTM minimums [S]";
const std::string kA36 = "ASTM A36: F_y 250 MPa, F_u 400-550 MPa, minimum used [S]";
const std::string kS355 = "EN 10025-2 S355: R_eH by thickness band, R_m 470-630 MPa, minimum used";
const std::string kAws = "AWS electrode minimums, Budynas and Nisbett 9th ed. Table 9-3, from memory [M]";

std::vector<Material> build_table() {
  return {
      {"AISI 1020 HR", 380, 210, kTextbookSae},
      {"AISI 1030 HR", 470, 260, kTextbookSae},
      {"AISI 1045 HR", 570, 310, kTextbookSae},
      {"ASTM A36", 400, 250, kA36},
      {"S355 t<=16", 470, 355, kS355 + " [S]"},
      {"S355 16<t<=40", 470, 345, kS355 + " [S]"},
      {"S355 40<t<=63", 470, 335, kS355 + ", band from memory [M]"},
      {"S355 63<t<=80", 470, 325, kS355 + ", band from memory [M]"},
      {"S355 80<t<=100", 470, 315, kS355 + ", band from memory [M]"},
      {"E60xx", 427, 345, kAws},
      {"E70xx", 482, 393, kAws},
      {"E80xx", 551, 462, kAws},
      {"E90xx", 620, 531, kAws},
      {"E100xx", 689, 600, kAws},
      {"E120xx", 827, 737, kAws},
  };
}

void require_strength(const std::string& name, const char* what, double v) {
  if (!std::isfinite(v))
    throw Error("material '" + name + "': " + what + " is missing; give it in MPa");
  if (v <= 0.0)
    throw Error("material '" + name + "': " + what + " must be positive, got " + number(v) + " MPa");
}

}  // namespace

const std::vector<Material>& material_table() {
  static const std::vector<Material> table = build_table();
  return table;
}

Material find_material(std::string_view name) {
  for (const Material& m : material_table())
    if (m.name == name) return m;
  std::string names;
  for (const Material& m : material_table()) names += (names.empty() ? "" : ", ") + m.name;
  throw Error("unknown material '" + std::string(name) + "'; use one of " + names +
              ", or define the material with its strengths");
}

Material s355(double thickness_mm) {
  constexpr std::array<std::pair<double, const char*>, 5> bands{
      {{16, "S355 t<=16"}, {40, "S355 16<t<=40"}, {63, "S355 40<t<=63"}, {80, "S355 63<t<=80"},
       {100, "S355 80<t<=100"}}};
  if (std::isfinite(thickness_mm) && thickness_mm > 0.0)
    for (const auto& [upper, name] : bands)
      if (thickness_mm <= upper) return find_material(name);
  throw Error("S355 plate thickness " + number(thickness_mm) +
              " mm is outside the table (0 < t <= 100 mm); define the material with its strengths");
}

void check_material(const Material& m) {
  require_strength(m.name, "ultimate strength", m.ultimate_MPa);
  require_strength(m.name, "yield strength", m.yield_MPa);
  if (m.yield_MPa > m.ultimate_MPa)
    throw Error("material '" + m.name + "': yield strength " + number(m.yield_MPa) +
                " MPa exceeds ultimate strength " + number(m.ultimate_MPa) + " MPa; check the two values");
}

Material user_material(std::string name, double ultimate_MPa, double yield_MPa, std::string source) {
  Material m{std::move(name), ultimate_MPa, yield_MPa, std::move(source)};
  check_material(m);
  return m;
}

Material weaker_of(const Material& parent, const Material& weld_metal) {
  check_material(parent);
  check_material(weld_metal);
  const Material& u = parent.ultimate_MPa <= weld_metal.ultimate_MPa ? parent : weld_metal;
  const Material& y = parent.yield_MPa <= weld_metal.yield_MPa ? parent : weld_metal;
  return {"weaker of " + parent.name + " and " + weld_metal.name, u.ultimate_MPa, y.yield_MPa,
          "ultimate from " + u.name + ", yield from " + y.name +
              " (weaker of parent and weld metal: common practice, no source)"};
}

}  // namespace toehold::nominal
