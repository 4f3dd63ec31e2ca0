#include "nominal_step.hpp"

namespace toehold::detail {

void prepare_nominal(const Plan&, const ModelGeometry&, PlacedToe&) {}

void record_nominal_step(PlacedToe&, const StressField&) {}

void evaluate_nominal(const Plan&, PlacedToe&, const std::optional<LoadHistory>&) {}

}  // namespace toehold::detail
