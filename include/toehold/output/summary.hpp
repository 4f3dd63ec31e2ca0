// The console summary of an assessment as text: a fixed-column table with the worst station of each toe, the
// counts, where the outputs are, the caution, and the warnings grouped at the end. The CLI prints it.
#pragma once

#include "toehold/assess/assessment.hpp"

#include <string>
#include <vector>

namespace toehold {

// The caution every summary, report and README carries.
extern const char* const kCaution;

// `output_folder` and `files` name what was written ("" / empty when nothing was).
std::string format_assessment_summary(const Assessment& assessment, const std::string& output_folder,
                                      const std::vector<std::string>& files);

}  // namespace toehold
