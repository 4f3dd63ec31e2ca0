// Writes an assessment's results for viewing, review and post-processing: stations and read-out paths as VTK
// polydata, the model with the station utilization on its nodes, a ParaView collection opening all three, a CSV
// table of the stations, results.json, the HTML report and a ParaView script. docs/outputs.md describes every file;
// coordinates go back to the model's length unit. Every file carries the run's provenance.
#pragma once

#include "toehold/assess/assessment.hpp"
#include "toehold/common/units.hpp"
#include "toehold/model/mesh.hpp"
#include "toehold/output/output_folder.hpp"

#include <functional>
#include <string>
#include <vector>

namespace toehold {

// The result files, in the order they are written.
inline constexpr const char* kStationsVtp = "stations.vtp";
inline constexpr const char* kReadoutVtp = "readout.vtp";
inline constexpr const char* kModelVtu = "model.vtu";
inline constexpr const char* kResultsPvd = "results.pvd";
inline constexpr const char* kStationsCsv = "stations.csv";
inline constexpr const char* kResultsJson = "results.json";
inline constexpr const char* kReportHtml = "report.html";
inline constexpr const char* kViewScript = "view_results.py";

// Called after each result file is complete, with its file name (e.g. "stations.vtp"). A hook that throws stops
// the writing; the exception passes through write_results and no output folder is left behind.
using FileWrittenHook = std::function<void(const std::string& file_name)>;

// Writes the result files into `out` without committing it, so callers can add files (the summary) before
// OutputFolder::commit(). Returns the file names written, in order.
//   a: the assessment; positions in mm, stresses in MPa.
//   model: the mesh the assessment ran on (points in mm); copied to model.vtu with the station arrays added.
//   out_unit: length unit of coordinates and distances in the files (the model's own unit, so the results
//     overlay the model file in a viewer); stresses are written in MPa.
// Throws Error naming the file when a file cannot be written, or naming the step when two load steps share a name.
std::vector<std::string> write_result_files(const Assessment& a, const Mesh& model, OutputFolder& out,
                                            LengthUnit out_unit, const FileWrittenHook& on_file = {});

// Writes the result files into a new OutputFolder at `folder` and commits it: the folder appears complete or
// not at all, replacing an older toehold results folder. Returns the paths of the files written (inside
// `folder`). Throws Error as write_result_files and OutputFolder do.
std::vector<std::string> write_results(const Assessment& a, const Mesh& model, const std::string& folder,
                                       LengthUnit out_unit, const FileWrittenHook& on_file = {});

}  // namespace toehold
