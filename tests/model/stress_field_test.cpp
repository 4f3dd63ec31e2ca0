// Reading stress tensors from point or cell arrays: component orders, full tensors, scalar sets, units, errors.
#include "support/support.hpp"
#include "toehold/common/error.hpp"
#include "toehold/model/stress_field.hpp"

#include <vtkCellData.h>
#include <vtkCellType.h>
#include <vtkDoubleArray.h>
#include <vtkFloatArray.h>
#include <vtkPointData.h>
#include <vtkPoints.h>

#include <cmath>
#include <limits>
#include <memory>

namespace toehold {
namespace {

// One linear tetrahedron with 4 points, no arrays yet.
vtkSmartPointer<vtkUnstructuredGrid> tetra() {
  auto grid = vtkSmartPointer<vtkUnstructuredGrid>::New();
  auto points = vtkSmartPointer<vtkPoints>::New();
  points->SetDataTypeToDouble();
  points->InsertNextPoint(0, 0, 0);
  points->InsertNextPoint(1, 0, 0);
  points->InsertNextPoint(0, 1, 0);
  points->InsertNextPoint(0, 0, 1);
  grid->SetPoints(points);
  const vtkIdType ids[4] = {0, 1, 2, 3};
  grid->InsertNextCell(VTK_TETRA, 4, ids);
  return grid;
}

// Internal Voigt values of point p used throughout: xx = 10p+1, yy = 10p+2, ..., xz = 10p+6 (MPa).
double value(vtkIdType p, int k) { return 10.0 * static_cast<double>(p) + k + 1; }

// Adds a 6-component array holding value(p, k) with its components stored in `file_order` (internal index
// of each file component) and named `names`.
void add_six(vtkDataSetAttributes* data, vtkIdType n, const std::string& name, const std::array<int, 6>& file_order,
             const std::array<const char*, 6>& names, double scale = 1.0) {
  auto a = vtkSmartPointer<vtkDoubleArray>::New();
  a->SetName(name.c_str());
  a->SetNumberOfComponents(6);
  a->SetNumberOfTuples(n);
  for (int c = 0; c < 6; ++c)
    if (names[c]) a->SetComponentName(c, names[c]);
  for (vtkIdType p = 0; p < n; ++p)
    for (int c = 0; c < 6; ++c) a->SetComponent(p, c, scale * value(p, file_order[c]));
  data->AddArray(a);
}

void expect_values(const StressField& f, std::size_t n, double factor = 1.0) {
  ASSERT_EQ(f.size(), n);
  for (std::size_t p = 0; p < n; ++p)
    for (int k = 0; k < 6; ++k) EXPECT_CLOSE(f.voigt(p)[k], factor * value(static_cast<vtkIdType>(p), k), 1e-12);
}

const std::array<const char*, 6> kNoNames{nullptr, nullptr, nullptr, nullptr, nullptr, nullptr};

TEST(ReadStress, PointTensorWithNamedComponentsInAnotherOrder) {
  auto grid = tetra();
  // File order xx, yy, zz, xy, xz, yz, named S11 ... S23.
  add_six(grid->GetPointData(), 4, "S", {0, 1, 2, 3, 5, 4}, {"S11", "S22", "S33", "S12", "S13", "S23"});
  const Mesh mesh(grid, "t.vtu", LengthUnit::mm);
  const StressField f = read_stress(mesh, StressSpec{"S", {}, ""}, StressUnit::MPa);
  EXPECT_EQ(f.where(), Association::point);
  expect_values(f, 4);
}

TEST(ReadStress, DeclaredOrderForUnnamedComponents) {
  auto grid = tetra();
  add_six(grid->GetCellData(), 1, "stress", {0, 1, 2, 3, 5, 4}, kNoNames);
  const Mesh mesh(grid, "t.vtu", LengthUnit::mm);
  const StressField f = read_stress(mesh, StressSpec{"stress", {}, "xx,yy,zz,xy,xz,yz"}, StressUnit::MPa);
  EXPECT_EQ(f.where(), Association::cell);
  expect_values(f, 1);
}

TEST(ReadStress, FullTensorRowMajorTakesTheSymmetricPart) {
  auto grid = tetra();
  auto a = vtkSmartPointer<vtkDoubleArray>::New();
  a->SetName("sigma");
  a->SetNumberOfComponents(9);
  // Row-major [[1, 4+e, 6], [4-e, 2, 5], [6, 5, 3]]: the symmetric part has xy = 4 [D].
  const double e = 0.5;
  const double row_major[9] = {1, 4 + e, 6, 4 - e, 2, 5, 6, 5, 3};
  for (int p = 0; p < 4; ++p) a->InsertNextTuple(row_major);
  grid->GetPointData()->AddArray(a);
  const StressField f = read_stress(Mesh(grid, "t.vtu", LengthUnit::mm), StressSpec{"sigma", {}, ""}, StressUnit::MPa);
  const Voigt expected{1, 2, 3, 4, 5, 6};
  for (int k = 0; k < 6; ++k) EXPECT_CLOSE(f.voigt(3)[k], expected[static_cast<std::size_t>(k)], 1e-15);
}

TEST(ReadStress, SixScalarArraysInPascals) {
  auto grid = tetra();
  const char* names[6] = {"Sxx", "Syy", "Szz", "Sxy", "Syz", "Sxz"};
  for (int k = 0; k < 6; ++k) {
    auto a = vtkSmartPointer<vtkFloatArray>::New();  // FreeFEM writes Float32
    a->SetName(names[k]);
    for (vtkIdType p = 0; p < 4; ++p) a->InsertNextValue(static_cast<float>(1e6 * value(p, k)));
    grid->GetPointData()->AddArray(a);
  }
  StressSpec spec;
  spec.component_arrays = {"Sxx", "Syy", "Szz", "Sxy", "Syz", "Sxz"};
  const StressField f = read_stress(Mesh(grid, "ff.vtu", LengthUnit::m), spec, StressUnit::Pa);
  // 1e6 Pa = 1 MPa [D]; 1e6 n = 2^6 * 15625 n is exact in Float32 for n < 1000 [D].
  expect_values(f, 4);
}

TEST(ReadStress, KsiConvertsToMegapascals) {
  auto grid = tetra();
  add_six(grid->GetPointData(), 4, "S", {0, 1, 2, 3, 4, 5}, {"XX", "YY", "ZZ", "XY", "YZ", "XZ"});
  const StressField f = read_stress(Mesh(grid, "t.vtu", LengthUnit::in), StressSpec{"S", {}, ""}, StressUnit::ksi);
  // 1 ksi = 1000 psi * 6894.757293168 Pa = 6.894757293168 MPa (NIST SP 811 factor, from memory [M]).
  expect_values(f, 4, 6.894757293168);
}

std::string stress_error(vtkSmartPointer<vtkUnstructuredGrid> grid, const StressSpec& spec) {
  try {
    read_stress(Mesh(grid, "model.vtu", LengthUnit::mm), spec, StressUnit::MPa);
  } catch (const Error& e) {
    return e.what();
  }
  return "no error";
}

TEST(ReadStress, UnnamedSixComponentArraySaysHowToDeclareTheOrder) {
  auto grid = tetra();
  add_six(grid->GetPointData(), 4, "S", {0, 1, 2, 3, 4, 5}, {"0", "1", "2", "3", "4", "5"});
  EXPECT_EQ(stress_error(grid, StressSpec{"S", {}, ""}),
            "model.vtu: cannot tell the component order of 6-component array 'S' (component names: 0, 1, 2, 3, 4, 5); "
            "declare its component order in the plan, e.g. order = \"xx,yy,zz,xy,yz,xz\"");
  auto bare = tetra();
  add_six(bare->GetPointData(), 4, "S", {0, 1, 2, 3, 4, 5}, kNoNames);
  EXPECT_EQ(stress_error(bare, StressSpec{"S", {}, ""}),
            "model.vtu: cannot tell the component order of 6-component array 'S' (component names: (none), (none), "
            "(none), (none), (none), (none)); declare its component order in the plan, e.g. order = "
            "\"xx,yy,zz,xy,yz,xz\"");
}

TEST(ReadStress, WrongComponentCountSaysWhatIsAccepted) {
  auto grid = tetra();
  auto a = vtkSmartPointer<vtkDoubleArray>::New();
  a->SetName("U");
  a->SetNumberOfComponents(3);
  a->SetNumberOfTuples(4);
  a->Fill(0.0);
  grid->GetPointData()->AddArray(a);
  EXPECT_EQ(stress_error(grid, StressSpec{"U", {}, ""}),
            "model.vtu: array 'U' has 3 components; a stress array needs 6 (symmetric tensor) or 9 (full 3x3 "
            "tensor), or name six scalar arrays, one per component");
}

TEST(ReadStress, MissingArrayListsTheArraysThereAre) {
  auto grid = tetra();
  add_six(grid->GetPointData(), 4, "S", {0, 1, 2, 3, 4, 5}, kNoNames);
  auto region = vtkSmartPointer<vtkDoubleArray>::New();
  region->SetName("region");
  region->InsertNextValue(1);
  grid->GetCellData()->AddArray(region);
  EXPECT_EQ(stress_error(grid, StressSpec{"stress", {}, ""}),
            "model.vtu: has no numeric point or cell array named 'stress'; its point arrays are: S (6 components); "
            "its cell arrays are: region");
}

TEST(ReadStress, NonFiniteValueNamesArrayAndFirstBadEntity) {
  auto grid = tetra();
  add_six(grid->GetPointData(), 4, "S", {0, 1, 2, 3, 4, 5}, {"XX", "YY", "ZZ", "XY", "YZ", "XZ"});
  auto* s = grid->GetPointData()->GetArray("S");
  s->SetComponent(2, 4, std::numeric_limits<double>::quiet_NaN());
  s->SetComponent(3, 0, std::numeric_limits<double>::infinity());
  EXPECT_EQ(stress_error(grid, StressSpec{"S", {}, ""}),
            "model.vtu: array 'S' holds a non-finite value (nan) at point 2; fix the solver results or write them again");

  auto cells = tetra();
  add_six(cells->GetCellData(), 1, "C", {0, 1, 2, 3, 4, 5}, {"XX", "YY", "ZZ", "XY", "YZ", "XZ"});
  cells->GetCellData()->GetArray("C")->SetComponent(0, 1, -std::numeric_limits<double>::infinity());
  EXPECT_EQ(stress_error(cells, StressSpec{"C", {}, ""}),
            "model.vtu: array 'C' holds a non-finite value (-inf) at cell 0; fix the solver results or write them again");
}

TEST(ReadStress, ComponentArraysMustShareAnAssociation) {
  auto grid = tetra();
  const char* names[6] = {"a", "b", "c", "d", "e", "f"};
  for (int k = 0; k < 6; ++k) {
    auto arr = vtkSmartPointer<vtkDoubleArray>::New();
    arr->SetName(names[k]);
    arr->SetNumberOfTuples(k == 3 ? 1 : 4);
    arr->Fill(1.0);
    vtkDataSetAttributes* data = k == 3 ? static_cast<vtkDataSetAttributes*>(grid->GetCellData()) : grid->GetPointData();
    data->AddArray(arr);
  }
  StressSpec spec;
  spec.component_arrays = {"a", "b", "c", "d", "e", "f"};
  EXPECT_EQ(stress_error(grid, spec),
            "model.vtu: stress component arrays 'a' (point data) and 'd' (cell data) differ; all six must be point "
            "data or all cell data");
}

// Converting only some points gives exactly the full conversion there and NaN elsewhere, for a tensor array and
// for six scalar arrays; the checks still cover the whole array [D].
TEST(ReadStress, SubsetConvertsOnlyItsEntities) {
  auto grid = tetra();
  add_six(grid->GetPointData(), 4, "S", {0, 1, 2, 3, 4, 5}, {"XX", "YY", "ZZ", "XY", "YZ", "XZ"}, 1e6);
  const char* names[6] = {"Sxx", "Syy", "Szz", "Sxy", "Syz", "Sxz"};
  for (int k = 0; k < 6; ++k) {
    auto a = vtkSmartPointer<vtkDoubleArray>::New();
    a->SetName(names[k]);
    for (vtkIdType p = 0; p < 4; ++p) a->InsertNextValue(1e6 * value(p, k));
    grid->GetPointData()->AddArray(a);
  }
  const Mesh mesh(grid, "t.vtu", LengthUnit::mm);
  StressSubsets only;
  only.points = std::make_shared<EntitySubset>(std::vector<long long>{3, 1, 3}, 4);
  EXPECT_EQ(only.points->ids(), (std::vector<long long>{1, 3}));
  StressSpec tensor, scalars;
  tensor.array = "S";
  scalars.component_arrays = {"Sxx", "Syy", "Szz", "Sxy", "Syz", "Sxz"};
  for (const StressSpec& spec : {tensor, scalars}) {
    const StressField all = read_stress(mesh, spec, StressUnit::Pa);
    const StressField part = read_stress(mesh, spec, StressUnit::Pa, only);
    EXPECT_TRUE(all.holds_all());
    EXPECT_FALSE(part.holds_all());
    ASSERT_EQ(part.size(), 4u);
    for (std::size_t p = 0; p < 4; ++p)
      for (int k = 0; k < 6; ++k) {
        if (p == 1 || p == 3) EXPECT_EQ(part.voigt(p)[k], all.voigt(p)[k]);
        else EXPECT_TRUE(std::isnan(part.voigt(p)[k]));
      }
  }
  // A subset for another entity count (or the cells, when the stress is point data) is not used.
  only.points = std::make_shared<EntitySubset>(std::vector<long long>{1}, 5);
  only.cells = std::make_shared<EntitySubset>(std::vector<long long>{0}, 1);
  EXPECT_TRUE(read_stress(mesh, tensor, StressUnit::Pa, only).holds_all());
}

TEST(ReadStress, SubsetIdsMustBeOnTheMesh) {
  EXPECT_EQ(test::error_of([] { EntitySubset({0, 4}, 4); }),
            "entity subset: id 4 is not one of the mesh's 4 (0 to 4 - 1); the subset must come from the same mesh");
}

}  // namespace
}  // namespace toehold
