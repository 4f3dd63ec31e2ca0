#include "toehold/common/error.hpp"
#include "toehold/fatigue/sn_catalogue.hpp"
#include "toehold/fatigue/sn_curve.hpp"
#include "support/support.hpp"

#include <algorithm>
#include <cmath>
#include <functional>
#include <limits>
#include <random>
#include <string>
#include <vector>

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

// The VA segment that holds range ds (MPa): the first whose knee range it is not below (as the curve picks).
const SnSegment& segment_holding(const SnCurve& c, double ds) {
  std::size_t i = 0;
  const std::vector<SnKnee> knees = c.knees();
  while (i < knees.size() && ds < knees[i].range) ++i;
  return c.segments()[i];
}

// N = 10^(log10_a - m log10 ds) in long double (64-bit mantissa): the reference both forms are measured against.
double extended_precision_cycles(const SnSegment& s, double ds) {
  const long double y = static_cast<long double>(s.log10_a) -
                        static_cast<long double>(s.slope) * std::log10(static_cast<long double>(ds));
  return static_cast<double>(std::pow(10.0L, y));
}

// Ranges spread evenly in log10 between 1e-3 and 1e5 MPa (both sides of every knee).
std::vector<double> random_ranges(unsigned seed, std::size_t n) {
  std::mt19937 gen(seed);
  std::uniform_real_distribution<double> exponent(-3.0, 5.0);
  std::vector<double> out(n);
  for (double& ds : out) ds = std::pow(10.0, exponent(gen));
  return out;
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

// cycles_to_failure evaluates whole slopes (3, 5) as a / ds^m by multiplication instead of the plain
// 10^(log10_a - m log10 ds) of SnSegment::cycles_at. On 20,000 random ranges per curve the two agree to
// 1e-14 relative, and where the fast form applies it is within 8e-16 (under 4 ulp) of the extended-precision
// value (derived [D]: a rounded once, at most 7 multiplications and one division, 0.5 ulp each, for m <= 8; the
// plain form loses about ulp(y) ln 10 relative in 10^y, some 10 ulp for y near 15).
TEST(SnCurve, WholeSlopeFormMatchesThePlainLogForm) {
  const std::vector<SnCurve> curves{iiw_fat(90.0), iiw_fat(80.0, SnMaterial::steel, StressKind::shear),
                                    iiw_fat(36.0, SnMaterial::aluminium), en_1993_detail(71.0),
                                    dnv_air_curve("D"), iiw_fat(90.0).scaled(0.8685, "f(t)")};
  for (const SnCurve& c : curves) {
    double worst_fast = 0.0;
    for (double ds : random_ranges(11, 20000)) {
      const double fast = c.cycles_to_failure(ds, Amplitude::variable);
      if (std::isinf(fast)) continue;  // below the cut-off
      const SnSegment& s = segment_holding(c, ds);
      EXPECT_CLOSE(fast, s.cycles_at(ds), 1e-14);
      if (s.slope != std::floor(s.slope) || s.slope > 8.0) continue;  // e.g. shear m = 9 beyond 1e8: plain form
      const double exact = extended_precision_cycles(s, ds);
      worst_fast = std::max(worst_fast, std::abs(fast - exact) / exact);
    }
    EXPECT_LE(worst_fast, 8e-16) << c.name();
  }
}

// Slopes that are not whole numbers, and ranges outside 1e-20..1e20 MPa, keep the plain form bit for bit.
TEST(SnCurve, OtherSlopesAndExtremeRangesUseThePlainForm) {
  const SnCurve odd = user_segment_curve("odd", {SnSegment::through(3.5, 90.0, 2e6)});
  for (double ds : random_ranges(12, 2000)) EXPECT_EQ(odd.cycles_to_failure(ds), odd.segments()[0].cycles_at(ds));
  const SnCurve c = iiw_fat(90.0);
  EXPECT_EQ(c.cycles_to_failure(1e25), c.segments()[0].cycles_at(1e25));
  EXPECT_EQ(c.cycles_to_failure(1e-25), c.segments()[1].cycles_at(1e-25));
  const SnCurve steep = user_segment_curve("steep", {SnSegment::through(9.0, 90.0, 2e6)});
  EXPECT_EQ(steep.cycles_to_failure(50.0), steep.segments()[0].cycles_at(50.0));
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
