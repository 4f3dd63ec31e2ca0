#include "console.hpp"

#include <cstdio>
#include <unistd.h>

namespace toehold::cli {

ConsoleReporter::ConsoleReporter(bool quiet) : quiet_(quiet), interactive_(::isatty(STDERR_FILENO) != 0) {}

void ConsoleReporter::info(const std::string& message) {
  if (!quiet_) std::fprintf(stderr, "%s\n", message.c_str());
}

void ConsoleReporter::warn(const std::string& message) { warnings_.push_back(message); }

void ConsoleReporter::progress(const std::string& what, std::size_t done, std::size_t total) {
  if (quiet_ || !interactive_ || total == 0) return;
  std::fprintf(stderr, "\r%s: %zu of %zu", what.c_str(), done, total);
  if (done >= total) std::fprintf(stderr, "\n");
  std::fflush(stderr);
}

}  // namespace toehold::cli
