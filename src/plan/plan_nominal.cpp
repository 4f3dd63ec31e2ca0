// The nominal-stress parts of a plan: [[material]] tables and each toe's [toe.nominal] table with its
// [toe.nominal.weld_group] and [toe.nominal.infinite_life] sub-tables (docs/nominal-method.md, section 11).
#include "plan_sections.hpp"
#include "toehold/common/error.hpp"
#include "toehold/nominal/material.hpp"
#include "toehold/nominal/names.hpp"

#include <algorithm>
#include <set>

namespace toehold::plan_detail {
namespace {

using nominal::NominalSource;

const std::vector<std::string_view> kNominalKeys{"source", "curve",  "values",   "range",     "point",
                                                 "normal", "direction", "regions", "centre", "radius",
                                                 "box",    "distance",  "weld_group", "infinite_life"};
const std::vector<std::string_view> kWeldGroupKeys{"layout", "leg",     "width",   "depth",  "radius",
                                                   "measure", "force_x", "force_y", "force_z", "torsion",
                                                   "bending"};
const std::vector<std::string_view> kInfiniteLifeKeys{"parent",      "weld_metal",         "weld",
                                                      "criterion",   "surface",            "load",
                                                      "diameter",    "temperature_factor", "reliability",
                                                      "misc_factor", "mean"};
const std::vector<std::string_view> kMaterialKeys{"name", "ultimate", "yield", "source"};

// MPa per plan stress unit ([model] is read and checked before the materials and toes).
double stress_factor(const Context& ctx) {
  const toml::node* unit = ctx.root != nullptr ? ctx.root->at_path("model.stress_unit").node() : nullptr;
  if (unit == nullptr || !unit->is_string()) return 1.0;
  return mpa_per(parse_stress_unit(unit->as_string()->get(), location(ctx.file, 0) + "key model.stress_unit"));
}

// The sub-table `key` of `table`, nullptr when absent; Error when the key holds something else.
const toml::table* sub_table(const Fields& f, const toml::table& table, std::string_view key) {
  const toml::node* node = table.get(key);
  if (node == nullptr) return nullptr;
  if (const toml::table* t = node->as_table()) return t;
  f.fail_key(key, "must be a table ([toe.nominal." + std::string(key) + "] or an inline table), not " +
                      type_phrase(*node));
}

// The [[toe]] table read by `f` (matched by its line; the toe's line is unique in the plan).
const toml::table* toe_table(const Context& ctx, const Fields& f) {
  const toml::node* toes = ctx.root != nullptr ? ctx.root->get("toe") : nullptr;
  if (toes == nullptr || !toes->is_array()) return nullptr;
  for (const toml::node& item : *toes->as_array())
    if (const toml::table* t = item.as_table(); t != nullptr && line_of(*t) == f.line()) return t;
  return nullptr;
}

std::vector<std::string> material_names(const std::vector<MaterialPlan>& materials) {
  std::vector<std::string> names;
  for (const auto& m : nominal::material_table()) names.push_back(m.name);
  names.push_back("S355");
  for (const auto& m : materials) names.push_back(m.name);
  return names;
}

// A material by name: the plan's [[material]] tables, then "S355" (band by the toe's thickness), then the table.
nominal::Material named_material(const Fields& f, std::string_view key, const std::string& name,
                                 const ToePlan& toe, const std::vector<MaterialPlan>& materials) {
  for (const MaterialPlan& m : materials)
    if (m.name == name) return m.material;
  try {
    if (name == "S355") return nominal::s355(toe.thickness);
    for (const auto& m : nominal::material_table())
      if (m.name == name) return m;
  } catch (const Error& e) {
    f.fail_key(key, std::string("'") + name + "': " + e.what());
  }
  std::string known;
  for (const auto& n : material_names(materials)) known += (known.empty() ? "" : ", ") + n;
  f.fail_key(key, "names no material '" + name + "'; use one of " + known + ", or define it in a [[material]] table");
}

nominal::Material infinite_life_material(const Fields& f, InfiniteLifePlan& p, const ToePlan& toe,
                                         const std::vector<MaterialPlan>& materials) {
  p.parent = f.text("parent").value_or("");
  p.weld_metal = f.text("weld_metal").value_or("");
  if (p.parent.empty() && p.weld_metal.empty())
    f.fail(" has no material; give parent (the plate material) and weld_metal (the electrode class), e.g. "
           "parent = \"S355\", weld_metal = \"E70xx\"; the weaker of the two is used");
  if (p.weld_metal.empty()) return named_material(f, "parent", p.parent, toe, materials);
  if (p.parent.empty()) return named_material(f, "weld_metal", p.weld_metal, toe, materials);
  return nominal::weaker_of(named_material(f, "parent", p.parent, toe, materials),
                            named_material(f, "weld_metal", p.weld_metal, toe, materials));
}

void read_marin(const Fields& f, nominal::MarinInput& m, NominalSource source) {
  if (auto s = f.text("surface")) m.surface = nominal::parse_surface(*s, f.where("surface"));
  m.load = source == NominalSource::weld_group ? nominal::LoadKind::torsion_shear : nominal::LoadKind::axial;
  if (auto s = f.text("load")) m.load = nominal::parse_load_kind(*s, f.where("load"));
  if (auto d = f.number("diameter")) {
    f.require("diameter", *d > 0, "greater than 0", *d);
    m.diameter_mm = *d;
  }
  m.temperature_factor = f.number("temperature_factor").value_or(1.0);
  f.require("temperature_factor", m.temperature_factor > 0 && m.temperature_factor <= 1.025,
            "greater than 0 and at most 1.025 (the Marin temperature factor k_d)", m.temperature_factor);
  m.reliability_percent = f.number("reliability").value_or(50.0);
  m.misc_factor = f.number("misc_factor").value_or(1.0);
  f.require("misc_factor", m.misc_factor > 0 && m.misc_factor <= 1,
            "greater than 0 and at most 1 (the Marin factor k_f for other reductions)", m.misc_factor);
}

InfiniteLifePlan read_infinite_life(const Context& ctx, const toml::table& table, const std::string& owner,
                                    const ToePlan& toe, const ToeNominalPlan& n,
                                    const std::vector<MaterialPlan>& materials) {
  Fields f(ctx.file, table, "toe.nominal.infinite_life", owner + " [toe.nominal.infinite_life]", true);
  f.check_known(kInfiniteLifeKeys);
  InfiniteLifePlan p;
  p.line = f.line();
  p.input.material = infinite_life_material(f, p, toe, materials);
  p.input.detail = nominal::parse_weld_detail(
      f.need_text("weld", "give the weld type for K_fs: reinforced-butt, transverse-fillet-toe, "
                          "parallel-fillet-end or t-butt-sharp-corners"),
      f.where("weld"));
  if (auto c = f.text("criterion")) p.input.criterion = nominal::parse_criterion(*c, f.where("criterion"));
  if (p.input.criterion == nominal::Criterion::first_cycle_yield)
    f.fail_key("criterion", "must be a fatigue criterion (goodman, gerber or asme-elliptic); first-cycle yield is "
                            "always checked beside it");
  read_marin(f, p.input.marin, n.source);
  try {
    nominal::endurance_limit(p.input.material.ultimate_MPa, p.input.marin);
  } catch (const Error& e) {
    f.fail(std::string(": ") + e.what());
  }
  const bool given_range = n.source == NominalSource::given && n.range_MPa;
  if (auto mean = f.number("mean")) {
    if (!given_range) f.fail_key("mean", "applies to source = \"given\" with a range only; otherwise the mean "
                                         "comes from the load steps");
    p.mean_MPa = *mean * stress_factor(ctx);
  } else if (given_range) {
    f.missing("mean", "a given range has no mean stress; give the nominal mean stress in the plan's stress unit");
  }
  return p;
}

std::vector<double> load_column(const Fields& f, std::string_view key, double scale, std::size_t& count) {
  std::optional<std::vector<double>> values = f.numbers(key);
  if (!values) return {};
  if (count != 0 && values->size() != count)
    f.fail_key(key, "has " + std::to_string(values->size()) + " values but another load array has " +
                        std::to_string(count) + "; give one value per load step in every array");
  count = values->size();
  for (double& v : *values) v *= scale;
  return *values;
}

WeldGroupPlan read_weld_group(const Context& ctx, const toml::table& table, const std::string& owner,
                              const ToePlan& toe) {
  Fields f(ctx.file, table, "toe.nominal.weld_group", owner + " [toe.nominal.weld_group]", true);
  f.check_known(kWeldGroupKeys);
  WeldGroupPlan w;
  w.shape.name = toe.name;
  w.shape.layout = nominal::parse_weld_layout(
      f.need_text("layout", "give the weld layout: single, parallel-pair, across-pair, angle, channel, box or circle"),
      f.where("layout"));
  w.shape.leg_mm = f.need_number("leg", "give the fillet leg size h in the model length unit") * ctx.mm;
  w.shape.width_mm = f.number("width").value_or(0.0) * ctx.mm;
  w.shape.depth_mm = f.number("depth").value_or(0.0) * ctx.mm;
  w.shape.radius_mm = f.number("radius").value_or(0.0) * ctx.mm;
  try {
    nominal::weld_group_properties(w.shape);
  } catch (const Error& e) {
    f.fail(std::string(": ") + e.what());
  }
  if (auto m = f.text("measure")) w.measure = nominal::parse_throat_measure(*m, f.where("measure"));
  std::size_t count = 0;
  const auto fx = load_column(f, "force_x", 1.0, count), fy = load_column(f, "force_y", 1.0, count);
  const auto fz = load_column(f, "force_z", 1.0, count), tz = load_column(f, "torsion", ctx.mm, count);
  const auto mx = load_column(f, "bending", ctx.mm, count);
  if (count == 0)
    f.fail(" has no loads; give force_x, force_y, force_z (N), torsion or bending (N times the model length "
           "unit), each with one value per load step");
  const auto at = [](const std::vector<double>& v, std::size_t i) { return v.empty() ? 0.0 : v[i]; };
  for (std::size_t i = 0; i < count; ++i)
    w.loads.push_back({at(fx, i), at(fy, i), at(fz, i), at(tz, i), at(mx, i)});
  return w;
}

void read_given(const Context& ctx, const Fields& f, ToeNominalPlan& n) {
  const double scale = stress_factor(ctx);
  if (f.has("values") && f.has("range")) f.fail(": give either values (one per load step) or range, not both");
  if (auto values = f.numbers("values")) {
    if (values->size() < 2) f.fail_key("values", "must have one value per load step, at least two");
    for (double& v : *values) v *= scale;
    n.values_MPa = std::move(*values);
  } else if (auto range = f.number("range")) {
    f.require("range", *range >= 0, "0 or more", *range);
    if (ctx.kind != LoadingKind::range)
      f.fail_key("range", "applies to loading kind range only; give values, one nominal stress per load step");
    n.range_MPa = *range * scale;
  } else {
    f.fail(" has no nominal stress; give values (one per load step) or range, in the plan's stress unit");
  }
}

SectionBox read_box(const Fields& f) {
  const std::vector<Vec3> corners = *f.points("box");
  if (corners.size() != 2) f.fail_key("box", "must give two corners [[x, y, z], [x, y, z]]");
  return {corners[0].cwiseMin(corners[1]), corners[0].cwiseMax(corners[1])};
}

void read_section(const Context& ctx, const Fields& f, ToeNominalPlan& n) {
  SectionSpec& s = n.section;
  s.name = "nominal section";  // messages put the toe before it
  const auto point = f.point("point");
  if (!point) f.missing("point", "give a point of the cut plane through the plate away from the weld");
  const auto normal = f.point("normal");
  if (!normal) f.missing("normal", "give the normal of the cut plane (the direction of the nominal stress)");
  if (!(normal->norm() > 0)) f.fail_key("normal", "must not be the zero vector");
  s.point_mm = *point * ctx.mm;
  s.normal = normal->normalized();
  if (auto d = f.point("direction")) {
    if (!(d->norm() > 0)) f.fail_key("direction", "must not be the zero vector");
    s.direction = d->normalized();
  }
  if (auto regions = f.integers("regions")) {
    const toml::node* array = ctx.root != nullptr ? ctx.root->at_path("model.region_array").node() : nullptr;
    if (array == nullptr || !array->is_string())
      f.fail_key("regions", "needs model.region_array, the cell-data array that holds the region values; add it "
                            "to [model]");
    s.limits.region_array = array->as_string()->get();
    s.limits.region_values = *regions;
  }
  if (f.has("centre") != f.has("radius")) f.fail(": give centre and radius together (a disc in the cut plane)");
  if (auto c = f.point("centre")) {
    const double r = *f.number("radius");
    f.require("radius", r > 0, "greater than 0", r);
    s.limits.centre_mm = *c * ctx.mm;
    s.limits.radius_mm = r * ctx.mm;
  }
  if (f.has("box")) {
    SectionBox b = read_box(f);
    s.limits.box = SectionBox{b.lo * ctx.mm, b.hi * ctx.mm};
  }
}

void refuse_unused(const Fields& f, NominalSource source) {
  const std::vector<std::pair<NominalSource, std::vector<std::string_view>>> owned{
      {NominalSource::given, {"values", "range"}},
      {NominalSource::section, {"point", "normal", "direction", "regions", "centre", "radius", "box"}},
      {NominalSource::surface_distance, {"distance"}},
      {NominalSource::weld_group, {"weld_group"}}};
  for (const auto& [s, keys] : owned)
    for (std::string_view key : keys)
      if (s != source && f.has(key))
        f.fail_key(key, "applies to source = \"" + nominal::to_string(s) + "\", not \"" + nominal::to_string(source) +
                            "\"");
}

void read_source(const Context& ctx, const Fields& f, const toml::table& table, const ToePlan& toe,
                 ToeNominalPlan& n) {
  switch (n.source) {
    case NominalSource::given: return read_given(ctx, f, n);
    case NominalSource::section: return read_section(ctx, f, n);
    case NominalSource::surface_distance: {
      const double d = f.need_number("distance", "give the distance from the toe along the read-out path, in the "
                                                 "model length unit, clear of the toe's local stress rise");
      f.require("distance", d > 0, "greater than 0", d);
      n.distance_mm = d * ctx.mm;
      return;
    }
    case NominalSource::weld_group: {
      if (ctx.kind == LoadingKind::series || ctx.kind == LoadingKind::unit_cases)
        f.fail_key("source", "\"weld-group\" works with loading kinds range and blocks only: the throat-stress "
                             "magnitude has no sign to count cycles on; give the nominal stress per load step "
                             "with source = \"given\" instead");
      if (ctx.kind == LoadingKind::blocks && toe.mean_stress)
        f.fail_key("source", "\"weld-group\" has no signed mean stress for mean_stress = \"" +
                                 to_string(*toe.mean_stress) + "\"; remove mean_stress or use source = \"given\"");
      const toml::table* w = sub_table(f, table, "weld_group");
      if (w == nullptr)
        f.missing("weld_group", "source = \"weld-group\" needs a [toe.nominal.weld_group] table with layout, leg, "
                                "dimensions and loads");
      n.weld_group = read_weld_group(ctx, *w, "toe '" + toe.name + "'", toe);
      return;
    }
  }
}

}  // namespace

std::vector<MaterialPlan> read_materials(const Context& ctx, const toml::table& root) {
  std::vector<MaterialPlan> out;
  std::set<std::string> table_names{"S355"};
  for (const auto& m : nominal::material_table()) table_names.insert(m.name);
  for (const toml::table* t : section_array(ctx, root, "material")) {
    Fields f(ctx.file, *t, "material", "[[material]]", true);
    const std::string name = f.need_text("name", "give the material a name that toes' infinite_life tables use");
    f.set_owner("material '" + name + "'");
    f.check_known(kMaterialKeys);
    if (table_names.count(name) != 0)
      f.fail(" has the name of a built-in material; give it a name of its own");
    for (const MaterialPlan& m : out)
      if (m.name == name)
        f.fail(" is defined twice (first at line " + std::to_string(m.line) + "); give each material its own name");
    const double u = f.need_number("ultimate", "give the ultimate tensile strength S_ut in the plan's stress unit");
    const double y = f.need_number("yield", "give the yield strength S_y in the plan's stress unit");
    f.require("ultimate", u > 0, "greater than 0", u);
    f.require("yield", y > 0, "greater than 0", y);
    if (y > u) f.fail_key("yield", "must not exceed ultimate (" + number_text(u) + "), not " + number_text(y));
    const double scale = stress_factor(ctx);
    out.push_back({name, nominal::user_material(name, u * scale, y * scale, f.text("source").value_or("user-defined")),
                   f.line()});
  }
  return out;
}

std::optional<ToeNominalPlan> read_toe_nominal(const Context& ctx, const Fields& f, const ToePlan& toe,
                                               const std::vector<MaterialPlan>& materials) {
  if (!f.has_own("nominal")) return std::nullopt;
  const toml::table* toe_t = toe_table(ctx, f);
  const toml::table* table = toe_t != nullptr ? sub_table(f, *toe_t, "nominal") : nullptr;
  if (table == nullptr) f.fail_key("nominal", "must be a table ([toe.nominal] after the toe's [[toe]])");
  Fields n(ctx.file, *table, "toe.nominal", f.owner() + " [toe.nominal]", true);
  n.check_known(kNominalKeys);
  ToeNominalPlan p;
  p.line = n.line() != 0 ? n.line() : f.line();
  p.source = nominal::parse_nominal_source(
      n.need_text("source", "say where the nominal stress comes from: given, section, surface-distance or weld-group"),
      n.where("source"));
  p.curve = n.need_text("curve", "give the detail class of the nominal-stress check, e.g. \"IIW FAT 80\"");
  refuse_unused(n, p.source);
  read_source(ctx, n, *table, toe, p);
  if (const toml::table* life = sub_table(n, *table, "infinite_life"))
    p.infinite_life = read_infinite_life(ctx, *life, f.owner(), toe, p, materials);
  return p;
}

}  // namespace toehold::plan_detail
