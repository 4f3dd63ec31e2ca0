// One assessment run and its results: every station of every toe with its read-out points, hot-spot stress per
// load step, range, allowable range, utilization and life. The outputs layer writes these; nothing here prints.
#pragma once

#include "toehold/common/reporter.hpp"
#include "toehold/common/tensor.hpp"
#include "toehold/model/mesh.hpp"
#include "toehold/plan/plan.hpp"
#include "toehold/readout/scheme.hpp"
#include "toehold/toe/station.hpp"
#include "toehold/toe/toe_line.hpp"

#include <array>
#include <string>
#include <vector>

namespace toehold {

struct ReadoutPoint {
  double distance = 0.0;               // mm from the toe, along the surface
  Vec3 x = Vec3::Zero();               // mm
  long long cell = -1;                 // host volume cell; -1 when the point could not be placed
  std::array<double, 3> pcoords{};     // parametric coordinates in the host cell
  double off_model = 0.0;              // mm between the point and its host cell (0 when inside)
  std::vector<double> normal_stress;   // per load step: readout . S . readout at the point, MPa
};

struct StationResult {
  Station station;
  std::vector<ReadoutPoint> points;    // one per scheme distance that could be placed
  std::vector<Vec3> path;              // the walked read-out path on the surface, mm
  std::string problem;                 // why the station has no result (empty when it has one)
  std::vector<std::string> notes;      // remarks that do not void the result (principal window choices, ...)
  std::vector<double> hot_spot;        // per load step: hot-spot stress by the toe's definition, MPa
  double range = 0.0;                  // hot-spot stress range, MPa (largest over pairs of steps), >= 0
  int range_from = -1, range_to = -1;  // the two steps (indices into Assessment::steps) that give the range
  double range_angle_deg = 0.0;        // principal definition: direction of the range, degrees from readout
  double allowable = 0.0;              // allowable range at the required cycles, with gamma_M, MPa
  double utilization = 0.0;            // gamma_F * range / allowable
  double life = 0.0;                   // cycles to failure of gamma_F * gamma_M * range (inf: no damage)

  bool ok() const { return problem.empty(); }
  bool exceeds() const { return ok() && utilization > 1.0; }
};

struct ToeResult {
  ToePlan plan;
  ToeLine line;
  ReadoutScheme scheme;
  std::string definition;              // hot-spot definition name
  std::string curve;                   // curve name with corrections applied
  std::string curve_source;            // document, edition, section
  double thickness_factor = 1.0;       // f(t) applied to the curve (1 when none)
  std::vector<StationResult> stations;
  int worst = -1;                      // index into stations of the largest utilization; -1 when none has a result
};

struct Assessment {
  Plan plan;
  std::vector<std::string> steps;      // load step names, in plan order
  std::vector<std::string> input_files;  // every model file read, in reading order
  std::vector<ToeResult> toes;
  std::vector<std::string> warnings;   // collected remarks for the end of the console summary
  long long model_points = 0, model_cells = 0;
  Mesh model;                          // the mesh the toes were built on (first load step's file)

  int stations() const;
  int stations_without_result() const;
  int stations_exceeding() const;
};

// Runs `plan`: reads the model and the load steps, builds the toes and stations, reads out, extrapolates and
// checks. Input errors throw Error; station-level problems are recorded in the station and counted in warnings.
Assessment run_assessment(const Plan& plan, Reporter& reporter);

}  // namespace toehold
