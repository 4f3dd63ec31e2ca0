#include "run_command.hpp"

#include "console.hpp"
#include "toehold/assess/assessment.hpp"
#include "toehold/common/error.hpp"
#include "toehold/output/results_writer.hpp"
#include "toehold/output/summary.hpp"
#include "toehold/plan/plan.hpp"

#include <cstdio>
#include <filesystem>

namespace toehold::cli {
namespace {

void apply_overrides(const RunOptions& o, Plan& plan) {
  if (!o.output.empty()) plan.output_folder = std::filesystem::absolute(o.output).lexically_normal().string();
  if (o.cycles) {
    if (!(*o.cycles > 0)) throw Error("--cycles must be a positive number of cycles");
    plan.requirement.cycles = *o.cycles;
  }
  if (o.gamma_M) {
    if (!(*o.gamma_M >= 1.0)) throw Error("--gamma-M must be at least 1");
    plan.requirement.gamma_M = *o.gamma_M;
  }
  if (o.gamma_F) {
    if (!(*o.gamma_F > 0.0)) throw Error("--gamma-F must be positive");
    plan.requirement.gamma_F = *o.gamma_F;
  }
}

}  // namespace

void setup_run(CLI::App& app, RunOptions& options) {
  auto* sub = app.add_subcommand("run", "Run an assessment plan (TOML) and write its results");
  sub->add_option("plan", options.plan, "the assessment plan, a .toml file (see docs/plan.md)")->required();
  sub->add_option("-o,--output", options.output, "output folder (overrides [output] folder)");
  sub->add_option("--cycles", options.cycles, "required cycles (overrides [requirement] cycles)");
  sub->add_option("--gamma-M", options.gamma_M, "partial factor on resistance (overrides [requirement] gamma_M)");
  sub->add_option("--gamma-F", options.gamma_F, "partial factor on load (overrides [requirement] gamma_F)");
  sub->add_flag("-q,--quiet", options.quiet, "print only the summary");
}

int run_run(const RunOptions& options) {
  ConsoleReporter reporter(options.quiet);
  Plan plan = read_plan(options.plan);
  apply_overrides(options, plan);
  const Assessment assessment = run_assessment(plan, reporter);
  const auto files = write_results(assessment, assessment.model, plan.output_folder, plan.model.length_unit);
  std::fputs(format_assessment_summary(assessment, plan.output_folder, files).c_str(), stdout);
  if (assessment.stations_exceeding() > 0) return kExceeds;
  if (assessment.stations_without_result() > 0) return kIncomplete;
  return kPass;
}

}  // namespace toehold::cli
