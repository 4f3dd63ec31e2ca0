// The through-thickness linearization at one station (ASME BPVC VIII-2 Annex 5-A), beside the surface
// extrapolation, so that the two structural stresses can be compared; and the stress 1 mm below the surface on
// the same line (Xiao and Yamada, Int. J. Fatigue 26, 2004).
#pragma once

#include <limits>
#include <string>
#include <vector>

namespace toehold {

struct ThroughThicknessResult {
  std::string rule;         // "gauss-lobatto" or "simpson"
  int points = 0;           // samples along the line
  double thickness = 0.0;   // mm: line length (the toe's t), along -frame.normal from the toe surface
  // Per load step (unit case): the parts' normal stress across the toe, readout . part . readout, MPa. The bending
  // part is its value at the toe surface (tension there positive); structural = membrane + bending; peak = the
  // stress at the toe surface minus structural.
  std::vector<double> membrane, bending, structural, peak;
  std::vector<double> hot_spot;  // per step: the toe's hot-spot definition on the structural tensor, MPa
  std::vector<double> one_mm;    // per step: the definition on the tensor 1 mm below the surface; empty when t < 1 mm
  // Largest range between any two steps (the definition applied to the tensor difference, as for the surface
  // route), MPa; NaN for unit-cases (per-case values only) and when there is no valid range.
  double structural_range = std::numeric_limits<double>::quiet_NaN();
  int range_from = -1, range_to = -1;  // the two steps of structural_range (indices into Assessment::steps)
  double one_mm_range = std::numeric_limits<double>::quiet_NaN();
  std::string problem;  // why the station has no linearized value (the line leaves the model, enters the weld, ...)
  std::string note;     // a remark that does not void it (the model goes on beyond t)
  double stop_depth = std::numeric_limits<double>::quiet_NaN();  // mm below the surface where the line leaves the
                                                                 // model or enters the weld; NaN when it does not

  bool ok() const { return problem.empty(); }
};

}  // namespace toehold
