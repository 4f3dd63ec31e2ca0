#include "toehold/shell/normal_check.hpp"

#include <algorithm>
#include <cmath>
#include <set>
#include <tuple>

namespace toehold {
namespace {

constexpr double kPi = 3.14159265358979323846;

// Flip across the boundary edge (a -> b) of facet f, if there is one.
bool flip_across(const ShellSurface &surface, int f, long long a, long long b,
                 double cos_limit, NormalFlip &out) {
  const std::vector<int> &on_edge = surface.facets_on_edge(a, b);
  if (on_edge.size() != 2)
    return false;
  const int g = on_edge[0] == f ? on_edge[1] : on_edge[0];
  const long long cf = surface.facet(f).cell, cg = surface.facet(g).cell;
  if (cf == cg)
    return false;
  if (std::abs(surface.facet(f).normal.dot(surface.facet(g).normal)) <
      cos_limit)
    return false; // a fold
  if (!surface.runs_forward(g, a, b))
    return false; // opposite directions: consistent
  out = {std::min(cf, cg), std::max(cf, cg), std::min(a, b), std::max(a, b)};
  return true;
}

} // namespace

std::vector<NormalFlip> find_normal_flips(const ShellSurface &surface,
                                          const std::vector<long long> &cells,
                                          double kink_limit_deg) {
  const double cos_limit = std::cos(kink_limit_deg * kPi / 180.0);
  const std::set<long long> wanted(cells.begin(), cells.end());
  std::set<std::tuple<long long, long long>> seen;
  std::vector<NormalFlip> flips;
  for (long long cell : wanted) {
    for (int f = surface.first_facet(cell); f < surface.first_facet(cell + 1);
         ++f) {
      const ShellFacet &facet = surface.facet(f);
      const int m = facet.corner_count();
      for (int k = 0; k < m; ++k) {
        const long long a = facet.points[static_cast<std::size_t>(k)];
        const long long b = facet.points[static_cast<std::size_t>((k + 1) % m)];
        NormalFlip flip;
        if (flip_across(surface, f, a, b, cos_limit, flip) &&
            seen.emplace(flip.cell_a, flip.cell_b).second)
          flips.push_back(flip);
      }
    }
  }
  std::sort(
      flips.begin(), flips.end(), [](const NormalFlip &x, const NormalFlip &y) {
        return std::tie(x.cell_a, x.cell_b) < std::tie(y.cell_a, y.cell_b);
      });
  return flips;
}

std::string describe(const std::vector<NormalFlip> &flips) {
  std::string out;
  for (const NormalFlip &f : flips) {
    if (!out.empty())
      out += "; ";
    out += "shell normals flip between cells " + std::to_string(f.cell_a) +
           " and " + std::to_string(f.cell_b) + " (edge of points " +
           std::to_string(f.point_a) + "-" + std::to_string(f.point_b) + ")";
  }
  return out;
}

} // namespace toehold
