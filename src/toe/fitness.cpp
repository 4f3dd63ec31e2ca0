#include "toehold/toe/fitness.hpp"

#include "toehold/model/cell_types.hpp"

#include <vtkCell.h>
#include <vtkGenericCell.h>
#include <vtkPoints.h>

#include <algorithm>
#include <limits>
#include <set>
#include <sstream>

namespace toehold {
namespace {

std::vector<Vec3> corners(const Mesh& mesh, long long cell) {
  vtkCell* c = mesh.grid()->GetCell(cell);
  const int n = cell_type_info(c->GetCellType()).corners;
  std::vector<Vec3> out;
  for (int i = 0; i < n; ++i) {
    double x[3];
    mesh.grid()->GetPoint(c->GetPointId(i), x);
    out.emplace_back(x[0], x[1], x[2]);
  }
  return out;
}

double extent_along(const Mesh& mesh, long long cell, const Vec3& direction) {
  double lo = std::numeric_limits<double>::infinity(), hi = -lo;
  for (const Vec3& p : corners(mesh, cell)) lo = std::min(lo, p.dot(direction)), hi = std::max(hi, p.dot(direction));
  return hi - lo;
}

// Longest over shortest edge of the cell's corner edges.
double edge_ratio(const Mesh& mesh, long long cell) {
  vtkCell* c = mesh.grid()->GetCell(cell);
  double lo = std::numeric_limits<double>::infinity(), hi = 0.0;
  for (int e = 0; e < c->GetNumberOfEdges(); ++e) {
    vtkCell* edge = c->GetEdge(e);
    double a[3], b[3];
    mesh.grid()->GetPoint(edge->GetPointId(0), a);
    mesh.grid()->GetPoint(edge->GetPointId(1), b);  // corner ends of the (possibly quadratic) edge
    const double length = (Vec3(a[0], a[1], a[2]) - Vec3(b[0], b[1], b[2])).norm();
    lo = std::min(lo, length), hi = std::max(hi, length);
  }
  return lo > 0 ? hi / lo : std::numeric_limits<double>::infinity();
}

std::string number(double v) {
  std::ostringstream os;
  os.precision(3);
  os << v;
  return os.str();
}

FitnessCheck size_check(const Mesh& mesh, const ReadoutScheme& scheme, double t, const Vec3& readout, long long cell) {
  const MeshRule rule = mesh_rule(scheme, t);
  const double size = extent_along(mesh, cell, readout);
  return {"element size", size <= 1.05 * rule.max_element_size_mm,
          "element at the toe is " + number(size) + " mm long across the toe; " + rule.text};
}

FitnessCheck separate_check(const std::vector<long long>& hosts) {
  const std::set<long long> distinct(hosts.begin(), hosts.end());
  const bool ok = distinct.size() == hosts.size();
  return {"separate elements", ok,
          ok ? "each of the three read-out points lies in its own element"
             : "two or more read-out points lie in the same element; quadratic extrapolation needs one element per "
               "point (Lotsberg et al. 2024)"};
}

FitnessCheck order_check(const Mesh& mesh, const std::vector<long long>& hosts) {
  int lowest = 9;
  for (long long cell : hosts) {
    const int type = mesh.grid()->GetCellType(cell);
    lowest = std::min(lowest, cell_order(type, static_cast<int>(mesh.grid()->GetCell(cell)->GetNumberOfPoints())));
  }
  const bool ok = lowest >= 2;
  return {"element order", ok,
          ok ? "read-out points lie in higher-order elements, as the coarse-mesh scheme assumes"
             : "read-out points lie in linear elements; the coarse t x t scheme assumes higher-order elements "
               "(IIW 2016 sec. 3.3, from memory)"};
}

FitnessCheck shape_check(const Mesh& mesh, const std::vector<long long>& hosts) {
  double worst = 1.0;
  for (long long cell : hosts) worst = std::max(worst, edge_ratio(mesh, cell));
  return {"cell shape", worst <= 5.0,
          "largest edge ratio of the read-out cells is " + number(worst) + " (limit 5, common practice)"};
}

}  // namespace

std::vector<FitnessCheck> check_station_fitness(const Mesh& mesh, const ReadoutScheme& scheme, double thickness,
                                                const Vec3& readout, long long toe_cell,
                                                const std::vector<long long>& host_cells) {
  std::vector<FitnessCheck> checks;
  if (toe_cell >= 0) checks.push_back(size_check(mesh, scheme, thickness, readout, toe_cell));
  if (host_cells.empty()) return checks;
  if (scheme.distances.size() == 3) checks.push_back(separate_check(host_cells));
  if (scheme.kind == SchemeKind::coarse_linear) checks.push_back(order_check(mesh, host_cells));
  checks.push_back(shape_check(mesh, host_cells));
  return checks;
}

}  // namespace toehold
