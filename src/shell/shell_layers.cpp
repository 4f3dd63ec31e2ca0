#include "toehold/shell/shell_layers.hpp"

#include "toehold/common/error.hpp"

namespace toehold {
namespace {

bool named(const StressSpec &spec) {
  return !spec.array.empty() || !spec.component_arrays[0].empty();
}

std::string label(const StressSpec &spec) {
  std::string out = "'";
  out += spec.array.empty() ? spec.component_arrays[0] : spec.array;
  out += spec.array.empty() ? "'..." : "'";
  return out;
}

void require_pair(const ShellMesh &shells, const StressSpec &a,
                  const StressSpec &b, const char *name_a, const char *name_b) {
  if (named(a) == named(b))
    return;
  const char *missing = named(a) ? name_b : name_a;
  const char *given = named(a) ? name_a : name_b;
  throw Error(shells.source() + ": the " + given +
              " stress array is named but the " + missing +
              " one is not; name both");
}

// top = m + b or bottom = m - b, entity by entity (sign +1 or -1).
StressField combine(const StressField &m, const StressField &b, double sign) {
  std::vector<double> out(m.values().size());
  for (std::size_t i = 0; i < out.size(); ++i)
    out[i] = m.values()[i] + sign * b.values()[i];
  return StressField(m.where(), std::move(out));
}

} // namespace

ShellLayerStress read_shell_layers(const ShellMesh &shells,
                                   const ShellStressSpec &spec,
                                   StressUnit unit) {
  require_pair(shells, spec.top, spec.bottom, "top", "bottom");
  require_pair(shells, spec.membrane, spec.bending, "membrane", "bending");
  ShellLayerStress out;
  if (named(spec.top)) {
    out.top = read_stress(shells.mesh(), spec.top, unit);
    out.bottom = read_stress(shells.mesh(), spec.bottom, unit);
    out.origin = "top " + label(spec.top) + ", bottom " + label(spec.bottom);
    return out;
  }
  if (!named(spec.membrane))
    throw Error(shells.source() +
                ": no shell stress layer arrays are named; name the top and "
                "bottom surface stress "
                "arrays, or the membrane and bending stress arrays");
  const StressField m = read_stress(shells.mesh(), spec.membrane, unit);
  const StressField b = read_stress(shells.mesh(), spec.bending, unit);
  if (m.where() != b.where())
    throw Error(shells.source() + ": membrane array " + label(spec.membrane) +
                " and bending array " + label(spec.bending) +
                " must both be point data or both cell data");
  out.top = combine(m, b, 1.0);     // top surface: membrane plus bending
  out.bottom = combine(m, b, -1.0); // bottom surface: membrane minus bending
  out.origin =
      "membrane " + label(spec.membrane) + " +- bending " + label(spec.bending);
  return out;
}

Tensor membrane_part(const Tensor &top, const Tensor &bottom) {
  return 0.5 * (top + bottom);
}
Tensor bending_part(const Tensor &top, const Tensor &bottom) {
  return 0.5 * (top - bottom);
}

ShellLayer opposite(ShellLayer layer) {
  return layer == ShellLayer::top ? ShellLayer::bottom : ShellLayer::top;
}

LayerChoice parse_layer_choice(std::string_view text,
                               const std::string &where) {
  if (text == "weld-side" || text == "weld_side")
    return LayerChoice::weld_side;
  if (text == "top")
    return LayerChoice::top;
  if (text == "bottom")
    return LayerChoice::bottom;
  throw Error(where + ": unknown shell layer '" + std::string(text) +
              "'; use weld-side, top or bottom");
}

std::string to_string(LayerChoice choice) {
  switch (choice) {
  case LayerChoice::weld_side:
    return "weld-side";
  case LayerChoice::top:
    return "top";
  case LayerChoice::bottom:
    return "bottom";
  }
  return "?";
}

std::string to_string(ShellLayer layer) {
  return layer == ShellLayer::top ? "top" : "bottom";
}

} // namespace toehold
