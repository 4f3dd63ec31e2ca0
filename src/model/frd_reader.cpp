// A parsed .frd turned into a VTK unstructured grid: sparse node numbers mapped to point ids, cells in VTK node
// order, the chosen step's stress and displacement as point data, element and material numbers as cell data.
#include "toehold/model/frd_reader.hpp"

#include "frd_parse.hpp"
#include "mesh_reading.hpp"
#include "toehold/common/error.hpp"

#include <vtkCellData.h>
#include <vtkDoubleArray.h>
#include <vtkIdList.h>
#include <vtkIntArray.h>
#include <vtkPointData.h>
#include <vtkPoints.h>

#include <sstream>
#include <unordered_map>

namespace toehold {
namespace {

// "1" for 1.0, "0.5" for 0.5: step values as a reader would write them.
std::string short_number(double v) {
  std::ostringstream os;
  os.precision(6);
  os << v;
  return os.str();
}

std::string step_range(const std::vector<FrdStep>& steps) {
  const std::size_t n = steps.size();
  return n == 1 ? "step 0" : "steps 0 to " + std::to_string(n - 1);
}

std::string step_label(const std::vector<FrdStep>& steps, int index) {
  return "result step " + std::to_string(index) + " (step value " +
         short_number(steps[static_cast<std::size_t>(index)].value) + ")";
}

// The step index to read; Error naming the file when `step` does not exist or is ambiguous.
int chosen_step(const std::string& path, const std::vector<FrdStep>& steps, int step) {
  const int count = static_cast<int>(steps.size());
  if (count == 0)
    throw Error(path + ": holds no result blocks (100C); request the stresses in the deck with *EL FILE and S "
                       "(or *NODE FILE and S) and run the analysis again");
  if (step == -1 && count != 1)
    throw Error(path + ": has " + std::to_string(count) + " result steps; name the step to use (" +
                step_range(steps) + ")");
  const int chosen = step == -1 ? 0 : step;
  if (chosen < 0 || chosen >= count)
    throw Error(path + ": has no result step " + std::to_string(step) + "; it has " + std::to_string(count) + " (" +
                step_range(steps) + ")");
  return chosen;
}

const detail::FrdBlock* find_block(const detail::FrdData& data, const std::string& name) {
  for (const detail::FrdBlock& b : data.kept)
    if (b.name == name) return &b;
  return nullptr;
}

std::string listed(const std::vector<std::string>& names) {
  std::string out;
  for (const std::string& n : names) out += (out.empty() ? "" : ", ") + n;
  return out;
}

class GridBuilder {
public:
  GridBuilder(const std::string& path, const detail::FrdData& data) : path_(path), data_(data) {}

  vtkSmartPointer<vtkUnstructuredGrid> build(long long& unused_nodes) {
    map_used_nodes(unused_nodes);
    add_points();
    add_cells();
    return grid_;
  }

  // Point data of `block` in the order of the grid's points; Error at the first point it has no value for.
  void add_point_array(const detail::FrdBlock& block, const char* name, const std::vector<const char*>& components,
                       const std::string& step) {
    auto a = vtkSmartPointer<vtkDoubleArray>::New();
    a->SetName(name);
    a->SetNumberOfComponents(static_cast<int>(components.size()));
    for (std::size_t k = 0; k < components.size(); ++k) a->SetComponentName(static_cast<vtkIdType>(k), components[k]);
    a->SetNumberOfTuples(static_cast<vtkIdType>(point_nodes_.size()));
    const auto stride = static_cast<std::size_t>(block.components);
    for (std::size_t p = 0; p < point_nodes_.size(); ++p) {
      const auto row = block.row.find(point_nodes_[p]);
      if (row == block.row.end())
        throw Error(path_ + ", line " + std::to_string(block.line) + ": the " + block.name + " block of " + step +
                    " has no value for node " + std::to_string(point_nodes_[p]) +
                    ", which an element uses; write the results for every node (*NODE FILE / *EL FILE without NSET)");
      for (std::size_t k = 0; k < components.size(); ++k)
        a->SetComponent(static_cast<vtkIdType>(p), static_cast<int>(k), block.values[row->second * stride + k]);
    }
    grid_->GetPointData()->AddArray(a);
  }

private:
  void map_used_nodes(long long& unused_nodes) {
    std::unordered_map<long long, std::size_t> file_index;
    for (std::size_t i = 0; i < data_.node_ids.size(); ++i) file_index.emplace(data_.node_ids[i], i);
    std::vector<char> used(data_.node_ids.size(), 0);
    for (const detail::FrdElement& e : data_.elements) {
      for (long long n : e.nodes) {
        const auto found = file_index.find(n);
        if (found == file_index.end())
          throw Error(path_ + ", line " + std::to_string(e.line) + ": element " + std::to_string(e.number) +
                      " uses node " + std::to_string(n) + ", which the node block does not list; the file is corrupt");
        used[found->second] = 1;
      }
    }
    for (std::size_t i = 0; i < used.size(); ++i) {
      if (!used[i]) continue;
      point_of_.emplace(data_.node_ids[i], static_cast<vtkIdType>(point_nodes_.size()));
      point_nodes_.push_back(data_.node_ids[i]);
      file_rows_.push_back(i);
    }
    unused_nodes = static_cast<long long>(used.size() - point_nodes_.size());
  }

  void add_points() {
    auto points = vtkSmartPointer<vtkPoints>::New();
    points->SetDataTypeToDouble();
    points->SetNumberOfPoints(static_cast<vtkIdType>(file_rows_.size()));
    auto ids = vtkSmartPointer<vtkIntArray>::New();
    ids->SetName("frd node");
    ids->SetNumberOfTuples(static_cast<vtkIdType>(file_rows_.size()));
    for (std::size_t p = 0; p < file_rows_.size(); ++p) {
      const auto& x = data_.xyz[file_rows_[p]];
      points->SetPoint(static_cast<vtkIdType>(p), x[0], x[1], x[2]);
      ids->SetValue(static_cast<vtkIdType>(p), static_cast<int>(point_nodes_[p]));
    }
    grid_->SetPoints(points);
    grid_->GetPointData()->AddArray(ids);
  }

  void add_cells() {
    auto numbers = vtkSmartPointer<vtkIntArray>::New();
    numbers->SetName("frd element");
    auto materials = vtkSmartPointer<vtkIntArray>::New();
    materials->SetName("frd material");
    grid_->Allocate(static_cast<vtkIdType>(data_.elements.size()));
    auto cell = vtkSmartPointer<vtkIdList>::New();
    for (const detail::FrdElement& e : data_.elements) {
      const detail::FrdElementType* type = detail::frd_element_type(e.type);
      cell->SetNumberOfIds(type->nodes);
      for (int k = 0; k < type->nodes; ++k)
        cell->SetId(k, point_of_.at(e.nodes[static_cast<std::size_t>(type->from[static_cast<std::size_t>(k)])]));
      grid_->InsertNextCell(type->vtk_type, cell);
      numbers->InsertNextValue(static_cast<int>(e.number));
      materials->InsertNextValue(e.material);
    }
    grid_->GetCellData()->AddArray(numbers);
    grid_->GetCellData()->AddArray(materials);
  }

  const std::string& path_;
  const detail::FrdData& data_;
  std::vector<long long> point_nodes_;  // node number of each point
  std::vector<std::size_t> file_rows_;  // row in data_.node_ids of each point
  std::unordered_map<long long, vtkIdType> point_of_;
  vtkSmartPointer<vtkUnstructuredGrid> grid_ = vtkSmartPointer<vtkUnstructuredGrid>::New();
};

void add_results(GridBuilder& builder, const std::string& path, const detail::FrdData& data, int step) {
  const FrdStep& s = data.steps[static_cast<std::size_t>(step)];
  const std::string label = step_label(data.steps, step);
  const detail::FrdBlock* stress = find_block(data, "STRESS");
  if (!stress)
    throw Error(path + ", line " + std::to_string(s.line) + ": " + label + " has no STRESS block (it has " +
                listed(s.blocks) + "); request the stresses in the deck with *EL FILE and S (or *NODE FILE and S) "
                                   "and run the analysis again");
  if (stress->components != 6)
    throw Error(path + ", line " + std::to_string(stress->line) + ": the STRESS block of " + label + " has " +
                std::to_string(stress->components) + " components; a stress block has 6 (SXX SYY SZZ SXY SYZ SZX)");
  // .frd columns SXX SYY SZZ SXY SYZ SZX; SZX is the xz component of the symmetric tensor.
  builder.add_point_array(*stress, "stress", {"XX", "YY", "ZZ", "XY", "YZ", "XZ"}, label);
  const detail::FrdBlock* disp = find_block(data, "DISP");
  if (disp && disp->components >= 3) builder.add_point_array(*disp, "displacement", {"X", "Y", "Z"}, label);
}

}  // namespace

FrdModel read_frd(const std::string& path, int step) {
  const detail::FrdData data = detail::parse_frd(path, step == -1 ? 0 : step);
  const int chosen = chosen_step(path, data.steps, step);
  FrdModel model;
  GridBuilder builder(path, data);
  model.grid = builder.build(model.unused_nodes);
  add_results(builder, path, data, chosen);
  model.steps = data.steps;
  model.step = chosen;
  model.materials = data.materials;
  for (const detail::FrdElement& e : data.elements) ++model.element_types[detail::frd_element_type(e.type)->name];
  return model;
}

std::vector<FrdStep> frd_steps(const std::string& path) { return detail::parse_frd(path, -1).steps; }

namespace detail {

RawModel read_frd_raw(const std::string& file, int step) {
  const FrdModel model = read_frd(file, step);
  RawModel raw;
  raw.file = file;
  raw.piece_files = {file};
  raw.pieces.push_back(model.grid);
  raw.steps = static_cast<int>(model.steps.size());
  const FrdStep& s = model.steps[static_cast<std::size_t>(model.step)];
  raw.notes.push_back("CalculiX results, " + step_label(model.steps, model.step) + " of " +
                      std::to_string(raw.steps) + " (" + step_range(model.steps) + "), blocks " + listed(s.blocks));
  if (model.unused_nodes > 0)
    raw.notes.push_back("left out " + std::to_string(model.unused_nodes) + " node" +
                        (model.unused_nodes == 1 ? "" : "s") + " used by no element");
  return raw;
}

}  // namespace detail

}  // namespace toehold
