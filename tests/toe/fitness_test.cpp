#include "toehold/model/locator.hpp"
#include "toehold/toe/fitness.hpp"
#include "support/grid.hpp"
#include "support/support.hpp"

namespace toehold {
namespace {

using test::GridCell;
using test::GridSpec;

// Read-out points of `scheme` from the toe at (30, 20, 10) going +y on a 60 x 60 x 10 mm plate.
std::vector<long long> hosts_of(const Mesh& mesh, const ReadoutScheme& scheme) {
  const Locator locator(mesh);
  std::vector<long long> cells;
  for (double d : scheme.distances) cells.push_back(locator.locate(Vec3(30.1, 20.0 + d, 9.999), 0.1)->cell);
  return cells;
}

const FitnessCheck& find(const std::vector<FitnessCheck>& checks, const std::string& name) {
  for (const auto& c : checks)
    if (c.name == name) return c;
  throw std::runtime_error("no check " + name);
}

std::vector<FitnessCheck> checks_for(const GridSpec& spec, SchemeKind kind) {
  const Mesh mesh = test::mesh_of(test::make_box_grid(spec));
  const ReadoutScheme scheme = make_scheme(kind, HotSpotType::a, 10.0);
  const auto hosts = hosts_of(mesh, scheme);
  const long long toe_cell = Locator(mesh).locate(Vec3(30.1, 20.1, 9.9), 0.1)->cell;
  return check_station_fitness(mesh, scheme, 10.0, Vec3::UnitY(), toe_cell, hosts);
}

// IIW 2016 sec. 3.3 (from memory): the fine-mesh schemes want elements no longer than 0.4t (4 mm at t = 10 mm).
TEST(Fitness, ElementSizeAgainstTheFineMeshRule) {
  EXPECT_TRUE(find(checks_for({60, 60, 10, 12, 24, 4, GridCell::hex8}, SchemeKind::fine_linear), "element size").passed);
  const auto coarse = checks_for({60, 60, 10, 12, 6, 4, GridCell::hex8}, SchemeKind::fine_linear);
  EXPECT_FALSE(find(coarse, "element size").passed);
  EXPECT_NE(find(coarse, "element size").detail.find("element at the toe is 10 mm long across the toe"),
            std::string::npos);
}

// Lotsberg et al., Procedia Structural Integrity 57 (2024): quadratic read-out points each in a separate element.
TEST(Fitness, QuadraticReadoutPointsNeedSeparateElements) {
  EXPECT_TRUE(
      find(checks_for({60, 60, 10, 12, 24, 4, GridCell::hex8}, SchemeKind::fine_quadratic), "separate elements").passed);
  EXPECT_FALSE(
      find(checks_for({60, 60, 10, 12, 3, 4, GridCell::hex8}, SchemeKind::fine_quadratic), "separate elements").passed);
}

// IIW 2016 sec. 3.3 (from memory): the coarse t x t scheme assumes higher-order elements.
TEST(Fitness, CoarseSchemeWantsHigherOrderElements) {
  EXPECT_FALSE(find(checks_for({60, 60, 10, 6, 6, 1, GridCell::hex8}, SchemeKind::coarse_linear), "element order").passed);
  const auto quadratic = checks_for({60, 60, 10, 6, 6, 1, GridCell::hex20}, SchemeKind::coarse_linear);
  EXPECT_TRUE(find(quadratic, "element order").passed);
  EXPECT_TRUE(find(quadratic, "element size").passed);  // 10 mm = t x t
}

TEST(Fitness, StretchedCellsAreFlagged) {
  EXPECT_TRUE(find(checks_for({60, 60, 10, 12, 24, 4, GridCell::hex8}, SchemeKind::fine_linear), "cell shape").passed);
  const auto stretched = checks_for({60, 60, 10, 1, 24, 4, GridCell::hex8}, SchemeKind::fine_linear);
  EXPECT_FALSE(find(stretched, "cell shape").passed);
  EXPECT_EQ(find(stretched, "cell shape").detail,
            "largest edge ratio of the read-out cells is 24 (limit 5, common practice)");
}

}  // namespace
}  // namespace toehold
