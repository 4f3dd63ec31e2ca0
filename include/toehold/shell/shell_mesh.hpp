// A shell (mid-surface) model: linear and quadratic triangles and
// quadrilaterals with their points in mm, a thickness per cell and a unit
// normal per cell from the node order. The layer stresses live in the arrays of
// grid() (see shell_layers.hpp); the shell cells are also offered as a Mesh so
// read_stress applies to them.
#pragma once

#include "toehold/common/reporter.hpp"
#include "toehold/common/tensor.hpp"
#include "toehold/common/units.hpp"
#include "toehold/model/mesh.hpp"

#include <vtkSmartPointer.h>
#include <vtkUnstructuredGrid.h>

#include <string>
#include <vector>

namespace toehold {

// Where the plate thickness comes from: exactly one of the two.
struct ShellThickness {
  double plan_mm = 0.0; // one thickness for every cell, mm (0 when not given)
  std::string array;    // name of a 1-component cell-data array, in the model's
                        // length unit ("" when not given)
};

class ShellMesh {
public:
  ShellMesh() = default;
  // `mesh`: shell cells only, points in mm (make_shell_mesh makes such meshes).
  // thickness_mm: one per cell, > 0.
  ShellMesh(Mesh mesh, std::vector<double> thickness_mm);

  // The shell cells as a Mesh: points (double, mm) and point data as in the
  // file, cell data of the kept cells.
  const Mesh &mesh() const { return mesh_; }
  vtkUnstructuredGrid *grid() const { return mesh_.grid(); }
  const std::string &source() const { return mesh_.source(); }
  long long cell_count() const {
    return static_cast<long long>(thickness_.size());
  }
  // Plate thickness of `cell`, mm.
  double thickness(long long cell) const {
    return thickness_[static_cast<std::size_t>(cell)];
  }
  // Unit normal of `cell` at its parametric centre, by the right-hand rule on
  // its node order (the "top" side).
  const Vec3 &normal(long long cell) const {
    return normals_[static_cast<std::size_t>(cell)];
  }
  // Position of point p, mm.
  Vec3 point(long long p) const;

private:
  Mesh mesh_;
  std::vector<double> thickness_;
  std::vector<Vec3> normals_;
};

// True for the shell cell types toehold reads: VTK 5 and 9 (linear), 22, 23 and
// 28 (quadratic), 69 with 3 or 6 nodes and 70 with 4 or 9 nodes (Lagrange of
// order 1 or 2).
bool is_shell_cell(int vtk_type, long long node_count);

// Keeps the shell cells of `grid` (cells of dimension 0 and 1, and cells whose
// vtkGhostType is not 0, are left out), scales the points to mm (double) and
// sets the thickness. Point ids stay as in `grid`. Throws Error naming `source`
// and the cell for a 2D cell of another type (polygon, pixel, biquadratic
// triangle, higher-order Lagrange), a 3D cell (solid and shell models are read
// separately), no shell cell at all, a zero-area cell; and naming the array for
// a missing, multi-component or non-positive thickness array; and when neither
// or both thickness sources are given.
ShellMesh make_shell_mesh(vtkUnstructuredGrid *grid, const std::string &source,
                          LengthUnit length, const ShellThickness &thickness);

// Reads a .vtu, legacy .vtk or a .pvd step (see resolve_series_file) holding a
// shell model and calls make_shell_mesh. Throws Error naming the file when it
// is missing, unreadable or not an unstructured grid, and for a .pvtu (write
// the shell model as one .vtu). Reports what was left out through `reporter`.
ShellMesh read_shell_mesh(const std::string &path, int step, LengthUnit length,
                          const ShellThickness &thickness, Reporter &reporter);

} // namespace toehold
