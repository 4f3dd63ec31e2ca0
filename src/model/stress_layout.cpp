#include "toehold/model/stress_layout.hpp"

#include "toehold/common/error.hpp"

#include <algorithm>
#include <array>
#include <cctype>
#include <utility>

namespace toehold {
namespace {

// Internal Voigt components, in internal order.
constexpr std::array<std::string_view, 6> kKeys{"xx", "yy", "zz", "xy", "yz", "xz"};

// What may stand before the component part of a name ("Sxx", "sigma_xy", "stress.11"). Tried all at once: a
// name two prefixes read differently is refused.
constexpr std::array<std::string_view, 6> kPrefixes{"", "stress", "sigma", "sig", "tau", "s"};

// Component spellings (after lower-casing and removing separators) and the internal key they mean.
// Indices are 1-based as in continuum mechanics (11 = xx); single letters name normal stresses (Sx = xx).
constexpr std::array<std::pair<std::string_view, std::string_view>, 21> kSpellings{{
    {"xx", "xx"}, {"yy", "yy"}, {"zz", "zz"}, {"xy", "xy"}, {"yx", "xy"}, {"yz", "yz"}, {"zy", "yz"},
    {"xz", "xz"}, {"zx", "xz"}, {"x", "xx"},  {"y", "yy"},  {"z", "zz"},  {"11", "xx"}, {"22", "yy"},
    {"33", "zz"}, {"12", "xy"}, {"21", "xy"}, {"23", "yz"}, {"32", "yz"}, {"13", "xz"}, {"31", "xz"},
}};

std::string normalized(std::string_view name) {
  std::string out;
  for (char c : name)
    if (std::isalnum(static_cast<unsigned char>(c))) out += static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return out;
}

std::string_view key_of_spelling(std::string_view rest) {
  for (const auto& [spelling, key] : kSpellings)
    if (spelling == rest) return key;
  return {};
}

int key_index(std::string_view key) {
  for (std::size_t i = 0; i < kKeys.size(); ++i)
    if (kKeys[i] == key) return static_cast<int>(i);
  return -1;
}

std::vector<std::string> split_order(std::string_view text) {
  std::vector<std::string> tokens;
  std::string current;
  for (char c : text) {
    if (c == ',' || c == ';' || std::isspace(static_cast<unsigned char>(c))) {
      if (!current.empty()) tokens.push_back(current);
      current.clear();
    } else {
      current += c;
    }
  }
  if (!current.empty()) tokens.push_back(current);
  return tokens;
}

std::string quoted(std::string_view text) {  // built step by step: g++ 12 -O3 warns (-Wrestrict) on "a" + s + "b"
  std::string out = "\"";
  out += text;
  out += '"';
  return out;
}

}  // namespace

std::string component_name_key(std::string_view name) {
  const std::string norm = normalized(name);
  std::string found;
  for (std::string_view prefix : kPrefixes) {
    if (norm.size() <= prefix.size() || norm.compare(0, prefix.size(), prefix) != 0) continue;
    const std::string_view key = key_of_spelling(std::string_view(norm).substr(prefix.size()));
    if (key.empty()) continue;
    if (!found.empty() && found != key) return "";  // two readings: refuse
    found = std::string(key);
  }
  return found;
}

std::optional<StressLayout> layout_from_component_names(const std::vector<std::string>& names) {
  if (names.size() != 6) return std::nullopt;
  StressLayout layout;
  layout.source.fill(-1);
  for (std::size_t i = 0; i < names.size(); ++i) {
    const int k = key_index(component_name_key(names[i]));
    if (k < 0 || layout.source[k] >= 0) return std::nullopt;  // unnamed, unknown or repeated component
    layout.source[k] = static_cast<int>(i);
  }
  return layout;
}

StressLayout parse_component_order(std::string_view text, const std::string& where) {
  const std::vector<std::string> tokens = split_order(text);
  if (tokens.size() != 6)
    throw Error(where + ": order " + quoted(text) + " names " + std::to_string(tokens.size()) +
                " components; list all six, e.g. order = \"xx,yy,zz,xy,yz,xz\"");
  StressLayout layout;
  layout.source.fill(-1);
  for (std::size_t i = 0; i < tokens.size(); ++i) {
    const std::string key = component_name_key(tokens[i]);
    const int k = key_index(key);
    if (k < 0)
      throw Error(where + ": unknown stress component '" + tokens[i] + "' in order " + quoted(text) +
                  "; use xx, yy, zz, xy, yz, xz (or 11, 22, 33, 12, 23, 13)");
    if (layout.source[k] >= 0)
      throw Error(where + ": order " + quoted(text) + " names component " + key + " twice ('" +
                  tokens[layout.source[k]] + "' and '" + tokens[i] + "'); list each of xx, yy, zz, xy, yz, xz once");
    layout.source[k] = static_cast<int>(i);
  }
  return layout;
}

}  // namespace toehold
