// Reads named point or cell DataArrays of a .vtu straight from the file, without parsing its points and cells:
// only the XML header and the byte ranges of the named arrays are read. Handles uncompressed raw appended
// Float32/Float64 arrays of a one-piece unstructured grid; anything else is "not handled" so the caller uses VTK.
#pragma once

#include "toehold/model/stress_field.hpp"

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

namespace toehold {

// One array as the file holds it: `tuples` x `components` values, tuple-major, in the file's own unit.
struct VtuArray {
  std::string name;
  Association where = Association::point;    // PointData or CellData of the piece
  int components = 1;                         // the NumberOfComponents attribute
  std::size_t tuples = 0;                     // the piece's NumberOfPoints (point data) or NumberOfCells
  std::vector<std::string> component_names;  // ComponentName0.. attributes, "" where absent
  std::vector<float> f32;                     // the values of a Float32 array (empty otherwise)
  std::vector<double> f64;                    // the values of a Float64 array (empty otherwise)
};

// The arrays `names` (each looked up in the point data first, then the cell data, as the stress reader does) of
// the .vtu at `path`, in the order of `names`, when the file is a one-piece UnstructuredGrid with `points`
// points and `cells` cells and every named array is an uncompressed Float32 or Float64 DataArray in raw appended
// data (UInt32 or UInt64 header, either byte order). nullopt ("not handled") for anything else: another file
// type, several pieces, other counts, a compressor, ascii or base64 data, another value type, a missing or
// repeated name, a byte count that does not match, a truncated or unreadable file. Never throws for file content.
std::optional<std::vector<VtuArray>> read_vtu_arrays(const std::string& path, const std::vector<std::string>& names,
                                                     std::int64_t points, std::int64_t cells);

// A view of `array` for read_stress (valid while `array` lives).
StressArrayView stress_view(const VtuArray& array);

}  // namespace toehold
