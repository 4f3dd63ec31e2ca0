// Private to src/output: the writers of the single result files and what they share (length conversion,
// provenance lines, the array names). results_writer.cpp runs them in order; docs/outputs.md lists every name.
#pragma once

#include "toehold/assess/assessment.hpp"
#include "toehold/model/mesh.hpp"

#include <string>
#include <vector>

#include <vtkSmartPointer.h>

class vtkDataObject;
class vtkOutputStream;
class vtkXMLWriter;

namespace toehold::detail {

// What every result file needs.
struct OutputContext {
  const Assessment* a = nullptr;
  double mm_per_unit = 1.0;             // mm in one output length unit: divide a length in mm by this
  std::string unit;                     // name of the output length unit ("mm", "m", "in")
  std::vector<std::string> provenance;  // "toehold 0.1.0", "plan: ...", "written: ..." (see provenance_lines)

  double length(double mm) const { return mm / mm_per_unit; }
  // `what` followed by the output length unit in brackets, e.g. "arc length [m]".
  std::string length_name(const std::string& what) const { return what + " [" + unit + "]"; }
};

// Tool version, plan path, input files and the current UTC time (ISO 8601), one line each.
std::vector<std::string> provenance_lines(const Assessment& a);

// Array and field names shared by more than one file.
inline constexpr const char* kToeNumber = "toe number";
inline constexpr const char* kStationId = "station id";
inline constexpr const char* kToeNames = "toe names";
inline constexpr const char* kLoadSteps = "load steps";
inline constexpr const char* kProvenance = "toehold provenance";
inline constexpr const char* kUtilization = "utilization [-]";
inline constexpr const char* kStationUtilization = "station utilization [-]";
inline std::string hot_spot_name(const std::string& step) { return "hot-spot stress " + step + " [MPa]"; }
inline std::string normal_stress_name(const std::string& step) { return "normal stress " + step + " [MPa]"; }

// True when at least one toe has a nominal-stress check ([toe.nominal]): the files then carry its columns.
inline bool has_nominal(const Assessment& a) {
  for (const auto& t : a.toes)
    if (t.nominal) return true;
  return false;
}

// True when the model is a shell model (some toe reads a shell layer): the files then carry the shell columns.
inline bool has_shell(const Assessment& a) {
  for (const auto& t : a.toes)
    if (t.plan.shell) return true;
  return false;
}

// True when at least one toe asks for through-thickness linearization: the files then carry its columns.
inline bool has_linearization(const Assessment& a) {
  for (const auto& t : a.toes)
    if (t.plan.through_thickness) return true;
  return false;
}

// The linearized structural range over the surface hot-spot range of a station: NaN when either side has no
// value (no result, no line, unit-cases, a zero surface range).
double linearized_ratio(const StationResult& s);

// The status column and flag of a station: "ok", "exceeds", or "no result: <problem>".
std::string station_status(const StationResult& s);

// `name` with the characters VTK 9.1 writes unescaped into XML attributes replaced: '"' -> ''', '<' -> '(',
// '>' -> ')', '&' -> '+'. Every array name toehold writes into a VTK file goes through this.
std::string vtk_safe_name(std::string name);

// Adds a string array `name` with `lines` to the field data of `data`.
void add_field_strings(vtkDataObject* data, const std::string& name, const std::vector<std::string>& lines);

// A base64 output stream that writes the same bytes as VTK's vtkBase64OutputStream, whole blocks at a time.
vtkSmartPointer<vtkOutputStream> new_base64_stream();

// Runs an XML writer set up for `path` in inline binary (base64), uncompressed form with 64-bit block headers,
// through new_base64_stream; VTK's messages are captured. Throws Error naming the file when VTK reports a failure.
void write_xml(vtkXMLWriter* writer, vtkDataObject* data, const std::string& path);

void write_stations_vtp(const OutputContext& c, const std::string& path);
void write_readout_vtp(const OutputContext& c, const std::string& path);
void write_model_vtu(const OutputContext& c, const Mesh& model, const std::string& path);
void write_stations_csv(const OutputContext& c, const std::string& path);
// A ParaView collection listing `files` (names relative to the .pvd's folder) as parts 0, 1, ... of timestep 0.
void write_collection_pvd(const std::vector<std::string>& files, const std::string& path);

}  // namespace toehold::detail
