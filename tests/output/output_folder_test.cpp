// The output folder appears whole or not at all: files go to a hidden sibling folder until commit(), an older
// results folder survives a failed run, and a folder toehold did not write is never replaced.
#include "output/sample_results.hpp"
#include "support/support.hpp"
#include "toehold/common/error.hpp"
#include "toehold/output/output_folder.hpp"
#include "toehold/output/results_writer.hpp"

#include <unistd.h>

#include <algorithm>
#include <filesystem>
#include <functional>
#include <fstream>
#include <sstream>

namespace fs = std::filesystem;

namespace toehold::test {
namespace {

using test::error_of;

void write_text(const std::string& path, const std::string& text) {
  std::ofstream out(path);
  out << text;
}

std::string read_text(const std::string& path) {
  std::ifstream in(path);
  std::ostringstream os;
  os << in.rdbuf();
  return os.str();
}

// Names of everything in `folder`, sorted.
std::vector<std::string> listing(const fs::path& folder) {
  std::vector<std::string> names;
  for (const auto& entry : fs::directory_iterator(folder)) names.push_back(entry.path().filename().string());
  std::sort(names.begin(), names.end());
  return names;
}

// An older toehold results folder at `path` with one file in it.
void make_old_results(const std::string& path) {
  OutputFolder old(path);
  write_text(old.path_for("stations.csv"), "old results\r\n");
  old.commit();
}

TEST(OutputFolder, FilesAppearOnlyAtCommit) {
  TempDir dir;
  OutputFolder out(dir.file("results"));
  write_text(out.path_for("a.txt"), "a");
  EXPECT_FALSE(fs::exists(dir.file("results")));
  EXPECT_EQ(fs::path(out.path_for("a.txt")).parent_path().parent_path(), dir.path());
  out.commit();
  EXPECT_TRUE(out.committed());
  EXPECT_EQ(listing(dir.file("results")), (std::vector<std::string>{".toehold-results", "a.txt"}));
  EXPECT_EQ(listing(dir.path()), (std::vector<std::string>{"results"}));  // no temporary folder left
}

TEST(OutputFolder, UncommittedFolderLeavesNothing) {
  TempDir dir;
  {
    OutputFolder out(dir.file("results"));
    write_text(out.path_for("a.txt"), "a");
    EXPECT_TRUE(fs::is_directory(out.temporary_path()));
  }
  EXPECT_TRUE(listing(dir.path()).empty());
}

TEST(OutputFolder, CreatesMissingParentFolders) {
  TempDir dir;
  OutputFolder out(dir.file("runs/2024/results"));
  out.commit();
  EXPECT_TRUE(fs::is_regular_file(dir.file("runs/2024/results/.toehold-results")));
}

TEST(OutputFolder, CommitReplacesOlderResults) {
  TempDir dir;
  make_old_results(dir.file("results"));
  OutputFolder out(dir.file("results"));
  write_text(out.path_for("new.txt"), "new");
  out.commit();
  EXPECT_EQ(listing(dir.file("results")), (std::vector<std::string>{".toehold-results", "new.txt"}));
  EXPECT_EQ(listing(dir.path()), (std::vector<std::string>{"results"}));  // the old folder is gone
}

TEST(OutputFolder, EmptyExistingFolderIsUsed) {
  TempDir dir;
  fs::create_directory(dir.file("results"));
  OutputFolder out(dir.file("results/"));
  out.commit();
  EXPECT_TRUE(fs::is_regular_file(dir.file("results/.toehold-results")));
}

TEST(OutputFolder, RefusesToReplaceAForeignFolder) {
  TempDir dir;
  fs::create_directory(dir.file("thesis"));
  write_text(dir.file("thesis/chapter1.tex"), "precious");
  const std::string path = dir.file("thesis");
  EXPECT_EQ(error_of([&] { OutputFolder out(path); }),
            "output folder '" + path + "' exists and was not written by toehold (it has no .toehold-results file); "
            "choose another output folder or remove it yourself");
  EXPECT_EQ(read_text(dir.file("thesis/chapter1.tex")), "precious");
  EXPECT_EQ(listing(dir.path()), (std::vector<std::string>{"thesis"}));
}

TEST(OutputFolder, RefusesAForeignFolderThatAppearedBeforeCommit) {
  TempDir dir;
  OutputFolder out(dir.file("results"));
  fs::create_directory(dir.file("results"));
  write_text(dir.file("results/notes.txt"), "mine");
  EXPECT_NE(error_of([&] { out.commit(); }).find("exists and was not written by toehold"), std::string::npos);
  EXPECT_EQ(read_text(dir.file("results/notes.txt")), "mine");
}

TEST(OutputFolder, RefusesAFile) {
  TempDir dir;
  write_text(dir.file("results"), "a file");
  EXPECT_EQ(error_of([&] { OutputFolder out(dir.file("results")); }),
            "output folder '" + dir.file("results") + "' is an existing file, not a folder; choose another output "
            "folder");
}

TEST(OutputFolder, CannotCreateUnderAFileNamesTheFolder) {
  TempDir dir;
  write_text(dir.file("plain"), "a file");
  const std::string path = dir.file("plain/results");
  const std::string message = error_of([&] { OutputFolder out(path); });
  EXPECT_EQ(message.rfind("cannot create output folder '" + path + "': cannot create '" + dir.file("plain") + "'", 0),
            0u)
      << message;
}

TEST(OutputFolder, NotWritableParentNamesTheFolder) {
  if (::geteuid() == 0) GTEST_SKIP() << "permissions do not bind root";
  TempDir dir;
  fs::create_directory(dir.file("locked"));
  fs::permissions(dir.file("locked"), fs::perms::owner_read | fs::perms::owner_exec);
  const std::string path = dir.file("locked/results");
  const std::string message = error_of([&] { OutputFolder out(path); });
  fs::permissions(dir.file("locked"), fs::perms::owner_all);
  EXPECT_EQ(message.rfind("cannot create output folder '" + path + "'", 0), 0u) << message;
}

TEST(OutputFolder, PathForTakesPlainNamesOnly) {
  TempDir dir;
  OutputFolder out(dir.file("results"));
  EXPECT_EQ(error_of([&] { out.path_for("../escape.txt"); }),
            "output file name '../escape.txt' for output folder '" + dir.file("results") +
                "' must be a plain file name without a folder part");
  EXPECT_NE(error_of([&] { out.path_for(""); }), "no error");
}

TEST(OutputFolder, CommitTwiceIsAnError) {
  TempDir dir;
  OutputFolder out(dir.file("results"));
  out.commit();
  EXPECT_EQ(error_of([&] { out.commit(); }),
            "output folder '" + dir.file("results") + "' was committed already; write a new OutputFolder");
}

// A failure in the middle of writing (the hook throws after the second file) leaves no partial folder behind and
// the older results untouched.
TEST(OutputFolder, FailedWriteKeepsOlderResultsIntact) {
  TempDir dir;
  make_old_results(dir.file("results"));
  auto grid = sample_grid();
  const Assessment a = sample_assessment(grid);
  std::vector<std::string> seen;
  const auto hook = [&](const std::string& name) {
    seen.push_back(name);
    if (name == "readout.vtp") throw Error("disk full (simulated)");
  };
  EXPECT_EQ(error_of([&] { write_results(a, mesh_of(grid), dir.file("results"), LengthUnit::mm, hook); }),
            "disk full (simulated)");
  EXPECT_EQ(seen, (std::vector<std::string>{"stations.vtp", "readout.vtp"}));
  EXPECT_EQ(listing(dir.path()), (std::vector<std::string>{"results"}));
  EXPECT_EQ(listing(dir.file("results")), (std::vector<std::string>{".toehold-results", "stations.csv"}));
  EXPECT_EQ(read_text(dir.file("results/stations.csv")), "old results\r\n");
}

TEST(OutputFolder, FailedFirstWriteLeavesNoFolder) {
  TempDir dir;
  auto grid = sample_grid();
  const Assessment a = sample_assessment(grid);
  const auto hook = [](const std::string&) { throw Error("stop"); };
  EXPECT_EQ(error_of([&] { write_results(a, mesh_of(grid), dir.file("results"), LengthUnit::mm, hook); }), "stop");
  EXPECT_TRUE(listing(dir.path()).empty());
}

TEST(OutputFolder, SummaryCanJoinTheResultsBeforeCommit) {
  TempDir dir;
  auto grid = sample_grid();
  const Assessment a = sample_assessment(grid);
  OutputFolder out(dir.file("results"));
  const auto names = write_result_files(a, mesh_of(grid), out, LengthUnit::mm);
  write_text(out.path_for("summary.txt"), "summary");
  out.commit();
  EXPECT_EQ(names.size(), 8u);
  EXPECT_EQ(listing(dir.file("results")),
            (std::vector<std::string>{".toehold-results", "model.vtu", "readout.vtp", "report.html", "results.json",
                                      "results.pvd", "stations.csv", "stations.vtp", "summary.txt",
                                      "view_results.py"}));
}

}  // namespace
}  // namespace toehold::test
