// The neighbourhood of the toes that the surface and the locator are built on: seeds along every toe, each with
// the reach the toe's read-out, linearization and nominal samples need, plus a margin for where the toe line
// runs between the seeds.
#include "internal.hpp"

#include "toehold/common/error.hpp"

#include <algorithm>
#include <cmath>

namespace toehold::detail {
namespace {

// Above this share of the model's cells the near cells save too little to pay for the copy of their grid (our
// own choice, no source).
constexpr double kWorthwhileShare = 0.8;

// How far (mm) from its toe line a toe's geometry reaches: the farthest read-out point, the plate thickness (the
// linearization line and its "model goes on" probe at 1.02 t) and the nominal sample distance, with a quarter
// more and a quarter of t for the locate and snap tolerances (0.05 t, 0.25 t). Margins of our own, no source.
double toe_reach(const ToePlan& toe) {
  const ReadoutScheme scheme = toe_scheme(toe, toe.thickness);
  double needed = toe.thickness;
  for (double d : scheme.distances) needed = std::max(needed, d);
  if (toe.nominal) needed = std::max(needed, toe.nominal->distance_mm);
  return 1.25 * needed + 0.25 * toe.thickness;
}

// Marker nodes: the toe line runs along cell edges between them, so each reaches as far as its largest cell
// more than the toe needs.
void add_marker_seeds(const Mesh& mesh, const ToePlan& toe, double reach, std::vector<Seed>& out) {
  const std::vector<long long> nodes = marked_nodes(mesh, toe);
  const std::vector<double> cell_size = largest_cell_size_at(mesh, nodes);
  double x[3];
  for (std::size_t i = 0; i < nodes.size(); ++i) {
    mesh.grid()->GetPoint(static_cast<vtkIdType>(nodes[i]), x);
    out.push_back({Vec3(x[0], x[1], x[2]), reach + cell_size[i]});
  }
}

// Coordinate toes: the polyline (closed when the toe is) sampled at most reach / 2 apart.
void add_point_seeds(const ToePlan& toe, double reach, std::vector<Seed>& out) {
  const std::size_t n = toe.points.size();
  if (n < 2) throw Error("toe '" + toe.name + "': fewer than two points");  // placement gives the full message
  const std::size_t segments = toe.closed ? n : n - 1;
  const double spacing = 0.5 * reach;
  for (std::size_t i = 0; i < segments; ++i) {
    const Vec3& a = toe.points[i];
    const Vec3& b = toe.points[(i + 1) % n];
    const auto steps = static_cast<long long>(std::ceil((b - a).norm() / spacing));
    for (long long k = 0; k <= std::max(steps, 1LL); ++k)
      out.push_back({a + (b - a) * (static_cast<double>(k) / static_cast<double>(std::max(steps, 1LL))),
                     reach + 0.5 * spacing});
  }
}

}  // namespace

std::optional<NearCells> toe_neighbourhood(const Plan& plan, const Mesh& mesh) {
  std::vector<Seed> seeds;
  try {
    for (const ToePlan& toe : plan.toes) {
      const double reach = toe_reach(toe);
      if (!toe.marker_array.empty()) add_marker_seeds(mesh, toe, reach, seeds);
      else add_point_seeds(toe, reach, seeds);
    }
  } catch (const Error&) {
    return std::nullopt;  // a toe that cannot be found: the whole model's geometry gives the plain message
  }
  if (seeds.empty()) return std::nullopt;
  NearCells near(mesh, std::move(seeds));
  const auto cells = static_cast<double>(mesh.grid()->GetNumberOfCells());
  if (static_cast<double>(near.cells().size()) > kWorthwhileShare * cells) return std::nullopt;
  return near;
}

}  // namespace toehold::detail
