// Plans toehold must reject: each error names the plan file, the line and the full key, word for word.
#include <initializer_list>
#include <map>
#include <string>
#include <vector>

#include "support/support.hpp"
#include "toehold/common/error.hpp"
#include "toehold/plan/plan.hpp"

namespace toehold {
namespace {

bool starts_with(const std::string& text, const std::string& head) { return text.rfind(head, 0) == 0; }

// A valid plan, one entry per line, so that a test can change line n (1-based) and know every line number.
const std::vector<std::string> kBase{
    "[model]",                  // 1
    "file = \"m.vtu\"",         // 2
    "length_unit = \"mm\"",     // 3
    "stress_unit = \"MPa\"",    // 4
    "stress = \"stress\"",      // 5
    "[[step]]",                 // 6
    "name = \"a\"",             // 7
    "[[step]]",                 // 8
    "name = \"b\"",             // 9
    "[[toe]]",                  // 10
    "name = \"north\"",         // 11
    "marker_array = \"toe\"",   // 12
    "marker_value = 1",         // 13
    "weld_point = [0, 0, 1]",   // 14
    "thickness = 12",           // 15
    "curve = \"IIW FAT 100\"",  // 16
    "[requirement]",            // 17
    "cycles = 2e6",             // 18
};

// kBase with line n replaced by `text` ("" drops the line's content but keeps the numbering; text may hold
// several lines, which shifts only the lines after n).
std::string edited(std::initializer_list<std::pair<int, std::string>> changes, const std::string& tail = "") {
  std::map<int, std::string> by_line(changes.begin(), changes.end());
  std::string out;
  for (std::size_t i = 0; i < kBase.size(); ++i) {
    const auto it = by_line.find(static_cast<int>(i) + 1);
    out += (it != by_line.end() ? it->second : kBase[i]) + "\n";
  }
  return out + tail;
}

// The message of the Error the plan raises, or "no error".
std::string error_of(const std::string& text) {
  try {
    parse_plan(text, "plan.toml");
  } catch (const Error& e) {
    return e.what();
  }
  return "no error";
}

TEST(PlanErrors, BasePlanIsValid) { EXPECT_EQ(error_of(edited({})), "no error"); }

TEST(PlanErrors, UnknownKeyListsTheKnownOnes) {
  EXPECT_EQ(error_of(edited({{15, "thicknes = 12"}})),
            "plan.toml line 15: toe 'north': unknown key 'thicknes'; known keys: name, marker_array, marker_value, "
            "points, closed, report_stations, nominal, plate_point, weld_regions, weld_point, thickness, spacing, "
            "hot_spot_type, scheme, distances, factor, definition, detail_class, curve, thickness_exponent, "
            "mean_stress, misalignment_km, misalignment_offset, plate_region, layer, origin, weld_leg, kink_limit, through_thickness, "
            "through_thickness_points, through_thickness_rule");
  EXPECT_EQ(error_of(edited({{5, "stres = \"stress\""}})),
            "plan.toml line 5: [model]: unknown key 'stres'; known keys: file, length_unit, stress_unit, stress, "
            "stress_components, order, region_array, shell, thickness, thickness_array, stress_top, "
            "stress_top_components, stress_bottom, stress_bottom_components, stress_membrane, "
            "stress_membrane_components, stress_bending, stress_bending_components");
  EXPECT_EQ(error_of("titel = \"x\"\n" + edited({})),
            "plan.toml line 1: unknown top-level key 'titel'; known keys: title, model, step, loading, block, curve, "
            "material, toe_defaults, toe, requirement, output");
}

TEST(PlanErrors, WrongTypeNamesKeyAndBothTypes) {
  EXPECT_EQ(error_of(edited({{3, "length_unit = 1"}})),
            "plan.toml line 3: key model.length_unit must be a string, not an integer");
  EXPECT_EQ(error_of(edited({{15, "thickness = \"12\""}})),
            "plan.toml line 15: toe 'north': key toe.thickness must be a number, not a string");
  EXPECT_EQ(error_of(edited({{13, "marker_value = 1.0"}})),
            "plan.toml line 13: toe 'north': key toe.marker_value must be an integer, not a float");
  EXPECT_EQ(error_of(edited({{13, "marker_value = 3000000000"}})),
            "plan.toml line 13: toe 'north': key toe.marker_value must be between -2147483648 and 2147483647, not "
            "3000000000");
  EXPECT_EQ(error_of("step = 3\n" + edited({{6, ""}, {7, ""}, {8, ""}, {9, ""}})),
            "plan.toml line 1: key step must be an array of tables ([[step]]), not an integer");
}

TEST(PlanErrors, MissingRequiredKeySaysWhatToGive) {
  EXPECT_EQ(error_of(edited({{3, ""}})),
            "plan.toml line 1: [model] has no key 'length_unit'; declare the model's length unit (mm, m or in)");
  EXPECT_EQ(
      error_of(edited({{4, ""}})),
      "plan.toml line 1: [model] has no key 'stress_unit'; declare the model's stress unit (MPa, Pa, psi or ksi)");
  EXPECT_EQ(error_of(edited({{15, ""}})),
            "plan.toml line 10: toe 'north' has no key 'thickness'; give the plate thickness t (> 0) in the model "
            "length unit, here or in [toe_defaults]");
  EXPECT_EQ(error_of(edited({{17, ""}, {18, ""}})),
            "plan.toml: [requirement] has no key 'cycles'; loading kind \"range\" needs the required number of cycles "
            "(> 0)");
  EXPECT_EQ(error_of(edited({{1, ""}, {2, ""}, {3, ""}, {4, ""}, {5, ""}})),
            "plan.toml: the plan has no [model] table; add one with file, length_unit and stress_unit");
}

TEST(PlanErrors, UnknownUnitListsTheUnits) {
  EXPECT_EQ(error_of(edited({{3, "length_unit = \"cm\""}})),
            "plan.toml line 3: key model.length_unit: unknown length unit 'cm'; use one of mm, m, in");
}

TEST(PlanErrors, MissingFileAndSyntaxErrors) {
  test::TempDir dir;
  const std::string path = dir.file("x.toml");
  try {
    read_plan(path);
    FAIL() << "no error";
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()), "cannot read plan '" + path + "': no such file");
  }
  // toml++ writes the description; toehold adds the file, line and column.
  const std::string unterminated = error_of(edited({{2, "file = \"m.vtu"}}));
  EXPECT_TRUE(starts_with(unterminated, "plan.toml line 2 column ")) << unterminated;
  EXPECT_NE(unterminated.find(": not valid TOML: "), std::string::npos) << unterminated;
  const std::string twice = error_of(edited({{5, "stress = \"s\"\nstress = \"t\""}}));
  EXPECT_TRUE(starts_with(twice, "plan.toml line 6 column ")) << twice;
}

TEST(PlanErrors, ToeNeedsExactlyOneLocation) {
  EXPECT_EQ(error_of(edited({{14, "weld_point = [0, 0, 1]\npoints = [[0, 0, 0], [1, 0, 0]]"}})),
            "plan.toml line 10: toe 'north': give either marker_array with marker_value, or points, not both");
  EXPECT_EQ(error_of(edited({{12, ""}, {13, ""}})),
            "plan.toml line 10: toe 'north' has no location; give marker_array and marker_value (the toe nodes marked "
            "in a point-data array), or points (coordinates along the toe)");
  EXPECT_EQ(error_of(edited({{13, ""}})),
            "plan.toml line 10: toe 'north' has no key 'marker_value'; give the integer value that marks this toe's "
            "nodes in 'toe'");
}

TEST(PlanErrors, PointsMustBeThreeNumbers) {
  EXPECT_EQ(error_of(edited({{14, "weld_point = [0, 1]"}})),
            "plan.toml line 14: toe 'north': key toe.weld_point must be a point [x, y, z] of 3 numbers, not an array "
            "of 2");
  EXPECT_EQ(error_of(edited({{12, "points = [[0, 0, 0],"}, {13, "  [1, \"y\", 0]]"}})),
            "plan.toml line 13: toe 'north': key toe.points: point 2, coordinate 2 must be a finite number, not a "
            "string");
  EXPECT_EQ(error_of(edited({{12, "points = [[0, 0, 0]]"}, {13, ""}})),
            "plan.toml line 12: toe 'north': key toe.points must list at least 2 points along the toe, not 1");
}

TEST(PlanErrors, DuplicateNames) {
  EXPECT_EQ(error_of(edited({}, "[[toe]]\nname = \"north\"\n")),
            "plan.toml line 19: toe 'north' is defined twice (first at line 10); give each toe its own name");
  EXPECT_EQ(error_of(edited({{9, "name = \"a\""}})),
            "plan.toml line 8: step 'a' is defined twice (first at line 6); give each step its own name");
}

TEST(PlanErrors, ThicknessMustBePositive) {
  EXPECT_EQ(error_of(edited({{15, "thickness = -2"}})),
            "plan.toml line 15: toe 'north': key toe.thickness must be greater than 0, not -2");
  EXPECT_EQ(error_of(edited({{15, "thickness = 0"}})),
            "plan.toml line 15: toe 'north': key toe.thickness must be greater than 0, not 0");
}

TEST(PlanErrors, WeldSide) {
  EXPECT_EQ(error_of(edited({{14, "weld_regions = [3]"}})),
            "plan.toml line 14: toe 'north': key toe.weld_regions needs model.region_array, the cell-data array that "
            "holds the region values; add it to [model]");
  EXPECT_EQ(error_of(edited({{14, ""}})),
            "plan.toml line 10: toe 'north' has no weld side; give weld_regions (region values of the weld cells, "
            "with model.region_array) or weld_point (a point inside the weld or the attached part)");
}

TEST(PlanErrors, UserSchemeNeedsDistances) {
  EXPECT_EQ(error_of(edited({{16, "curve = \"IIW FAT 100\"\nscheme = \"user\""}})),
            "plan.toml line 10: toe 'north' has no key 'distances'; scheme = \"user\" needs its read-out distances "
            "from the toe, in the model length unit");
  EXPECT_EQ(error_of(edited({{16, "curve = \"IIW FAT 100\"\ndistances = [4, 10]"}})),
            "plan.toml line 17: toe 'north': key toe.distances applies to scheme = \"user\" only");
}

TEST(PlanErrors, SchemeMustExistForTheHotSpotType) {
  // The reason after "key toe.scheme: " is the read-out layer's own message.
  const std::string e =
      error_of(edited({{16, "curve = \"IIW FAT 100\"\nhot_spot_type = \"b\"\nscheme = \"fine-linear\""}}));
  EXPECT_TRUE(starts_with(e, "plan.toml line 18: toe 'north': key toe.scheme: read-out scheme 'fine-linear'")) << e;
}

TEST(PlanErrors, RangeNeedsTwoSteps) {
  EXPECT_EQ(error_of(edited({{8, ""}, {9, ""}})),
            "plan.toml line 6: loading kind \"range\" (the default) needs at least 2 [[step]] tables (a range is "
            "taken between two steps); the plan has 1");
  EXPECT_EQ(error_of(edited({{8, "[loading]"}, {9, "kind = \"range\""}})),
            "plan.toml line 9: key loading.kind = \"range\" needs at least 2 [[step]] tables (a range is taken "
            "between two steps); the plan has 1");
}

TEST(PlanErrors, UnitCasesNeedAHistory) {
  EXPECT_EQ(error_of(edited({{17, "[loading]\nkind = \"unit-cases\""}, {18, ""}})),
            "plan.toml line 17: [loading] has no key 'history'; kind = \"unit-cases\" needs a CSV file with one "
            "column per step name");
}

TEST(PlanErrors, KeysOfAnotherLoadingKindAreRejected) {
  EXPECT_EQ(error_of(edited({}, "damage_limit = 0.5\n")),
            "plan.toml line 19: key requirement.damage_limit does not apply to loading kind \"range\"");
  EXPECT_EQ(error_of(edited({}, "[loading]\ncounting = \"repeating\"\n")),
            "plan.toml line 20: key loading.counting applies to kind = \"series\", \"unit-cases\" and \"blocks\", not \"range\"");
}

TEST(PlanErrors, PvdStepOnlyForPvdFiles) {
  EXPECT_EQ(error_of(edited({{7, "name = \"a\"\npvd_step = 2"}})),
            "plan.toml line 8: step 'a': key step.pvd_step applies to .pvd series and CalculiX .frd results only; 'm.vtu' is neither");
  EXPECT_EQ(error_of(edited({{2, "file = \"m.pvd\""}, {7, "name = \"a\"\npvd_step = -1"}})),
            "plan.toml line 8: step 'a': key step.pvd_step must be 0 or more (the first time step is 0), not -1");
}

TEST(PlanErrors, ToeDefaultsCannotSayWhereAToeIs) {
  EXPECT_EQ(error_of(edited({{9, "name = \"b\"\n[toe_defaults]\nmarker_array = \"toe\""}})),
            "plan.toml line 11: key toe_defaults.marker_array cannot have a default; give it in each [[toe]]");
  EXPECT_EQ(error_of(edited({{9, "name = \"b\"\n[toe_defaults]\nthickness = -1"}, {15, ""}})),
            "plan.toml line 11: toe 'north': key toe_defaults.thickness must be greater than 0, not -1");
}

TEST(PlanErrors, StressArraysAreEitherOneOrSix) {
  EXPECT_EQ(error_of(edited({{5, "stress = \"s\"\nstress_components = [\"a\", \"b\", \"c\", \"d\", \"e\", \"f\"]"}})),
            "plan.toml line 6: key model.stress_components cannot be given together with stress; give one of them");
  EXPECT_EQ(error_of(edited({{5, "stress_components = [\"a\", \"b\", \"c\"]"}})),
            "plan.toml line 5: key model.stress_components must name 6 scalar arrays (xx, yy, zz, xy, yz, xz), not 3");
  EXPECT_EQ(error_of(edited({{5, ""}})),
            "plan.toml line 6: step 'a' has no stress array; give stress or stress_components in the step or in "
            "[model]");
}

// IIW 2016 sec. 3.8.2 [M]: k_m = 1 + 3 e / t; e = 1.2 mm at t = 12 mm gives 1.3 (derived [D]).
TEST(PlanErrors, MisalignmentIsAFactorOrAnOffset) {
  EXPECT_EQ(parse_plan(edited({{16, "curve = \"IIW FAT 100\"\nmisalignment_offset = 1.2"}}), "plan.toml")
                .toes[0]
                .misalignment_km,
            1.0 + 3.0 * 1.2 / 12.0);
  EXPECT_EQ(error_of(edited({{16, "curve = \"IIW FAT 100\"\nmisalignment_km = 0.9"}})),
            "plan.toml line 17: toe 'north': key toe.misalignment_km must be 1 or more (1 = no misalignment), not 0.9");
  EXPECT_EQ(error_of(edited({{16, "curve = \"IIW FAT 100\"\nmisalignment_km = 1.2\nmisalignment_offset = 1"}})),
            "plan.toml line 18: toe 'north': key toe.misalignment_offset cannot be given together with "
            "misalignment_km; give one of the two");
}

TEST(PlanErrors, AnUnloadedStepReadsNothing) {
  const Plan plan = parse_plan(edited({{9, "name = \"rest\"\nunloaded = true"}}), "plan.toml");
  ASSERT_EQ(plan.steps.size(), 2u);
  EXPECT_TRUE(plan.steps[1].unloaded);
  EXPECT_FALSE(plan.steps[0].unloaded);
  EXPECT_EQ(error_of(edited({{9, "name = \"rest\"\nunloaded = true\nstress = \"s\""}})),
            "plan.toml line 11: step 'rest': key step.stress does not apply to an unloaded step (zero stress "
            "everywhere, nothing is read)");
}

}  // namespace
}  // namespace toehold
