#include "toehold/readout/extrapolation.hpp"

#include "toehold/common/error.hpp"

#include <cmath>
#include <cstddef>
#include <sstream>
#include <string>

namespace toehold {
namespace {

std::string number(double v) {
  std::ostringstream os;
  os << v;
  return os.str();
}

void check_positions(double x0, const std::vector<double>& xs) {
  if (xs.empty()) throw Error("Lagrange extrapolation: no sample positions given; give at least one");
  if (!std::isfinite(x0)) throw Error("Lagrange extrapolation: target position is not a finite number");
  for (std::size_t i = 0; i < xs.size(); ++i) {
    if (!std::isfinite(xs[i]))
      throw Error("Lagrange extrapolation: sample position " + std::to_string(i + 1) + " is not a finite number");
    for (std::size_t j = 0; j < i; ++j)
      if (xs[i] == xs[j])
        throw Error("Lagrange extrapolation: sample positions " + std::to_string(j + 1) + " and " +
                    std::to_string(i + 1) + " are both " + number(xs[i]) + "; give distinct positions");
  }
}

// Weight of sample i: the i-th Lagrange basis polynomial evaluated at x0.
double basis_at(double x0, const std::vector<double>& xs, std::size_t i) {
  double c = 1.0;
  for (std::size_t j = 0; j < xs.size(); ++j)
    if (j != i) c *= (x0 - xs[j]) / (xs[i] - xs[j]);
  return c;
}

}  // namespace

std::vector<double> lagrange_weights(double x0, const std::vector<double>& xs) {
  check_positions(x0, xs);
  std::vector<double> weights(xs.size());
  for (std::size_t i = 0; i < xs.size(); ++i) weights[i] = basis_at(x0, xs, i);
  return weights;
}

}  // namespace toehold
