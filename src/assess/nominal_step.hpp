// The nominal-stress method of a toe inside the assessment (private to src/assess): set up once the toe is placed,
// fed every load step's stress field, evaluated once the hot-spot results are in.
#pragma once

#include "internal.hpp"

#include <optional>

namespace toehold::detail {

// What one toe's nominal check keeps between the steps (cut cells, sample hosts, values per step, ...).
struct NominalToeState {};

// After place_toe: locates what the toe's [toe.nominal] source needs in the model. No-op without [toe.nominal].
void prepare_nominal(const Plan& plan, const ModelGeometry& geometry, PlacedToe& toe);

// Per load step (unit case), after the stations have recorded the step.
void record_nominal_step(PlacedToe& toe, const StressField& field);

// After the stations have been evaluated: the nominal range, its check, and the side-by-side comparison.
void evaluate_nominal(const Plan& plan, PlacedToe& toe, const std::optional<LoadHistory>& history);

}  // namespace toehold::detail
