// The nominal-stress part of a toe section of report.html: where the nominal stress comes from, its check against
// the detail class, the textbook infinite-life weld check, and the two methods side by side at every station.
#include "report_parts.hpp"
#include "toehold/nominal/names.hpp"

#include <sstream>

namespace toehold::report {
namespace {

std::string td(const std::string& name, const std::string& text) {
  return "<td class=\"v-nominal-" + name + "\">" + text + "</td>";
}

std::string check_facts(const Context& c, const ToeNominalResult& n) {
  std::ostringstream os;
  os << "<p>Nominal stress from <b>" << esc(n.source) << "</b>: " << esc(n.description) << ". Detail class "
     << esc(n.curve) << " (" << esc(n.curve_source) << "), " << esc(n.stress_kind) << " stress.";
  if (n.check.ok() && (n.worst >= 0 || !n.per_station)) {
    os << (n.per_station ? " Worst station by the nominal method: range " : " Nominal range ")
       << fixed(n.check.range, 1) << " MPa, allowable " << fixed(n.check.allowable, 1) << " MPa, utilization "
       << fixed(n.check.utilization, 3);
    if (c.damage_kind()) os << ", Miner sum per repeat " << sig(n.check.damage, 4);
    os << ", life " << sig(n.check.life, 4) << " cycles.";
  } else if (!n.check.ok()) {
    os << " No nominal result: " << esc(n.check.problem) << ".";
  }
  if (!n.governing.empty()) os << " Governing method at this toe: <b>" << esc(n.governing) << "</b>.";
  for (const auto& note : n.notes) os << " " << esc(note) << ".";
  os << "</p>\n";
  return os.str();
}

std::string life_table(const InfiniteLifeResult& r) {
  const nominal::WeldCheck& w = r.check;
  const auto row = [](const std::string& what, const std::string& value) {
    return "<tr><td class=\"text\">" + esc(what) + "</td><td>" + value + "</td></tr>\n";
  };
  std::ostringstream os;
  os << "<h4>Textbook infinite-life weld check</h4>\n<p>" << esc(r.cycle) << "; material " << esc(w.material.name)
     << " (" << esc(w.material.source) << ").</p>\n<table class=\"infinite-life\">\n";
  os << row(w.shear ? "ultimate shear strength S_su [MPa]" : "ultimate strength S_ut [MPa]", sig(w.ultimate_MPa, 4));
  os << row(w.shear ? "shear yield strength S_sy [MPa]" : "yield strength S_y [MPa]", sig(w.yield_MPa, 4));
  os << row("specimen endurance limit S'e [MPa]", sig(w.endurance.specimen_MPa, 4));
  os << row("Marin factors k_a, k_b, k_c, k_d, k_e, k_f",
            sig(w.endurance.k_a, 4) + ", " + sig(w.endurance.k_b, 4) + ", " + sig(w.endurance.k_c, 4) + ", " +
                sig(w.endurance.k_d, 4) + ", " + sig(w.endurance.k_e, 4) + ", " + sig(w.endurance.k_f, 4));
  os << row("endurance limit S_e [MPa]", sig(w.endurance.endurance_MPa, 4));
  os << row("fatigue stress-concentration factor K_fs", sig(w.concentration_factor, 3));
  os << row("nominal alternating / mean stress [MPa]", sig(w.nominal_alternating_MPa, 4) + " / " + sig(w.nominal_mean_MPa, 4));
  os << row("alternating / mean stress with K_fs [MPa]", sig(w.alternating_MPa, 4) + " / " + sig(w.mean_MPa, 4));
  os << row("factor of safety: Goodman, Gerber, ASME-elliptic", sig(w.goodman, 4) + ", " + sig(w.gerber, 4) + ", " +
                                                                       sig(w.asme_elliptic, 4));
  os << row("first-cycle yield factor", sig(w.first_cycle_yield, 4));
  os << row("governing: " + to_string(w.governing), "<b>" + sig(w.factor_of_safety, 4) + "</b>");
  os << "</table>\n";
  return os.str();
}

std::string station_rows(const ToeResult& toe) {
  std::ostringstream os;
  for (const auto& s : toe.stations) {
    if (!s.nominal) continue;
    const StationNominal& n = *s.nominal;
    os << "<tr>" << td("id", std::to_string(s.station.id)) << td("hot-spot-range", s.ok() ? fixed(s.range, 1) : "-")
       << td("range", n.check.ok() ? fixed(n.check.range, 1) : "-")
       << td("factor", n.concentration_factor ? fixed(*n.concentration_factor, 3) : "-")
       << td("hot-spot-utilization", s.ok() ? fixed(s.utilization, 3) : "-")
       << td("utilization", n.check.ok() ? fixed(n.check.utilization, 3) : "-")
       << td("hot-spot-life", s.ok() ? sig(s.life, 4) : "-") << td("life", n.check.ok() ? sig(n.check.life, 4) : "-")
       << "<td class=\"text v-nominal-governing\">"
       << esc(!n.governing.empty() ? n.governing : n.check.ok() ? "no hot-spot result" : n.check.problem)
       << "</td></tr>\n";
  }
  return os.str();
}

}  // namespace

std::string nominal_section(const Context& c, std::size_t t) {
  const ToeResult& toe = c.a.toes[t];
  if (!toe.nominal) return "";
  std::ostringstream os;
  os << "<h3 id=\"" << toe_anchor(t) << "-nominal\">Nominal-stress method beside the hot-spot method</h3>\n"
     << check_facts(c, *toe.nominal);
  if (toe.nominal->infinite_life) os << life_table(*toe.nominal->infinite_life);
  os << "<table class=\"nominal\" data-toe=\"" << t + 1 << "\">\n<tr><th>station</th><th>hot-spot range [MPa]</th>"
     << "<th>nominal range [MPa]</th><th>structural SCF [-]</th><th>hot-spot utilization [-]</th>"
     << "<th>nominal utilization [-]</th><th>hot-spot life [cycles]</th><th>nominal life [cycles]</th>"
     << "<th class=\"text\">governs</th></tr>\n"
     << station_rows(toe) << "</table>\n";
  return os.str();
}

}  // namespace toehold::report
