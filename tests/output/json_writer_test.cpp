// The JSON text writer: layout, escaping (RFC 8259 sec. 7), shortest round-trip numbers, and misuse errors.
#include "support/support.hpp"
#include "toehold/common/error.hpp"
#include "toehold/output/json_writer.hpp"

#include <cmath>
#include <limits>

namespace toehold::test {
namespace {

TEST(JsonWriter, WritesNestedDocumentIndented) {
  JsonWriter w;
  w.begin_object().field("name", "toe").key("x").numbers({1.5, -2.0, 0.1}).key("empty").begin_array().end_array();
  w.key("flags").begin_array().value(true).null().value(3).end_array().end_object();
  EXPECT_EQ(w.text(),
            "{\n  \"name\": \"toe\",\n  \"x\": [1.5, -2, 0.1],\n  \"empty\": [],\n  \"flags\": [\n    true,\n"
            "    null,\n    3\n  ]\n}\n");
}

TEST(JsonWriter, EscapesQuotesBackslashesAndControlCharacters) {
  EXPECT_EQ(json_quoted("lift, \"swung\""), "\"lift, \\\"swung\\\"\"");
  EXPECT_EQ(json_quoted("a\\b"), "\"a\\\\b\"");
  EXPECT_EQ(json_quoted("line\nnext\ttab\r"), "\"line\\nnext\\ttab\\r\"");
  EXPECT_EQ(json_quoted(std::string("\x01", 1)), "\"\\u0001\"");
  EXPECT_EQ(json_quoted("Grad \xc2\xb0"), "\"Grad \xc2\xb0\"");  // UTF-8 passes through
}

TEST(JsonWriter, NumbersReadBackExactly) {
  EXPECT_EQ(json_number(0.1), "0.1");
  EXPECT_EQ(json_number(0.5555555555555556), "0.5555555555555556");
  EXPECT_EQ(json_number(1.5e7), "1.5e+07");  // shortest form, as std::to_chars writes it
  EXPECT_EQ(json_number(1e300), "1e+300");
  EXPECT_EQ(std::stod(json_number(2.0 / 3.0)), 2.0 / 3.0);
}

TEST(JsonWriter, NonFiniteNumbersBecomeNull) {
  EXPECT_EQ(json_number(std::numeric_limits<double>::infinity()), "null");
  EXPECT_EQ(json_number(std::nan("")), "null");
}

TEST(JsonWriter, MisuseThrows) {
  JsonWriter open;
  open.begin_object();
  EXPECT_THROW(open.text(), Error);
  EXPECT_THROW(open.value(1.0), Error);  // a value in an object without a key
  JsonWriter wrong;
  wrong.begin_array();
  EXPECT_THROW(wrong.end_object(), Error);
  try {
    JsonWriter w;
    w.begin_array().key("x");
    FAIL() << "expected Error";
  } catch (const Error& e) {
    EXPECT_STREQ(e.what(), "JSON writer: key 'x' outside an object or after another key");
  }
}

}  // namespace
}  // namespace toehold::test
