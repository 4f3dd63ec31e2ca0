// Private to the plan reader: the readers of the plan's sections, sharing what every section needs to know
// (the plan file for messages, its folder for relative paths, the list of defaults applied).
#pragma once

#include <filesystem>
#include <optional>
#include <string>
#include <vector>

#include "plan_fields.hpp"
#include "toehold/plan/plan.hpp"

namespace toehold::plan_detail {

struct Context {
  std::string file;                    // the plan as given, for messages
  std::filesystem::path folder;        // absolute folder of the plan; relative paths are resolved against it
  std::vector<std::string>* defaults;  // Plan::defaults_applied, appended to
  double mm = 1.0;                     // mm per model length unit (set once [model] is read)
  LoadingKind kind = LoadingKind::range;  // set once [loading] is read
  const toml::table* root = nullptr;      // the whole plan, for tables that look at other sections
};

// `text` as an absolute, lexically normal path (relative ones against the plan's folder).
std::string resolve(const Context& ctx, const std::string& text);

// The table under `key` of `root`, or nullptr when absent; Error when the key holds something else.
const toml::table* section(const Context& ctx, const toml::table& root, std::string_view key);
// The tables of the array of tables under `key` ([[key]]); empty when absent; Error for anything else.
std::vector<const toml::table*> section_array(const Context& ctx, const toml::table& root, std::string_view key);

// The [[toe]] tables, merged with [toe_defaults]. Lengths converted to mm with ctx.mm.
// One step per .pvd time step when the [[step]] table gives pvd_steps ("all" or [first, last]), named
// "<name> <time step>"; otherwise just `step`.
std::vector<StepPlan> expand_pvd_steps(const Fields& f, const StepPlan& step);

// The [[block]] tables (kind "blocks": at least one; other kinds: none allowed), step names resolved.
std::vector<BlockPlan> read_blocks(const Context& ctx, const toml::table& root, LoadingKind kind,
                                   const std::vector<StepPlan>& steps);

// The [[curve]] tables: user-defined S-N curves.
std::vector<CurvePlan> read_curves(const Context& ctx, const toml::table& root);

// Checks every toe's curve name and sets ToePlan::damage_limit (recording the defaults applied).
void resolve_damage_limits(const Context& ctx, Plan& plan);

// The [[material]] tables (plan_nominal.cpp).
std::vector<MaterialPlan> read_materials(const Context& ctx, const toml::table& root);

// The [toe.nominal] table of one toe, or none when the toe has none (plan_nominal.cpp). `f` reads the [[toe]].
std::optional<ToeNominalPlan> read_toe_nominal(const Context& ctx, const Fields& f, const ToePlan& toe,
                                               const std::vector<MaterialPlan>& materials);

// ---- shell models and linearization (plan_shell.cpp) ----
// [model] keys of shell models, and the layer-array keys a shell model's [model] and [[step]] tables may give.
const std::vector<std::string_view>& shell_model_keys();
const std::vector<std::string_view>& shell_layer_keys();
// model.shell (default false); Error for shell-only keys of a solid [model].
bool read_shell_flag(const Fields& f);
// The shell part of [model] (ctx.mm already set): thickness and the default layer arrays.
ShellModelPlan read_model_shell(const Context& ctx, const Fields& f);
// A step's layer arrays on a shell model (its own, else the model's; a full pair either way).
ShellStressSpec step_layers(const Fields& f, const ModelPlan& model);
// Error when a step of a solid model names layer arrays.
void refuse_step_layers(const Fields& f);
// Toe keys of shell models (besides the location key plate_point) and of the linearization.
const std::vector<std::string_view>& shell_toe_keys();
const std::vector<std::string_view>& through_thickness_keys();
// Error for shell toe keys on a toe of a solid model.
void refuse_shell_toe_keys(const Fields& f);
// A toe on a shell model: carrying plate, layer, origin (sets toe.shell); Error for solid-only keys.
void read_toe_shell(const Context& ctx, const Fields& f, const ModelPlan& model, ToePlan& toe);
// through_thickness, _points, _rule of a solid toe (toe.thickness already read).
void read_toe_through_thickness(const Context& ctx, const Fields& f, ToePlan& toe);

std::vector<ToePlan> read_toes(const Context& ctx, const toml::table& root, const ModelPlan& model,
                               const std::vector<MaterialPlan>& materials);

}  // namespace toehold::plan_detail
