// Lagrange extrapolation of read-out stresses to the weld toe: the weights that turn stresses sampled at a few
// distances from the toe into the polynomial's value at the toe. Used by every read-out scheme.
#pragma once

#include <vector>

namespace toehold {

// Weights c_i such that p(x0) = sum_i c_i f(xs[i]) for the Lagrange polynomial p of degree xs.size() - 1 through
// the points (xs[i], f(xs[i])): c_i = prod_{j != i} (x0 - xs[j]) / (xs[i] - xs[j]).
//   x0: where the polynomial is evaluated, same length unit as xs (0 = the toe for read-out schemes).
//   xs: sample positions, any length unit, any order, at least one, all distinct and finite.
// The weights sum to 1 (a constant field is reproduced). Throws Error for an empty list, a non-finite position or
// two equal positions.
std::vector<double> lagrange_weights(double x0, const std::vector<double>& xs);

}  // namespace toehold
