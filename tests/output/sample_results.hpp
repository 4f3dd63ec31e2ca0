// A small assessment built by hand for the output tests: two toes on a 2 x 2 x 1 brick grid (mm), one open with
// three stations that all have a result, one closed loop with a station without a result and one whose frame
// could not be set up. Values are chosen by hand; tests compare what they read back with these inputs.
#pragma once

#include "support/grid.hpp"
#include "toehold/assess/assessment.hpp"

#include <limits>
#include <string>
#include <vector>

namespace toehold::test {

struct SampleStation {
  long long node;            // grid point the station sits on; -1 for a station off the nodes
  Vec3 x_off_node;           // mm, used when node < 0
  double arc;                // mm
  std::vector<double> hot;   // MPa per step; empty: no result
  double range, allowable, utilization, life;
  int from, to;
  std::string problem;       // result problem
  std::string frame_problem; // station frame problem
};

inline StationResult make_station(vtkUnstructuredGrid* grid, int id, const SampleStation& in) {
  StationResult r;
  r.station.id = id;
  r.station.node = in.node;
  r.station.x = in.node >= 0 ? grid_point(grid, in.node) : in.x_off_node;
  r.station.arc = in.arc;
  r.station.frame.tangent = Vec3(1, 0, 0);
  r.station.frame.normal = Vec3(0, 0, 1);
  r.station.frame.readout = Vec3(0, -1, 0);
  r.station.facet = in.frame_problem.empty() ? 3 : -1;
  r.station.problem = in.frame_problem;
  r.problem = in.problem;
  r.hot_spot = in.hot;
  r.range = in.range;
  r.allowable = in.allowable;
  r.utilization = in.utilization;
  r.life = in.life;
  r.range_from = in.from;
  r.range_to = in.to;
  if (!in.frame_problem.empty()) return r;
  // Read-out points at 4 mm and 10 mm in the read-out direction (-y), normal stresses per step by hand.
  for (double d : {4.0, 10.0}) {
    ReadoutPoint p;
    p.distance = d;
    p.x = r.station.x + d * r.station.frame.readout;
    p.cell = 0;
    p.off_model = d > 5.0 ? 0.25 : 0.0;
    p.normal_stress = {100.0 - d, -20.0 + d};
    r.points.push_back(p);
  }
  r.path = {r.station.x, r.station.x + Vec3(0, -6, 0), r.station.x + Vec3(0, -6, -8)};  // 6 mm, then 8 mm more
  return r;
}

inline ToeResult make_toe(vtkUnstructuredGrid* grid, const std::string& name, bool closed, const std::string& curve,
                          const std::vector<SampleStation>& stations) {
  ToeResult t;
  t.plan.name = name;
  t.plan.closed = closed;
  t.line.closed = closed;
  t.curve = curve;
  int id = 1;
  for (const auto& s : stations) t.stations.push_back(make_station(grid, id++, s));
  return t;
}

inline constexpr double kInf = std::numeric_limits<double>::infinity();

inline Assessment sample_assessment(vtkUnstructuredGrid* grid) {
  Assessment a;
  a.plan.path = "/plans/crane, beam.toml";
  a.steps = {"hoist loaded", "lift, \"swung\""};
  a.input_files = {"/models/beam.vtu"};
  a.toes.push_back(make_toe(grid, "north, flange", false, "IIW FAT 90",
                            {{9, {}, 0.0, {120.5, -30.25}, 150.75, 90.0, 1.675, 452000.0, 1, 0, "", ""},
                             {10, {}, 1000.0, {60.0, 10.0}, 50.0, 90.0, 0.5555555555555556, kInf, 1, 0, "", ""},
                             {11, {}, 2000.0, {-5.5, 75.125}, 80.625, 90.0, 0.8958333333333334, 2.5e6, 0, 1, "", ""}}));
  a.toes.push_back(make_toe(grid, "ring", true, "IIW FAT 100",
                            {{12, {}, 0.0, {40.0, 0.0}, 40.0, 100.0, 0.4, 1.5e7, 1, 0, "", ""},
                             {13, {}, 1500.0, {}, 0.0, 0.0, 0.0, 0.0, -1, -1, "read-out path stops at a plate edge", ""},
                             {-1, Vec3(1500.0, 250.0, 1000.0), 3000.0, {}, 0.0, 0.0, 0.0, 0.0, -1, -1,
                              "no plate facet beside the toe", "no plate facet beside the toe"}}));
  a.toes[0].worst = 0;
  a.toes[1].worst = 0;
  return a;
}

// The sample grid: 2 x 2 x 1 bricks over 2000 x 2000 x 1000 mm (a 2 m x 2 m x 1 m block, declared in metres), with
// a point array of the model's own ("temperature [K]", Int32) that the copy must keep.
inline vtkSmartPointer<vtkUnstructuredGrid> sample_grid() {
  GridSpec spec;
  spec.lx = 2000.0;
  spec.ly = 2000.0;
  spec.lz = 1000.0;
  spec.nx = 2;
  spec.ny = 2;
  spec.nz = 1;
  auto grid = make_box_grid(spec);
  add_point_ints(grid, "temperature [K]", [](const Vec3& x) { return 290 + static_cast<int>(x.x() / 1000.0); });
  return grid;
}

}  // namespace toehold::test
