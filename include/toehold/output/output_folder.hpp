// An output folder that appears whole or not at all: files are written into a temporary sibling folder, and
// commit() renames it into place, replacing an older toehold results folder. A folder without toehold's marker
// file is never replaced, and a folder that was never committed leaves nothing behind.
#pragma once

#include <string>

namespace toehold {

class OutputFolder {
public:
  // Name of the marker file that tells a toehold results folder from any other folder.
  static constexpr const char* kMarkerName = ".toehold-results";

  // Creates the temporary folder `.<name>.toehold-partial-<n>` next to `final_path` (creating missing parent
  // folders) and writes the marker into it. Throws Error naming the folder when it cannot be created or written
  // to, when `final_path` is an existing file, or when it is an existing non-empty folder without the marker.
  explicit OutputFolder(std::string final_path);
  // Removes the temporary folder and everything in it unless commit() succeeded.
  ~OutputFolder();
  OutputFolder(const OutputFolder&) = delete;
  OutputFolder& operator=(const OutputFolder&) = delete;

  // Where to write `file_name` (a plain file name, no folder part) before the commit: inside the temporary folder.
  // Throws Error for an empty name, "." or "..", or a name with a folder separator.
  std::string path_for(const std::string& file_name) const;

  // Moves the temporary folder to the final path. An older toehold results folder (or an empty folder) there is
  // replaced; it is kept intact if the move fails. Throws Error naming the folder when the final path is not ours
  // (no marker file), when it was committed already, or when a rename fails.
  void commit();

  const std::string& final_path() const { return final_; }
  const std::string& temporary_path() const { return temp_; }
  bool committed() const { return committed_; }

private:
  std::string final_;
  std::string temp_;
  bool committed_ = false;
};

}  // namespace toehold
