#include "toehold/common/error.hpp"
#include "toehold/readout/scheme.hpp"
#include "support/support.hpp"

#include <cmath>
#include <functional>

namespace toehold {
namespace {

using test::error_of;

}  // namespace

// IIW 2016 sec. 3.3, from memory [M]: fine mesh type a, 0.4t and 1.0t; weights 5/3, -2/3 derived [D].
TEST(ReadoutScheme, FineLinearScalesWithThickness) {
  const ReadoutScheme s = make_scheme(SchemeKind::fine_linear, HotSpotType::a, 20.0);
  ASSERT_EQ(s.distances.size(), 2u);
  EXPECT_CLOSE(s.distances[0], 8.0, 1e-14);
  EXPECT_CLOSE(s.distances[1], 20.0, 1e-14);
  EXPECT_CLOSE(s.weights[0], 5.0 / 3.0, 1e-14);
  EXPECT_CLOSE(s.weights[1], -2.0 / 3.0, 1e-14);
  EXPECT_EQ(s.label, "IIW type a, fine mesh, linear (0.4t, 1.0t)");
  EXPECT_EQ(s.source, "IIW 2016 sec. 3.3 (from memory); weights derived");
}

// IIW 2016 sec. 3.3, from memory [M]: 0.4t, 0.9t, 1.4t with 2.52, -2.24, 0.72 [D].
TEST(ReadoutScheme, FineQuadraticPointsAndWeights) {
  const ReadoutScheme s = make_scheme(SchemeKind::fine_quadratic, HotSpotType::a, 10.0);
  ASSERT_EQ(s.distances.size(), 3u);
  EXPECT_CLOSE(s.distances[0], 4.0, 1e-14);
  EXPECT_CLOSE(s.distances[1], 9.0, 1e-14);
  EXPECT_CLOSE(s.distances[2], 14.0, 1e-14);
  EXPECT_CLOSE(s.weights[0], 2.52, 1e-13);
  EXPECT_CLOSE(s.weights[1], -2.24, 1e-13);
  EXPECT_CLOSE(s.weights[2], 0.72, 1e-13);
}

// IIW 2016 sec. 3.3 / DNVGL-RP-C203 2016 sec. 4.3, from memory [M]: 0.5t, 1.5t with 1.5, -0.5.
TEST(ReadoutScheme, CoarseLinearPointsAndWeights) {
  const ReadoutScheme s = make_scheme(SchemeKind::coarse_linear, HotSpotType::a, 25.0);
  EXPECT_CLOSE(s.distances[0], 12.5, 1e-14);
  EXPECT_CLOSE(s.distances[1], 37.5, 1e-14);
  EXPECT_CLOSE(s.weights[0], 1.5, 1e-14);
  EXPECT_CLOSE(s.weights[1], -0.5, 1e-14);
}

// IIW 2016 sec. 3.3, from memory [M]: type b points are fixed in mm (4, 8, 12 and 5, 15), whatever t is.
TEST(ReadoutScheme, TypeBDistancesIgnoreThickness) {
  for (double t : {6.0, 40.0, 0.0}) {
    const ReadoutScheme fine = make_scheme(SchemeKind::type_b_fine, HotSpotType::b, t);
    EXPECT_EQ(fine.distances, (std::vector<double>{4.0, 8.0, 12.0}));
    EXPECT_CLOSE(fine.weights[0], 3.0, 1e-14);
    EXPECT_CLOSE(fine.weights[1], -3.0, 1e-14);
    EXPECT_CLOSE(fine.weights[2], 1.0, 1e-14);
    const ReadoutScheme coarse = make_scheme(SchemeKind::type_b_coarse, HotSpotType::b, t);
    EXPECT_EQ(coarse.distances, (std::vector<double>{5.0, 15.0}));
    EXPECT_CLOSE(coarse.weights[0], 1.5, 1e-14);
    EXPECT_CLOSE(coarse.weights[1], -0.5, 1e-14);
  }
}

// IACS CSR Pt1 Ch9 Sec5 sec. 3.1.1 [S]: 1.12 x s(t/2) for type a, 1.12 x s(5 mm) for type b.
TEST(ReadoutScheme, ShipSinglePointUsesFactor112) {
  const ReadoutScheme a = make_scheme(SchemeKind::ship_single_point, HotSpotType::a, 16.0);
  EXPECT_EQ(a.distances, (std::vector<double>{8.0}));
  EXPECT_EQ(a.weights, (std::vector<double>{1.12}));
  const ReadoutScheme b = make_scheme(SchemeKind::ship_single_point, HotSpotType::b, 16.0);
  EXPECT_EQ(b.distances, (std::vector<double>{5.0}));
  EXPECT_EQ(b.weights, (std::vector<double>{1.12}));
  EXPECT_EQ(b.source, "IACS CSR Pt1 Ch9 Sec5 sec. 3.1.1");
}

TEST(ReadoutScheme, TypeMismatchNamesTheSchemesThatExist) {
  EXPECT_EQ(error_of([] { make_scheme(SchemeKind::fine_linear, HotSpotType::b, 10.0); }),
            "read-out scheme 'fine-linear' exists for type a hot spots only; for type b use type-b-fine, "
            "type-b-coarse or ship-single-point");
  EXPECT_EQ(error_of([] { make_scheme(SchemeKind::type_b_coarse, HotSpotType::a, 10.0); }),
            "read-out scheme 'type-b-coarse' exists for type b hot spots only; for type a use fine-linear, "
            "fine-quadratic, coarse-linear or ship-single-point");
  EXPECT_EQ(error_of([] { make_scheme(SchemeKind::user, HotSpotType::a, 10.0); }),
            "read-out scheme 'user' needs its own read-out distances; build it with make_user_scheme");
}

TEST(ReadoutScheme, TypeAThicknessMustBePositive) {
  EXPECT_EQ(error_of([] { make_scheme(SchemeKind::fine_quadratic, HotSpotType::a, 0.0); }),
            "read-out scheme 'fine-quadratic' (type a): plate thickness 0 mm is not positive; give the thickness of "
            "the plate that carries the toe");
  EXPECT_THROW(make_scheme(SchemeKind::coarse_linear, HotSpotType::a, -5.0), Error);
  EXPECT_EQ(error_of([] { make_scheme(SchemeKind::fine_linear, HotSpotType::a, std::nan("")); }),
            "read-out scheme 'fine-linear' (type a): plate thickness is not a finite number; give the thickness in mm");
}

// Derived [D]: two points give Lagrange weights (0 - 6) / (2 - 6) = 1.5 and (0 - 2) / (6 - 2) = -0.5.
TEST(ReadoutScheme, UserSchemeTwoPointsIsLagrange) {
  const ReadoutScheme s = make_user_scheme({2.0, 6.0}, HotSpotType::a);
  EXPECT_EQ(s.kind, SchemeKind::user);
  EXPECT_CLOSE(s.weights[0], 1.5, 1e-14);
  EXPECT_CLOSE(s.weights[1], -0.5, 1e-14);
  EXPECT_EQ(s.label, "user, type a, Lagrange extrapolation from 2 points (2, 6 mm)");
}

TEST(ReadoutScheme, UserSchemeOnePointTimesFactor) {
  const ReadoutScheme s = make_user_scheme({5.0}, HotSpotType::b, 1.12);
  EXPECT_EQ(s.weights, (std::vector<double>{1.12}));
  EXPECT_EQ(s.label, "user, type b, single point (1.12 x s(5 mm))");
  const ReadoutScheme scaled = make_user_scheme({2.0, 6.0}, HotSpotType::a, 2.0);
  EXPECT_CLOSE(scaled.weights[0], 3.0, 1e-14);
  EXPECT_CLOSE(scaled.weights[1], -1.0, 1e-14);
}

TEST(ReadoutScheme, UserSchemeBadDistancesNameTheProblem) {
  EXPECT_EQ(error_of([] { make_user_scheme({4.0, 12.0, 8.0}, HotSpotType::b); }),
            "user read-out scheme: distance 3 (8 mm) is smaller than distance 2 (12 mm); list the distances in "
            "ascending order");
  EXPECT_EQ(error_of([] { make_user_scheme({4.0, 8.0, 8.0}, HotSpotType::b); }),
            "user read-out scheme: distances 2 and 3 are both 8 mm; give each distance once");
  EXPECT_EQ(error_of([] { make_user_scheme({0.0, 8.0}, HotSpotType::b); }),
            "user read-out scheme: distance 1 is 0 mm; read-out distances must be positive (measured from the toe)");
  EXPECT_EQ(error_of([] { make_user_scheme({}, HotSpotType::a); }),
            "user read-out scheme: no read-out distances given; give at least one distance in mm");
  EXPECT_THROW(make_user_scheme({-1.0}, HotSpotType::a), Error);
  EXPECT_EQ(error_of([] { make_user_scheme({5.0}, HotSpotType::a, 0.0); }),
            "user read-out scheme: factor 0 is not a positive number; give a positive factor");
}

// Derived [D]: a linear surface stress s(x) = 200 - 3x MPa extrapolates exactly to s(0) = 200 MPa. With t = 20 mm:
// s(8) = 176, s(20) = 140, 5/3 * 176 - 2/3 * 140 = 293.333 - 93.333 = 200.
TEST(ReadoutScheme, ExtrapolatesLinearFieldToItsToeValue) {
  const ReadoutScheme s = make_scheme(SchemeKind::fine_linear, HotSpotType::a, 20.0);
  EXPECT_CLOSE(extrapolate(s, {176.0, 140.0}), 200.0, 1e-13);
  Tensor near = Tensor::Zero(), far = Tensor::Zero();
  near(1, 1) = 176.0;
  far(1, 1) = 140.0;
  near(0, 1) = near(1, 0) = 10.0;  // shear constant along the surface stays 10
  far(0, 1) = far(1, 0) = 10.0;
  const Tensor hs = extrapolate(s, std::vector<Tensor>{near, far});
  EXPECT_CLOSE(hs(1, 1), 200.0, 1e-13);
  EXPECT_CLOSE(hs(0, 1), 10.0, 1e-13);
  EXPECT_EQ(error_of([&] { extrapolate(s, {1.0, 2.0, 3.0}); }),
            "read-out scheme 'IIW type a, fine mesh, linear (0.4t, 1.0t)': 3 readings given for 2 read-out points; "
            "give one reading per point, in order");
}

// Mesh rules: IIW 2016 sec. 3.3 from memory [M] (0.4t fine, t x t coarse, 4 mm and 10 mm for type b);
// IACS CSR Pt1 Ch9 Sec5 sec. 3.1.1 [S] (t x t, 10 x 10 mm); user: common practice, no source.
TEST(ReadoutScheme, MeshRuleSizes) {
  const double t = 20.0;
  EXPECT_CLOSE(mesh_rule(make_scheme(SchemeKind::fine_linear, HotSpotType::a, t), t).max_element_size_mm, 8.0, 1e-14);
  EXPECT_CLOSE(mesh_rule(make_scheme(SchemeKind::fine_quadratic, HotSpotType::a, t), t).max_element_size_mm, 8.0,
               1e-14);
  EXPECT_EQ(mesh_rule(make_scheme(SchemeKind::coarse_linear, HotSpotType::a, t), t).max_element_size_mm, 20.0);
  EXPECT_EQ(mesh_rule(make_scheme(SchemeKind::type_b_fine, HotSpotType::b, t), t).max_element_size_mm, 4.0);
  EXPECT_EQ(mesh_rule(make_scheme(SchemeKind::type_b_coarse, HotSpotType::b, t), t).max_element_size_mm, 10.0);
  EXPECT_EQ(mesh_rule(make_scheme(SchemeKind::ship_single_point, HotSpotType::a, t), t).max_element_size_mm, 20.0);
  EXPECT_EQ(mesh_rule(make_scheme(SchemeKind::ship_single_point, HotSpotType::b, t), t).max_element_size_mm, 10.0);
  const MeshRule user = mesh_rule(make_user_scheme({3.0, 9.0}, HotSpotType::a), t);
  EXPECT_EQ(user.max_element_size_mm, 3.0);
  EXPECT_EQ(mesh_rule(make_scheme(SchemeKind::fine_linear, HotSpotType::a, t), t).text,
            "fine mesh: element size at the toe at most 0.4t = 8 mm (IIW 2016 sec. 3.3, from memory)");
}

TEST(ReadoutScheme, NamesRoundTripThroughOneTable) {
  for (SchemeKind k : {SchemeKind::fine_linear, SchemeKind::fine_quadratic, SchemeKind::coarse_linear,
                       SchemeKind::type_b_fine, SchemeKind::type_b_coarse, SchemeKind::ship_single_point,
                       SchemeKind::user})
    EXPECT_EQ(parse_scheme_kind(to_string(k), "x"), k);
  EXPECT_EQ(parse_scheme_kind("type_b_fine", "x"), SchemeKind::type_b_fine);
  EXPECT_EQ(error_of([] { parse_scheme_kind("linear", "plan key toe.readout"); }),
            "plan key toe.readout: unknown read-out scheme 'linear'; use one of fine-linear, fine-quadratic, "
            "coarse-linear, type-b-fine, type-b-coarse, ship-single-point, user");
  EXPECT_EQ(parse_hot_spot_type("b", "x"), HotSpotType::b);
  EXPECT_EQ(to_string(HotSpotType::a), "a");
  EXPECT_EQ(error_of([] { parse_hot_spot_type("c", "plan key toe.type"); }),
            "plan key toe.type: unknown hot-spot type 'c'; use one of a, b");
}

}  // namespace toehold
