// The through-thickness linearization of solid toes inside the assessment (private to src/assess): the line through
// the plate at each station is located once, every load step's stress is sampled on it and linearized, and the
// toe's hot-spot definition is applied to the structural and the 1-mm tensors beside the surface extrapolation.
#pragma once

#include "internal.hpp"
#include "toehold/hotspot/linearization.hpp"
#include "toehold/toe/thickness_line.hpp"

namespace toehold::detail {

// One station's line and its linearized tensors per load step.
struct ThicknessStation {
  ThicknessLine line;
  std::vector<double> x;                // the rule's sample positions, mm below the toe surface
  std::vector<LinearizedTensor> steps;  // per load step, when the line is usable
};

// The linearization of one toe; `stations` runs parallel to PlacedToe::stations (empty when the toe asks for none).
struct ThicknessToe {
  ThroughThicknessPlan plan;
  double thickness = 0.0;  // mm
  std::vector<ThicknessStation> stations;
};

// Locates the line of every station of `placed` whose frame is set up: from the station point along
// -frame.normal over the toe's t. Nothing when the toe has no through_thickness.
ThicknessToe prepare_through_thickness(const ModelGeometry& geometry, const ToePlan& toe, const WeldSide& weld,
                                       const PlacedToe& placed);

// Samples and linearizes one load step (unit case) on every usable line.
void record_through_thickness_step(ThicknessToe& toe, const StressField& field);

// Fills StationResult::through_thickness of every station of `placed` (after the surface route has evaluated it,
// so that the notes added here stay): per-step values, the ranges (not for unit-cases), the line's problem.
void evaluate_through_thickness(const ThicknessToe& toe, PlacedToe& placed, HotSpotDefinition definition,
                                const DefinitionOptions& options, LoadingKind kind);

}  // namespace toehold::detail
