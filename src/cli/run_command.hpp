// `toehold run PLAN`: runs an assessment plan, writes the output folder, prints the summary.
#pragma once

#include <CLI/CLI.hpp>

#include <optional>
#include <string>

namespace toehold::cli {

struct RunOptions {
  std::string plan;
  std::string output;                // overrides [output] folder
  std::optional<double> cycles;      // overrides [requirement] cycles
  std::optional<double> gamma_M;     // overrides [requirement] gamma_M
  std::optional<double> gamma_F;     // overrides [requirement] gamma_F
  bool quiet = false;
};

void setup_run(CLI::App& app, RunOptions& options);
int run_run(const RunOptions& options);

}  // namespace toehold::cli
