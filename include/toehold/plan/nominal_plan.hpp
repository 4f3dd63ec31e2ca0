// The nominal-stress method of one toe as the plan gives it: where the nominal stress comes from and the textbook
// infinite-life weld check, for the side-by-side comparison with the hot-spot result (docs/nominal-method.md).
// Lengths are already in mm, stresses in MPa, forces in N and moments in N mm.
#pragma once

#include "toehold/model/section_stress.hpp"
#include "toehold/nominal/infinite_life.hpp"
#include "toehold/nominal/nominal_source.hpp"

#include <optional>
#include <string>
#include <vector>

namespace toehold {

// [toe.nominal.weld_group]: a fillet-weld group and the load it carries at every load step.
struct WeldGroupPlan {
  nominal::WeldGroupShape shape;  // layout, leg and dimensions, mm; shape.name = the toe's name
  nominal::ThroatMeasure measure = nominal::ThroatMeasure::combined;
  std::vector<nominal::WeldLoad> loads;  // one per load step (plan order), at the group's centroid, N and N mm
};

// [toe.nominal.infinite_life]: the textbook infinite-life check of the weld.
struct InfiniteLifePlan {
  std::string parent;      // parent-metal name as written ("" when only weld_metal is given)
  std::string weld_metal;  // weld-metal name as written ("" when only parent is given)
  // material = the weaker of parent and weld metal (common practice), or the one given; detail (K_fs), Marin
  // inputs and criterion as the plan says.
  nominal::WeldCheckInput input;
  std::optional<double> mean_MPa;  // source "given" with a range only: the nominal mean stress, MPa
  unsigned line = 0;               // line of the table, for messages
};

// [toe.nominal] of one [[toe]]: absent when the toe has no nominal-stress check.
struct ToeNominalPlan {
  unsigned line = 0;  // line of the [toe.nominal] table, for messages
  nominal::NominalSource source = nominal::NominalSource::given;
  std::string curve;  // detail class: a catalogue or [[curve]] name (normal or shear), e.g. "IIW FAT 80"
  // given: one value per load step (plan order), MPa, signed; or one range, MPa (loading kind range only).
  std::vector<double> values_MPa;
  std::optional<double> range_MPa;
  // section: the cut plane through the plate away from the weld (name "nominal section"; messages name the toe).
  SectionSpec section;
  // surface-distance: distance from the toe along each station's read-out path, mm (> 0).
  double distance_mm = 0.0;
  std::optional<WeldGroupPlan> weld_group;      // weld-group only
  std::optional<InfiniteLifePlan> infinite_life;  // optional for every source
};

// An analyst-defined material from a [[material]] table, named by toes' nominal checks.
struct MaterialPlan {
  std::string name;
  nominal::Material material;  // strengths in MPa, checked (nominal::user_material)
  unsigned line = 0;           // line of the [[material]] table, for messages
};

}  // namespace toehold
