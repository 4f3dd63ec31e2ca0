// Runs the project's JSON schema checker (tests/e2e/report_schema_check.py against the schema in
// docs/results-schema.md) on a results.json text, for the output tests.
#pragma once

#include "support/support.hpp"

#include <sys/wait.h>

#include <cstdio>
#include <fstream>
#include <string>

namespace toehold::test {

// The checker's exit code (0 valid, 1 invalid, -1 could not run); its output goes into `said`.
inline int check_schema(const std::string& json, std::string& said) {
  TempDir dir;
  std::ofstream(dir.file("results.json"), std::ios::binary) << json;
  const std::string command = std::string(TOEHOLD_PYTHON) + " " + TOEHOLD_SOURCE_DIR +
                              "/tests/e2e/report_schema_check.py " + dir.file("results.json") + " " +
                              TOEHOLD_SOURCE_DIR + "/docs/results-schema.md 2>&1";
  FILE* pipe = popen(command.c_str(), "r");
  if (!pipe) return -1;
  char buffer[512];
  while (std::fgets(buffer, sizeof buffer, pipe)) said += buffer;
  const int status = pclose(pipe);
  return WIFEXITED(status) ? WEXITSTATUS(status) : -1;
}

}  // namespace toehold::test
