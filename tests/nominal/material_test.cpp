#include "toehold/common/error.hpp"
#include "toehold/nominal/material.hpp"
#include "support/support.hpp"

#include <limits>

namespace toehold::nominal {
namespace {

template <class F>
std::string error_of(F&& f) {
  try {
    f();
  } catch (const Error& e) {
    return e.what();
  }
  return "no error";
}

}  // namespace

// Budynas and Nisbett 9th ed., SAE/ASTM values as tabulated in the textbook [S]: 1020 HR 380/210,
// 1030 HR 470/260, 1045 HR 570/310 MPa. ASTM A36 F_y 250, F_u 400-550 MPa [S].
TEST(Material, TextbookSteelsAndA36) {
  EXPECT_CLOSE(find_material("AISI 1020 HR").ultimate_MPa, 380, 1e-12);
  EXPECT_CLOSE(find_material("AISI 1020 HR").yield_MPa, 210, 1e-12);
  EXPECT_CLOSE(find_material("AISI 1030 HR").ultimate_MPa, 470, 1e-12);
  EXPECT_CLOSE(find_material("AISI 1030 HR").yield_MPa, 260, 1e-12);
  EXPECT_CLOSE(find_material("AISI 1045 HR").ultimate_MPa, 570, 1e-12);
  EXPECT_CLOSE(find_material("AISI 1045 HR").yield_MPa, 310, 1e-12);
  EXPECT_CLOSE(find_material("ASTM A36").yield_MPa, 250, 1e-12);
  EXPECT_CLOSE(find_material("ASTM A36").ultimate_MPa, 400, 1e-12);
}

// EN 10025-2 S355: R_eH 355 (t <= 16), 345 (16-40 mm) [S]; 335 for 40-63 mm from memory [M]; R_m >= 470 [S].
TEST(Material, S355PicksTheThicknessBand) {
  EXPECT_CLOSE(s355(10).yield_MPa, 355, 1e-12);
  EXPECT_CLOSE(s355(16).yield_MPa, 355, 1e-12);
  EXPECT_CLOSE(s355(16.5).yield_MPa, 345, 1e-12);
  EXPECT_CLOSE(s355(40).yield_MPa, 345, 1e-12);
  EXPECT_CLOSE(s355(50).yield_MPa, 335, 1e-12);
  EXPECT_CLOSE(s355(25).ultimate_MPa, 470, 1e-12);
  EXPECT_EQ(error_of([] { s355(120); }),
            "S355 plate thickness 120 mm is outside the table (0 < t <= 100 mm); define the material with its "
            "strengths");
}

// AWS electrode minimums as in the textbook's Table 9-3, from memory [M]: E60xx 427/345, E70xx 482/393 MPa.
TEST(Material, ElectrodeMinimums) {
  EXPECT_CLOSE(find_material("E60xx").ultimate_MPa, 427, 1e-12);
  EXPECT_CLOSE(find_material("E60xx").yield_MPa, 345, 1e-12);
  EXPECT_CLOSE(find_material("E70xx").ultimate_MPa, 482, 1e-12);
  EXPECT_CLOSE(find_material("E70xx").yield_MPa, 393, 1e-12);
}

// Common practice, no source: each strength is the smaller of parent and weld metal.
TEST(Material, WeakerOfParentAndWeldMetalTakesEachStrengthOnItsOwn) {
  const Material parent = user_material("plate", 500, 380);
  const Material weld = find_material("E60xx");  // 427 / 345
  const Material m = weaker_of(parent, weld);
  EXPECT_CLOSE(m.ultimate_MPa, 427, 1e-12);
  EXPECT_CLOSE(m.yield_MPa, 345, 1e-12);
  EXPECT_EQ(m.name, "weaker of plate and E60xx");
  const Material soft = weaker_of(find_material("AISI 1020 HR"), weld);
  EXPECT_CLOSE(soft.ultimate_MPa, 380, 1e-12);
  EXPECT_CLOSE(soft.yield_MPa, 210, 1e-12);
  EXPECT_EQ(soft.source,
            "ultimate from AISI 1020 HR, yield from AISI 1020 HR (weaker of parent and weld metal: common "
            "practice, no source)");
}

TEST(Material, BadStrengthsAreErrorsNamingTheMaterial) {
  const double nan = std::numeric_limits<double>::quiet_NaN();
  EXPECT_EQ(error_of([&] { user_material("frame steel", nan, 200); }),
            "material 'frame steel': ultimate strength is missing; give it in MPa");
  EXPECT_EQ(error_of([] { user_material("frame steel", 400, -5); }),
            "material 'frame steel': yield strength must be positive, got -5 MPa");
  EXPECT_EQ(error_of([] { user_material("frame steel", 300, 350); }),
            "material 'frame steel': yield strength 350 MPa exceeds ultimate strength 300 MPa; check the two values");
  const Material missing{"weld metal", 480, nan, "user"};
  EXPECT_EQ(error_of([&] { weaker_of(find_material("ASTM A36"), missing); }),
            "material 'weld metal': yield strength is missing; give it in MPa");
}

TEST(Material, UnknownNameListsTheTable) {
  const std::string message = error_of([] { find_material("S275"); });
  EXPECT_EQ(message.rfind("unknown material 'S275'; use one of AISI 1020 HR, AISI 1030 HR, ", 0), 0u) << message;
  EXPECT_NE(message.find("E120xx, or define the material with its strengths"), std::string::npos) << message;
}

}  // namespace toehold::nominal
