// `toehold curve NAME [--cycles N] [--range DS]`: a quick look-up of a catalogue S-N curve: its source and
// edition, segments and knees, the allowable range at N cycles and the life at a stress range.
#pragma once

#include <CLI/CLI.hpp>

#include <optional>
#include <string>

namespace toehold::cli {

struct CurveOptions {
  std::string name;               // as in a plan's curve key, e.g. "IIW FAT 90"
  std::optional<double> cycles;   // N, > 0: print the allowable range there
  std::optional<double> range;    // MPa, >= 0: print the cycles to failure
};

void setup_curve(CLI::App& app, CurveOptions& options);
int run_curve(const CurveOptions& options);

// The text run_curve prints (for tests).
std::string format_curve(const CurveOptions& options);

}  // namespace toehold::cli
