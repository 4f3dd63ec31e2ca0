#include "toehold/model/stress_field.hpp"

#include "toehold/common/error.hpp"
#include "toehold/model/stress_layout.hpp"

#include <vtkAOSDataArrayTemplate.h>
#include <vtkCellData.h>
#include <vtkDataArray.h>
#include <vtkPointData.h>

#include <cmath>
#include <optional>

namespace toehold {
namespace {

struct Found {
  vtkDataArray* array = nullptr;
  Association where = Association::point;
};

const char* entity(Association where) { return where == Association::point ? "point" : "cell"; }

std::string array_list(vtkFieldData* data) {
  std::string out;
  for (int i = 0; i < data->GetNumberOfArrays(); ++i) {
    vtkAbstractArray* a = data->GetAbstractArray(i);
    const char* name = a->GetName();
    out += (out.empty() ? "" : ", ") + std::string(name ? name : "(unnamed)");
    if (a->GetNumberOfComponents() != 1) out += " (" + std::to_string(a->GetNumberOfComponents()) + " components)";
  }
  return out.empty() ? "none" : out;
}

// The point or cell array `name` (point data first). Throws Error listing the file's arrays when there is none.
Found find_array(const Mesh& mesh, const std::string& name) {
  vtkUnstructuredGrid* grid = mesh.grid();
  if (vtkDataArray* a = grid->GetPointData()->GetArray(name.c_str())) return {a, Association::point};
  if (vtkDataArray* a = grid->GetCellData()->GetArray(name.c_str())) return {a, Association::cell};
  throw Error(mesh.source() + ": has no numeric point or cell array named '" + name + "'; its point arrays are: " +
              array_list(grid->GetPointData()) + "; its cell arrays are: " + array_list(grid->GetCellData()));
}

std::string value_text(double v) {
  if (std::isnan(v)) return "nan";
  return v > 0 ? "inf" : "-inf";
}

// Calls visit(get) with get(i, c) = component c of tuple i as double: straight from memory for the usual
// Float32/Float64 arrays (a million points and six components per load step), through GetComponent otherwise.
template <class Visit>
void with_values(vtkDataArray* a, Visit&& visit) {
  const auto comps = static_cast<vtkIdType>(a->GetNumberOfComponents());
  if (auto* f = vtkAOSDataArrayTemplate<float>::FastDownCast(a)) {
    const float* p = f->GetPointer(0);
    return visit([p, comps](vtkIdType i, int c) { return static_cast<double>(p[i * comps + c]); });
  }
  if (auto* d = vtkAOSDataArrayTemplate<double>::FastDownCast(a)) {
    const double* p = d->GetPointer(0);
    return visit([p, comps](vtkIdType i, int c) { return p[i * comps + c]; });
  }
  visit([a](vtkIdType i, int c) { return a->GetComponent(i, c); });
}

void check_finite(const Mesh& mesh, const Found& found) {
  const vtkIdType n = found.array->GetNumberOfTuples();
  const int comps = found.array->GetNumberOfComponents();
  with_values(found.array, [&](auto get) {
    for (vtkIdType i = 0; i < n; ++i) {
      bool finite = true;
      for (int c = 0; c < comps; ++c) finite = finite && std::isfinite(get(i, c));
      if (finite) continue;
      for (int c = 0; c < comps; ++c) {
        const double v = get(i, c);
        if (std::isfinite(v)) continue;
        throw Error(mesh.source() + ": array '" + found.array->GetName() + "' holds a non-finite value (" +
                    value_text(v) + ") at " + entity(found.where) + " " + std::to_string(i) +
                    "; fix the solver results or write them again");
      }
    }
  });
}

std::vector<std::string> component_names(vtkDataArray* array) {
  std::vector<std::string> names;
  for (int c = 0; c < array->GetNumberOfComponents(); ++c) {
    const char* name = array->GetComponentName(c);
    names.emplace_back(name ? name : "");
  }
  return names;
}

StressLayout six_component_layout(const Mesh& mesh, const StressSpec& spec, vtkDataArray* array) {
  if (!spec.order.empty()) return parse_component_order(spec.order, "order of stress array '" + spec.array + "'");
  const std::vector<std::string> names = component_names(array);
  if (std::optional<StressLayout> layout = layout_from_component_names(names)) return *layout;
  std::string shown;
  for (const std::string& n : names) shown += (shown.empty() ? "" : ", ") + (n.empty() ? std::string("(none)") : n);
  throw Error(mesh.source() + ": cannot tell the component order of 6-component array '" + spec.array +
              "' (component names: " + shown +
              "); declare its component order in the plan, e.g. order = \"xx,yy,zz,xy,yz,xz\"");
}

// Values of one 6- or 9-component array, converted by `factor`, in internal Voigt order.
std::vector<double> tensor_values(const Mesh& mesh, const StressSpec& spec, const Found& found, double factor) {
  vtkDataArray* a = found.array;
  const vtkIdType n = a->GetNumberOfTuples();
  std::vector<double> out(static_cast<std::size_t>(n) * 6);
  if (a->GetNumberOfComponents() == 9) {
    // Row-major 3x3: symmetric part, (S_ij + S_ji) / 2.
    with_values(a, [&](auto get) {
      for (vtkIdType i = 0; i < n; ++i) {
        for (std::size_t k = 0; k < 6; ++k) {
          const int r = kVoigtIndex[k][0], c = kVoigtIndex[k][1];
          const double sym = 0.5 * (get(i, 3 * r + c) + get(i, 3 * c + r));
          out[6 * static_cast<std::size_t>(i) + k] = sym * factor;
        }
      }
    });
    return out;
  }
  const StressLayout layout = six_component_layout(mesh, spec, a);
  with_values(a, [&](auto get) {
    for (vtkIdType i = 0; i < n; ++i)
      for (std::size_t k = 0; k < 6; ++k) out[6 * static_cast<std::size_t>(i) + k] = get(i, layout.source[k]) * factor;
  });
  return out;
}

StressField from_tensor_array(const Mesh& mesh, const StressSpec& spec, double factor) {
  const Found found = find_array(mesh, spec.array);
  const int comps = found.array->GetNumberOfComponents();
  if (comps != 6 && comps != 9)
    throw Error(mesh.source() + ": array '" + spec.array + "' has " + std::to_string(comps) +
                " components; a stress array needs 6 (symmetric tensor) or 9 (full 3x3 tensor), or name six "
                "scalar arrays, one per component");
  check_finite(mesh, found);
  return StressField(found.where, tensor_values(mesh, spec, found, factor));
}

StressField from_component_arrays(const Mesh& mesh, const StressSpec& spec, double factor) {
  std::array<Found, 6> found;
  for (std::size_t k = 0; k < 6; ++k) {
    if (spec.component_arrays[k].empty())
      throw Error(mesh.source() + ": the stress names neither one tensor array nor all six component arrays");
    found[k] = find_array(mesh, spec.component_arrays[k]);
    if (found[k].array->GetNumberOfComponents() != 1)
      throw Error(mesh.source() + ": stress component array '" + spec.component_arrays[k] + "' has " +
                  std::to_string(found[k].array->GetNumberOfComponents()) + " components; each of the six must be a scalar");
    if (found[k].where != found[0].where)
      throw Error(mesh.source() + ": stress component arrays '" + spec.component_arrays[0] + "' (" +
                  entity(found[0].where) + " data) and '" + spec.component_arrays[k] + "' (" + entity(found[k].where) +
                  " data) differ; all six must be point data or all cell data");
    check_finite(mesh, found[k]);
  }
  const vtkIdType n = found[0].array->GetNumberOfTuples();
  std::vector<double> out(static_cast<std::size_t>(n) * 6);
  for (std::size_t k = 0; k < 6; ++k)
    with_values(found[k].array, [&](auto get) {
      for (vtkIdType i = 0; i < n; ++i) out[6 * static_cast<std::size_t>(i) + k] = get(i, 0) * factor;
    });
  return StressField(found[0].where, std::move(out));
}

}  // namespace

StressField read_stress(const Mesh& mesh, const StressSpec& spec, StressUnit unit) {
  if (!mesh.grid()) throw Error("read_stress: the mesh is empty; read the model first");
  const double factor = mpa_per(unit);
  return spec.array.empty() ? from_component_arrays(mesh, spec, factor) : from_tensor_array(mesh, spec, factor);
}

}  // namespace toehold
