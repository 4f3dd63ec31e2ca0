// Private to the plan reader: the readers of the plan's sections, sharing what every section needs to know
// (the plan file for messages, its folder for relative paths, the list of defaults applied).
#pragma once

#include <filesystem>
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
};

// `text` as an absolute, lexically normal path (relative ones against the plan's folder).
std::string resolve(const Context& ctx, const std::string& text);

// The table under `key` of `root`, or nullptr when absent; Error when the key holds something else.
const toml::table* section(const Context& ctx, const toml::table& root, std::string_view key);
// The tables of the array of tables under `key` ([[key]]); empty when absent; Error for anything else.
std::vector<const toml::table*> section_array(const Context& ctx, const toml::table& root, std::string_view key);

// The [[toe]] tables, merged with [toe_defaults]. Lengths converted to mm with ctx.mm.
std::vector<ToePlan> read_toes(const Context& ctx, const toml::table& root, const ModelPlan& model);

}  // namespace toehold::plan_detail
