// model.vtu: the model mesh with points back in the output length unit, its own arrays unchanged, and two
// point arrays added: the utilization at nodes that carry a toe station, and which toe's station sits there.
#include "result_files.hpp"

#include <vtkAbstractArray.h>
#include <vtkCellData.h>
#include <vtkDoubleArray.h>
#include <vtkFieldData.h>
#include <vtkIntArray.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkSmartPointer.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLUnstructuredGridWriter.h>

#include <cmath>
#include <limits>
#include <string>
#include <vector>

namespace toehold::detail {
namespace {

// `name`, or "toehold <name>" when the model already carries a point array called `name`.
std::string free_name(vtkPointData* data, const std::string& name) {
  return data->HasArray(name.c_str()) ? "toehold " + name : name;
}

// Renames every array of `data` (a copy's own attribute list) whose name VTK would write as broken XML; the
// renamed arrays are deep copies, so the model's arrays keep their names.
void make_names_safe(vtkFieldData* data) {
  std::vector<std::string> unsafe;
  for (int i = 0; i < data->GetNumberOfArrays(); ++i) {
    const char* name = data->GetAbstractArray(i) ? data->GetAbstractArray(i)->GetName() : nullptr;
    if (name && vtk_safe_name(name) != name) unsafe.emplace_back(name);
  }
  for (const auto& name : unsafe) {
    vtkAbstractArray* original = data->GetAbstractArray(name.c_str());
    auto renamed = vtkSmartPointer<vtkAbstractArray>::Take(original->NewInstance());
    renamed->DeepCopy(original);
    renamed->SetName(vtk_safe_name(name).c_str());
    data->RemoveArray(name.c_str());
    data->AddArray(renamed);
  }
}

// A copy of `grid` that shares its cells and arrays, with its own points divided by `mm_per_unit` and its own field data.
vtkSmartPointer<vtkUnstructuredGrid> scaled_copy(vtkUnstructuredGrid* grid, double mm_per_unit) {
  auto copy = vtkSmartPointer<vtkUnstructuredGrid>::New();
  copy->ShallowCopy(grid);
  vtkNew<vtkPoints> points;
  points->SetDataTypeToDouble();
  const vtkIdType n = grid->GetNumberOfPoints();
  points->SetNumberOfPoints(n);
  double x[3];
  for (vtkIdType i = 0; i < n; ++i) {
    grid->GetPoint(i, x);
    points->SetPoint(i, x[0] / mm_per_unit, x[1] / mm_per_unit, x[2] / mm_per_unit);
  }
  copy->SetPoints(points);
  vtkNew<vtkFieldData> fields;
  if (grid->GetFieldData()) fields->ShallowCopy(grid->GetFieldData());
  copy->SetFieldData(fields);
  make_names_safe(copy->GetPointData());
  make_names_safe(copy->GetCellData());
  make_names_safe(copy->GetFieldData());
  return copy;
}

// True when `u` should replace the value `old` already at a node shared by two stations (the larger wins; a
// value beats NaN).
bool worse(double u, double old) { return std::isnan(old) || (!std::isnan(u) && u > old); }

void add_station_arrays(const Assessment& a, vtkUnstructuredGrid* copy) {
  vtkPointData* pd = copy->GetPointData();
  const vtkIdType n = copy->GetNumberOfPoints();
  vtkNew<vtkDoubleArray> utilization;
  utilization->SetName(free_name(pd, kStationUtilization).c_str());
  utilization->SetNumberOfTuples(n);
  utilization->Fill(std::numeric_limits<double>::quiet_NaN());
  vtkNew<vtkIntArray> toe_number;
  toe_number->SetName(free_name(pd, kToeNumber).c_str());
  toe_number->SetNumberOfTuples(n);
  toe_number->Fill(0);
  for (std::size_t t = 0; t < a.toes.size(); ++t) {
    for (const auto& s : a.toes[t].stations) {
      const long long node = s.station.node;
      if (node < 0 || node >= n) continue;
      const double u = s.ok() ? s.utilization : std::numeric_limits<double>::quiet_NaN();
      const bool first = toe_number->GetValue(node) == 0;
      if (!first && !worse(u, utilization->GetValue(node))) continue;
      utilization->SetValue(node, u);
      toe_number->SetValue(node, static_cast<int>(t + 1));
    }
  }
  pd->AddArray(utilization);
  pd->AddArray(toe_number);
}

}  // namespace

void write_model_vtu(const OutputContext& c, const Mesh& model, const std::string& path) {
  auto copy = scaled_copy(model.grid(), c.mm_per_unit);
  add_station_arrays(*c.a, copy);
  add_field_strings(copy, kProvenance, c.provenance);
  vtkNew<vtkXMLUnstructuredGridWriter> writer;
  write_xml(writer, copy, path);
}

}  // namespace toehold::detail
