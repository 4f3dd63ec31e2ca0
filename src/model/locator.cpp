#include "toehold/model/locator.hpp"

#include "toehold/common/error.hpp"
#include "toehold/model/cell_types.hpp"

#include <Eigen/LU>
#include <vtkCellType.h>
#include <vtkGenericCell.h>
#include <vtkIdList.h>
#include <vtkNew.h>
#include <vtkPoints.h>
#include <vtkUnstructuredGrid.h>

#include <algorithm>
#include <array>
#include <bit>
#include <cmath>
#include <functional>
#include <string>

namespace toehold {
namespace {

constexpr int kMaxNewtonSteps = 10;
constexpr double kStepTolerance = 1e-12;    // parametric step below which Newton has converged (the next
                                            // error is of its square: round-off)
constexpr double kInsideSlack = 1e-10;      // parametric slack when deciding that a point is inside a cell
constexpr double kSingularJacobian = 1e-12; // |det J| relative to (cell size)^3 taken as singular

// Per-thread scratch reused across calls, so that concurrent locate() calls never share a VTK cell.
struct Scratch {
  vtkSmartPointer<vtkGenericCell> cell = vtkSmartPointer<vtkGenericCell>::New();
  vtkSmartPointer<vtkIdList> candidates = vtkSmartPointer<vtkIdList>::New();
  std::vector<double> weights;
  std::vector<double> derivs;
  std::vector<Vec3> nodes;
  double size = 0.0;  // bounding-box diagonal of the loaded cell, mm
};

Scratch& scratch(int max_cell_size) {
  thread_local Scratch s;
  const auto n = static_cast<std::size_t>(max_cell_size);
  if (s.weights.size() < n) {
    s.weights.resize(n);
    s.derivs.resize(3 * n);
  }
  return s;
}

// The parametric domain of a VTK cell: tetrahedra use the unit simplex, wedges a triangle times [0,1], and
// hexahedra and pyramids (whose VTK shape functions collapse the top of the unit cube) the unit cube.
enum class Domain { simplex, prism, cube };

Domain domain_of(int vtk_type) {
  const int corners = cell_type_info(vtk_type).corners;
  if (corners == 4) return Domain::simplex;
  if (corners == 6) return Domain::prism;
  return Domain::cube;
}

// Closest point of {p >= 0, p[0] + ... + p[n-1] <= 1} to p, for n = 2 or 3 coordinates.
void project_simplex(double* p, int n) {
  double clamped_sum = 0.0;
  for (int i = 0; i < n; ++i) clamped_sum += std::max(p[i], 0.0);
  if (clamped_sum <= 1.0) {
    for (int i = 0; i < n; ++i) p[i] = std::max(p[i], 0.0);
    return;
  }
  // The sum constraint is active: project onto {p >= 0, sum = 1} (sort-and-threshold algorithm).
  double u[3] = {p[0], p[1], n > 2 ? p[2] : 0.0};
  std::sort(u, u + n, std::greater<>());
  double running = 0.0, theta = 0.0;
  for (int j = 0; j < n; ++j) {
    running += u[j];
    const double t = (running - 1.0) / (j + 1);
    if (u[j] - t > 0.0) theta = t;
  }
  for (int i = 0; i < n; ++i) p[i] = std::max(p[i] - theta, 0.0);
}

void project(Domain domain, double pc[3]) {
  if (domain == Domain::simplex) return project_simplex(pc, 3);
  if (domain == Domain::prism) project_simplex(pc, 2);
  for (int i = domain == Domain::prism ? 2 : 0; i < 3; ++i) pc[i] = std::clamp(pc[i], 0.0, 1.0);
}

bool inside(Domain domain, const double pc[3]) {
  const double lo = -kInsideSlack, hi = 1.0 + kInsideSlack;
  const bool t_ok = pc[2] >= lo && pc[2] <= hi;
  if (domain == Domain::simplex) return pc[0] >= lo && pc[1] >= lo && t_ok && pc[0] + pc[1] + pc[2] <= hi;
  const bool rs_ok = domain == Domain::prism ? pc[0] >= lo && pc[1] >= lo && pc[0] + pc[1] <= hi
                                             : pc[0] >= lo && pc[0] <= hi && pc[1] >= lo && pc[1] <= hi;
  return rs_ok && t_ok;
}

// Loads cell `id` into the scratch cell and copies its node positions.
void load_cell(vtkUnstructuredGrid* grid, vtkIdType id, Scratch& s) {
  grid->GetCell(id, s.cell);
  vtkPoints* points = s.cell->GetPoints();
  s.nodes.resize(static_cast<std::size_t>(points->GetNumberOfPoints()));
  Vec3 lo = Vec3::Constant(HUGE_VAL), hi = Vec3::Constant(-HUGE_VAL);
  for (std::size_t i = 0; i < s.nodes.size(); ++i) {
    points->GetPoint(static_cast<vtkIdType>(i), s.nodes[i].data());
    lo = lo.cwiseMin(s.nodes[i]);
    hi = hi.cwiseMax(s.nodes[i]);
  }
  s.size = (hi - lo).norm();
}

// Position the loaded cell maps pcoords to, with the shape-function values left in s.weights.
Vec3 map_point(Scratch& s, const double pc[3]) {
  s.cell->InterpolateFunctions(pc, s.weights.data());
  Vec3 x = Vec3::Zero();
  for (std::size_t i = 0; i < s.nodes.size(); ++i) x += s.weights[i] * s.nodes[i];
  return x;
}

// How a cell type's InterpolateDerivs lays out its 3n values. Most VTK 9.1 cells write them direction by
// direction (all dN/dr, then all dN/ds, then all dN/dt); VTK 9.1's Lagrange hexahedron writes them node by node
// (dN0/dr, dN0/ds, dN0/dt, dN1/dr, ...). Measured once per cell type against finite differences of
// InterpolateFunctions, so a VTK that changes its layout is still read right; `unknown` falls back to
// finite differences of the geometric map.
enum class DerivLayout { by_direction, by_node, unknown };

// A cell of `type` with `nodes` dummy points, set up the way vtkUnstructuredGrid::GetCell sets up real ones.
void sample_cell(int type, vtkIdType nodes, vtkGenericCell* cell) {
  auto grid = vtkSmartPointer<vtkUnstructuredGrid>::New();
  vtkNew<vtkPoints> points;
  std::vector<vtkIdType> ids(static_cast<std::size_t>(nodes));
  for (vtkIdType n = 0; n < nodes; ++n) ids[static_cast<std::size_t>(n)] = points->InsertNextPoint(0.0, 0.0, 0.0);
  grid->SetPoints(points);
  grid->InsertNextCell(type, nodes, ids.data());
  grid->GetCell(0, cell);
}

vtkIdType sample_node_count(int type) {
  if (type == VTK_LAGRANGE_HEXAHEDRON) return 27;
  if (type == VTK_LAGRANGE_TETRAHEDRON) return 10;
  if (type == VTK_LAGRANGE_WEDGE) return 18;
  vtkCell* cell = vtkGenericCell::InstantiateCell(type);
  const vtkIdType n = cell->GetNumberOfPoints();
  cell->Delete();
  return n;
}

DerivLayout measure_layout(int type) {
  const vtkIdType nodes = sample_node_count(type);
  const auto n = static_cast<std::size_t>(nodes);
  vtkNew<vtkGenericCell> cell;
  sample_cell(type, nodes, cell);
  const double pc[3] = {0.2, 0.3, 0.25}, h = 1e-6;
  std::vector<double> d(3 * n), plus(n), minus(n);
  cell->InterpolateDerivs(pc, d.data());
  bool direction = true, node = true;
  for (std::size_t a = 0; a < 3; ++a) {
    double p[3] = {pc[0], pc[1], pc[2]}, m[3] = {pc[0], pc[1], pc[2]};
    p[a] += h;
    m[a] -= h;
    cell->InterpolateFunctions(p, plus.data());
    cell->InterpolateFunctions(m, minus.data());
    for (std::size_t i = 0; i < n; ++i) {
      const double fd = (plus[i] - minus[i]) / (2 * h);
      direction = direction && std::abs(d[a * n + i] - fd) < 1e-5 * (1.0 + std::abs(fd));
      node = node && std::abs(d[3 * i + a] - fd) < 1e-5 * (1.0 + std::abs(fd));
    }
  }
  return direction ? DerivLayout::by_direction : node ? DerivLayout::by_node : DerivLayout::unknown;
}

DerivLayout layout_of(int type) {
  static const auto table = [] {
    std::array<DerivLayout, 128> out;
    out.fill(DerivLayout::unknown);
    for (int t = 0; t < static_cast<int>(out.size()); ++t)
      if (cell_type_info(t).dimension == 3) out[static_cast<std::size_t>(t)] = measure_layout(t);
    return out;
  }();
  return type >= 0 && type < static_cast<int>(table.size()) ? table[static_cast<std::size_t>(type)]
                                                            : DerivLayout::unknown;
}

Eigen::Matrix3d numeric_jacobian(Scratch& s, const double pc[3]) {
  Eigen::Matrix3d j;
  const double h = 1e-7;
  for (int a = 0; a < 3; ++a) {
    double p[3] = {pc[0], pc[1], pc[2]}, m[3] = {pc[0], pc[1], pc[2]};
    p[a] += h;
    m[a] -= h;
    j.col(a) = (map_point(s, p) - map_point(s, m)) / (2 * h);
  }
  return j;
}

// d x / d pcoords of the loaded cell (columns: r, s, t).
Eigen::Matrix3d jacobian(Scratch& s, const double pc[3]) {
  const DerivLayout layout = layout_of(s.cell->GetCellType());
  if (layout == DerivLayout::unknown) return numeric_jacobian(s, pc);
  s.cell->InterpolateDerivs(pc, s.derivs.data());
  const std::size_t n = s.nodes.size();
  Eigen::Matrix3d j = Eigen::Matrix3d::Zero();
  for (std::size_t a = 0; a < 3; ++a)
    for (std::size_t i = 0; i < n; ++i) {
      const double d = layout == DerivLayout::by_direction ? s.derivs[a * n + i] : s.derivs[3 * i + a];
      j.col(static_cast<Eigen::Index>(a)) += d * s.nodes[i];
    }
  return j;
}

// Newton iterations on x(pc) = x for the loaded cell, from the pc given. True when the step fell below
// kStepTolerance or the residual to round-off; false for a singular Jacobian or no convergence.
bool newton(Scratch& s, const Vec3& x, double pc[3]) {
  for (int step = 0; step < kMaxNewtonSteps; ++step) {
    const Vec3 residual = x - map_point(s, pc);
    if (residual.lpNorm<Eigen::Infinity>() <= 1e-15 * (s.size + x.lpNorm<Eigen::Infinity>())) return true;
    const Eigen::Matrix3d j = jacobian(s, pc);
    if (!(std::abs(j.determinant()) > kSingularJacobian * s.size * s.size * s.size)) return false;
    const Vec3 delta = j.partialPivLu().solve(residual);
    for (int a = 0; a < 3; ++a) pc[a] += delta[a];
    if (delta.lpNorm<Eigen::Infinity>() < kStepTolerance) return true;
  }
  return false;
}

Host make_host(Scratch& s, vtkIdType id, const double pc[3], double distance) {
  Host host;
  host.cell = id;
  host.pcoords = {pc[0], pc[1], pc[2]};
  host.distance = distance;
  map_point(s, pc);
  const vtkIdType n = s.cell->GetNumberOfPoints();
  host.points.resize(static_cast<std::size_t>(n));
  host.weights.assign(s.weights.begin(), s.weights.begin() + static_cast<std::ptrdiff_t>(n));
  for (vtkIdType i = 0; i < n; ++i) host.points[static_cast<std::size_t>(i)] = s.cell->GetPointIds()->GetId(i);
  return host;
}

// The faces of a parametric domain as half-spaces a . pc <= b.
struct HalfSpace {
  Vec3 a;
  double b;
};

std::vector<HalfSpace> domain_faces(Domain domain) {
  const Vec3 ex = Vec3::UnitX(), ey = Vec3::UnitY(), ez = Vec3::UnitZ();
  if (domain == Domain::simplex) return {{-ex, 0.0}, {-ey, 0.0}, {-ez, 0.0}, {Vec3(1, 1, 1), 1.0}};
  if (domain == Domain::prism) return {{-ex, 0.0}, {-ey, 0.0}, {Vec3(1, 1, 0), 1.0}, {-ez, 0.0}, {ez, 1.0}};
  return {{-ex, 0.0}, {ex, 1.0}, {-ey, 0.0}, {ey, 1.0}, {-ez, 0.0}, {ez, 1.0}};
}

// The step d minimising |r - J d|^2 (mm^2) with pc + d in the domain. The minimum of a convex quadratic over a
// polytope is the stationary point of the quadratic on some face, edge, vertex or the interior, so every set of
// at most three active faces is solved (KKT system) and the best feasible stationary point is kept.
Vec3 constrained_step(const Eigen::Matrix3d& j, const Vec3& r, const Vec3& pc, Domain domain) {
  const std::vector<HalfSpace> faces = domain_faces(domain);
  const Eigen::Matrix3d h = j.transpose() * j;
  const Vec3 g = j.transpose() * r;
  Vec3 best = Vec3::Zero();
  double best_q = HUGE_VAL;
  for (unsigned mask = 0; mask < (1u << faces.size()); ++mask) {
    const int k = std::popcount(mask);
    if (k > 3) continue;
    Eigen::MatrixXd kkt = Eigen::MatrixXd::Zero(3 + k, 3 + k);
    Eigen::VectorXd rhs(3 + k);
    kkt.topLeftCorner<3, 3>() = h;
    rhs.head<3>() = g;
    Eigen::Index row = 3;
    for (std::size_t f = 0; f < faces.size(); ++f) {
      if (!(mask >> f & 1u)) continue;
      kkt.block<1, 3>(row, 0) = faces[f].a.transpose();
      kkt.block<3, 1>(0, row) = faces[f].a;
      rhs[row++] = faces[f].b - faces[f].a.dot(pc);
    }
    const Eigen::FullPivLU<Eigen::MatrixXd> lu(kkt);
    if (!lu.isInvertible()) continue;
    const Vec3 d = lu.solve(rhs).head<3>();
    const bool feasible = std::all_of(faces.begin(), faces.end(),
                                      [&](const HalfSpace& f) { return f.a.dot(pc + d) <= f.b + 1e-12; });
    const double q = 0.5 * d.dot(h * d) - g.dot(d);
    if (feasible && q < best_q) {
      best = d;
      best_q = q;
    }
  }
  return best;
}

// Moves pc to the point of the loaded cell closest to x (Gauss-Newton with the domain as constraint).
void closest_in_cell(Scratch& s, const Vec3& x, Domain domain, double pc[3]) {
  project(domain, pc);
  for (int step = 0; step < 2 * kMaxNewtonSteps; ++step) {
    const Vec3 residual = x - map_point(s, pc);
    const Vec3 d = constrained_step(jacobian(s, pc), residual, Vec3(pc[0], pc[1], pc[2]), domain);
    for (int a = 0; a < 3; ++a) pc[a] += d[a];
    project(domain, pc);
    if (d.lpNorm<Eigen::Infinity>() < kStepTolerance) return;
  }
}

// Where x falls relative to candidate cell `id`: the parametric coordinates of the cell's closest point to x
// and the distance (mm) to it; 0 when x is inside.
double distance_to_cell(vtkUnstructuredGrid* grid, vtkIdType id, const Vec3& x, Scratch& s, double pc[3]) {
  load_cell(grid, id, s);
  s.cell->GetParametricCenter(pc);
  const Domain domain = domain_of(s.cell->GetCellType());
  if (newton(s, x, pc) && inside(domain, pc)) return 0.0;
  if (!std::isfinite(pc[0] + pc[1] + pc[2])) s.cell->GetParametricCenter(pc);
  closest_in_cell(s, x, domain, pc);
  return (x - map_point(s, pc)).norm();
}

bool bounds_near(vtkUnstructuredGrid* grid, vtkIdType id, const Vec3& x, double tolerance) {
  double b[6];
  grid->GetCellBounds(id, b);
  for (int a = 0; a < 3; ++a)
    if (x[a] < b[2 * a] - tolerance || x[a] > b[2 * a + 1] + tolerance) return false;
  return true;
}

// The near cells as a grid of their own on the mesh's points (cell k of it is mesh cell near.cells()[k]).
vtkSmartPointer<vtkUnstructuredGrid> near_grid(vtkUnstructuredGrid* grid, const NearCells& near) {
  auto sub = vtkSmartPointer<vtkUnstructuredGrid>::New();
  sub->SetPoints(grid->GetPoints());
  sub->Allocate(static_cast<vtkIdType>(near.cells().size()));
  vtkNew<vtkIdList> ids;
  for (long long c : near.cells()) {
    grid->GetCellPoints(static_cast<vtkIdType>(c), ids);
    sub->InsertNextCell(grid->GetCellType(static_cast<vtkIdType>(c)), ids);
  }
  return sub;
}

}  // namespace

Locator::Locator(const Mesh& mesh, const NearCells* near) {
  vtkUnstructuredGrid* grid = mesh.grid();
  if (grid == nullptr || grid->GetNumberOfCells() == 0)
    throw Error("cannot locate points in model '" + mesh.source() +
                "': it has no volume cells; give a model with 3D cells");
  cells_ = grid;
  if (near != nullptr) {
    cells_ = near_grid(grid, *near);
    mesh_cell_ = near->cells();
  }
  max_cell_size_ = grid->GetMaxCellSize();
  locator_ = vtkSmartPointer<vtkStaticCellLocator>::New();
  if (cells_->GetNumberOfCells() == 0) return;  // nothing near: every point is off the model
  locator_->SetDataSet(cells_);
  locator_->BuildLocator();
  vtkNew<vtkGenericCell> first;
  cells_->GetCell(0, first);  // any lazy set-up of the grid happens here, before threads query it
}

std::optional<Host> Locator::locate(const Vec3& x, double tolerance) const {
  return locate(x, tolerance, CellFilter{});
}

std::optional<Host> Locator::locate(const Vec3& x, double tolerance, const CellFilter& refuse) const {
  vtkUnstructuredGrid* grid = cells_.Get();
  const auto mesh_cell = [this](vtkIdType id) {
    return mesh_cell_.empty() ? static_cast<long long>(id) : mesh_cell_[static_cast<std::size_t>(id)];
  };
  const auto refused = [&](vtkIdType id) { return refuse && refuse(mesh_cell(id)); };
  Scratch& s = scratch(max_cell_size_);
  double xp[3] = {x.x(), x.y(), x.z()};
  double pc[3];
  const vtkIdType found = cells_->GetNumberOfCells() > 0 ? locator_->FindCell(xp, 0.0, s.cell, pc, s.weights.data())
                                                         : -1;
  if (found >= 0 && !refused(found)) {
    load_cell(grid, found, s);
    if (newton(s, x, pc) && inside(domain_of(s.cell->GetCellType()), pc))
      return make_host(s, mesh_cell(found), pc, 0.0);
  }
  // No acceptable cell holds x to round-off: take the closest acceptable cell among those whose bounds come
  // within the tolerance (a refused cell that holds x leaves its neighbours, which touch x, at distance 0).
  const double reach = std::max(tolerance, 0.0);
  double box[6] = {x.x() - reach, x.x() + reach, x.y() - reach, x.y() + reach, x.z() - reach, x.z() + reach};
  if (cells_->GetNumberOfCells() == 0) return std::nullopt;
  locator_->FindCellsWithinBounds(box, s.candidates);
  vtkIdType best = -1;
  double best_distance = HUGE_VAL, best_pc[3] = {0, 0, 0};
  for (vtkIdType k = 0; k < s.candidates->GetNumberOfIds() && best_distance > 0.0; ++k) {
    const vtkIdType id = s.candidates->GetId(k);
    if (refused(id) || !bounds_near(grid, id, x, reach)) continue;
    const double d = distance_to_cell(grid, id, x, s, pc);
    if (d < best_distance) {
      best = id;
      best_distance = d;
      std::copy(pc, pc + 3, best_pc);
    }
  }
  if (best < 0 || best_distance > reach) return std::nullopt;
  load_cell(grid, best, s);
  return make_host(s, mesh_cell(best), best_pc, best_distance);
}

Tensor interpolate(const StressField& field, const Host& host) {
  if (field.where() == Association::cell) {
    if (host.cell < 0 || static_cast<std::size_t>(host.cell) >= field.size())
      throw Error("stress field has " + std::to_string(field.size()) +
                  " cell tensors but the point was located in cell " +
                  std::to_string(host.cell) + ": read the stress from the mesh the locator was built on");
    return field.tensor(static_cast<std::size_t>(host.cell));
  }
  Voigt sum{};
  for (std::size_t i = 0; i < host.points.size(); ++i) {
    const long long p = host.points[i];
    if (p < 0 || static_cast<std::size_t>(p) >= field.size())
      throw Error("stress field has " + std::to_string(field.size()) +
                  " point tensors but the located cell uses point " +
                  std::to_string(p) + ": read the stress from the mesh the locator was built on");
    const double* v = field.voigt(static_cast<std::size_t>(p));
    for (std::size_t c = 0; c < 6; ++c) sum[c] += host.weights[i] * v[c];
  }
  return tensor_from_voigt(sum.data());
}

}  // namespace toehold
