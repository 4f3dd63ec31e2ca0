// A finite-element model read from an open VTK file: the volume cells and their points in mm, with the
// arrays the file carries. Cleaning of solver quirks (repeated .pvtu pieces, ghost cells, boundary faces mixed
// with volume cells, Float32 points) happens here, once, so no later layer sees them.
#pragma once

#include "toehold/common/reporter.hpp"
#include "toehold/common/units.hpp"

#include <vtkSmartPointer.h>
#include <vtkUnstructuredGrid.h>

#include <string>
#include <vector>

namespace toehold {

class Mesh {
public:
  Mesh() = default;
  // Takes `grid` as it is: already cleaned, points in mm (read_mesh makes such grids; nothing is converted here).
  Mesh(vtkSmartPointer<vtkUnstructuredGrid> grid, std::string source, LengthUnit length);

  // Volume cells only (dimension 3), points as double in mm; point and cell arrays as read (not converted).
  vtkUnstructuredGrid* grid() const { return grid_.Get(); }
  // The file the mesh came from, as the user named it (for messages).
  const std::string& source() const { return source_; }
  // The length unit the file was declared in.
  LengthUnit length_unit() const { return length_; }

private:
  vtkSmartPointer<vtkUnstructuredGrid> grid_;
  std::string source_;
  LengthUnit length_ = LengthUnit::mm;
};

// One entry of a .pvd collection: a time step (or part) and the file it points to.
struct SeriesEntry {
  double time = 0.0;  // the "timestep" attribute, in the solver's own time unit
  int part = 0;       // the "part" attribute, 0 when absent
  std::string file;   // path of the referenced file, resolved against the .pvd's folder
};

// Entries of a .pvd file in file order. Throws Error naming the file when it is missing or not a collection.
std::vector<SeriesEntry> read_pvd(const std::string& path);

// The data file behind `path`: `path` itself, or for a .pvd the file of time step `step` (0-based; -1 means
// "the .pvd has exactly one step"). Throws Error naming the .pvd and the step when it does not exist.
std::string resolve_series_file(const std::string& path, int step);

// Reads .vtu, .pvtu, legacy .vtk (unstructured grid) or a .pvd step (see resolve_series_file) and cleans it:
// drops cells of dimension < 3, cells with vtkGhostType != 0, pieces a .pvtu lists more than once; merges
// coincident points of different pieces; converts points to double mm. Throws Error naming the file for a
// missing, unreadable, truncated or non-unstructured file, or one with no volume cells.
Mesh read_mesh(const std::string& path, int step, LengthUnit length, Reporter& reporter);

}  // namespace toehold
