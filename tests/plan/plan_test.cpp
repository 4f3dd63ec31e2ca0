// Reading valid plans: every section into the Plan struct, lengths converted to mm, paths resolved, defaults
// recorded, [toe_defaults] merged, and the complete example of docs/plan.md.
#include "toehold/plan/plan.hpp"

#include <algorithm>
#include <filesystem>
#include <fstream>
#include <sstream>

#include "support/support.hpp"
#include "toehold/common/error.hpp"

namespace toehold {
namespace {

namespace fs = std::filesystem;
using Lines = std::vector<std::string>;

bool contains(const Lines& lines, const std::string& line) {
  return std::find(lines.begin(), lines.end(), line) != lines.end();
}

// A plan with every section, in metres, series loading.
const char* kMetrePlan = R"(title = "Crane runway, end of stiffener"
[model]
file = "models/../runway.pvd"
length_unit = "m"
stress_unit = "Pa"
stress_components = ["sxx", "syy", "szz", "sxy", "syz", "sxz"]
region_array = "part"
[[step]]
name = "empty"
pvd_step = 0
[[step]]
name = "trolley at mid span"
file = "/data/loaded.vtu"
stress = "S"
order = "11 22 33 12 23 13"
[loading]
kind = "series"
counting = "repeating"
repeats_per_year = 1000
[[toe]]
name = "stiffener end"
points = [[0, 0, 0], [0.1, 0, 0], [0.1, 0.05, 0]]
closed = true
weld_regions = [3, 4]
weld_point = [0.05, 0.01, 0.005]
thickness = 0.012
spacing = 0.005
hot_spot_type = "b"
scheme = "user"
distances = [0.004, 0.01]
factor = 1.1
definition = "effective"
detail_class = "C1"
curve = "DNV D"
thickness_exponent = 0.2
mean_stress = "none"
[requirement]
gamma_M = 1.35
gamma_F = 1.1
damage_limit = 0.5
design_life_years = 25
[output]
folder = "results/run1"
)";

// A small valid plan in mm with range loading; `extra` is appended (more tables, or keys of [requirement]).
std::string minimal_plan(const std::string& extra = "") {
  return "[model]\nfile = \"frame.vtu\"\nlength_unit = \"mm\"\nstress_unit = \"MPa\"\nstress = \"stress\"\n"
         "[[step]]\nname = \"rest\"\n[[step]]\nname = \"loaded\"\n"
         "[[toe]]\nname = \"north\"\nmarker_array = \"toe\"\nmarker_value = 1\nweld_point = [0, 0, 1]\n"
         "thickness = 12\ncurve = \"IIW FAT 100\"\n" +
         extra + (extra.find("[requirement]") == std::string::npos ? "[requirement]\ncycles = 2000000\n" : "");
}

std::string in(const test::TempDir& dir, const std::string& name) {
  return (dir.path() / name).lexically_normal().string();
}

std::string slurp(const std::string& path) {
  std::ifstream f(path, std::ios::binary);
  std::ostringstream s;
  s << f.rdbuf();
  return s.str();
}

TEST(Plan, CompletePlanInMetresParsesWithLengthsInMm) {
  test::TempDir dir;
  const Plan plan = parse_plan(kMetrePlan, dir.file("plan.toml"));
  EXPECT_EQ(plan.title, "Crane runway, end of stiffener");
  EXPECT_EQ(plan.model.file, in(dir, "runway.pvd"));
  EXPECT_EQ(plan.model.length_unit, LengthUnit::m);
  EXPECT_EQ(plan.model.stress_unit, StressUnit::Pa);
  EXPECT_EQ(plan.model.stress.array, "");
  EXPECT_EQ(plan.model.stress.component_arrays[0], "sxx");
  EXPECT_EQ(plan.model.stress.component_arrays[5], "sxz");
  EXPECT_EQ(plan.model.region_array, "part");

  ASSERT_EQ(plan.steps.size(), 2u);
  EXPECT_EQ(plan.steps[0].name, "empty");
  EXPECT_EQ(plan.steps[0].file, in(dir, "runway.pvd"));
  EXPECT_EQ(plan.steps[0].step, 0);
  EXPECT_EQ(plan.steps[0].stress.component_arrays[3], "sxy");
  EXPECT_EQ(plan.steps[1].name, "trolley at mid span");
  EXPECT_EQ(plan.steps[1].file, "/data/loaded.vtu");
  EXPECT_EQ(plan.steps[1].step, -1);
  EXPECT_EQ(plan.steps[1].stress.array, "S");
  EXPECT_EQ(plan.steps[1].stress.order, "11 22 33 12 23 13");
  EXPECT_EQ(plan.steps[1].stress.component_arrays[0], "");

  EXPECT_EQ(plan.loading.kind, LoadingKind::series);
  EXPECT_TRUE(plan.loading.repeating_history);
  EXPECT_CLOSE(plan.loading.repeats_per_year, 1000.0, 1e-15);

  ASSERT_EQ(plan.toes.size(), 1u);
  const ToePlan& toe = plan.toes[0];
  EXPECT_EQ(toe.name, "stiffener end");
  EXPECT_EQ(toe.line, 20);
  EXPECT_EQ(toe.marker_array, "");
  // 1 m = 1000 mm (SI prefix), so 0.1 m = 100 mm, 0.05 m = 50 mm; derived [D].
  ASSERT_EQ(toe.points.size(), 3u);
  EXPECT_CLOSE(toe.points[1].x(), 100.0, 1e-12);
  EXPECT_CLOSE(toe.points[2].y(), 50.0, 1e-12);
  EXPECT_CLOSE(toe.points[2].z(), 0.0, 1e-12);
  EXPECT_TRUE(toe.closed);
  EXPECT_EQ(toe.weld_regions, (std::vector<int>{3, 4}));
  ASSERT_TRUE(toe.weld_point.has_value());
  EXPECT_CLOSE(toe.weld_point->x(), 50.0, 1e-12);  // 0.05 m [D]
  EXPECT_CLOSE(toe.weld_point->y(), 10.0, 1e-12);  // 0.01 m [D]
  EXPECT_CLOSE(toe.weld_point->z(), 5.0, 1e-12);   // 0.005 m [D]
  EXPECT_CLOSE(toe.thickness, 12.0, 1e-12);        // 0.012 m [D]
  EXPECT_CLOSE(toe.spacing, 5.0, 1e-12);           // 0.005 m [D]
  EXPECT_EQ(toe.type, HotSpotType::b);
  EXPECT_EQ(toe.scheme, SchemeKind::user);
  ASSERT_EQ(toe.user_distances.size(), 2u);
  EXPECT_CLOSE(toe.user_distances[0], 4.0, 1e-12);   // 0.004 m [D]
  EXPECT_CLOSE(toe.user_distances[1], 10.0, 1e-12);  // 0.01 m [D]
  EXPECT_CLOSE(toe.user_factor, 1.1, 1e-15);         // dimensionless: not converted
  EXPECT_EQ(toe.definition, "effective");
  EXPECT_EQ(toe.detail_class, "C1");
  EXPECT_EQ(toe.curve, "DNV D");
  ASSERT_TRUE(toe.thickness_exponent.has_value());
  EXPECT_CLOSE(*toe.thickness_exponent, 0.2, 1e-15);  // dimensionless: not converted

  EXPECT_CLOSE(plan.requirement.gamma_M, 1.35, 1e-15);
  EXPECT_CLOSE(plan.requirement.gamma_F, 1.1, 1e-15);
  EXPECT_CLOSE(plan.requirement.damage_limit, 0.5, 1e-15);
  EXPECT_CLOSE(plan.requirement.design_life_years, 25.0, 1e-15);
  EXPECT_EQ(plan.output_folder, in(dir, "results/run1"));
  EXPECT_TRUE(plan.defaults_applied.empty());  // every key was given
  EXPECT_EQ(plan.text, kMetrePlan);
  EXPECT_EQ(plan.path, dir.file("plan.toml"));
}

TEST(Plan, InchPlanGivesMm) {
  std::string text = minimal_plan();
  text.replace(text.find("\"mm\""), 4, "\"in\"");
  text.replace(text.find("thickness = 12"), 14, "thickness = 0.5\nspacing = 2");
  const Plan plan = parse_plan(text, "plan.toml");
  // 1 in = 25.4 mm exactly (international inch, 1959; from memory [M]): 0.5 in = 12.7 mm, 2 in = 50.8 mm [D].
  EXPECT_CLOSE(plan.toes[0].thickness, 12.7, 1e-12);
  EXPECT_CLOSE(plan.toes[0].spacing, 50.8, 1e-12);
  EXPECT_CLOSE(plan.toes[0].weld_point->z(), 25.4, 1e-12);
}

TEST(Plan, DefaultsAreAppliedAndRecordedByKey) {
  test::TempDir dir;
  const Plan plan = parse_plan(minimal_plan(), dir.file("plan.toml"));
  EXPECT_EQ(plan.title, "");
  EXPECT_EQ(plan.loading.kind, LoadingKind::range);
  EXPECT_FALSE(plan.loading.repeating_history);
  const ToePlan& toe = plan.toes[0];
  EXPECT_EQ(toe.marker_array, "toe");
  EXPECT_EQ(toe.marker_value, 1);
  EXPECT_TRUE(toe.points.empty());
  EXPECT_FALSE(toe.closed);
  EXPECT_TRUE(toe.weld_regions.empty());
  EXPECT_CLOSE(toe.thickness, 12.0, 1e-15);  // integer accepted where a number is expected
  EXPECT_CLOSE(toe.spacing, 0.0, 1e-15);
  EXPECT_EQ(toe.type, HotSpotType::a);
  EXPECT_EQ(toe.scheme, SchemeKind::fine_linear);
  EXPECT_EQ(toe.definition, "perpendicular");
  EXPECT_FALSE(toe.thickness_exponent.has_value());
  EXPECT_CLOSE(plan.requirement.cycles, 2e6, 1e-15);  // integer 2000000 accepted
  EXPECT_CLOSE(plan.requirement.gamma_M, 1.0, 1e-15);
  EXPECT_CLOSE(plan.requirement.gamma_F, 1.0, 1e-15);
  EXPECT_EQ(plan.steps[1].file, in(dir, "frame.vtu"));
  EXPECT_EQ(plan.steps[1].stress.array, "stress");
  EXPECT_EQ(plan.output_folder, in(dir, "plan-out"));
  EXPECT_EQ(plan.defaults_applied,
            (Lines{"loading.kind = \"range\" (the largest range between any two steps)",
                   "toe 'north': spacing = 0 (a station at every toe node or point)",
                   "toe 'north': hot_spot_type = \"a\" (toe on the plate surface)",
                   "toe 'north': scheme = \"fine-linear\" (the fine-mesh scheme of type a hot spots)",
                   "toe 'north': definition = \"perpendicular\" (the normal stress across the toe)",
                   "toe 'north': no thickness_exponent (no thickness correction)",
                   "requirement.gamma_M = 1 (no partial factor on fatigue resistance)",
                   "requirement.gamma_F = 1 (no partial factor on the load)",
                   "output.folder = \"" + in(dir, "plan-out") + "\" (<plan file stem>-out beside the plan)"}));
}

TEST(Plan, TypeBDefaultsToTheFineTypeBScheme) {
  std::string text = minimal_plan();
  text.replace(text.find("thickness = 12"), 14, "thickness = 12\nhot_spot_type = \"b\"");
  const Plan plan = parse_plan(text, "plan.toml");
  EXPECT_EQ(plan.toes[0].scheme, SchemeKind::type_b_fine);
  EXPECT_TRUE(contains(plan.defaults_applied,
                       "toe 'north': scheme = \"type-b-fine\" (the fine-mesh scheme of type b hot spots)"));
}

TEST(Plan, ToeDefaultsMergeAndToesOverrideThem) {
  const std::string text =
      "[model]\nfile = \"m.vtu\"\nlength_unit = \"m\"\nstress_unit = \"MPa\"\nstress = \"s\"\n"
      "region_array = \"region\"\n"
      "[[step]]\nname = \"a\"\n[[step]]\nname = \"b\"\n"
      "[toe_defaults]\nthickness = 0.02\nspacing = 0.01\nscheme = \"coarse-linear\"\ncurve = \"IIW FAT 90\"\n"
      "weld_regions = [7]\n"
      "[[toe]]\nname = \"first\"\nmarker_array = \"toe\"\nmarker_value = 1\n"
      "[[toe]]\nname = \"second\"\nmarker_array = \"toe\"\nmarker_value = 2\nthickness = 0.03\n"
      "curve = \"IIW FAT 100\"\nweld_point = [0, 0, 0.001]\n"
      "[requirement]\ncycles = 1e5\n";
  const Plan plan = parse_plan(text, "plan.toml");
  ASSERT_EQ(plan.toes.size(), 2u);
  const ToePlan& first = plan.toes[0];
  const ToePlan& second = plan.toes[1];
  EXPECT_CLOSE(first.thickness, 20.0, 1e-12);  // 0.02 m from [toe_defaults], in mm [D]
  EXPECT_CLOSE(first.spacing, 10.0, 1e-12);    // 0.01 m [D]
  EXPECT_EQ(first.scheme, SchemeKind::coarse_linear);
  EXPECT_EQ(first.curve, "IIW FAT 90");
  EXPECT_EQ(first.weld_regions, std::vector<int>{7});
  EXPECT_FALSE(first.weld_point.has_value());
  EXPECT_CLOSE(second.thickness, 30.0, 1e-12);  // own 0.03 m overrides the default [D]
  EXPECT_CLOSE(second.spacing, 10.0, 1e-12);
  EXPECT_EQ(second.curve, "IIW FAT 100");
  EXPECT_EQ(second.marker_value, 2);
  EXPECT_EQ(second.weld_regions, std::vector<int>{7});
  EXPECT_CLOSE(second.weld_point->z(), 1.0, 1e-12);  // 0.001 m [D]
  for (const std::string& line : plan.defaults_applied) {
    EXPECT_EQ(line.find("spacing"), std::string::npos) << line;  // from [toe_defaults], not a toehold default
    EXPECT_EQ(line.find("scheme"), std::string::npos) << line;
  }
}

TEST(Plan, UnitCasesResolveTheHistoryAndRecordTheirDefaults) {
  test::TempDir dir;
  std::string text = minimal_plan(
      "[loading]\nkind = \"unit-cases\"\nhistory = \"../loads/channels.csv\"\n"
      "[requirement]\n");
  const Plan plan = parse_plan(text, dir.file("plan.toml"));
  EXPECT_EQ(plan.loading.kind, LoadingKind::unit_cases);
  EXPECT_EQ(plan.loading.history_file, (dir.path().parent_path() / "loads/channels.csv").string());
  EXPECT_FALSE(plan.loading.repeating_history);
  EXPECT_FALSE(plan.requirement.damage_limit_given);
  EXPECT_CLOSE(plan.toes[0].damage_limit, 0.5, 1e-15);  // IIW 2016 sec. 4.3.1, from memory [M]
  EXPECT_CLOSE(plan.requirement.cycles, 0.0, 1e-15);
  for (const char* line :
       {"loading.counting = \"half-cycles\" (ASTM E1049 sec. 5.4.4)", "loading.repeats_per_year = 0 (no life in years)",
        "toe 'north': damage_limit = 0.5 (IIW 2016 sec. 4.3.1 allowable Miner sum)",
        "toe 'north': mean_stress = \"none\" (no mean-stress enhancement f(R))",
        "requirement.design_life_years = 0 (no required life in years)"})
    EXPECT_TRUE(contains(plan.defaults_applied, line)) << line;
}

TEST(Plan, StepOrderAloneRedeclaresTheModelArrayOrder) {
  std::string text = minimal_plan();
  text.replace(text.find("name = \"loaded\""), 15, "name = \"loaded\"\norder = \"xx yy zz xy xz yz\"");
  const Plan plan = parse_plan(text, "plan.toml");
  EXPECT_EQ(plan.steps[0].stress.order, "");
  EXPECT_EQ(plan.steps[1].stress.array, "stress");
  EXPECT_EQ(plan.steps[1].stress.order, "xx yy zz xy xz yz");
}

TEST(Plan, ReadPlanKeepsTheTextVerbatimAndPutsOutputBesideIt) {
  test::TempDir dir;
  const std::string path = dir.file("frame.toml");
  const std::string text = "# a comment that must survive\n" + minimal_plan();
  std::ofstream(path, std::ios::binary) << text;
  const Plan plan = read_plan(path);
  EXPECT_EQ(plan.text, text);
  EXPECT_EQ(plan.path, path);
  EXPECT_EQ(plan.model.file, in(dir, "frame.vtu"));
  EXPECT_EQ(plan.output_folder, in(dir, "frame-out"));
}

TEST(Plan, LoadingKindNames) {
  EXPECT_EQ(to_string(LoadingKind::range), "range");
  EXPECT_EQ(to_string(LoadingKind::series), "series");
  EXPECT_EQ(to_string(LoadingKind::unit_cases), "unit-cases");
  const Plan plan =
      parse_plan(minimal_plan("[loading]\nkind = \"unit_cases\"\nhistory = \"h.csv\"\n[requirement]\n"), "plan.toml");
  EXPECT_EQ(plan.loading.kind, LoadingKind::unit_cases);
}

// The first ```toml block of docs/plan.md, so the documented example can never drift from what is accepted.
std::string docs_example() {
  const std::string doc = slurp(TOEHOLD_SOURCE_DIR "/docs/plan.md");
  const std::string fence = "```toml\n";
  const std::size_t begin = doc.find(fence);
  if (begin == std::string::npos) return "";
  const std::size_t end = doc.find("```", begin + fence.size());
  return doc.substr(begin + fence.size(), end - begin - fence.size());
}

TEST(PlanDocs, CompleteExampleParses) {
  const std::string example = docs_example();
  ASSERT_FALSE(example.empty()) << "docs/plan.md has no ```toml block";
  const Plan plan = parse_plan(example, "/work/plans/frame_rail.toml");
  EXPECT_EQ(plan.model.file, "/work/plans/frame_rail.pvd");
  ASSERT_EQ(plan.steps.size(), 2u);
  EXPECT_EQ(plan.steps[1].step, 1);
  ASSERT_EQ(plan.toes.size(), 2u);
  EXPECT_CLOSE(plan.toes[0].thickness, 12.0, 1e-15);  // from [toe_defaults]
  EXPECT_EQ(plan.toes[0].curve, "IIW FAT 100");
  EXPECT_CLOSE(plan.toes[1].thickness, 10.0, 1e-15);
  EXPECT_EQ(plan.toes[1].scheme, SchemeKind::user);
  EXPECT_EQ(plan.toes[1].user_distances.size(), 2u);
  EXPECT_CLOSE(plan.requirement.cycles, 2e6, 1e-15);
  EXPECT_EQ(plan.output_folder, "/work/plans/toehold-out");
}

}  // namespace
}  // namespace toehold
