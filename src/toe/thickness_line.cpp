#include "toehold/toe/thickness_line.hpp"

#include <sstream>

namespace toehold {
namespace {

std::string at_depth(const char* what, double depth) {
  std::ostringstream os;
  os.precision(4);
  os << "the through-thickness line " << what << " at " << depth << " mm below the surface";
  return os.str();
}

}  // namespace

ThicknessLine place_thickness_line(const Locator& locator, const WeldSide& weld, const Vec3& x, const Vec3& normal,
                                   double thickness, const std::vector<double>& depths, double tolerance) {
  ThicknessLine line;
  const Vec3 inward = -normal.normalized();
  for (double depth : depths) {
    const auto refuse = [&](long long cell) { return depth == 0.0 && weld.is_weld_cell(cell); };
    const auto host = locator.locate(x + depth * inward, tolerance, refuse);
    if (!host) {
      line.problem = at_depth("leaves the model", depth);
      line.stop_depth = depth;
      break;
    }
    if (weld.is_weld_cell(host->cell)) {
      line.problem = at_depth("enters the weld", depth);
      line.stop_depth = depth;
      break;
    }
    line.depths.push_back(depth);
    line.hosts.push_back(*host);
  }
  if (line.problem.empty() && locator.locate(x + 1.02 * thickness * inward, 0.0))
    line.note = "the model goes on beyond the plate thickness along the surface normal: check t";
  return line;
}

}  // namespace toehold
