#include "toehold/output/summary.hpp"

#include "result_files.hpp"

#include "toehold/nominal/names.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <sstream>

namespace toehold {

const char* const kCaution =
    "CAUTION: toehold is a screening and documentation aid. Its results must be checked by a qualified engineer "
    "under the governing code and local regulations before they are relied on.";

namespace {

std::string fixed(double value, int decimals) {
  if (std::isinf(value)) return "no damage";
  char buffer[64];
  std::snprintf(buffer, sizeof buffer, "%.*f", decimals, value);
  return buffer;
}

std::string cycles(double value) {
  if (std::isinf(value)) return "no damage";
  char buffer[64];
  std::snprintf(buffer, sizeof buffer, "%.3g", value);
  return buffer;
}

std::string pad(const std::string& text, std::size_t width, bool right = false) {
  if (text.size() >= width) return text;
  const std::string fill(width - text.size(), ' ');
  return right ? fill + text : text + fill;
}

std::string position(const Vec3& x_mm, LengthUnit unit) {
  const double f = 1.0 / mm_per(unit);
  char buffer[128];
  std::snprintf(buffer, sizeof buffer, "(%.1f, %.1f, %.1f)", x_mm.x() * f, x_mm.y() * f, x_mm.z() * f);
  return buffer;
}

std::string table(const Assessment& a) {
  const std::string unit = to_string(a.plan.model.length_unit);
  std::ostringstream os;
  os << pad("toe", 16) << pad("stations", 9, true) << pad("worst", 7, true) << "  " << pad("at [" + unit + "]", 26)
     << pad("range [MPa]", 12, true) << pad("allow. [MPa]", 13, true) << pad("util.", 8, true)
     << pad("life [cycles]", 14, true) << "  status\n";
  for (const ToeResult& t : a.toes) {
    os << pad(t.plan.name, 16) << pad(std::to_string(t.stations.size()), 9, true);
    if (t.worst < 0) {
      os << pad("-", 7, true) << "  " << pad("-", 26) << pad("-", 12, true) << pad("-", 13, true) << pad("-", 8, true)
         << pad("-", 14, true) << "  no result\n";
      continue;
    }
    const StationResult& s = t.stations[static_cast<std::size_t>(t.worst)];
    os << pad(std::to_string(s.station.id), 7, true) << "  " << pad(position(s.station.x, a.plan.model.length_unit), 26)
       << pad(fixed(s.range, 1), 12, true) << pad(fixed(s.allowable, 1), 13, true)
       << pad(fixed(s.utilization, 3), 8, true) << pad(cycles(s.life), 14, true) << "  "
       << (s.exceeds() ? "EXCEEDS" : "passes") << "\n";
  }
  return os.str();
}

std::string years(double value) {
  if (std::isnan(value)) return "-";
  return cycles(value);
}

// Damage kinds: the worst station of each toe by Miner sum.
std::string damage_table(const Assessment& a) {
  const std::string unit = to_string(a.plan.model.length_unit);
  std::ostringstream os;
  os << pad("toe", 16) << pad("stations", 9, true) << pad("worst", 7, true) << "  " << pad("at [" + unit + "]", 26)
     << pad("damage", 11, true) << pad("limit", 7, true) << pad("eq. [MPa]", 11, true)
     << pad("life [repeats]", 15, true) << pad("life [years]", 13, true) << "  status\n";
  for (const ToeResult& t : a.toes) {
    os << pad(t.plan.name, 16) << pad(std::to_string(t.stations.size()), 9, true);
    if (t.worst < 0) {
      os << pad("-", 7, true) << "  " << pad("-", 26) << pad("-", 11, true) << pad("-", 7, true) << pad("-", 11, true)
         << pad("-", 15, true) << pad("-", 13, true) << "  no result\n";
      continue;
    }
    const StationResult& s = t.stations[static_cast<std::size_t>(t.worst)];
    os << pad(std::to_string(s.station.id), 7, true) << "  " << pad(position(s.station.x, a.plan.model.length_unit), 26)
       << pad(cycles(s.damage), 11, true) << pad(cycles(t.damage_limit), 7, true)
       << pad(fixed(s.equivalent_range, 1), 11, true) << pad(cycles(s.life_repeats), 15, true)
       << pad(years(s.life_years), 13, true) << "  " << (s.exceeds() ? "EXCEEDS" : "passes") << "\n";
  }
  return os.str();
}

// Toes with [toe.nominal]: the nominal method beside the hot-spot method at the toe's worst stations.
std::string nominal_table(const Assessment& a) {
  std::ostringstream os;
  os << pad("toe", 16) << pad("source", 18) << pad("nominal [MPa]", 14, true) << pad("hot spot [MPa]", 15, true)
     << pad("SCF", 7, true) << pad("util. nom.", 11, true) << pad("util. h.s.", 11, true) << "  governs\n";
  for (const ToeResult& t : a.toes) {
    if (!t.nominal) continue;
    const ToeNominalResult& n = *t.nominal;
    os << pad(t.plan.name, 16) << pad(n.source, 18);
    const StationResult* hot = t.worst >= 0 ? &t.stations[static_cast<std::size_t>(t.worst)] : nullptr;
    const bool nominal_ok = n.check.ok() && (n.worst >= 0 || !n.per_station);
    os << pad(nominal_ok ? fixed(n.check.range, 1) : "-", 14, true) << pad(hot ? fixed(hot->range, 1) : "-", 15, true);
    const bool scf = hot && hot->nominal && hot->nominal->concentration_factor;
    os << pad(scf ? fixed(*hot->nominal->concentration_factor, 2) : "-", 7, true)
       << pad(nominal_ok ? fixed(n.check.utilization, 3) : "-", 11, true)
       << pad(hot ? fixed(hot->utilization, 3) : "-", 11, true) << "  "
       << (n.governing.empty() ? "-" : n.governing) << "\n";
    if (n.infinite_life)
      os << "    infinite-life weld check: factor of safety " << fixed(n.infinite_life->check.factor_of_safety, 2)
         << " (" << nominal::to_string(n.infinite_life->check.governing) << ")\n";
    if (!n.check.ok()) os << "    no nominal result: " << n.check.problem << "\n";
  }
  return os.str();
}

// Toes with through_thickness: the largest ratio of the linearized structural range to the surface range, and how
// many stations have no linearized value.
std::string linearization_line(const ToeResult& t) {
  double largest = -1.0;
  int at = -1, without = 0;
  for (const StationResult& s : t.stations) {
    if (!s.through_thickness || !s.through_thickness->ok()) {
      ++without;
      continue;
    }
    const double ratio = detail::linearized_ratio(s);
    if (!std::isfinite(ratio) || ratio <= largest) continue;
    largest = ratio;
    at = s.station.id;
  }
  std::ostringstream os;
  os << "  toe '" << t.plan.name << "': largest ratio linearized / surface range ";
  if (at >= 0)
    os << fixed(largest, 3) << " at station " << at;
  else
    os << "-";
  os << "; " << without << " of " << t.stations.size() << " stations without a linearized value\n";
  return os.str();
}

std::string linearization_lines(const Assessment& a) {
  std::string text;
  for (const ToeResult& t : a.toes)
    if (t.plan.through_thickness) text += linearization_line(t);
  if (text.empty()) return "";
  return "Through-thickness linearization beside the surface extrapolation (per station in stations.csv):\n" + text +
         "\n";
}

std::string loading_line(const Assessment& a) {
  const auto& p = a.plan;
  std::ostringstream os;
  os << "loading: " << to_string(p.loading.kind);
  if (p.loading.kind == LoadingKind::unit_cases)
    os << ", " << a.steps.size() << " unit cases x " << a.history_rows << " history rows";
  if (p.loading.kind == LoadingKind::blocks) os << ", " << p.loading.blocks.size() << " blocks";
  os << "; counting: " << a.counting;
  if (p.loading.repeats_per_year > 0) os << "; " << cycles(p.loading.repeats_per_year) << " repeats per year";
  os << "; gamma_M = " << p.requirement.gamma_M << ", gamma_F = " << p.requirement.gamma_F << "\n";
  return os.str();
}

}  // namespace

std::string format_assessment_summary(const Assessment& a, const std::string& output_folder,
                                      const std::vector<std::string>& files) {
  std::ostringstream os;
  os << "toehold " << TOEHOLD_VERSION << " - " << (a.plan.title.empty() ? a.plan.path : a.plan.title) << "\n";
  os << "model: " << a.model_points << " points, " << a.model_cells << (a.plan.model.shell ? " shell" : " volume")
     << " cells; units "
     << to_string(a.plan.model.length_unit) << ", " << to_string(a.plan.model.stress_unit)
     << " (results in MPa); " << a.steps.size() << " load steps\n";
  const bool damage = a.plan.loading.kind != LoadingKind::range;
  if (damage)
    os << loading_line(a);
  else
    os << "requirement: " << cycles(a.plan.requirement.cycles) << " cycles, gamma_M = " << a.plan.requirement.gamma_M
       << ", gamma_F = " << a.plan.requirement.gamma_F << "\n";
  for (const ToeResult& t : a.toes) {
    os << "  toe '" << t.plan.name << "': " << t.scheme.label << "; " << t.definition << " stress; "
       << t.curve << " (" << t.curve_source << ")";
    if (damage) os << "; damage limit " << t.damage_limit << "; mean stress " << t.mean_stress;
    os << "\n";
  }
  os << "\nWorst station of each toe:\n" << (damage ? damage_table(a) : table(a)) << "\n";
  if (std::any_of(a.toes.begin(), a.toes.end(), [](const ToeResult& t) { return t.nominal.has_value(); }))
    os << "Nominal-stress method beside the hot-spot method (hot spot and SCF at the worst station; nominal "
          "source and detail class per toe in report.html):\n"
       << nominal_table(a) << "\n";
  os << linearization_lines(a);
  os << a.stations() << " stations: " << a.stations() - a.stations_without_result() - a.stations_exceeding()
     << " pass, " << a.stations_exceeding() << " exceed, " << a.stations_without_result() << " without result\n";
  if (!output_folder.empty()) {
    os << "\nOutputs in " << output_folder << ":";
    for (const auto& f : files) os << " " << f;
    os << "\nOpen results.pvd there in ParaView (File > Open) to see the stations, read-out paths and model.\n";
  }
  if (!a.warnings.empty()) {
    os << "\nWarnings (" << a.warnings.size() << "):\n";
    const std::size_t shown = std::min<std::size_t>(a.warnings.size(), 25);
    for (std::size_t i = 0; i < shown; ++i) os << "  - " << a.warnings[i] << "\n";
    if (shown < a.warnings.size())
      os << "  ... and " << a.warnings.size() - shown << " more (every station's status is in stations.csv)\n";
  }
  os << "\n" << kCaution << "\n";
  return os.str();
}

}  // namespace toehold
