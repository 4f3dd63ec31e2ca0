#include "toehold/model/stress_field.hpp"

#include "toehold/common/error.hpp"
#include "toehold/common/finite.hpp"
#include "toehold/model/stress_layout.hpp"

#include <vtkAOSDataArrayTemplate.h>
#include <vtkCellData.h>
#include <vtkDataArray.h>
#include <vtkPointData.h>

#include <algorithm>
#include <cmath>
#include <functional>
#include <optional>

namespace toehold {
namespace {

// One array wherever it lives (a VTK array or memory read straight from a file): Float32/Float64 values are
// read from memory, other VTK types through GetComponent.
struct Found {
  std::string name;
  Association where = Association::point;
  int comps = 0;
  vtkIdType tuples = 0;
  std::vector<std::string> component_names;
  const float* f32 = nullptr;
  const double* f64 = nullptr;
  vtkDataArray* other = nullptr;
};

// Finds the array a name of the stress spec refers to; throws Error naming the file when there is none.
using Finder = std::function<Found(const std::string&)>;

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

Found from_vtk(vtkDataArray* a, Association where) {
  Found f{a->GetName(), where, a->GetNumberOfComponents(), a->GetNumberOfTuples(), {}, nullptr, nullptr, nullptr};
  for (int c = 0; c < f.comps; ++c) {
    const char* name = a->GetComponentName(c);
    f.component_names.emplace_back(name ? name : "");
  }
  if (auto* fa = vtkAOSDataArrayTemplate<float>::FastDownCast(a)) f.f32 = fa->GetPointer(0);
  else if (auto* da = vtkAOSDataArrayTemplate<double>::FastDownCast(a)) f.f64 = da->GetPointer(0);
  else f.other = a;
  return f;
}

// The point or cell array `name` (point data first). Throws Error listing the file's arrays when there is none.
Found find_array(const Mesh& mesh, const std::string& name) {
  vtkUnstructuredGrid* grid = mesh.grid();
  if (vtkDataArray* a = grid->GetPointData()->GetArray(name.c_str())) return from_vtk(a, Association::point);
  if (vtkDataArray* a = grid->GetCellData()->GetArray(name.c_str())) return from_vtk(a, Association::cell);
  throw Error(mesh.source() + ": has no numeric point or cell array named '" + name + "'; its point arrays are: " +
              array_list(grid->GetPointData()) + "; its cell arrays are: " + array_list(grid->GetCellData()));
}

Found from_view(const StressArrayView& v) {
  return {v.name, v.where, v.components, static_cast<vtkIdType>(v.tuples), v.component_names, v.f32, v.f64, nullptr};
}

std::string view_list(const std::vector<StressArrayView>& arrays, Association where) {
  std::string out;
  for (const StressArrayView& v : arrays) {
    if (v.where != where) continue;
    out += (out.empty() ? "" : ", ") + v.name;
    if (v.components != 1) out += " (" + std::to_string(v.components) + " components)";
  }
  return out.empty() ? "none" : out;
}

// The array `name` among `arrays` (point data first), with the message find_array gives when there is none.
Found find_view(const std::string& source, const std::vector<StressArrayView>& arrays, const std::string& name) {
  for (Association where : {Association::point, Association::cell})
    for (const StressArrayView& v : arrays)
      if (v.where == where && v.name == name) return from_view(v);
  throw Error(source + ": has no numeric point or cell array named '" + name + "'; its point arrays are: " +
              view_list(arrays, Association::point) + "; its cell arrays are: " + view_list(arrays, Association::cell));
}

std::string value_text(double v) {
  if (std::isnan(v)) return "nan";
  return v > 0 ? "inf" : "-inf";
}

// Calls visit(get) with get(i, c) = component c of tuple i as double: straight from memory for the usual
// Float32/Float64 arrays (a million points and six components per load step; six as a constant stride), through
// GetComponent otherwise.
template <class Visit>
void with_values(const Found& a, Visit&& visit) {
  const auto comps = static_cast<vtkIdType>(a.comps);
  if (const float* p = a.f32) {
    if (comps == 6) return visit([p](vtkIdType i, int c) { return static_cast<double>(p[i * 6 + c]); });
    return visit([p, comps](vtkIdType i, int c) { return static_cast<double>(p[i * comps + c]); });
  }
  if (const double* p = a.f64) {
    if (comps == 6) return visit([p](vtkIdType i, int c) { return p[i * 6 + c]; });
    return visit([p, comps](vtkIdType i, int c) { return p[i * comps + c]; });
  }
  vtkDataArray* other = a.other;
  visit([other](vtkIdType i, int c) { return other->GetComponent(i, c); });
}

// Index (tuple-major, tuple * comps + component) of the array's first non-finite value; tuples * comps if none.
std::size_t first_non_finite(const Found& a) {
  const std::size_t n = static_cast<std::size_t>(a.tuples) * static_cast<std::size_t>(a.comps);
  if (a.f32) return toehold::first_non_finite(a.f32, n);
  if (a.f64) return toehold::first_non_finite(a.f64, n);
  std::size_t j = 0;
  for (vtkIdType i = 0; i < a.tuples; ++i)
    for (int c = 0; c < a.comps; ++c, ++j)
      if (!std::isfinite(a.other->GetComponent(i, c))) return j;
  return n;
}

void check_finite(const std::string& source, const Found& found) {
  const std::size_t bad = first_non_finite(found);
  if (bad == static_cast<std::size_t>(found.tuples) * static_cast<std::size_t>(found.comps)) return;
  const auto comps = static_cast<std::size_t>(found.comps);
  const auto i = static_cast<vtkIdType>(bad / comps);
  double v = 0.0;
  with_values(found, [&](auto get) { v = get(i, static_cast<int>(bad % comps)); });
  throw Error(source + ": array '" + found.name + "' holds a non-finite value (" + value_text(v) + ") at " +
              entity(found.where) + " " + std::to_string(i) + "; fix the solver results or write them again");
}

StressLayout six_component_layout(const std::string& source, const StressSpec& spec, const Found& found) {
  if (!spec.order.empty()) return parse_component_order(spec.order, "order of stress array '" + spec.array + "'");
  const std::vector<std::string>& names = found.component_names;
  if (std::optional<StressLayout> layout = layout_from_component_names(names)) return *layout;
  std::string shown;
  for (const std::string& n : names) shown += (shown.empty() ? "" : ", ") + (n.empty() ? std::string("(none)") : n);
  throw Error(source + ": cannot tell the component order of 6-component array '" + spec.array +
              "' (component names: " + shown +
              "); declare its component order in the plan, e.g. order = \"xx,yy,zz,xy,yz,xz\"");
}

// The tuples to convert: every one (held = null), or the held ids. Calls visit(tuple, output position).
template <class Visit>
void for_each_tuple(vtkIdType n, const EntitySubset* held, Visit&& visit) {
  if (held == nullptr) {
    for (vtkIdType i = 0; i < n; ++i) visit(i, static_cast<std::size_t>(i));
    return;
  }
  for (std::size_t s = 0; s < held->ids().size(); ++s) visit(static_cast<vtkIdType>(held->ids()[s]), s);
}

// The subset of `only` for an array of `tuples` entities at `where`; null (convert all) when none fits.
const EntitySubset* subset_for(const StressSubsets& only, Association where, vtkIdType tuples) {
  const EntitySubset* held = where == Association::point ? only.points.get() : only.cells.get();
  return held != nullptr && held->entities() == static_cast<std::size_t>(tuples) ? held : nullptr;
}

std::size_t output_tuples(vtkIdType n, const EntitySubset* held) {
  return held ? held->ids().size() : static_cast<std::size_t>(n);
}

// Values of one 6- or 9-component array, converted by `factor`, in internal Voigt order (held tuples only).
std::vector<double> tensor_values(const std::string& source, const StressSpec& spec, const Found& a, double factor,
                                  const EntitySubset* held) {
  const vtkIdType n = a.tuples;
  std::vector<double> out(output_tuples(n, held) * 6);
  if (a.comps == 9) {
    // Row-major 3x3: symmetric part, (S_ij + S_ji) / 2.
    with_values(a, [&](auto get) {
      for_each_tuple(n, held, [&](vtkIdType i, std::size_t o) {
        for (std::size_t k = 0; k < 6; ++k) {
          const int r = kVoigtIndex[k][0], c = kVoigtIndex[k][1];
          const double sym = 0.5 * (get(i, 3 * r + c) + get(i, 3 * c + r));
          out[6 * o + k] = sym * factor;
        }
      });
    });
    return out;
  }
  const StressLayout layout = six_component_layout(source, spec, a);
  with_values(a, [&](auto get) {
    for_each_tuple(n, held, [&](vtkIdType i, std::size_t o) {
      for (std::size_t k = 0; k < 6; ++k) out[6 * o + k] = get(i, layout.source[k]) * factor;
    });
  });
  return out;
}

StressField make_field(Association where, const EntitySubset* held, const StressSubsets& only,
                       std::vector<double> values) {
  if (held == nullptr) return StressField(where, std::move(values));
  return StressField(where, where == Association::point ? only.points : only.cells, std::move(values));
}

StressField from_tensor_array(const std::string& source, const StressSpec& spec, const Finder& find, double factor,
                              const StressSubsets& only) {
  const Found found = find(spec.array);
  const int comps = found.comps;
  if (comps != 6 && comps != 9)
    throw Error(source + ": array '" + spec.array + "' has " + std::to_string(comps) +
                " components; a stress array needs 6 (symmetric tensor) or 9 (full 3x3 tensor), or name six "
                "scalar arrays, one per component");
  check_finite(source, found);
  const EntitySubset* held = subset_for(only, found.where, found.tuples);
  return make_field(found.where, held, only, tensor_values(source, spec, found, factor, held));
}

StressField from_component_arrays(const std::string& source, const StressSpec& spec, const Finder& find,
                                  double factor, const StressSubsets& only) {
  std::array<Found, 6> found;
  for (std::size_t k = 0; k < 6; ++k) {
    if (spec.component_arrays[k].empty())
      throw Error(source + ": the stress names neither one tensor array nor all six component arrays");
    found[k] = find(spec.component_arrays[k]);
    if (found[k].comps != 1)
      throw Error(source + ": stress component array '" + spec.component_arrays[k] + "' has " +
                  std::to_string(found[k].comps) + " components; each of the six must be a scalar");
    if (found[k].where != found[0].where)
      throw Error(source + ": stress component arrays '" + spec.component_arrays[0] + "' (" +
                  entity(found[0].where) + " data) and '" + spec.component_arrays[k] + "' (" + entity(found[k].where) +
                  " data) differ; all six must be point data or all cell data");
    check_finite(source, found[k]);
  }
  const vtkIdType n = found[0].tuples;
  const EntitySubset* held = subset_for(only, found[0].where, n);
  std::vector<double> out(output_tuples(n, held) * 6);
  for (std::size_t k = 0; k < 6; ++k)
    with_values(found[k], [&](auto get) {
      for_each_tuple(n, held, [&](vtkIdType i, std::size_t o) { out[6 * o + k] = get(i, 0) * factor; });
    });
  return make_field(found[0].where, held, only, std::move(out));
}

StressField convert(const std::string& source, const StressSpec& spec, const Finder& find, StressUnit unit,
                    const StressSubsets& only) {
  const double factor = mpa_per(unit);
  return spec.array.empty() ? from_component_arrays(source, spec, find, factor, only)
                            : from_tensor_array(source, spec, find, factor, only);
}

}  // namespace

const std::array<double, 6> StressField::kNotHeld = {NAN, NAN, NAN, NAN, NAN, NAN};

EntitySubset::EntitySubset(std::vector<long long> ids, std::size_t entities) : ids_(std::move(ids)), slot_(entities, -1) {
  std::sort(ids_.begin(), ids_.end());
  ids_.erase(std::unique(ids_.begin(), ids_.end()), ids_.end());
  if (!ids_.empty() && (ids_.front() < 0 || static_cast<std::size_t>(ids_.back()) >= entities))
    throw Error("entity subset: id " + std::to_string(ids_.front() < 0 ? ids_.front() : ids_.back()) +
                " is not one of the mesh's " + std::to_string(entities) + " (0 to " + std::to_string(entities) +
                " - 1); the subset must come from the same mesh");
  for (std::size_t s = 0; s < ids_.size(); ++s) slot_[static_cast<std::size_t>(ids_[s])] = static_cast<int>(s);
}

StressField read_stress(const Mesh& mesh, const StressSpec& spec, StressUnit unit, const StressSubsets& only) {
  if (!mesh.grid()) throw Error("read_stress: the mesh is empty; read the model first");
  return convert(mesh.source(), spec, [&mesh](const std::string& name) { return find_array(mesh, name); }, unit, only);
}

StressField read_stress(const std::string& source, const std::vector<StressArrayView>& arrays, const StressSpec& spec,
                        StressUnit unit, const StressSubsets& only) {
  return convert(source, spec, [&](const std::string& name) { return find_view(source, arrays, name); }, unit, only);
}

}  // namespace toehold
