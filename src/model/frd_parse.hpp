// Private to src/model: the text of a CalculiX .frd parsed into its records (nodes, elements, result steps and
// the DISP/STRESS values of one step), before any VTK grid is built. Also the table of .frd element types.
#pragma once

#include "toehold/model/frd_reader.hpp"

#include <array>
#include <map>
#include <string>
#include <vector>

namespace toehold::detail {

// One .frd element type: its VTK cell type and where each VTK node sits in the .frd's node list.
struct FrdElementType {
  int code = 0;                 // the .frd type number (1 = 8-node hexahedron, ...)
  int vtk_type = 0;             // VTK cell-type code
  int nodes = 0;                // nodes per element
  std::array<int, 20> from{};   // VTK node k is the element's .frd node from[k] (0-based)
  const char* name = "";
};

// The type with .frd number `code`, or nullptr when toehold does not know it.
const FrdElementType* frd_element_type(int code);

struct FrdElement {
  long long number = 0;
  int type = 0;                  // .frd type number
  int material = 0;              // the element record's material number
  int line = 0;                  // 1-based line of its "-1" record
  std::vector<long long> nodes;  // node numbers in .frd order
};

// The values of one result block at the nodes it lists.
struct FrdBlock {
  std::string name;              // "DISP", "STRESS"
  int line = 0;                  // 1-based line of its 100C header
  int components = 0;            // stored components per node (derived ones such as ALL are not stored)
  std::map<long long, std::size_t> row;  // node number -> row in values
  std::vector<double> values;    // row-major, `components` per node, in the file's order of components
};

struct FrdData {
  std::vector<long long> node_ids;          // node numbers in file order
  std::vector<std::array<double, 3>> xyz;   // their coordinates, file length unit
  std::vector<FrdElement> elements;         // in file order
  std::vector<FrdStep> steps;               // every result step
  std::map<int, std::string> materials;     // 1UMAT records
  std::vector<FrdBlock> kept;               // DISP and STRESS of the kept step (first block of each name)
};

// Parses `path`; keeps the DISP and STRESS values of step index `keep_step` (0-based; -1 keeps none). Throws
// Error naming the file and line for a binary, truncated or corrupt file and for an unknown element type.
FrdData parse_frd(const std::string& path, int keep_step);

}  // namespace toehold::detail
