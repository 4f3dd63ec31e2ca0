#include "toehold/common/error.hpp"
#include "toehold/fatigue/sn_catalogue.hpp"
#include "toehold/fatigue/sn_curve.hpp"
#include "support/support.hpp"

#include <cmath>
#include <functional>
#include <limits>
#include <string>

namespace toehold {
namespace {

constexpr double kInf = std::numeric_limits<double>::infinity();

std::string error_of(const std::function<void()>& fn) {
  try {
    fn();
  } catch (const Error& e) {
    return e.what();
  }
  return "no error";
}

}  // namespace

// IIW 2016 sec. 3.7 [M]: N = 2e6 (FAT/ds)^3; at 1e7: ds = FAT (2e6/1e7)^(1/3) = 0.5848 FAT [D].
TEST(SnCurve, IiwFat90AndFat100AtTheKnee) {
  EXPECT_CLOSE(iiw_fat(90.0).allowable_range(1e7), 52.63, 1e-4);   // REFERENCE-VALUES [D]
  EXPECT_CLOSE(iiw_fat(100.0).allowable_range(1e7), 58.48, 1e-4);  // REFERENCE-VALUES [D]
  EXPECT_CLOSE(iiw_fat(90.0).reference_range(), 90.0, 1e-12);
}

// FAT 90 at ds = 100 MPa: N = 2e6 (90/100)^3 = 1.458e6 (REFERENCE-VALUES [D]).
TEST(SnCurve, IiwFat90CyclesAt100MPa) {
  EXPECT_CLOSE(iiw_fat(90.0).cycles_to_failure(100.0), 1.458e6, 1e-12);
  EXPECT_CLOSE(iiw_fat(90.0).cycles_to_failure(100.0, Amplitude::constant), 1.458e6, 1e-12);
}

// Beyond the knee: VA m2 = 5 (IIW 2016 [M]), CA m = 22 (IIW 2008 p. 43 [S], 2016 [M]); hand calculation [D].
TEST(SnCurve, IiwBeyondKneeUsesSlope5ForVariableAndSlope22ForConstantAmplitude) {
  const SnCurve c = iiw_fat(90.0);
  const double ds_k = 90.0 * std::cbrt(2e6 / 1e7);
  EXPECT_CLOSE(c.cycles_to_failure(40.0, Amplitude::variable), 1e7 * std::pow(ds_k / 40.0, 5.0), 1e-12);
  EXPECT_CLOSE(c.cycles_to_failure(40.0, Amplitude::constant), 1e7 * std::pow(ds_k / 40.0, 22.0), 1e-12);
  EXPECT_CLOSE(c.allowable_range(1e9, Amplitude::variable), ds_k * std::pow(1e7 / 1e9, 1.0 / 5.0), 1e-12);
  EXPECT_CLOSE(c.allowable_range(1e9, Amplitude::constant), ds_k * std::pow(1e7 / 1e9, 1.0 / 22.0), 1e-12);
  ASSERT_EQ(c.knees().size(), 1u);
  EXPECT_CLOSE(c.knees()[0].cycles, 1e7, 1e-12);
  EXPECT_CLOSE(c.knees()[0].range, ds_k, 1e-12);
  ASSERT_TRUE(c.constant_amplitude_knee().has_value());
  EXPECT_CLOSE(c.constant_amplitude_knee()->cycles, 1e7, 1e-12);
  EXPECT_EQ(*c.constant_amplitude_slope(), 22.0);
  EXPECT_FALSE(c.cutoff_range().has_value());
}

// IIW shear: m = 5 to the knee at 1e8 (IIW 2016 [M]); 1e8 is reached at FAT (2e6/1e8)^(1/5) [D].
TEST(SnCurve, IiwShearKneeAt1e8) {
  const SnCurve c = iiw_fat(80.0, SnMaterial::steel, StressKind::shear);
  EXPECT_EQ(c.kind(), StressKind::shear);
  EXPECT_EQ(c.first_slope(), 5.0);
  EXPECT_CLOSE(c.knees()[0].cycles, 1e8, 1e-12);
  EXPECT_CLOSE(c.allowable_range(1e8), 80.0 * std::pow(0.02, 0.2), 1e-12);
  EXPECT_CLOSE(c.cycles_to_failure(100.0), 2e6 * std::pow(0.8, 5.0), 1e-12);
}

TEST(SnCurve, CarriesNameSourceAndEdition) {
  const SnCurve c = iiw_fat(90.0);
  EXPECT_EQ(c.name(), "IIW FAT 90 (steel, normal stress)");
  EXPECT_EQ(c.source(), "IIW 2016 (IIW-2259-15) sec. 3.7, FAT 90, steel, normal stress");
  EXPECT_EQ(c.edition(), "IIW 2016 (IIW-2259-15)");
  EXPECT_EQ(iiw_fat(36.0, SnMaterial::aluminium).name(), "IIW FAT 36 (aluminium, normal stress)");
}

TEST(SnCurve, ZeroRangeAndCutoffGiveInfiniteLife) {
  EXPECT_EQ(iiw_fat(90.0).cycles_to_failure(0.0), kInf);
  const SnCurve c = user_segment_curve("cut", {SnSegment::through(3.0, 100.0, 2e6)}, 30.0);
  EXPECT_EQ(c.cycles_to_failure(29.9), kInf);
  EXPECT_CLOSE(c.cycles_to_failure(30.0), 2e6 * std::pow(100.0 / 30.0, 3.0), 1e-12);
  EXPECT_EQ(c.allowable_range(1e12), 30.0);
  EXPECT_EQ(c.allowable_range(kInf), 30.0);
}

// User curve from FAT + slopes + knees equals the IIW curve built the same way [D].
TEST(SnCurve, UserFatCurveMatchesIiwConstruction) {
  const SnCurve user = user_fat_curve({"mine", 90.0, {3.0, 5.0}, {1e7}, 0.0, std::nullopt, StressKind::normal});
  const SnCurve iiw = iiw_fat(90.0);
  for (double ds : {200.0, 90.0, 52.0, 20.0}) EXPECT_CLOSE(user.cycles_to_failure(ds), iiw.cycles_to_failure(ds), 1e-12);
  EXPECT_EQ(user.source(), "user-defined: FAT 90, m = 3, 5, knees at N = 1e+07");
}

// Segments given as slope + log10 intercept: N = 10^(log a) ds^-m [D].
TEST(SnCurve, SegmentFromInterceptAndFromPointAgree) {
  const SnSegment a = SnSegment::with_intercept(3.0, 12.164);
  const SnSegment b = SnSegment::through(3.0, a.range_at(1e6), 1e6);
  EXPECT_CLOSE(b.log10_a, 12.164, 1e-12);
  EXPECT_CLOSE(a.cycles_at(100.0), std::pow(10.0, 12.164 - 6.0), 1e-12);
}

// Scaling the resistance by f multiplies every range; N at f ds equals N at ds before [D].
TEST(SnCurve, ScaledCurveMultipliesRanges) {
  const SnCurve c = iiw_fat(90.0);
  const SnCurve s = c.scaled(0.8685, "f(t) = 0.8685");
  EXPECT_CLOSE(s.reference_range(), 90.0 * 0.8685, 1e-12);
  EXPECT_CLOSE(s.cycles_to_failure(40.0 * 0.8685, Amplitude::constant), c.cycles_to_failure(40.0, Amplitude::constant), 1e-10);
  EXPECT_CLOSE(s.knees()[0].cycles, 1e7, 1e-10);
  EXPECT_EQ(s.name(), "IIW FAT 90 (steel, normal stress), f(t) = 0.8685");
}

TEST(SnCurve, CurveWithNoSegmentsIsAnError) {
  SnCurveSpec spec;
  spec.name = "empty";
  EXPECT_EQ(error_of([&] { SnCurve c(spec); }),
            "S-N curve 'empty': no segments; give at least one segment (slope m and a point or log10 intercept)");
}

TEST(SnCurve, BadSegmentsAreErrors) {
  EXPECT_EQ(error_of([] { user_segment_curve("neg", {SnSegment::with_intercept(-3.0, 12.0)}); }),
            "S-N curve 'neg': segment 1 has slope m = -3; the slope must be a finite number > 0");
  EXPECT_EQ(error_of([] {
              user_segment_curve("same", {SnSegment::with_intercept(3.0, 12.0), SnSegment::with_intercept(3.0, 13.0)});
            }),
            "S-N curve 'same': segments 1 and 2 have the same slope 3 and never meet; merge them or change a slope");
  EXPECT_EQ(error_of([] { user_fat_curve({"two", 90.0, {3.0, 5.0}, {}, 0.0, std::nullopt, StressKind::normal}); }),
            "user S-N curve 'two': 2 slopes need 1 knee(s), got 0");
}

TEST(SnCurve, NonFiniteOrNegativeRangeIsAnError) {
  const SnCurve c = iiw_fat(90.0);
  EXPECT_EQ(error_of([&] { c.cycles_to_failure(std::nan("")); }),
            "S-N curve 'IIW FAT 90 (steel, normal stress)': stress range nan MPa is not finite; check the stress "
            "history");
  EXPECT_EQ(error_of([&] { c.cycles_to_failure(-5.0); }),
            "S-N curve 'IIW FAT 90 (steel, normal stress)': stress range -5 MPa is negative; give the range "
            "(maximum - minimum) as a positive number");
  EXPECT_EQ(error_of([&] { c.allowable_range(0.0); }),
            "S-N curve 'IIW FAT 90 (steel, normal stress)': number of cycles 0 must be > 0");
  EXPECT_EQ(error_of([] { iiw_fat(-90.0); }), "IIW S-N curve: FAT -90 MPa must be finite and > 0");
}

}  // namespace toehold
