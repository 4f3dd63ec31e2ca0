// results.json: every toe and station of an assessment with its values, read-out points, path, diagnostics and the
// run's provenance, under a schema version. docs/results-schema.md documents (and holds the JSON Schema of) every
// key; lengths are in the output length unit named in "units", stresses in MPa.
#pragma once

#include "toehold/assess/assessment.hpp"
#include "toehold/common/units.hpp"
#include "toehold/output/provenance.hpp"

#include <string>

namespace toehold {

// Version of the results.json layout: the major number changes when a key is removed or changes meaning, the minor
// number when keys are added.
inline constexpr const char* kResultsSchemaVersion = "1.2";

// The JSON text of results.json.
//   a: the assessment (positions in mm, stresses in MPa); p: its provenance;
//   out_unit: length unit of coordinates and distances in the file (the model's own, as in the VTK files).
std::string format_results_json(const Assessment& a, const Provenance& p, LengthUnit out_unit);

}  // namespace toehold
