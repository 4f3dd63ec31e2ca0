#include "internal.hpp"

#include "toehold/common/error.hpp"

#include <vtkDataArraySelection.h>
#include <vtkNew.h>
#include <vtkObject.h>
#include <vtkXMLUnstructuredGridReader.h>

#include <filesystem>

namespace toehold::detail {

namespace {

// Reads only the stress arrays of a step's .vtu. Returns an empty grid unless the file holds exactly the
// geometry's points and cells (then read_mesh would drop and renumber nothing, so ids match the geometry);
// the caller falls back on read_mesh, which also gives the proper error for a bad file.
vtkSmartPointer<vtkUnstructuredGrid> read_stress_only(const std::string& file, const StressSpec& spec,
                                                      const Mesh& geometry) {
  if (std::filesystem::path(file).extension() != ".vtu") return nullptr;
  vtkNew<vtkXMLUnstructuredGridReader> reader;
  reader->SetFileName(file.c_str());
  reader->UpdateInformation();
  for (vtkDataArraySelection* selection : {reader->GetPointDataArraySelection(), reader->GetCellDataArraySelection()}) {
    selection->DisableAllArrays();
    if (!spec.array.empty()) selection->EnableArray(spec.array.c_str());
    for (const std::string& name : spec.component_arrays)
      if (!name.empty()) selection->EnableArray(name.c_str());
  }
  const int warnings = vtkObject::GetGlobalWarningDisplay();
  vtkObject::GlobalWarningDisplayOff();
  reader->Update();
  vtkObject::SetGlobalWarningDisplay(warnings);
  vtkUnstructuredGrid* grid = reader->GetOutput();
  if (reader->GetErrorCode() != 0 || grid == nullptr ||
      grid->GetNumberOfPoints() != geometry.grid()->GetNumberOfPoints() ||
      grid->GetNumberOfCells() != geometry.grid()->GetNumberOfCells())
    return nullptr;
  return grid;
}

}  // namespace

std::pair<std::string, int> geometry_source(const Plan& plan) {
  for (const StepPlan& step : plan.steps)
    if (!step.unloaded) return {step.file, step.step};
  return {plan.model.file, -1};
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
  const std::string data_file = resolve_series_file(step.file, step.step);
  if (auto grid = read_stress_only(data_file, step.stress, geometry_)) {
    files_.push_back(data_file);
    meshes_.clear();
    return meshes_.emplace(key, Mesh(grid, data_file, plan_.model.length_unit)).first->second;
  }
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
  if (step.unloaded)
    return StressField(Association::cell,
                       std::vector<double>(6 * static_cast<std::size_t>(geometry_.grid()->GetNumberOfCells()), 0.0));
  const Mesh& mesh = mesh_for(step);  // its errors name the step already
  try {
    return read_stress(mesh, step.stress, plan_.model.stress_unit);
  } catch (const Error& e) {
    throw Error("load step '" + step.name + "': " + e.what());
  }
}

}  // namespace toehold::detail
