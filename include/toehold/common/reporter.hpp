// How the core library tells the front end about progress and warnings without printing itself.
// The CLI implements it; tests use NullReporter or a recording one.
#pragma once

#include <cstddef>
#include <string>

namespace toehold {

class Reporter {
public:
  virtual ~Reporter() = default;
  // A remark worth showing as the work goes on.
  virtual void info(const std::string& message) = 0;
  // Something the analyst must look at; collected and shown together at the end.
  virtual void warn(const std::string& message) = 0;
  // Progress of a long task: done of total units of `what`.
  virtual void progress(const std::string& what, std::size_t done, std::size_t total) = 0;
};

class NullReporter final : public Reporter {
public:
  void info(const std::string&) override {}
  void warn(const std::string&) override {}
  void progress(const std::string&, std::size_t, std::size_t) override {}
};

}  // namespace toehold
