#include "toehold/nominal/names.hpp"

#include "toehold/common/error.hpp"

#include <array>
#include <utility>

namespace toehold::nominal {
namespace {

constexpr std::array<std::pair<std::string_view, WeldLayout>, 7> kLayout{{{"single", WeldLayout::single},
                                                                          {"parallel-pair", WeldLayout::parallel_pair},
                                                                          {"across-pair", WeldLayout::across_pair},
                                                                          {"angle", WeldLayout::angle},
                                                                          {"channel", WeldLayout::channel},
                                                                          {"box", WeldLayout::box},
                                                                          {"circle", WeldLayout::circle}}};
constexpr std::array<std::pair<std::string_view, Surface>, 4> kSurface{{{"ground", Surface::ground},
                                                                        {"machined", Surface::machined},
                                                                        {"hot-rolled", Surface::hot_rolled},
                                                                        {"as-forged", Surface::as_forged}}};
constexpr std::array<std::pair<std::string_view, LoadKind>, 3> kLoad{{{"bending", LoadKind::bending},
                                                                      {"axial", LoadKind::axial},
                                                                      {"torsion-shear", LoadKind::torsion_shear}}};
constexpr std::array<std::pair<std::string_view, WeldDetail>, 4> kDetail{
    {{"reinforced-butt", WeldDetail::reinforced_butt},
     {"transverse-fillet-toe", WeldDetail::transverse_fillet_toe},
     {"parallel-fillet-end", WeldDetail::parallel_fillet_end},
     {"t-butt-sharp-corners", WeldDetail::t_butt_sharp_corners}}};
constexpr std::array<std::pair<std::string_view, Criterion>, 4> kCriterion{
    {{"goodman", Criterion::goodman},
     {"gerber", Criterion::gerber},
     {"asme-elliptic", Criterion::asme_elliptic},
     {"first-cycle-yield", Criterion::first_cycle_yield}}};

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
  throw Error(where + ": unknown " + kind + " '" + std::string(text) + "'; use one of " + spellings(table));
}

template <class Table, class Value>
std::string name_of(const Table& table, Value v) {
  for (const auto& [name, value] : table)
    if (value == v) return std::string(name);
  return "?";
}

}  // namespace

WeldLayout parse_weld_layout(std::string_view text, const std::string& where) {
  return parse(kLayout, text, where, "weld group layout");
}
Surface parse_surface(std::string_view text, const std::string& where) {
  return parse(kSurface, text, where, "surface finish");
}
LoadKind parse_load_kind(std::string_view text, const std::string& where) {
  return parse(kLoad, text, where, "load kind");
}
WeldDetail parse_weld_detail(std::string_view text, const std::string& where) {
  return parse(kDetail, text, where, "weld detail");
}
Criterion parse_criterion(std::string_view text, const std::string& where) {
  return parse(kCriterion, text, where, "criterion");
}

std::string to_string(WeldLayout layout) { return name_of(kLayout, layout); }
std::string to_string(Surface surface) { return name_of(kSurface, surface); }
std::string to_string(LoadKind load) { return name_of(kLoad, load); }
std::string to_string(WeldDetail detail) { return name_of(kDetail, detail); }
std::string to_string(Criterion criterion) { return name_of(kCriterion, criterion); }

}  // namespace toehold::nominal
