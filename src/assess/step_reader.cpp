#include "internal.hpp"

#include "toehold/common/error.hpp"

namespace toehold::detail {

std::pair<std::string, int> geometry_source(const Plan& plan) {
  if (plan.steps.empty()) return {plan.model.file, -1};
  return {plan.steps.front().file, plan.steps.front().step};
}

StepReader::StepReader(const Plan& plan, const Mesh& geometry, Reporter& reporter)
    : plan_(plan), geometry_(geometry), reporter_(reporter) {
  files_.push_back(geometry.source());
}

const Mesh& StepReader::mesh_for(const StepPlan& step) {
  const auto key = std::make_pair(step.file, step.step);
  if (key == geometry_source(plan_)) return geometry_;
  auto found = meshes_.find(key);
  if (found != meshes_.end()) return found->second;
  Mesh mesh = read_mesh(step.file, step.step, plan_.model.length_unit, reporter_);
  const auto points = mesh.grid()->GetNumberOfPoints(), cells = mesh.grid()->GetNumberOfCells();
  if (points != geometry_.grid()->GetNumberOfPoints() || cells != geometry_.grid()->GetNumberOfCells())
    throw Error("load step '" + step.name + "': " + mesh.source() + " has " + std::to_string(points) + " points and " +
                std::to_string(cells) + " volume cells, the model (" + geometry_.source() + ") has " +
                std::to_string(geometry_.grid()->GetNumberOfPoints()) + " and " +
                std::to_string(geometry_.grid()->GetNumberOfCells()) +
                "; every load step must be on the same mesh");
  files_.push_back(mesh.source());
  // Keep only the latest extra mesh: steps are read in order, and a series may have many files.
  meshes_.clear();
  return meshes_.emplace(key, std::move(mesh)).first->second;
}

StressField StepReader::read(std::size_t index) {
  const StepPlan& step = plan_.steps[index];
  try {
    return read_stress(mesh_for(step), step.stress, plan_.model.stress_unit);
  } catch (const Error& e) {
    throw Error("load step '" + step.name + "': " + e.what());
  }
}

}  // namespace toehold::detail
