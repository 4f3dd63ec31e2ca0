// Where a toe's nominal stress range comes from (a value the analyst gives, a section cut through the FE model,
// the far-field surface stress on the read-out path, or a weld-group hand formula) and the range itself, with a
// one-line note on how it was obtained. Numeric core: the FE section itself is model/section_stress.hpp.
#pragma once

#include "toehold/fatigue/sn_curve.hpp"
#include "toehold/nominal/weld_group.hpp"

#include <string>
#include <string_view>
#include <vector>

namespace toehold::nominal {

// The sources of a nominal stress; strings users type in parentheses (parse_nominal_source, to_string).
enum class NominalSource {
  given,             // "given": a range, or one value per load step, written in the plan by the analyst
  section,           // "section": area-averaged (membrane) normal stress on a cut through the plate away from the weld
  surface_distance,  // "surface-distance": the surface stress on the toe's read-out path at a given distance
  weld_group,        // "weld-group": throat stress of a fillet-weld group by the hand formula (weld_group.hpp)
};

std::string to_string(NominalSource source);
// Throws Error naming `where` and listing the accepted spellings for any other text.
NominalSource parse_nominal_source(std::string_view text, const std::string& where);

// A nominal stress range ready for the S-N check.
struct NominalRange {
  double range_MPa = 0.0;                     // stress range, MPa, >= 0
  StressKind kind = StressKind::normal;       // normal or shear: must match the detail class's curve
  NominalSource source = NominalSource::given;
  int from = -1, to = -1;                     // load steps (0-based indices) giving the range; -1 when given
  double from_MPa = 0.0, to_MPa = 0.0;        // signed values at those steps, MPa (0 when given as a range)
  std::string note;                           // one line for reports: what was measured, where, and how
};

// A range the analyst gives directly. what: label for messages and the note, e.g. "toe 'T1' nominal stress".
// Throws Error naming `what` for a negative or non-finite range.
NominalRange given_range(double range_MPa, StressKind kind, const std::string& what);

// The largest range between two of `values` (one signed value per load step, MPa): max - min, from the step of
// the minimum to the step of the maximum (the first of equal values). Throws Error naming `what` when there are
// fewer than two values or one is not finite.
NominalRange range_over_steps(const std::vector<double>& values, StressKind kind, NominalSource source,
                              const std::string& what);

// Which part of a weld group's throat stress is taken as the nominal stress.
enum class ThroatMeasure {
  combined,  // "combined": |(tau_x, tau_y, sigma_z)|, the magnitude of the throat traction; it equals IIW's
             // sigma_w = sqrt(sigma_perp^2 + tau_perp^2 + tau_par^2) on the same throat area [D], checked with a
             // normal-stress class (IIW 2016 FAT 36 for root cracks of load-carrying fillets, from memory [M])
  shear,     // "shear": |(tau_x, tau_y)|, the in-plane shear; checked with a shear class (e.g. IIW FAT 80 shear [M])
  normal,    // "normal": |sigma_z|, the throat stress normal to the weld plane; a normal-stress class
};

std::string to_string(ThroatMeasure measure);
ThroatMeasure parse_throat_measure(std::string_view text, const std::string& where);
// Stress kind of the S-N curve a measure is checked with: shear for `shear`, normal otherwise.
StressKind stress_kind_of(ThroatMeasure measure);

// The nominal range from a weld group under a load range.
struct WeldGroupRange {
  NominalRange range;            // source weld_group, kind stress_kind_of(measure), from = 0, to = 1
  WeldGroupProperties group;     // the group's throat area and moments
  WeldLoad load_range;           // second - first: the throat stresses are linear in the loads
  ThroatStress throat;           // throat stresses of load_range at the critical point of the measure
  ThroatMeasure measure = ThroatMeasure::combined;
};

// Throat-stress range of a weld group between two load states (forces N, moments N mm at the centroid): the
// hand formula of weld_group.hpp applied to the load difference, at the weld end, corner (or, for a circle, the
// point round it) where the chosen measure is largest. Throws Error naming the weld group when its leg or a
// dimension is zero, negative or not finite (a weld of zero length), or when bending acts on an angle layout.
WeldGroupRange weld_group_range(const WeldGroupShape& shape, const WeldLoad& first, const WeldLoad& second,
                                ThroatMeasure measure);

}  // namespace toehold::nominal
