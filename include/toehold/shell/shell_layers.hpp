// The stress layers of a shell model: the surface stresses at the top (+normal
// side, +t/2) and bottom (-t/2) of each shell cell, from two arrays named by
// the analyst, or rebuilt from membrane and bending arrays (top = m + b, bottom
// = m - b). Which layer a toe reads, and the strings users type for that
// choice.
#pragma once

#include "toehold/model/stress_field.hpp"
#include "toehold/shell/shell_mesh.hpp"

#include <string>
#include <string_view>

namespace toehold {

// A shell surface, seen from the cell's own normal (right-hand rule on the node
// order).
enum class ShellLayer {
  top,    // the surface at +t/2 along the cell normal
  bottom, // the surface at -t/2
};

// How a toe's layer is chosen.
enum class LayerChoice {
  weld_side, // the surface on the side of the plate where the attached plate
             // stands
  top,       // always the top layer
  bottom,    // always the bottom layer
};

// Where the layer stresses are. Either `top` and `bottom` are both named, or
// `membrane` and `bending` are (b is the bending stress at the top surface, so
// the bottom surface has -b). A StressSpec is named when its `array` or its
// first component array is not empty. All stresses in global model axes
// (Cartesian tensors).
struct ShellStressSpec {
  StressSpec top, bottom;
  StressSpec membrane, bending;
};

// The two surface stress fields of one load step, MPa, internal Voigt order,
// global axes.
struct ShellLayerStress {
  StressField top;
  StressField bottom;
  std::string origin; // how they were obtained, for the output: "arrays 'S_top'
                      // and 'S_bot'" or "membrane ... + bending ..."

  const StressField &layer(ShellLayer which) const {
    return which == ShellLayer::top ? top : bottom;
  }
};

// Reads the layer stresses named by `spec` from `shells` (point or cell data),
// converting `unit` to MPa. Throws Error naming the model when no layer array
// is named or a pair is named only half, when membrane and bending are not both
// point or both cell data, and (through read_stress) naming the array when it
// is missing or malformed.
ShellLayerStress read_shell_layers(const ShellMesh &shells,
                                   const ShellStressSpec &spec,
                                   StressUnit unit);

// The membrane and bending parts of a pair of surface tensors (MPa): m = (top +
// bottom) / 2, b = (top - bottom) / 2.
Tensor membrane_part(const Tensor &top, const Tensor &bottom);
Tensor bending_part(const Tensor &top, const Tensor &bottom);

// The other surface.
ShellLayer opposite(ShellLayer layer);

// The strings users type, in one place: "top", "bottom"; choices also
// "weld-side" (or "weld_side"). Parsing throws Error naming `where` and listing
// the accepted spellings.
LayerChoice parse_layer_choice(std::string_view text, const std::string &where);
std::string to_string(LayerChoice choice);
std::string to_string(ShellLayer layer);

} // namespace toehold
