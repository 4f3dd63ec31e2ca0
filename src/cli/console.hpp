// The terminal side of toehold: a Reporter that writes remarks to stderr, collects warnings for the end, and
// shows progress only when stderr is a terminal.
#pragma once

#include "toehold/common/reporter.hpp"

#include <string>
#include <vector>

namespace toehold::cli {

class ConsoleReporter final : public Reporter {
public:
  explicit ConsoleReporter(bool quiet);
  void info(const std::string& message) override;
  void warn(const std::string& message) override;
  void progress(const std::string& what, std::size_t done, std::size_t total) override;
  const std::vector<std::string>& warnings() const { return warnings_; }

private:
  bool quiet_;
  bool interactive_;
  std::vector<std::string> warnings_;
};

// Exit codes, documented in README and docs/cli.md.
enum ExitCode : int {
  kPass = 0,          // assessment done; every station has a result and none exceeds
  kExceeds = 1,       // assessment done; at least one station exceeds its allowable
  kInputError = 2,    // bad input or I/O failure; nothing written
  kIncomplete = 3,    // assessment done; none exceeds, but some stations have no result
  kInternalError = 4  // a bug: please report it with the plan and model
};

}  // namespace toehold::cli
