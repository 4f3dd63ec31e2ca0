#include "toehold/model/inspect.hpp"

#include "mesh_reading.hpp"
#include "toehold/common/error.hpp"
#include "toehold/model/cell_types.hpp"
#include "toehold/model/stress_layout.hpp"

#include <vtkCellData.h>
#include <vtkDataArray.h>
#include <vtkPointData.h>
#include <vtkType.h>

#include <algorithm>
#include <cctype>
#include <filesystem>
#include <map>
#include <set>
#include <sstream>

namespace toehold {
namespace {

constexpr std::size_t kMaxMarkerValues = 12;  // an integer array with more distinct values is not a marker

std::string value_type_name(int vtk_type, int bytes) {
  switch (vtk_type) {
    case VTK_FLOAT: return "Float32";
    case VTK_DOUBLE: return "Float64";
    case VTK_UNSIGNED_CHAR:
    case VTK_UNSIGNED_SHORT:
    case VTK_UNSIGNED_INT:
    case VTK_UNSIGNED_LONG:
    case VTK_UNSIGNED_LONG_LONG: return "UInt" + std::to_string(8 * bytes);
    case VTK_CHAR:
    case VTK_SIGNED_CHAR:
    case VTK_SHORT:
    case VTK_INT:
    case VTK_LONG:
    case VTK_LONG_LONG:
    case VTK_ID_TYPE: return "Int" + std::to_string(8 * bytes);
    default: return "VTK type " + std::to_string(vtk_type);
  }
}

std::vector<std::string> names_of_components(vtkDataArray* a) {
  std::vector<std::string> names;
  for (int c = 0; c < a->GetNumberOfComponents(); ++c) {
    const char* n = a->GetComponentName(c);
    names.emplace_back(n ? n : "");
  }
  return names;
}

// "toe or region marker (values 1, 2)" for an integer scalar with few distinct values, "" otherwise.
std::string marker_text(vtkDataArray* a) {
  std::set<long long> values;
  for (vtkIdType i = 0; i < a->GetNumberOfTuples() && values.size() <= kMaxMarkerValues; ++i)
    values.insert(static_cast<long long>(a->GetComponent(i, 0)));
  if (values.size() > kMaxMarkerValues) return "integer values (more than " + std::to_string(kMaxMarkerValues) + " distinct: ids?)";
  std::string list;
  for (long long v : values) list += (list.empty() ? "" : ", ") + std::to_string(v);
  return "toe or region marker (values " + list + ")";
}

std::string tensor_text(const ArrayInfo& info) {
  if (info.components == 9) return "stress tensor (9 components, taken as a row-major 3x3 tensor)";
  const auto layout = layout_from_component_names(info.component_names);
  if (!layout) return "stress tensor? component order unknown: declare it, e.g. order = \"xx,yy,zz,xy,yz,xz\"";
  static const char* keys[6] = {"xx", "yy", "zz", "xy", "yz", "xz"};
  std::string order;
  for (std::size_t k = 0; k < 6; ++k) order += (k ? ", " : "") + std::string(keys[k]) + "=" + info.component_names[layout->source[k]];
  return "stress tensor (order from names: " + order + ")";
}

ArrayInfo describe_array(vtkDataArray* a, bool point_data) {
  ArrayInfo info;
  info.name = a->GetName() ? a->GetName() : "";
  info.point_data = point_data;
  info.components = a->GetNumberOfComponents();
  info.component_names = names_of_components(a);
  info.value_type = value_type_name(a->GetDataType(), a->GetDataTypeSize());
  info.integer = a->GetDataType() != VTK_FLOAT && a->GetDataType() != VTK_DOUBLE;
  double range[2] = {0.0, 0.0};
  a->GetRange(range, info.components == 1 ? 0 : -1);
  info.min = range[0];
  info.max = range[1];
  if (info.components == 6 || info.components == 9) {
    info.looks_like = tensor_text(info);
  } else if (info.integer && info.components == 1) {
    info.looks_like = marker_text(a);
  }
  return info;
}

// The name without its trailing component spelling ("sigma_xx" -> "sigma"), used to group six scalar arrays.
std::string component_stem(const std::string& name) {
  for (std::size_t cut : {2u, 1u}) {
    if (name.size() <= cut) continue;
    const std::string tail = name.substr(name.size() - cut);
    if (!std::all_of(tail.begin(), tail.end(), [](unsigned char c) { return std::isalnum(c); })) continue;
    if (component_name_key(tail).empty() || component_name_key(name).empty()) continue;
    std::string stem = name.substr(0, name.size() - cut);
    while (!stem.empty() && !std::isalnum(static_cast<unsigned char>(stem.back()))) stem.pop_back();
    return stem;
  }
  return "";
}

// Marks scalar float arrays that form a set of six stress components ("Sxx", "Syy", ... of one association).
void mark_component_sets(std::vector<ArrayInfo>& arrays) {
  std::map<std::pair<bool, std::string>, std::vector<std::size_t>> groups;
  for (std::size_t i = 0; i < arrays.size(); ++i) {
    if (arrays[i].components != 1 || arrays[i].integer) continue;
    const std::string stem = component_stem(arrays[i].name);
    if (!stem.empty()) groups[{arrays[i].point_data, stem}].push_back(i);
  }
  for (const auto& [key, members] : groups) {
    std::set<std::string> keys;
    for (std::size_t i : members) keys.insert(component_name_key(arrays[i].name));
    if (keys.size() != 6 || members.size() != 6) continue;
    for (std::size_t i : members)
      arrays[i].looks_like = "stress component " + component_name_key(arrays[i].name) + " (one of six scalar arrays '" +
                             key.second + "...')";
  }
}

void add_arrays(vtkDataSetAttributes* data, bool point_data, std::vector<ArrayInfo>& out) {
  for (int i = 0; i < data->GetNumberOfArrays(); ++i) {
    vtkDataArray* a = data->GetArray(i);
    if (!a || (a->GetName() && std::string(a->GetName()) == vtkDataSetAttributes::GhostArrayName())) continue;
    out.push_back(describe_array(a, point_data));
  }
}

std::vector<CellCount> count_cells(const detail::RawModel& raw) {
  std::map<int, long long> counts;
  for (const auto& piece : raw.pieces)
    for (vtkIdType c = 0; c < piece->GetNumberOfCells(); ++c) ++counts[piece->GetCellType(c)];
  std::vector<CellCount> out;
  for (const auto& [type, count] : counts) out.push_back({type, cell_type_info(type).name, count});
  return out;
}

// The data file to look at: `path` itself (a .frd shows its first result step) or the first step of a .pvd.
std::string data_file_of(const std::string& path, ModelSummary& summary) {
  std::string ext = std::filesystem::path(path).extension().string();
  std::transform(ext.begin(), ext.end(), ext.begin(), [](unsigned char c) { return static_cast<char>(std::tolower(c)); });
  if (ext != ".pvd") return path;
  const auto steps = detail::series_steps(read_pvd(path));
  summary.pvd_steps = static_cast<int>(steps.size());
  if (steps.front().size() > 1)
    summary.remarks.push_back("step 0 is split into " + std::to_string(steps.front().size()) +
                              " parts; only the first is shown and toehold reads one file per step");
  return steps.front().front().file;
}

std::string number(double v) {
  std::ostringstream os;
  os.precision(6);
  os << v;
  return os.str();
}

void format_arrays(std::ostringstream& os, const ModelSummary& s, bool point_data) {
  os << (point_data ? "Point arrays:\n" : "Cell arrays:\n");
  bool any = false;
  for (const ArrayInfo& a : s.arrays) {
    if (a.point_data != point_data) continue;
    any = true;
    os << "  " << a.name << "  " << a.value_type << ", " << a.components << (a.components == 1 ? " component" : " components");
    std::string names;
    for (const std::string& n : a.component_names) names += (names.empty() ? "" : ", ") + (n.empty() ? std::string("-") : n);
    if (a.components > 1) os << " (" << names << ")";
    os << ", " << (a.components == 1 ? "range " : "magnitude ") << number(a.min) << " .. " << number(a.max);
    if (!a.looks_like.empty()) os << "\n      looks like: " << a.looks_like;
    os << "\n";
  }
  if (!any) os << "  none\n";
}

}  // namespace

ModelSummary inspect_model(const std::string& path, Reporter& reporter) {
  detail::require_file(path);
  ModelSummary summary;
  summary.file = path;
  const detail::RawModel raw = detail::read_raw(data_file_of(path, summary), 0);  // a .frd: its first step
  summary.remarks.insert(summary.remarks.end(), raw.notes.begin(), raw.notes.end());
  summary.cell_types = count_cells(raw);
  vtkUnstructuredGrid* grid = raw.pieces.front();
  detail::CleanModel clean;
  try {
    clean = detail::clean_model(raw, 1.0);
    grid = clean.grid;
    for (const std::string& r : detail::describe(clean.stats)) summary.remarks.push_back(r);
  } catch (const Error& e) {
    summary.remarks.push_back(std::string("toehold cannot use this model as it is: ") + e.what());
    reporter.warn(e.what());
  }
  summary.points = grid->GetNumberOfPoints();
  summary.cells = grid->GetNumberOfCells();
  grid->GetBounds(summary.bounds);
  add_arrays(grid->GetPointData(), true, summary.arrays);
  add_arrays(grid->GetCellData(), false, summary.arrays);
  mark_component_sets(summary.arrays);
  return summary;
}

std::string format_summary(const ModelSummary& s) {
  std::ostringstream os;
  os << "Model: " << s.file << "\n";
  if (s.pvd_steps > 0) os << "Steps in the .pvd: " << s.pvd_steps << " (showing step 0)\n";
  os << "Cells in the file, by type:\n";
  for (const CellCount& c : s.cell_types) os << "  " << c.name << " (VTK " << c.vtk_type << "): " << c.count << "\n";
  os << "Volume mesh used: " << s.cells << " cells, " << s.points << " points\n";
  os << "Bounds (file length unit): x " << number(s.bounds[0]) << " .. " << number(s.bounds[1]) << ", y "
     << number(s.bounds[2]) << " .. " << number(s.bounds[3]) << ", z " << number(s.bounds[4]) << " .. "
     << number(s.bounds[5]) << "\n";
  format_arrays(os, s, true);
  format_arrays(os, s, false);
  os << "Remarks:\n";
  if (s.remarks.empty()) os << "  none\n";
  for (const std::string& r : s.remarks) os << "  - " << r << "\n";
  return os.str();
}

}  // namespace toehold
