// report.html: one self-contained page for review (inline CSS and SVG, no scripts, no network): the summary and
// caution, every toe with plots along it and its station table, the critical stations with their read-out path,
// extrapolation and S-N diagram, the diagnostics, and the provenance. docs/report.md describes every part.
#pragma once

#include "toehold/assess/assessment.hpp"
#include "toehold/common/units.hpp"
#include "toehold/output/provenance.hpp"

#include <string>
#include <vector>

namespace toehold {

// How many of the worst stations of each toe get a section of their own.
inline constexpr int kCriticalStationsPerToe = 3;

// The page. a: the assessment (mm, MPa); p: its provenance; out_unit: length unit of positions and distances
// shown (the model's own, as in the other result files); stresses are shown in MPa.
std::string format_report_html(const Assessment& a, const Provenance& p, LengthUnit out_unit);

// Indices into toe.stations of the stations with a result and the largest utilization, worst first, at most
// `how_many` (ties: lower index first), followed by the stations with a result that the plan names in the toe's
// report_stations (by station id), each once.
std::vector<std::size_t> critical_stations(const ToeResult& toe, int how_many);

}  // namespace toehold
