#include "toehold/hotspot/linearization.hpp"

#include "toehold/common/error.hpp"
#include "toehold/readout/extrapolation.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <cstddef>
#include <numbers>
#include <sstream>
#include <utility>

namespace toehold {
namespace {

constexpr std::array<std::pair<std::string_view, ThroughThicknessRule>, 2> kRuleNames{{
    {"gauss-lobatto", ThroughThicknessRule::gauss_lobatto},
    {"simpson", ThroughThicknessRule::simpson},
}};
constexpr int kMaxLobatto = 64;
constexpr int kMaxSimpson = 100001;
constexpr double kStationTolerance = 1e-6;  // fraction of t by which a sample may miss its station
constexpr double kOneMm = 1.0;              // Xiao and Yamada (2004): 1 mm below the surface
const std::string kWhat = "through-thickness linearization: ";

std::string number(double v) {
  std::ostringstream os;
  os << v;
  return os.str();
}

// Integration rule on [0, t]: int_0^t f dx ~ sum_i w[i] f(x[i]).
struct Rule {
  std::vector<double> x;
  std::vector<double> w;
};

// Legendre P_{N-1}(x) and P_N(x) by the three-term recurrence, N >= 1.
std::pair<double, double> legendre_pair(int N, double x) {
  double previous = 1.0, current = x;
  for (int k = 2; k <= N; ++k) {
    const double next = ((2.0 * k - 1.0) * x * current - (k - 1.0) * previous) / k;
    previous = current;
    current = next;
  }
  return {previous, current};
}

// Gauss-Lobatto nodes: the ends and the roots of P'_{n-1}, by Newton's method from the Chebyshev-Lobatto points;
// weights 2 / (n (n-1) P_{n-1}(x)^2). Mapped from [-1, 1] to [0, t].
Rule lobatto(double t, int n) {
  const int N = n - 1;
  Rule r{std::vector<double>(static_cast<std::size_t>(n)), std::vector<double>(static_cast<std::size_t>(n))};
  for (int i = 0; i < n; ++i) {
    double xi = -std::cos(std::numbers::pi * i / N);
    for (int iter = 0; iter < 100; ++iter) {
      const auto [p_prev, p_n] = legendre_pair(N, xi);
      const double step = (xi * p_n - p_prev) / (n * p_n);
      xi -= step;
      if (std::abs(step) < 1e-15) break;
    }
    const double p_n = legendre_pair(N, xi).second;
    r.x[static_cast<std::size_t>(i)] = 0.5 * t * (1.0 + xi);
    r.w[static_cast<std::size_t>(i)] = 0.5 * t * 2.0 / (N * n * p_n * p_n);
  }
  r.x.front() = 0.0;
  r.x.back() = t;
  return r;
}

// Composite Simpson on n equally spaced points (n odd).
Rule simpson(double t, int n) {
  const double h = t / (n - 1);
  Rule r{std::vector<double>(static_cast<std::size_t>(n)), std::vector<double>(static_cast<std::size_t>(n))};
  for (int i = 0; i < n; ++i) {
    const bool end = i == 0 || i == n - 1;
    r.x[static_cast<std::size_t>(i)] = i * h;
    r.w[static_cast<std::size_t>(i)] = h / 3.0 * (end ? 1.0 : (i % 2 == 1 ? 4.0 : 2.0));
  }
  r.x.back() = t;
  return r;
}

Rule make_rule(double t, int n, ThroughThicknessRule rule) {
  if (!std::isfinite(t) || t <= 0)
    throw Error(kWhat + "thickness " + number(t) + " mm is not positive; give the plate thickness along the line in mm");
  if (rule == ThroughThicknessRule::gauss_lobatto) {
    if (n < 3 || n > kMaxLobatto)
      throw Error(kWhat + std::to_string(n) + " gauss-lobatto stations requested; use 3 to " +
                  std::to_string(kMaxLobatto));
    return lobatto(t, n);
  }
  if (n < 3 || n > kMaxSimpson || n % 2 == 0)
    throw Error(kWhat + std::to_string(n) + " simpson stations requested; use an odd number from 3 to " +
                std::to_string(kMaxSimpson));
  return simpson(t, n);
}

// Coefficients c such that each result = sum_i c[i] s[i].
struct Combination {
  std::vector<double> membrane, bending, one_mm;
};

std::vector<double> one_mm_weights(const Rule& r, double t, ThroughThicknessRule rule) {
  if (t < kOneMm) return {};
  if (rule == ThroughThicknessRule::gauss_lobatto) return lagrange_weights(kOneMm, r.x);
  const std::size_t panels = (r.x.size() - 1) / 2;
  const double panel_width = 2.0 * (r.x[1] - r.x[0]);
  const std::size_t k = std::min(panels - 1, static_cast<std::size_t>(kOneMm / panel_width));
  const std::vector<double> local = lagrange_weights(kOneMm, {r.x[2 * k], r.x[2 * k + 1], r.x[2 * k + 2]});
  std::vector<double> c(r.x.size(), 0.0);
  std::copy(local.begin(), local.end(), c.begin() + static_cast<std::ptrdiff_t>(2 * k));
  return c;
}

void check_stations(const std::vector<double>& x_mm, const Rule& r, double t, ThroughThicknessRule rule) {
  for (std::size_t i = 0; i < x_mm.size(); ++i)
    if (!(std::abs(x_mm[i] - r.x[i]) <= kStationTolerance * t))
      throw Error(kWhat + "sample " + std::to_string(i + 1) + " is at " + number(x_mm[i]) + " mm but " +
                  to_string(rule) + " station " + std::to_string(i + 1) + " of " + std::to_string(x_mm.size()) +
                  " for t = " + number(t) + " mm is at " + number(r.x[i]) +
                  " mm; sample at linearization_stations(t, n)");
}

Combination combination(const std::vector<double>& x_mm, std::size_t values, double t, ThroughThicknessRule rule) {
  if (values != x_mm.size())
    throw Error(kWhat + std::to_string(values) + " values given for " + std::to_string(x_mm.size()) +
                " positions; give one value per position");
  if (x_mm.size() > static_cast<std::size_t>(kMaxSimpson))
    throw Error(kWhat + std::to_string(x_mm.size()) + " samples given; use at most " + std::to_string(kMaxSimpson));
  const Rule r = make_rule(t, static_cast<int>(x_mm.size()), rule);
  check_stations(x_mm, r, t, rule);
  Combination c{r.w, r.w, one_mm_weights(r, t, rule)};
  for (std::size_t i = 0; i < r.x.size(); ++i) {
    c.membrane[i] /= t;
    c.bending[i] *= 6.0 / (t * t) * (0.5 * t - r.x[i]);
  }
  return c;
}

bool finite(double v) { return std::isfinite(v); }
bool finite(const Tensor& v) { return v.allFinite(); }

template <class Value>
void check_values(const std::vector<Value>& s) {
  for (std::size_t i = 0; i < s.size(); ++i)
    if (!finite(s[i])) throw Error(kWhat + "sample " + std::to_string(i + 1) + " is not a finite number");
}

template <class Value>
Value combine(const std::vector<double>& c, const std::vector<Value>& s, Value sum) {
  for (std::size_t i = 0; i < s.size(); ++i) sum += c[i] * s[i];
  return sum;
}

}  // namespace

std::vector<double> linearization_stations(double t, int n, ThroughThicknessRule rule) {
  return make_rule(t, n, rule).x;
}

Linearized linearize(const std::vector<double>& x_mm, const std::vector<double>& s, double t,
                     ThroughThicknessRule rule) {
  const Combination c = combination(x_mm, s.size(), t, rule);
  check_values(s);
  Linearized out;
  out.membrane = combine(c.membrane, s, 0.0);
  out.bending = combine(c.bending, s, 0.0);
  out.structural = out.membrane + out.bending;
  out.peak = s.front() - out.structural;
  if (!c.one_mm.empty()) out.one_mm_below = combine(c.one_mm, s, 0.0);
  return out;
}

LinearizedTensor linearize(const std::vector<double>& x_mm, const std::vector<Tensor>& s, double t,
                           ThroughThicknessRule rule) {
  const Combination c = combination(x_mm, s.size(), t, rule);
  check_values(s);
  LinearizedTensor out;
  out.membrane = combine(c.membrane, s, Tensor(Tensor::Zero()));
  out.bending = combine(c.bending, s, Tensor(Tensor::Zero()));
  out.structural = out.membrane + out.bending;
  out.peak = s.front() - out.structural;
  if (!c.one_mm.empty()) out.one_mm_below = combine(c.one_mm, s, Tensor(Tensor::Zero()));
  return out;
}

ThroughThicknessRule parse_through_thickness_rule(std::string_view text, const std::string& where) {
  for (const auto& [name, value] : kRuleNames)
    if (name == text) return value;
  std::string list;
  for (const auto& [name, value] : kRuleNames) list += (list.empty() ? "" : ", ") + std::string(name);
  throw Error(where + ": unknown through-thickness rule '" + std::string(text) + "'; use one of " + list);
}

std::string to_string(ThroughThicknessRule rule) {
  for (const auto& [name, value] : kRuleNames)
    if (value == rule) return std::string(name);
  return "?";
}

}  // namespace toehold
