#include "plan_fields.hpp"

#include <cmath>
#include <cstdint>
#include <limits>
#include <sstream>

#include "toehold/common/error.hpp"

namespace toehold::plan_detail {
namespace {

constexpr const char* kPoint = "a point [x, y, z] of 3 numbers";

std::optional<double> as_number(const toml::node& node) {
  if (const auto* i = node.as_integer()) return static_cast<double>(i->get());
  if (const auto* f = node.as_floating_point()) return f->get();
  return std::nullopt;
}

std::string item(const std::string& label, std::size_t index) { return label + " " + std::to_string(index + 1); }

}  // namespace

std::string location(const std::string& file, unsigned line) {
  return line == 0 ? file + ": " : file + " line " + std::to_string(line) + ": ";
}

unsigned line_of(const toml::node& node) { return static_cast<unsigned>(node.source().begin.line); }

std::string type_phrase(const toml::node& node) {
  switch (node.type()) {
    case toml::node_type::table:
      return "a table";
    case toml::node_type::array:
      return "an array";
    case toml::node_type::string:
      return "a string";
    case toml::node_type::integer:
      return "an integer";
    case toml::node_type::floating_point:
      return "a float";
    case toml::node_type::boolean:
      return "a boolean";
    case toml::node_type::date:
      return "a date";
    case toml::node_type::time:
      return "a time";
    case toml::node_type::date_time:
      return "a date-time";
    default:
      return "nothing";
  }
}

std::string number_text(double value) {
  std::ostringstream os;
  os.precision(10);
  os << value;
  return os.str();
}

std::string join(const std::vector<std::string_view>& items) {
  std::string out;
  for (std::string_view s : items) out += (out.empty() ? "" : ", ") + std::string(s);
  return out;
}

Fields::Fields(std::string file, const toml::table& table, std::string prefix, std::string owner, bool scoped)
    : file_(std::move(file)),
      table_(&table),
      prefix_(std::move(prefix)),
      owner_(std::move(owner)),
      scoped_(scoped),
      line_(line_of(table)) {}

void Fields::set_fallback(const toml::table* defaults, std::string prefix) {
  fallback_ = defaults;
  fallback_prefix_ = std::move(prefix);
}

void Fields::set_owner(std::string owner) { owner_ = std::move(owner); }

Fields::Found Fields::find(std::string_view key) const {
  const std::string full = prefix_.empty() ? std::string(key) : prefix_ + "." + std::string(key);
  if (const toml::node* own = table_->get(key)) return {own, full};
  if (fallback_ != nullptr)
    if (const toml::node* other = fallback_->get(key)) return {other, fallback_prefix_ + "." + std::string(key)};
  return {nullptr, full};
}

bool Fields::has(std::string_view key) const { return find(key).node != nullptr; }
bool Fields::has_own(std::string_view key) const { return table_->get(key) != nullptr; }

std::string Fields::key_where(const Found& found, const toml::node& at) const {
  return location(file_, line_of(at)) + scope() + "key " + found.full;
}

std::string Fields::where(std::string_view key) const {
  const Found found = find(key);
  if (found.node != nullptr) return key_where(found, *found.node);
  return location(file_, line_) + scope() + "key " + found.full;
}

void Fields::wrong_type(const Found& found, const std::string& expected) const {
  throw Error(key_where(found, *found.node) + " must be " + expected + ", not " + type_phrase(*found.node));
}

void Fields::fail_key(std::string_view key, const std::string& tail) const { throw Error(where(key) + " " + tail); }

void Fields::fail(const std::string& message) const { throw Error(location(file_, line_) + owner_ + message); }

void Fields::missing(std::string_view key, const std::string& hint) const {
  fail(" has no key '" + std::string(key) + "'; " + hint);
}

void Fields::check_known(const std::vector<std::string_view>& known) const {
  for (const auto& [key, node] : *table_) {
    bool ok = false;
    for (std::string_view k : known) ok = ok || k == key.str();
    if (ok) continue;
    const unsigned line = key.source().begin.line != 0 ? static_cast<unsigned>(key.source().begin.line) : line_of(node);
    const std::string head = owner_.empty() ? "unknown top-level key '" : owner_ + ": unknown key '";
    throw Error(location(file_, line) + head + std::string(key.str()) + "'; known keys: " + join(known));
  }
}

void Fields::require(std::string_view key, bool ok, const std::string& condition, double value) const {
  if (!ok) fail_key(key, "must be " + condition + ", not " + number_text(value));
}

std::optional<std::string> Fields::text(std::string_view key) const {
  const Found found = find(key);
  if (found.node == nullptr) return std::nullopt;
  const auto* s = found.node->as_string();
  if (s == nullptr) wrong_type(found, "a string");
  if (s->get().empty()) throw Error(key_where(found, *found.node) + " must not be empty");
  return s->get();
}

std::optional<double> Fields::number(std::string_view key) const {
  const Found found = find(key);
  if (found.node == nullptr) return std::nullopt;
  const std::optional<double> value = as_number(*found.node);
  if (!value) wrong_type(found, "a number");
  if (!std::isfinite(*value))
    throw Error(key_where(found, *found.node) + " must be a finite number, not " + number_text(*value));
  return value;
}

std::optional<int> Fields::integer(std::string_view key) const {
  const Found found = find(key);
  if (found.node == nullptr) return std::nullopt;
  const auto* i = found.node->as_integer();
  if (i == nullptr) wrong_type(found, "an integer");
  const std::int64_t v = i->get();
  if (v < std::numeric_limits<int>::min() || v > std::numeric_limits<int>::max())
    throw Error(key_where(found, *found.node) + " must be between " + std::to_string(std::numeric_limits<int>::min()) +
                " and " + std::to_string(std::numeric_limits<int>::max()) + ", not " + std::to_string(v));
  return static_cast<int>(v);
}

std::optional<bool> Fields::flag(std::string_view key) const {
  const Found found = find(key);
  if (found.node == nullptr) return std::nullopt;
  const auto* b = found.node->as_boolean();
  if (b == nullptr) wrong_type(found, "true or false");
  return b->get();
}

const toml::array& Fields::array_of(const Found& found, const std::string& expected) const {
  const auto* a = found.node->as_array();
  if (a == nullptr) wrong_type(found, expected);
  if (a->empty()) throw Error(key_where(found, *found.node) + " must not be an empty array");
  return *a;
}

std::optional<std::vector<double>> Fields::numbers(std::string_view key) const {
  const Found found = find(key);
  if (found.node == nullptr) return std::nullopt;
  std::vector<double> out;
  const toml::array& a = array_of(found, "an array of numbers");
  for (std::size_t i = 0; i < a.size(); ++i) {
    const std::optional<double> v = as_number(a[i]);
    if (!v || !std::isfinite(*v))
      throw Error(key_where(found, a[i]) + ": " + item("item", i) + " must be a finite number, not " +
                  (v ? number_text(*v) : type_phrase(a[i])));
    out.push_back(*v);
  }
  return out;
}

std::optional<std::vector<int>> Fields::integers(std::string_view key) const {
  const Found found = find(key);
  if (found.node == nullptr) return std::nullopt;
  std::vector<int> out;
  const toml::array& a = array_of(found, "an array of integers");
  for (std::size_t i = 0; i < a.size(); ++i) {
    const auto* v = a[i].as_integer();
    if (v == nullptr || v->get() < std::numeric_limits<int>::min() || v->get() > std::numeric_limits<int>::max())
      throw Error(key_where(found, a[i]) + ": " + item("item", i) + " must be an integer, not " +
                  (v ? std::to_string(v->get()) : type_phrase(a[i])));
    out.push_back(static_cast<int>(v->get()));
  }
  return out;
}

std::optional<std::vector<std::string>> Fields::texts(std::string_view key) const {
  const Found found = find(key);
  if (found.node == nullptr) return std::nullopt;
  std::vector<std::string> out;
  const toml::array& a = array_of(found, "an array of strings");
  for (std::size_t i = 0; i < a.size(); ++i) {
    const auto* s = a[i].as_string();
    if (s == nullptr || s->get().empty())
      throw Error(key_where(found, a[i]) + ": " + item("item", i) + " must be a non-empty string, not " +
                  (s ? "an empty one" : type_phrase(a[i])));
    out.push_back(s->get());
  }
  return out;
}

Vec3 Fields::point_from(const Found& found, const toml::node& node, const std::string& label) const {
  const std::string head = key_where(found, node) + (label.empty() ? "" : ": " + label);
  const auto* a = node.as_array();
  if (a == nullptr) throw Error(head + " must be " + kPoint + ", not " + type_phrase(node));
  if (a->size() != 3) throw Error(head + " must be " + kPoint + ", not an array of " + std::to_string(a->size()));
  Vec3 p;
  for (std::size_t i = 0; i < 3; ++i) {
    const std::optional<double> v = as_number((*a)[i]);
    if (!v || !std::isfinite(*v))
      throw Error(head + (label.empty() ? ": " : ", ") + item("coordinate", i) + " must be a finite number, not " +
                  (v ? number_text(*v) : type_phrase((*a)[i])));
    p[static_cast<Eigen::Index>(i)] = *v;
  }
  return p;
}

std::optional<Vec3> Fields::point(std::string_view key) const {
  const Found found = find(key);
  if (found.node == nullptr) return std::nullopt;
  return point_from(found, *found.node, "");
}

std::optional<std::vector<Vec3>> Fields::points(std::string_view key) const {
  const Found found = find(key);
  if (found.node == nullptr) return std::nullopt;
  const toml::array& a = array_of(found, "an array of points [x, y, z]");
  std::vector<Vec3> out;
  for (std::size_t i = 0; i < a.size(); ++i) out.push_back(point_from(found, a[i], item("point", i)));
  return out;
}

std::string Fields::need_text(std::string_view key, const std::string& hint) const {
  std::optional<std::string> value = text(key);
  if (!value) missing(key, hint);
  return *value;
}

double Fields::need_number(std::string_view key, const std::string& hint) const {
  const std::optional<double> value = number(key);
  if (!value) missing(key, hint);
  return *value;
}

}  // namespace toehold::plan_detail
