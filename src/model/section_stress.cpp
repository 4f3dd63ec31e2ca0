#include "toehold/model/section_stress.hpp"

#include "toehold/common/error.hpp"
#include "toehold/model/cell_types.hpp"

#include <Eigen/Eigenvalues>
#include <vtkCellData.h>
#include <vtkDataArray.h>
#include <vtkGenericCell.h>
#include <vtkIdList.h>
#include <vtkPoints.h>
#include <vtkSmartPointer.h>
#include <vtkUnstructuredGrid.h>

#include <algorithm>
#include <cmath>
#include <sstream>

namespace toehold {
namespace {

constexpr double kOnPlane = 1e-9;       // distance to the plane, relative to the cell size, counted as on it
constexpr double kRejectMargin = 0.25;  // node distances beyond this fraction of the cell size: cell not cut

// ---- messages -------------------------------------------------------------------------------------------------

std::string text(double v) {
  std::ostringstream os;
  os << v;
  return os.str();
}

std::string text(const Vec3& v) {  // appended step by step: g++ 12 -O3 warns (-Wrestrict) on "(" + s + ...
  std::string out = "(";
  out += text(v.x());
  out += ", ";
  out += text(v.y());
  out += ", ";
  out += text(v.z());
  out += ")";
  return out;
}

std::string label(const SectionSpec& spec) { return "section '" + spec.name + "'"; }

Vec3 unit_or_throw(const SectionSpec& spec, const Vec3& v, const std::string& what, const std::string& advice) {
  const double n = v.norm();
  if (std::isfinite(n) && n > 0.0) return v / n;
  throw Error(label(spec) + ": the " + what + " " + text(v) + " has no direction; " + advice);
}

// ---- parametric subdivision ---------------------------------------------------------------------------------

using Param = std::array<double, 3>;
using SubTet = std::array<int, 4>;  // indices into Subdivision::vertices

// A cell's parametric domain cut into linear tetrahedra that fill it exactly.
struct Subdivision {
  std::vector<Param> vertices;
  std::vector<SubTet> tets;
};

int add_vertex(Subdivision& s, const Param& p) {
  for (std::size_t i = 0; i < s.vertices.size(); ++i)
    if (s.vertices[i] == p) return static_cast<int>(i);
  s.vertices.push_back(p);
  return static_cast<int>(s.vertices.size()) - 1;
}

// Unit cube in `level`^3 sub-cubes, each split into the six tetrahedra around its main diagonal (Kuhn split).
Subdivision cube_subdivision(int level) {
  Subdivision s;
  const double h = 1.0 / level;
  const int orders[6][3] = {{0, 1, 2}, {0, 2, 1}, {1, 0, 2}, {1, 2, 0}, {2, 0, 1}, {2, 1, 0}};
  for (int i = 0; i < level; ++i)
    for (int j = 0; j < level; ++j)
      for (int k = 0; k < level; ++k)
        for (const auto& order : orders) {
          Param p{i * h, j * h, k * h};
          SubTet t{};
          t[0] = add_vertex(s, p);
          for (int step = 0; step < 3; ++step) {
            p[static_cast<std::size_t>(order[step])] += h;
            t[static_cast<std::size_t>(step + 1)] = add_vertex(s, p);
          }
          s.tets.push_back(t);
        }
  return s;
}

Param mid(const Param& a, const Param& b) { return {(a[0] + b[0]) / 2, (a[1] + b[1]) / 2, (a[2] + b[2]) / 2}; }

// Unit simplex: itself (level 1) or four corner tetrahedra and the inner octahedron split about one diagonal.
Subdivision simplex_subdivision(int level) {
  Subdivision s;
  const Param v[4] = {{0, 0, 0}, {1, 0, 0}, {0, 1, 0}, {0, 0, 1}};
  if (level < 2) {
    for (const auto& p : v) add_vertex(s, p);
    s.tets.push_back({0, 1, 2, 3});
    return s;
  }
  auto m = [&](int a, int b) { return add_vertex(s, mid(v[a], v[b])); };
  const int c0 = add_vertex(s, v[0]), c1 = add_vertex(s, v[1]), c2 = add_vertex(s, v[2]), c3 = add_vertex(s, v[3]);
  const int m01 = m(0, 1), m02 = m(0, 2), m03 = m(0, 3), m12 = m(1, 2), m13 = m(1, 3), m23 = m(2, 3);
  s.tets = {{c0, m01, m02, m03}, {c1, m01, m12, m13}, {c2, m02, m12, m23}, {c3, m03, m13, m23},
            {m02, m13, m01, m03}, {m02, m13, m03, m23}, {m02, m13, m23, m12}, {m02, m13, m12, m01}};
  return s;
}

// Triangle (r, s) times [0, 1] in t: the triangle itself or its four halves-split triangles, `level` layers in t,
// each sub-prism split into three tetrahedra.
Subdivision prism_subdivision(int level) {
  Subdivision s;
  using Tri = std::array<std::array<double, 2>, 3>;
  std::vector<Tri> tris{{{{0, 0}, {1, 0}, {0, 1}}}};
  if (level >= 2) {
    const std::array<double, 2> a{0, 0}, b{1, 0}, c{0, 1}, ab{0.5, 0}, bc{0.5, 0.5}, ca{0, 0.5};
    tris = {{{a, ab, ca}}, {{ab, b, bc}}, {{ca, bc, c}}, {{ab, bc, ca}}};
  }
  const double h = 1.0 / level;
  for (int layer = 0; layer < level; ++layer)
    for (const Tri& tri : tris) {
      int lo[3], hi[3];
      for (int k = 0; k < 3; ++k) {
        lo[k] = add_vertex(s, {tri[k][0], tri[k][1], layer * h});
        hi[k] = add_vertex(s, {tri[k][0], tri[k][1], (layer + 1) * h});
      }
      s.tets.push_back({lo[0], lo[1], lo[2], hi[0]});
      s.tets.push_back({lo[1], lo[2], hi[0], hi[1]});
      s.tets.push_back({lo[2], hi[0], hi[1], hi[2]});
    }
  return s;
}

// The subdivision for a VTK volume cell type: by its parametric domain (the same choice as the locator's),
// halved along every parametric edge for cells of order 2 and above.
const Subdivision& subdivision_for(int vtk_type, int node_count) {
  static const Subdivision table[3][2] = {{simplex_subdivision(1), simplex_subdivision(2)},
                                          {prism_subdivision(1), prism_subdivision(2)},
                                          {cube_subdivision(1), cube_subdivision(2)}};
  const int corners = cell_type_info(vtk_type).corners;
  const int domain = corners == 4 ? 0 : corners == 6 ? 1 : 2;
  const int level = cell_order(vtk_type, node_count) >= 2 ? 1 : 0;
  return table[domain][level];
}

// ---- quadrature on triangles --------------------------------------------------------------------------------

struct TrianglePoint {
  std::array<double, 3> bary;  // barycentric coordinates
  double weight;               // fraction of the triangle's area
};

// Degree-5 seven-point rule on a triangle (Radon 1948; as tabulated by Dunavant, Int. J. Numer. Meth. Eng. 21,
// 1985, rule 5, from memory [M]; exactness for degree 5 is checked in the tests [D]).
const std::vector<TrianglePoint>& triangle_rule() {
  static const std::vector<TrianglePoint> rule = [] {
    const double r = std::sqrt(15.0);
    const double a1 = (9.0 - 2.0 * r) / 21.0, b1 = (6.0 + r) / 21.0, w1 = (155.0 + r) / 1200.0;
    const double a2 = (9.0 + 2.0 * r) / 21.0, b2 = (6.0 - r) / 21.0, w2 = (155.0 - r) / 1200.0;
    return std::vector<TrianglePoint>{{{1.0 / 3, 1.0 / 3, 1.0 / 3}, 9.0 / 40.0},
                                      {{a1, b1, b1}, w1}, {{b1, a1, b1}, w1}, {{b1, b1, a1}, w1},
                                      {{a2, b2, b2}, w2}, {{b2, a2, b2}, w2}, {{b2, b2, a2}, w2}};
  }();
  return rule;
}

// ---- integration over one cell ------------------------------------------------------------------------------

// Integrals over part of the cut, in plane coordinates (u, v) about a reference point of the plane.
struct Moments {
  double area = 0.0, u = 0.0, v = 0.0, uu = 0.0, uv = 0.0, vv = 0.0;  // mm^2, mm^3, mm^4
  double s = 0.0, su = 0.0, sv = 0.0;                                 // integrals of d.S.d (times u, v)
  Tensor tensor = Tensor::Zero();                                     // integral of S, MPa mm^2
  std::vector<Eigen::Vector2d> corners;                               // (u, v) of the cut polygons' vertices

  void add(const Moments& o) {
    area += o.area, u += o.u, v += o.v, uu += o.uu, uv += o.uv, vv += o.vv;
    s += o.s, su += o.su, sv += o.sv;
    tensor += o.tensor;
    corners.insert(corners.end(), o.corners.begin(), o.corners.end());
  }
};

// The plane, its in-plane basis and the stress direction; fixed for one section.
struct Plane {
  Vec3 origin, normal, eu, ev, direction;
  Eigen::Vector2d coords(const Vec3& x) const { return {eu.dot(x - origin), ev.dot(x - origin)}; }
  double distance(const Vec3& x) const { return normal.dot(x - origin); }
};

struct CutVertex {
  Vec3 x;
  Param p;
};

// Everything about the cell being integrated: its VTK cell, node positions and the field.
struct CellContext {
  vtkSmartPointer<vtkGenericCell> cell = vtkSmartPointer<vtkGenericCell>::New();
  std::vector<Vec3> nodes;
  std::vector<double> weights;
  double size = 0.0;
  const StressField* field = nullptr;
  long long id = -1;

  Vec3 map(const Param& p) {
    cell->InterpolateFunctions(p.data(), weights.data());
    Vec3 x = Vec3::Zero();
    for (std::size_t i = 0; i < nodes.size(); ++i) x += weights[i] * nodes[i];
    return x;
  }
  Tensor stress(const Param& p) {
    if (field->where() == Association::cell) return field->tensor(static_cast<std::size_t>(id));
    cell->InterpolateFunctions(p.data(), weights.data());
    Tensor s = Tensor::Zero();
    for (std::size_t i = 0; i < nodes.size(); ++i)
      s += weights[i] * field->tensor(static_cast<std::size_t>(cell->GetPointId(static_cast<int>(i))));
    return s;
  }
};

void integrate_triangle(CellContext& c, const Plane& plane, const CutVertex* t[3], Moments& m) {
  const double area = 0.5 * (t[1]->x - t[0]->x).cross(t[2]->x - t[0]->x).norm();
  if (area <= 0.0) return;
  for (const TrianglePoint& q : triangle_rule()) {
    Vec3 x = Vec3::Zero();
    Param p{0, 0, 0};
    for (int k = 0; k < 3; ++k) {
      x += q.bary[k] * t[k]->x;
      for (int a = 0; a < 3; ++a) p[a] += q.bary[k] * t[k]->p[a];
    }
    const Tensor s = c.stress(p);
    const double w = q.weight * area, sn = normal_stress(s, plane.direction);
    const Eigen::Vector2d r = plane.coords(x);
    m.area += w, m.u += w * r.x(), m.v += w * r.y();
    m.uu += w * r.x() * r.x(), m.uv += w * r.x() * r.y(), m.vv += w * r.y() * r.y();
    m.s += w * sn, m.su += w * sn * r.x(), m.sv += w * sn * r.y();
    m.tensor += w * s;
  }
}

// The cut of one linear tetrahedron (vertices with signed distances d, "on the plane" counted as >= 0): a
// triangle (one or three vertices below) or a quadrilateral (two below), as a cycle of edge points.
std::vector<CutVertex> cut_tet(const std::array<CutVertex, 4>& v, const std::array<double, 4>& d) {
  std::vector<int> below, above;
  for (int k = 0; k < 4; ++k) (d[k] < 0.0 ? below : above).push_back(k);
  if (below.empty() || above.empty()) return {};
  auto edge = [&](int i, int j) {
    const double t = d[i] / (d[i] - d[j]);
    CutVertex c{v[i].x + t * (v[j].x - v[i].x), {}};
    for (int a = 0; a < 3; ++a) c.p[a] = v[i].p[a] + t * (v[j].p[a] - v[i].p[a]);
    return c;
  };
  if (below.size() == 1) return {edge(below[0], above[0]), edge(below[0], above[1]), edge(below[0], above[2])};
  if (below.size() == 3) return {edge(below[0], above[0]), edge(below[1], above[0]), edge(below[2], above[0])};
  return {edge(below[0], above[0]), edge(below[0], above[1]), edge(below[1], above[1]), edge(below[1], above[0])};
}

void load_cell(vtkUnstructuredGrid* grid, long long id, CellContext& c) {
  grid->GetCell(static_cast<vtkIdType>(id), c.cell);
  vtkPoints* points = c.cell->GetPoints();
  const auto n = static_cast<std::size_t>(points->GetNumberOfPoints());
  c.nodes.resize(n);
  c.weights.resize(n);
  Vec3 lo = Vec3::Constant(HUGE_VAL), hi = Vec3::Constant(-HUGE_VAL);
  for (std::size_t i = 0; i < n; ++i) {
    points->GetPoint(static_cast<vtkIdType>(i), c.nodes[i].data());
    lo = lo.cwiseMin(c.nodes[i]);
    hi = hi.cwiseMax(c.nodes[i]);
  }
  c.size = (hi - lo).norm();
  c.id = id;
}

// True when every node is clearly on one side of the plane (by a margin for curved higher-order cells).
bool clearly_apart(const CellContext& c, const Plane& plane) {
  double lo = HUGE_VAL, hi = -HUGE_VAL;
  for (const Vec3& x : c.nodes) {
    const double d = plane.distance(x);
    lo = std::min(lo, d), hi = std::max(hi, d);
  }
  const double margin = kRejectMargin * c.size;
  return lo > margin || hi < -margin;
}

// Integrals over the cut of the loaded cell; area 0 when the plane does not cut it.
Moments integrate_cell(CellContext& c, const Plane& plane) {
  Moments m;
  if (clearly_apart(c, plane)) return m;
  const Subdivision& sub = subdivision_for(c.cell->GetCellType(), static_cast<int>(c.nodes.size()));
  std::vector<CutVertex> verts(sub.vertices.size());
  std::vector<double> dist(sub.vertices.size());
  for (std::size_t k = 0; k < verts.size(); ++k) {
    verts[k] = {c.map(sub.vertices[k]), sub.vertices[k]};
    const double d = plane.distance(verts[k].x);
    dist[k] = std::abs(d) <= kOnPlane * c.size ? 0.0 : d;
  }
  for (const SubTet& t : sub.tets) {
    std::array<CutVertex, 4> v;
    std::array<double, 4> d;
    for (int k = 0; k < 4; ++k) v[k] = verts[t[k]], d[k] = dist[t[k]];
    const std::vector<CutVertex> poly = cut_tet(v, d);
    for (std::size_t k = 1; k + 1 < poly.size(); ++k) {
      const CutVertex* tri[3] = {&poly[0], &poly[k], &poly[k + 1]};
      integrate_triangle(c, plane, tri, m);
    }
    for (const CutVertex& p : poly) m.corners.push_back(plane.coords(p.x));
  }
  return m;
}

// ---- limits -------------------------------------------------------------------------------------------------

struct Limits {
  vtkDataArray* regions = nullptr;
  std::vector<int> values;
  std::optional<Eigen::Vector2d> centre;  // in plane coordinates
  double radius = 0.0;
  std::optional<SectionBox> box;
};

Limits prepare_limits(const Mesh& mesh, const SectionSpec& spec, const Plane& plane) {
  const SectionLimits& in = spec.limits;
  Limits out;
  if (!in.region_array.empty()) {
    out.regions = mesh.grid()->GetCellData()->GetArray(in.region_array.c_str());
    if (!out.regions || out.regions->GetNumberOfComponents() != 1)
      throw Error(label(spec) + ": cell array '" + in.region_array + "' not found as a one-component cell array in " +
                  mesh.source() + "; give the name of an integer cell array of the model (e.g. a part id)");
    if (in.region_values.empty())
      throw Error(label(spec) + ": region array '" + in.region_array +
                  "' is given without region values; list the values of the cells that make up the plate");
    out.values = in.region_values;
  } else if (!in.region_values.empty()) {
    throw Error(label(spec) + ": region values are given without a region array; name the cell array they refer to");
  }
  if (in.centre_mm) {
    if (!(std::isfinite(in.radius_mm) && in.radius_mm > 0.0))
      throw Error(label(spec) + ": the radius around the centre must be positive, got " + text(in.radius_mm) +
                  " mm; give a radius that encloses the plate's cross-section");
    out.centre = plane.coords(*in.centre_mm);
    out.radius = in.radius_mm;
  }
  if (in.box && !(in.box->lo.array() <= in.box->hi.array()).all())
    throw Error(label(spec) + ": the box from " + text(in.box->lo) + " to " + text(in.box->hi) +
                " mm is empty; give its smallest corner first");
  out.box = in.box;
  return out;
}

bool kept(const Limits& limits, const Plane& plane, long long cell, const Moments& m) {
  if (limits.regions) {
    const int value = static_cast<int>(std::lround(limits.regions->GetTuple1(static_cast<vtkIdType>(cell))));
    if (std::find(limits.values.begin(), limits.values.end(), value) == limits.values.end()) return false;
  }
  const Eigen::Vector2d c(m.u / m.area, m.v / m.area);
  if (limits.centre && (c - *limits.centre).norm() > limits.radius) return false;
  if (limits.box) {
    const Vec3 x = plane.origin + c.x() * plane.eu + c.y() * plane.ev;
    if (!((x.array() >= limits.box->lo.array()).all() && (x.array() <= limits.box->hi.array()).all())) return false;
  }
  return true;
}

// ---- result -------------------------------------------------------------------------------------------------

Plane make_plane(const SectionSpec& spec) {
  Plane p;
  p.origin = spec.point_mm;
  p.normal = unit_or_throw(spec, spec.normal, "plane normal", "give a non-zero normal vector");
  p.direction = spec.direction ? unit_or_throw(spec, *spec.direction, "stress direction",
                                               "give a non-zero direction or leave it out to use the plane normal")
                               : p.normal;
  if (!spec.point_mm.allFinite())
    throw Error(label(spec) + ": the plane point " + text(spec.point_mm) + " is not finite; give it in mm");
  Eigen::Index least = 0;
  p.normal.cwiseAbs().minCoeff(&least);
  p.eu = p.normal.cross(Vec3::Unit(least)).normalized();
  p.ev = p.normal.cross(p.eu);
  return p;
}

// Sign of an in-plane unit vector made definite: its largest component positive.
Eigen::Vector2d definite(Eigen::Vector2d w) {
  Eigen::Index k = 0;
  w.cwiseAbs().maxCoeff(&k);
  return w(k) < 0 ? Eigen::Vector2d(-w) : w;
}

SectionBending bending_along(const Plane& plane, const Eigen::Vector2d& w, double second_moment,
                             const Eigen::Vector2d& moment, const Moments& m, const Eigen::Vector2d& centroid) {
  SectionBending b;
  b.across = (w.x() * plane.eu + w.y() * plane.ev).normalized();
  b.axis = plane.normal.cross(b.across);
  b.second_moment_mm4 = second_moment;
  b.gradient_MPa_per_mm = second_moment > 0.0 ? moment.dot(w) / second_moment : 0.0;
  for (const Eigen::Vector2d& r : m.corners) {
    const double a = (r - centroid).dot(w);
    b.fibre_max_mm = std::max(b.fibre_max_mm, a);
    b.fibre_min_mm = std::min(b.fibre_min_mm, a);
  }
  b.bending_MPa = b.gradient_MPa_per_mm * b.fibre_max_mm;
  b.bending_min_MPa = b.gradient_MPa_per_mm * b.fibre_min_mm;
  return b;
}

void finish(SectionStress& out, const Plane& plane, const Moments& m) {
  const Eigen::Vector2d c(m.u / m.area, m.v / m.area);
  out.area_mm2 = m.area;
  out.centroid_mm = plane.origin + c.x() * plane.eu + c.y() * plane.ev;
  out.membrane_MPa = m.s / m.area;
  Eigen::Matrix2d inertia;  // second moment tensor of the cut about its centroid, mm^4
  inertia << m.uu - m.area * c.x() * c.x(), m.uv - m.area * c.x() * c.y(),  //
      m.uv - m.area * c.x() * c.y(), m.vv - m.area * c.y() * c.y();
  const Eigen::Vector2d moment(m.su - c.x() * m.s, m.sv - c.y() * m.s);  // first moment of d.S.d, MPa mm^3
  const Eigen::SelfAdjointEigenSolver<Eigen::Matrix2d> eig(inertia);    // eigenvalues ascending: weak axis first
  Eigen::Vector2d gradient = Eigen::Vector2d::Zero();  // of the linear fit in plane coordinates, MPa/mm
  for (int k = 0; k < 2; ++k) {
    const Eigen::Vector2d w = definite(eig.eigenvectors().col(k));
    SectionBending& b = out.bending[static_cast<std::size_t>(k)];
    b = bending_along(plane, w, std::max(eig.eigenvalues()(k), 0.0), moment, m, c);
    gradient += b.gradient_MPa_per_mm * w;
  }
  out.fit_max_MPa = -HUGE_VAL, out.fit_min_MPa = HUGE_VAL;
  for (const Eigen::Vector2d& r : m.corners) {
    const double fit = out.membrane_MPa + gradient.dot(r - c);
    out.fit_max_MPa = std::max(out.fit_max_MPa, fit), out.fit_min_MPa = std::min(out.fit_min_MPa, fit);
  }
  out.mean_tensor = m.tensor / m.area;
  out.mean_traction_MPa = out.mean_tensor * plane.normal;
  out.mean_shear_MPa = (out.mean_traction_MPa - out.mean_traction_MPa.dot(plane.normal) * plane.normal).norm();
}

void check_field(const Mesh& mesh, const StressField& field, const SectionSpec& spec) {
  const bool on_points = field.where() == Association::point;
  const long long expected = on_points ? mesh.grid()->GetNumberOfPoints() : mesh.grid()->GetNumberOfCells();
  if (static_cast<long long>(field.size()) == expected) return;
  throw Error(label(spec) + ": the stress field has " + std::to_string(field.size()) + " tensors but " +
              mesh.source() + " has " + std::to_string(expected) + (on_points ? " points" : " cells") +
              "; read the stress from the same model");
}

}  // namespace

SectionStress section_stress(const Mesh& mesh, const StressField& field, const SectionSpec& spec) {
  const Plane plane = make_plane(spec);
  const Limits limits = prepare_limits(mesh, spec, plane);
  check_field(mesh, field, spec);
  CellContext c;
  c.field = &field;
  Moments total;
  long long touched = 0, cut = 0, kept_cells = 0;
  const long long cells = mesh.grid()->GetNumberOfCells();
  for (long long id = 0; id < cells; ++id) {
    load_cell(mesh.grid(), id, c);
    Moments m = integrate_cell(c, plane);
    if (m.corners.empty()) continue;
    ++touched;
    if (m.area <= 0.0) continue;
    ++cut;
    if (!kept(limits, plane, id, m)) continue;
    ++kept_cells;
    total.add(m);
  }
  const std::string where = " through " + text(spec.point_mm) + " mm with normal " + text(plane.normal);
  if (touched == 0)
    throw Error(label(spec) + ": the cut plane" + where + " misses the model " + mesh.source() +
                "; put the point inside the plate and check that it is in mm");
  if (cut == 0)
    throw Error(label(spec) + ": the cut plane" + where + " only touches edges or corners of the model, "
                "so the cut has zero area; move the point into the plate");
  if (kept_cells == 0)
    throw Error(label(spec) + ": the cut plane" + where + " cuts " + std::to_string(cut) +
                " cells but the limits keep none of them; widen the limits (region values, centre and radius, box) "
                "so they cover the plate's cross-section");
  SectionStress out;
  out.name = spec.name;
  out.normal = plane.normal;
  out.direction = plane.direction;
  out.cut_cells = kept_cells;
  finish(out, plane, total);
  return out;
}

}  // namespace toehold
