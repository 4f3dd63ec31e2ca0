// The line through the plate thickness at a toe station, located once in the mesh, for through-thickness
// linearization (ASME BPVC VIII-2 Annex 5-A) beside the surface extrapolation. The line must stay in the plate:
// where it leaves the model or enters the weld is reported, not passed over.
#pragma once

#include "toehold/common/tensor.hpp"
#include "toehold/model/locator.hpp"
#include "toehold/toe/weld_side.hpp"

#include <string>
#include <vector>

namespace toehold {

struct ThicknessLine {
  std::vector<double> depths;  // mm below the toe surface, ascending, one per host
  std::vector<Host> hosts;     // where each depth was located; reused for every load step
  std::string problem;         // why the line cannot be used (empty when it can)
  std::string note;            // a remark that does not void it (e.g. the plate goes on beyond t)
  double stop_depth = -1.0;    // mm below the surface where the line leaves the model or enters the weld; -1 if not
};

// Locates the points x - depth * normal (x: toe station on the surface, mm; normal: unit outward surface normal;
// depths: mm, ascending, from 0 to the thickness t). At depth 0 a plate cell is taken, not a weld cell that
// shares the toe. Points further than `tolerance` mm from every cell make
// the problem "leaves the model at ... mm", points in weld cells "enters the weld at ... mm". When a point 2 % of t
// beyond the far surface is still in the model, the note says the plate seems thicker than t there.
ThicknessLine place_thickness_line(const Locator& locator, const WeldSide& weld, const Vec3& x, const Vec3& normal,
                                   double thickness, const std::vector<double>& depths, double tolerance);

}  // namespace toehold
