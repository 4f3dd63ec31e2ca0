// CalculiX .frd result files read directly: nodes, elements (with their material numbers) and the DISP and
// STRESS blocks of one result step, as a VTK unstructured grid in VTK's node order. ASCII files only, with node
// and element numbers 5 or 10 digits wide (the .frd "short" and "long" formats; ccx 2.20 writes the long one).
#pragma once

#include <vtkSmartPointer.h>
#include <vtkUnstructuredGrid.h>

#include <map>
#include <string>
#include <vector>

namespace toehold {

// One result step of a .frd: the result blocks (100C records) that share one step number, in file order.
struct FrdStep {
  int number = 0;                   // the step number of the 100C headers (ccx counts its outputs from 1)
  double value = 0.0;               // the step value of the headers: total time of a static step, solver's unit
  std::vector<std::string> blocks;  // names of the result blocks: "DISP", "STRESS", "ERROR", ...
  int line = 0;                     // line of the step's first 100C header, 1-based
};

// What a .frd holds, with one step's results on the grid.
struct FrdModel {
  // Points in the file's length unit (double), cells in VTK node order. Point data: "stress" (6 components named
  // XX YY ZZ XY YZ XZ, the file's SXX SYY SZZ SXY SYZ SZX, in the file's stress unit), "displacement" (X Y Z, when
  // the step has a DISP block) and "frd node" (the file's node numbers). Cell data: "frd element" (element
  // numbers) and "frd material" (the element's material number, usable as a region array).
  vtkSmartPointer<vtkUnstructuredGrid> grid;
  std::vector<FrdStep> steps;            // every result step of the file
  int step = 0;                          // index into steps of the step on the grid
  std::map<int, std::string> materials;  // material number -> name (the file's 1UMAT records)
  long long unused_nodes = 0;            // nodes no element uses; left out of the grid
  std::map<std::string, long long> element_types;  // element type name ("20-node hexahedron") -> count
};

// Reads `path` with the results of step `step` (0-based, in file order; -1: the file must have exactly one
// step). Throws Error naming the file and line for a truncated, binary or corrupt file, an unknown element type,
// a step that does not exist, a step without a STRESS block, or a stress value missing at a node.
FrdModel read_frd(const std::string& path, int step);

// Only the steps of `path` (no grid is built), for listing them. Throws as read_frd does for a corrupt file.
std::vector<FrdStep> frd_steps(const std::string& path);

}  // namespace toehold
