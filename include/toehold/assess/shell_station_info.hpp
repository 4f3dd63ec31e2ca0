// What a station of a shell model adds to a station result: which stress layer it reads and where its hot spot
// lies relative to the plate intersection line.
#pragma once

#include <string>

namespace toehold {

struct ShellStationInfo {
  std::string layer;  // "top" or "bottom"
};

}  // namespace toehold
