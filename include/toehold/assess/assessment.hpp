// One assessment run and its results: every station of every toe with its read-out points, hot-spot stress per
// load step, range, allowable range, utilization and life. The outputs layer writes these; nothing here prints.
#pragma once

#include "toehold/assess/shell_station_info.hpp"
#include "toehold/assess/through_thickness_result.hpp"
#include "toehold/common/reporter.hpp"
#include "toehold/common/tensor.hpp"
#include "toehold/fatigue/miner.hpp"
#include "toehold/model/mesh.hpp"
#include "toehold/nominal/infinite_life.hpp"
#include "toehold/plan/plan.hpp"
#include "toehold/readout/scheme.hpp"
#include "toehold/toe/station.hpp"
#include "toehold/toe/toe_line.hpp"

#include <array>
#include <limits>
#include <optional>
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

// One nominal stress history checked against the toe's nominal detail class, by the plan's loading kind (the same
// rules as the hot-spot check of StationResult: range, or rainflow and Miner for the damage kinds).
struct NominalCheckResult {
  std::string problem;          // why there is no nominal result here (empty when there is one)
  std::vector<double> values;   // per load step (unit case): nominal stress, MPa, signed; empty when a range is given
  double range = 0.0;           // range: the largest range; damage kinds: the largest counted range. MPa, >= 0
  int range_from = -1, range_to = -1;  // steps of the range (range kind, blocks, series); -1 when not known
  double allowable = 0.0;       // as StationResult::allowable, on the nominal curve, MPa
  double utilization = 0.0;     // as StationResult::utilization
  double life = 0.0;            // as StationResult::life (inf: no damage)
  double damage = 0.0;          // damage kinds: Miner sum of one repeat
  double damage_limit = 0.0;    // damage kinds: allowable Miner sum of the nominal curve; 0 for range
  double life_repeats = 0.0;    // damage kinds: repeats to the damage limit
  double life_years = std::numeric_limits<double>::quiet_NaN();  // damage kinds with repeats_per_year, else NaN
  double equivalent_range = 0.0;  // damage kinds: equivalent range at 2e6 cycles, MPa
  bool ok() const { return problem.empty(); }
};

// The two methods side by side at one station.
struct StationNominal {
  NominalCheckResult check;     // surface-distance: this station's own; other sources: the toe's (a copy)
  std::optional<Vec3> sample_x;  // surface-distance: the sample point on the read-out path, mm
  // Structural stress concentration factor: hot-spot range / nominal range; none when the nominal range is 0, a
  // shear range, or either side has no result.
  std::optional<double> concentration_factor;
  std::string governing;        // "nominal" or "hot-spot" (the larger utilization; ties: hot-spot); "" if unknown
  std::string verdict;          // one line: which governs, both utilizations, ranges and curves, the factor
};

struct StationResult {
  Station station;
  std::vector<ReadoutPoint> points;    // one per scheme distance that could be placed
  std::vector<Vec3> path;              // the walked read-out path on the surface, mm
  std::string problem;                 // why the station has no result (empty when it has one)
  std::vector<std::string> notes;      // remarks that do not void the result (principal window choices, ...)
  std::vector<double> hot_spot;        // per load step (unit case for unit-cases): hot-spot stress, MPa
  // range: the largest range over pairs of steps. series, unit-cases, blocks: the largest counted range. MPa, >= 0
  double range = 0.0;
  // range: the two steps (indices into Assessment::steps) that give the range. series and blocks: the steps of
  // the governing cycle (series: the turning points' steps). -1 when not known (unit-cases: rows, not steps).
  int range_from = -1, range_to = -1;
  double range_angle_deg = 0.0;        // principal definition: direction of the range, degrees from readout
  // range: allowable range at the required cycles, with gamma_M. Other kinds: the curve's range at 2e6 cycles
  // divided by gamma_M (compare with equivalent_range). MPa.
  double allowable = 0.0;
  // range: gamma_F * range / allowable. Other kinds: damage x required repeats / damage_limit of the toe, the
  // required repeats being requirement.design_life_years x loading.repeats_per_year when both are given, else 1
  // (one repeat of the history).
  double utilization = 0.0;
  // range: cycles to failure of gamma_F * gamma_M * range. Other kinds: life_repeats times the cycles of one
  // repeat of the history. inf: no damage.
  double life = 0.0;

  // series, unit-cases, blocks only (0 / empty / NaN for range):
  double damage = 0.0;                 // Miner sum of one repeat of the history, with gamma_F, gamma_M, f(R)
  double life_repeats = 0.0;           // repeats of the history until damage reaches the toe's damage_limit
  double life_years = std::numeric_limits<double>::quiet_NaN();  // life_repeats / repeats_per_year; NaN if none
  double equivalent_range = 0.0;       // equivalent constant-amplitude range at 2e6 cycles, MPa (see allowable)
  double cycles_per_repeat = 0.0;      // counted cycles in one repeat (half cycles count 0.5)
  std::vector<CycleDamage> governing;  // the most damaging cycles, most damaging first (ranges as counted, MPa)

  std::optional<ThroughThicknessResult> through_thickness;  // when the toe asks for linearization
  std::optional<ShellStationInfo> shell;                    // shell models only
  std::optional<StationNominal> nominal;                    // toes with [toe.nominal]

  bool ok() const { return problem.empty(); }
  bool exceeds() const { return ok() && utilization > 1.0; }
};

// The textbook infinite-life weld check of a toe and the load steps it was made between.
struct InfiniteLifeResult {
  nominal::WeldCheck check;     // every intermediate value; factor_of_safety is the governing one
  int from = -1, to = -1;       // the steps of the governing cycle; -1 when the plan gives the range
  std::string cycle;            // how the alternating and mean stresses were found, one line
};

// The nominal-stress method of one toe ([toe.nominal]).
struct ToeNominalResult {
  std::string source;           // "given", "section", "surface-distance" or "weld-group"
  std::string description;      // one line: where and how the nominal stress is measured
  std::string curve;            // nominal detail class as resolved (catalogue or [[curve]] name)
  std::string curve_source;     // document, edition, section
  std::string stress_kind;      // "normal" or "shear"
  bool per_station = false;     // surface-distance: every station has its own nominal history
  NominalCheckResult check;     // per-toe sources: the toe's check; surface-distance: the worst station's
  int worst = -1;               // index into stations of the largest nominal utilization; -1 when none
  std::string governing;        // method with the larger worst utilization over the toe; "" if unknown
  std::optional<InfiniteLifeResult> infinite_life;
  std::vector<std::string> notes;  // remarks (a shear nominal range has no concentration factor, ...)
};

struct ToeResult {
  ToePlan plan;
  ToeLine line;
  ReadoutScheme scheme;
  std::string definition;              // hot-spot definition name
  std::string curve;                   // curve name with corrections applied
  std::string curve_source;            // document, edition, section
  double thickness_factor = 1.0;       // f(t) applied to the curve (1 when none)
  double damage_limit = 0.0;           // series, unit-cases, blocks: allowable Miner sum of the toe; 0 for range
  std::string mean_stress;             // "none", or the IIW f(R) case applied ("IIW f(R) stress_relieved")
  std::vector<StationResult> stations;
  int worst = -1;                      // index into stations of the largest utilization; -1 when none has a result
  std::optional<ToeNominalResult> nominal;  // toes with [toe.nominal]
};

struct Assessment {
  Plan plan;
  std::vector<std::string> steps;      // load step names, in plan order (unit-cases: the unit case names)
  // series, unit-cases: the residue rule used, with its ASTM E1049-85 section; blocks: "blocks as given";
  // range: "". Written into every output.
  std::string counting;
  std::size_t history_rows = 0;        // unit-cases: rows of the load history; series: steps; else 0
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
