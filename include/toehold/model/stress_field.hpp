// A stress field of one load step on a mesh: one symmetric tensor per point or per cell, in MPa, internal
// Voigt order (xx, yy, zz, xy, yz, xz), tension positive. Read from one 6- or 9-component array or from six
// scalar arrays, converted from the declared stress unit once.
#pragma once

#include "toehold/common/tensor.hpp"
#include "toehold/common/units.hpp"
#include "toehold/model/mesh.hpp"

#include <array>
#include <memory>
#include <string>
#include <vector>

namespace toehold {

enum class Association {
  point,  // one tensor per mesh point (nodal values)
  cell,   // one tensor per cell (constant over the cell)
};

// Where a step's stress lives in a file. Either `array` (6 or 9 components) or all six `component_arrays`
// (scalar arrays for xx, yy, zz, xy, yz, xz, in that order) are set.
struct StressSpec {
  std::string array;                         // name of a 6- or 9-component point or cell array
  std::array<std::string, 6> component_arrays;  // six scalar arrays, internal order; empty when `array` is used
  std::string order;                         // declared component order of a 6-component array, "" if none
};

// Some of the points (or cells) of a mesh: those a reader converts when only they are read (the hosts of the
// read-out points, say). Built once and shared by the fields of every step.
class EntitySubset {
public:
  // `ids`: entity ids in [0, entities), any order, repeats allowed; `entities`: how many the mesh has.
  EntitySubset(std::vector<long long> ids, std::size_t entities);
  const std::vector<long long>& ids() const { return ids_; }  // ascending, unique
  std::size_t entities() const { return slot_.size(); }
  // Position of entity i in ids(), -1 when it is not held.
  int slot(std::size_t i) const { return slot_[i]; }

private:
  std::vector<long long> ids_;
  std::vector<int> slot_;
};

// The subsets a step reader converts: the one matching the stress array's association is used; none = all.
struct StressSubsets {
  std::shared_ptr<const EntitySubset> points;
  std::shared_ptr<const EntitySubset> cells;
};

class StressField {
public:
  StressField() = default;
  // Every entity: voigt holds 6 values per entity.
  StressField(Association where, std::vector<double> voigt) : where_(where), voigt_(std::move(voigt)) {}
  // Only the entities of `held` (of its association): voigt holds 6 values per held id, in ids() order; every
  // other entity reads NaN.
  StressField(Association where, std::shared_ptr<const EntitySubset> held, std::vector<double> voigt)
      : where_(where), voigt_(std::move(voigt)), held_(std::move(held)) {}

  Association where() const { return where_; }
  // Number of points (or cells) of the mesh the field is on.
  std::size_t size() const { return held_ ? held_->entities() : voigt_.size() / 6; }
  // Six values of entity i in internal Voigt order, MPa (NaN for an entity the field does not hold).
  const double* voigt(std::size_t i) const {
    if (!held_) return voigt_.data() + 6 * i;
    const int s = held_->slot(i);
    return s >= 0 ? voigt_.data() + 6 * static_cast<std::size_t>(s) : kNotHeld.data();
  }
  Tensor tensor(std::size_t i) const { return tensor_from_voigt(voigt(i)); }
  // Every entity's values, 6 per entity; only for a field that holds every entity (holds_all()).
  const std::vector<double>& values() const { return voigt_; }
  bool holds_all() const { return !held_; }

private:
  static const std::array<double, 6> kNotHeld;
  Association where_ = Association::point;
  std::vector<double> voigt_;
  std::shared_ptr<const EntitySubset> held_;
};

// Reads the stress `spec` names from `mesh` as point or cell data (whichever holds it), converts `unit` to MPa.
// A 9-component array is taken as a full tensor (row-major; symmetric part used). A 6-component array takes its
// order from `spec.order`, else from its component names, else throws Error saying how to declare the order.
// Throws Error naming file and array for a missing array, a wrong component count, or NaN/Inf values (naming
// the first point or cell id).
// With `only`, just the entities of the subset matching the array's association are converted (the checks still
// cover the whole array); a subset whose size is not the array's tuple count is not used.
StressField read_stress(const Mesh& mesh, const StressSpec& spec, StressUnit unit, const StressSubsets& only = {});

// A numeric array held in memory outside VTK (for example read straight from a file): `tuples` x `components`
// values, tuple-major, in the file's stress unit, as Float32 or Float64 (exactly one of f32, f64 is set).
struct StressArrayView {
  std::string name;
  Association where = Association::point;
  int components = 1;
  std::size_t tuples = 0;
  std::vector<std::string> component_names;  // one per component, "" where the file names none
  const float* f32 = nullptr;
  const double* f64 = nullptr;
};

// read_stress on arrays already in memory: each name of `spec` is looked up in `arrays` (point data first, then
// cell data), and converted exactly as read_stress converts a VTK array of the same values, with the same checks
// and messages; `source` names the file in them.
StressField read_stress(const std::string& source, const std::vector<StressArrayView>& arrays, const StressSpec& spec,
                        StressUnit unit, const StressSubsets& only = {});

}  // namespace toehold
