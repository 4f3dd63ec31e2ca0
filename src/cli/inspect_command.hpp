// `toehold inspect MODEL`: what is in a model file, for an analyst seeing it for the first time.
#pragma once

#include <CLI/CLI.hpp>

#include <string>

namespace toehold::cli {

struct InspectOptions {
  std::string model;
};

void setup_inspect(CLI::App& app, InspectOptions& options);
int run_inspect(const InspectOptions& options);

}  // namespace toehold::cli
