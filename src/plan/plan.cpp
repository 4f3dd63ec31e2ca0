// Reading an assessment plan: TOML syntax, then each section ([model], [[step]], [loading], [[toe]],
// [requirement], [output]) with its checks. docs/plan.md documents every key.
#include <algorithm>
#include <array>
#include <cctype>
#include <fstream>
#include <map>
#include <sstream>
#include <system_error>

#include "plan_sections.hpp"
#include "toehold/common/error.hpp"
#include "toehold/model/stress_layout.hpp"

namespace toehold {
namespace plan_detail {
namespace {

namespace fs = std::filesystem;

constexpr std::array<std::pair<std::string_view, LoadingKind>, 5> kLoadingNames{
    {{"range", LoadingKind::range},
     {"blocks", LoadingKind::blocks},
     {"series", LoadingKind::series},
     {"unit-cases", LoadingKind::unit_cases},
     {"unit_cases", LoadingKind::unit_cases}}};

LoadingKind parse_loading_kind(std::string_view text, const std::string& where) {
  for (const auto& [name, kind] : kLoadingNames)
    if (name == text) return kind;
  throw Error(where + ": unknown loading kind '" + std::string(text) + "'; use one of range, series, unit-cases, blocks");
}

// true for repeating (ASTM E1049 sec. 5.4.5), false for half-cycles (sec. 5.4.4).
bool parse_counting(std::string_view text, const std::string& where) {
  if (text == "half-cycles" || text == "half_cycles") return false;
  if (text == "repeating") return true;
  throw Error(where + ": unknown counting '" + std::string(text) + "'; use one of half-cycles, repeating");
}

const toml::table& empty_table() {
  static const toml::table table;
  return table;
}

// ---- stress arrays ([model] and [[step]]) ----

struct StressKeys {
  std::optional<std::string> array;
  std::optional<std::vector<std::string>> components;
  std::optional<std::string> order;
};

StressKeys read_stress_keys(const Fields& f) {
  StressKeys keys{f.text("stress"), f.texts("stress_components"), f.text("order")};
  if (keys.array && keys.components)
    f.fail_key("stress_components", "cannot be given together with stress; give one of them");
  if (keys.components && keys.components->size() != 6)
    f.fail_key("stress_components",
               "must name 6 scalar arrays (xx, yy, zz, xy, yz, xz), not " + std::to_string(keys.components->size()));
  if (keys.order && keys.components)
    f.fail_key("order",
               "applies to a 6-component stress array; stress_components are already in the order "
               "xx, yy, zz, xy, yz, xz");
  if (keys.order) parse_component_order(*keys.order, f.where("order"));
  return keys;
}

StressSpec spec_from(const StressKeys& keys) {
  StressSpec spec;
  if (keys.array) spec.array = *keys.array;
  if (keys.components)
    for (std::size_t i = 0; i < 6; ++i) spec.component_arrays[i] = (*keys.components)[i];
  spec.order = keys.order.value_or("");
  return spec;
}

bool has_stress(const StressSpec& spec) { return !spec.array.empty() || !spec.component_arrays[0].empty(); }

// ---- [model] ----

ModelPlan read_model(Context& ctx, const toml::table& root) {
  const toml::table* table = section(ctx, root, "model");
  if (table == nullptr)
    throw Error(location(ctx.file, 0) +
                "the plan has no [model] table; add one with file, length_unit and stress_unit");
  Fields f(ctx.file, *table, "model", "[model]", false);
  std::vector<std::string_view> known{"file", "length_unit", "stress_unit", "stress", "stress_components", "order",
                                      "region_array"};
  known.insert(known.end(), shell_model_keys().begin(), shell_model_keys().end());
  f.check_known(known);
  ModelPlan model;
  model.file = resolve(ctx, f.need_text("file",
                                        "name the FE model file (.vtu, .pvtu, .vtk or .pvd), relative to "
                                        "the plan's folder"));
  model.length_unit = parse_length_unit(f.need_text("length_unit", "declare the model's length unit (mm, m or in)"),
                                        f.where("length_unit"));
  model.stress_unit = parse_stress_unit(
      f.need_text("stress_unit", "declare the model's stress unit (MPa, Pa, psi or ksi)"), f.where("stress_unit"));
  model.region_array = f.text("region_array").value_or("");
  ctx.mm = mm_per(model.length_unit);
  if (read_shell_flag(f)) {
    model.shell = read_model_shell(ctx, f);
    return model;
  }
  const StressKeys keys = read_stress_keys(f);
  if (keys.order && !keys.array) f.fail_key("order", "describes model.stress; give model.stress too");
  model.stress = spec_from(keys);
  return model;
}

// ---- [[step]] ----

StressSpec step_stress(const Fields& f, const ModelPlan& model) {
  const StressKeys keys = read_stress_keys(f);
  StressSpec spec = keys.array || keys.components ? spec_from(keys) : model.stress;
  if (keys.order && !keys.array) {
    if (model.stress.array.empty())
      f.fail_key("order", "describes a 6-component stress array, but neither the step nor [model] gives stress");
    spec.order = *keys.order;
  }
  if (!has_stress(spec)) f.fail(" has no stress array; give stress or stress_components in the step or in [model]");
  return spec;
}

// unloaded = true: the structure at rest (zero stress), e.g. the other end of a range from zero to the load.
StepPlan unloaded_step(const Fields& f, const ModelPlan& model) {
  StepPlan step;
  step.name = f.need_text("name", "give each step a unique name");
  step.file = model.file;
  step.unloaded = true;
  std::vector<std::string_view> keys{"file", "pvd_step", "pvd_steps", "stress", "stress_components", "order"};
  keys.insert(keys.end(), shell_layer_keys().begin(), shell_layer_keys().end());
  for (std::string_view key : keys)
    if (f.has_own(key)) f.fail_key(key, "does not apply to an unloaded step (zero stress everywhere, nothing is read)");
  return step;
}

StepPlan read_step(const Context& ctx, const Fields& f, const ModelPlan& model) {
  if (f.flag("unloaded").value_or(false)) return unloaded_step(f, model);
  StepPlan step;
  step.name = f.need_text("name", "give each step a unique name");
  const std::optional<std::string> file = f.text("file");
  step.file = file ? resolve(ctx, *file) : model.file;
  if (f.has("pvd_steps") && f.has("pvd_step")) f.fail_key("pvd_steps", "cannot be given together with pvd_step");
  if (std::optional<int> pvd = f.integer("pvd_step")) {
    f.require("pvd_step", *pvd >= 0, "0 or more (the first time step is 0)", *pvd);
    const auto extension = fs::path(step.file).extension();
    if (extension != ".pvd" && extension != ".frd")
      f.fail_key("pvd_step", "applies to .pvd series and CalculiX .frd results only; '" +
                                 fs::path(step.file).filename().string() + "' is neither");
    step.step = *pvd;
  }
  if (model.shell) {
    step.layers = step_layers(f, model);
  } else {
    refuse_step_layers(f);
    step.stress = step_stress(f, model);
  }
  return step;
}

std::vector<StepPlan> read_steps(const Context& ctx, const toml::table& root, const ModelPlan& model,
                                 std::vector<unsigned>& lines) {
  const std::vector<const toml::table*> tables = section_array(ctx, root, "step");
  if (tables.empty())
    throw Error(location(ctx.file, 0) + "the plan has no [[step]] table; add one for each load step or unit load case");
  std::vector<StepPlan> steps;
  std::map<std::string, unsigned> seen;
  for (std::size_t i = 0; i < tables.size(); ++i) {
    Fields f(ctx.file, *tables[i], "step", "step " + std::to_string(i + 1), true);
    const std::string name = f.need_text("name", "give each step a unique name");
    f.set_owner("step '" + name + "'");
    std::vector<std::string_view> known{"name",   "file",  "pvd_step", "pvd_steps", "stress", "stress_components",
                                        "order",  "unloaded"};
    known.insert(known.end(), shell_layer_keys().begin(), shell_layer_keys().end());
    f.check_known(known);
    const StepPlan step = read_step(ctx, f, model);
    for (const StepPlan& each : expand_pvd_steps(f, step)) {
      if (const auto it = seen.find(each.name); it != seen.end())
        f.fail(" is defined twice (first at line " + std::to_string(it->second) + "); give each step its own name");
      seen.emplace(each.name, f.line());
      lines.push_back(f.line());
      steps.push_back(each);
    }
  }
  return steps;
}

// ---- [loading] ----

void read_cycle_keys(const Context& ctx, const Fields& f, LoadingPlan& loading) {
  if (loading.kind == LoadingKind::range) {
    for (std::string_view key : {"counting", "repeats_per_year"})
      if (f.has(key)) f.fail_key(key, "applies to kind = \"series\", \"unit-cases\" and \"blocks\", not \"range\"");
    return;
  }
  if (loading.kind == LoadingKind::blocks) {
    if (f.has("counting")) f.fail_key("counting", "applies to kind = \"series\" and \"unit-cases\"; blocks are counted already");
  } else if (std::optional<std::string> counting = f.text("counting")) {
    loading.repeating_history = parse_counting(*counting, f.where("counting"));
  } else {
    ctx.defaults->push_back("loading.counting = \"half-cycles\" (ASTM E1049 sec. 5.4.4)");
  }
  if (std::optional<double> repeats = f.number("repeats_per_year")) {
    f.require("repeats_per_year", *repeats >= 0, "0 or more", *repeats);
    loading.repeats_per_year = *repeats;
  } else {
    ctx.defaults->push_back("loading.repeats_per_year = 0 (no life in years)");
  }
}

void check_step_count(const Context& ctx, const Fields& f, LoadingKind kind, const std::vector<unsigned>& lines) {
  if (kind == LoadingKind::unit_cases || lines.size() >= 2) return;
  const std::string why = kind == LoadingKind::series ? "a history needs two" : "a range is taken between two steps";
  const std::string head =
      f.has("kind") ? f.where("kind") + " = \"" + to_string(kind) + "\""
                    : location(ctx.file, lines.front()) + "loading kind \"" + to_string(kind) + "\" (the default)";
  throw Error(head + " needs at least 2 [[step]] tables (" + why + "); the plan has 1");
}

LoadingPlan read_loading(const Context& ctx, const toml::table& root, const std::vector<unsigned>& step_lines,
                         const std::vector<StepPlan>& steps) {
  const toml::table* table = section(ctx, root, "loading");
  Fields f(ctx.file, table != nullptr ? *table : empty_table(), "loading", "[loading]", false);
  f.check_known({"kind", "history", "counting", "repeats_per_year"});
  LoadingPlan loading;
  if (std::optional<std::string> kind = f.text("kind")) {
    loading.kind = parse_loading_kind(*kind, f.where("kind"));
  } else {
    ctx.defaults->push_back("loading.kind = \"range\" (the largest range between any two steps)");
  }
  check_step_count(ctx, f, loading.kind, step_lines);
  const std::optional<std::string> history = f.text("history");
  if (loading.kind == LoadingKind::unit_cases && !history)
    f.missing("history", "kind = \"unit-cases\" needs a CSV file with one column per step name");
  if (loading.kind != LoadingKind::unit_cases && history)
    f.fail_key("history", "applies to kind = \"unit-cases\" only");
  if (history) loading.history_file = resolve(ctx, *history);
  read_cycle_keys(ctx, f, loading);
  loading.blocks = read_blocks(ctx, root, loading.kind, steps);
  return loading;
}

// ---- [requirement] ----

void read_factors(const Context& ctx, const Fields& f, RequirementPlan& req) {
  if (std::optional<double> g = f.number("gamma_M")) {
    f.require("gamma_M", *g >= 1, "1 or more", *g);
    req.gamma_M = *g;
  } else {
    ctx.defaults->push_back("requirement.gamma_M = 1 (no partial factor on fatigue resistance)");
  }
  if (std::optional<double> g = f.number("gamma_F")) {
    f.require("gamma_F", *g > 0, "greater than 0", *g);
    req.gamma_F = *g;
  } else {
    ctx.defaults->push_back("requirement.gamma_F = 1 (no partial factor on the load)");
  }
}

void read_damage_keys(const Context& ctx, const Fields& f, const LoadingPlan& loading, RequirementPlan& req) {
  if (std::optional<double> d = f.number("damage_limit")) {
    f.require("damage_limit", *d > 0, "greater than 0", *d);
    req.damage_limit = *d;
    req.damage_limit_given = true;
  } else {
    req.damage_limit_given = false;
  }
  if (std::optional<double> years = f.number("design_life_years")) {
    f.require("design_life_years", *years >= 0, "0 or more", *years);
    if (*years > 0 && loading.repeats_per_year <= 0)
      f.fail_key("design_life_years", "needs loading.repeats_per_year (> 0) to turn the history into years");
    req.design_life_years = *years;
  } else {
    ctx.defaults->push_back("requirement.design_life_years = 0 (no required life in years)");
  }
}

RequirementPlan read_requirement(const Context& ctx, const toml::table& root, const LoadingPlan& loading) {
  const toml::table* table = section(ctx, root, "requirement");
  Fields f(ctx.file, table != nullptr ? *table : empty_table(), "requirement", "[requirement]", false);
  f.check_known({"cycles", "gamma_M", "gamma_F", "damage_limit", "design_life_years"});
  RequirementPlan req;
  const bool range = loading.kind == LoadingKind::range;
  const std::vector<std::string_view> other_kind =
      range ? std::vector<std::string_view>{"damage_limit", "design_life_years"}
            : std::vector<std::string_view>{"cycles"};
  for (std::string_view key : other_kind)
    if (f.has(key)) f.fail_key(key, "does not apply to loading kind \"" + to_string(loading.kind) + "\"");
  if (range) {
    req.cycles = f.need_number("cycles", "loading kind \"range\" needs the required number of cycles (> 0)");
    f.require("cycles", req.cycles > 0, "greater than 0", req.cycles);
  } else {
    read_damage_keys(ctx, f, loading, req);
  }
  read_factors(ctx, f, req);
  return req;
}

// ---- [output] and the whole ----

std::string read_output(const Context& ctx, const toml::table& root) {
  const toml::table* table = section(ctx, root, "output");
  Fields f(ctx.file, table != nullptr ? *table : empty_table(), "output", "[output]", false);
  f.check_known({"folder"});
  if (std::optional<std::string> folder = f.text("folder")) return resolve(ctx, *folder);
  const std::string folder = resolve(ctx, fs::path(ctx.file).stem().string() + "-out");
  ctx.defaults->push_back("output.folder = \"" + folder + "\" (<plan file stem>-out beside the plan)");
  return folder;
}

toml::table parse_toml(const std::string& text, const std::string& file) {
  try {
    return toml::parse(text, file);
  } catch (const toml::parse_error& e) {
    const auto& begin = e.source().begin;
    std::string description(e.description());
    if (!description.empty())
      description[0] = static_cast<char>(std::tolower(static_cast<unsigned char>(description[0])));
    throw Error(file + " line " + std::to_string(begin.line) + " column " + std::to_string(begin.column) +
                ": not valid TOML: " + description);
  }
}

fs::path plan_folder(const std::string& path) {
  std::error_code ec;
  const fs::path absolute = fs::absolute(path.empty() ? fs::path(".") : fs::path(path), ec);
  return (ec ? fs::path(path) : absolute).parent_path().lexically_normal();
}

}  // namespace

std::string resolve(const Context& ctx, const std::string& text) {
  const fs::path p(text);
  return (p.is_absolute() ? p : ctx.folder / p).lexically_normal().string();
}

const toml::table* section(const Context& ctx, const toml::table& root, std::string_view key) {
  const toml::node* node = root.get(key);
  if (node == nullptr) return nullptr;
  if (const toml::table* table = node->as_table()) return table;
  throw Error(location(ctx.file, line_of(*node)) + "key " + std::string(key) + " must be a table ([" +
              std::string(key) + "]), not " + type_phrase(*node));
}

std::vector<const toml::table*> section_array(const Context& ctx, const toml::table& root, std::string_view key) {
  const toml::node* node = root.get(key);
  if (node == nullptr) return {};
  std::vector<const toml::table*> out;
  const toml::array* array = node->as_array();
  if (array != nullptr)
    for (const toml::node& item : *array) out.push_back(item.as_table());
  if (array == nullptr || array->empty() || std::find(out.begin(), out.end(), nullptr) != out.end())
    throw Error(location(ctx.file, line_of(*node)) + "key " + std::string(key) + " must be an array of tables ([[" +
                std::string(key) + "]]), not " + (array != nullptr ? "an array of values" : type_phrase(*node)));
  return out;
}

Plan parse(const std::string& text, const std::string& path) {
  Plan plan;
  plan.path = path;
  plan.text = text;
  Context ctx{path, plan_folder(path), &plan.defaults_applied};
  const toml::table root = parse_toml(text, path);
  ctx.root = &root;
  Fields top(path, root, "", "", false);
  top.check_known(
      {"title", "model", "step", "loading", "block", "curve", "material", "toe_defaults", "toe", "requirement",
       "output"});
  plan.title = top.text("title").value_or("");
  plan.model = read_model(ctx, root);
  std::vector<unsigned> step_lines;
  plan.steps = read_steps(ctx, root, plan.model, step_lines);
  plan.loading = read_loading(ctx, root, step_lines, plan.steps);
  ctx.kind = plan.loading.kind;
  plan.curves = read_curves(ctx, root);
  plan.materials = read_materials(ctx, root);
  plan.toes = read_toes(ctx, root, plan.model, plan.materials);
  plan.requirement = read_requirement(ctx, root, plan.loading);
  resolve_damage_limits(ctx, plan);
  plan.output_folder = read_output(ctx, root);
  return plan;
}

}  // namespace plan_detail

Plan parse_plan(const std::string& text, const std::string& path) { return plan_detail::parse(text, path); }

Plan read_plan(const std::string& path) {
  namespace fs = std::filesystem;
  std::error_code ec;
  if (!fs::exists(path, ec)) throw Error("cannot read plan '" + path + "': no such file");
  if (fs::is_directory(path, ec)) throw Error("cannot read plan '" + path + "': it is a folder, not a file");
  std::ifstream in(path, std::ios::binary);
  if (!in) throw Error("cannot read plan '" + path + "': the file cannot be opened; check its permissions");
  std::ostringstream text;
  text << in.rdbuf();
  return parse_plan(text.str(), path);
}

std::string to_string(LoadingKind kind) {
  switch (kind) {
    case LoadingKind::range:
      return "range";
    case LoadingKind::series:
      return "series";
    case LoadingKind::unit_cases:
      return "unit-cases";
    case LoadingKind::blocks:
      return "blocks";
  }
  return "range";
}

}  // namespace toehold
