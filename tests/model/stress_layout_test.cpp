// Stress component order: from names, from a declaration, and refusals of anything ambiguous.
#include "support/support.hpp"
#include "toehold/common/error.hpp"
#include "toehold/model/stress_layout.hpp"

namespace toehold {
namespace {

using Source = std::array<int, 6>;

TEST(ComponentNameKey, ReadsCommonSpellings) {
  // Spellings used by solvers and post-processors for the six components (common practice, no source).
  EXPECT_EQ(component_name_key("XX"), "xx");
  EXPECT_EQ(component_name_key("Sxx"), "xx");
  EXPECT_EQ(component_name_key("sigma_xx"), "xx");
  EXPECT_EQ(component_name_key("Stress-YZ"), "yz");
  EXPECT_EQ(component_name_key("S11"), "xx");
  EXPECT_EQ(component_name_key("11"), "xx");
  EXPECT_EQ(component_name_key("s_23"), "yz");
  EXPECT_EQ(component_name_key("SX"), "xx");
  EXPECT_EQ(component_name_key("yx"), "xy");
  EXPECT_EQ(component_name_key("ZX"), "xz");
  EXPECT_EQ(component_name_key("31"), "xz");
  EXPECT_EQ(component_name_key("tau_xy"), "xy");
}

TEST(ComponentNameKey, RefusesNamesThatNameNoComponent) {
  EXPECT_EQ(component_name_key(""), "");
  EXPECT_EQ(component_name_key("0"), "");
  EXPECT_EQ(component_name_key("5"), "");
  EXPECT_EQ(component_name_key("1"), "");
  EXPECT_EQ(component_name_key("00"), "");
  EXPECT_EQ(component_name_key("Magnitude"), "");
  EXPECT_EQ(component_name_key("s"), "");
  EXPECT_EQ(component_name_key("xxx"), "");
}

TEST(LayoutFromNames, InternalOrderIsIdentity) {
  const auto layout = layout_from_component_names({"XX", "YY", "ZZ", "XY", "YZ", "XZ"});
  ASSERT_TRUE(layout);
  EXPECT_EQ(layout->source, (Source{0, 1, 2, 3, 4, 5}));
}

TEST(LayoutFromNames, ShearLastInAnotherOrder) {
  // File order xx, yy, zz, xy, xz, yz (xz before yz): internal yz is file index 5, internal xz is 4.
  const auto layout = layout_from_component_names({"S11", "S22", "S33", "S12", "S13", "S23"});
  ASSERT_TRUE(layout);
  EXPECT_EQ(layout->source, (Source{0, 1, 2, 3, 5, 4}));
}

TEST(LayoutFromNames, MixedCaseAndTransposedShearNames) {
  // File order xx, xy, xz, yy, yz, zz (upper triangle row by row), shear written yx, zx, zy.
  const auto layout = layout_from_component_names({"sigma_xx", "sigma_yx", "sigma_zx", "sigma_yy", "sigma_zy", "sigma_zz"});
  ASSERT_TRUE(layout);
  EXPECT_EQ(layout->source, (Source{0, 3, 5, 1, 4, 2}));
}

TEST(LayoutFromNames, RefusesIndexNamesEmptyNamesAndRepeats) {
  EXPECT_FALSE(layout_from_component_names({"0", "1", "2", "3", "4", "5"}));
  EXPECT_FALSE(layout_from_component_names({"", "", "", "", "", ""}));
  EXPECT_FALSE(layout_from_component_names({"XX", "YY", "ZZ", "XY", "YX", "XZ"}));  // xy twice, yz missing
  EXPECT_FALSE(layout_from_component_names({"00", "11", "22", "01", "12", "02"}));  // zero-based indices
  EXPECT_FALSE(layout_from_component_names({"XX", "YY", "ZZ", "XY", "YZ"}));
}

TEST(ParseComponentOrder, AcceptsCommasSpacesAndIndexForms) {
  EXPECT_EQ(parse_component_order("xx,yy,zz,xy,yz,xz", "plan").source, (Source{0, 1, 2, 3, 4, 5}));
  EXPECT_EQ(parse_component_order("xx yy zz xy xz yz", "plan").source, (Source{0, 1, 2, 3, 5, 4}));
  EXPECT_EQ(parse_component_order("11, 22, 33, 12, 23, 31", "plan").source, (Source{0, 1, 2, 3, 4, 5}));
  EXPECT_EQ(parse_component_order("x,y,z,yx,zy,zx", "plan").source, (Source{0, 1, 2, 3, 4, 5}));
  EXPECT_EQ(parse_component_order("zz,yy,xx,xy,yz,xz", "plan").source, (Source{2, 1, 0, 3, 4, 5}));
}

std::string order_error(const std::string& text) {
  try {
    parse_component_order(text, "plan key stress.order");
  } catch (const Error& e) {
    return e.what();
  }
  return "no error";
}

TEST(ParseComponentOrder, ErrorsNameThePlaceAndTheProblem) {
  EXPECT_EQ(order_error("xx,yy,zz,xy,yz"),
            "plan key stress.order: order \"xx,yy,zz,xy,yz\" names 5 components; list all six, e.g. order = "
            "\"xx,yy,zz,xy,yz,xz\"");
  EXPECT_EQ(order_error("xx,yy,zz,xy,yz,qq"),
            "plan key stress.order: unknown stress component 'qq' in order \"xx,yy,zz,xy,yz,qq\"; use xx, yy, zz, xy, "
            "yz, xz (or 11, 22, 33, 12, 23, 13)");
  EXPECT_EQ(order_error("xx,yy,zz,xy,yx,xz"),
            "plan key stress.order: order \"xx,yy,zz,xy,yx,xz\" names component xy twice ('xy' and 'yx'); list each "
            "of xx, yy, zz, xy, yz, xz once");
}

}  // namespace
}  // namespace toehold
