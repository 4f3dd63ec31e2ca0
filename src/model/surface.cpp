#include "toehold/model/surface.hpp"

#include "toehold/common/error.hpp"
#include "toehold/model/cell_types.hpp"

#include <vtkCellArray.h>
#include <vtkCellType.h>
#include <vtkDataArray.h>
#include <vtkGenericCell.h>
#include <vtkIdList.h>
#include <vtkNew.h>
#include <vtkPoints.h>
#include <vtkPolyData.h>
#include <vtkStaticCellLocator.h>

#include <algorithm>
#include <bit>
#include <cmath>
#include <cstdint>
#include <limits>
#include <mutex>
#include <numeric>
#include <string>
#include <tuple>

namespace toehold {
namespace {

using Quad = std::array<int, 4>;  // node numbers of a facet, [3] = -1 for a triangle

// One face of a cell type in cell-local node numbers: its corners (for matching faces between cells) and the
// linear facets it splits into, wound the same way as the corners.
struct FaceTemplate {
  int corners = 0;
  Quad corner{-1, -1, -1, -1};
  std::vector<Quad> facets;
};

struct CellTemplate {
  int vtk_type = 0;
  vtkIdType nodes = 0;
  std::vector<FaceTemplate> faces;
};

// Facets of a face in the face's own node numbers. Quadratic and Lagrange faces of order 2 are split through
// their mid-edge (and centre) nodes: 6-node triangle -> 4 triangles, 8-node quad -> 4 corner triangles and an
// inner quad, 9-node quad -> 4 quads. VTK numbers these faces corners first, then mid-edges 01, 12, 23(20), 30.
std::vector<Quad> split_known_face(int type, vtkIdType nodes) {
  if (type == VTK_TRIANGLE) return {{0, 1, 2, -1}};
  if (type == VTK_QUAD) return {{0, 1, 2, 3}};
  if (type == VTK_QUADRATIC_TRIANGLE || (type == VTK_LAGRANGE_TRIANGLE && nodes == 6))
    return {{0, 3, 5, -1}, {3, 1, 4, -1}, {5, 4, 2, -1}, {3, 4, 5, -1}};
  if (type == VTK_QUADRATIC_QUAD) return {{0, 4, 7, -1}, {4, 1, 5, -1}, {5, 2, 6, -1}, {7, 6, 3, -1}, {4, 5, 6, 7}};
  if (type == VTK_BIQUADRATIC_QUAD || (type == VTK_LAGRANGE_QUADRILATERAL && nodes == 9))
    return {{0, 4, 8, 7}, {4, 1, 5, 8}, {8, 5, 2, 6}, {7, 8, 6, 3}};
  return {};
}

Vec3 point_of(vtkPoints* points, vtkIdType id) {
  Vec3 x;
  points->GetPoint(id, x.data());
  return x;
}

// Newell normal (not normalised) of a polygon given by positions.
Vec3 polygon_normal(const std::vector<Vec3>& x) {
  Vec3 n = Vec3::Zero();
  for (std::size_t i = 0; i < x.size(); ++i) n += x[i].cross(x[(i + 1) % x.size()]);
  return n;
}

// Any other face (higher-order Lagrange, biquadratic triangle...): VTK's own triangulation of the face, each
// triangle wound like the face's corners.
std::vector<Quad> triangulate_face(vtkCell* face, int corners) {
  vtkNew<vtkIdList> ids;
  vtkNew<vtkPoints> points;
  face->Triangulate(0, ids, points);
  std::vector<Vec3> corner_x;
  for (int c = 0; c < corners; ++c) corner_x.push_back(point_of(face->GetPoints(), c));
  const Vec3 face_normal = polygon_normal(corner_x);
  std::vector<Quad> out;
  for (vtkIdType t = 0; t + 2 < ids->GetNumberOfIds(); t += 3) {
    Quad q{-1, -1, -1, -1};
    for (int k = 0; k < 3; ++k) q[k] = static_cast<int>(face->GetPointIds()->IsId(ids->GetId(t + k)));
    const Vec3 n = polygon_normal({point_of(points, t), point_of(points, t + 1), point_of(points, t + 2)});
    if (n.dot(face_normal) < 0.0) std::swap(q[1], q[2]);
    out.push_back(q);
  }
  return out;
}

// The face template of face `f` of the sample cell, in the cell's local node numbers.
FaceTemplate face_template(vtkGenericCell* cell, int f) {
  vtkCell* face = cell->GetFace(f);
  FaceTemplate out;
  out.corners = cell_type_info(face->GetCellType()).corners;
  std::vector<Quad> facets = split_known_face(face->GetCellType(), face->GetNumberOfPoints());
  if (facets.empty()) facets = triangulate_face(face, out.corners);
  auto local = [&](int k) { return k < 0 ? -1 : static_cast<int>(cell->GetPointIds()->IsId(face->GetPointId(k))); };
  for (int c = 0; c < out.corners; ++c) out.corner[c] = local(c);
  for (const Quad& q : facets) out.facets.push_back({local(q[0]), local(q[1]), local(q[2]), local(q[3])});
  return out;
}

CellTemplate cell_template(vtkUnstructuredGrid* grid, vtkIdType id, const std::string& source) {
  vtkNew<vtkGenericCell> cell;
  grid->GetCell(id, cell);
  CellTemplate out{cell->GetCellType(), cell->GetNumberOfPoints(), {}};
  if (cell->GetCellDimension() != 3 || cell->GetNumberOfFaces() == 0)
    throw Error("cannot find the surface of model '" + source + "': cell " + std::to_string(id) + " is a " +
                cell_type_info(out.vtk_type).name + " (VTK type " + std::to_string(out.vtk_type) +
                ") without faces; give a model of volume cells with fixed faces (no polyhedra)");
  for (int f = 0; f < cell->GetNumberOfFaces(); ++f) out.faces.push_back(face_template(cell, f));
  return out;
}

// Face templates of every cell of the grid, one per (cell type, node count) found.
class Templates {
public:
  Templates(vtkUnstructuredGrid* grid, const std::string& source) : of_cell_(grid->GetNumberOfCells()) {
    for (vtkIdType c = 0; c < grid->GetNumberOfCells(); ++c) of_cell_[c] = find_or_add(grid, c, source);
  }
  const CellTemplate& of(vtkIdType cell) const { return list_[of_cell_[cell]]; }

private:
  int find_or_add(vtkUnstructuredGrid* grid, vtkIdType c, const std::string& source) {
    const int type = grid->GetCellType(c);
    const vtkIdType nodes = grid->GetCells()->GetCellSize(c);
    for (std::size_t i = 0; i < list_.size(); ++i)
      if (list_[i].vtk_type == type && list_[i].nodes == nodes) return static_cast<int>(i);
    list_.push_back(cell_template(grid, c, source));
    return static_cast<int>(list_.size()) - 1;
  }
  std::vector<CellTemplate> list_;
  std::vector<int> of_cell_;
};

// Discontinuous (element-nodal) results duplicate a node once per cell. For the surface, coincident points are one
// point: the lowest id among them (-0.0 and 0.0 are the same place). The cells keep their own copies, so stresses
// still come from the host cell. Found with an open-addressing hash of the exact coordinates, in id order; each
// slot keeps 24 bits of its point's hash, so a probe reads the coordinates only when the tags agree.
class CanonicalPoints {
public:
  explicit CanonicalPoints(vtkUnstructuredGrid* grid) {
    const auto n = static_cast<std::size_t>(grid->GetNumberOfPoints());
    vtkPoints* points = grid->GetPoints();
    std::vector<double> copy;  // only when the points are not doubles (read_mesh makes doubles)
    const double* x = nullptr;
    if (points->GetDataType() == VTK_DOUBLE) {
      x = static_cast<const double*>(points->GetData()->GetVoidPointer(0));
    } else {
      copy.resize(3 * n);
      for (std::size_t i = 0; i < n; ++i) points->GetPoint(static_cast<vtkIdType>(i), copy.data() + 3 * i);
      x = copy.data();
    }
    std::size_t size = 16;
    while (size < 2 * n) size *= 2;
    std::vector<std::uint64_t> table(size, 0);  // 0 = empty, else tag << kIdBits | (id + 1)
    std::vector<long long> canon(n);
    bool any = false;
    for (std::size_t i = 0; i < n; ++i) {
      const std::uint64_t h = hash(x + 3 * i);
      const std::uint64_t tag = h >> kIdBits;
      std::size_t slot = static_cast<std::size_t>(h) & (size - 1);
      while (table[slot] != 0 && ((table[slot] >> kIdBits) != tag || !same(x + 3 * (id_of(table[slot])), x + 3 * i)))
        slot = (slot + 1) & (size - 1);
      if (table[slot] == 0) table[slot] = tag << kIdBits | (i + 1);
      canon[i] = static_cast<long long>(id_of(table[slot]));
      any = any || canon[i] != static_cast<long long>(i);
    }
    if (any) canon_ = std::move(canon);
  }
  long long of(long long p) const { return canon_.empty() ? p : canon_[static_cast<std::size_t>(p)]; }
  const std::vector<long long>& table() const { return canon_; }

private:
  static constexpr int kIdBits = 40;  // up to 2^40 - 1 points; the upper 24 bits of a slot tag its hash
  static std::size_t id_of(std::uint64_t slot) {
    return static_cast<std::size_t>((slot & ((std::uint64_t{1} << kIdBits) - 1)) - 1);
  }
  static bool same(const double* a, const double* b) {
    return a[0] == b[0] && a[1] == b[1] && a[2] == b[2];  // -0.0 == 0.0
  }
  static std::uint64_t hash(const double* x) {
    std::uint64_t h = 0x9e3779b97f4a7c15ull;
    for (int a = 0; a < 3; ++a) {
      h ^= std::bit_cast<std::uint64_t>(x[a] + 0.0) + 0x9e3779b97f4a7c15ull + (h << 6) + (h >> 2);  // -0.0 -> 0.0
      h *= 0xbf58476d1ce4e5b9ull;
      h ^= h >> 31;
    }
    return h;
  }
  std::vector<long long> canon_;
};

// The cells' point ids read straight from the grid's cell array (32- or 64-bit storage), each replaced by its
// canonical id. One buffer: not for concurrent use.
class CellNodes {
public:
  CellNodes(vtkUnstructuredGrid* grid, const CanonicalPoints& canonical)
      : cells_(grid->GetCells()), canonical_(canonical),
        buffer_(static_cast<std::size_t>(std::max(grid->GetMaxCellSize(), 1))) {
    if (cells_->IsStorage64Bit()) {
      offsets64_ = cells_->GetOffsetsArray64()->GetPointer(0);
      nodes64_ = cells_->GetConnectivityArray64()->GetPointer(0);
    } else {
      offsets32_ = cells_->GetOffsetsArray32()->GetPointer(0);
      nodes32_ = cells_->GetConnectivityArray32()->GetPointer(0);
    }
  }
  vtkIdType size(vtkIdType cell) const { return offset(cell + 1) - offset(cell); }
  // The canonical point ids of `cell`; valid until the next call.
  const vtkIdType* of(vtkIdType cell, vtkIdType& npts) const {
    const vtkIdType begin = offset(cell);
    npts = offset(cell + 1) - begin;
    for (vtkIdType k = 0; k < npts; ++k)
      buffer_[static_cast<std::size_t>(k)] = canonical_.of(node(begin + k));
    return buffer_.data();
  }

private:
  vtkIdType offset(vtkIdType i) const {
    return offsets64_ ? static_cast<vtkIdType>(offsets64_[i]) : static_cast<vtkIdType>(offsets32_[i]);
  }
  vtkIdType node(vtkIdType i) const {
    return nodes64_ ? static_cast<vtkIdType>(nodes64_[i]) : static_cast<vtkIdType>(nodes32_[i]);
  }
  vtkCellArray* cells_;
  const CanonicalPoints& canonical_;
  const vtkTypeInt64* offsets64_ = nullptr;
  const vtkTypeInt64* nodes64_ = nullptr;
  const vtkTypeInt32* offsets32_ = nullptr;
  const vtkTypeInt32* nodes32_ = nullptr;
  mutable std::vector<vtkIdType> buffer_;
};

using FaceKey = std::array<long long, 4>;  // sorted corner ids of a face; [3] = -1 for triangles

constexpr long long kFaceBits = 16;  // a face is coded as cell * 16 + face number

struct FaceCode {
  static long long make(vtkIdType cell, std::size_t face) { return cell * kFaceBits + static_cast<long long>(face); }
  static vtkIdType cell(long long code) { return code / kFaceBits; }
  static std::size_t face(long long code) { return static_cast<std::size_t>(code % kFaceBits); }
};

FaceKey face_key(const FaceTemplate& face, const vtkIdType* pts) {
  FaceKey key{-1, -1, -1, -1};
  for (int c = 0; c < face.corners; ++c) key[c] = pts[face.corner[c]];
  for (int i = 1; i < face.corners; ++i)  // insertion sort of at most four ids
    for (int j = i; j > 0 && key[j - 1] > key[j]; --j) std::swap(key[j - 1], key[j]);
  return key;
}

// A face filed under its smallest corner id: the other corners (sorted, -1 for a triangle's fourth) and its code.
template <class Id>
struct FiledFace {
  std::array<Id, 3> rest;
  Id code;
  bool operator<(const FiledFace& o) const { return std::tie(rest, code) < std::tie(o.rest, o.code); }
};

// Boundary faces: those whose corner set no other face has. Faces are filed under their smallest corner id
// (flat arrays, two passes over the cells in order, linear time) with their other corners, so each bucket is
// compared on its own without going back to the cells. Id is int when the point and face numbers fit (half
// the memory), else long long. Returns face codes in cell order.
template <class Id>
std::vector<long long> boundary_faces(vtkUnstructuredGrid* grid, const Templates& templates, const CellNodes& nodes,
                                      const NearCells* near) {
  std::vector<long long> start(static_cast<std::size_t>(grid->GetNumberOfPoints()) + 1, 0);
  auto for_each_face = [&](auto&& visit) {
    vtkIdType npts = 0;
    const auto faces_of = [&](vtkIdType c) {
      const vtkIdType* pts = nodes.of(c, npts);
      const auto& faces = templates.of(c).faces;
      for (std::size_t f = 0; f < faces.size(); ++f) visit(c, f, face_key(faces[f], pts));
    };
    if (near == nullptr)
      for (vtkIdType c = 0; c < grid->GetNumberOfCells(); ++c) faces_of(c);
    else
      for (long long c : near->cells()) faces_of(static_cast<vtkIdType>(c));
  };
  for_each_face([&](vtkIdType, std::size_t, const FaceKey& key) { ++start[static_cast<std::size_t>(key[0]) + 1]; });
  std::partial_sum(start.begin(), start.end(), start.begin());
  std::vector<FiledFace<Id>> bucket(static_cast<std::size_t>(start.back()));
  {
    std::vector<long long> fill(start.begin(), start.end() - 1);
    for_each_face([&](vtkIdType c, std::size_t f, const FaceKey& key) {
      const auto at = static_cast<std::size_t>(fill[static_cast<std::size_t>(key[0])]++);
      bucket[at] = {{static_cast<Id>(key[1]), static_cast<Id>(key[2]), static_cast<Id>(key[3])},
                    static_cast<Id>(FaceCode::make(c, f))};
    });
  }
  std::vector<long long> out;
  for (std::size_t b = 0; b + 1 < start.size(); ++b) {
    const auto first = bucket.begin() + start[b], last = bucket.begin() + start[b + 1];
    std::sort(first, last);
    for (auto i = first; i != last; ++i) {
      const bool same_before = i != first && (i - 1)->rest == i->rest;
      const bool same_after = i + 1 != last && (i + 1)->rest == i->rest;
      if (!same_before && !same_after) out.push_back(static_cast<long long>(i->code));
    }
  }
  std::sort(out.begin(), out.end());
  return out;
}

std::vector<long long> boundary_faces(vtkUnstructuredGrid* grid, const Templates& templates, const CellNodes& nodes,
                                      const NearCells* near) {
  constexpr long long fits = std::numeric_limits<int>::max();
  if (grid->GetNumberOfPoints() < fits && grid->GetNumberOfCells() < fits / kFaceBits)
    return boundary_faces<int>(grid, templates, nodes, near);
  return boundary_faces<long long>(grid, templates, nodes, near);
}

// Bounding box of a facet's corners, mm.
Box facet_box(vtkPoints* points, const Facet& f) {
  Box b = kEmptyBox;
  for (int k = 0; k < f.corner_count(); ++k) grow(b, point_of(points, f.points[k]).data());
  return b;
}

Vec3 facet_normal(vtkPoints* points, const std::array<long long, 4>& p) {
  const Vec3 a = point_of(points, p[0]), b = point_of(points, p[1]), c = point_of(points, p[2]);
  const Vec3 n = p[3] < 0 ? Vec3((b - a).cross(c - a)) : Vec3((c - a).cross(point_of(points, p[3]) - b));
  return n.norm() > 0.0 ? Vec3(n.normalized()) : Vec3::Zero();
}

// The facets of one boundary face, wound counter-clockwise seen from outside the owner cell.
void add_face_facets(vtkPoints* points, vtkIdType owner, vtkIdType npts, const vtkIdType* pts,
                     const FaceTemplate& face, std::vector<Facet>& out) {
  Vec3 cell_centre = Vec3::Zero(), face_centre = Vec3::Zero();
  for (vtkIdType i = 0; i < npts; ++i) cell_centre += point_of(points, pts[i]);
  cell_centre /= static_cast<double>(npts);
  std::vector<Vec3> corners;
  for (int c = 0; c < face.corners; ++c) corners.push_back(point_of(points, pts[face.corner[c]]));
  for (const Vec3& x : corners) face_centre += x;
  face_centre /= face.corners;
  const bool flip = polygon_normal(corners).dot(face_centre - cell_centre) < 0.0;
  for (const Quad& q : face.facets) {
    Facet facet;
    const int n = q[3] < 0 ? 3 : 4;
    for (int k = 0; k < n; ++k) facet.points[k] = pts[q[flip ? (n - k) % n : k]];
    facet.owner = owner;
    facet.normal = facet_normal(points, facet.points);
    out.push_back(facet);
  }
}

bool has_edge(const Facet& f, long long a, long long b) {
  const int n = f.corner_count();
  for (int k = 0; k < n; ++k) {
    const long long p = f.points[k], q = f.points[(k + 1) % n];
    if ((p == a && q == b) || (p == b && q == a)) return true;
  }
  return false;
}

}  // namespace

// The facets as VTK triangles (quads split along their 0-2 diagonal) with a locator, built on first use.
struct Surface::FacetIndex {
  std::once_flag built;
  vtkSmartPointer<vtkPolyData> triangles;
  vtkSmartPointer<vtkStaticCellLocator> locator;
  std::vector<int> facet_of_triangle;

  void build(const std::vector<Facet>& facets, vtkPoints* points) {
    vtkNew<vtkCellArray> polys;
    for (std::size_t f = 0; f < facets.size(); ++f) {
      const auto& p = facets[f].points;
      const vtkIdType first[3] = {p[0], p[1], p[2]};
      polys->InsertNextCell(3, first);
      facet_of_triangle.push_back(static_cast<int>(f));
      if (p[3] < 0) continue;
      const vtkIdType second[3] = {p[0], p[2], p[3]};
      polys->InsertNextCell(3, second);
      facet_of_triangle.push_back(static_cast<int>(f));
    }
    triangles = vtkSmartPointer<vtkPolyData>::New();
    triangles->SetPoints(points);
    triangles->SetPolys(polys);
    triangles->BuildCells();  // done here, not lazily inside concurrent queries
    locator = vtkSmartPointer<vtkStaticCellLocator>::New();
    locator->SetDataSet(triangles);
    locator->BuildLocator();
  }
};

Surface::Surface(const Mesh& mesh, const NearCells* near) : mesh_(&mesh), index_(std::make_shared<FacetIndex>()) {
  vtkUnstructuredGrid* grid = mesh.grid();
  if (grid == nullptr || grid->GetNumberOfCells() == 0)
    throw Error("cannot find the surface of model '" + mesh.source() +
                "': it has no volume cells; give a model with 3D cells");
  const Templates templates(grid, mesh.source());
  const CanonicalPoints canonical(grid);
  canonical_ = canonical.table();
  const CellNodes nodes(grid, canonical);
  vtkIdType npts = 0;
  const vtkIdType* pts = nullptr;
  for (long long code : boundary_faces(grid, templates, nodes, near)) {
    const vtkIdType cell = FaceCode::cell(code);
    pts = nodes.of(cell, npts);
    add_face_facets(grid->GetPoints(), cell, npts, pts, templates.of(cell).faces[FaceCode::face(code)], facets_);
  }
  // Of the near cells' boundary, only facets near a seed are sure to be on the whole mesh's surface: a face the
  // near cells share with a cell left out lies in that cell's box, which is out of every seed's reach.
  if (near != nullptr)
    std::erase_if(facets_, [&](const Facet& f) { return !near->near(facet_box(grid->GetPoints(), f)); });
  point_start_.assign(static_cast<std::size_t>(grid->GetNumberOfPoints()) + 1, 0);
  for (const Facet& f : facets_)
    for (int k = 0; k < f.corner_count(); ++k) ++point_start_[static_cast<std::size_t>(f.points[k]) + 1];
  std::partial_sum(point_start_.begin(), point_start_.end(), point_start_.begin());
  point_facet_.resize(static_cast<std::size_t>(point_start_.back()));
  std::vector<long long> fill(point_start_.begin(), point_start_.end() - 1);
  for (std::size_t i = 0; i < facets_.size(); ++i)
    for (int k = 0; k < facets_[i].corner_count(); ++k)
      point_facet_[static_cast<std::size_t>(fill[static_cast<std::size_t>(facets_[i].points[k])]++)] =
          static_cast<int>(i);
}

std::span<const int> Surface::facets_of_point(long long p) const {
  if (p < 0 || static_cast<std::size_t>(p) + 1 >= point_start_.size()) return {};
  const auto begin = static_cast<std::size_t>(point_start_[static_cast<std::size_t>(p)]);
  const auto end = static_cast<std::size_t>(point_start_[static_cast<std::size_t>(p) + 1]);
  return {point_facet_.data() + begin, end - begin};
}

std::vector<int> Surface::facets_on_edge(long long a, long long b) const {
  std::vector<int> out;
  for (int f : facets_of_point(a))
    if (has_edge(facets_[static_cast<std::size_t>(f)], a, b)) out.push_back(f);
  return out;
}

int Surface::neighbour(int facet, long long a, long long b) const {
  for (int f : facets_of_point(a))
    if (f != facet && has_edge(facets_[static_cast<std::size_t>(f)], a, b)) return f;
  return -1;
}

std::vector<long long> Surface::edge_neighbours(long long p) const {
  std::vector<long long> out;
  for (int i : facets_of_point(p)) {
    const Facet& f = facets_[static_cast<std::size_t>(i)];
    const int n = f.corner_count();
    for (int k = 0; k < n; ++k) {
      if (f.points[k] != p) continue;
      for (long long q : {f.points[(k + 1) % n], f.points[(k + n - 1) % n]})
        if (std::find(out.begin(), out.end(), q) == out.end()) out.push_back(q);
    }
  }
  return out;
}

SurfaceHit Surface::closest(const Vec3& x) const {
  std::call_once(index_->built, [this] { index_->build(facets_, mesh_->grid()->GetPoints()); });
  SurfaceHit hit;
  if (index_->facet_of_triangle.empty()) return hit;
  vtkNew<vtkGenericCell> cell;
  double closest[3], dist2 = 0.0;
  vtkIdType triangle = -1;
  int sub = 0;
  index_->locator->FindClosestPoint(x.data(), closest, cell, triangle, sub, dist2);
  if (triangle < 0) return hit;
  hit.facet = index_->facet_of_triangle[static_cast<std::size_t>(triangle)];
  hit.x = Vec3(closest[0], closest[1], closest[2]);
  hit.distance = std::sqrt(dist2);
  return hit;
}

long long Surface::canonical(long long p) const {
  if (canonical_.empty() || p < 0 || static_cast<std::size_t>(p) >= canonical_.size()) return p;
  return canonical_[static_cast<std::size_t>(p)];
}

Vec3 Surface::point(long long p) const { return point_of(mesh_->grid()->GetPoints(), p); }

}  // namespace toehold
