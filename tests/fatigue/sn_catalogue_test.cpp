#include "toehold/common/error.hpp"
#include "toehold/fatigue/sn_catalogue.hpp"
#include "support/support.hpp"

#include <cmath>
#include <functional>
#include <limits>
#include <string>
#include <utility>

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

struct DnvCheck {
  const char* name;
  double log_a1, log_a2, ds_1e7, ds_2e6, k;
};

// DNVGL-RP-C203 2016 Table 2-1, curves in air [S2]; ds at 2e6 [D] (REFERENCE-VALUES.md).
constexpr DnvCheck kDnv[] = {
    {"D", 12.164, 15.606, 52.63, 90.0, 0.20}, {"C", 12.592, 16.320, 73.10, 125.0, 0.05},
    {"C1", 12.449, 16.081, 65.50, 112.0, 0.10}, {"C2", 12.301, 15.835, 58.48, 100.0, 0.15},
    {"E", 12.010, 15.350, 46.78, 80.0, 0.20}, {"F", 11.855, 15.091, 41.52, 71.0, 0.25},
};

}  // namespace

// EN 1993-1-9:2005 Fig. 7.1: ds_D = (2/5)^(1/3) ds_C = 0.7368 ds_C, ds_L = 0.4047 ds_C
// (REFERENCE-VALUES [S via reference pages, D]).
TEST(SnCatalogue, EnKneesAndCutoffFollowTheCategory) {
  for (double cat : en_1993_categories(StressKind::normal)) {
    const SnCurve c = en_1993_detail(cat);
    EXPECT_CLOSE(c.reference_range(), cat, 1e-12);
    EXPECT_CLOSE(c.allowable_range(5e6), 0.7368 * cat, 1e-4);
    ASSERT_TRUE(c.cutoff_range().has_value());
    EXPECT_CLOSE(*c.cutoff_range(), 0.4047 * cat, 1e-4);
    EXPECT_CLOSE(c.knees()[0].cycles, 5e6, 1e-12);
  }
}

// EN 1993-1-9 sec. 7.1: constant amplitude below ds_D does no damage; variable amplitude follows m = 5 down
// to ds_L at 1e8, nothing below (hand calculation [D]).
TEST(SnCatalogue, EnConstantAmplitudeFatigueLimitAndVariableAmplitudeCutoff) {
  const SnCurve c = en_1993_detail(71.0);
  const double ds_d = 71.0 * std::cbrt(0.4);
  const double ds_l = ds_d * std::pow(0.05, 0.2);
  EXPECT_EQ(c.cycles_to_failure(0.99 * ds_d, Amplitude::constant), kInf);
  EXPECT_CLOSE(c.cycles_to_failure(0.99 * ds_d, Amplitude::variable), 5e6 * std::pow(1.0 / 0.99, 5.0), 1e-12);
  EXPECT_CLOSE(c.cycles_to_failure(ds_l, Amplitude::variable), 1e8, 1e-10);
  EXPECT_EQ(c.cycles_to_failure(0.99 * ds_l, Amplitude::variable), kInf);
  EXPECT_CLOSE(c.allowable_range(1e9, Amplitude::constant), ds_d, 1e-12);
  EXPECT_CLOSE(c.allowable_range(1e9, Amplitude::variable), ds_l, 1e-10);
}

// EN 1993-1-9 Fig. 7.2: shear m = 5 to 1e8, ds_L = (2e6/1e8)^(1/5) ds_C = 45.73 MPa for category 100 [D].
TEST(SnCatalogue, EnShearCategories) {
  EXPECT_EQ(en_1993_categories(StressKind::shear), (std::vector<double>{100.0, 80.0}));
  const SnCurve c = en_1993_detail(100.0, StressKind::shear);
  EXPECT_EQ(c.first_slope(), 5.0);
  EXPECT_CLOSE(*c.cutoff_range(), 45.73, 1e-4);
  EXPECT_EQ(c.cycles_to_failure(45.0), kInf);
}

TEST(SnCatalogue, DnvCurvesMatchTable21) {
  for (const DnvCheck& d : kDnv) {
    SCOPED_TRACE(d.name);
    const SnCurve c = dnv_air_curve(d.name);
    ASSERT_EQ(c.segments().size(), 2u);
    EXPECT_EQ(c.segments()[0].log10_a, d.log_a1);
    EXPECT_EQ(c.segments()[0].slope, 3.0);
    EXPECT_EQ(c.segments()[1].log10_a, d.log_a2);
    EXPECT_EQ(c.segments()[1].slope, 5.0);
    EXPECT_CLOSE(c.allowable_range(1e7), d.ds_1e7, 5e-4);
    EXPECT_CLOSE(c.reference_range(), d.ds_2e6, 1e-3);
    ASSERT_TRUE(c.thickness().has_value());
    EXPECT_EQ(c.thickness()->exponent, d.k);
    EXPECT_EQ(c.thickness()->reference_mm, 25.0);
  }
}

// Consistency of the whole table, including the values from memory [M]: the two lines of each curve meet
// at N = 1e7 (DNVGL-RP-C203 2016 Table 2-1 [M]); checked to 1 % [D].
TEST(SnCatalogue, DnvSegmentsMeetAt1e7ForEveryCurve) {
  EXPECT_EQ(dnv_air_curve_names().size(), 14u);
  for (const std::string& name : dnv_air_curve_names()) {
    SCOPED_TRACE(name);
    const SnCurve c = dnv_air_curve(name);
    ASSERT_EQ(c.knees().size(), 1u);
    EXPECT_CLOSE(c.knees()[0].cycles, 1e7, 1e-2);
  }
  EXPECT_EQ(dnv_air_curve("b1").first_slope(), 4.0);
}

// The curves from memory [M] reach the EN 1993-1-9 category values at 2e6 cycles, as the DNV curves are built
// to (DNVGL-RP-C203 2016 Table 2-1 [M]); checked to 0.1 % [D].
TEST(SnCatalogue, DnvCurvesFromMemoryReachTheEnCategoriesAt2e6) {
  const std::pair<const char*, double> rows[] = {{"B1", 160.0}, {"B2", 140.0}, {"F1", 63.0}, {"F3", 56.0},
                                                 {"G", 50.0},   {"W1", 45.0},  {"W2", 40.0}, {"W3", 36.0}};
  for (const auto& [name, ds] : rows) {
    SCOPED_TRACE(name);
    EXPECT_CLOSE(dnv_air_curve(name).reference_range(), ds, 1e-3);
  }
}

TEST(SnCatalogue, ParsesTheNamesUsersType) {
  EXPECT_EQ(parse_sn_curve("IIW FAT 90").name(), "IIW FAT 90 (steel, normal stress)");
  EXPECT_EQ(parse_sn_curve("iiw fat 36 aluminium").name(), "IIW FAT 36 (aluminium, normal stress)");
  EXPECT_EQ(parse_sn_curve("IIW FAT 80 shear").kind(), StressKind::shear);
  EXPECT_CLOSE(parse_sn_curve("IIW FAT 112.5").reference_range(), 112.5, 1e-13);
  EXPECT_EQ(parse_sn_curve("EN 71").name(), "EN 1993-1-9 detail category 71 (normal stress)");
  EXPECT_EQ(parse_sn_curve("EN 1993-1-9 80 shear").kind(), StressKind::shear);
  EXPECT_EQ(parse_sn_curve("DNV C1").name(), "DNV curve C1 (in air)");
  EXPECT_EQ(parse_sn_curve("DNVGL-RP-C203 d air").name(), "DNV curve D (in air)");
  EXPECT_EQ(parse_sn_curve("DNV D").source(),
            "DNVGL-RP-C203 (2016) Table 2-1, curve D in air, k = 0.2, t_ref = 25 mm");
  EXPECT_EQ(parse_sn_curve("DNV W3").source(),
            "DNVGL-RP-C203 (2016) Table 2-1, curve W3 in air, k = 0.25, t_ref = 25 mm; table values from memory");
}

TEST(SnCatalogue, UnknownNamesListWhatIsAccepted) {
  EXPECT_EQ(error_of([] { parse_sn_curve("FAT 90"); }),
            "S-N curve 'FAT 90' is not recognised; use 'IIW FAT <class> [steel|aluminium] [normal|shear]', "
            "'EN 1993-1-9 <category> [normal|shear]' (normal: 160, 140, 125, 112, 100, 90, 80, 71, 63, 56, 50, 45, "
            "40, 36; shear: 100, 80) or 'DNV <curve>' (B1, B2, C, C1, C2, D, E, F, F1, F3, G, W1, W2, W3)");
  EXPECT_EQ(error_of([] { parse_sn_curve("EN 75"); }),
            "EN 1993-1-9 S-N curve: detail category 75 is not a normal stress category; use one of 160, 140, 125, "
            "112, 100, 90, 80, 71, 63, 56, 50, 45, 40, 36");
  EXPECT_EQ(error_of([] { parse_sn_curve("DNV T"); }),
            "DNVGL-RP-C203 S-N curve 'T' is not a curve in air; use one of B1, B2, C, C1, C2, D, E, F, F1, F3, G, "
            "W1, W2, W3");
  EXPECT_NE(error_of([] { parse_sn_curve("IIW FAT 90 titanium"); }), "no error");
  EXPECT_NE(error_of([] { parse_sn_curve(""); }), "no error");
}

}  // namespace toehold
