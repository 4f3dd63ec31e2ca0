// Private to src/output: the parts of report.html (report_html.cpp puts the page together, report_toe.cpp the toe
// sections, report_station.cpp the critical stations) and the number formats they share.
#pragma once

#include "toehold/assess/assessment.hpp"
#include "toehold/output/provenance.hpp"

#include <string>
#include <vector>

namespace toehold::report {

// What every part needs.
struct Context {
  const Assessment& a;
  const Provenance& p;
  double mm_per_unit;  // mm in one output length unit
  std::string unit;    // output length unit name

  double length(double mm) const { return mm / mm_per_unit; }
  bool damage_kind() const { return a.plan.loading.kind != LoadingKind::range; }
};

// Number formats of the report (the e2e test reads them back): fixed decimals, or "-" for NaN and "no damage" for
// +infinity.
std::string fixed(double v, int decimals);
// Up to `digits` significant digits ("%.*g"), "no damage" for +infinity, "-" for NaN.
std::string sig(double v, int digits = 4);
std::string esc(const std::string& text);  // HTML-escaped text

// The step indices whose values are plotted for a station: all steps when there are few, else its range's steps.
std::vector<std::size_t> plotted_steps(const Assessment& a, const StationResult& s);
// A colour for the i-th plotted series.
const char* series_colour(std::size_t i);
// "ok", "exceeds" or "no result", and the CSS class for it.
std::string status_word(const StationResult& s);

// The anchor id of a toe section and a station row ("toe-1", "toe-1-station-5").
std::string toe_anchor(std::size_t toe);
std::string station_anchor(std::size_t toe, int station_id);

std::string toe_section(const Context& c, std::size_t toe);
// The nominal-stress method beside the hot-spot method of a toe with [toe.nominal]; "" for other toes.
std::string nominal_section(const Context& c, std::size_t toe);
// " Shell model: the toe reads the top layer ..." for a toe on a shell model; "" for other toes.
std::string shell_toe_sentence(const ToeResult& toe);
// The shell layer, origin and hot-spot location of a station (a paragraph); "" off shell models.
std::string shell_station_facts(const Context& c, const StationResult& s);
// The linearization table of a station beside its surface value; "" when the toe does not ask for it.
std::string linearization_table(const Context& c, const StationResult& s);
std::string critical_station_section(const Context& c, std::size_t toe, std::size_t station);

}  // namespace toehold::report
