// How the fatigue layer writes numbers into error messages and curve names: shortest "%g" form (6 digits),
// so messages read "FAT 90" and "N = 1e+07" rather than "90.000000". Internal to the fatigue layer.
#pragma once

#include <cstdio>
#include <string>

namespace toehold::fatigue_detail {

inline std::string number_text(double value) {
  char buffer[32];
  std::snprintf(buffer, sizeof buffer, "%g", value);
  return buffer;
}

}  // namespace toehold::fatigue_detail
