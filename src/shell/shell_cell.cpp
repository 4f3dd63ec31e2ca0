#include "toehold/shell/shell_cell.hpp"

#include "toehold/model/cell_types.hpp"

#include <Eigen/Dense>
#include <vtkGenericCell.h>
#include <vtkNew.h>

#include <algorithm>
#include <cmath>
#include <vector>

namespace toehold {
namespace {

constexpr int kMaxSteps = 20;
constexpr double kStepTolerance = 1e-12; // parametric step taken as converged

struct LoadedCell {
  vtkNew<vtkGenericCell> cell;
  std::vector<double> weights, derivs;
  bool triangle = false;
};

void load(vtkUnstructuredGrid *grid, long long id, LoadedCell &c) {
  grid->GetCell(static_cast<vtkIdType>(id), c.cell);
  const auto n = static_cast<std::size_t>(c.cell->GetNumberOfPoints());
  c.weights.assign(n, 0.0);
  c.derivs.assign(n, 0.0); // scratch weights for the differences
  c.triangle = cell_type_info(c.cell->GetCellType()).corners == 3;
}

Vec3 position(LoadedCell &c, const double *pc, std::vector<double> &w) {
  c.cell->InterpolateFunctions(pc, w.data());
  Vec3 x = Vec3::Zero();
  for (std::size_t i = 0; i < w.size(); ++i) {
    Vec3 xi;
    c.cell->GetPoints()->GetPoint(static_cast<vtkIdType>(i), xi.data());
    x += w[i] * xi;
  }
  return x;
}

// The tangents come from central differences of the shape functions, not from
// InterpolateDerivs, whose layout VTK 9.1 does not keep the same across cell
// types (its Lagrange quadrilateral writes them node by node). The shape
// functions of the supported cells are at most quadratic in each of r and s, so
// a central difference is exact but for round-off (about 1e-11 with this step)
// [D].
ShellCellMap map_of(LoadedCell &c, double r, double s) {
  constexpr double h = 1e-5;
  const double rp[3] = {r + h, s, 0}, rm[3] = {r - h, s, 0},
               sp[3] = {r, s + h, 0}, sm[3] = {r, s - h, 0};
  ShellCellMap m;
  m.dr = (position(c, rp, c.derivs) - position(c, rm, c.derivs)) / (2 * h);
  m.ds = (position(c, sp, c.derivs) - position(c, sm, c.derivs)) / (2 * h);
  const double pc[3] = {r, s, 0};
  m.x = position(c, pc, c.weights);
  return m;
}

// How far (r, s) lies outside the parametric domain (0 inside), and the closest
// point of the domain.
double clamp_to_domain(bool triangle, double &r, double &s) {
  const double r0 = r, s0 = s;
  if (!triangle) {
    r = std::clamp(r, 0.0, 1.0);
    s = std::clamp(s, 0.0, 1.0);
  } else {
    r = std::max(r, 0.0);
    s = std::max(s, 0.0);
    if (r + s >
        1.0) { // project onto the hypotenuse r + s = 1, then clamp to its ends
      const double excess = 0.5 * (r0 + s0 - 1.0);
      r = std::clamp(r0 - excess, 0.0, 1.0);
      s = 1.0 - r;
    }
  }
  return std::hypot(r - r0, s - s0);
}

// Gauss-Newton from (r, s); with `constrained`, each iterate is put back into
// the domain.
void solve(LoadedCell &c, const Vec3 &x, double &r, double &s,
           bool constrained) {
  for (int step = 0; step < kMaxSteps; ++step) {
    const ShellCellMap m = map_of(c, r, s);
    Eigen::Matrix<double, 3, 2> J;
    J.col(0) = m.dr;
    J.col(1) = m.ds;
    const Eigen::Matrix2d JtJ = J.transpose() * J;
    if (std::abs(JtJ.determinant()) < 1e-300)
      return;
    const Eigen::Vector2d delta = JtJ.ldlt().solve(J.transpose() * (x - m.x));
    r += delta[0];
    s += delta[1];
    if (constrained)
      clamp_to_domain(c.triangle, r, s);
    else
      r = std::clamp(r, -2.0, 3.0),
      s = std::clamp(s, -2.0, 3.0); // keep a wild guess bounded
    if (delta.norm() < kStepTolerance)
      return;
  }
}

} // namespace

ShellCellMap shell_cell_map(vtkUnstructuredGrid *grid, long long cell, double r,
                            double s) {
  LoadedCell c;
  load(grid, cell, c);
  return map_of(c, r, s);
}

Vec3 shell_cell_normal(vtkUnstructuredGrid *grid, long long cell) {
  LoadedCell c;
  load(grid, cell, c);
  double centre[3];
  c.cell->GetParametricCenter(centre);
  const ShellCellMap m = map_of(c, centre[0], centre[1]);
  const Vec3 n = m.dr.cross(m.ds);
  const double scale = m.dr.norm() * m.ds.norm();
  return scale > 0.0 && n.norm() > 1e-12 * scale ? Vec3(n.normalized())
                                                 : Vec3(Vec3::Zero());
}

Host locate_in_shell_cell(vtkUnstructuredGrid *grid, long long cell,
                          const Vec3 &x, double *outside) {
  LoadedCell c;
  load(grid, cell, c);
  double centre[3];
  c.cell->GetParametricCenter(centre);
  double r = centre[0], s = centre[1];
  solve(c, x, r, s, false);
  double rc = r, sc = s;
  const double off = clamp_to_domain(c.triangle, rc, sc);
  if (off > 1e-9) {
    r = rc, s = sc;
    solve(c, x, r, s, true);
  }
  if (outside)
    *outside = off > 1e-9 ? off : 0.0;
  const ShellCellMap m = map_of(c, r, s);
  Host host;
  host.cell = cell;
  host.pcoords = {r, s, 0.0};
  host.weights = c.weights;
  for (int i = 0; i < static_cast<int>(c.cell->GetNumberOfPoints()); ++i)
    host.points.push_back(c.cell->GetPointId(i));
  host.distance = (x - m.x).norm();
  return host;
}

} // namespace toehold
