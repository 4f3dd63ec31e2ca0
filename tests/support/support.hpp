// Test helpers shared by all test files: one tolerance check, one temporary folder.
#pragma once

#include <gtest/gtest.h>

#include <filesystem>
#include <functional>
#include <string>

namespace toehold::test {

// Relative-or-absolute closeness: |a - b| <= tol * max(1, |b|). Use for every floating comparison.
::testing::AssertionResult near(double actual, double expected, double tol);

#define EXPECT_CLOSE(actual, expected, tol) EXPECT_TRUE(::toehold::test::near((actual), (expected), (tol)))

// The message of the toehold::Error that `f` throws, or "no error". For checking messages word for word.
std::string error_of(const std::function<void()>& f);

// A fresh empty folder under the system temp dir, removed when the object goes away.
class TempDir {
public:
  TempDir();
  ~TempDir();
  TempDir(const TempDir&) = delete;
  TempDir& operator=(const TempDir&) = delete;
  const std::filesystem::path& path() const { return path_; }
  std::string file(const std::string& name) const { return (path_ / name).string(); }

private:
  std::filesystem::path path_;
};

}  // namespace toehold::test
