// Shell toes on the gmsh plate-with-attachment models (meshes/shell/), with a
// stress field prescribed in the test: layer choice, membrane + bending,
// read-out from the intersection line and from the weld toe, normal flips,
// top/bottom swap with flipped normals, rotation, and bad input.
#include "toehold/shell/normal_check.hpp"
#include "toehold/shell/shell_layers.hpp"
#include "toehold/shell/shell_toe.hpp"

#include "support/support.hpp"
#include "toehold/common/error.hpp"

#include <gmock/gmock.h>
#include <vtkCellData.h>
#include <vtkDoubleArray.h>
#include <vtkIdList.h>
#include <vtkIntArray.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkUnstructuredGridReader.h>

#include <cmath>
#include <functional>
#include <string>

namespace toehold {
namespace {

using ::testing::HasSubstr;

std::string model(const std::string &name) {
  return std::string(TOEHOLD_SOURCE_DIR) + "/meshes/shell/" + name;
}

vtkSmartPointer<vtkUnstructuredGrid> read_gmsh(const std::string &name) {
  vtkNew<vtkUnstructuredGridReader> reader;
  reader->SetFileName(model(name).c_str());
  reader->Update();
  vtkSmartPointer<vtkUnstructuredGrid> grid = reader->GetOutput();
  return grid;
}

// The prescribed surface stresses of the base plate (z = 0), MPa, as functions
// of position (mm): on the +z surface s_yy = 200 - 1.5|y| + 0.1x, s_xx = 40; on
// the -z surface s_yy = -50 + 0.5|y|, s_xx = 10. Linear on each side of the
// intersection line, so quadratic and linear cells reproduce them exactly [D].
Tensor plus_z(const Vec3 &x) {
  Tensor s = Tensor::Zero();
  s(1, 1) = 200.0 - 1.5 * std::abs(x.y()) + 0.1 * x.x();
  s(0, 0) = 40.0;
  return s;
}
Tensor minus_z(const Vec3 &x) {
  Tensor s = Tensor::Zero();
  s(1, 1) = -50.0 + 0.5 * std::abs(x.y());
  s(0, 0) = 10.0;
  return s;
}

void add_tensor_array(vtkUnstructuredGrid *grid, const char *name,
                      const std::function<Tensor(vtkIdType)> &value) {
  vtkNew<vtkDoubleArray> a;
  a->SetName(name);
  a->SetNumberOfComponents(6);
  const char *names[6] = {"XX", "YY", "ZZ", "XY", "YZ", "XZ"};
  for (int k = 0; k < 6; ++k)
    a->SetComponentName(k, names[k]);
  a->SetNumberOfTuples(grid->GetNumberOfPoints());
  for (vtkIdType p = 0; p < grid->GetNumberOfPoints(); ++p) {
    const Voigt v = voigt_from_tensor(value(p));
    a->SetTuple(p, v.data());
  }
  grid->GetPointData()->AddArray(a);
}

Vec3 point_of(vtkUnstructuredGrid *grid, vtkIdType p) {
  Vec3 x;
  grid->GetPoint(p, x.data());
  return x;
}

// Node order reversed (the cell normal flips), for 8-node quadrilaterals and
// 6-node triangles.
void reverse_cell(vtkUnstructuredGrid *grid, vtkIdType c) {
  vtkNew<vtkIdList> ids;
  grid->GetCellPoints(c, ids);
  const std::vector<int> quad8{0, 3, 2, 1, 7, 6, 5, 4}, tri6{0, 2, 1, 5, 4, 3};
  const std::vector<int> &order = ids->GetNumberOfIds() == 8 ? quad8 : tri6;
  std::vector<vtkIdType> flipped;
  for (int k : order)
    flipped.push_back(ids->GetId(k));
  grid->ReplaceCell(c, static_cast<int>(flipped.size()), flipped.data());
}

// Layer arrays: "S_top" holds the stress of the surface the base plate's cells
// call top. The model may be turned by R: positions x = R x0, tensors R S(x0)
// R^T. `base_up`: the base cells' normals point along R e_z.
void add_layers(vtkUnstructuredGrid *grid, bool base_up,
                const Eigen::Matrix3d &R) {
  auto turned = [&](Tensor (*f)(const Vec3 &), vtkIdType p) {
    return Tensor(R * f(R.transpose() * point_of(grid, p)) * R.transpose());
  };
  add_tensor_array(grid, "S_top", [&](vtkIdType p) {
    return turned(base_up ? plus_z : minus_z, p);
  });
  add_tensor_array(grid, "S_bot", [&](vtkIdType p) {
    return turned(base_up ? minus_z : plus_z, p);
  });
}

struct Model {
  ShellMesh shells;
  std::unique_ptr<ShellSurface> surface;
  ShellLayerStress layers;
};

// Reads the gmsh model, lets `edit` change its cells, turns it by R and adds
// the layers.
Model make_model(const std::string &file,
                 const std::function<void(vtkUnstructuredGrid *)> &edit = {},
                 const Eigen::Matrix3d &R = Eigen::Matrix3d::Identity()) {
  auto grid = read_gmsh(file);
  if (edit)
    edit(grid);
  for (vtkIdType p = 0; p < grid->GetNumberOfPoints(); ++p) {
    const Vec3 x = R * point_of(grid, p);
    grid->GetPoints()->SetPoint(p, x.data());
  }
  const ShellMesh probe =
      make_shell_mesh(grid, file, LengthUnit::mm, {10.0, ""});
  const Vec3 up = R * Vec3::UnitZ();
  long long base = 0;
  while (base + 1 < probe.cell_count() &&
         std::abs(probe.normal(base).dot(up)) < 0.9)
    ++base;
  add_layers(grid, probe.normal(base).dot(up) > 0, R);
  Model m{make_shell_mesh(grid, file, LengthUnit::mm, {10.0, ""}), nullptr, {}};
  m.surface = std::make_unique<ShellSurface>(m.shells);
  ShellStressSpec spec;
  spec.top.array = "S_top";
  spec.bottom.array = "S_bot";
  m.layers = read_shell_layers(m.shells, spec, StressUnit::MPa);
  return m;
}

ShellToeSpec toe_spec() {
  ShellToeSpec spec;
  spec.name = "toe 1";
  spec.points = {{-50, 0, 0}, {50, 0, 0}};
  spec.plate_point = Vec3(0, -30, 0);
  return spec;
}

// s_yy read at each station (MPa): r . S . r with r the read-out direction.
std::vector<double>
readout_normal(const Model &m, const ShellToeSpec &spec,
               const std::vector<double> &distances,
               std::vector<ShellStation> *stations = nullptr) {
  ShellToe toe = trace_shell_toe(*m.surface, spec);
  std::vector<double> out;
  for (ShellStation &st : toe.stations) {
    place_shell_readout(*m.surface, spec, st, distances);
    EXPECT_EQ(st.problem, "");
    for (const Tensor &s : shell_readings(st, m.layers))
      out.push_back(normal_stress(s, st.frame.readout));
  }
  if (stations)
    *stations = toe.stations;
  return out;
}

TEST(ShellToe, ReadsTheWeldSideLayerFromTheIntersectionLine) {
  for (const char *file :
       {"plate_attachment_quad8.vtk", "plate_attachment_tri6.vtk"}) {
    const Model m = make_model(file);
    std::vector<ShellStation> stations;
    const std::vector<double> s =
        readout_normal(m, toe_spec(), {4.0, 10.0}, &stations);
    ASSERT_EQ(stations.size(), 21u)
        << file; // 10 mm quadratic cells over 100 mm: 21 nodes on the line
    for (std::size_t i = 0; i < stations.size(); ++i) {
      const ShellStation &st = stations[i];
      EXPECT_CLOSE((st.frame.normal - Vec3::UnitZ()).norm(), 0.0,
                   1e-9); // the attachment stands at +z
      EXPECT_CLOSE((st.frame.readout + Vec3::UnitY()).norm(), 0.0,
                   1e-9); // towards the plate point, -y
      const double x = st.x.x();
      EXPECT_CLOSE(s[2 * i], 200.0 - 1.5 * 4.0 + 0.1 * x, 1e-9)
          << file; // +z surface at y = -4 [D]
      EXPECT_CLOSE(s[2 * i + 1], 200.0 - 1.5 * 10.0 + 0.1 * x,
                   1e-9);                        // and at y = -10 [D]
      EXPECT_CLOSE(st.hot_spot.z(), 5.0, 1e-12); // t/2 above the mid-surface
    }
  }
}

TEST(ShellToe, PlanLayerOverridesTheWeldSide) {
  const Model m = make_model("plate_attachment_quad8.vtk");
  ShellToeSpec spec = toe_spec();
  spec.layer = LayerChoice::bottom;
  std::vector<ShellStation> st;
  const std::vector<double> s = readout_normal(m, spec, {4.0}, &st);
  // "bottom" is the surface opposite the base cells' own normal, whichever way
  // gmsh wound them.
  const bool up = m.shells.normal(m.surface->facet(st[0].facet).cell).z() > 0;
  EXPECT_CLOSE(st[0].frame.normal.z(), up ? -1.0 : 1.0, 1e-9);
  EXPECT_CLOSE(s[0],
               up ? -50.0 + 0.5 * 4.0 : 200.0 - 1.5 * 4.0 + 0.1 * st[0].x.x(),
               1e-9); // [D]
}

TEST(ShellToe, WeldToeOriginShiftsReadoutByHalfAttachmentPlusLeg) {
  const Model m = make_model("plate_attachment_quad8.vtk");
  ShellToeSpec spec = toe_spec();
  spec.origin = ToeOrigin::weld_toe;
  spec.weld_leg_mm = 6.0;
  std::vector<ShellStation> stations;
  const std::vector<double> s = readout_normal(m, spec, {4.0, 10.0}, &stations);
  // Offset = 10/2 + 6 = 11 mm [D]; points at 15 and 21 mm from the intersection
  // line.
  EXPECT_CLOSE(stations[3].offset, 11.0, 1e-12);
  EXPECT_CLOSE(stations[3].points[0].from_intersection, 15.0, 1e-9);
  EXPECT_CLOSE(stations[3].points[1].distance, 10.0, 1e-12);
  const double x = stations[3].x.x();
  EXPECT_CLOSE(s[2 * 3], 200.0 - 1.5 * 15.0 + 0.1 * x, 1e-9);
  EXPECT_CLOSE(s[2 * 3 + 1], 200.0 - 1.5 * 21.0 + 0.1 * x, 1e-9);
  EXPECT_CLOSE(stations[3].hot_spot.y(), -11.0, 1e-9);
}

TEST(ShellToe, FlippedNormalsWithSwappedLayersGiveTheSameAnswer) {
  const Model plain = make_model("plate_attachment_quad8.vtk");
  const Model flipped =
      make_model("plate_attachment_quad8.vtk", [](vtkUnstructuredGrid *g) {
        for (vtkIdType c = 0; c < g->GetNumberOfCells(); ++c)
          if (g->GetCellType(c) == VTK_QUADRATIC_QUAD)
            reverse_cell(g, c);
      });
  const auto a = readout_normal(plain, toe_spec(), {4.0, 10.0});
  const auto b = readout_normal(flipped, toe_spec(), {4.0, 10.0});
  ASSERT_EQ(a.size(), b.size());
  for (std::size_t i = 0; i < a.size(); ++i)
    EXPECT_CLOSE(b[i], a[i], 1e-9);
}

TEST(ShellToe, RotationLeavesReadoutUnchanged) {
  const Eigen::Matrix3d R =
      Eigen::AngleAxisd(0.7, Vec3(1, 2, 3).normalized()).toRotationMatrix();
  const Model plain = make_model("plate_attachment_tri6.vtk");
  const Model turned = make_model("plate_attachment_tri6.vtk", {}, R);
  ShellToeSpec spec_r = toe_spec();
  for (Vec3 &x : spec_r.points)
    x = R * x;
  const Vec3 plate_point(0, -30, 0);
  spec_r.plate_point = Vec3(R * plate_point);
  std::vector<ShellStation> st;
  const auto a = readout_normal(plain, toe_spec(), {4.0, 10.0});
  const auto b = readout_normal(turned, spec_r, {4.0, 10.0}, &st);
  ASSERT_EQ(a.size(), b.size());
  for (std::size_t i = 0; i < a.size(); ++i)
    EXPECT_CLOSE(b[i], a[i], 1e-9);
  EXPECT_CLOSE((R.transpose() * st[4].frame.readout + Vec3::UnitY()).norm(),
               0.0, 1e-9);
}

TEST(ShellToe, FlippedCellNearTheToeIsReportedPerStation) {
  vtkIdType flipped_cell = -1;
  const Model m =
      make_model("plate_attachment_quad8.vtk", [&](vtkUnstructuredGrid *g) {
        for (vtkIdType c = 0; c < g->GetNumberOfCells() && flipped_cell < 0;
             ++c) {
          if (g->GetCellType(c) != VTK_QUADRATIC_QUAD)
            continue;
          double centre[3] = {0, 0, 0}, pc[3] = {0.5, 0.5, 0}, w[8];
          int sub = 0;
          g->GetCell(c)->EvaluateLocation(sub, pc, centre, w);
          if (std::abs(centre[2]) < 1e-9 && centre[1] < 0 && centre[1] > -10 &&
              centre[0] > 0 && centre[0] < 12)
            flipped_cell = c;
        }
        reverse_cell(g, flipped_cell);
      });
  ShellToeSpec spec = toe_spec();
  ShellToe toe = trace_shell_toe(*m.surface, spec);
  int flagged = 0;
  for (ShellStation &st : toe.stations) {
    place_shell_readout(*m.surface, spec, st, {4.0, 10.0});
    if (st.problem.empty())
      continue;
    ++flagged;
    EXPECT_THAT(st.problem, HasSubstr("toe 1 station " + std::to_string(st.id) +
                                      ": shell normals flip between cells"));
    EXPECT_THAT(st.problem, HasSubstr("give the plate's shell cells one "
                                      "node-order sense (consistent normals)"));
    EXPECT_GT(st.x.x(), -15.0);
    EXPECT_LT(st.x.x(), 25.0);
  }
  EXPECT_GE(flagged, 1);
  EXPECT_LT(flagged, 21);
}

TEST(ShellToe, MembraneAndBendingRecombineIntoTheLayers) {
  auto grid = read_gmsh("plate_attachment_quad8.vtk");
  // m = (plus + minus)/2 and b = (plus - minus)/2 for a base normal along +z;
  // the recombined top must be `plus`.
  add_tensor_array(grid, "S_m", [&](vtkIdType p) -> Tensor {
    return 0.5 * (plus_z(point_of(grid, p)) + minus_z(point_of(grid, p)));
  });
  add_tensor_array(grid, "S_b", [&](vtkIdType p) -> Tensor {
    return 0.5 * (plus_z(point_of(grid, p)) - minus_z(point_of(grid, p)));
  });
  const ShellMesh shells =
      make_shell_mesh(grid, "m+b", LengthUnit::mm, {10.0, ""});
  ShellStressSpec spec;
  spec.membrane.array = "S_m";
  spec.bending.array = "S_b";
  const ShellLayerStress layers =
      read_shell_layers(shells, spec, StressUnit::MPa);
  for (vtkIdType p : {0, 5, 100}) {
    const Vec3 x = point_of(grid, p);
    EXPECT_CLOSE(
        (layers.top.tensor(static_cast<std::size_t>(p)) - plus_z(x)).norm(),
        0.0, 1e-12);
    EXPECT_CLOSE(
        (layers.bottom.tensor(static_cast<std::size_t>(p)) - minus_z(x)).norm(),
        0.0, 1e-12);
  }
  // Hand numbers: top 120, bottom -40 -> membrane 40, bending 80 [D].
  Tensor top = Tensor::Zero(), bottom = Tensor::Zero();
  top(0, 0) = 120.0;
  bottom(0, 0) = -40.0;
  EXPECT_CLOSE(membrane_part(top, bottom)(0, 0), 40.0, 1e-12);
  EXPECT_CLOSE(bending_part(top, bottom)(0, 0), 80.0, 1e-12);
}

TEST(ShellToe, GmshModelHasConsistentNormalsOnEachPlate) {
  const Model m = make_model("plate_attachment_quad8.vtk");
  std::vector<long long> all;
  for (long long c = 0; c < m.shells.cell_count(); ++c)
    all.push_back(c);
  EXPECT_EQ(describe(find_normal_flips(*m.surface, all, 30.0)), "");
}

TEST(ShellToe, PathLeavingThePlateIsAStationProblem) {
  const Model m = make_model("plate_attachment_quad8.vtk");
  ShellToeSpec spec = toe_spec();
  spec.origin = ToeOrigin::weld_toe;
  spec.weld_leg_mm = 45.0; // offset 50 mm: the 10 mm point would lie 60 mm out,
                           // on the plate edge y = -60
  ShellToe toe = trace_shell_toe(*m.surface, spec);
  place_shell_readout(*m.surface, spec, toe.stations[0], {4.0, 12.0});
  EXPECT_EQ(toe.stations[0].problem,
            "toe 1 station 1: the read-out path reaches an open edge of the "
            "plate 60 mm "
            "from the start, before the read-out point at 12 mm from the "
            "hot-spot location");
  EXPECT_EQ(toe.stations[0].points.size(), 1u);
}

TEST(ShellToeErrors, NamesWhatIsMissing) {
  const Model m = make_model("plate_attachment_quad8.vtk");
  ShellToeSpec spec = toe_spec();
  spec.plate_point.reset();
  try {
    trace_shell_toe(*m.surface, spec);
    FAIL();
  } catch (const Error &e) {
    EXPECT_EQ(std::string(e.what()),
              "toe 1: say which plate carries the toe: a region array value or "
              "a point on the plate");
  }
  spec = toe_spec();
  spec.origin = ToeOrigin::weld_toe;
  try {
    trace_shell_toe(*m.surface, spec);
    FAIL();
  } catch (const Error &e) {
    EXPECT_EQ(std::string(e.what()),
              "toe 1: the read-out measured from the weld toe needs the weld "
              "leg (a positive number of mm)");
  }
  spec = toe_spec();
  spec.region_array = "part";
  EXPECT_THROW(trace_shell_toe(*m.surface, spec), Error);
  spec = toe_spec();
  spec.points = {{-50, -30, 0},
                 {50, -30, 0}}; // on the plate, not on the intersection line
  try {
    trace_shell_toe(*m.surface, spec);
    FAIL();
  } catch (const Error &e) {
    EXPECT_THAT(
        std::string(e.what()),
        HasSubstr("toe 1: found 0 toe nodes on a plate intersection line"));
  }
}

TEST(ShellToeErrors, MissingLayerArraysAndThickness) {
  auto grid = read_gmsh("plate_attachment_quad8.vtk");
  try {
    make_shell_mesh(grid, "plate.vtk", LengthUnit::mm, {});
    FAIL();
  } catch (const Error &e) {
    EXPECT_EQ(std::string(e.what()), "plate.vtk: no shell thickness is given; "
                                     "give the plate thickness in the plan "
                                     "or name a cell-data thickness array");
  }
  EXPECT_THROW(make_shell_mesh(grid, "plate.vtk", LengthUnit::mm, {0.0, "t"}),
               Error);
  const ShellMesh shells =
      make_shell_mesh(grid, "plate.vtk", LengthUnit::mm, {10.0, ""});
  try {
    read_shell_layers(shells, {}, StressUnit::MPa);
    FAIL();
  } catch (const Error &e) {
    EXPECT_EQ(
        std::string(e.what()),
        "plate.vtk: no shell stress layer arrays are named; name the top and "
        "bottom "
        "surface stress arrays, or the membrane and bending stress arrays");
  }
  ShellStressSpec half;
  half.top.array = "S_top";
  try {
    read_shell_layers(shells, half, StressUnit::MPa);
    FAIL();
  } catch (const Error &e) {
    EXPECT_EQ(std::string(e.what()), "plate.vtk: the top stress array is named "
                                     "but the bottom one is not; name both");
  }
  ShellStressSpec absent;
  absent.top.array = "S_top";
  absent.bottom.array = "S_bot";
  EXPECT_THROW(read_shell_layers(shells, absent, StressUnit::MPa),
               Error); // read_stress names the array
}

TEST(ShellMesh, ReadsTheGmshFileAndItsThicknessArray) {
  NullReporter reporter;
  const ShellMesh shells =
      read_shell_mesh(model("plate_attachment_quad8.vtk"), -1, LengthUnit::mm,
                      {8.0, ""}, reporter);
  EXPECT_EQ(shells.cell_count(),
            344); // gmsh's 448 cells less 8 vertices and 96 lines
  EXPECT_CLOSE(shells.thickness(0), 8.0, 1e-12);
  auto grid = read_gmsh("plate_attachment_quad8.vtk");
  vtkNew<vtkDoubleArray> t;
  t->SetName("thick");
  for (vtkIdType c = 0; c < grid->GetNumberOfCells(); ++c)
    t->InsertNextValue(0.012); // m
  grid->GetCellData()->AddArray(t);
  const ShellMesh in_m =
      make_shell_mesh(grid, "plate", LengthUnit::m, {0.0, "thick"});
  EXPECT_CLOSE(in_m.thickness(10), 12.0, 1e-12); // 0.012 m = 12 mm
  EXPECT_CLOSE(in_m.point(0).norm(), 50.0 * 1000.0,
               1e-9); // point 0 is (-50, 0, 0) in the file, read as m
}

} // namespace
} // namespace toehold
