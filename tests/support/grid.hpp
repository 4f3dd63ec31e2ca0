// Test meshes built in memory: a box [0,lx]x[0,ly]x[0,lz] (mm) cut into nx*ny*nz bricks, each brick one hex or
// split into conforming tets or wedges, linear, quadratic or Lagrange; with analytic stress, marker and region
// arrays attached from functions, optional distortion of interior nodes and a rigid motion of the whole grid.
#pragma once

#include "toehold/common/tensor.hpp"
#include "toehold/model/mesh.hpp"

#include <vtkSmartPointer.h>
#include <vtkUnstructuredGrid.h>

#include <functional>
#include <string>

namespace toehold::test {

// The cells a box is meshed with. Higher-order nodes sit at mid-edges (and face/body centres), shared between
// neighbouring cells.
enum class GridCell {
  hex8,            // VTK_HEXAHEDRON, one per brick
  hex20,           // VTK_QUADRATIC_HEXAHEDRON
  hex27,           // VTK_TRIQUADRATIC_HEXAHEDRON
  tet4,            // VTK_TETRA, 6 or 5 per brick (see TetSplit)
  tet10,           // VTK_QUADRATIC_TETRA
  wedge6,          // VTK_WEDGE, 2 per brick (split along the brick's bottom diagonal 0-2, extruded in z)
  wedge15,         // VTK_QUADRATIC_WEDGE
  lagrange_tet10,  // VTK_LAGRANGE_TETRAHEDRON with 10 nodes
  lagrange_hex27,  // VTK_LAGRANGE_HEXAHEDRON with 27 nodes
};

// The enumerator's name ("hex20", "lagrange_tet10", ...), for test names and messages.
std::string to_string(GridCell cell);

// How a brick is cut into tetrahedra; both are conforming across bricks.
enum class TetSplit {
  six,   // six tets around the brick diagonal 0-6
  five,  // one central tet and four corner tets, mirrored in a checkerboard
};

struct GridSpec {
  double lx = 1.0, ly = 1.0, lz = 1.0;  // box edge lengths, mm
  int nx = 1, ny = 1, nz = 1;           // bricks along x, y, z
  GridCell cell = GridCell::hex8;
  TetSplit tets = TetSplit::six;
  // Random move of interior brick corners, as a fraction of the brick size along each axis (keep below ~0.2).
  // Higher-order nodes follow at mid-edges, so edges stay straight. Boundary nodes never move.
  double jitter = 0.0;
  // Random move of interior higher-order nodes off their straight position, fraction of the brick size:
  // curves the cell edges (the geometric map is no longer affine or multilinear).
  double curve = 0.0;
  unsigned seed = 1;  // of the pseudo-random distortion
};

// The grid described by `spec`; throws std::invalid_argument for non-positive sizes or counts.
vtkSmartPointer<vtkUnstructuredGrid> make_box_grid(const GridSpec& spec);

// Stress as a function of position: Voigt order xx, yy, zz, xy, yz, xz in MPa, position in mm.
using StressFunction = std::function<Voigt(const Vec3&)>;
// Integer marker as a function of position (mm).
using IntFunction = std::function<int(const Vec3&)>;

// Adds a 6-component Float64 point array `name` (components named XX YY ZZ XY YZ XZ) with f at every point.
void add_point_stress(vtkUnstructuredGrid* grid, const std::string& name, const StressFunction& f);
// Adds a 6-component Float64 cell array `name` (components XX YY ZZ XY YZ XZ) with f at every cell centroid.
void add_cell_stress(vtkUnstructuredGrid* grid, const std::string& name, const StressFunction& f);
// Adds an Int32 point array `name` with f at every point.
void add_point_ints(vtkUnstructuredGrid* grid, const std::string& name, const IntFunction& f);
// Adds an Int32 cell array `name` (a region marker) with f at every cell centroid.
void add_cell_regions(vtkUnstructuredGrid* grid, const std::string& name, const IntFunction& f);

// Moves every point to rotation * x + translation (mm). Arrays are left alone: rotating tensors is the caller's.
void move_grid(vtkUnstructuredGrid* grid, const Eigen::Matrix3d& rotation, const Vec3& translation);

// Mean of the points of cell `cell` (mm).
Vec3 cell_centroid(vtkUnstructuredGrid* grid, long long cell);

// Position of point `p` (mm).
Vec3 grid_point(vtkUnstructuredGrid* grid, long long p);

// The grid as a toehold Mesh in mm, source "test grid".
Mesh mesh_of(vtkSmartPointer<vtkUnstructuredGrid> grid);

}  // namespace toehold::test
