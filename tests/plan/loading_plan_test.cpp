// The loading keys of a plan beyond range: .pvd series expanded into steps, block spectra, user curves, the
// mean-stress case and each toe's allowable damage sum, with their errors.
#include "toehold/common/error.hpp"
#include "toehold/plan/plan.hpp"
#include "support/support.hpp"

#include <algorithm>
#include <fstream>

namespace toehold {
namespace {

// Model, two steps, one toe with `curve`; `extra` is appended.
std::string plan_text(const std::string& extra, const std::string& curve = "IIW FAT 100") {
  return "[model]\nfile = \"frame.vtu\"\nlength_unit = \"mm\"\nstress_unit = \"MPa\"\nstress = \"stress\"\n"
         "[[step]]\nname = \"rest\"\n[[step]]\nname = \"loaded\"\n"
         "[[toe]]\nname = \"north\"\nmarker_array = \"toe\"\nmarker_value = 1\nweld_point = [0, 0, 1]\n"
         "thickness = 12\ncurve = \"" + curve + "\"\n" + extra;
}

std::string error_of(const std::string& text, const std::string& path = "plan.toml") {
  try {
    parse_plan(text, path);
  } catch (const Error& e) {
    return e.what();
  }
  return "no error";
}

bool recorded(const Plan& plan, const std::string& line) {
  return std::find(plan.defaults_applied.begin(), plan.defaults_applied.end(), line) != plan.defaults_applied.end();
}

const std::string kBlocks =
    "[loading]\nkind = \"blocks\"\nrepeats_per_year = 2\n"
    "[[block]]\nfrom = \"rest\"\nto = \"loaded\"\ncycles = 1e5\n"
    "[[block]]\nfrom = \"loaded\"\nto = \"rest\"\ncycles = 300\n";

TEST(LoadingPlan, BlocksNameTheirStepsAndCycles) {
  const Plan plan = parse_plan(plan_text(kBlocks), "plan.toml");
  EXPECT_EQ(plan.loading.kind, LoadingKind::blocks);
  ASSERT_EQ(plan.loading.blocks.size(), 2u);
  EXPECT_EQ(plan.loading.blocks[0].from_step, 0);
  EXPECT_EQ(plan.loading.blocks[0].to_step, 1);
  EXPECT_CLOSE(plan.loading.blocks[0].cycles, 1e5, 0);
  EXPECT_EQ(plan.loading.blocks[1].from, "loaded");
  EXPECT_CLOSE(plan.loading.repeats_per_year, 2.0, 0);
}

TEST(LoadingPlan, NegativeBlockCyclesAreAnError) {
  std::string text = plan_text(kBlocks);
  text.replace(text.find("cycles = 300"), 12, "cycles = -3");
  EXPECT_EQ(error_of(text), "plan.toml line 27: block 2: key block.cycles must be 0 or more, not -3");
}

TEST(LoadingPlan, BlockNamingAnUnknownStepIsAnError) {
  std::string text = plan_text(kBlocks);
  text.replace(text.find("to = \"rest\""), 11, "to = \"parked\"");
  EXPECT_EQ(error_of(text), "plan.toml line 26: block 2: key block.to names no [[step]]: 'parked'; use one of the "
                            "step names");
}

TEST(LoadingPlan, BlocksNeedKindBlocks) {
  EXPECT_EQ(error_of(plan_text("[[block]]\nfrom = \"rest\"\nto = \"loaded\"\ncycles = 1\n[requirement]\ncycles = 1\n")),
            "plan.toml line 17: [[block]] tables apply to loading kind \"blocks\" only; set kind = \"blocks\" in "
            "[loading]");
  EXPECT_EQ(error_of(plan_text("[loading]\nkind = \"blocks\"\n")),
            "plan.toml: loading kind \"blocks\" needs at least one [[block]] table (from, to, cycles)");
}

TEST(LoadingPlan, DamageLimitDefaultsByCurveAndIsRecorded) {
  const Plan iiw = parse_plan(plan_text("[loading]\nkind = \"series\"\n"), "plan.toml");
  EXPECT_CLOSE(iiw.toes[0].damage_limit, 0.5, 0);  // IIW 2016 sec. 4.3.1, from memory [M]
  EXPECT_TRUE(recorded(iiw, "toe 'north': damage_limit = 0.5 (IIW 2016 sec. 4.3.1 allowable Miner sum)"));
  const Plan en = parse_plan(plan_text("[loading]\nkind = \"series\"\n", "EN 71"), "plan.toml");
  EXPECT_CLOSE(en.toes[0].damage_limit, 1.0, 0);  // EN 1993-1-9:2005 Annex A, from memory [M]
  const Plan given =
      parse_plan(plan_text("[loading]\nkind = \"series\"\n[requirement]\ndamage_limit = 0.3\n"), "plan.toml");
  EXPECT_CLOSE(given.toes[0].damage_limit, 0.3, 0);
  EXPECT_TRUE(given.requirement.damage_limit_given);
}

TEST(LoadingPlan, MeanStressCaseIsReadForDamageKindsOnly) {
  const Plan plan = parse_plan(plan_text("mean_stress = \"small-residual-stress\"\n[loading]\nkind = \"series\"\n"),
                               "plan.toml");
  ASSERT_TRUE(plan.toes[0].mean_stress.has_value());
  EXPECT_EQ(*plan.toes[0].mean_stress, IiwMeanStressCase::small_residual_stress);
  EXPECT_EQ(error_of(plan_text("mean_stress = \"stress-relieved\"\n[requirement]\ncycles = 1\n")),
            "plan.toml line 17: toe 'north': key toe.mean_stress applies to loading kinds series, unit-cases and "
            "blocks, not range");
}

TEST(LoadingPlan, UserCurvesAreFoundByName) {
  const Plan plan = parse_plan(
      plan_text("[[curve]]\nname = \"bracket\"\nfat = 80\nslopes = [3, 5]\nknees = [1e7]\n"
                "[[curve]]\nname = \"lug\"\nsegments = [[3, 12.0]]\n[loading]\nkind = \"series\"\n",
                "bracket"),
      "plan.toml");
  ASSERT_EQ(plan.curves.size(), 2u);
  EXPECT_CLOSE(find_curve(plan, "bracket").reference_range(), 80.0, 1e-12);
  // log10 N = 12 - 3 log10 ds: ds = 100 MPa at N = 1e6 (derived [D])
  EXPECT_CLOSE(find_curve(plan, "lug").cycles_to_failure(100.0), 1e6, 1e-9);
  EXPECT_CLOSE(plan.toes[0].damage_limit, 0.5, 0);
}

TEST(LoadingPlan, CurveWithNoSegmentsIsAnError) {
  EXPECT_EQ(error_of(plan_text("[[curve]]\nname = \"empty\"\n[requirement]\ncycles = 1\n")),
            "plan.toml line 17: curve 'empty' has no segments; give fat and slopes (and knees), or segments = "
            "[[m, log10_a], ...]");
}

TEST(LoadingPlan, PvdStepsExpandIntoOneStepPerTimeStep) {
  test::TempDir dir;
  {
    std::ofstream pvd(dir.file("series.pvd"));
    pvd << "<?xml version=\"1.0\"?>\n<VTKFile type=\"Collection\" version=\"0.1\">\n<Collection>\n";
    for (int i = 0; i < 4; ++i) pvd << "<DataSet timestep=\"" << i << "\" file=\"t" << i << ".vtu\"/>\n";
    pvd << "</Collection>\n</VTKFile>\n";
  }
  const std::string text =
      "[model]\nfile = \"series.pvd\"\nlength_unit = \"mm\"\nstress_unit = \"MPa\"\nstress = \"stress\"\n"
      "[[step]]\nname = \"t\"\npvd_steps = \"all\"\n"
      "[[toe]]\nname = \"north\"\nmarker_array = \"toe\"\nmarker_value = 1\nweld_point = [0, 0, 1]\n"
      "thickness = 12\ncurve = \"IIW FAT 100\"\n[loading]\nkind = \"series\"\n";
  const Plan plan = parse_plan(text, dir.file("plan.toml"));
  ASSERT_EQ(plan.steps.size(), 4u);
  EXPECT_EQ(plan.steps[3].name, "t 3");
  EXPECT_EQ(plan.steps[3].step, 3);
  std::string part = text;
  part.replace(part.find("\"all\""), 5, "[1, 2]");
  const Plan two = parse_plan(part, dir.file("plan.toml"));
  ASSERT_EQ(two.steps.size(), 2u);
  EXPECT_EQ(two.steps[0].name, "t 1");
  std::string bad = text;
  bad.replace(bad.find("\"all\""), 5, "[2, 9]");
  EXPECT_EQ(error_of(bad, dir.file("plan.toml")),
            dir.file("plan.toml") + " line 8: step 't': key step.pvd_steps must be \"all\" or [first, last] with 0 <= "
                                    "first <= last <= 3 (the file has 4 steps)");
}

}  // namespace
}  // namespace toehold
