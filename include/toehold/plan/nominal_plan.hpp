// The nominal-stress method of one toe as the plan gives it: where the nominal stress comes from and the textbook
// infinite-life weld check, for the side-by-side comparison with the hot-spot result (docs/nominal-method.md).
#pragma once

#include <string>
#include <vector>

namespace toehold {

// [toe.nominal] of one [[toe]]: absent when the toe has no nominal-stress check.
struct ToeNominalPlan {
  unsigned line = 0;  // line of the [toe.nominal] table, for messages
};

// An analyst-defined material from a [[material]] table, named by toes' nominal checks.
struct MaterialPlan {
  std::string name;
  unsigned line = 0;  // line of the [[material]] table, for messages
};

}  // namespace toehold
