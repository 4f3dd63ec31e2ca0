#include "toehold/common/error.hpp"
#include "toehold/common/units.hpp"
#include "support/support.hpp"

namespace toehold {

// 1 in = 25.4 mm exactly and 1 psi = 6894.757293168 Pa (NIST SP 811, appendix B).
TEST(Units, ConversionFactorsMatchNist) {
  EXPECT_CLOSE(mm_per(LengthUnit::in), 25.4, 1e-15);
  EXPECT_CLOSE(mm_per(LengthUnit::m), 1000.0, 1e-15);
  EXPECT_CLOSE(mpa_per(StressUnit::psi), 6.894757293168e-3, 1e-15);
  EXPECT_CLOSE(mpa_per(StressUnit::ksi), 6.894757293168, 1e-15);
  EXPECT_CLOSE(mpa_per(StressUnit::Pa), 1e-6, 1e-15);
}

TEST(Units, UnknownSpellingIsAnErrorThatListsTheChoices) {
  try {
    parse_stress_unit("N/mm2", "plan key model.stress_unit");
    FAIL();
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()),
              "plan key model.stress_unit: unknown stress unit 'N/mm2'; use one of MPa, Pa, psi, ksi");
  }
  EXPECT_EQ(parse_length_unit("in", "x"), LengthUnit::in);
  EXPECT_EQ(to_string(StressUnit::ksi), "ksi");
}

}  // namespace toehold
