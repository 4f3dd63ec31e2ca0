// Finds the volume cell that holds a point and the cell's interpolation weights there, accurate to round-off
// on quadratic and Lagrange cells (VTK 9.1's own Newton iteration stops early; two more steps are taken here).
// Built once per mesh; the Host it returns is reused for every load step and load case.
#pragma once

#include "toehold/common/tensor.hpp"
#include "toehold/model/mesh.hpp"
#include "toehold/model/near_cells.hpp"
#include "toehold/model/stress_field.hpp"

#include <vtkSmartPointer.h>
#include <vtkStaticCellLocator.h>

#include <array>
#include <functional>
#include <optional>
#include <vector>

namespace toehold {

// A point located in a cell: its parametric coordinates and the weights of the cell's points.
struct Host {
  long long cell = -1;                // cell id in the mesh
  std::array<double, 3> pcoords{};    // parametric coordinates in that cell
  std::vector<long long> points;      // the cell's point ids, in VTK order
  std::vector<double> weights;        // shape-function values at pcoords, same order as points; sum to 1
  double distance = 0.0;              // mm from the query point to the cell (0 when inside)
};

class Locator {
public:
  // Over every cell of `mesh`, or with `near` over its cells only (points beyond their reach are then not
  // found). `near` is used during construction only; hosts always carry the mesh's own cell ids.
  explicit Locator(const Mesh& mesh, const NearCells* near = nullptr);

  // The cell holding x (mm). When x lies in no cell (faceted curved surfaces), the closest cell within
  // `tolerance` mm is taken, with its distance recorded. nullopt when no cell is that close.
  // Safe to call from several threads at once on one Locator (each call uses its own VTK cell).
  std::optional<Host> locate(const Vec3& x, double tolerance) const;

  // The same, never returning a cell for which `refuse(cell)` is true: at a point on the face between a refused
  // cell (say a weld cell) and an accepted one, the accepted one is taken with distance 0.
  using CellFilter = std::function<bool(long long)>;
  std::optional<Host> locate(const Vec3& x, double tolerance, const CellFilter& refuse) const;

private:
  vtkSmartPointer<vtkUnstructuredGrid> cells_;   // the mesh's grid, or a grid of the near cells on its points
  std::vector<long long> mesh_cell_;             // mesh cell id of each cell of cells_; empty: the same ids
  vtkSmartPointer<vtkStaticCellLocator> locator_;
  int max_cell_size_ = 0;  // most points in one cell, for weight buffers
};

// Stress at a located point: sum of weights times nodal tensors (point data) or the cell's tensor (cell data).
Tensor interpolate(const StressField& field, const Host& host);

}  // namespace toehold
