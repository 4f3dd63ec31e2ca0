#include "inspect_command.hpp"

#include "console.hpp"
#include "toehold/model/inspect.hpp"

#include <cstdio>

namespace toehold::cli {

void setup_inspect(CLI::App& app, InspectOptions& options) {
  auto* sub = app.add_subcommand("inspect", "Show what a model file holds: cells, bounds, arrays, likely stress and "
                                            "marker arrays");
  sub->add_option("model", options.model, "a .vtu, .pvtu, .vtk or .pvd file")->required();
}

int run_inspect(const InspectOptions& options) {
  ConsoleReporter reporter(false);
  const ModelSummary summary = inspect_model(options.model, reporter);
  std::fputs(format_summary(summary).c_str(), stdout);
  return kPass;
}

}  // namespace toehold::cli
