// toehold: weld-toe hot-spot stress fatigue assessment from finite-element results. The command-line front end.
#include "console.hpp"
#include "curve_command.hpp"
#include "inspect_command.hpp"
#include "run_command.hpp"
#include "toehold/common/error.hpp"

#include <CLI/CLI.hpp>

#include <cstdio>
#include <exception>

int main(int argc, char** argv) {
  using namespace toehold::cli;
  CLI::App app{"toehold: structural hot-spot stress fatigue assessment of weld toes from FE results (VTK files)"};
  app.set_version_flag("--version", std::string("toehold ") + TOEHOLD_VERSION);
  app.require_subcommand(1);
  InspectOptions inspect;
  RunOptions run;
  setup_inspect(app, inspect);
  setup_run(app, run);
  CurveOptions curve;
  setup_curve(app, curve);
  try {
    app.parse(argc, argv);
  } catch (const CLI::ParseError& e) {
    const int code = app.exit(e);
    return code == 0 ? kPass : kInputError;
  }
  try {
    if (app.got_subcommand("inspect")) return run_inspect(inspect);
    if (app.got_subcommand("curve")) return run_curve(curve);
    return run_run(run);
  } catch (const toehold::Error& e) {
    std::fprintf(stderr, "toehold: error: %s\n", e.what());
    return kInputError;
  } catch (const std::exception& e) {
    std::fprintf(stderr, "toehold: internal error: %s (please report it with the plan and model)\n", e.what());
    return kInternalError;
  }
}
