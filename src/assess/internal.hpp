// Pieces of the assessment shared by its source files (private to src/assess).
#pragma once

#include "toehold/assess/assessment.hpp"
#include "toehold/fatigue/sn_curve.hpp"
#include "toehold/hotspot/definition.hpp"
#include "toehold/loading/in_plane_stress.hpp"
#include "toehold/loading/load_history.hpp"
#include "toehold/model/locator.hpp"
#include "toehold/model/mesh.hpp"
#include "toehold/model/stress_field.hpp"
#include "toehold/model/surface.hpp"
#include "toehold/toe/weld_side.hpp"

#include "toehold/loading/spectrum_damage.hpp"
#include "toehold/fatigue/rainflow.hpp"

#include <map>
#include <memory>
#include <optional>
#include <utility>

namespace toehold::detail {

// A station with its read-out points located: the hosts (cells and weights) are reused for every load step.
struct PlacedStation {
  StationResult result;
  std::vector<Host> hosts;  // one per result.points entry
};

struct NominalToeState;  // nominal_step.hpp

struct PlacedToe {
  ToeResult result;              // stations left empty; filled from `stations` at the end
  std::vector<PlacedStation> stations;
  std::shared_ptr<NominalToeState> nominal;  // set by prepare_nominal when the toe has [toe.nominal]
};

// The geometry every toe is built on: the surface and locator of the whole mesh, or of the cells near the toes.
struct ModelGeometry {
  Mesh mesh;
  std::optional<NearCells> near;  // the cells the surface and locator cover; none = the whole mesh
  Surface surface;
  Locator locator;
  std::vector<int> cell_region;  // empty when the plan names no region array
  // Over the whole mesh, or over `near` (its cells of `m`).
  ModelGeometry(Mesh m, std::optional<NearCells> near_toes);
};

// The cells near the plan's toes (toe_region.cpp), or none when the whole model is needed or barely larger:
// a toe that cannot be found (its error then comes from the whole model) or near cells over 80 % of the model.
std::optional<NearCells> toe_neighbourhood(const Plan& plan, const Mesh& mesh);

// The nodes of `mesh` with the toe's marker value in its marker array. Throws Error naming the toe and the array
// when the array is missing, has several components or marks no node.
std::vector<long long> marked_nodes(const Mesh& mesh, const ToePlan& toe);

std::vector<int> read_cell_region(const Mesh& mesh, const std::string& array);

// The toe's read-out scheme for plate thickness t (mm): the plan's user scheme, or the named scheme at t.
ReadoutScheme toe_scheme(const ToePlan& toe, double thickness_mm);

// The toe's weld side (region values and/or weld point) as place_toe uses it.
WeldSide toe_weld_side(const ModelGeometry& geometry, const ToePlan& toe, const std::string& region_array);

// Builds the toe line, stations and read-out points of one toe (no stresses yet).
PlacedToe place_toe(const ModelGeometry& geometry, const ToePlan& toe, const std::string& region_array,
                    Reporter& reporter);

// Reads the load steps' stress fields one by one, reusing meshes already read, and hands each to `use`.
class StepReader {
public:
  StepReader(const Plan& plan, const Mesh& geometry, Reporter& reporter);
  StressField read(std::size_t step);
  const std::vector<std::string>& files() const { return files_; }
  // Convert only these points or cells of every later step (the fields read NaN elsewhere); none = all.
  void convert_only(StressSubsets only) { only_ = std::move(only); }

private:
  const Mesh& mesh_for(const StepPlan& step);
  const Plan& plan_;
  const Mesh& geometry_;
  Reporter& reporter_;
  std::map<std::pair<std::string, int>, Mesh> meshes_;
  std::vector<std::string> files_;
  StressSubsets only_;
};

// Per-station evaluation (evaluate.cpp).
Tensor toe_tensor(const PlacedStation& s, const ReadoutScheme& scheme, const StressField& field);
// Appends the step's read-out normal stresses and in-plane toe stress of a station that has a result.
void record_step(PlacedStation& s, const ReadoutScheme& scheme, const StressField& field,
                 std::vector<InPlaneStress>& steps);
DefinitionOptions definition_options(const ToePlan& toe);
void evaluate_range(StationResult& r, const std::vector<InPlaneStress>& steps, HotSpotDefinition definition,
                    const DefinitionOptions& options);
// The toe's S-N curve (plan curve or catalogue) with its thickness correction; thickness_factor receives the
// factor applied.
SnCurve toe_curve(const Plan& plan, const ToePlan& toe, double& thickness_factor);
void check_range(StationResult& r, const SnCurve& curve, const RequirementPlan& req);

// Damage kinds (damage.cpp). What one toe's stations share.
struct ToeDamage {
  HotSpotScalar scalar;
  SnCurve curve;
  DamageRules rules;
  ResidueRule residue = ResidueRule::half_cycles;
  double required_repeats = 1.0;  // design_life_years x repeats_per_year when both are given, else 1
};
ToeDamage toe_damage(const Plan& plan, const ToePlan& toe, const SnCurve& curve);
// "none" or "IIW f(R) <case>", for ToeResult::mean_stress.
std::string toe_mean_stress(const ToePlan& toe);
// series: the steps in order are the history.
void evaluate_series(StationResult& r, const std::vector<InPlaneStress>& steps, const ToeDamage& d);
// blocks: each block's range between two steps, its cycles as given.
void evaluate_blocks(StationResult& r, const std::vector<InPlaneStress>& steps, const ToeDamage& d,
                     const std::vector<BlockPlan>& blocks);
// unit-cases: steps are the unit cases, history.channels in the same order.
void evaluate_unit_cases(StationResult& r, const std::vector<InPlaneStress>& cases, const ToeDamage& d,
                         const LoadHistory& history, HotSpotDefinition definition);
// Hot-spot value per step (unit case) into r.hot_spot; a note when principal has no candidate at some steps.
void record_hot_spots(StationResult& r, const std::vector<InPlaneStress>& steps, const HotSpotScalar& scalar);

// The (file, step) of the mesh that serves as geometry: the first load step's.
std::pair<std::string, int> geometry_source(const Plan& plan);

}  // namespace toehold::detail
