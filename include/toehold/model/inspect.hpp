// What is in a model file, for an analyst seeing it for the first time: cell types and counts, bounds,
// arrays with their components, which arrays look like stress tensors, which integer arrays could mark toes.
#pragma once

#include "toehold/common/reporter.hpp"

#include <string>
#include <vector>

namespace toehold {

struct ArrayInfo {
  std::string name;
  bool point_data = true;                   // false: cell data
  int components = 1;
  std::vector<std::string> component_names;  // empty names where the file gives none
  std::string value_type;                   // "Float64", "Int32", ...
  double min = 0.0, max = 0.0;               // range of component 0 (or magnitude for vectors)
  bool integer = false;                     // integer-valued type
  std::string looks_like;                   // "stress tensor (order from names: ...)", "toe or region marker (values 1, 2)", ...
};

struct CellCount {
  int vtk_type = 0;
  std::string name;
  long long count = 0;
};

struct ModelSummary {
  std::string file;
  long long points = 0;
  long long cells = 0;
  std::vector<CellCount> cell_types;  // as found in the file, before cleaning
  double bounds[6] = {0, 0, 0, 0, 0, 0};  // xmin, xmax, ymin, ymax, zmin, zmax in the file's length unit
  std::vector<ArrayInfo> arrays;
  std::vector<std::string> remarks;  // quirks found: ghost cells, repeated pieces, lower-dimension cells, Float32
  int pvd_steps = 0;                 // number of steps when the file is a .pvd
};

// Looks at `path` (.vtu, .pvtu, .vtk or .pvd: its first step) without converting units.
ModelSummary inspect_model(const std::string& path, Reporter& reporter);

// Human-readable multi-line text of a summary.
std::string format_summary(const ModelSummary& summary);

}  // namespace toehold
