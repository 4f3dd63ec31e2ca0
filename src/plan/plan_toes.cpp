// The [[toe]] tables of a plan and their [toe_defaults]: where each toe is, which side the weld is on, and how its
// hot-spot stress is read out and assessed.
#include <algorithm>
#include <map>

#include "plan_sections.hpp"
#include "toehold/common/error.hpp"

namespace toehold::plan_detail {
namespace {

// Keys that say where a toe is: given per toe, never in [toe_defaults].
// report_stations names stations of this toe, and the [toe.nominal] table belongs to one toe: no defaults either.
const std::vector<std::string_view> kLocationKeys{"name",   "marker_array",    "marker_value", "points",
                                                  "closed", "report_stations", "nominal"};
const std::vector<std::string_view> kSettingKeys{"weld_regions",  "weld_point",   "thickness", "spacing",
                                                 "hot_spot_type", "scheme",       "distances", "factor",
                                                 "definition",    "detail_class", "curve",     "thickness_exponent",
                                                 "mean_stress",   "misalignment_km", "misalignment_offset"};

// Settings of shell toes and of the linearization, which may have defaults too; plate_point says where a plate is.
std::vector<std::string_view> setting_keys() {
  std::vector<std::string_view> keys = kSettingKeys;
  keys.insert(keys.end(), shell_toe_keys().begin(), shell_toe_keys().end());
  keys.insert(keys.end(), through_thickness_keys().begin(), through_thickness_keys().end());
  return keys;
}

std::vector<std::string_view> location_keys() {
  std::vector<std::string_view> keys = kLocationKeys;
  keys.push_back("plate_point");
  return keys;
}

std::vector<std::string_view> all_toe_keys() {
  std::vector<std::string_view> keys = location_keys();
  const std::vector<std::string_view> settings = setting_keys();
  keys.insert(keys.end(), settings.begin(), settings.end());
  return keys;
}

void record(const Context& ctx, const ToePlan& toe, const std::string& what) {
  ctx.defaults->push_back("toe '" + toe.name + "': " + what);
}

const toml::table* read_defaults(const Context& ctx, const toml::table& root) {
  const toml::table* defaults = section(ctx, root, "toe_defaults");
  if (defaults == nullptr) return nullptr;
  Fields f(ctx.file, *defaults, "toe_defaults", "[toe_defaults]", false);
  for (std::string_view key : location_keys())
    if (f.has(key)) f.fail_key(key, "cannot have a default; give it in each [[toe]]");
  f.check_known(setting_keys());
  return defaults;
}

void read_marker(const Fields& f, ToePlan& toe) {
  toe.marker_array = f.need_text("marker_array", "give the point-data array that marks the toe nodes");
  const std::optional<int> value = f.integer("marker_value");
  if (!value)
    f.missing("marker_value", "give the integer value that marks this toe's nodes in '" + toe.marker_array + "'");
  toe.marker_value = *value;
  if (f.has("closed"))
    f.fail_key("closed", "applies to points only; a marked toe is open or closed as its marked nodes are");
}

void read_points(const Context& ctx, const Fields& f, ToePlan& toe) {
  std::vector<Vec3> points = *f.points("points");
  toe.closed = f.flag("closed").value_or(false);
  const std::size_t least = toe.closed ? 3 : 2;
  if (points.size() < least)
    f.fail_key("points", "must list at least " + std::to_string(least) + " points along the " +
                             (toe.closed ? "closed " : "") + "toe, not " + std::to_string(points.size()));
  for (Vec3& p : points) p *= ctx.mm;
  toe.points = std::move(points);
}

void read_location(const Context& ctx, const Fields& f, ToePlan& toe) {
  const bool marker = f.has("marker_array") || f.has("marker_value");
  const bool points = f.has("points");
  if (marker && points) f.fail(": give either marker_array with marker_value, or points, not both");
  if (!marker && !points)
    f.fail(
        " has no location; give marker_array and marker_value (the toe nodes marked in a point-data array), "
        "or points (coordinates along the toe)");
  if (marker)
    read_marker(f, toe);
  else
    read_points(ctx, f, toe);
}

void read_weld_side(const Context& ctx, const Fields& f, const ModelPlan& model, ToePlan& toe) {
  if (std::optional<std::vector<int>> regions = f.integers("weld_regions")) {
    if (model.region_array.empty())
      f.fail_key("weld_regions",
                 "needs model.region_array, the cell-data array that holds the region values; "
                 "add it to [model]");
    toe.weld_regions = std::move(*regions);
  }
  if (std::optional<Vec3> p = f.point("weld_point")) toe.weld_point = *p * ctx.mm;
  if (toe.weld_regions.empty() && !toe.weld_point)
    f.fail(
        " has no weld side; give weld_regions (region values of the weld cells, with model.region_array) or "
        "weld_point (a point inside the weld or the attached part)");
}

void read_thickness(const Context& ctx, const Fields& f, const ModelPlan& model, ToePlan& toe);

void read_sizes(const Context& ctx, const Fields& f, const ModelPlan& model, ToePlan& toe) {
  if (model.shell && model.shell->thickness > 0 && !f.has("thickness")) {
    toe.thickness = model.shell->thickness;
    record(ctx, toe, "thickness = model.thickness (" + number_text(toe.thickness / ctx.mm) + ")");
  } else {
    read_thickness(ctx, f, model, toe);
  }
  if (std::optional<double> spacing = f.number("spacing")) {
    f.require("spacing", *spacing >= 0, "0 or more", *spacing);
    toe.spacing = *spacing * ctx.mm;
  } else {
    record(ctx, toe, "spacing = 0 (a station at every toe node or point)");
  }
}

void read_thickness(const Context& ctx, const Fields& f, const ModelPlan& model, ToePlan& toe) {
  const double t = f.need_number("thickness",
                                 model.shell ? "give the plate thickness t (> 0) in the model length unit, here or in "
                                               "[toe_defaults]: the read-out scheme and the thickness correction use "
                                               "it (the model's thickness_array does not give one value)"
                                             : "give the plate thickness t (> 0) in the model length unit, here or "
                                               "in [toe_defaults]");
  f.require("thickness", t > 0, "greater than 0", t);
  toe.thickness = t * ctx.mm;
}

void read_user_scheme(const Context& ctx, const Fields& f, ToePlan& toe) {
  std::optional<std::vector<double>> d = f.numbers("distances");
  if (!d)
    f.missing("distances", "scheme = \"user\" needs its read-out distances from the toe, in the model length unit");
  for (double& x : *d) x *= ctx.mm;
  toe.user_distances = std::move(*d);
  if (std::optional<double> factor = f.number("factor")) {
    f.require("factor", *factor > 0, "greater than 0", *factor);
    toe.user_factor = *factor;
  } else {
    record(ctx, toe, "factor = 1 (the user scheme's result is not scaled)");
  }
  try {
    make_user_scheme(toe.user_distances, toe.type, toe.user_factor);
  } catch (const Error& e) {
    throw Error(f.where("distances") + ": " + e.what());
  }
}

void read_scheme(const Context& ctx, const Fields& f, ToePlan& toe) {
  if (std::optional<std::string> type = f.text("hot_spot_type")) {
    toe.type = parse_hot_spot_type(*type, f.where("hot_spot_type"));
  } else {
    record(ctx, toe, "hot_spot_type = \"a\" (toe on the plate surface)");
  }
  if (std::optional<std::string> scheme = f.text("scheme")) {
    toe.scheme = parse_scheme_kind(*scheme, f.where("scheme"));
  } else {
    toe.scheme = toe.type == HotSpotType::a ? SchemeKind::fine_linear : SchemeKind::type_b_fine;
    record(ctx, toe,
           "scheme = \"" + to_string(toe.scheme) + "\" (the fine-mesh scheme of type " + to_string(toe.type) +
               " hot spots)");
  }
  if (toe.scheme == SchemeKind::user) return read_user_scheme(ctx, f, toe);
  for (std::string_view key : {"distances", "factor"})
    if (f.has(key)) f.fail_key(key, "applies to scheme = \"user\" only");
  try {
    make_scheme(toe.scheme, toe.type, toe.thickness);
  } catch (const Error& e) {
    throw Error(f.where("scheme") + ": " + e.what());
  }
}

// mean_stress: "none" or an IIW 2016 sec. 3.5.3 residual-stress case (hyphens or underscores).
void read_mean_stress(const Context& ctx, const Fields& f, ToePlan& toe) {
  const std::optional<std::string> text = f.text("mean_stress");
  if (ctx.kind == LoadingKind::range) {
    if (text) f.fail_key("mean_stress", "applies to loading kinds series, unit-cases and blocks, not range");
    return;
  }
  if (!text) {
    record(ctx, toe, "mean_stress = \"none\" (no mean-stress enhancement f(R))");
    return;
  }
  if (*text == "none") return;
  std::string key = *text;
  std::replace(key.begin(), key.end(), '-', '_');
  toe.mean_stress = parse_iiw_mean_stress_case(key, f.where("mean_stress"));
}

// misalignment_km (k_m as calculated, >= 1) or misalignment_offset (axial offset e of equal plates, model length
// unit: k_m = 1 + 3 e / t, IIW 2016 sec. 3.8.2); neither: k_m = 1.
void read_misalignment(const Context& ctx, const Fields& f, ToePlan& toe) {
  if (f.has("misalignment_km") && f.has("misalignment_offset"))
    f.fail_key("misalignment_offset", "cannot be given together with misalignment_km; give one of the two");
  if (std::optional<double> km = f.number("misalignment_km")) {
    f.require("misalignment_km", *km >= 1, "1 or more (1 = no misalignment)", *km);
    toe.misalignment_km = *km;
  } else if (std::optional<double> e = f.number("misalignment_offset")) {
    f.require("misalignment_offset", *e >= 0, "0 or more", *e);
    toe.misalignment_km = axial_misalignment_factor(*e * ctx.mm, toe.thickness);
  }
}

void read_assessment(const Context& ctx, const Fields& f, ToePlan& toe) {
  if (std::optional<std::string> definition = f.text("definition")) {
    toe.definition = *definition;
  } else {
    record(ctx, toe, "definition = \"perpendicular\" (the normal stress across the toe)");
  }
  toe.report_stations = f.integers("report_stations").value_or(std::vector<int>{});
  toe.detail_class = f.text("detail_class").value_or("");
  toe.curve = f.need_text("curve", "name the S-N curve of the detail, e.g. \"IIW FAT 100\"");
  if (std::optional<double> n = f.number("thickness_exponent")) {
    f.require("thickness_exponent", *n >= 0, "0 or more", *n);
    toe.thickness_exponent = *n;
  } else {
    record(ctx, toe, "no thickness_exponent (no thickness correction)");
  }
  read_mean_stress(ctx, f, toe);
}

ToePlan read_toe(const Context& ctx, const Fields& f, const ModelPlan& model,
                 const std::vector<MaterialPlan>& materials) {
  ToePlan toe;
  toe.line = static_cast<int>(f.line());
  toe.name = f.need_text("name", "give each toe a unique name (it labels every output)");
  read_location(ctx, f, toe);
  if (model.shell) {
    read_toe_shell(ctx, f, model, toe);
  } else {
    refuse_shell_toe_keys(f);
    read_weld_side(ctx, f, model, toe);
  }
  read_sizes(ctx, f, model, toe);
  if (!model.shell) read_toe_through_thickness(ctx, f, toe);
  read_scheme(ctx, f, toe);
  read_assessment(ctx, f, toe);
  read_misalignment(ctx, f, toe);
  toe.nominal = read_toe_nominal(ctx, f, toe, materials);
  return toe;
}

}  // namespace

std::vector<ToePlan> read_toes(const Context& ctx, const toml::table& root, const ModelPlan& model,
                               const std::vector<MaterialPlan>& materials) {
  const toml::table* defaults = read_defaults(ctx, root);
  const std::vector<const toml::table*> tables = section_array(ctx, root, "toe");
  if (tables.empty())
    throw Error(location(ctx.file, 0) + "the plan has no [[toe]] table; add one for each weld toe to assess");
  std::vector<ToePlan> toes;
  std::map<std::string, unsigned> lines;
  for (std::size_t i = 0; i < tables.size(); ++i) {
    Fields f(ctx.file, *tables[i], "toe", "toe " + std::to_string(i + 1), true);
    f.set_fallback(defaults, "toe_defaults");
    const std::string name = f.need_text("name", "give each toe a unique name (it labels every output)");
    f.set_owner("toe '" + name + "'");
    f.check_known(all_toe_keys());
    if (const auto seen = lines.find(name); seen != lines.end())
      f.fail(" is defined twice (first at line " + std::to_string(seen->second) + "); give each toe its own name");
    lines.emplace(name, f.line());
    toes.push_back(read_toe(ctx, f, model, materials));
  }
  return toes;
}

}  // namespace toehold::plan_detail
