// The loading tables beyond [[step]] and [loading]: .pvd series expanded into steps (pvd_steps), block spectra
// ([[block]]), user-defined S-N curves ([[curve]]), and each toe's allowable Miner sum.
#include <algorithm>
#include <filesystem>
#include <map>

#include "plan_sections.hpp"
#include "toehold/common/error.hpp"
#include "toehold/fatigue/sn_catalogue.hpp"
#include "toehold/model/mesh.hpp"

namespace toehold::plan_detail {
namespace {

// Time steps of a .pvd as read_mesh counts them: entries, or distinct times when the file has parts.
int pvd_step_count(const std::string& pvd) {
  const std::vector<SeriesEntry> entries = read_pvd(pvd);
  const bool parts = std::any_of(entries.begin(), entries.end(), [](const SeriesEntry& e) { return e.part != 0; });
  if (!parts) return static_cast<int>(entries.size());
  std::vector<double> times;
  for (const SeriesEntry& e : entries)
    if (std::find(times.begin(), times.end(), e.time) == times.end()) times.push_back(e.time);
  return static_cast<int>(times.size());
}

// [first, last] of pvd_steps: "all" or two integers.
std::pair<int, int> pvd_range(const Fields& f, int count) {
  std::optional<std::string> all;
  std::vector<int> range;
  try {
    all = f.text("pvd_steps");
  } catch (const Error&) {
    range = f.integers("pvd_steps").value_or(std::vector<int>{});  // not a string: [first, last]
  }
  if (all) {
    if (*all != "all") f.fail_key("pvd_steps", "must be \"all\" or [first, last], not \"" + *all + "\"");
    return {0, count - 1};
  }
  if (range.size() != 2 || range[0] < 0 || range[1] < range[0] || range[1] >= count)
    f.fail_key("pvd_steps", "must be \"all\" or [first, last] with 0 <= first <= last <= " +
                                std::to_string(count - 1) + " (the file has " + std::to_string(count) + " steps)");
  return {range[0], range[1]};
}

double block_cycles(const Fields& f) {
  const double n = f.need_number("cycles", "give the number of cycles of the block per repeat of the spectrum");
  f.require("cycles", n >= 0, "0 or more", n);
  return n;
}

int step_index(const Fields& f, std::string_view key, const std::vector<StepPlan>& steps) {
  const std::string name = f.need_text(key, "name the [[step]] at this end of the block's range");
  for (std::size_t i = 0; i < steps.size(); ++i)
    if (steps[i].name == name) return static_cast<int>(i);
  f.fail_key(key, "names no [[step]]: '" + name + "'; use one of the step names");
}

SnSegment segment_from(const Context& ctx, const std::string& owner, const toml::node& node) {
  const toml::array* pair = node.as_array();
  std::optional<double> m, log_a;
  if (pair != nullptr && pair->size() == 2) {
    m = (*pair)[0].value<double>();
    log_a = (*pair)[1].value<double>();
  }
  if (!m || !log_a)
    throw Error(location(ctx.file, line_of(node)) + owner + ": each segment must be [slope m, log10 a] (two numbers)");
  return SnSegment::with_intercept(*m, *log_a);
}

std::vector<SnSegment> read_segments(const Context& ctx, const std::string& owner, const toml::table& table) {
  std::vector<SnSegment> out;
  const toml::node* node = table.get("segments");
  if (node == nullptr) return out;
  const toml::array* list = node->as_array();
  if (list == nullptr) throw Error(location(ctx.file, line_of(*node)) + owner + ": key curve.segments must be an array");
  for (const toml::node& item : *list) out.push_back(segment_from(ctx, owner, item));
  return out;
}

StressKind curve_kind(const Fields& f) {
  const std::string kind = f.text("stress").value_or("normal");
  if (kind == "normal") return StressKind::normal;
  if (kind == "shear") return StressKind::shear;
  f.fail_key("stress", "must be \"normal\" or \"shear\", not \"" + kind + "\"");
}

SnCurve build_curve(const Context& ctx, const Fields& f, const toml::table& table, const std::string& name) {
  const std::vector<SnSegment> segments = read_segments(ctx, f.owner(), table);
  const std::optional<double> fat = f.number("fat");
  const double cutoff = f.number("cutoff").value_or(0.0);
  f.require("cutoff", cutoff >= 0, "0 or more", cutoff);
  if (fat && !segments.empty()) f.fail_key("segments", "cannot be given together with fat; give one of them");
  if (fat) {
    FatCurveInput in{name, *fat, f.numbers("slopes").value_or(std::vector<double>{}),
                     f.numbers("knees").value_or(std::vector<double>{}), cutoff, std::nullopt, curve_kind(f)};
    if (in.slopes.empty()) f.missing("slopes", "give the slopes m1, m2, ... of the curve");
    return user_fat_curve(in);
  }
  if (segments.empty())
    f.fail(" has no segments; give fat and slopes (and knees), or segments = [[m, log10_a], ...]");
  return user_segment_curve(name, segments, cutoff, curve_kind(f));
}

}  // namespace

std::vector<StepPlan> expand_pvd_steps(const Fields& f, const StepPlan& step) {
  if (!f.has("pvd_steps")) return {step};
  if (std::filesystem::path(step.file).extension() != ".pvd")
    f.fail_key("pvd_steps", "applies to .pvd files only; '" + std::filesystem::path(step.file).filename().string() +
                                "' is not one");
  const auto [first, last] = pvd_range(f, pvd_step_count(step.file));
  std::vector<StepPlan> out;
  for (int k = first; k <= last; ++k) {
    StepPlan each = step;
    each.name = step.name + " " + std::to_string(k);
    each.step = k;
    out.push_back(each);
  }
  return out;
}

std::vector<BlockPlan> read_blocks(const Context& ctx, const toml::table& root, LoadingKind kind,
                                   const std::vector<StepPlan>& steps) {
  const std::vector<const toml::table*> tables = section_array(ctx, root, "block");
  if (kind != LoadingKind::blocks && !tables.empty())
    throw Error(location(ctx.file, tables.front()->source().begin.line) +
                "[[block]] tables apply to loading kind \"blocks\" only; set kind = \"blocks\" in [loading]");
  if (kind == LoadingKind::blocks && tables.empty())
    throw Error(location(ctx.file, 0) +
                "loading kind \"blocks\" needs at least one [[block]] table (from, to, cycles)");
  std::vector<BlockPlan> blocks;
  for (std::size_t i = 0; i < tables.size(); ++i) {
    Fields f(ctx.file, *tables[i], "block", "block " + std::to_string(i + 1), true);
    f.check_known({"from", "to", "cycles"});
    BlockPlan b;
    b.from_step = step_index(f, "from", steps);
    b.to_step = step_index(f, "to", steps);
    b.from = steps[static_cast<std::size_t>(b.from_step)].name;
    b.to = steps[static_cast<std::size_t>(b.to_step)].name;
    b.cycles = block_cycles(f);
    b.line = f.line();
    blocks.push_back(b);
  }
  return blocks;
}

std::vector<CurvePlan> read_curves(const Context& ctx, const toml::table& root) {
  std::vector<CurvePlan> curves;
  std::map<std::string, unsigned> seen;
  for (const toml::table* table : section_array(ctx, root, "curve")) {
    Fields f(ctx.file, *table, "curve", "curve " + std::to_string(curves.size() + 1), true);
    const std::string name = f.need_text("name", "give each curve a unique name (toes name it in curve)");
    f.set_owner("curve '" + name + "'");
    f.check_known({"name", "fat", "slopes", "knees", "cutoff", "segments", "stress"});
    if (const auto it = seen.find(name); it != seen.end())
      f.fail(" is defined twice (first at line " + std::to_string(it->second) + "); give each curve its own name");
    seen.emplace(name, f.line());
    try {
      curves.push_back(CurvePlan{name, build_curve(ctx, f, *table, name)});
    } catch (const Error& e) {
      const std::string what = e.what();
      if (what.rfind(ctx.file, 0) == 0) throw;
      throw Error(location(ctx.file, f.line()) + "curve '" + name + "': " + what);
    }
  }
  return curves;
}

void resolve_damage_limits(const Context& ctx, Plan& plan) {
  if (plan.loading.kind == LoadingKind::range) return;
  for (ToePlan& toe : plan.toes) {
    if (plan.requirement.damage_limit_given) {
      toe.damage_limit = plan.requirement.damage_limit;
      continue;
    }
    std::optional<SnCurve> curve;
    try {
      curve = find_curve(plan, toe.curve);
    } catch (const Error& e) {
      throw Error(location(ctx.file, static_cast<unsigned>(toe.line)) + "toe '" + toe.name + "': " + e.what());
    }
    std::string basis;
    toe.damage_limit = default_damage_limit(*curve, basis);
    ctx.defaults->push_back("toe '" + toe.name + "': damage_limit = " + (toe.damage_limit == 1.0 ? "1" : "0.5") +
                            " (" + basis + ")");
  }
}

}  // namespace toehold::plan_detail

namespace toehold {

SnCurve find_curve(const Plan& plan, const std::string& name) {
  for (const CurvePlan& c : plan.curves)
    if (c.name == name) return c.curve;
  return parse_sn_curve(name);
}

}  // namespace toehold
