#include "toehold/common/error.hpp"
#include "toehold/readout/extrapolation.hpp"
#include "support/support.hpp"

#include <cmath>
#include <numeric>

namespace toehold {

// IIW 2016 sec. 3.3, from memory [M]: 1.67 s(0.4t) - 0.67 s(1.0t); exact weights 5/3 and -2/3 derived [D]:
// c0 = (0 - 1.0) / (0.4 - 1.0) = 5/3, c1 = (0 - 0.4) / (1.0 - 0.4) = -2/3.
TEST(Extrapolation, IiwFineLinearWeights) {
  const auto c = lagrange_weights(0.0, {0.4, 1.0});
  ASSERT_EQ(c.size(), 2u);
  EXPECT_CLOSE(c[0], 5.0 / 3.0, 1e-14);
  EXPECT_CLOSE(c[1], -2.0 / 3.0, 1e-14);
}

// IIW 2016 sec. 3.3, from memory [M]: 2.52 s(0.4t) - 2.24 s(0.9t) + 0.72 s(1.4t), exact [D]:
// c0 = (0.9 * 1.4) / (0.5 * 1.0) = 2.52, c1 = (0.4 * 1.4) / (0.5 * -0.5) = -2.24, c2 = (0.4 * 0.9) / (1.0 * 0.5) = 0.72.
TEST(Extrapolation, IiwFineQuadraticWeights) {
  const auto c = lagrange_weights(0.0, {0.4, 0.9, 1.4});
  ASSERT_EQ(c.size(), 3u);
  EXPECT_CLOSE(c[0], 2.52, 1e-14);
  EXPECT_CLOSE(c[1], -2.24, 1e-14);
  EXPECT_CLOSE(c[2], 0.72, 1e-14);
}

// IIW 2016 sec. 3.3 and DNVGL-RP-C203 2016 sec. 4.3, from memory [M]: 1.50 s(0.5t) - 0.50 s(1.5t).
TEST(Extrapolation, CoarseLinearWeights) {
  const auto c = lagrange_weights(0.0, {0.5, 1.5});
  EXPECT_CLOSE(c[0], 1.5, 1e-14);
  EXPECT_CLOSE(c[1], -0.5, 1e-14);
}

// IIW 2016 sec. 3.3, from memory [M], weights derived [D]: type b fine 3 s(4) - 3 s(8) + s(12);
// c0 = (8 * 12) / (4 * 8) = 3, c1 = (4 * 12) / (4 * -4) = -3, c2 = (4 * 8) / (8 * 4) = 1.
TEST(Extrapolation, TypeBFineWeights) {
  const auto c = lagrange_weights(0.0, {4.0, 8.0, 12.0});
  EXPECT_CLOSE(c[0], 3.0, 1e-14);
  EXPECT_CLOSE(c[1], -3.0, 1e-14);
  EXPECT_CLOSE(c[2], 1.0, 1e-14);
}

// IIW 2016 sec. 3.3, from memory [M], derived [D]: type b coarse 1.5 s(5) - 0.5 s(15).
TEST(Extrapolation, TypeBCoarseWeights) {
  const auto c = lagrange_weights(0.0, {5.0, 15.0});
  EXPECT_CLOSE(c[0], 1.5, 1e-14);
  EXPECT_CLOSE(c[1], -0.5, 1e-14);
}

// Derived [D]: weights through n points reproduce any polynomial of degree < n, here f = 2 + 3x - x^2 at x0 = 0.5:
// f(0.5) = 2 + 1.5 - 0.25 = 3.25. Points in any order.
TEST(Extrapolation, ReproducesQuadraticAtAnyTarget) {
  const std::vector<double> xs{3.0, 1.0, 7.0};
  const auto c = lagrange_weights(0.5, xs);
  double sum = 0;
  for (std::size_t i = 0; i < xs.size(); ++i) sum += c[i] * (2 + 3 * xs[i] - xs[i] * xs[i]);
  EXPECT_CLOSE(sum, 3.25, 1e-13);
  EXPECT_CLOSE(std::accumulate(c.begin(), c.end(), 0.0), 1.0, 1e-14);
}

TEST(Extrapolation, OnePointGivesWeightOne) {
  const auto c = lagrange_weights(0.0, {5.0});
  ASSERT_EQ(c.size(), 1u);
  EXPECT_EQ(c[0], 1.0);
}

TEST(Extrapolation, RepeatedPositionIsAnError) {
  try {
    lagrange_weights(0.0, {0.4, 0.9, 0.4});
    FAIL();
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()),
              "Lagrange extrapolation: sample positions 1 and 3 are both 0.4; give distinct positions");
  }
  EXPECT_THROW(lagrange_weights(0.0, {}), Error);
  EXPECT_THROW(lagrange_weights(0.0, {1.0, std::nan("")}), Error);
}

}  // namespace toehold
