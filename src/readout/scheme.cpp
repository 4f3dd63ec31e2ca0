#include "toehold/readout/scheme.hpp"

#include "toehold/common/error.hpp"
#include "toehold/readout/extrapolation.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <cstddef>
#include <sstream>
#include <utility>

namespace toehold {
namespace {

constexpr std::array<std::pair<std::string_view, SchemeKind>, 7> kSchemeNames{{
    {"fine-linear", SchemeKind::fine_linear},
    {"fine-quadratic", SchemeKind::fine_quadratic},
    {"coarse-linear", SchemeKind::coarse_linear},
    {"type-b-fine", SchemeKind::type_b_fine},
    {"type-b-coarse", SchemeKind::type_b_coarse},
    {"ship-single-point", SchemeKind::ship_single_point},
    {"user", SchemeKind::user},
}};
constexpr std::array<std::pair<std::string_view, HotSpotType>, 2> kTypeNames{{
    {"a", HotSpotType::a},
    {"b", HotSpotType::b},
}};

constexpr const char* kIiw = "IIW 2016 sec. 3.3 (from memory); weights derived";
constexpr const char* kIiwDnv = "IIW 2016 sec. 3.3 and DNVGL-RP-C203 2016 sec. 4.3 (from memory); weights derived";
constexpr const char* kShip = "IACS CSR Pt1 Ch9 Sec5 sec. 3.1.1";
constexpr double kShipFactor = 1.12;  // IACS CSR Pt1 Ch9 Sec5 sec. 3.1.1

std::string number(double v) {
  std::ostringstream os;
  os << v;
  return os.str();
}

template <class Table>
std::string spellings(const Table& table) {
  std::string out;
  for (const auto& [name, value] : table) out += (out.empty() ? "" : ", ") + std::string(name);
  return out;
}

// A published scheme before t is known: read-out points as multiples of t (type a) or in mm (type b).
struct Recipe {
  std::vector<double> points;
  bool in_thickness = true;  // true: points are multiples of t; false: points are mm
  double factor = 0;         // 0: Lagrange weights to the toe; otherwise the single point's factor
  const char* label = "";
  const char* source = "";
};

[[noreturn]] void wrong_type(SchemeKind kind, HotSpotType type) {
  const std::string others = type == HotSpotType::b ? "type-b-fine, type-b-coarse or ship-single-point"
                                                    : "fine-linear, fine-quadratic, coarse-linear or ship-single-point";
  const std::string other_type = type == HotSpotType::b ? "a" : "b";
  throw Error("read-out scheme '" + to_string(kind) + "' exists for type " + other_type + " hot spots only; for type " +
              to_string(type) + " use " + others);
}

Recipe type_a_recipe(SchemeKind kind) {
  switch (kind) {
    case SchemeKind::fine_linear: return {{0.4, 1.0}, true, 0, "IIW type a, fine mesh, linear (0.4t, 1.0t)", kIiw};
    case SchemeKind::fine_quadratic:
      return {{0.4, 0.9, 1.4}, true, 0, "IIW type a, fine mesh, quadratic (0.4t, 0.9t, 1.4t)", kIiw};
    case SchemeKind::coarse_linear:
      return {{0.5, 1.5}, true, 0, "IIW type a, coarse mesh, linear (0.5t, 1.5t)", kIiwDnv};
    case SchemeKind::ship_single_point:
      return {{0.5}, true, kShipFactor, "ship rules, type a, single point (1.12 x s(t/2))", kShip};
    default: wrong_type(kind, HotSpotType::a);
  }
}

Recipe type_b_recipe(SchemeKind kind) {
  switch (kind) {
    case SchemeKind::type_b_fine:
      return {{4.0, 8.0, 12.0}, false, 0, "IIW type b, fine mesh, quadratic (4, 8, 12 mm)", kIiw};
    case SchemeKind::type_b_coarse: return {{5.0, 15.0}, false, 0, "IIW type b, coarse mesh, linear (5, 15 mm)", kIiw};
    case SchemeKind::ship_single_point:
      return {{5.0}, false, kShipFactor, "ship rules, type b, single point (1.12 x s(5 mm))", kShip};
    default: wrong_type(kind, HotSpotType::b);
  }
}

void check_thickness(SchemeKind kind, double t) {
  const std::string what = "read-out scheme '" + to_string(kind) + "' (type a): plate thickness ";
  if (!std::isfinite(t)) throw Error(what + "is not a finite number; give the thickness in mm");
  if (t <= 0)
    throw Error(what + number(t) + " mm is not positive; give the thickness of the plate that carries the toe");
}

void check_distances(const std::vector<double>& d) {
  const std::string what = "user read-out scheme: ";
  if (d.empty()) throw Error(what + "no read-out distances given; give at least one distance in mm");
  for (std::size_t i = 0; i < d.size(); ++i) {
    const std::string n = std::to_string(i + 1);
    if (!std::isfinite(d[i])) throw Error(what + "distance " + n + " is not a finite number");
    if (d[i] <= 0)
      throw Error(what + "distance " + n + " is " + number(d[i]) +
                  " mm; read-out distances must be positive (measured from the toe)");
    if (i == 0) continue;
    const std::string p = std::to_string(i);
    if (d[i] == d[i - 1])
      throw Error(what + "distances " + p + " and " + n + " are both " + number(d[i]) + " mm; give each distance once");
    if (d[i] < d[i - 1])
      throw Error(what + "distance " + n + " (" + number(d[i]) + " mm) is smaller than distance " + p + " (" +
                  number(d[i - 1]) + " mm); list the distances in ascending order");
  }
}

std::string list_mm(const std::vector<double>& d) {
  std::string out;
  for (double v : d) out += (out.empty() ? "" : ", ") + number(v);
  return out + " mm";
}

std::string user_label(const ReadoutScheme& s, double factor) {
  std::string label = "user, type " + to_string(s.type) + ", ";
  if (s.distances.size() == 1) return label + "single point (" + number(factor) + " x s(" + list_mm(s.distances) + "))";
  label += "Lagrange extrapolation from " + std::to_string(s.distances.size()) + " points (" + list_mm(s.distances) + ")";
  return factor == 1.0 ? label : label + ", times " + number(factor);
}

void check_readings(const ReadoutScheme& scheme, std::size_t n) {
  if (n != scheme.weights.size() || scheme.weights.size() != scheme.distances.size())
    throw Error("read-out scheme '" + scheme.label + "': " + std::to_string(n) + " readings given for " +
                std::to_string(scheme.distances.size()) + " read-out points; give one reading per point, in order");
}

MeshRule type_a_rule(const ReadoutScheme& s, double t) {
  check_thickness(s.kind, t);
  const std::string tt = number(t) + " x " + number(t) + " mm";
  switch (s.kind) {
    case SchemeKind::fine_linear:
      return {0.4 * t, "fine mesh: element size at the toe at most 0.4t = " + number(0.4 * t) +
                           " mm (IIW 2016 sec. 3.3, from memory)"};
    case SchemeKind::fine_quadratic:
      return {0.4 * t, "fine mesh: element size at the toe at most 0.4t = " + number(0.4 * t) +
                           " mm (IIW 2016 sec. 3.3, from memory); each read-out point in a separate element "
                           "(Lotsberg et al., Procedia Struct. Integrity 57, 2024)"};
    case SchemeKind::coarse_linear:
      return {t, "coarse mesh: t x t = " + tt +
                     " higher-order elements at the toe (IIW 2016 sec. 3.3, DNVGL-RP-C203 2016 sec. 4.3, from memory)"};
    default: return {t, "t x t = " + tt + " elements at the toe (IACS CSR Pt1 Ch9 Sec5 sec. 3.1.1)"};
  }
}

MeshRule type_b_rule(const ReadoutScheme& s) {
  switch (s.kind) {
    case SchemeKind::type_b_fine:
      return {4.0, "fine mesh: element length at the toe at most 4 mm along the plate edge (IIW 2016 sec. 3.3, from "
                   "memory)"};
    case SchemeKind::type_b_coarse:
      return {10.0, "coarse mesh: 10 x 10 mm higher-order elements at the toe (IIW 2016 sec. 3.3, from memory)"};
    default: return {10.0, "10 x 10 mm elements at the toe (IACS CSR Pt1 Ch9 Sec5 sec. 3.1.1)"};
  }
}

}  // namespace

ReadoutScheme make_scheme(SchemeKind kind, HotSpotType type, double thickness_mm) {
  if (kind == SchemeKind::user)
    throw Error("read-out scheme 'user' needs its own read-out distances; build it with make_user_scheme");
  const Recipe r = type == HotSpotType::a ? type_a_recipe(kind) : type_b_recipe(kind);
  if (r.in_thickness) check_thickness(kind, thickness_mm);
  ReadoutScheme s{kind, type, r.points, {}, r.label, r.source};
  if (r.in_thickness)
    for (double& d : s.distances) d *= thickness_mm;
  s.weights = r.factor > 0 ? std::vector<double>{r.factor} : lagrange_weights(0.0, s.distances);
  return s;
}

ReadoutScheme make_user_scheme(std::vector<double> distances_mm, HotSpotType type, double factor) {
  check_distances(distances_mm);
  if (!std::isfinite(factor) || factor <= 0)
    throw Error("user read-out scheme: factor " + number(factor) + " is not a positive number; give a positive factor");
  ReadoutScheme s{SchemeKind::user, type, std::move(distances_mm), {}, "", ""};
  s.weights = s.distances.size() == 1 ? std::vector<double>{1.0} : lagrange_weights(0.0, s.distances);
  for (double& w : s.weights) w *= factor;
  s.label = user_label(s, factor);
  s.source = s.distances.size() == 1 ? "user-defined single read-out point"
                                     : "user-defined read-out points, Lagrange extrapolation to the toe";
  return s;
}

double extrapolate(const ReadoutScheme& scheme, const std::vector<double>& readings) {
  check_readings(scheme, readings.size());
  double sum = 0;
  for (std::size_t i = 0; i < readings.size(); ++i) sum += scheme.weights[i] * readings[i];
  return sum;
}

Tensor extrapolate(const ReadoutScheme& scheme, const std::vector<Tensor>& readings) {
  check_readings(scheme, readings.size());
  Tensor sum = Tensor::Zero();
  for (std::size_t i = 0; i < readings.size(); ++i) sum += scheme.weights[i] * readings[i];
  return sum;
}

MeshRule mesh_rule(const ReadoutScheme& scheme, double thickness_mm) {
  if (scheme.kind == SchemeKind::user) {
    const double first = scheme.distances.empty() ? 0.0 : scheme.distances.front();
    return {first, "user scheme: no published mesh rule; element size at the toe no larger than the first read-out "
                   "distance, " + number(first) + " mm (common practice, no source)"};
  }
  return scheme.type == HotSpotType::a ? type_a_rule(scheme, thickness_mm) : type_b_rule(scheme);
}

SchemeKind parse_scheme_kind(std::string_view text, const std::string& where) {
  std::string key(text);
  std::replace(key.begin(), key.end(), '_', '-');
  for (const auto& [name, value] : kSchemeNames)
    if (name == key) return value;
  throw Error(where + ": unknown read-out scheme '" + std::string(text) + "'; use one of " + spellings(kSchemeNames));
}

std::string to_string(SchemeKind kind) {
  for (const auto& [name, value] : kSchemeNames)
    if (value == kind) return std::string(name);
  return "?";
}

HotSpotType parse_hot_spot_type(std::string_view text, const std::string& where) {
  for (const auto& [name, value] : kTypeNames)
    if (name == text) return value;
  throw Error(where + ": unknown hot-spot type '" + std::string(text) + "'; use one of " + spellings(kTypeNames));
}

std::string to_string(HotSpotType type) {
  for (const auto& [name, value] : kTypeNames)
    if (value == type) return std::string(name);
  return "?";
}

}  // namespace toehold
