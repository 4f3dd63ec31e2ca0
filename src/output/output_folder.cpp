// The all-or-nothing output folder: a temporary sibling folder, a marker file, and a commit by renames.
#include "toehold/output/output_folder.hpp"

#include "toehold/common/error.hpp"

#include <unistd.h>

#include <atomic>
#include <filesystem>
#include <fstream>
#include <system_error>

namespace fs = std::filesystem;

namespace toehold {
namespace {

std::atomic<unsigned> g_sibling_counter{0};

// `path` made absolute and without a trailing separator, so it has a parent and a name.
fs::path normalized(const std::string& path) {
  if (path.empty()) throw Error("the output folder path is empty; give a folder name");
  fs::path p = fs::absolute(fs::path(path)).lexically_normal();
  if (p.filename().empty()) p = p.parent_path();
  if (p.filename().empty() || p == p.root_path())
    throw Error("output folder '" + path + "' is a file system root; give a folder below it");
  return p;
}

bool is_ours(const fs::path& folder) {
  std::error_code ec;
  return fs::is_regular_file(folder / OutputFolder::kMarkerName, ec);
}

bool is_empty_folder(const fs::path& folder) {
  std::error_code ec;
  return fs::is_empty(folder, ec) && !ec;
}

// Throws unless `final_path` is absent, empty, or a toehold results folder. `shown` is the path as given.
void require_replaceable(const fs::path& final_path, const std::string& shown) {
  std::error_code ec;
  const fs::file_status status = fs::symlink_status(final_path, ec);
  if (ec || status.type() == fs::file_type::not_found) return;
  if (status.type() == fs::file_type::symlink)
    throw Error("output folder '" + shown + "' is a symbolic link; give the folder it points to, or another name");
  if (status.type() != fs::file_type::directory)
    throw Error("output folder '" + shown + "' is an existing file, not a folder; choose another output folder");
  if (!is_ours(final_path) && !is_empty_folder(final_path))
    throw Error("output folder '" + shown + "' exists and was not written by toehold (it has no " +
                OutputFolder::kMarkerName + " file); choose another output folder or remove it yourself");
}

// A new, unused sibling path of `p`: `.<name>.toehold-<tag>-<pid>-<n>`.
fs::path sibling(const fs::path& p, const std::string& tag) {
  for (;;) {
    std::string name = ".";
    name += p.filename().string();
    name += ".toehold-" + tag + "-" + std::to_string(getpid()) + "-" + std::to_string(g_sibling_counter++);
    fs::path candidate = p.parent_path() / name;
    std::error_code ec;
    if (!fs::exists(fs::symlink_status(candidate, ec))) return candidate;
  }
}

void create_parent(const fs::path& p, const std::string& shown) {
  std::error_code ec;
  fs::create_directories(p.parent_path(), ec);
  if (ec)
    throw Error("cannot create output folder '" + shown + "': cannot create '" + p.parent_path().string() +
                "' (" + ec.message() + "); check the path and its permissions");
}

void write_marker(const fs::path& folder) {
  std::ofstream out(folder / OutputFolder::kMarkerName);
  out << "Written by toehold " << TOEHOLD_VERSION
      << ". toehold replaces this folder when it writes results here again.\n";
  out.close();
  if (!out) throw std::system_error(std::make_error_code(std::errc::io_error));
}

}  // namespace

OutputFolder::OutputFolder(std::string final_path) : final_(std::move(final_path)) {
  const fs::path target = normalized(final_);
  require_replaceable(target, final_);
  create_parent(target, final_);
  const fs::path temp = sibling(target, "partial");
  std::error_code ec;
  if (!fs::create_directory(temp, ec) || ec)
    throw Error("cannot create output folder '" + final_ + "': cannot create '" + temp.string() + "' (" +
                (ec ? ec.message() : std::string("it exists")) + "); check that '" + target.parent_path().string() +
                "' is writable");
  temp_ = temp.string();
  try {
    write_marker(temp);
  } catch (const std::exception&) {
    fs::remove_all(temp, ec);
    temp_.clear();
    throw Error("output folder '" + final_ + "' is not writable: cannot write files in '" +
                target.parent_path().string() + "'; check its permissions and free space");
  }
}

OutputFolder::~OutputFolder() {
  if (committed_ || temp_.empty()) return;
  std::error_code ec;
  fs::remove_all(temp_, ec);
}

std::string OutputFolder::path_for(const std::string& file_name) const {
  if (file_name.empty() || file_name == "." || file_name == ".." ||
      file_name.find_first_of("/\\") != std::string::npos)
    throw Error("output file name '" + file_name + "' for output folder '" + final_ +
                "' must be a plain file name without a folder part");
  return (fs::path(temp_) / file_name).string();
}

void OutputFolder::commit() {
  if (committed_) throw Error("output folder '" + final_ + "' was committed already; write a new OutputFolder");
  const fs::path target = normalized(final_);
  require_replaceable(target, final_);
  std::error_code ec;
  fs::path old;
  if (fs::exists(fs::symlink_status(target, ec))) {
    old = sibling(target, "old");
    fs::rename(target, old, ec);
    if (ec)
      throw Error("cannot replace output folder '" + final_ + "' (" + ec.message() +
                  "); check that it and its parent folder are writable");
  }
  fs::rename(temp_, target, ec);
  if (ec) {
    std::error_code ignored;
    if (!old.empty()) fs::rename(old, target, ignored);
    throw Error("cannot move the results into output folder '" + final_ + "' (" + ec.message() +
                "); the older folder was kept");
  }
  committed_ = true;
  if (!old.empty()) fs::remove_all(old, ec);
}

}  // namespace toehold
