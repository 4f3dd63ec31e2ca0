// Private to src/model: the two halves of read_mesh, shared with inspect_model. read_raw reads a data file
// (.vtu, .pvtu, legacy .vtk, CalculiX .frd) as the solver wrote it; clean_model removes the solver quirks and converts units.
#pragma once

#include "toehold/model/mesh.hpp"

#include <vtkSmartPointer.h>
#include <vtkUnstructuredGrid.h>

#include <map>
#include <string>
#include <vector>

namespace toehold::detail {

// A data file as written: its distinct pieces (one for .vtu and .vtk), before any cleaning.
struct RawModel {
  std::string file;                                          // as the user named it
  std::vector<vtkSmartPointer<vtkUnstructuredGrid>> pieces;  // each distinct piece once
  std::vector<std::string> piece_files;                      // file of each piece (== file for .vtu/.vtk)
  int repeated_pieces = 0;                                   // pieces a .pvtu listed again
  bool merge_pieces = false;                                 // .pvtu: merge coincident points of pieces
  std::vector<std::string> notes;                            // facts about the file worth an info line (.frd)
  int steps = 0;                                             // result steps in the file (.frd), 0 otherwise
};

// What cleaning did, counted.
struct CleanStats {
  int repeated_pieces = 0;
  long long ghost_cells = 0;
  std::map<std::string, long long> lower_dimension;  // cell type name -> cells dropped
  long long merged_points = 0;                       // points of a piece found in an earlier piece
  long long unused_points = 0;                       // points no kept cell uses (pieces only)
  bool float32_points = false;
};

struct CleanModel {
  vtkSmartPointer<vtkUnstructuredGrid> grid;  // volume cells only, double points scaled to mm
  CleanStats stats;
};

// Reads `data_file` (not a .pvd); `step` picks the result step of a .frd (0-based, -1: the file has one step)
// and is ignored for the other formats. Throws Error naming the file for a missing, unreadable, corrupt or
// truncated file or one that holds no unstructured grid. VTK's own messages never reach stderr.
RawModel read_raw(const std::string& data_file, int step = -1);

// A CalculiX .frd with the results of `step` (see read_frd in toehold/model/frd_reader.hpp) as a one-piece
// model; its notes say which step was read and how many nodes no element uses were left out.
RawModel read_frd_raw(const std::string& file, int step);

// Volume cells of `raw` without ghost cells, points multiplied by `scale` (mm per file length unit). Throws
// Error naming the file and cell for an unsupported cell type, and when no volume cell is left.
CleanModel clean_model(const RawModel& raw, double scale);

// The quirks cleaned, one phrase each ("dropped 1 repeated piece", ...); empty when there were none.
std::vector<std::string> describe(const CleanStats& stats);

// The steps of a .pvd in file order: each DataSet is a step, unless the file uses the `part` attribute, when
// the DataSets of one timestep form one step.
std::vector<std::vector<SeriesEntry>> series_steps(const std::vector<SeriesEntry>& entries);

// Checks that `path` names an existing regular file; throws Error naming it otherwise.
void require_file(const std::string& path);

}  // namespace toehold::detail
