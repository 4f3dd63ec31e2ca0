// A small JSON text writer (RFC 8259): objects, arrays, strings, numbers, booleans and null, indented two spaces.
// Numbers are written in the shortest form that reads back to the same double; NaN and infinities, which JSON
// cannot hold, are written as null (callers that need to tell infinity apart write a string instead).
#pragma once

#include <string>
#include <string_view>
#include <vector>

namespace toehold {

// `text` as a JSON string literal, quotes included: '"', '\\' and control characters escaped; UTF-8 passes through.
std::string json_quoted(std::string_view text);
// The shortest decimal text that reads back to exactly `value`; "null" for NaN and infinities.
std::string json_number(double value);

class JsonWriter {
public:
  // Containers. `compact` puts the items on one line (for short arrays of numbers such as coordinates).
  JsonWriter& begin_object(bool compact = false);
  JsonWriter& end_object();
  JsonWriter& begin_array(bool compact = false);
  JsonWriter& end_array();
  // The key of the next value inside an object.
  JsonWriter& key(std::string_view name);
  JsonWriter& value(std::string_view text);
  JsonWriter& value(const char* text) { return value(std::string_view(text)); }
  JsonWriter& value(const std::string& text) { return value(std::string_view(text)); }
  JsonWriter& value(double number);
  JsonWriter& value(int number) { return value(static_cast<long long>(number)); }
  JsonWriter& value(long long number);
  JsonWriter& value(bool flag);
  JsonWriter& null();
  // key(name).value(v) in one call.
  template <class T>
  JsonWriter& field(std::string_view name, const T& v) {
    key(name);
    return value(v);
  }
  JsonWriter& numbers(const std::vector<double>& values);  // a compact array of numbers
  JsonWriter& strings(const std::vector<std::string>& values);  // an array of strings, one per line

  // The text written so far; complete once every container is closed. Throws Error when containers are open.
  std::string text() const;

private:
  struct Level {
    bool object = false;
    bool compact = false;
    bool empty = true;
  };
  void before_value();
  void close(bool object);
  void newline();

  std::string out_;
  std::vector<Level> levels_;
  bool after_key_ = false;
};

}  // namespace toehold
