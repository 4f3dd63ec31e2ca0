// The nominal-stress parts of a plan: [[material]] tables and each toe's [toe.nominal] table.
#include "plan_sections.hpp"
#include "toehold/common/error.hpp"

namespace toehold::plan_detail {

std::vector<MaterialPlan> read_materials(const Context& ctx, const toml::table& root) {
  if (!section_array(ctx, root, "material").empty())
    throw Error(location(ctx.file, 0) + "[[material]] tables are not read yet");
  return {};
}

std::optional<ToeNominalPlan> read_toe_nominal(const Context&, const Fields& f, const ToePlan&,
                                               const std::vector<MaterialPlan>&) {
  if (f.has("nominal")) f.fail_key("nominal", "is not read yet");
  return std::nullopt;
}

}  // namespace toehold::plan_detail
