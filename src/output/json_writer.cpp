// The JSON text writer: escaping after RFC 8259 sec. 7, numbers by std::to_chars.
#include "toehold/output/json_writer.hpp"

#include "toehold/common/error.hpp"

#include <charconv>
#include <cmath>
#include <cstdio>

namespace toehold {

std::string json_quoted(std::string_view text) {
  std::string out = "\"";
  for (char ch : text) {
    switch (ch) {
      case '"': out += "\\\""; break;
      case '\\': out += "\\\\"; break;
      case '\n': out += "\\n"; break;
      case '\r': out += "\\r"; break;
      case '\t': out += "\\t"; break;
      case '\b': out += "\\b"; break;
      case '\f': out += "\\f"; break;
      default:
        if (static_cast<unsigned char>(ch) < 0x20) {
          char code[8];
          std::snprintf(code, sizeof code, "\\u%04x", static_cast<unsigned>(static_cast<unsigned char>(ch)));
          out += code;
        } else {
          out += ch;
        }
    }
  }
  return out + "\"";
}

std::string json_number(double value) {
  if (!std::isfinite(value)) return "null";
  char buffer[64];
  const auto [end, ec] = std::to_chars(buffer, buffer + sizeof buffer, value);
  if (ec != std::errc()) return "null";
  return std::string(buffer, end);
}

void JsonWriter::newline() {
  out_ += '\n';
  out_.append(2 * levels_.size(), ' ');
}

void JsonWriter::before_value() {
  if (after_key_) {
    after_key_ = false;
    return;
  }
  if (levels_.empty()) {
    if (!out_.empty()) throw Error("JSON writer: a second top-level value; write one document per writer");
    return;
  }
  Level& level = levels_.back();
  if (level.object) throw Error("JSON writer: a value inside an object needs a key first");
  if (!level.empty) out_ += level.compact ? ", " : ",";
  if (!level.compact) newline();
  level.empty = false;
}

JsonWriter& JsonWriter::begin_object(bool compact) {
  before_value();
  out_ += '{';
  levels_.push_back({true, compact, true});
  return *this;
}

JsonWriter& JsonWriter::begin_array(bool compact) {
  before_value();
  out_ += '[';
  levels_.push_back({false, compact, true});
  return *this;
}

void JsonWriter::close(bool object) {
  if (levels_.empty() || levels_.back().object != object || after_key_)
    throw Error(std::string("JSON writer: end_") + (object ? "object" : "array") + " does not match an open one");
  const Level level = levels_.back();
  levels_.pop_back();
  if (!level.empty && !level.compact) newline();
  out_ += object ? '}' : ']';
}

JsonWriter& JsonWriter::end_object() {
  close(true);
  return *this;
}

JsonWriter& JsonWriter::end_array() {
  close(false);
  return *this;
}

JsonWriter& JsonWriter::key(std::string_view name) {
  if (levels_.empty() || !levels_.back().object || after_key_)
    throw Error("JSON writer: key '" + std::string(name) + "' outside an object or after another key");
  Level& level = levels_.back();
  if (!level.empty) out_ += level.compact ? ", " : ",";
  if (!level.compact) newline();
  level.empty = false;
  out_ += json_quoted(name) + ": ";
  after_key_ = true;
  return *this;
}

JsonWriter& JsonWriter::value(std::string_view text) {
  before_value();
  out_ += json_quoted(text);
  return *this;
}

JsonWriter& JsonWriter::value(double number) {
  before_value();
  out_ += json_number(number);
  return *this;
}

JsonWriter& JsonWriter::value(long long number) {
  before_value();
  out_ += std::to_string(number);
  return *this;
}

JsonWriter& JsonWriter::value(bool flag) {
  before_value();
  out_ += flag ? "true" : "false";
  return *this;
}

JsonWriter& JsonWriter::null() {
  before_value();
  out_ += "null";
  return *this;
}

JsonWriter& JsonWriter::numbers(const std::vector<double>& values) {
  begin_array(true);
  for (double v : values) value(v);
  return end_array();
}

JsonWriter& JsonWriter::strings(const std::vector<std::string>& values) {
  begin_array();
  for (const auto& v : values) value(v);
  return end_array();
}

std::string JsonWriter::text() const {
  if (!levels_.empty() || after_key_) throw Error("JSON writer: the document has open objects or arrays");
  return out_ + "\n";
}

}  // namespace toehold
