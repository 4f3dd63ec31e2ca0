#include "internal.hpp"

#include "toehold/common/error.hpp"
#include "toehold/model/vtu_array_reader.hpp"

#include <vtkCellData.h>
#include <vtkDataArraySelection.h>
#include <vtkNew.h>
#include <vtkObject.h>
#include <vtkPointData.h>
#include <vtkXMLUnstructuredGridReader.h>

#include <filesystem>
#include <optional>

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

// The array names `spec` refers to: the tensor array, or the six component arrays.
std::vector<std::string> stress_names(const StressSpec& spec) {
  if (!spec.array.empty()) return {spec.array};
  std::vector<std::string> names;
  for (const std::string& name : spec.component_arrays)
    if (!name.empty()) names.push_back(name);
  return names;
}

// True when `mesh` holds every array `spec` names (a mesh read for another step's arrays may not).
bool has_arrays(const Mesh& mesh, const StressSpec& spec) {
  for (const std::string& name : stress_names(spec))
    if (!mesh.grid()->GetPointData()->GetArray(name.c_str()) && !mesh.grid()->GetCellData()->GetArray(name.c_str()))
      return false;
  return true;
}

// The stress of a step read straight from the stress array(s) of an uncompressed raw appended .vtu holding
// exactly the geometry's points and cells (see read_vtu_arrays), converted by the same code as read_stress;
// nullopt when the file is not such a file, and the caller reads it with VTK.
std::optional<StressField> read_direct(const std::string& file, const StressSpec& spec, const Mesh& geometry,
                                       StressUnit unit, const StressSubsets& only) {
  if (std::filesystem::path(file).extension() != ".vtu") return std::nullopt;
  const auto arrays = read_vtu_arrays(file, stress_names(spec), geometry.grid()->GetNumberOfPoints(),
                                      geometry.grid()->GetNumberOfCells());
  if (!arrays) return std::nullopt;
  std::vector<StressArrayView> views;
  for (const VtuArray& a : *arrays) views.push_back(stress_view(a));
  return read_stress(file, views, spec, unit, only);
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
  if (found != meshes_.end() && has_arrays(found->second, step.stress)) return found->second;
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
  const auto key = std::make_pair(step.file, step.step);
  const auto cached = meshes_.find(key);
  if (key != geometry_source(plan_) && (cached == meshes_.end() || !has_arrays(cached->second, step.stress))) {
    const std::string data_file = resolve_series_file(step.file, step.step);
    try {
      if (std::optional<StressField> direct =
              read_direct(data_file, step.stress, geometry_, plan_.model.stress_unit, only_)) {
        files_.push_back(data_file);
        return std::move(*direct);
      }
    } catch (const Error& e) {
      throw Error("load step '" + step.name + "': " + e.what());
    }
  }
  const Mesh& mesh = mesh_for(step);  // its errors name the step already
  try {
    return read_stress(mesh, step.stress, plan_.model.stress_unit, only_);
  } catch (const Error& e) {
    throw Error("load step '" + step.name + "': " + e.what());
  }
}

}  // namespace toehold::detail
