#include "toehold/common/error.hpp"
#include "toehold/hotspot/definition.hpp"
#include "support/support.hpp"

#include <Eigen/Geometry>

#include <cmath>
#include <numbers>

namespace toehold {
namespace {

// Toe along x, plate surface normal +z, read-out direction +y.
ToeFrame frame() { return make_toe_frame({1.0, 0.0, 0.0}, {0.0, 0.0, 1.0}, {0.0, 1.0, 0.0}, "test"); }

// Tensor with in-plane components in the frame: s_rr across the toe, s_tt along it, shear s_rt.
Tensor in_plane(const ToeFrame& f, double s_rr, double s_tt, double s_rt) {
  return s_rr * f.readout * f.readout.transpose() + s_tt * f.tangent * f.tangent.transpose() +
         s_rt * (f.readout * f.tangent.transpose() + f.tangent * f.readout.transpose());
}

// Uniaxial stress `sigma` along the in-plane direction at `deg` from readout towards tangent.
Tensor uniaxial_at(const ToeFrame& f, double sigma, double deg) {
  const double a = deg * std::numbers::pi / 180.0;
  const Vec3 d = std::cos(a) * f.readout + std::sin(a) * f.tangent;
  return sigma * d * d.transpose();
}

const DefinitionOptions kDefault{};

}  // namespace

TEST(HotSpotDefinition, PerpendicularIsNormalStressAcrossTheToe) {
  const ToeFrame f = frame();
  const HotSpotValue v = evaluate(HotSpotDefinition::perpendicular, in_plane(f, 120.0, 40.0, 30.0), f, kDefault);
  EXPECT_CLOSE(v.value, 120.0, 1e-13);
  EXPECT_TRUE(v.valid);
}

// Mohr's circle [D]: a uniaxial stress along a direction is the principal stress at that direction. Window +-60 deg
// around the read-out direction (Niemi, Fricke, Maddox 2018 ch. 2 [S]): 30 deg inside, 70 deg outside.
TEST(HotSpotDefinition, PrincipalTakesTheDirectionInsideTheWindow) {
  const ToeFrame f = frame();
  const HotSpotValue inside = evaluate(HotSpotDefinition::principal, uniaxial_at(f, 150.0, 30.0), f, kDefault);
  EXPECT_TRUE(inside.valid);
  EXPECT_CLOSE(inside.value, 150.0, 1e-12);
  EXPECT_CLOSE(inside.angle_deg, 30.0, 1e-9);
  const HotSpotValue outside = evaluate(HotSpotDefinition::principal, uniaxial_at(f, 150.0, 70.0), f, kDefault);
  EXPECT_FALSE(outside.valid);
  EXPECT_EQ(outside.value, 0.0);
  EXPECT_CLOSE(outside.angle_deg, 70.0, 1e-9);
}

// Mohr's circle [D]: pure in-plane shear tau has principal stresses +tau at +45 deg and -tau at -45 deg; both lie
// inside +-60 deg, equal magnitudes, so the tensile one is taken. A +-40 deg window holds neither.
TEST(HotSpotDefinition, PureShearHasPrincipalAt45Degrees) {
  const ToeFrame f = frame();
  const Tensor shear = in_plane(f, 0.0, 0.0, 50.0);
  const HotSpotValue v = evaluate(HotSpotDefinition::principal, shear, f, kDefault);
  EXPECT_TRUE(v.valid);
  EXPECT_CLOSE(v.value, 50.0, 1e-13);
  EXPECT_CLOSE(v.angle_deg, 45.0, 1e-12);
  EXPECT_EQ(v.note, "both in-plane principal stresses lie within +-60 deg of the read-out direction (s1 = 50 MPa at "
                    "45 deg, s2 = -50 MPa at -45 deg); took the one of larger magnitude");
  const HotSpotValue narrow = evaluate(HotSpotDefinition::principal, shear, f, DefinitionOptions{40.0, 0.9});
  EXPECT_FALSE(narrow.valid);
}

// Mohr's circle [D]: uniaxial stress along the toe has s1 = 100 at 90 deg (outside the window) and s2 = 0 at 0 deg
// (inside, but zero): no candidate.
TEST(HotSpotDefinition, UniaxialAlongToeHasNoCandidate) {
  const ToeFrame f = frame();
  const HotSpotValue v = evaluate(HotSpotDefinition::principal, in_plane(f, 0.0, 100.0, 0.0), f, kDefault);
  EXPECT_FALSE(v.valid);
  EXPECT_EQ(v.value, 0.0);
  EXPECT_EQ(v.note, "no nonzero in-plane principal stress lies within +-60 deg of the read-out direction (s1 = 100 "
                    "MPa at 90 deg, s2 = 0 MPa at 0 deg); the stress runs along the toe, which the hot-spot method "
                    "does not cover");
}

TEST(HotSpotDefinition, LargerStressAlongTheToeIsFlagged) {
  const ToeFrame f = frame();
  const HotSpotValue v = evaluate(HotSpotDefinition::principal, in_plane(f, 30.0, 100.0, 0.0), f, kDefault);
  EXPECT_TRUE(v.valid);
  EXPECT_CLOSE(v.value, 30.0, 1e-13);
  EXPECT_EQ(v.note, "the larger principal stress, 100 MPa at 90 deg, lies outside the +-60 deg window (stress along "
                    "the toe); check the weld for loading along it");
}

// DNVGL-RP-C203 2016 sec. 4.3.4, from memory [M]; hand calculation [D]:
// s_perp = 80, tau_par = 40, s_par = 100, alpha = 0.90 (C2):
//   sqrt(80^2 + 0.81 * 40^2) = sqrt(6400 + 1296) = sqrt(7696) = 87.7268
//   centre 90, radius sqrt(10^2 + 40^2) = sqrt(1700) = 41.2311 -> s1 = 131.2311, s2 = 48.7689
//   0.90 * 131.2311 = 118.1080 governs.
TEST(HotSpotDefinition, EffectiveStressPrincipalTermGoverns) {
  const ToeFrame f = frame();
  const HotSpotValue v = evaluate(HotSpotDefinition::effective, in_plane(f, 80.0, 100.0, 40.0), f, kDefault);
  EXPECT_CLOSE(v.value, 0.90 * (90.0 + std::sqrt(1700.0)), 1e-13);
  EXPECT_CLOSE(v.value, 118.1080, 1e-6);
  EXPECT_EQ(v.note, "alpha x |s1| governs (alpha 0.9)");
}

// Same source [M]; hand calculation [D]: s_perp = 100, tau_par = 30, s_par = 0, alpha = 0.72 (C):
//   sqrt(100^2 + 0.81 * 30^2) = sqrt(10000 + 729) = sqrt(10729) = 103.5809
//   centre 50, radius sqrt(50^2 + 30^2) = sqrt(3400) = 58.3095 -> s1 = 108.3095; 0.72 * 108.3095 = 77.98
//   so the perpendicular-and-shear term governs.
TEST(HotSpotDefinition, EffectiveStressShearTermGoverns) {
  const ToeFrame f = frame();
  DefinitionOptions o;
  o.alpha = effective_alpha("C", "x");
  EXPECT_EQ(o.alpha, 0.72);
  const HotSpotValue v = evaluate(HotSpotDefinition::effective, in_plane(f, 100.0, 0.0, 30.0), f, o);
  EXPECT_CLOSE(v.value, std::sqrt(10729.0), 1e-13);
  EXPECT_CLOSE(v.value, 103.5809, 1e-6);
  EXPECT_EQ(v.angle_deg, 0.0);
}

// DNVGL-RP-C203 2016 sec. 4.3.4, from memory [M]: alpha 0.90 / 0.80 / 0.72 for C2 / C1 / C.
TEST(HotSpotDefinition, EffectiveAlphaTable) {
  EXPECT_EQ(effective_alpha("C2", "x"), 0.90);
  EXPECT_EQ(effective_alpha("C1", "x"), 0.80);
  EXPECT_EQ(effective_alpha("C", "x"), 0.72);
  try {
    effective_alpha("D", "plan key hotspot.detail_class");
    FAIL();
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()), "plan key hotspot.detail_class: no effective hot-spot alpha for detail class "
                                     "'D'; use one of C2, C1, C or give alpha itself");
  }
}

// Hand calculation [D]. Step A: s_rr = 100 (principal 100 at 0 deg). Step B: s_rr = 50, s_tt = 50, s_rt = 50
// (centre 50, radius 50: principal 100 at 45 deg, the other 0). Difference of principal values: 100 - 100 = 0.
// Difference tensor B - A: s_rr = -50, s_tt = 50, s_rt = 50: centre 0, radius 50 sqrt 2 = 70.7107;
// s1 = +70.71 at 0.5 atan2(50, -50) = 67.5 deg (outside +-60), s2 = -70.71 at -22.5 deg (inside): range -70.71.
TEST(HotSpotDefinition, RangeFromTensorDifferenceDiffersFromDifferenceOfPrincipals) {
  const ToeFrame f = frame();
  const Tensor a = in_plane(f, 100.0, 0.0, 0.0);
  const Tensor b = in_plane(f, 50.0, 50.0, 50.0);
  const HotSpotRange r = evaluate_range(HotSpotDefinition::principal, a, b, f, kDefault);
  EXPECT_CLOSE(r.step_a.value, 100.0, 1e-13);
  EXPECT_CLOSE(r.step_b.value, 100.0, 1e-13);
  EXPECT_CLOSE(r.step_b.angle_deg, 45.0, 1e-12);
  EXPECT_CLOSE(r.range.value, -50.0 * std::sqrt(2.0), 1e-13);
  EXPECT_CLOSE(r.range.angle_deg, -22.5, 1e-12);
  EXPECT_GT(std::abs(r.range.value - (r.step_b.value - r.step_a.value)), 70.0);
}

TEST(HotSpotDefinition, PerpendicularRangeIsDifferenceOfSteps) {
  const ToeFrame f = frame();
  const HotSpotRange r = evaluate_range(HotSpotDefinition::perpendicular, in_plane(f, -40.0, 10.0, 5.0),
                                        in_plane(f, 110.0, -20.0, 30.0), f, kDefault);
  EXPECT_CLOSE(r.range.value, 150.0, 1e-13);
  EXPECT_CLOSE(r.range.value, r.step_b.value - r.step_a.value, 1e-13);
}

// Property: rotating the model (stress and frame together) and flipping the sense of the tangent change nothing
// but the sign of the reported angle.
TEST(HotSpotDefinition, RotationAndTangentSenseDoNotChangeValues) {
  const ToeFrame f = frame();
  const Tensor s = in_plane(f, 80.0, 100.0, 40.0) + 7.0 * f.normal * f.normal.transpose();
  const Eigen::Matrix3d q =
      Eigen::AngleAxisd(0.7, Vec3(1.0, 2.0, -0.5).normalized()).toRotationMatrix();
  ToeFrame g{q * f.tangent, q * f.normal, q * f.readout};
  ToeFrame flipped{-f.tangent, f.normal, f.readout};
  for (HotSpotDefinition d : {HotSpotDefinition::perpendicular, HotSpotDefinition::principal,
                              HotSpotDefinition::effective}) {
    const HotSpotValue base = evaluate(d, s, f, kDefault);
    const HotSpotValue rotated = evaluate(d, q * s * q.transpose(), g, kDefault);
    const HotSpotValue other_sense = evaluate(d, s, flipped, kDefault);
    EXPECT_CLOSE(rotated.value, base.value, 1e-12);
    EXPECT_CLOSE(rotated.angle_deg, base.angle_deg, 1e-9);
    EXPECT_CLOSE(other_sense.value, base.value, 1e-12);
    EXPECT_CLOSE(other_sense.angle_deg, -base.angle_deg, 1e-9);
  }
}

TEST(HotSpotDefinition, BadOptionsAndInputsAreErrors) {
  const ToeFrame f = frame();
  const Tensor s = in_plane(f, 1.0, 0.0, 0.0);
  try {
    evaluate(HotSpotDefinition::principal, s, f, DefinitionOptions{95.0, 0.9});
    FAIL();
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()), "hot-spot definition 'principal': window 95 deg is outside (0, 90]; give the "
                                     "half-width of the window around the read-out direction in degrees");
  }
  try {
    evaluate(HotSpotDefinition::effective, s, f, DefinitionOptions{60.0, 1.5});
    FAIL();
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()), "hot-spot definition 'effective': alpha 1.5 is outside (0, 1]; use 0.90, 0.80 "
                                     "or 0.72 (detail class C2, C1, C) or your own value");
  }
  Tensor bad = s;
  bad(0, 0) = std::nan("");
  EXPECT_THROW(evaluate(HotSpotDefinition::perpendicular, bad, f, kDefault), Error);
  ToeFrame skew = f;
  skew.readout = Vec3(1.0, 1.0, 0.0).normalized();
  EXPECT_THROW(evaluate(HotSpotDefinition::perpendicular, s, skew, kDefault), Error);
}

TEST(HotSpotDefinition, NamesRoundTripThroughOneTable) {
  for (HotSpotDefinition d : {HotSpotDefinition::perpendicular, HotSpotDefinition::principal,
                              HotSpotDefinition::effective})
    EXPECT_EQ(parse_hot_spot_definition(to_string(d), "x"), d);
  try {
    parse_hot_spot_definition("max-principal", "plan key hotspot.definition");
    FAIL();
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()), "plan key hotspot.definition: unknown hot-spot definition 'max-principal'; use "
                                     "one of perpendicular, principal, effective");
  }
}

}  // namespace toehold
