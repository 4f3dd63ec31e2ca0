// Through-thickness linearization per station (ASME BPVC VIII-2 Annex 5-A) and the stress 1 mm below the surface
// (Xiao and Yamada 2004), beside the surface extrapolation.
#include "through_thickness.hpp"

#include "toehold/common/error.hpp"

#include <cmath>
#include <sstream>

namespace toehold::detail {
namespace {

constexpr double kLineTolerance = 0.05;  // fraction of t a sample may lie off the model (faceted surfaces)

bool frame_usable(const StationResult& r) { return r.station.problem.empty() && r.station.facet >= 0; }

// The largest |range| over pairs of tensors: the definition applied to the difference (evaluate_range).
struct PairRange {
  double value = std::numeric_limits<double>::quiet_NaN();
  int from = -1, to = -1;
};

PairRange largest_range(const std::vector<Tensor>& tensors, HotSpotDefinition definition, const ToeFrame& frame,
                        const DefinitionOptions& options) {
  PairRange best;
  for (std::size_t i = 0; i < tensors.size(); ++i)
    for (std::size_t j = i + 1; j < tensors.size(); ++j) {
      const HotSpotRange r = evaluate_range(definition, tensors[i], tensors[j], frame, options);
      if (!r.range.valid) continue;
      if (best.from < 0 || std::abs(r.range.value) > best.value) {
        best.value = std::abs(r.range.value);
        best.from = static_cast<int>(i);
        best.to = static_cast<int>(j);
      }
    }
  return best;
}

std::string depth_text(double depth) {
  std::ostringstream os;
  os.precision(4);
  os << depth;
  return os.str();
}

void fill_values(const ThicknessStation& s, const ToeFrame& frame, HotSpotDefinition definition,
                 const DefinitionOptions& options, LoadingKind kind, ThroughThicknessResult& out) {
  const Vec3& n = frame.readout;
  std::vector<Tensor> structural, one_mm;
  for (const LinearizedTensor& t : s.steps) {
    out.membrane.push_back(normal_stress(t.membrane, n));
    out.bending.push_back(normal_stress(t.bending, n));
    out.structural.push_back(normal_stress(t.structural, n));
    out.peak.push_back(normal_stress(t.peak, n));
    out.hot_spot.push_back(evaluate(definition, t.structural, frame, options).value);
    structural.push_back(t.structural);
    if (t.one_mm_below) {
      out.one_mm.push_back(evaluate(definition, *t.one_mm_below, frame, options).value);
      one_mm.push_back(*t.one_mm_below);
    }
  }
  if (kind == LoadingKind::unit_cases) return;
  const PairRange range = largest_range(structural, definition, frame, options);
  out.structural_range = range.value;
  out.range_from = range.from;
  out.range_to = range.to;
  if (!one_mm.empty()) out.one_mm_range = largest_range(one_mm, definition, frame, options).value;
}

}  // namespace

ThicknessToe prepare_through_thickness(const ModelGeometry& g, const ToePlan& toe, const WeldSide& weld,
                                       const PlacedToe& placed) {
  ThicknessToe out;
  if (!toe.through_thickness) return out;
  out.plan = *toe.through_thickness;
  out.thickness = toe.thickness;
  const std::vector<double> x = linearization_stations(toe.thickness, out.plan.points, out.plan.rule);
  for (const PlacedStation& s : placed.stations) {
    ThicknessStation station;
    station.x = x;
    if (frame_usable(s.result)) {
      station.line = place_thickness_line(g.locator, weld, s.result.station.x, s.result.station.frame.normal,
                                          toe.thickness, x, kLineTolerance * toe.thickness);
    } else {
      station.line.problem = "the station has no frame, so no line through the thickness";
    }
    out.stations.push_back(std::move(station));
  }
  return out;
}

void record_through_thickness_step(ThicknessToe& toe, const StressField& field) {
  for (ThicknessStation& s : toe.stations) {
    if (!s.line.problem.empty()) continue;
    std::vector<Tensor> samples;
    for (const Host& h : s.line.hosts) samples.push_back(interpolate(field, h));
    try {
      s.steps.push_back(linearize(s.x, samples, toe.thickness, toe.plan.rule));
    } catch (const Error& e) {  // e.g. a sample that is not finite: the station's linearization only is void
      s.line.problem = std::string("the linearization failed at load step ") + std::to_string(s.steps.size() + 1) +
                       ": " + e.what();
      s.steps.clear();
    }
  }
}

void evaluate_through_thickness(const ThicknessToe& toe, PlacedToe& placed, HotSpotDefinition definition,
                                const DefinitionOptions& options, LoadingKind kind) {
  for (std::size_t i = 0; i < toe.stations.size() && i < placed.stations.size(); ++i) {
    const ThicknessStation& s = toe.stations[i];
    StationResult& r = placed.stations[i].result;
    ThroughThicknessResult out;
    out.rule = to_string(toe.plan.rule);
    out.points = toe.plan.points;
    out.thickness = toe.thickness;
    out.problem = s.line.problem;
    out.note = s.line.note;
    if (s.line.stop_depth >= 0) out.stop_depth = s.line.stop_depth;
    if (out.ok()) {
      fill_values(s, r.station.frame, definition, options, kind, out);
    } else if (frame_usable(r)) {
      r.notes.push_back("through-thickness linearization: " + out.problem + " (t = " + depth_text(toe.thickness) +
                        " mm), so this station has no linearized value; the surface result stands");
    }
    if (!out.note.empty()) r.notes.push_back("through-thickness linearization: " + out.note);
    r.through_thickness = std::move(out);
  }
}

}  // namespace toehold::detail
