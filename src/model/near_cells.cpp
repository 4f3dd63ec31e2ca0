#include "toehold/model/near_cells.hpp"

#include "toehold/common/error.hpp"

#include <vtkCellArray.h>
#include <vtkDataArray.h>
#include <vtkPoints.h>
#include <vtkType.h>

#include <algorithm>
#include <cmath>

namespace toehold {
namespace {

constexpr long long kMaxBins = 1 << 20;

// Calls visit(cell, npts, ids) for every cell, reading the cell array's own 32- or 64-bit storage.
template <class Visit>
void for_each_cell(vtkUnstructuredGrid* grid, Visit&& visit) {
  vtkCellArray* cells = grid->GetCells();
  auto run = [&](const auto* offsets, const auto* nodes) {
    for (vtkIdType c = 0; c < cells->GetNumberOfCells(); ++c)
      visit(c, static_cast<vtkIdType>(offsets[c + 1] - offsets[c]), nodes + offsets[c]);
  };
  if (cells->IsStorage64Bit())
    run(cells->GetOffsetsArray64()->GetPointer(0), cells->GetConnectivityArray64()->GetPointer(0));
  else
    run(cells->GetOffsetsArray32()->GetPointer(0), cells->GetConnectivityArray32()->GetPointer(0));
}

// The mesh's point coordinates (mm, x y z per point): read_mesh stores them as doubles.
const double* coordinates(const Mesh& mesh) {
  vtkPoints* points = mesh.grid()->GetPoints();
  if (points == nullptr || points->GetDataType() != VTK_DOUBLE)
    throw Error("cells near the toes of '" + mesh.source() + "': the points are not stored as doubles");
  return static_cast<const double*>(points->GetData()->GetVoidPointer(0));
}

// Bounding box of the points `ids` of a cell (any integer id type).
template <class Id>
Box cell_box(const double* xyz, vtkIdType npts, const Id* ids) {
  Box b = kEmptyBox;
  for (vtkIdType k = 0; k < npts; ++k) grow(b, xyz + 3 * static_cast<std::ptrdiff_t>(ids[k]));
  return b;
}

double diagonal(const Box& b) { return std::hypot(b[1] - b[0], b[3] - b[2], b[5] - b[4]); }

}  // namespace

NearCells::NearCells(const Mesh& mesh, std::vector<Seed> seeds) : seeds_(std::move(seeds)) {
  if (seeds_.empty()) throw Error("cells near the toes of '" + mesh.source() + "': no seed points were given");
  for (const Seed& s : seeds_)
    if (!(s.reach > 0.0) || !std::isfinite(s.reach) || !s.x.allFinite())
      throw Error("cells near the toes of '" + mesh.source() + "': a seed point has no finite position or reach");
  index_seeds();
  vtkUnstructuredGrid* grid = mesh.grid();
  mesh_cells_ = grid->GetNumberOfCells();
  const double* xyz = coordinates(mesh);
  for_each_cell(grid, [&](vtkIdType c, vtkIdType npts, const auto* ids) {
    if (near(cell_box(xyz, npts, ids))) cells_.push_back(c);
  });
}

// Seeds filed in cubic bins of the largest reach, so a box only looks at the seeds of the bins it overlaps.
void NearCells::index_seeds() {
  Vec3 lo = seeds_.front().x, hi = lo;
  for (const Seed& s : seeds_) {
    lo = lo.cwiseMin(s.x);
    hi = hi.cwiseMax(s.x);
    bin_ = std::max(bin_, s.reach);
  }
  const Vec3 extent = hi - lo;
  while ((std::floor(extent.x() / bin_) + 1) * (std::floor(extent.y() / bin_) + 1) *
             (std::floor(extent.z() / bin_) + 1) > static_cast<double>(kMaxBins))
    bin_ *= 2.0;
  origin_ = lo;
  for (int a = 0; a < 3; ++a) bins_[a] = static_cast<long long>(std::floor(extent[a] / bin_)) + 1;
  const auto bin_of = [&](const Vec3& x) {
    long long b = 0;
    for (int a = 2; a >= 0; --a)
      b = b * bins_[a] + std::clamp(static_cast<long long>(std::floor((x[a] - origin_[a]) / bin_)), 0LL, bins_[a] - 1);
    return b;
  };
  std::sort(seeds_.begin(), seeds_.end(), [&](const Seed& a, const Seed& b) { return bin_of(a.x) < bin_of(b.x); });
  bin_start_.assign(static_cast<std::size_t>(bins_[0] * bins_[1] * bins_[2]) + 1, 0);
  for (const Seed& s : seeds_) ++bin_start_[static_cast<std::size_t>(bin_of(s.x)) + 1];
  for (std::size_t b = 1; b < bin_start_.size(); ++b) bin_start_[b] += bin_start_[b - 1];
}

bool NearCells::near_seed(const Seed& s, const Box& b) const {
  double d2 = 0.0;
  for (int a = 0; a < 3; ++a) {
    const double gap = std::max({b[2 * a] - s.x[a], s.x[a] - b[2 * a + 1], 0.0});
    d2 += gap * gap;
  }
  return d2 <= s.reach * s.reach;
}

bool NearCells::near(const Box& b) const {
  std::array<long long, 3> first{}, last{};
  for (int a = 0; a < 3; ++a) {
    first[a] = static_cast<long long>(std::floor((b[2 * a] - bin_ - origin_[a]) / bin_));
    last[a] = static_cast<long long>(std::floor((b[2 * a + 1] + bin_ - origin_[a]) / bin_));
    if (last[a] < 0 || first[a] >= bins_[a]) return false;
    first[a] = std::max(first[a], 0LL);
    last[a] = std::min(last[a], bins_[a] - 1);
  }
  for (long long k = first[2]; k <= last[2]; ++k)
    for (long long j = first[1]; j <= last[1]; ++j)
      for (long long i = first[0]; i <= last[0]; ++i) {
        const auto bin = static_cast<std::size_t>((k * bins_[1] + j) * bins_[0] + i);
        for (int s = bin_start_[bin]; s < bin_start_[bin + 1]; ++s)
          if (near_seed(seeds_[static_cast<std::size_t>(s)], b)) return true;
      }
  return false;
}

std::vector<double> largest_cell_size_at(const Mesh& mesh, const std::vector<long long>& points) {
  vtkUnstructuredGrid* grid = mesh.grid();
  std::vector<int> slot(static_cast<std::size_t>(grid->GetNumberOfPoints()), -1);
  for (std::size_t i = 0; i < points.size(); ++i) slot[static_cast<std::size_t>(points[i])] = static_cast<int>(i);
  std::vector<double> size(points.size(), 0.0);
  const double* xyz = coordinates(mesh);
  for_each_cell(grid, [&](vtkIdType, vtkIdType npts, const auto* ids) {
    const auto* end = ids + npts;
    if (std::none_of(ids, end, [&](auto p) { return slot[static_cast<std::size_t>(p)] >= 0; })) return;
    const double d = diagonal(cell_box(xyz, npts, ids));
    for (const auto* p = ids; p != end; ++p)
      if (const int s = slot[static_cast<std::size_t>(*p)]; s >= 0) size[static_cast<std::size_t>(s)] = std::max(size[static_cast<std::size_t>(s)], d);
  });
  return size;
}

}  // namespace toehold
