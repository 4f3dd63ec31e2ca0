#include "support/grid.hpp"

#include <vtkCellData.h>
#include <vtkCellType.h>
#include <vtkDoubleArray.h>
#include <vtkGenericCell.h>
#include <vtkHexahedron.h>
#include <vtkIdList.h>
#include <vtkIntArray.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkTetra.h>
#include <vtkWedge.h>

#include <algorithm>
#include <array>
#include <random>
#include <stdexcept>
#include <unordered_map>
#include <vector>

namespace toehold::test {
namespace {

struct Kind {
  int vtk_type;    // the cell written
  int linear;      // the linear cell with the same corners
  int nodes;       // nodes per cell
  int corners;     // corner nodes per cell
};

Kind kind_of(GridCell cell) {
  switch (cell) {
    case GridCell::hex8: return {VTK_HEXAHEDRON, VTK_HEXAHEDRON, 8, 8};
    case GridCell::hex20: return {VTK_QUADRATIC_HEXAHEDRON, VTK_HEXAHEDRON, 20, 8};
    case GridCell::hex27: return {VTK_TRIQUADRATIC_HEXAHEDRON, VTK_HEXAHEDRON, 27, 8};
    case GridCell::tet4: return {VTK_TETRA, VTK_TETRA, 4, 4};
    case GridCell::tet10: return {VTK_QUADRATIC_TETRA, VTK_TETRA, 10, 4};
    case GridCell::wedge6: return {VTK_WEDGE, VTK_WEDGE, 6, 6};
    case GridCell::wedge15: return {VTK_QUADRATIC_WEDGE, VTK_WEDGE, 15, 6};
    case GridCell::lagrange_tet10: return {VTK_LAGRANGE_TETRAHEDRON, VTK_TETRA, 10, 4};
    case GridCell::lagrange_hex27: return {VTK_LAGRANGE_HEXAHEDRON, VTK_HEXAHEDRON, 27, 8};
  }
  throw std::invalid_argument("unknown GridCell");
}

using Corners = std::vector<int>;  // brick-local corner numbers (VTK hexahedron order)

std::vector<Corners> brick_cells(const GridSpec& spec, int i, int j, int k) {
  const Kind kind = kind_of(spec.cell);
  if (kind.linear == VTK_HEXAHEDRON) return {{0, 1, 2, 3, 4, 5, 6, 7}};
  if (kind.linear == VTK_WEDGE) return {{0, 1, 2, 4, 5, 6}, {0, 2, 3, 4, 6, 7}};
  if (spec.tets == TetSplit::six)
    return {{0, 1, 2, 6}, {0, 2, 3, 6}, {0, 3, 7, 6}, {0, 7, 4, 6}, {0, 4, 5, 6}, {0, 5, 1, 6}};
  if ((i + j + k) % 2 == 0) return {{0, 1, 3, 4}, {1, 2, 3, 6}, {1, 4, 5, 6}, {3, 4, 6, 7}, {1, 3, 4, 6}};
  return {{0, 1, 2, 5}, {0, 2, 3, 7}, {0, 4, 5, 7}, {2, 5, 6, 7}, {0, 2, 5, 7}};
}

// Parametric coordinates of the nodes of a cell type, as VTK defines them.
std::vector<std::array<double, 3>> node_pcoords(const Kind& kind) {
  auto probe = vtkSmartPointer<vtkUnstructuredGrid>::New();
  vtkNew<vtkPoints> points;
  std::vector<vtkIdType> ids(kind.nodes);
  for (int n = 0; n < kind.nodes; ++n) ids[n] = points->InsertNextPoint(n, 0.0, 0.0);
  probe->SetPoints(points);
  probe->InsertNextCell(kind.vtk_type, kind.nodes, ids.data());
  vtkNew<vtkGenericCell> cell;
  probe->GetCell(0, cell);
  const double* pc = cell->GetParametricCoords();
  std::vector<std::array<double, 3>> out(kind.nodes);
  for (int n = 0; n < kind.nodes; ++n) out[n] = {pc[3 * n], pc[3 * n + 1], pc[3 * n + 2]};
  return out;
}

// Weights of the corners of the linear cell at each node's parametric coordinates.
std::vector<std::vector<double>> corner_weights(const Kind& kind) {
  vtkSmartPointer<vtkCell> linear;
  if (kind.linear == VTK_HEXAHEDRON) linear = vtkSmartPointer<vtkHexahedron>::New();
  if (kind.linear == VTK_TETRA) linear = vtkSmartPointer<vtkTetra>::New();
  if (kind.linear == VTK_WEDGE) linear = vtkSmartPointer<vtkWedge>::New();
  std::vector<std::vector<double>> out;
  for (const auto& pc : node_pcoords(kind)) {
    std::vector<double> w(kind.corners);
    linear->InterpolateFunctions(pc.data(), w.data());
    out.push_back(w);
  }
  return out;
}

struct KeyHash {
  std::size_t operator()(const std::vector<long long>& key) const {
    std::size_t h = 1469598103934665603ull;
    for (long long v : key) h = (h ^ static_cast<std::size_t>(v)) * 1099511628211ull;
    return h;
  }
};

class Builder {
public:
  explicit Builder(const GridSpec& spec) : spec_(spec), kind_(kind_of(spec.cell)), weights_(corner_weights(kind_)),
                                           random_(spec.seed) {
    h_ = Vec3(spec.lx / spec.nx, spec.ly / spec.ny, spec.lz / spec.nz);
    make_lattice();
  }

  vtkSmartPointer<vtkUnstructuredGrid> build() {
    auto grid = vtkSmartPointer<vtkUnstructuredGrid>::New();
    std::vector<vtkIdType> nodes(kind_.nodes);
    for (int k = 0; k < spec_.nz; ++k)
      for (int j = 0; j < spec_.ny; ++j)
        for (int i = 0; i < spec_.nx; ++i)
          for (const Corners& local : brick_cells(spec_, i, j, k)) {
            cell_nodes(corner_ids(local, i, j, k), nodes);
            grid->InsertNextCell(kind_.vtk_type, kind_.nodes, nodes.data());
          }
    vtkNew<vtkPoints> points;
    points->SetDataTypeToDouble();
    for (const Vec3& x : actual_) points->InsertNextPoint(x.x(), x.y(), x.z());
    grid->SetPoints(points);
    return grid;
  }

private:
  long long lattice_id(int i, int j, int k) const {
    return i + static_cast<long long>(spec_.nx + 1) * (j + static_cast<long long>(spec_.ny + 1) * k);
  }

  Vec3 random_move(double fraction) {
    return fraction * Vec3(unit_(random_), unit_(random_), unit_(random_)).cwiseProduct(h_);
  }

  bool interior(const Vec3& x) const {
    const Vec3 size(spec_.lx, spec_.ly, spec_.lz);
    for (int a = 0; a < 3; ++a)
      if (x[a] < 1e-9 * size[a] || x[a] > size[a] * (1.0 - 1e-9)) return false;
    return true;
  }

  void make_lattice() {
    for (int k = 0; k <= spec_.nz; ++k)
      for (int j = 0; j <= spec_.ny; ++j)
        for (int i = 0; i <= spec_.nx; ++i) {
          const Vec3 x = Vec3(i, j, k).cwiseProduct(h_);
          const Vec3 move = random_move(spec_.jitter);
          regular_.push_back(x);
          actual_.push_back(interior(x) ? Vec3(x + move) : x);
        }
  }

  std::vector<long long> corner_ids(const Corners& local, int i, int j, int k) const {
    static constexpr int offset[8][3] = {{0, 0, 0}, {1, 0, 0}, {1, 1, 0}, {0, 1, 0},
                                         {0, 0, 1}, {1, 0, 1}, {1, 1, 1}, {0, 1, 1}};
    std::vector<long long> ids;
    for (int c : local) ids.push_back(lattice_id(i + offset[c][0], j + offset[c][1], k + offset[c][2]));
    if (ids.size() == 4 && signed_volume(ids) < 0.0) std::swap(ids[1], ids[2]);
    return ids;
  }

  double signed_volume(const std::vector<long long>& t) const {
    const Vec3& a = regular_[t[0]];
    return (regular_[t[1]] - a).cross(regular_[t[2]] - a).dot(regular_[t[3]] - a);
  }

  void cell_nodes(const std::vector<long long>& corners, std::vector<vtkIdType>& nodes) {
    for (int n = 0; n < kind_.nodes; ++n)
      nodes[n] = n < kind_.corners ? corners[n] : higher_order_node(corners, weights_[n]);
  }

  // The shared node at the given corner weights (mid-edge, face or body centre), created on first use.
  long long higher_order_node(const std::vector<long long>& corners, const std::vector<double>& w) {
    std::vector<long long> key;
    Vec3 regular = Vec3::Zero(), actual = Vec3::Zero();
    for (int c = 0; c < kind_.corners; ++c) {
      if (std::abs(w[c]) < 1e-12) continue;
      key.push_back(corners[c]);
      regular += w[c] * regular_[corners[c]];
      actual += w[c] * actual_[corners[c]];
    }
    std::sort(key.begin(), key.end());
    const auto found = shared_.find(key);
    if (found != shared_.end()) return found->second;
    const Vec3 move = random_move(spec_.curve);
    if (interior(regular)) actual += move;
    regular_.push_back(regular);
    actual_.push_back(actual);
    const long long id = static_cast<long long>(actual_.size()) - 1;
    shared_.emplace(std::move(key), id);
    return id;
  }

  GridSpec spec_;
  Kind kind_;
  std::vector<std::vector<double>> weights_;
  std::mt19937 random_;
  std::uniform_real_distribution<double> unit_{-1.0, 1.0};
  Vec3 h_;
  std::vector<Vec3> regular_, actual_;
  std::unordered_map<std::vector<long long>, long long, KeyHash> shared_;
};

vtkSmartPointer<vtkDoubleArray> stress_array(const std::string& name, vtkIdType count) {
  auto array = vtkSmartPointer<vtkDoubleArray>::New();
  array->SetName(name.c_str());
  array->SetNumberOfComponents(6);
  const char* names[6] = {"XX", "YY", "ZZ", "XY", "YZ", "XZ"};
  for (int c = 0; c < 6; ++c) array->SetComponentName(c, names[c]);
  array->SetNumberOfTuples(count);
  return array;
}

vtkSmartPointer<vtkIntArray> int_array(const std::string& name, vtkIdType count) {
  auto array = vtkSmartPointer<vtkIntArray>::New();
  array->SetName(name.c_str());
  array->SetNumberOfTuples(count);
  return array;
}

}  // namespace

std::string to_string(GridCell cell) {
  switch (cell) {
    case GridCell::hex8: return "hex8";
    case GridCell::hex20: return "hex20";
    case GridCell::hex27: return "hex27";
    case GridCell::tet4: return "tet4";
    case GridCell::tet10: return "tet10";
    case GridCell::wedge6: return "wedge6";
    case GridCell::wedge15: return "wedge15";
    case GridCell::lagrange_tet10: return "lagrange_tet10";
    case GridCell::lagrange_hex27: return "lagrange_hex27";
  }
  return "unknown";
}

vtkSmartPointer<vtkUnstructuredGrid> make_box_grid(const GridSpec& spec) {
  if (spec.nx < 1 || spec.ny < 1 || spec.nz < 1 || !(spec.lx > 0 && spec.ly > 0 && spec.lz > 0))
    throw std::invalid_argument("make_box_grid: sizes and counts must be positive");
  return Builder(spec).build();
}

Vec3 grid_point(vtkUnstructuredGrid* grid, long long p) {
  double x[3];
  grid->GetPoint(p, x);
  return {x[0], x[1], x[2]};
}

Vec3 cell_centroid(vtkUnstructuredGrid* grid, long long cell) {
  vtkNew<vtkIdList> ids;
  grid->GetCellPoints(cell, ids);
  Vec3 sum = Vec3::Zero();
  for (vtkIdType n = 0; n < ids->GetNumberOfIds(); ++n) sum += grid_point(grid, ids->GetId(n));
  return sum / static_cast<double>(ids->GetNumberOfIds());
}

void add_point_stress(vtkUnstructuredGrid* grid, const std::string& name, const StressFunction& f) {
  auto array = stress_array(name, grid->GetNumberOfPoints());
  for (vtkIdType p = 0; p < grid->GetNumberOfPoints(); ++p) array->SetTypedTuple(p, f(grid_point(grid, p)).data());
  grid->GetPointData()->AddArray(array);
}

void add_cell_stress(vtkUnstructuredGrid* grid, const std::string& name, const StressFunction& f) {
  auto array = stress_array(name, grid->GetNumberOfCells());
  for (vtkIdType c = 0; c < grid->GetNumberOfCells(); ++c) array->SetTypedTuple(c, f(cell_centroid(grid, c)).data());
  grid->GetCellData()->AddArray(array);
}

void add_point_ints(vtkUnstructuredGrid* grid, const std::string& name, const IntFunction& f) {
  auto array = int_array(name, grid->GetNumberOfPoints());
  for (vtkIdType p = 0; p < grid->GetNumberOfPoints(); ++p) array->SetValue(p, f(grid_point(grid, p)));
  grid->GetPointData()->AddArray(array);
}

void add_cell_regions(vtkUnstructuredGrid* grid, const std::string& name, const IntFunction& f) {
  auto array = int_array(name, grid->GetNumberOfCells());
  for (vtkIdType c = 0; c < grid->GetNumberOfCells(); ++c) array->SetValue(c, f(cell_centroid(grid, c)));
  grid->GetCellData()->AddArray(array);
}

void move_grid(vtkUnstructuredGrid* grid, const Eigen::Matrix3d& rotation, const Vec3& translation) {
  vtkPoints* points = grid->GetPoints();
  for (vtkIdType p = 0; p < points->GetNumberOfPoints(); ++p) {
    const Vec3 x = rotation * grid_point(grid, p) + translation;
    points->SetPoint(p, x.x(), x.y(), x.z());
  }
  points->Modified();
  grid->Modified();
}

Mesh mesh_of(vtkSmartPointer<vtkUnstructuredGrid> grid) { return Mesh(std::move(grid), "test grid", LengthUnit::mm); }

}  // namespace toehold::test
