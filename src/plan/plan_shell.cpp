// The plan keys of shell models ([model] shell = true: thickness and layer stress arrays; per step the layer arrays;
// per toe the carrying plate, layer and read-out origin) and the through-thickness linearization of solid toes.
// docs/plan.md and docs/shell-models.md document them.
#include <array>
#include <cmath>

#include "plan_sections.hpp"
#include "toehold/common/error.hpp"
#include "toehold/model/stress_layout.hpp"

namespace toehold::plan_detail {
namespace {

// The four layer names as the keys spell them: stress_<name> and stress_<name>_components.
constexpr std::array<std::string_view, 4> kLayers{"top", "bottom", "membrane", "bending"};

std::string layer_key(std::string_view layer) { return "stress_" + std::string(layer); }
std::string components_key(std::string_view layer) { return "stress_" + std::string(layer) + "_components"; }

StressSpec& layer_of(ShellStressSpec& spec, std::size_t i) {
  switch (i) {
    case 0: return spec.top;
    case 1: return spec.bottom;
    case 2: return spec.membrane;
    default: return spec.bending;
  }
}

bool named(const StressSpec& spec) { return !spec.array.empty() || !spec.component_arrays[0].empty(); }

// The layer arrays the table itself gives (none named: an empty spec). `order` applies to every 6-component one.
ShellStressSpec read_layers(const Fields& f, bool& any_array) {
  ShellStressSpec spec;
  const std::optional<std::string> order = f.text("order");
  any_array = false;
  bool any_components = false;
  for (std::size_t i = 0; i < kLayers.size(); ++i) {
    const std::string key = layer_key(kLayers[i]), ckey = components_key(kLayers[i]);
    const std::optional<std::string> array = f.text(key);
    const std::optional<std::vector<std::string>> components = f.texts(ckey);
    if (array && components) f.fail_key(ckey, "cannot be given together with " + key + "; give one of them");
    if (components && components->size() != 6)
      f.fail_key(ckey, "must name 6 scalar arrays (xx, yy, zz, xy, yz, xz), not " + std::to_string(components->size()));
    StressSpec& layer = layer_of(spec, i);
    if (array) layer.array = *array, any_array = true;
    if (components) {
      for (std::size_t k = 0; k < 6; ++k) layer.component_arrays[k] = (*components)[k];
      any_components = true;
    }
  }
  if (order) {
    parse_component_order(*order, f.where("order"));
    if (!any_array && any_components)
      f.fail_key("order",
                 "applies to 6-component layer arrays (stress_top, stress_bottom, stress_membrane, stress_bending); "
                 "stress_*_components are already in the order xx, yy, zz, xy, yz, xz");
    for (std::size_t i = 0; i < kLayers.size(); ++i)
      if (!layer_of(spec, i).array.empty()) layer_of(spec, i).order = *order;
  }
  return spec;
}

bool any_layer(const ShellStressSpec& spec) {
  return named(spec.top) || named(spec.bottom) || named(spec.membrane) || named(spec.bending);
}

// Either a full top/bottom pair or a full membrane/bending pair.
void check_pair(const Fields& f, const ShellStressSpec& spec) {
  const bool surfaces = named(spec.top) || named(spec.bottom), parts = named(spec.membrane) || named(spec.bending);
  if (surfaces && parts)
    f.fail(" names both surface layers (stress_top, stress_bottom) and membrane/bending parts (stress_membrane, "
           "stress_bending); give one pair");
  const auto half = [&](const StressSpec& a, const StressSpec& b, std::string_view an, std::string_view bn) {
    if (named(a) && !named(b))
      f.fail(" names stress_" + std::string(an) + " but not stress_" + std::string(bn) +
             "; give both, or the other pair (stress_top and stress_bottom, or stress_membrane and stress_bending)");
  };
  half(spec.top, spec.bottom, "top", "bottom");
  half(spec.bottom, spec.top, "bottom", "top");
  half(spec.membrane, spec.bending, "membrane", "bending");
  half(spec.bending, spec.membrane, "bending", "membrane");
}

void refuse_solid_stress(const Fields& f) {
  for (std::string_view key : {"stress", "stress_components"})
    if (f.has(key))
      f.fail_key(key,
                 "does not apply to a shell model: its stresses are layers; give stress_top and stress_bottom, or "
                 "stress_membrane and stress_bending");
}

void read_thickness(const Context& ctx, const Fields& f, ShellModelPlan& shell) {
  const std::optional<double> t = f.number("thickness");
  const std::optional<std::string> array = f.text("thickness_array");
  if (t && array) f.fail_key("thickness_array", "cannot be given together with thickness; give one of them");
  if (!t && !array)
    f.missing("thickness",
              "a shell model needs the plate thickness: give thickness (one value in the length unit) or "
              "thickness_array (a one-component cell-data array)");
  if (t) {
    f.require("thickness", *t > 0, "greater than 0", *t);
    shell.thickness = *t * ctx.mm;
  }
  if (array) shell.thickness_array = *array;
}

void refuse_keys(const Fields& f, const std::vector<std::string_view>& keys, const std::string& why) {
  for (std::string_view key : keys)
    if (f.has(key)) f.fail_key(key, why);
}

}  // namespace

const std::vector<std::string_view>& shell_layer_keys() {
  static const std::vector<std::string_view> keys{
      "stress_top",      "stress_top_components",      "stress_bottom",  "stress_bottom_components",
      "stress_membrane", "stress_membrane_components", "stress_bending", "stress_bending_components"};
  return keys;
}

const std::vector<std::string_view>& shell_model_keys() {
  static const std::vector<std::string_view> keys = [] {
    std::vector<std::string_view> k{"shell", "thickness", "thickness_array"};
    k.insert(k.end(), shell_layer_keys().begin(), shell_layer_keys().end());
    return k;
  }();
  return keys;
}

bool read_shell_flag(const Fields& f) {
  const bool shell = f.flag("shell").value_or(false);
  if (!shell)
    refuse_keys(f, {"thickness", "thickness_array"}, "applies to shell models; add shell = true to [model]");
  if (!shell)
    refuse_keys(f, shell_layer_keys(), "applies to shell models; add shell = true to [model]");
  return shell;
}

ShellModelPlan read_model_shell(const Context& ctx, const Fields& f) {
  refuse_solid_stress(f);
  ShellModelPlan shell;
  read_thickness(ctx, f, shell);
  bool any_array = false;
  shell.layers = read_layers(f, any_array);
  check_pair(f, shell.layers);
  return shell;
}

ShellStressSpec step_layers(const Fields& f, const ModelPlan& model) {
  refuse_solid_stress(f);
  bool any_array = false;
  ShellStressSpec own = read_layers(f, any_array);
  check_pair(f, own);
  ShellStressSpec spec = any_layer(own) ? own : model.shell->layers;
  if (!any_layer(own) && f.has("order")) {  // order alone re-declares the order of the model's layer arrays
    const std::string order = *f.text("order");
    bool applied = false;
    for (std::size_t i = 0; i < kLayers.size(); ++i)
      if (!layer_of(spec, i).array.empty()) layer_of(spec, i).order = order, applied = true;
    if (!applied)
      f.fail_key("order", "describes 6-component layer arrays, but neither the step nor [model] names one");
  }
  if (!any_layer(spec))
    f.fail(" has no layer stresses; give stress_top and stress_bottom, or stress_membrane and stress_bending, in "
           "the step or in [model]");
  return spec;
}

void refuse_step_layers(const Fields& f) {
  refuse_keys(f, shell_layer_keys(), "applies to shell models; add shell = true to [model]");
}

const std::vector<std::string_view>& shell_toe_keys() {
  static const std::vector<std::string_view> keys{"plate_region", "layer", "origin", "weld_leg", "kink_limit"};
  return keys;
}

const std::vector<std::string_view>& through_thickness_keys() {
  static const std::vector<std::string_view> keys{"through_thickness", "through_thickness_points",
                                                  "through_thickness_rule"};
  return keys;
}

void refuse_shell_toe_keys(const Fields& f) {
  std::vector<std::string_view> keys = shell_toe_keys();
  keys.push_back("plate_point");
  refuse_keys(f, keys, "applies to shell models (shell = true in [model])");
}

namespace {

void read_plate(const Context& ctx, const Fields& f, const ModelPlan& model, ShellToePlan& shell) {
  if (std::optional<int> region = f.integer("plate_region")) {
    if (model.region_array.empty())
      f.fail_key("plate_region",
                 "needs model.region_array, the cell-data array that holds the region values; add it to [model]");
    shell.plate_region = *region;
  }
  if (std::optional<Vec3> p = f.point("plate_point")) shell.plate_point = *p * ctx.mm;
  if (!shell.plate_region && !shell.plate_point)
    f.fail(" has no carrying plate; give plate_point (a point on the plate that carries the toe, on the read-out "
           "side) or plate_region (its value in model.region_array)");
}

void read_origin(const Context& ctx, const Fields& f, const ToePlan& toe, ShellToePlan& shell) {
  if (std::optional<std::string> origin = f.text("origin")) {
    shell.origin = parse_toe_origin(*origin, f.where("origin"));
  } else {
    ctx.defaults->push_back("toe '" + toe.name +
                            "': origin = \"intersection\" (read-out distances from the plate intersection line)");
  }
  const std::optional<double> leg = f.number("weld_leg");
  if (shell.origin == ToeOrigin::intersection) {
    if (leg) f.fail_key("weld_leg", "applies to origin = \"weld-toe\" only");
    return;
  }
  if (!leg)
    f.missing("weld_leg",
              "origin = \"weld-toe\" needs the weld leg on the carrying plate (> 0), in the model length unit");
  f.require("weld_leg", *leg > 0, "greater than 0", *leg);
  shell.weld_leg = *leg * ctx.mm;
}

}  // namespace

void read_toe_shell(const Context& ctx, const Fields& f, const ModelPlan& model, ToePlan& toe) {
  refuse_keys(f, {"weld_regions", "weld_point"},
              "applies to solid models; on a shell model name the plate that carries the toe with plate_point or "
              "plate_region");
  refuse_keys(f, through_thickness_keys(),
              "applies to solid models: a shell's layers are already its membrane and bending parts");
  refuse_keys(f, {"nominal"}, "is not available on shell models yet: the nominal-stress method reads a solid model");
  if (f.has("closed")) f.fail_key("closed", "applies to solid models; a toe on a shell intersection line is open");
  ShellToePlan shell;
  read_plate(ctx, f, model, shell);
  if (std::optional<std::string> layer = f.text("layer")) {
    shell.layer = parse_layer_choice(*layer, f.where("layer"));
  } else {
    ctx.defaults->push_back("toe '" + toe.name + "': layer = \"weld-side\" (the surface the attached plate stands on)");
  }
  read_origin(ctx, f, toe, shell);
  if (std::optional<double> kink = f.number("kink_limit")) {
    f.require("kink_limit", *kink > 0 && *kink < 90, "between 0 and 90 degrees", *kink);
    shell.kink_limit_deg = *kink;
  }
  toe.shell = shell;
}

void read_toe_through_thickness(const Context& ctx, const Fields& f, ToePlan& toe) {
  const bool on = f.flag("through_thickness").value_or(false);
  if (!on) {
    refuse_keys(f, {"through_thickness_points", "through_thickness_rule"}, "needs through_thickness = true");
    return;
  }
  ThroughThicknessPlan tt;
  if (std::optional<std::string> rule = f.text("through_thickness_rule"))
    tt.rule = parse_through_thickness_rule(*rule, f.where("through_thickness_rule"));
  tt.points = tt.rule == ThroughThicknessRule::gauss_lobatto ? 9 : 21;
  if (std::optional<int> n = f.integer("through_thickness_points")) {
    tt.points = *n;
    try {
      linearization_stations(toe.thickness, *n, tt.rule);
    } catch (const Error& e) {
      f.fail_key("through_thickness_points", std::string("is not usable: ") + e.what());
    }
  } else {
    ctx.defaults->push_back("toe '" + toe.name + "': through_thickness_points = " + std::to_string(tt.points) + " (" +
                            to_string(tt.rule) + ")");
  }
  toe.through_thickness = tt;
}

}  // namespace toehold::plan_detail
