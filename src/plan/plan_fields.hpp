// Private to the plan reader: one TOML table of a plan seen as typed fields. Every look-up error names the plan
// file, the line and the full key ("plan.toml line 7: key model.length_unit must be a string, not an integer").
// A toe's table can fall back on [toe_defaults] for keys it does not give itself.
#pragma once

#include <toml++/toml.h>

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "toehold/common/tensor.hpp"

namespace toehold::plan_detail {

// "plan.toml line 7: " (or "plan.toml: " when line is 0, i.e. unknown).
std::string location(const std::string& file, unsigned line);
// Line where a node starts in the plan text, 0 when toml++ recorded none.
unsigned line_of(const toml::node& node);
// "a string", "an integer", "a float", "a table", "an array", ... for messages.
std::string type_phrase(const toml::node& node);
// A number as people write it: 12, 0.4, 2e+06.
std::string number_text(double value);
// `items` joined with ", ".
std::string join(const std::vector<std::string_view>& items);

class Fields {
 public:
  // file: the plan as given (for messages). table: the fields. prefix: the full-key prefix ("model", "toe").
  // owner: how messages name the table ("[model]", "toe 'north'"). scoped: put "owner: " before every message
  // about a key too (tables of an array, whose keys alone do not say which element is meant).
  Fields(std::string file, const toml::table& table, std::string prefix, std::string owner, bool scoped);

  // Keys missing here are looked up in `defaults` (full-key prefix `prefix`), e.g. [toe_defaults] for a toe.
  void set_fallback(const toml::table* defaults, std::string prefix);
  // Names the table anew in messages, e.g. once a toe's name is known.
  void set_owner(std::string owner);

  const std::string& file() const { return file_; }
  const std::string& owner() const { return owner_; }
  unsigned line() const { return line_; }
  bool has(std::string_view key) const;
  // True when the key is given in the table itself (not only in the fallback).
  bool has_own(std::string_view key) const;

  // Typed look-ups; nullopt when the key is absent; Error when it has the wrong type.
  std::optional<std::string> text(std::string_view key) const;                // a non-empty string
  std::optional<double> number(std::string_view key) const;                   // an integer or a float, finite
  std::optional<int> integer(std::string_view key) const;                     // an integer that fits an int
  std::optional<bool> flag(std::string_view key) const;                       // a boolean
  std::optional<std::vector<double>> numbers(std::string_view key) const;     // array of numbers, >= 1
  std::optional<std::vector<int>> integers(std::string_view key) const;       // array of integers, >= 1
  std::optional<std::vector<std::string>> texts(std::string_view key) const;  // array of non-empty strings
  std::optional<Vec3> point(std::string_view key) const;                      // [x, y, z], unit as in the file
  std::optional<std::vector<Vec3>> points(std::string_view key) const;        // array of [x, y, z]

  // The required look-ups: Error "<owner> has no key '<key>'; <hint>" when absent.
  std::string need_text(std::string_view key, const std::string& hint) const;
  double need_number(std::string_view key, const std::string& hint) const;

  // "plan.toml line 7: key model.order" (with the owner for scoped tables): the `where` for parse_* functions.
  std::string where(std::string_view key) const;
  // Error "<where(key)> <tail>", e.g. tail "must be greater than 0, not -2".
  [[noreturn]] void fail_key(std::string_view key, const std::string& tail) const;
  // Error at the table's line: "plan.toml line 9: <owner><message>" where message starts with ": " or " ".
  [[noreturn]] void fail(const std::string& message) const;
  [[noreturn]] void missing(std::string_view key, const std::string& hint) const;
  // Error for the first key of the table (not the fallback) that is not in `known`.
  void check_known(const std::vector<std::string_view>& known) const;

  // Range checks on a number already read: Error "... must be <condition>, not <value>" unless ok.
  void require(std::string_view key, bool ok, const std::string& condition, double value) const;

 private:
  struct Found {
    const toml::node* node = nullptr;
    std::string full;  // full key, e.g. "toe.thickness" or "toe_defaults.thickness"
  };
  Found find(std::string_view key) const;
  std::string scope() const { return scoped_ ? owner_ + ": " : std::string(); }
  std::string key_where(const Found& found, const toml::node& at) const;
  [[noreturn]] void wrong_type(const Found& found, const std::string& expected) const;
  const toml::array& array_of(const Found& found, const std::string& expected) const;
  Vec3 point_from(const Found& found, const toml::node& node, const std::string& label) const;

  std::string file_;
  const toml::table* table_;
  std::string prefix_;
  std::string owner_;
  bool scoped_;
  unsigned line_;
  const toml::table* fallback_ = nullptr;
  std::string fallback_prefix_;
};

}  // namespace toehold::plan_detail
