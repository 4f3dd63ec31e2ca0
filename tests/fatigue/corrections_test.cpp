#include "toehold/common/error.hpp"
#include "toehold/fatigue/corrections.hpp"
#include "toehold/fatigue/sn_catalogue.hpp"
#include "support/support.hpp"

#include <cmath>
#include <functional>
#include <string>

namespace toehold {
namespace {

std::string error_of(const std::function<void()>& fn) {
  try {
    fn();
  } catch (const Error& e) {
    return e.what();
  }
  return "no error";
}

}  // namespace

// IIW 2016 sec. 3.5.2 [M]: f(t) = (25/t_eff)^n; t = 40 mm, n = 0.3 -> 0.8685 (REFERENCE-VALUES [D]).
TEST(Corrections, IiwThicknessFactor40mm) {
  EXPECT_CLOSE(iiw_thickness_factor(40.0, 0.3), 0.8685, 1e-4);
  EXPECT_CLOSE(iiw_thickness_factor(40.0, IiwThicknessCategory::as_welded_transverse), 0.8685, 1e-4);
  EXPECT_EQ(iiw_thickness_factor(25.0, 0.3), 1.0);
  EXPECT_EQ(iiw_thickness_factor(12.0, 0.3), 1.0);
  EXPECT_EQ(iiw_thickness_exponent(IiwThicknessCategory::toe_ground_or_butt), 0.2);
  EXPECT_EQ(iiw_thickness_exponent(IiwThicknessCategory::butt_ground_longitudinal), 0.1);
}

// IIW 2016 sec. 3.5.2 [M]: t_eff = 0.5 L for L/t <= 2, t otherwise; hand values [D].
TEST(Corrections, IiwEffectiveThicknessFromToeDistance) {
  EXPECT_EQ(iiw_effective_thickness(40.0, 60.0), 30.0);
  EXPECT_EQ(iiw_effective_thickness(40.0, 80.0), 40.0);
  EXPECT_EQ(iiw_effective_thickness(40.0, 200.0), 40.0);
}

// DNVGL-RP-C203 2016 sec. 2.4.3 [M]: (t/t_ref)^k; t = 50, t_ref = 25, k = 0.2 -> 2^0.2 = 1.1487 [D].
TEST(Corrections, DnvThicknessFactor) {
  EXPECT_CLOSE(dnv_thickness_factor(50.0, 25.0, 0.2), std::pow(2.0, 0.2), 1e-14);
  EXPECT_CLOSE(dnv_thickness_factor(50.0, 25.0, 0.2), 1.1487, 1e-4);
  EXPECT_EQ(dnv_thickness_factor(20.0, 25.0, 0.2), 1.0);
}

// IIW 2016 sec. 3.5.3 [M] (REFERENCE-VALUES): case I 1.6 / 1.2 - 0.4R / 1.0; case II 1.3 / 0.9 - 0.4R;
// case III 1.0. Case II is held at >= 1.0 (see docs/sn-curves.md).
TEST(Corrections, IiwMeanStressEnhancement) {
  using C = IiwMeanStressCase;
  EXPECT_CLOSE(iiw_mean_stress_factor(-2.0, C::stress_relieved), 1.6, 1e-15);
  EXPECT_CLOSE(iiw_mean_stress_factor(-1.0, C::stress_relieved), 1.6, 1e-15);
  EXPECT_CLOSE(iiw_mean_stress_factor(0.0, C::stress_relieved), 1.2, 1e-15);
  EXPECT_CLOSE(iiw_mean_stress_factor(0.5, C::stress_relieved), 1.0, 1e-15);
  EXPECT_CLOSE(iiw_mean_stress_factor(0.8, C::stress_relieved), 1.0, 1e-15);
  EXPECT_CLOSE(iiw_mean_stress_factor(-3.0, C::small_residual_stress), 1.3, 1e-15);
  EXPECT_CLOSE(iiw_mean_stress_factor(-1.0, C::small_residual_stress), 1.3, 1e-15);
  EXPECT_CLOSE(iiw_mean_stress_factor(-0.5, C::small_residual_stress), 1.1, 1e-15);
  EXPECT_CLOSE(iiw_mean_stress_factor(0.25, C::small_residual_stress), 1.0, 1e-15);
  EXPECT_EQ(iiw_mean_stress_factor(-1.0, C::high_residual_stress), 1.0);
  EXPECT_CLOSE(stress_ratio(-50.0, 100.0), -0.5, 1e-15);
}

// IIW 2016 sec. 3.8.2 [M]: k_m = 1 + 3e/t; e = 1 mm, t = 10 mm -> 1.3 [D].
TEST(Corrections, AxialMisalignment) {
  EXPECT_CLOSE(axial_misalignment_factor(1.0, 10.0), 1.3, 1e-15);
  EXPECT_EQ(axial_misalignment_factor(0.0, 10.0), 1.0);
}

// IIW gamma_M 1.00/1.15/1.15/1.30 and EN 1993-1-9 Table 3.1 gamma_Mf 1.00/1.15/1.15/1.35 (REFERENCE-VALUES [M]).
TEST(Corrections, PartialSafetyFactorTables) {
  using D = FatigueDesignConcept;
  using F = FailureConsequence;
  EXPECT_EQ(iiw_gamma_m(D::fail_safe, F::low), 1.00);
  EXPECT_EQ(iiw_gamma_m(D::fail_safe, F::high), 1.15);
  EXPECT_EQ(iiw_gamma_m(D::safe_life, F::low), 1.15);
  EXPECT_EQ(iiw_gamma_m(D::safe_life, F::high), 1.30);
  EXPECT_EQ(en_gamma_mf(D::safe_life, F::high), 1.35);
  const std::vector<NamedFactor> en = en_gamma_mf_table();
  ASSERT_EQ(en.size(), 4u);
  EXPECT_EQ(en[3].name, "EN 1993-1-9:2005 Table 3.1 gamma_Mf, safe life, high consequence");
  EXPECT_EQ(en[3].value, 1.35);
  EXPECT_EQ(iiw_gamma_m_table()[1].name, "IIW 2016 gamma_M, fail-safe (damage tolerant), high consequence");
  EXPECT_CLOSE((PartialSafetyFactors{1.1, 1.15}).on_stress_range(), 1.265, 1e-15);
}

// Corrections applied to a curve: FAT 90 at t = 40 mm (n = 0.3) becomes 90 x 0.8685 = 78.16 MPa [D].
TEST(Corrections, ThicknessFactorScalesTheCurve) {
  const SnCurve c = iiw_fat(90.0).scaled(iiw_thickness_factor(40.0, 0.3), "t = 40 mm");
  EXPECT_CLOSE(c.reference_range(), 78.16, 1e-4);
}

TEST(Corrections, BadInputsAreErrors) {
  EXPECT_EQ(error_of([] { iiw_thickness_factor(0.0, 0.3); }),
            "IIW thickness factor: effective thickness (mm) 0 must be finite and > 0");
  EXPECT_EQ(error_of([] { iiw_thickness_factor(40.0, -0.1); }),
            "IIW thickness factor: exponent n -0.1 must be finite and >= 0");
  EXPECT_EQ(error_of([] { dnv_thickness_factor(40.0, 0.0, 0.2); }),
            "DNV thickness factor: reference thickness t_ref (mm) 0 must be finite and > 0");
  EXPECT_EQ(error_of([] { axial_misalignment_factor(-1.0, 10.0); }),
            "axial misalignment: offset e (mm) -1 must be finite and >= 0");
  EXPECT_EQ(error_of([] { iiw_mean_stress_factor(std::nan(""), IiwMeanStressCase::stress_relieved); }),
            "IIW mean-stress factor: stress ratio R = nan is not finite; give R = s_min / s_max of a cycle with "
            "s_max != 0");
  EXPECT_EQ(error_of([] { (PartialSafetyFactors{0.0, 1.0}).on_stress_range(); }),
            "partial safety factor gamma_F 0 must be finite and > 0");
  EXPECT_EQ(error_of([] { parse_iiw_mean_stress_case("case4", "plan key fatigue.mean_stress"); }),
            "plan key fatigue.mean_stress: unknown IIW mean-stress case 'case4'; use one of stress_relieved, "
            "small_residual_stress, high_residual_stress");
  EXPECT_EQ(parse_iiw_thickness_category("toe_ground_or_butt", "x"), IiwThicknessCategory::toe_ground_or_butt);
}

}  // namespace toehold
