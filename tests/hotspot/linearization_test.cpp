#include "toehold/common/error.hpp"
#include "toehold/hotspot/linearization.hpp"
#include "support/support.hpp"

#include <cmath>
#include <functional>

namespace toehold {
namespace {

using Field = std::function<double(double)>;

std::vector<double> sample(const std::vector<double>& x, const Field& f) {
  std::vector<double> s;
  for (double xi : x) s.push_back(f(xi));
  return s;
}

Linearized run(double t, int n, ThroughThicknessRule rule, const Field& f) {
  const std::vector<double> x = linearization_stations(t, n, rule);
  return linearize(x, sample(x, f), t, rule);
}

std::string error_of(const std::function<void()>& g) {
  try {
    g();
  } catch (const Error& e) {
    return e.what();
  }
  return "(no error)";
}

}  // namespace

// ASME BPVC VIII-2 Annex 5-A [S2 + M]: pure bending s(x) = sb (1 - 2x/t) has membrane 0 and bending sb at x = 0,
// hand calculation [D]: (1/t) int (1 - 2x/t) dx = 0; (6/t^2) int (1 - 2x/t)(t/2 - x) dx = (12/t^3)(t^3/12) = 1.
TEST(Linearization, PureBendingGivesBendingOnly) {
  const Field f = [](double x) { return 150.0 * (1.0 - 2.0 * x / 20.0); };
  for (auto [n, rule] : {std::pair{3, ThroughThicknessRule::gauss_lobatto}, std::pair{7, ThroughThicknessRule::gauss_lobatto},
                         std::pair{5, ThroughThicknessRule::simpson}}) {
    const Linearized l = run(20.0, n, rule, f);
    EXPECT_CLOSE(l.membrane, 0.0, 1e-12);
    EXPECT_CLOSE(l.bending, 150.0, 1e-12);
    EXPECT_CLOSE(l.structural, 150.0, 1e-12);
    EXPECT_CLOSE(l.peak, 0.0, 1e-12);
    ASSERT_TRUE(l.one_mm_below.has_value());
    EXPECT_CLOSE(*l.one_mm_below, 150.0 * 0.9, 1e-12);  // Xiao and Yamada (2004) [S]: stress 1 mm below the surface
  }
}

// Hand calculation [D] for s = a + b x + c x^2 on [0, t]:
//   membrane = a + b t/2 + c t^2/3;  bending = (6/t^2)(-b t^3/12 - c t^4/12) = -b t/2 - c t^2/2
//   structural = a - c t^2/6;  peak = s(0) - structural = c t^2/6
// With t = 20, a = 100, b = -5, c = 0.2: membrane 76.6667, bending 10, structural 86.6667, peak 13.3333,
// s(1 mm) = 100 - 5 + 0.2 = 95.2.
TEST(Linearization, LinearPlusQuadraticGivesAnalyticSplit) {
  const Field f = [](double x) { return 100.0 - 5.0 * x + 0.2 * x * x; };
  for (auto [n, rule] : {std::pair{3, ThroughThicknessRule::gauss_lobatto}, std::pair{5, ThroughThicknessRule::gauss_lobatto},
                         std::pair{3, ThroughThicknessRule::simpson}, std::pair{11, ThroughThicknessRule::simpson}}) {
    const Linearized l = run(20.0, n, rule, f);
    EXPECT_CLOSE(l.membrane, 100.0 - 50.0 + 0.2 * 400.0 / 3.0, 1e-12);
    EXPECT_CLOSE(l.bending, 10.0, 1e-12);
    EXPECT_CLOSE(l.structural, 100.0 - 0.2 * 400.0 / 6.0, 1e-12);
    EXPECT_CLOSE(l.peak, 0.2 * 400.0 / 6.0, 1e-12);
    EXPECT_CLOSE(*l.one_mm_below, 95.2, 1e-12);
  }
}

// Hand calculation [D] for s = x^3, t = 10: membrane = t^3/4 = 250; bending = (6/t^2)(t^5/8 - t^5/5) = -9t^3/20 =
// -450; structural -200; peak 0 - (-200) = 200; s(1) = 1. Five Lobatto points are exact up to degree 6.
TEST(Linearization, CubicIsExactWithFiveLobattoPoints) {
  const Linearized l = run(10.0, 5, ThroughThicknessRule::gauss_lobatto, [](double x) { return x * x * x; });
  EXPECT_CLOSE(l.membrane, 250.0, 1e-12);
  EXPECT_CLOSE(l.bending, -450.0, 1e-12);
  EXPECT_CLOSE(l.structural, -200.0, 1e-12);
  EXPECT_CLOSE(l.peak, 200.0, 1e-12);
  EXPECT_CLOSE(*l.one_mm_below, 1.0, 1e-12);
}

// Hand calculation [D] for a decaying notch field s = 100 exp(-x/L), L = 5, t = 20, E = exp(-t/L):
//   membrane = (100 L / t)(1 - E);  int (t/2 - x) exp(-x/L) dx = (t/2) L (1 - E) - L^2 (1 - E (1 + t/L))
//   bending = (6/t^2) 100 [that integral]
TEST(Linearization, SmoothFieldConvergesForBothRules) {
  const double t = 20.0, L = 5.0, E = std::exp(-t / L);
  const double membrane = 100.0 * L / t * (1.0 - E);
  const double bending = 6.0 / (t * t) * 100.0 * (0.5 * t * L * (1.0 - E) - L * L * (1.0 - E * (1.0 + t / L)));
  const Field f = [L](double x) { return 100.0 * std::exp(-x / L); };
  const Linearized g = run(t, 16, ThroughThicknessRule::gauss_lobatto, f);
  EXPECT_CLOSE(g.membrane, membrane, 1e-12);
  EXPECT_CLOSE(g.bending, bending, 1e-12);
  EXPECT_CLOSE(*g.one_mm_below, 100.0 * std::exp(-1.0 / L), 1e-12);
  const Linearized s = run(t, 401, ThroughThicknessRule::simpson, f);
  EXPECT_CLOSE(s.membrane, membrane, 1e-8);
  EXPECT_CLOSE(s.bending, bending, 1e-8);
  EXPECT_CLOSE(*s.one_mm_below, 100.0 * std::exp(-1.0 / L), 1e-8);
}

// Component-wise on tensors: each component follows the scalar hand calculation above.
TEST(Linearization, TensorsLinearizeComponentByComponent) {
  const double t = 20.0;
  const std::vector<double> x = linearization_stations(t, 4);
  std::vector<Tensor> s;
  for (double xi : x) {
    Tensor m = Tensor::Zero();
    m(0, 0) = 150.0 * (1.0 - 2.0 * xi / t);                  // pure bending
    m(0, 1) = m(1, 0) = 100.0 - 5.0 * xi + 0.2 * xi * xi;     // linear + quadratic
    m(2, 2) = 30.0;                                          // membrane only
    s.push_back(m);
  }
  const LinearizedTensor l = linearize(x, s, t);
  EXPECT_CLOSE(l.membrane(0, 0), 0.0, 1e-12);
  EXPECT_CLOSE(l.bending(0, 0), 150.0, 1e-12);
  EXPECT_CLOSE(l.bending(1, 0), 10.0, 1e-12);
  EXPECT_CLOSE(l.structural(0, 1), 100.0 - 0.2 * 400.0 / 6.0, 1e-12);
  EXPECT_CLOSE(l.peak(1, 0), 0.2 * 400.0 / 6.0, 1e-12);
  EXPECT_CLOSE(l.membrane(2, 2), 30.0, 1e-12);
  EXPECT_CLOSE(l.bending(2, 2), 0.0, 1e-12);
  EXPECT_CLOSE((*l.one_mm_below)(0, 1), 95.2, 1e-12);
}

// Derived [D]: Lobatto interior nodes are the roots of P'_{n-1}: n = 4 -> +-1/sqrt(5), n = 5 -> 0, +-sqrt(3/7);
// mapped to [0, t] by x = t (1 + xi) / 2.
TEST(Linearization, LobattoStationsAreTheKnownNodes) {
  const auto x4 = linearization_stations(10.0, 4);
  ASSERT_EQ(x4.size(), 4u);
  EXPECT_EQ(x4[0], 0.0);
  EXPECT_CLOSE(x4[1], 5.0 * (1.0 - 1.0 / std::sqrt(5.0)), 1e-13);
  EXPECT_CLOSE(x4[2], 5.0 * (1.0 + 1.0 / std::sqrt(5.0)), 1e-13);
  EXPECT_EQ(x4[3], 10.0);
  const auto x5 = linearization_stations(10.0, 5);
  EXPECT_CLOSE(x5[1], 5.0 * (1.0 - std::sqrt(3.0 / 7.0)), 1e-13);
  EXPECT_CLOSE(x5[2], 5.0, 1e-13);
  const auto simpson = linearization_stations(8.0, 5, ThroughThicknessRule::simpson);
  EXPECT_EQ(simpson, (std::vector<double>{0.0, 2.0, 4.0, 6.0, 8.0}));
}

TEST(Linearization, ThinPlateHasNoOneMillimetreValue) {
  const Linearized l = run(0.8, 3, ThroughThicknessRule::gauss_lobatto, [](double) { return 10.0; });
  EXPECT_CLOSE(l.membrane, 10.0, 1e-13);
  EXPECT_FALSE(l.one_mm_below.has_value());
}

TEST(Linearization, BadInputsAreErrors) {
  EXPECT_EQ(error_of([] { linearization_stations(0.0, 5); }),
            "through-thickness linearization: thickness 0 mm is not positive; give the plate thickness along the line "
            "in mm");
  EXPECT_EQ(error_of([] { linearization_stations(10.0, 2); }),
            "through-thickness linearization: 2 gauss-lobatto stations requested; use 3 to 64");
  EXPECT_EQ(error_of([] { linearization_stations(10.0, 4, ThroughThicknessRule::simpson); }),
            "through-thickness linearization: 4 simpson stations requested; use an odd number from 3 to 100001");
  EXPECT_EQ(error_of([] { linearize({0.0, 2.0, 4.0, 6.0, 8.0}, {1.0, 1.0, 1.0, 1.0, 1.0}, 8.0); }),
            "through-thickness linearization: sample 2 is at 2 mm but gauss-lobatto station 2 of 5 for t = 8 mm is at "
            "1.38139 mm; sample at linearization_stations(t, n)");
  EXPECT_EQ(error_of([] { linearize({0.0, 4.0, 8.0}, {1.0, 1.0}, 8.0); }),
            "through-thickness linearization: 2 values given for 3 positions; give one value per position");
  EXPECT_THROW(linearize({0.0, 4.0, 8.0}, {1.0, std::nan(""), 1.0}, 8.0), Error);
  EXPECT_EQ(parse_through_thickness_rule("simpson", "x"), ThroughThicknessRule::simpson);
  EXPECT_EQ(to_string(ThroughThicknessRule::gauss_lobatto), "gauss-lobatto");
  EXPECT_EQ(error_of([] { parse_through_thickness_rule("trapezoid", "plan key hotspot.rule"); }),
            "plan key hotspot.rule: unknown through-thickness rule 'trapezoid'; use one of gauss-lobatto, simpson");
}

}  // namespace toehold
