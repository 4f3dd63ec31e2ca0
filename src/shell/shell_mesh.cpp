#include "toehold/shell/shell_mesh.hpp"

#include "toehold/common/error.hpp"
#include "toehold/model/cell_types.hpp"
#include "toehold/shell/shell_cell.hpp"

#include <vtkCellData.h>
#include <vtkCellType.h>
#include <vtkDataArray.h>
#include <vtkDataSetAttributes.h>
#include <vtkIdList.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkUnstructuredGridReader.h>
#include <vtkXMLUnstructuredGridReader.h>

#include <algorithm>
#include <cctype>
#include <cmath>
#include <filesystem>
#include <map>

namespace fs = std::filesystem;

namespace toehold {
namespace {

std::string lower_extension(const std::string &path) {
  std::string ext = fs::path(path).extension().string();
  std::transform(ext.begin(), ext.end(), ext.begin(), [](unsigned char c) {
    return static_cast<char>(std::tolower(c));
  });
  return ext;
}

[[noreturn]] void throw_cell(const std::string &source, vtkIdType cell,
                             const std::string &what) {
  throw Error(source + ": cell " + std::to_string(cell) + " is " + what);
}

// Which cells of `grid` are shell cells to keep; throws for cells a shell model
// cannot use.
std::vector<vtkIdType> shell_cells(vtkUnstructuredGrid *grid,
                                   const std::string &source) {
  vtkDataArray *ghost =
      grid->GetCellData()->GetArray(vtkDataSetAttributes::GhostArrayName());
  std::vector<vtkIdType> kept;
  for (vtkIdType c = 0; c < grid->GetNumberOfCells(); ++c) {
    if (ghost && ghost->GetTuple1(c) != 0)
      continue;
    const int type = grid->GetCellType(c);
    const CellTypeInfo info = cell_type_info(type);
    const vtkIdType nodes = grid->GetCells()->GetCellSize(c);
    if (info.dimension == 0 || info.dimension == 1)
      continue;
    if (info.dimension == 3)
      throw_cell(
          source, c,
          "a " + info.name +
              " (a volume cell); read solid models as solid models and shell "
              "models as shell models (one kind of cell per model)");
    if (!is_shell_cell(type, nodes))
      throw_cell(source, c,
                 "a " +
                     (info.dimension < 0
                          ? "VTK cell of type " + std::to_string(type)
                          : info.name) +
                     " with " + std::to_string(nodes) +
                     " nodes, which toehold cannot use as a shell cell; "
                     "mesh the shells with linear or quadratic triangles or "
                     "quadrilaterals");
    kept.push_back(c);
  }
  if (kept.empty())
    throw Error(source + ": has no shell cells (triangles or quadrilaterals); "
                         "a shell model needs its mid-surface "
                         "cells with their layer stresses");
  return kept;
}

vtkSmartPointer<vtkUnstructuredGrid>
copy_cells(vtkUnstructuredGrid *grid, const std::vector<vtkIdType> &kept,
           double scale) {
  auto out = vtkSmartPointer<vtkUnstructuredGrid>::New();
  vtkNew<vtkPoints> points;
  points->SetDataTypeToDouble();
  points->SetNumberOfPoints(grid->GetNumberOfPoints());
  for (vtkIdType p = 0; p < grid->GetNumberOfPoints(); ++p) {
    double x[3];
    grid->GetPoint(p, x);
    points->SetPoint(p, x[0] * scale, x[1] * scale, x[2] * scale);
  }
  out->SetPoints(points);
  out->GetPointData()->ShallowCopy(grid->GetPointData());
  out->GetPointData()->RemoveArray(vtkDataSetAttributes::GhostArrayName());
  out->GetCellData()->CopyAllocate(grid->GetCellData(),
                                   static_cast<vtkIdType>(kept.size()));
  vtkNew<vtkIdList> ids;
  for (vtkIdType c : kept) {
    grid->GetCellPoints(c, ids);
    const vtkIdType id = out->InsertNextCell(grid->GetCellType(c), ids);
    out->GetCellData()->CopyData(grid->GetCellData(), c, id);
  }
  out->GetCellData()->RemoveArray(vtkDataSetAttributes::GhostArrayName());
  out->Squeeze();
  return out;
}

std::vector<double> thickness_values(vtkUnstructuredGrid *grid,
                                     const std::string &source,
                                     const ShellThickness &spec, double scale) {
  const bool plan = spec.plan_mm != 0.0, array = !spec.array.empty();
  if (plan == array)
    throw Error(source + ": " +
                (plan ? std::string("both a plan thickness and a thickness "
                                    "array are given; give one")
                      : std::string("no shell thickness is given; give the "
                                    "plate thickness in the plan "
                                    "or name a cell-data thickness array")));
  const auto n = static_cast<std::size_t>(grid->GetNumberOfCells());
  if (plan) {
    if (!(spec.plan_mm > 0.0) || !std::isfinite(spec.plan_mm))
      throw Error(
          source +
          ": the shell thickness must be a positive number of mm, not " +
          std::to_string(spec.plan_mm));
    return std::vector<double>(n, spec.plan_mm);
  }
  vtkDataArray *a = grid->GetCellData()->GetArray(spec.array.c_str());
  if (!a)
    throw Error(source + ": has no cell-data thickness array '" + spec.array +
                "'; name a cell array that holds the shell thickness (toehold "
                "inspect lists the arrays)");
  if (a->GetNumberOfComponents() != 1)
    throw Error(source + ": thickness array '" + spec.array + "' has " +
                std::to_string(a->GetNumberOfComponents()) +
                " components; it must hold one value per cell");
  std::vector<double> t(n);
  for (std::size_t c = 0; c < n; ++c) {
    t[c] = a->GetTuple1(static_cast<vtkIdType>(c)) * scale;
    if (!(t[c] > 0.0) || !std::isfinite(t[c]))
      throw Error(source + ": thickness array '" + spec.array +
                  "' is not positive in cell " + std::to_string(c) +
                  "; every shell cell needs its plate thickness");
  }
  return t;
}

vtkSmartPointer<vtkUnstructuredGrid> read_grid(const std::string &file) {
  const std::string ext = lower_extension(file);
  if (!fs::is_regular_file(file))
    throw Error(file + ": no such file; check the path and the current folder");
  vtkUnstructuredGrid *out = nullptr;
  vtkNew<vtkXMLUnstructuredGridReader> xml;
  vtkNew<vtkUnstructuredGridReader> legacy;
  if (ext == ".vtu") {
    if (!xml->CanReadFile(file.c_str()))
      throw Error(file +
                  ": is not a VTK XML unstructured grid; write it as a .vtu");
    xml->SetFileName(file.c_str());
    xml->Update();
    out = xml->GetOutput();
  } else if (ext == ".vtk") {
    legacy->SetFileName(file.c_str());
    if (!legacy->IsFileUnstructuredGrid())
      throw Error(file + ": is not a legacy VTK unstructured grid; write the "
                         "shell model as an UNSTRUCTURED_GRID");
    legacy->ReadAllScalarsOn();
    legacy->ReadAllVectorsOn();
    legacy->ReadAllTensorsOn();
    legacy->ReadAllFieldsOn();
    legacy->Update();
    out = legacy->GetOutput();
  } else {
    throw Error(file +
                ": toehold reads shell models from .vtu, .vtk (legacy "
                "unstructured grid) and .pvd files, not '" +
                ext + "'; write the shell model as one .vtu");
  }
  if (!out || out->GetNumberOfPoints() == 0)
    throw Error(file + ": cannot be read as a shell model (no points); write "
                       "it again from the solver");
  vtkSmartPointer<vtkUnstructuredGrid> grid = out;
  return grid;
}

} // namespace

bool is_shell_cell(int vtk_type, long long node_count) {
  switch (vtk_type) {
  case VTK_TRIANGLE:
    return node_count == 3;
  case VTK_QUAD:
    return node_count == 4;
  case VTK_QUADRATIC_TRIANGLE:
    return node_count == 6;
  case VTK_QUADRATIC_QUAD:
    return node_count == 8;
  case VTK_BIQUADRATIC_QUAD:
    return node_count == 9;
  case VTK_LAGRANGE_TRIANGLE:
    return node_count == 3 || node_count == 6;
  case VTK_LAGRANGE_QUADRILATERAL:
    return node_count == 4 || node_count == 9;
  default:
    return false;
  }
}

ShellMesh::ShellMesh(Mesh mesh, std::vector<double> thickness_mm)
    : mesh_(std::move(mesh)), thickness_(std::move(thickness_mm)) {
  normals_.reserve(thickness_.size());
  for (std::size_t c = 0; c < thickness_.size(); ++c) {
    normals_.push_back(
        shell_cell_normal(mesh_.grid(), static_cast<long long>(c)));
    if (normals_.back().isZero())
      throw Error(mesh_.source() + ": shell cell " + std::to_string(c) +
                  " has no area (its corners are in line or repeated); mesh "
                  "that region again");
  }
}

Vec3 ShellMesh::point(long long p) const {
  Vec3 x;
  grid()->GetPoint(static_cast<vtkIdType>(p), x.data());
  return x;
}

ShellMesh make_shell_mesh(vtkUnstructuredGrid *grid, const std::string &source,
                          LengthUnit length, const ShellThickness &thickness) {
  const std::vector<vtkIdType> kept = shell_cells(grid, source);
  const double scale = mm_per(length);
  auto shells = copy_cells(grid, kept, scale);
  std::vector<double> t = thickness_values(shells, source, thickness, scale);
  return ShellMesh(Mesh(shells, source, length), std::move(t));
}

ShellMesh read_shell_mesh(const std::string &path, int step, LengthUnit length,
                          const ShellThickness &thickness, Reporter &reporter) {
  if (lower_extension(path) == ".pvtu")
    throw Error(path + ": toehold reads shell models from one piece; write the "
                       "shell model as one .vtu");
  const std::string file = resolve_series_file(path, step);
  auto grid = read_grid(file);
  ShellMesh shells = make_shell_mesh(grid, path, length, thickness);
  const long long dropped = grid->GetNumberOfCells() - shells.cell_count();
  if (dropped > 0)
    reporter.info(
        fs::path(file).filename().string() + ": left out " +
        std::to_string(dropped) +
        " cells that are not shell cells (points, lines, ghost cells)");
  return shells;
}

} // namespace toehold
