// The [toe.nominal] and [[material]] tables of a plan: what each source reads, unit conversion, defaults, and the
// bad input the plan refuses, word for word.
#include "support/support.hpp"
#include "toehold/common/error.hpp"
#include "toehold/plan/plan.hpp"

#include <string>

namespace toehold {
namespace {

// A valid plan with two load steps and one toe, in metres and MPa unless a test changes the head; `nominal` is
// appended after the toe (lines from 16 on), `tail` after the requirement.
std::string plan_text(const std::string& nominal, const std::string& head = "length_unit = \"mm\"\nstress_unit = \"MPa\"",
                      const std::string& loading = "") {
  return "[model]\n"                    // 1
         "file = \"m.vtu\"\n"           // 2
         + head + "\n"                  // 3, 4
         "stress = \"stress\"\n"        // 5
         "region_array = \"part\"\n"    // 6
         "[[step]]\n"                   // 7
         "name = \"empty\"\n"           // 8
         "[[step]]\n"                   // 9
         "name = \"loaded\"\n"          // 10
         "[[toe]]\n"                    // 11
         "name = \"rail\"\n"            // 12
         "points = [[0, 0, 0], [10, 0, 0]]\n"  // 13
         "weld_point = [0, 0, 1]\n"     // 14
         "thickness = 10\n"             // 15
         "curve = \"IIW FAT 90\"\n"     // 16
         + nominal +
         "[requirement]\n"
         "cycles = 2e6\n" + loading;
}

std::string error_text(const std::string& text) {
  return test::error_of([&] { parse_plan(text, "plan.toml"); });
}

TEST(NominalPlan, ToeWithoutNominalTableHasNone) {
  const Plan plan = parse_plan(plan_text(""), "plan.toml");
  EXPECT_FALSE(plan.toes[0].nominal.has_value());
  EXPECT_TRUE(plan.materials.empty());
}

TEST(NominalPlan, GivenValuesAreConvertedFromThePlanStressUnit) {
  const Plan plan = parse_plan(plan_text("[toe.nominal]\nsource = \"given\"\ncurve = \"IIW FAT 80\"\n"
                                         "values = [1e6, 4.5e7]\n",
                                         "length_unit = \"mm\"\nstress_unit = \"Pa\""),
                               "plan.toml");
  const ToeNominalPlan& n = *plan.toes[0].nominal;
  EXPECT_EQ(n.source, nominal::NominalSource::given);
  EXPECT_EQ(n.curve, "IIW FAT 80");
  EXPECT_EQ(n.line, 17u);
  ASSERT_EQ(n.values_MPa.size(), 2u);
  EXPECT_CLOSE(n.values_MPa[0], 1.0, 1e-12);   // 1e6 Pa = 1 MPa [D]
  EXPECT_CLOSE(n.values_MPa[1], 45.0, 1e-12);  // 4.5e7 Pa = 45 MPa [D]
}

TEST(NominalPlan, SectionReadsPlaneLimitsInMillimetres) {
  const Plan plan = parse_plan(plan_text("[toe.nominal]\nsource = \"section\"\ncurve = \"IIW FAT 80\"\n"
                                         "point = [0.2, 0, 0]\nnormal = [2, 0, 0]\nregions = [1, 2]\n"
                                         "box = [[0.3, 0.1, 0.1], [0.1, -0.1, -0.1]]\n",
                                         "length_unit = \"m\"\nstress_unit = \"MPa\""),
                               "plan.toml");
  const SectionSpec& s = plan.toes[0].nominal->section;
  EXPECT_EQ(s.name, "nominal section");
  EXPECT_CLOSE(s.point_mm.x(), 200.0, 1e-9);  // 0.2 m [D]
  EXPECT_CLOSE(s.normal.x(), 1.0, 1e-15);     // normalised
  EXPECT_EQ(s.limits.region_array, "part");
  EXPECT_EQ(s.limits.region_values, (std::vector<int>{1, 2}));
  ASSERT_TRUE(s.limits.box.has_value());
  EXPECT_CLOSE(s.limits.box->lo.x(), 100.0, 1e-9);  // corners sorted, in mm [D]
  EXPECT_CLOSE(s.limits.box->hi.x(), 300.0, 1e-9);
  EXPECT_CLOSE(s.limits.box->lo.y(), -100.0, 1e-9);
}

TEST(NominalPlan, WeldGroupLoadsPerStepWithMomentsInModelUnits) {
  const Plan plan = parse_plan(plan_text("[toe.nominal]\nsource = \"weld-group\"\ncurve = \"IIW FAT 80 shear\"\n"
                                         "[toe.nominal.weld_group]\nlayout = \"parallel-pair\"\nleg = 0.006\n"
                                         "width = 0.08\ndepth = 0.1\nmeasure = \"shear\"\nforce_y = [0, 5000]\n"
                                         "torsion = [0, 200]\n",
                                         "length_unit = \"m\"\nstress_unit = \"MPa\""),
                               "plan.toml");
  const WeldGroupPlan& w = *plan.toes[0].nominal->weld_group;
  EXPECT_EQ(w.shape.layout, nominal::WeldLayout::parallel_pair);
  EXPECT_CLOSE(w.shape.leg_mm, 6.0, 1e-12);
  EXPECT_CLOSE(w.shape.depth_mm, 100.0, 1e-12);
  EXPECT_EQ(w.measure, nominal::ThroatMeasure::shear);
  ASSERT_EQ(w.loads.size(), 2u);
  EXPECT_EQ(w.loads[1].shear_y_N, 5000.0);
  EXPECT_CLOSE(w.loads[1].torsion_Nmm, 200000.0, 1e-9);  // 200 N m = 2e5 N mm [D]
  EXPECT_EQ(w.loads[1].shear_x_N, 0.0);                 // absent arrays are zero
}

TEST(NominalPlan, InfiniteLifeTakesTheWeakerMaterialAndDefaults) {
  const Plan plan = parse_plan(plan_text("[toe.nominal]\nsource = \"given\"\ncurve = \"IIW FAT 80\"\n"
                                         "values = [10, 60]\n[toe.nominal.infinite_life]\nparent = \"S355\"\n"
                                         "weld_metal = \"E60xx\"\nweld = \"transverse-fillet-toe\"\n"),
                               "plan.toml");
  const InfiniteLifePlan& p = *plan.toes[0].nominal->infinite_life;
  // S355 t <= 16 mm: R_m 470, R_eH 355 MPa; E60xx 427/345 MPa (nominal/material.hpp): weaker is 427/345 [D].
  EXPECT_EQ(p.input.material.ultimate_MPa, 427.0);
  EXPECT_EQ(p.input.material.yield_MPa, 345.0);
  EXPECT_EQ(p.input.detail, nominal::WeldDetail::transverse_fillet_toe);
  EXPECT_EQ(p.input.criterion, nominal::Criterion::goodman);
  EXPECT_EQ(p.input.marin.load, nominal::LoadKind::axial);  // a normal-stress source: axial by default
  EXPECT_EQ(p.input.marin.surface, nominal::Surface::as_forged);
}

TEST(NominalPlan, PlanMaterialIsFoundByName) {
  const Plan plan = parse_plan("[[material]]\nname = \"rail steel\"\nultimate = 520\nyield = 380\n" +
                                   plan_text("[toe.nominal]\nsource = \"weld-group\"\ncurve = \"IIW FAT 36\"\n"
                                             "[toe.nominal.weld_group]\nlayout = \"single\"\nleg = 5\ndepth = 60\n"
                                             "force_z = [0, 3000]\n[toe.nominal.infinite_life]\n"
                                             "parent = \"rail steel\"\nweld = \"parallel-fillet-end\"\n"
                                             "criterion = \"gerber\"\n"),
                               "plan.toml");
  ASSERT_EQ(plan.materials.size(), 1u);
  const InfiniteLifePlan& p = *plan.toes[0].nominal->infinite_life;
  EXPECT_EQ(p.input.material.ultimate_MPa, 520.0);
  EXPECT_EQ(p.input.criterion, nominal::Criterion::gerber);
  EXPECT_EQ(p.input.marin.load, nominal::LoadKind::torsion_shear);  // weld-group: throat shear by default
}

// ---- bad input, word for word ----

TEST(NominalPlanErrors, UnknownSourceListsTheSpellings) {
  const std::string e = error_text(plan_text("[toe.nominal]\nsource = \"beam\"\ncurve = \"IIW FAT 80\"\n"));
  EXPECT_NE(e.find("plan.toml line 18: toe 'rail' [toe.nominal]: key toe.nominal.source"), std::string::npos) << e;
  EXPECT_NE(e.find("surface-distance"), std::string::npos) << e;
}

TEST(NominalPlanErrors, MissingCurve) {
  EXPECT_EQ(error_text(plan_text("[toe.nominal]\nsource = \"given\"\nvalues = [1, 2]\n")),
            "plan.toml line 17: toe 'rail' [toe.nominal] has no key 'curve'; give the detail class of the "
            "nominal-stress check, e.g. \"IIW FAT 80\"");
}

TEST(NominalPlanErrors, KeyOfAnotherSource) {
  EXPECT_EQ(error_text(plan_text("[toe.nominal]\nsource = \"given\"\ncurve = \"IIW FAT 80\"\nvalues = [1, 2]\n"
                                 "distance = 30\n")),
            "plan.toml line 21: toe 'rail' [toe.nominal]: key toe.nominal.distance applies to source = "
            "\"surface-distance\", not \"given\"");
}

TEST(NominalPlanErrors, WeldGroupOfZeroLength) {
  EXPECT_EQ(error_text(plan_text("[toe.nominal]\nsource = \"weld-group\"\ncurve = \"IIW FAT 36\"\n"
                                 "[toe.nominal.weld_group]\nlayout = \"single\"\nleg = 6\ndepth = 0\n"
                                 "force_y = [0, 1000]\n")),
            "plan.toml line 20: toe 'rail' [toe.nominal.weld_group]: weld group 'rail' (single layout): depth d must "
            "be positive and finite, got 0 mm; give the weld dimensions in mm");
}

TEST(NominalPlanErrors, NegativeMaterialStrength) {
  EXPECT_EQ(error_text("[[material]]\nname = \"soft\"\nultimate = -400\nyield = 250\n" + plan_text("")),
            "plan.toml line 3: material 'soft': key material.ultimate must be greater than 0, not -400");
}

TEST(NominalPlanErrors, MissingYieldStrength) {
  EXPECT_EQ(error_text("[[material]]\nname = \"soft\"\nultimate = 400\n" + plan_text("")),
            "plan.toml line 1: material 'soft' has no key 'yield'; give the yield strength S_y in the plan's stress "
            "unit");
}

TEST(NominalPlanErrors, MarinFactorOutOfRange) {
  EXPECT_EQ(error_text(plan_text("[toe.nominal]\nsource = \"given\"\ncurve = \"IIW FAT 80\"\nvalues = [1, 2]\n"
                                 "[toe.nominal.infinite_life]\nparent = \"ASTM A36\"\nweld = \"reinforced-butt\"\n"
                                 "misc_factor = 1.3\n")),
            "plan.toml line 24: toe 'rail' [toe.nominal.infinite_life]: key toe.nominal.infinite_life.misc_factor "
            "must be greater than 0 and at most 1 (the Marin factor k_f for other reductions), not 1.3");
}

TEST(NominalPlanErrors, UnknownMaterialListsTheKnownOnes) {
  const std::string e = error_text(plan_text("[toe.nominal]\nsource = \"given\"\ncurve = \"IIW FAT 80\"\n"
                                             "values = [1, 2]\n[toe.nominal.infinite_life]\nparent = \"S999\"\n"
                                             "weld = \"reinforced-butt\"\n"));
  EXPECT_EQ(e.rfind("plan.toml line 22: toe 'rail' [toe.nominal.infinite_life]: key toe.nominal.infinite_life.parent "
                    "names no material 'S999'; use one of AISI 1020 HR",
                    0),
            0u)
      << e;
}

TEST(NominalPlanErrors, WeldGroupRefusedForSeries) {
  EXPECT_EQ(error_text(plan_text("[toe.nominal]\nsource = \"weld-group\"\ncurve = \"IIW FAT 36\"\n"
                                 "[toe.nominal.weld_group]\nlayout = \"single\"\nleg = 6\ndepth = 50\n"
                                 "force_y = [0, 1000]\n",
                                 "length_unit = \"mm\"\nstress_unit = \"MPa\"", "[loading]\nkind = \"series\"\n")),
            "plan.toml line 18: toe 'rail' [toe.nominal]: key toe.nominal.source \"weld-group\" works with loading "
            "kinds range and blocks only: the throat-stress magnitude has no sign to count cycles on; give the "
            "nominal stress per load step with source = \"given\" instead");
}

TEST(NominalPlanErrors, GivenRangeNeedsAMeanForTheInfiniteLifeCheck) {
  EXPECT_EQ(error_text(plan_text("[toe.nominal]\nsource = \"given\"\ncurve = \"IIW FAT 80\"\nrange = 40\n"
                                 "[toe.nominal.infinite_life]\nparent = \"ASTM A36\"\nweld = \"reinforced-butt\"\n")),
            "plan.toml line 21: toe 'rail' [toe.nominal.infinite_life] has no key 'mean'; a given range has no mean "
            "stress; give the nominal mean stress in the plan's stress unit");
}

}  // namespace
}  // namespace toehold
