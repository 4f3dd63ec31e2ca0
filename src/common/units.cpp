#include "toehold/common/units.hpp"

#include "toehold/common/error.hpp"

#include <array>
#include <utility>

namespace toehold {
namespace {

constexpr std::array<std::pair<std::string_view, LengthUnit>, 3> kLength{{
    {"mm", LengthUnit::mm}, {"m", LengthUnit::m}, {"in", LengthUnit::in}}};
constexpr std::array<std::pair<std::string_view, StressUnit>, 4> kStress{{
    {"MPa", StressUnit::MPa}, {"Pa", StressUnit::Pa}, {"psi", StressUnit::psi}, {"ksi", StressUnit::ksi}}};

template <class Table>
std::string spellings(const Table& table) {
  std::string out;
  for (const auto& [name, value] : table) out += (out.empty() ? "" : ", ") + std::string(name);
  return out;
}

template <class Table>
auto parse(const Table& table, std::string_view text, const std::string& where, const char* kind) {
  for (const auto& [name, value] : table)
    if (name == text) return value;
  throw Error(where + ": unknown " + kind + " unit '" + std::string(text) + "'; use one of " + spellings(table));
}

template <class Table, class Value>
std::string name_of(const Table& table, Value v) {
  for (const auto& [name, value] : table)
    if (value == v) return std::string(name);
  return "?";
}

}  // namespace

double mm_per(LengthUnit unit) {
  switch (unit) {
    case LengthUnit::mm: return 1.0;
    case LengthUnit::m: return 1000.0;
    case LengthUnit::in: return 25.4;
  }
  return 1.0;
}

double mpa_per(StressUnit unit) {
  switch (unit) {
    case StressUnit::MPa: return 1.0;
    case StressUnit::Pa: return 1e-6;
    case StressUnit::psi: return 6894.757293168e-6;
    case StressUnit::ksi: return 6.894757293168;
  }
  return 1.0;
}

LengthUnit parse_length_unit(std::string_view text, const std::string& where) {
  return parse(kLength, text, where, "length");
}
StressUnit parse_stress_unit(std::string_view text, const std::string& where) {
  return parse(kStress, text, where, "stress");
}
std::string to_string(LengthUnit unit) { return name_of(kLength, unit); }
std::string to_string(StressUnit unit) { return name_of(kStress, unit); }

}  // namespace toehold
