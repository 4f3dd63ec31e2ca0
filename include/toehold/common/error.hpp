// The one error type of toehold: bad input and I/O failures.
// Messages name the file, array, toe, station or cell concerned and say what to do about it.
#pragma once

#include <stdexcept>
#include <string>

namespace toehold {

class Error : public std::runtime_error {
public:
  using std::runtime_error::runtime_error;
};

}  // namespace toehold
