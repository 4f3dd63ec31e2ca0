// Weld toes in shell models. The weld is not modelled: the toe follows the
// intersection line of two plates (the facet edges where three or more shell
// facets meet, or a fold), found from a node-marker array or coordinates. Each
// station gets its frame on the plate that carries the toe, the layer (top or
// bottom surface) the hot spot lies on, and the offset from the intersection
// line to the hot-spot location (0, or half the attached plate's thickness plus
// the weld leg). See docs/shell-models.md.
#pragma once

#include "toehold/common/tensor.hpp"
#include "toehold/hotspot/toe_frame.hpp"
#include "toehold/model/locator.hpp"
#include "toehold/shell/shell_layers.hpp"
#include "toehold/shell/shell_surface.hpp"
#include "toehold/toe/toe_line.hpp"

#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace toehold {

// Where the hot-spot location, and so the origin of the read-out distances,
// lies across the toe.
enum class ToeOrigin {
  intersection, // on the intersection line of the plate mid-surfaces (weld not
                // accounted for)
  weld_toe,     // at the weld toe: half the attached plate's thickness plus the
                // weld leg from the intersection line
};

struct ShellToeSpec {
  std::string name; // for messages, e.g. "toe 1"
  // The toe line: a point-data marker array and value, or (when marker_array is
  // empty) a polyline in mm; the toe nodes are then the intersection-line nodes
  // within tolerance_mm of the polyline.
  std::string marker_array;
  int marker_value = 1;
  std::vector<Vec3> points;  // mm
  double tolerance_mm = 0.5; // mm
  // The plate that carries the toe: a cell-data region array and value, and/or
  // a point on that plate (mm) on the read-out side. A point is needed when the
  // region's plate runs on both sides of the intersection line.
  std::string region_array;
  int plate_value = 0;
  std::optional<Vec3> plate_point;
  LayerChoice layer = LayerChoice::weld_side;
  ToeOrigin origin = ToeOrigin::intersection;
  double weld_leg_mm =
      0.0; // weld leg on the plate, mm (ToeOrigin::weld_toe only; > 0 there)
  double spacing_mm = 0.0;      // stations at the toe nodes (<= 0) or every
                                // spacing_mm mm along the toe
  double kink_limit_deg = 30.0; // degrees between facet planes taken as a fold
};

struct ShellReadoutPoint {
  double distance =
      0.0; // mm from the hot-spot location (the read-out scheme's distance)
  double from_intersection =
      0.0; // mm from the intersection line along the plate mid-surface
  Vec3 x = Vec3::Zero(); // mm, on the mid-surface
  Host host; // shell cell, parametric coordinates (r, s, 0) and weights of its
             // points
};

struct ShellStation {
  int id = 0;            // 1-based, in order along the toe
  Vec3 x = Vec3::Zero(); // mm, on the intersection line (mid-surface)
  double arc = 0.0;      // mm along the toe from its first point
  long long node = -1;   // mesh point id when the station sits on a toe node
  int facet = -1; // plate facet the read-out path starts on; -1 when the frame
                  // could not be set up
  ToeFrame frame; // normal: outward normal of the layer surface (+- the cell
                  // normal); readout: in the plate's mid-surface, perpendicular
                  // to the toe, away from the junction
  ShellLayer layer = ShellLayer::top;
  double thickness = 0.0; // mm, of the plate cell at the toe
  double offset = 0.0; // mm from the intersection line to the hot-spot location
  Vec3 hot_spot =
      Vec3::Zero(); // mm: the hot-spot location on the layer surface
  std::vector<ShellReadoutPoint>
      points;             // after place_shell_readout, one per distance
  std::vector<Vec3> path; // the walked read-out path on the mid-surface, mm
  std::string problem; // why the station has no value (empty when it has one)
  std::vector<std::string> notes; // remarks that do not void the value
};

struct ShellToe {
  std::string name;
  ToeLine line; // the toe nodes in order, mm
  std::vector<ShellStation> stations;
};

// Chains the toe nodes and sets up the stations with frame, layer, thickness
// and offset (no read-out points yet). Throws Error naming the toe (and array)
// for a missing or multi-component marker or region array (values are rounded
// to integers), no toe node, nodes that do not lie on a plate intersection
// line, a branching or broken line, no way to tell the plate (neither a region
// nor a point, or a region on both sides of the line without a point), and
// ToeOrigin::weld_toe without a positive weld leg. A station whose layer or
// frame cannot be told gets `problem` instead.
ShellToe trace_shell_toe(const ShellSurface &surface, const ShellToeSpec &spec);

// Walks the read-out path of `station` along its plate and locates each point
// at distances_mm (mm from the hot-spot location, ascending; e.g.
// make_scheme(kind, type, station.thickness).distances) in its shell cell. Sets
// `problem` when the path stops short, and when shell normals flip among the
// cells the station uses (those at the toe, walked over and hosting read-out
// points).
void place_shell_readout(const ShellSurface &surface, const ShellToeSpec &spec,
                         ShellStation &station,
                         const std::vector<double> &distances_mm);

// The layer stress tensors at the station's read-out points (MPa, global axes),
// from its layer of `layers`; the host cell's own shape functions interpolate
// point data, cell data is the host cell's value.
std::vector<Tensor> shell_readings(const ShellStation &station,
                                   const ShellLayerStress &layers);

// The strings users type, in one place: "intersection", "weld-toe" (or
// "weld_toe"). Parsing throws Error naming `where` and listing the accepted
// spellings.
ToeOrigin parse_toe_origin(std::string_view text, const std::string &where);
std::string to_string(ToeOrigin origin);

} // namespace toehold
