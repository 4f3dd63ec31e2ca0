// Stations along a weld toe: where the hot-spot stress is evaluated, each with its local frame (tangent along the
// toe, plate surface normal, read-out direction in the plate surface perpendicular to the toe, away from the weld).
#pragma once

#include "toehold/common/tensor.hpp"
#include "toehold/hotspot/toe_frame.hpp"
#include "toehold/model/surface.hpp"
#include "toehold/toe/toe_line.hpp"
#include "toehold/toe/weld_side.hpp"

#include <string>
#include <vector>

namespace toehold {

struct Station {
  int id = 0;               // 1-based, in order along the toe
  Vec3 x = Vec3::Zero();    // mm, on the model surface
  double arc = 0.0;         // mm along the toe from its first point
  long long node = -1;      // mesh point id when the station sits on a toe node
  ToeFrame frame;           // unit vectors
  int facet = -1;           // plate facet the read-out path starts on; -1 when the frame could not be set up
  std::string problem;      // why the frame could not be set up (empty when it could)
};

// Stations at the toe's points (spacing_mm <= 0) or every spacing_mm along it (ends included for open toes),
// each with its frame. A station whose frame cannot be set up (no plate facet on the side away from the weld)
// carries the reason in `problem`; `what` names the toe in those reasons.
std::vector<Station> make_stations(const Surface& surface, const ToeLine& toe, const WeldSide& weld,
                                   double spacing_mm, const std::string& what);

}  // namespace toehold
