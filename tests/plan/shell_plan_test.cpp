// Plan keys of shell models (thickness, layer arrays, carrying plate, layer, origin) and of the through-thickness
// linearization of solid toes: values read in mm, defaults recorded, and the errors word for word.
#include <string>

#include "support/support.hpp"
#include "toehold/common/error.hpp"
#include "toehold/plan/plan.hpp"

namespace toehold {
namespace {

using test::error_of;

// A valid shell plan in metres; `model_extra`, `step_extra` and `toe_extra` are appended to the tables.
std::string shell_plan(const std::string& model_extra = "thickness = 0.01\nstress_top = \"S_top\"\n"
                                                        "stress_bottom = \"S_bot\"\n",
                       const std::string& toe_extra = "plate_point = [0, -0.03, 0]\n",
                       const std::string& step_extra = "") {
  return "[model]\n"                      // 1
         "file = \"plate.vtu\"\n"         // 2
         "length_unit = \"m\"\n"          // 3
         "stress_unit = \"MPa\"\n"        // 4
         "shell = true\n" +               // 5
         model_extra +                    // 6...
         "[[step]]\nname = \"a\"\n" + step_extra + "[[step]]\nname = \"b\"\n"
         "[[toe]]\nname = \"t1\"\npoints = [[-0.05, 0, 0], [0.05, 0, 0]]\ncurve = \"IIW FAT 90\"\n" +
         toe_extra + "[requirement]\ncycles = 2e6\n";
}

std::string plan_error(const std::string& text) {
  return error_of([&] { parse_plan(text, "plan.toml"); });
}

TEST(ShellPlan, ReadsThicknessLayersAndToeKeysInMm) {
  const Plan plan = parse_plan(shell_plan("thickness = 0.01\nstress_membrane = \"S_m\"\nstress_bending = \"S_b\"\n"
                                          "order = \"xx,yy,zz,xy,yz,xz\"\n",
                                          "plate_point = [0, -0.03, 0]\nlayer = \"bottom\"\norigin = \"weld-toe\"\n"
                                          "weld_leg = 0.006\nkink_limit = 20\n"),
                               "plan.toml");
  ASSERT_TRUE(plan.model.shell);
  EXPECT_CLOSE(plan.model.shell->thickness, 10.0, 1e-12);  // 0.01 m
  EXPECT_EQ(plan.model.shell->layers.membrane.array, "S_m");
  EXPECT_EQ(plan.model.shell->layers.bending.order, "xx,yy,zz,xy,yz,xz");
  EXPECT_TRUE(plan.model.stress.array.empty());
  EXPECT_EQ(plan.steps[1].layers.bending.array, "S_b");  // steps take the model's layers
  const ToePlan& toe = plan.toes[0];
  ASSERT_TRUE(toe.shell);
  EXPECT_CLOSE(toe.thickness, 10.0, 1e-12);  // from model.thickness
  EXPECT_CLOSE((*toe.shell->plate_point - Vec3(0, -30, 0)).norm(), 0.0, 1e-12);
  EXPECT_EQ(toe.shell->layer, LayerChoice::bottom);
  EXPECT_EQ(toe.shell->origin, ToeOrigin::weld_toe);
  EXPECT_CLOSE(toe.shell->weld_leg, 6.0, 1e-12);
  EXPECT_CLOSE(toe.shell->kink_limit_deg, 20.0, 1e-12);
  EXPECT_TRUE(toe.weld_regions.empty());
}

TEST(ShellPlan, DefaultsAreRecorded) {
  const Plan plan = parse_plan(shell_plan(), "plan.toml");
  const auto has = [&](const std::string& line) {
    for (const auto& d : plan.defaults_applied)
      if (d == line) return true;
    return false;
  };
  EXPECT_TRUE(has("toe 't1': layer = \"weld-side\" (the surface the attached plate stands on)"));
  EXPECT_TRUE(has("toe 't1': origin = \"intersection\" (read-out distances from the plate intersection line)"));
  EXPECT_TRUE(has("toe 't1': thickness = model.thickness (0.01)"));
  EXPECT_EQ(plan.toes[0].shell->layer, LayerChoice::weld_side);
}

TEST(ShellPlan, StepsNameTheirOwnLayersAndThicknessArrayNeedsToeThickness) {
  const Plan plan = parse_plan(shell_plan("thickness_array = \"thk\"\nstress_top = \"S_top\"\nstress_bottom = \"S_bot\"\n",
                                          "plate_point = [0, -0.03, 0]\nthickness = 0.012\n",
                                          "stress_top_components = [\"a\", \"b\", \"c\", \"d\", \"e\", \"f\"]\n"
                                          "stress_bottom = \"low\"\n"),
                               "plan.toml");
  EXPECT_EQ(plan.model.shell->thickness_array, "thk");
  EXPECT_EQ(plan.steps[0].layers.top.component_arrays[5], "f");
  EXPECT_EQ(plan.steps[0].layers.bottom.array, "low");
  EXPECT_EQ(plan.steps[1].layers.top.array, "S_top");
  EXPECT_CLOSE(plan.toes[0].thickness, 12.0, 1e-12);
}

TEST(ShellPlan, ErrorsNameTheKeyAndSayWhatToDo) {
  // Shell model with no layer arrays anywhere.
  EXPECT_EQ(plan_error(shell_plan("thickness = 0.01\n")),
            "plan.toml line 7: step 'a' has no layer stresses; give stress_top and stress_bottom, or stress_membrane "
            "and stress_bending, in the step or in [model]");
  // Thickness missing.
  EXPECT_EQ(plan_error(shell_plan("stress_top = \"S_top\"\nstress_bottom = \"S_bot\"\n")),
            "plan.toml line 1: [model] has no key 'thickness'; a shell model needs the plate thickness: give "
            "thickness (one value in the length unit) or thickness_array (a one-component cell-data array)");
  EXPECT_EQ(plan_error(shell_plan("thickness = 0.01\nstress_top = \"S_top\"\n")),
            "plan.toml line 1: [model] names stress_top but not stress_bottom; give both, or the other pair "
            "(stress_top and stress_bottom, or stress_membrane and stress_bending)");
  EXPECT_EQ(plan_error(shell_plan("thickness = 0.01\nstress = \"S\"\n")),
            "plan.toml line 7: key model.stress does not apply to a shell model: its stresses are layers; give "
            "stress_top and stress_bottom, or stress_membrane and stress_bending");
  EXPECT_EQ(plan_error(shell_plan("thickness = 0.01\nthickness_array = \"thk\"\nstress_top = \"S_top\"\n"
                                  "stress_bottom = \"S_bot\"\n")),
            "plan.toml line 7: key model.thickness_array cannot be given together with thickness; give one of them");
}

TEST(ShellPlan, SolidAndShellToeKeysAreNotMixed) {
  const std::string layers = "thickness = 0.01\nstress_top = \"S_top\"\nstress_bottom = \"S_bot\"\n";
  EXPECT_EQ(plan_error(shell_plan(layers, "weld_point = [0, 0.01, 0.01]\n")),
            "plan.toml line 17: toe 't1': key toe.weld_point applies to solid models; on a shell model name the "
            "plate that carries the toe with plate_point or plate_region");
  EXPECT_EQ(plan_error(shell_plan(layers, "layer = \"top\"\n")),
            "plan.toml line 13: toe 't1' has no carrying plate; give plate_point (a point on the plate that carries "
            "the toe, on the read-out side) or plate_region (its value in model.region_array)");
  EXPECT_EQ(plan_error(shell_plan(layers, "plate_point = [0, -0.03, 0]\norigin = \"weld-toe\"\n")),
            "plan.toml line 13: toe 't1' has no key 'weld_leg'; origin = \"weld-toe\" needs the weld leg on the "
            "carrying plate (> 0), in the model length unit");
  EXPECT_EQ(plan_error(shell_plan(layers, "plate_point = [0, -0.03, 0]\nthrough_thickness = true\n")),
            "plan.toml line 18: toe 't1': key toe.through_thickness applies to solid models: a shell's layers are "
            "already its membrane and bending parts");
  EXPECT_EQ(plan_error(shell_plan(layers, "plate_point = [0, -0.03, 0]\nlayer = \"upper\"\n"))
                .rfind("plan.toml line 18: toe 't1': key toe.layer", 0),
            0u);
}

// A solid plan in mm; `toe_extra` is appended to its [[toe]].
std::string solid_plan(const std::string& toe_extra, const std::string& model_extra = "") {
  return "[model]\nfile = \"m.vtu\"\nlength_unit = \"mm\"\nstress_unit = \"MPa\"\nstress = \"s\"\n" + model_extra +
         "[[step]]\nname = \"a\"\n[[step]]\nname = \"b\"\n"
         "[[toe]]\nname = \"t1\"\nmarker_array = \"toe\"\nmarker_value = 1\nweld_point = [0, 0, 1]\n"
         "thickness = 10\ncurve = \"IIW FAT 90\"\n" +
         toe_extra + "[requirement]\ncycles = 2e6\n";
}

TEST(ShellPlan, ShellKeysOnASolidModelAreRefused) {
  EXPECT_EQ(plan_error(solid_plan("", "thickness = 10\n")),
            "plan.toml line 6: key model.thickness applies to shell models; add shell = true to [model]");
  EXPECT_EQ(plan_error(solid_plan("layer = \"top\"\n")),
            "plan.toml line 17: toe 't1': key toe.layer applies to shell models (shell = true in [model])");
}

TEST(ThroughThicknessPlan, KeyRuleAndPoints) {
  const Plan plan = parse_plan(solid_plan("through_thickness = true\n"), "plan.toml");
  ASSERT_TRUE(plan.toes[0].through_thickness);
  EXPECT_EQ(plan.toes[0].through_thickness->rule, ThroughThicknessRule::gauss_lobatto);
  EXPECT_EQ(plan.toes[0].through_thickness->points, 9);
  const Plan simpson = parse_plan(
      solid_plan("through_thickness = true\nthrough_thickness_rule = \"simpson\"\nthrough_thickness_points = 41\n"),
      "plan.toml");
  EXPECT_EQ(simpson.toes[0].through_thickness->rule, ThroughThicknessRule::simpson);
  EXPECT_EQ(simpson.toes[0].through_thickness->points, 41);
  EXPECT_FALSE(parse_plan(solid_plan(""), "plan.toml").toes[0].through_thickness);
  EXPECT_EQ(plan_error(solid_plan("through_thickness_points = 5\n")),
            "plan.toml line 17: toe 't1': key toe.through_thickness_points needs through_thickness = true");
  EXPECT_EQ(plan_error(solid_plan("through_thickness = true\nthrough_thickness_rule = \"simpson\"\n"
                                  "through_thickness_points = 4\n"))
                .rfind("plan.toml line 19: toe 't1': key toe.through_thickness_points is not usable: ", 0),
            0u);
}

}  // namespace
}  // namespace toehold
