// Shell models inside the assessment (private to src/assess): the shell geometry, toes traced on plate intersection
// lines and placed as the same PlacedToe / PlacedStation the solid path makes (so read-out, extrapolation,
// definitions, loading kinds and outputs apply unchanged), and the load steps' layer stresses.
#pragma once

#include "internal.hpp"
#include "toehold/shell/shell_layers.hpp"
#include "toehold/shell/shell_mesh.hpp"
#include "toehold/shell/shell_surface.hpp"

#include <map>
#include <memory>

namespace toehold::detail {

// The shell model every toe is built on. Not movable: the surface refers to the mesh.
struct ShellGeometry {
  ShellMesh shells;
  ShellSurface surface;
  explicit ShellGeometry(ShellMesh s) : shells(std::move(s)), surface(shells) {}
  ShellGeometry(const ShellGeometry&) = delete;
  ShellGeometry& operator=(const ShellGeometry&) = delete;
};

// Reads the geometry (first load step's file) with the plan's thickness.
std::unique_ptr<ShellGeometry> read_shell_geometry(const Plan& plan, Reporter& reporter);

// A placed shell toe and the layer each of its stations reads (parallel to PlacedToe::stations).
struct PlacedShellToe {
  PlacedToe toe;
  std::vector<ShellLayer> layers;
};

// Traces the toe on the intersection line, sets up its stations and read-out points (distances from the scheme
// with each station's own plate thickness), as PlacedToe with StationResult::shell filled.
PlacedShellToe place_shell_toe(const ShellGeometry& geometry, const ToePlan& toe, const std::string& region_array,
                               Reporter& reporter);

// Reads the load steps' layer stresses one by one, reusing meshes already read.
class ShellStepReader {
 public:
  ShellStepReader(const Plan& plan, const ShellMesh& geometry, Reporter& reporter);
  ShellLayerStress read(std::size_t step);
  const std::vector<std::string>& files() const { return files_; }

 private:
  const ShellMesh& mesh_for(const StepPlan& step);
  const Plan& plan_;
  const ShellMesh& geometry_;
  Reporter& reporter_;
  std::map<std::pair<std::string, int>, ShellMesh> meshes_;
  std::vector<std::string> files_;
};

}  // namespace toehold::detail
