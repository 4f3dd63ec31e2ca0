// How the components of a stress array in a file map onto toehold's tensor. The order is never guessed: it
// comes from the array's component names when they name it, or from the analyst's declaration.
#pragma once

#include <array>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace toehold {

// For each internal Voigt component (xx, yy, zz, xy, yz, xz) the index of the file's component that holds it.
struct StressLayout {
  std::array<int, 6> source{0, 1, 2, 3, 4, 5};
};

// Parses a declared order of six names separated by commas or spaces, each one of xx yy zz xy yz xz (also
// yx zy zx), or 11 22 33 12 23 13 (also 21 32 31), or x y z xy yz xz / sxx syy ... forms accepted by
// component_name_key. Throws Error naming `where` when a component is unknown, repeated or missing.
StressLayout parse_component_order(std::string_view text, const std::string& where);

// The layout a 6-component array's component names spell out (names like "XX", "Sxx", "s_xy", "11",
// "S12"...), or nullopt when any name is empty or does not name a tensor component unambiguously.
std::optional<StressLayout> layout_from_component_names(const std::vector<std::string>& names);

// The canonical component ("xx", ..., "xz") a single name refers to, or "" when it names none.
std::string component_name_key(std::string_view name);

}  // namespace toehold
