// The one way toehold maps the strings users type to enum values and back: a constexpr table of
// (spelling, value) pairs per enum, looked up by these two functions.
#pragma once

#include "toehold/common/error.hpp"

#include <array>
#include <string>
#include <string_view>
#include <utility>

namespace toehold {

// The value spelled `text`; throws Error "<where>: unknown <kind> '<text>'; use one of 'a', 'b'".
template <class E, std::size_t N>
E parse_from(const std::array<std::pair<const char*, E>, N>& table, std::string_view text, const std::string& where,
             const char* kind) {
  std::string spellings;
  for (const auto& [name, value] : table) {
    if (text == name) return value;
    spellings += (spellings.empty() ? "'" : ", '") + std::string(name) + "'";
  }
  throw Error(where + ": unknown " + kind + " '" + std::string(text) + "'; use one of " + spellings);
}

// The spelling of `value` ("?" when the table lacks it).
template <class E, std::size_t N>
std::string name_in(const std::array<std::pair<const char*, E>, N>& table, E value) {
  for (const auto& [name, v] : table)
    if (v == value) return name;
  return "?";
}

}  // namespace toehold
