// Provenance of a run: what made the results and from what. Tool version, the date (UTC), the platform, the plan
// verbatim, every input file with its size and SHA-256, and every default the plan reader applied. The report,
// results.json and the VTK field data all carry it.
#pragma once

#include "toehold/assess/assessment.hpp"

#include <cstdint>
#include <string>
#include <vector>

namespace toehold {

// One file the run read.
struct InputFileRecord {
  std::string role;             // "plan", "model" (a model or load-step file) or "load history"
  std::string path;             // as the run used it
  std::uintmax_t size_bytes = 0;  // bytes; 0 when the file could not be read
  std::string sha256;           // 64 lowercase hexadecimal digits; "" when the file could not be read
  std::string problem;          // why it could not be read now (e.g. removed since); "" when it was read

  bool read() const { return problem.empty(); }
};

struct Provenance {
  std::string tool_version;                 // TOEHOLD_VERSION, e.g. "0.1.0"
  std::string written_utc;                  // ISO 8601 UTC, "2024-05-01T12:00:00Z"
  std::string platform;                     // uname: system, release, version, machine
  std::string plan_path;                    // the plan file as given
  std::string plan_text;                    // verbatim
  std::vector<InputFileRecord> files;       // the plan first, then model files in reading order, then histories
  std::vector<std::string> defaults_applied;  // Plan::defaults_applied
};

// Collects the provenance of `a` now: reads and hashes every input file (a file that cannot be read is recorded
// with its problem, never thrown), takes the current time and the platform.
Provenance collect_provenance(const Assessment& a);

// The provenance as text lines for the VTK field data "toehold provenance": "toehold <version>", "plan: <path>",
// "input: <path>" per model file, "written: <time>", then "platform: ...", one "sha256: <digest> <bytes> bytes
// <role> <path>" per file, "default: <text>" per default applied, and "plan | <line>" per line of the plan.
std::vector<std::string> provenance_lines(const Provenance& p);

// The current time in UTC, ISO 8601 ("2024-05-01T12:00:00Z").
std::string utc_now();

}  // namespace toehold
