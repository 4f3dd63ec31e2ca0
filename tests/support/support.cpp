#include "support/support.hpp"

#include "toehold/common/error.hpp"

#include <algorithm>
#include <atomic>
#include <cmath>
#include <sstream>
#include <unistd.h>

namespace toehold::test {

::testing::AssertionResult near(double actual, double expected, double tol) {
  const double scale = std::max(1.0, std::abs(expected));
  if (std::abs(actual - expected) <= tol * scale) return ::testing::AssertionSuccess();
  std::ostringstream os;
  os.precision(15);
  os << actual << " differs from " << expected << " by " << std::abs(actual - expected) << " (allowed "
     << tol * scale << ")";
  return ::testing::AssertionFailure() << os.str();
}

std::string error_of(const std::function<void()>& f) {
  try {
    f();
  } catch (const Error& e) {
    return e.what();
  }
  return "no error";
}

TempDir::TempDir() {
  static std::atomic<int> counter{0};
  path_ = std::filesystem::temp_directory_path() /
          ("toehold-test-" + std::to_string(::getpid()) + "-" + std::to_string(counter++));
  std::filesystem::remove_all(path_);
  std::filesystem::create_directories(path_);
}

TempDir::~TempDir() {
  std::error_code ec;
  std::filesystem::remove_all(path_, ec);
}

}  // namespace toehold::test
