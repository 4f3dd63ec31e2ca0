// Reading model files: format dispatch, VTK message capture, .pvtu and .pvd parsing, and the cleaning of
// solver quirks (repeated pieces, ghost cells, lower-dimension cells, Float32 points) described in mesh.hpp.
#include "toehold/model/mesh.hpp"

#include "mesh_reading.hpp"
#include "toehold/common/error.hpp"
#include "toehold/model/cell_types.hpp"

#include <vtkAOSDataArrayTemplate.h>
#include <vtkCellArray.h>
#include <vtkCellData.h>
#include <vtkDataSetAttributes.h>
#include <vtkDoubleArray.h>
#include <vtkLogger.h>
#include <vtkNew.h>
#include <vtkObjectFactory.h>
#include <vtkOutputWindow.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkUnsignedCharArray.h>
#include <vtkUnstructuredGridReader.h>
#include <vtkXMLDataElement.h>
#include <vtkXMLDataParser.h>
#include <vtkXMLUnstructuredGridReader.h>

#include <algorithm>
#include <array>
#include <cctype>
#include <cstring>
#include <filesystem>
#include <fstream>
#include <optional>
#include <unordered_map>

namespace fs = std::filesystem;

namespace toehold {
namespace {

// Swallows everything VTK would print and keeps the first error, so failures become toehold::Error.
class CaptureWindow : public vtkOutputWindow {
public:
  static CaptureWindow* New();
  vtkTypeMacro(CaptureWindow, vtkOutputWindow)
  void DisplayText(const char*) override {}
  void DisplayErrorText(const char* text) override {
    if (first_error.empty() && text) first_error = text;
  }
  void DisplayWarningText(const char*) override {}
  void DisplayGenericWarningText(const char*) override {}
  void DisplayDebugText(const char*) override {}
  std::string first_error;
};
vtkStandardNewMacro(CaptureWindow);

// Installs a CaptureWindow and silences VTK's stderr log for its lifetime; puts both back afterwards.
class MessageCapture {
public:
  MessageCapture()
      : previous_(vtkOutputWindow::GetInstance()), window_(vtkSmartPointer<CaptureWindow>::New()),
        previous_log_(vtkLogger::GetCurrentVerbosityCutoff()) {
    vtkOutputWindow::SetInstance(window_);
    vtkLogger::SetStderrVerbosity(vtkLogger::VERBOSITY_OFF);  // VTK also logs each error to stderr itself
  }
  ~MessageCapture() {
    vtkLogger::SetStderrVerbosity(previous_log_);
    vtkOutputWindow::SetInstance(previous_);
  }
  MessageCapture(const MessageCapture&) = delete;
  MessageCapture& operator=(const MessageCapture&) = delete;
  // VTK's first error without its source-file location, "" when there was none.
  std::string error() const {
    std::string text = window_->first_error;
    const auto newline = text.find('\n');
    if (text.rfind("ERROR: In ", 0) == 0 && newline != std::string::npos) text = text.substr(newline + 1);
    const auto object_end = text.find("): ");
    if (object_end != std::string::npos && object_end < text.find('\n')) text = text.substr(object_end + 3);
    while (!text.empty() && std::isspace(static_cast<unsigned char>(text.back()))) text.pop_back();
    return text;
  }

private:
  vtkSmartPointer<vtkOutputWindow> previous_;
  vtkSmartPointer<CaptureWindow> window_;
  vtkLogger::Verbosity previous_log_;
};

std::string lower_extension(const std::string& path) {
  std::string ext = fs::path(path).extension().string();
  std::transform(ext.begin(), ext.end(), ext.begin(), [](unsigned char c) { return static_cast<char>(std::tolower(c)); });
  return ext;
}

std::string file_start(const std::string& path, std::size_t bytes) {
  std::ifstream in(path, std::ios::binary);
  std::string text(bytes, '\0');
  in.read(text.data(), static_cast<std::streamsize>(bytes));
  text.resize(static_cast<std::size_t>(in.gcount()));
  return text;
}

[[noreturn]] void throw_unreadable(const std::string& file, const std::string& reason) {
  throw Error(file + ": cannot be read (" + (reason.empty() ? "VTK returned no data" : reason) +
              "); the file may be truncated or corrupt: write it again from the solver");
}

// The `type` attribute of the <VTKFile> element at the start of an XML VTK file; Error when there is none.
std::string xml_file_type(const std::string& path) {
  const std::string head = file_start(path, 4096);
  const auto root = head.find("<VTKFile");
  const auto type = head.find("type=\"", root == std::string::npos ? 0 : root);
  if (root == std::string::npos || type == std::string::npos)
    throw Error(path + ": is not a VTK XML file (no <VTKFile type=...> element at its start); write it again as "
                       "a VTK XML file or use the extension that matches its format");
  const auto end = head.find('"', type + 6);
  return head.substr(type + 6, end == std::string::npos ? std::string::npos : end - type - 6);
}

vtkSmartPointer<vtkUnstructuredGrid> checked_output(vtkUnstructuredGrid* grid, const MessageCapture& capture,
                                                    const std::string& file) {
  if (!capture.error().empty() || !grid || grid->GetNumberOfPoints() == 0) throw_unreadable(file, capture.error());
  vtkSmartPointer<vtkUnstructuredGrid> out = grid;
  return out;
}

vtkSmartPointer<vtkUnstructuredGrid> read_vtu(const std::string& file) {
  detail::require_file(file);
  const std::string type = xml_file_type(file);
  if (type != "UnstructuredGrid")
    throw Error(file + ": holds a VTK XML " + type + " data set, not an unstructured grid; write the volume mesh "
                       "as an UnstructuredGrid (.vtu)");
  MessageCapture capture;
  auto reader = vtkSmartPointer<vtkXMLUnstructuredGridReader>::New();
  reader->SetFileName(file.c_str());
  reader->Update();
  return checked_output(reader->GetOutput(), capture, file);
}

bool ends_with_line_break(const std::string& file) {
  std::ifstream in(file, std::ios::binary | std::ios::ate);
  if (!in || in.tellg() <= 0) return false;
  in.seekg(-1, std::ios::end);
  const int last = in.get();
  return last == '\n' || last == '\r';
}

// The DATASET type named in a legacy VTK header, after checking the header's first line.
std::string legacy_dataset_type(const std::string& file) {
  std::ifstream in(file, std::ios::binary);
  std::string line;
  std::getline(in, line);
  if (line.rfind("# vtk DataFile", 0) != 0)
    throw Error(file + ": is not a legacy VTK file (its first line is not '# vtk DataFile Version ...'); "
                       "use the extension that matches its format");
  for (int i = 0; i < 8 && std::getline(in, line); ++i) {
    if (line.rfind("DATASET", 0) != 0) continue;
    std::string type = line.substr(7);
    type.erase(0, type.find_first_not_of(" \t"));
    while (!type.empty() && std::isspace(static_cast<unsigned char>(type.back()))) type.pop_back();
    return type;
  }
  return "";
}

vtkSmartPointer<vtkUnstructuredGrid> read_legacy(const std::string& file) {
  const std::string type = legacy_dataset_type(file);
  if (type != "UNSTRUCTURED_GRID")
    throw Error(file + ": holds a legacy VTK " + (type.empty() ? std::string("file without a DATASET") : type) +
                " data set, not an UNSTRUCTURED_GRID; write the volume mesh as an unstructured grid");
  MessageCapture capture;
  auto reader = vtkSmartPointer<vtkUnstructuredGridReader>::New();
  reader->SetFileName(file.c_str());
  reader->ReadAllScalarsOn();
  reader->ReadAllVectorsOn();
  reader->ReadAllTensorsOn();
  reader->ReadAllNormalsOn();
  reader->ReadAllColorScalarsOn();
  reader->ReadAllTCoordsOn();
  reader->ReadAllFieldsOn();
  reader->Update();
  // VTK stops quietly at the end of a legacy file, even inside a section; every writer ends with a line break.
  if (capture.error().empty() && !ends_with_line_break(file)) throw_unreadable(file, "it ends in the middle of a line");
  return checked_output(reader->GetOutput(), capture, file);
}

// Parses a small XML file (.pvtu, .pvd) and returns its root <VTKFile> element after checking its type.
vtkSmartPointer<vtkXMLDataParser> parse_xml(const std::string& file, const char* expected_type) {
  detail::require_file(file);
  const std::string type = xml_file_type(file);
  if (type != expected_type)
    throw Error(file + ": holds a VTK XML " + type + " file where a " + expected_type + " was expected");
  MessageCapture capture;
  auto parser = vtkSmartPointer<vtkXMLDataParser>::New();
  parser->SetFileName(file.c_str());
  if (!parser->Parse() || !parser->GetRootElement()) throw_unreadable(file, capture.error());
  return parser;
}

fs::path resolved(const std::string& base_file, const char* relative) {
  fs::path p(relative);
  if (p.is_relative()) p = fs::path(base_file).parent_path() / p;
  return p.lexically_normal();
}

detail::RawModel read_pvtu(const std::string& file) {
  auto parser = parse_xml(file, "PUnstructuredGrid");
  vtkXMLDataElement* grid = parser->GetRootElement()->FindNestedElementWithName("PUnstructuredGrid");
  if (!grid) throw Error(file + ": has no <PUnstructuredGrid> element; write the parallel file again");
  detail::RawModel raw;
  raw.file = file;
  raw.merge_pieces = true;
  std::vector<std::string> seen;
  for (int i = 0; i < grid->GetNumberOfNestedElements(); ++i) {
    vtkXMLDataElement* piece = grid->GetNestedElement(i);
    if (std::strcmp(piece->GetName(), "Piece") != 0) continue;
    const char* source = piece->GetAttribute("Source");
    if (!source) throw Error(file + ": piece " + std::to_string(i) + " has no Source attribute");
    const std::string path = resolved(file, source).string();
    if (std::find(seen.begin(), seen.end(), path) != seen.end()) {
      ++raw.repeated_pieces;
      continue;
    }
    seen.push_back(path);
    if (!fs::exists(path)) throw Error(file + ": its piece '" + std::string(source) + "' (" + path + ") does not exist");
    raw.pieces.push_back(read_vtu(path));
    raw.piece_files.push_back(path);
  }
  if (raw.pieces.empty()) throw Error(file + ": lists no pieces; write the parallel file again");
  return raw;
}

// ---- cleaning -------------------------------------------------------------------------------------------

[[noreturn]] void throw_unsupported(const std::string& file, vtkIdType cell, int type, vtkIdType nodes) {
  const CellTypeInfo info = cell_type_info(type);
  const std::string what = info.dimension < 0 ? "a " + info.name + " (VTK cell type " + std::to_string(type) + ")"
                                              : "a " + info.name + " with " + std::to_string(nodes) + " nodes";
  throw Error(file + ": cell " + std::to_string(cell) + " is " + what +
              ", which toehold cannot use; mesh the model with tetrahedra, hexahedra, wedges or pyramids "
              "(linear, quadratic or Lagrange)");
}

// cell_type_info of each VTK cell type met, looked up once (a model has millions of cells of a few types).
class TypeInfoCache {
public:
  const CellTypeInfo& operator()(int type) {
    if (type < 0 || type >= static_cast<int>(cache_.size())) {
      other_ = cell_type_info(type);
      return other_;
    }
    auto& slot = cache_[static_cast<std::size_t>(type)];
    if (!slot) slot = cell_type_info(type);
    return *slot;
  }

private:
  std::array<std::optional<CellTypeInfo>, 256> cache_;
  CellTypeInfo other_;
};

// Which cells of `piece` to keep: volume cells that are not ghosts. Throws for cell types toehold cannot use.
std::vector<char> select_cells(vtkUnstructuredGrid* piece, const std::string& file, detail::CleanStats& stats) {
  vtkDataArray* ghost = piece->GetCellData()->GetArray(vtkDataSetAttributes::GhostArrayName());
  std::vector<char> keep(static_cast<std::size_t>(piece->GetNumberOfCells()), 0);
  TypeInfoCache info_of;
  for (vtkIdType c = 0; c < piece->GetNumberOfCells(); ++c) {
    if (ghost && ghost->GetTuple1(c) != 0) {
      ++stats.ghost_cells;
      continue;
    }
    const int type = piece->GetCellType(c);
    const CellTypeInfo& info = info_of(type);
    vtkIdType nodes = 0;
    const vtkIdType* pts = nullptr;
    piece->GetCellPoints(c, nodes, pts);
    if (info.dimension < 0 || (info.lagrange && cell_order(type, static_cast<int>(nodes)) == 0))
      throw_unsupported(file, c, type, nodes);
    if (info.dimension < 3) {
      ++stats.lower_dimension[info.name];
      continue;
    }
    keep[static_cast<std::size_t>(c)] = 1;
  }
  return keep;
}

// Exact coordinates as a hash key (-0.0 and 0.0 are the same point).
struct PointKey {
  std::array<double, 3> x;
  bool operator==(const PointKey& o) const { return x == o.x; }
};
struct PointKeyHash {
  std::size_t operator()(const PointKey& k) const {
    std::size_t h = 0;
    for (double v : k.x) h = h * 1000003u ^ std::hash<double>{}(v + 0.0);
    return h;
  }
};

// Builds the cleaned grid piece by piece.
class Assembler {
public:
  Assembler(const detail::RawModel& raw, double scale)
      : raw_(raw), scale_(scale), points_list_(static_cast<int>(raw.pieces.size())),
        cells_list_(static_cast<int>(raw.pieces.size())) {
    for (const auto& piece : raw.pieces) {
      points_list_.IntersectFieldList(piece->GetPointData());
      cells_list_.IntersectFieldList(piece->GetCellData());
    }
    auto points = vtkSmartPointer<vtkPoints>::New();
    points->SetDataTypeToDouble();
    grid_->SetPoints(points);
    grid_->GetPointData()->CopyAllocate(points_list_, 0);
    grid_->GetCellData()->CopyAllocate(cells_list_, 0);
  }

  void add_piece(int index, const std::vector<char>& keep, detail::CleanStats& stats) {
    vtkUnstructuredGrid* piece = raw_.pieces[static_cast<std::size_t>(index)];
    if (!raw_.merge_pieces && grid_->GetNumberOfPoints() == 0 && grid_->GetNumberOfCells() == 0 &&
        std::all_of(keep.begin(), keep.end(), [](char k) { return k != 0; }))
      return add_whole_piece(index);
    const std::vector<vtkIdType> ids = add_points(index, used_points(piece, keep), stats);
    vtkIdList* cell_ids = vtkIdList::New();
    for (vtkIdType c = 0; c < piece->GetNumberOfCells(); ++c) {
      if (!keep[static_cast<std::size_t>(c)]) continue;
      vtkIdType npts = 0;
      const vtkIdType* pts = nullptr;
      piece->GetCellPoints(c, npts, pts);
      cell_ids->SetNumberOfIds(npts);
      for (vtkIdType k = 0; k < npts; ++k) cell_ids->SetId(k, ids[static_cast<std::size_t>(pts[k])]);
      const vtkIdType out = grid_->InsertNextCell(piece->GetCellType(c), cell_ids);
      grid_->GetCellData()->CopyData(cells_list_, piece->GetCellData(), index, c, out);
    }
    cell_ids->Delete();
  }

  vtkSmartPointer<vtkUnstructuredGrid> finish() {
    grid_->GetPointData()->RemoveArray(vtkDataSetAttributes::GhostArrayName());
    grid_->GetCellData()->RemoveArray(vtkDataSetAttributes::GhostArrayName());
    grid_->Squeeze();
    return grid_;
  }

private:
  // The piece as it is (every cell kept, ids unchanged, nothing to merge) in bulk: the same grid the point by
  // point and cell by cell path below builds, at a fraction of the cost on large models.
  void add_whole_piece(int index) {
    vtkUnstructuredGrid* piece = raw_.pieces[static_cast<std::size_t>(index)];
    const vtkIdType points = piece->GetNumberOfPoints(), cells = piece->GetNumberOfCells();
    copy_scaled_points(piece->GetPoints(), points);
    grid_->GetPointData()->CopyData(points_list_, piece->GetPointData(), index, 0, points, 0);
    vtkNew<vtkCellArray> connectivity;
    connectivity->DeepCopy(piece->GetCells());
    vtkNew<vtkUnsignedCharArray> types;
    types->DeepCopy(piece->GetCellTypesArray());
    grid_->SetCells(types, connectivity);
    grid_->GetCellData()->CopyData(cells_list_, piece->GetCellData(), index, 0, cells, 0);
  }

  // The piece's points times the scale, as doubles (x * scale exactly as the point by point path computes it).
  void copy_scaled_points(vtkPoints* from, vtkIdType count) {
    vtkPoints* to = grid_->GetPoints();
    to->SetNumberOfPoints(count);
    double* out = vtkDoubleArray::SafeDownCast(to->GetData())->GetPointer(0);
    const auto n = static_cast<std::size_t>(count) * 3;
    if (auto* f = vtkAOSDataArrayTemplate<float>::FastDownCast(from->GetData())) {
      const float* in = f->GetPointer(0);
      for (std::size_t i = 0; i < n; ++i) out[i] = static_cast<double>(in[i]) * scale_;
    } else if (auto* d = vtkAOSDataArrayTemplate<double>::FastDownCast(from->GetData())) {
      const double* in = d->GetPointer(0);
      for (std::size_t i = 0; i < n; ++i) out[i] = in[i] * scale_;
    } else {
      for (vtkIdType p = 0; p < count; ++p) {
        double x[3];
        from->GetPoint(p, x);
        for (int a = 0; a < 3; ++a) out[3 * p + a] = x[a] * scale_;
      }
    }
    to->Modified();
  }

  // Points used by kept cells; every point when pieces are not merged (ids then match the file).
  std::vector<char> used_points(vtkUnstructuredGrid* piece, const std::vector<char>& keep) const {
    std::vector<char> used(static_cast<std::size_t>(piece->GetNumberOfPoints()), raw_.merge_pieces ? 0 : 1);
    if (!raw_.merge_pieces) return used;
    for (vtkIdType c = 0; c < piece->GetNumberOfCells(); ++c) {
      if (!keep[static_cast<std::size_t>(c)]) continue;
      vtkIdType npts = 0;
      const vtkIdType* pts = nullptr;
      piece->GetCellPoints(c, npts, pts);
      for (vtkIdType k = 0; k < npts; ++k) used[static_cast<std::size_t>(pts[k])] = 1;
    }
    return used;
  }

  // New ids of the piece's points (-1 for unused ones), reusing points of earlier pieces at the same place.
  std::vector<vtkIdType> add_points(int index, const std::vector<char>& used, detail::CleanStats& stats) {
    vtkUnstructuredGrid* piece = raw_.pieces[static_cast<std::size_t>(index)];
    std::vector<vtkIdType> ids(used.size(), -1);
    std::vector<std::pair<PointKey, vtkIdType>> added;
    for (vtkIdType p = 0; p < piece->GetNumberOfPoints(); ++p) {
      if (!used[static_cast<std::size_t>(p)]) {
        ++stats.unused_points;
        continue;
      }
      PointKey key{};
      piece->GetPoint(p, key.x.data());
      const auto found = raw_.merge_pieces ? earlier_.find(key) : earlier_.end();
      if (found != earlier_.end()) {
        ids[static_cast<std::size_t>(p)] = found->second;
        ++stats.merged_points;
        continue;
      }
      const vtkIdType id = grid_->GetPoints()->InsertNextPoint(key.x[0] * scale_, key.x[1] * scale_, key.x[2] * scale_);
      grid_->GetPointData()->CopyData(points_list_, piece->GetPointData(), index, p, id);
      ids[static_cast<std::size_t>(p)] = id;
      if (raw_.merge_pieces) added.emplace_back(key, id);
    }
    for (const auto& [key, id] : added) earlier_.emplace(key, id);
    return ids;
  }

  const detail::RawModel& raw_;
  double scale_;
  vtkDataSetAttributes::FieldList points_list_;
  vtkDataSetAttributes::FieldList cells_list_;
  vtkSmartPointer<vtkUnstructuredGrid> grid_ = vtkSmartPointer<vtkUnstructuredGrid>::New();
  std::unordered_map<PointKey, vtkIdType, PointKeyHash> earlier_;
};

std::string plural(long long n, const std::string& word) {
  return std::to_string(n) + " " + word + (n == 1 ? "" : "s");
}

// One line for the reporter: "dropped 1 repeated piece, 120 ghost cells; Float32 points converted to double".
std::string joined(const std::vector<std::string>& phrases) {
  std::string out;
  bool last_dropped = false;
  for (const std::string& p : phrases) {
    const bool dropped = p.rfind("dropped ", 0) == 0;
    if (!out.empty()) out += dropped && last_dropped ? ", " : "; ";
    out += dropped && last_dropped ? p.substr(8) : p;
    last_dropped = dropped;
  }
  return out;
}

}  // namespace

namespace detail {

void require_file(const std::string& path) {
  std::error_code ec;
  if (fs::is_directory(path, ec))
    throw Error(path + ": is a folder, not a model file; name a .vtu, .pvtu, .vtk or .pvd file");
  if (!fs::exists(path, ec)) throw Error(path + ": no such file; check the path and the current folder");
}

RawModel read_raw(const std::string& data_file, int step) {
  require_file(data_file);
  const std::string ext = lower_extension(data_file);
  if (ext == ".pvtu") return read_pvtu(data_file);
  if (ext == ".frd") return read_frd_raw(data_file, step);
  RawModel raw;
  raw.file = data_file;
  raw.piece_files = {data_file};
  if (ext == ".vtu") {
    raw.pieces.push_back(read_vtu(data_file));
  } else if (ext == ".vtk") {
    raw.pieces.push_back(read_legacy(data_file));
  } else {
    throw Error(data_file + ": unknown model format '" + ext +
                "'; toehold reads .vtu, .pvtu, .vtk (legacy unstructured grid) and .pvd files");
  }
  return raw;
}

CleanModel clean_model(const RawModel& raw, double scale) {
  CleanModel out;
  out.stats.repeated_pieces = raw.repeated_pieces;
  std::vector<std::vector<char>> keep;
  long long kept = 0;
  for (std::size_t i = 0; i < raw.pieces.size(); ++i) {
    keep.push_back(select_cells(raw.pieces[i], raw.piece_files[i], out.stats));
    kept += std::count(keep.back().begin(), keep.back().end(), 1);
    vtkPoints* points = raw.pieces[i]->GetPoints();
    if (points && points->GetDataType() == VTK_FLOAT) out.stats.float32_points = true;
  }
  if (kept == 0)
    throw Error(raw.file + ": has no volume cells (only cells of dimension < 3 or ghost cells); toehold needs the "
                           "solid mesh with its stresses");
  Assembler assembler(raw, scale);
  for (std::size_t i = 0; i < raw.pieces.size(); ++i) assembler.add_piece(static_cast<int>(i), keep[i], out.stats);
  out.grid = assembler.finish();
  return out;
}

std::vector<std::string> describe(const CleanStats& stats) {
  std::vector<std::string> out;
  if (stats.repeated_pieces > 0) out.push_back("dropped " + plural(stats.repeated_pieces, "repeated piece"));
  if (stats.ghost_cells > 0) out.push_back("dropped " + plural(stats.ghost_cells, "ghost cell"));
  long long lower = 0;
  std::string types;
  for (const auto& [name, count] : stats.lower_dimension) {
    lower += count;
    types += (types.empty() ? "" : ", ") + std::to_string(count) + " " + name;
  }
  if (lower > 0) out.push_back("dropped " + plural(lower, "cell") + " of dimension < 3 (" + types + ")");
  if (stats.unused_points > 0) out.push_back("dropped " + plural(stats.unused_points, "point") + " used by no kept cell");
  if (stats.merged_points > 0) out.push_back("merged " + plural(stats.merged_points, "point") + " shared by pieces");
  if (stats.float32_points) out.push_back("Float32 points converted to double");
  return out;
}

std::vector<std::vector<SeriesEntry>> series_steps(const std::vector<SeriesEntry>& entries) {
  std::vector<std::vector<SeriesEntry>> steps;
  const bool parts = std::any_of(entries.begin(), entries.end(), [](const SeriesEntry& e) { return e.part != 0; });
  for (const SeriesEntry& entry : entries) {
    auto same_time = [&](const std::vector<SeriesEntry>& s) { return s.front().time == entry.time; };
    const auto found = parts ? std::find_if(steps.begin(), steps.end(), same_time) : steps.end();
    if (found != steps.end()) {
      found->push_back(entry);
    } else {
      steps.push_back({entry});
    }
  }
  return steps;
}

}  // namespace detail

Mesh::Mesh(vtkSmartPointer<vtkUnstructuredGrid> grid, std::string source, LengthUnit length)
    : grid_(std::move(grid)), source_(std::move(source)), length_(length) {}

std::vector<SeriesEntry> read_pvd(const std::string& path) {
  auto parser = parse_xml(path, "Collection");
  vtkXMLDataElement* collection = parser->GetRootElement()->FindNestedElementWithName("Collection");
  if (!collection) throw Error(path + ": has no <Collection> element; write the .pvd file again");
  std::vector<SeriesEntry> entries;
  for (int i = 0; i < collection->GetNumberOfNestedElements(); ++i) {
    vtkXMLDataElement* set = collection->GetNestedElement(i);
    if (std::strcmp(set->GetName(), "DataSet") != 0) continue;
    const char* file = set->GetAttribute("file");
    if (!file) throw Error(path + ": DataSet " + std::to_string(entries.size()) + " has no file attribute");
    SeriesEntry entry;
    set->GetScalarAttribute("timestep", entry.time);
    set->GetScalarAttribute("part", entry.part);
    entry.file = resolved(path, file).string();
    entries.push_back(entry);
  }
  if (entries.empty()) throw Error(path + ": lists no data sets; write the .pvd file again");
  return entries;
}

std::string resolve_series_file(const std::string& path, int step) {
  if (lower_extension(path) != ".pvd") return path;
  const auto steps = detail::series_steps(read_pvd(path));
  const int count = static_cast<int>(steps.size());
  const std::string range = count == 1 ? "step 0" : "steps 0 to " + std::to_string(count - 1);
  if (step == -1 && count != 1)
    throw Error(path + ": has " + std::to_string(count) + " steps; name the step to use (" + range + ")");
  const int chosen = step == -1 ? 0 : step;
  if (chosen < 0 || chosen >= count)
    throw Error(path + ": has no step " + std::to_string(step) + "; it has " + range);
  const auto& parts = steps[static_cast<std::size_t>(chosen)];
  if (parts.size() > 1)
    throw Error(path + ": step " + std::to_string(chosen) + " is split into " + std::to_string(parts.size()) +
                " parts; toehold reads one file per step: write the step as one .vtu or .pvtu");
  return parts.front().file;
}

Mesh read_mesh(const std::string& path, int step, LengthUnit length, Reporter& reporter) {
  detail::require_file(path);
  const std::string file = resolve_series_file(path, step);
  const detail::RawModel raw = detail::read_raw(file, file == path ? step : -1);
  for (const std::string& note : raw.notes) reporter.info(fs::path(file).filename().string() + ": " + note);
  detail::CleanModel clean = detail::clean_model(raw, mm_per(length));
  const std::vector<std::string> phrases = detail::describe(clean.stats);
  if (!phrases.empty()) reporter.info(fs::path(file).filename().string() + ": " + joined(phrases));
  return Mesh(clean.grid, file, length);
}

}  // namespace toehold
