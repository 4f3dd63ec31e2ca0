// An assessment plan: everything one run of toehold needs, as read from a TOML file (docs/plan.md documents every
// key). All lengths here are already in mm and all stresses in MPa; paths are resolved against the plan's folder.
#pragma once

#include "toehold/common/tensor.hpp"
#include "toehold/common/units.hpp"
#include "toehold/fatigue/corrections.hpp"
#include "toehold/fatigue/sn_curve.hpp"
#include "toehold/hotspot/linearization.hpp"
#include "toehold/model/stress_field.hpp"
#include "toehold/plan/nominal_plan.hpp"
#include "toehold/readout/scheme.hpp"
#include "toehold/shell/shell_layers.hpp"
#include "toehold/shell/shell_toe.hpp"

#include <optional>
#include <string>
#include <vector>

namespace toehold {

// What a shell model adds to [model] (docs/shell-models.md): where the plate thickness comes from and the layer
// stress arrays the load steps use unless they name their own.
struct ShellModelPlan {
  double thickness = 0.0;       // one plate thickness for every cell, mm; 0 when thickness_array is used
  std::string thickness_array;  // one-component cell-data array of thickness, in the model's length unit; "" if none
  ShellStressSpec layers;       // top + bottom, or membrane + bending (may be empty when every step names its own)
};

// The FE model: geometry file, units, and the stress array the load steps use unless they say otherwise.
struct ModelPlan {
  std::string file;               // resolved path of a .vtu, .pvtu, .vtk or .pvd
  LengthUnit length_unit = LengthUnit::mm;
  StressUnit stress_unit = StressUnit::MPa;
  StressSpec stress;              // default stress array(s) and declared component order
  std::string region_array;       // cell-data integer array that tells weld cells apart; "" when none
  std::optional<ShellModelPlan> shell;  // set for a shell model (shell = true); stress is then empty
};

// One load step (or unit load case): a file, or a time step of the model's .pvd, and its stress array.
struct StepPlan {
  std::string name;   // as the analyst calls it, e.g. "hoist loaded"
  std::string file;   // resolved path; the model file when the plan gives none
  int step = -1;      // 0-based .pvd time step; -1 when the file is not a .pvd or has exactly one step
  StressSpec stress;  // the model's stress spec unless the step names its own (solid models)
  ShellStressSpec layers{};  // shell models: the model's layer arrays unless the step names its own (a full pair)
  bool unloaded = false;     // the structure at rest: zero stress everywhere, nothing is read for this step
};

// How the load steps make the loading.
enum class LoadingKind {
  range,       // the largest range between any two steps, applied `cycles` times (constant amplitude)
  series,      // the steps in order are one stress history; rainflow-counted, repeated `repeats` times
  unit_cases,  // the steps are unit load cases scaled by the columns of a history table and summed
  blocks,      // a block spectrum: each [[block]] is a range between two steps applied a number of cycles
};

// One block of a block spectrum: `cycles` cycles of the range between two load steps.
struct BlockPlan {
  std::string from, to;  // step names
  int from_step = -1, to_step = -1;  // indices into Plan::steps
  double cycles = 0.0;   // cycles of the block per repeat of the spectrum, >= 0
  unsigned line = 0;     // line of the [[block]] table, for messages
};

struct LoadingPlan {
  LoadingKind kind = LoadingKind::range;
  std::string history_file;            // unit_cases: CSV with one column per step (named as the steps)
  bool repeating_history = false;      // series/unit_cases: ASTM E1049 sec. 5.4.5 instead of 5.4.4 (half cycles)
  double repeats_per_year = 0.0;       // series/unit_cases/blocks: repeats of the history per year; 0 = none
  std::vector<BlockPlan> blocks;       // blocks: the spectrum, in plan order (at least one)
};

// A user-defined S-N curve from a [[curve]] table; toes name it in `curve` like a catalogue curve.
struct CurvePlan {
  std::string name;
  SnCurve curve;
};

// How a toe on a shell model is read (docs/shell-models.md): the plate that carries it, the layer and the origin
// of the read-out distances.
struct ShellToePlan {
  std::optional<int> plate_region;   // value of model.region_array on the carrying plate's cells
  std::optional<Vec3> plate_point;   // mm: a point on the carrying plate, on the read-out side
  LayerChoice layer = LayerChoice::weld_side;
  ToeOrigin origin = ToeOrigin::intersection;
  double weld_leg = 0.0;             // mm, ToeOrigin::weld_toe only (> 0 there)
  double kink_limit_deg = 30.0;      // degrees between facet planes taken as a fold of the plate
};

// Through-thickness linearization at every station of a solid toe (ASME BPVC VIII-2 Annex 5-A).
struct ThroughThicknessPlan {
  int points = 9;  // samples along the line through the thickness (rule's limits, see hotspot/linearization.hpp)
  ThroughThicknessRule rule = ThroughThicknessRule::gauss_lobatto;
};

// Where a toe is and how it is assessed.
struct ToePlan {
  std::string name;                     // shown in every output; unique in the plan
  int line = 0;                         // line of the [[toe]] table in the plan, for messages
  // Where: a point-data marker (the nodes with marker_value) or coordinates (mm) snapped onto the surface.
  std::string marker_array;             // "" when points are given
  int marker_value = 0;
  std::vector<Vec3> points;             // mm, in order along the toe; empty when a marker is used
  bool closed = false;                  // points form a loop
  // Weld side: region values of weld cells (in the model's region array) and/or a point inside the weld.
  std::vector<int> weld_regions;
  std::optional<Vec3> weld_point;       // mm
  double thickness = 0.0;               // plate thickness t, mm (> 0)
  double spacing = 0.0;                 // mm between stations; 0 = a station at every toe node or point
  HotSpotType type = HotSpotType::a;
  SchemeKind scheme = SchemeKind::fine_linear;
  std::vector<double> user_distances;   // mm, for SchemeKind::user
  double user_factor = 1.0;             // SchemeKind::user: multiplies the extrapolated value
  std::string definition = "perpendicular";  // hot-spot stress definition name (see docs/plan.md)
  std::string detail_class;             // DNV detail class for the effective hot-spot stress factor, "" if none
  std::string curve;                    // S-N curve name from the catalogue, e.g. "IIW FAT 100"
  std::optional<double> thickness_exponent;  // IIW thickness correction exponent n; none = no correction
  // Axial misalignment factor k_m of the joint as calculated (IIW 2016 sec. 3.8.2), >= 1; 1 = none. The hot-spot
  // classes already cover k_m = 1.05, so the stress ranges are raised by k_m / 1.05 when that exceeds 1.
  double misalignment_km = 1.0;
  std::vector<int> report_stations;     // station ids the report details besides the worst few of the toe
  // series/unit_cases/blocks: IIW 2016 sec. 3.5.3 mean-stress enhancement f(R) case; none = no correction.
  std::optional<IiwMeanStressCase> mean_stress;
  // series/unit_cases/blocks: allowable Miner sum for this toe: requirement.damage_limit when given, else 0.5
  // (IIW 2016 sec. 4.3.1) for IIW and user curves and 1.0 for EN 1993-1-9 and DNVGL-RP-C203 curves.
  double damage_limit = 0.5;
  std::optional<ToeNominalPlan> nominal;  // [toe.nominal]: the nominal-stress method beside the hot-spot one
  std::optional<ShellToePlan> shell;      // set on shell models (weld_regions / weld_point are then empty)
  std::optional<ThroughThicknessPlan> through_thickness;  // solid models: linearize beside the surface read-out
};

// What the joint must achieve.
struct RequirementPlan {
  double cycles = 0.0;        // required cycles of the range (LoadingKind::range), > 0
  double gamma_M = 1.0;       // partial safety factor on fatigue resistance (divides the allowable range)
  double gamma_F = 1.0;       // partial safety factor on the load (multiplies the stress range)
  double damage_limit = 1.0;  // allowable Miner sum given in the plan (see damage_limit_given)
  bool damage_limit_given = false;  // false: each toe takes the default of its curve (ToePlan::damage_limit)
  double design_life_years = 0.0;  // series/unit_cases with repeats_per_year: required life; 0 = none
};

struct Plan {
  std::string path;                // the plan file as given
  std::string text;                // its text, verbatim (for provenance)
  std::string title;
  ModelPlan model;
  std::vector<StepPlan> steps;
  LoadingPlan loading;
  std::vector<ToePlan> toes;
  std::vector<CurvePlan> curves;   // user-defined curves, in plan order
  std::vector<MaterialPlan> materials;  // analyst-defined materials ([[material]]), in plan order
  RequirementPlan requirement;
  std::string output_folder;       // resolved; the command line may override it
  std::vector<std::string> defaults_applied;  // "toe 'north': spacing = 0 (a station at every toe node)", ...
};

// Reads and checks a plan. Throws Error naming the file, line and key for syntax errors, unknown keys, wrong
// types, missing required keys and values out of range.
Plan read_plan(const std::string& path);

// The same from text; `path` is used for messages and to resolve relative file names.
Plan parse_plan(const std::string& text, const std::string& path);

std::string to_string(LoadingKind kind);

// The curve a toe names: a plan curve of that name, else the catalogue's (parse_sn_curve; Error when neither).
SnCurve find_curve(const Plan& plan, const std::string& name);

}  // namespace toehold
