// The through-thickness linearization at one station (ASME BPVC VIII-2 Annex 5-A), beside the surface
// extrapolation, so that the two structural stresses can be compared.
#pragma once

#include <string>

namespace toehold {

struct ThroughThicknessResult {
  std::string problem;  // why the station has no linearized value (the line leaves the model, enters the weld, ...)
};

}  // namespace toehold
