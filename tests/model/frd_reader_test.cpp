// Reading CalculiX .frd results (meshes/calculix/, solved with ccx 2.20) against facts that do not come from the
// reader: the decks' nodes and elements, element geometry, values printed in the .frd, and equilibrium.
#include "support/support.hpp"
#include "toehold/common/error.hpp"
#include "toehold/model/frd_reader.hpp"
#include "toehold/model/inspect.hpp"
#include "toehold/model/mesh.hpp"

#include <vtkCell.h>
#include <vtkCellData.h>
#include <vtkCellType.h>
#include <vtkDataArray.h>
#include <vtkGenericCell.h>
#include <vtkPointData.h>
#include <vtkPoints.h>

#include <array>
#include <cmath>
#include <fstream>
#include <functional>
#include <map>
#include <sstream>

namespace toehold {
namespace {

using test::error_of;

const std::string kDir = std::string(TOEHOLD_SOURCE_DIR) + "/meshes/calculix/";

class QuietReporter final : public Reporter {
public:
  void info(const std::string& m) override { infos.push_back(m); }
  void warn(const std::string&) override {}
  void progress(const std::string&, std::size_t, std::size_t) override {}
  std::vector<std::string> infos;
};

// The nodes and elements of a CalculiX deck as the test models write them (*NODE and *ELEMENT lines).
struct Deck {
  std::map<long long, std::array<double, 3>> nodes;
  std::map<long long, std::pair<std::string, std::vector<long long>>> elements;  // number -> (type, nodes)
};

std::vector<std::string> split_commas(const std::string& line) {
  std::vector<std::string> out;
  std::stringstream in(line);
  for (std::string item; std::getline(in, item, ',');)
    if (item.find_first_not_of(' ') != std::string::npos) out.push_back(item);
  return out;
}

Deck read_deck(const std::string& path) {
  Deck deck;
  std::ifstream in(path);
  std::string line, section, type;
  long long open = 0;  // element whose node list continues on the next line
  while (std::getline(in, line)) {
    if (line.rfind("**", 0) == 0) continue;
    if (line.rfind("*", 0) == 0) {
      section = line.substr(0, line.find(','));
      const auto t = line.find("TYPE=");
      type = t == std::string::npos ? "" : line.substr(t + 5, line.find(',', t) - t - 5);
      continue;
    }
    const std::vector<std::string> items = split_commas(line);
    if (section == "*NODE") {
      deck.nodes[std::stoll(items[0])] = {std::stod(items[1]), std::stod(items[2]), std::stod(items[3])};
    } else if (section == "*ELEMENT") {
      std::size_t first = 0;
      if (open == 0) {
        open = std::stoll(items[0]);
        deck.elements[open].first = type;
        first = 1;
      }
      for (std::size_t k = first; k < items.size(); ++k) deck.elements[open].second.push_back(std::stoll(items[k]));
      if (line.back() != ',') open = 0;
    }
  }
  return deck;
}

long long node_number(vtkUnstructuredGrid* g, vtkIdType p) {
  return static_cast<long long>(g->GetPointData()->GetArray("frd node")->GetTuple1(p));
}

const char* const kModels[] = {"bar20", "block_tet10", "block_wedge15", "steps_hex8"};

TEST(FrdReader, NodeAndElementCountsAndNumbersMatchTheDeck) {
  for (const std::string model : kModels) {
    SCOPED_TRACE(model);
    const Deck deck = read_deck(kDir + model + ".inp");
    const FrdModel frd = read_frd(kDir + model + ".frd", 0);
    vtkUnstructuredGrid* g = frd.grid;
    ASSERT_EQ(g->GetNumberOfPoints(), static_cast<vtkIdType>(deck.nodes.size()));
    ASSERT_EQ(g->GetNumberOfCells(), static_cast<vtkIdType>(deck.elements.size()));
    for (vtkIdType p = 0; p < g->GetNumberOfPoints(); ++p) {
      const auto& x = deck.nodes.at(node_number(g, p));
      for (int k = 0; k < 3; ++k) EXPECT_CLOSE(g->GetPoint(p)[k], x[static_cast<std::size_t>(k)], 1e-6);
    }
    for (vtkIdType c = 0; c < g->GetNumberOfCells(); ++c)
      EXPECT_EQ(deck.elements.count(static_cast<long long>(g->GetCellData()->GetArray("frd element")->GetTuple1(c))), 1u);
  }
}

// The deck's node order of C3D8, C3D10 and C3D20(R) is VTK's (CalculiX 2.20 manual sec. 6.2, element figures,
// from memory [M]; VTK 9.1 vtkQuadraticHexahedron/vtkQuadraticTetra class documentation [S2]); ccx writes the
// 20-node hexahedron to the .frd in another order, which the reader must undo.
TEST(FrdReader, HexahedronAndTetrahedronNodesComeInTheDeckOrder) {
  for (const std::string model : {"bar20", "block_tet10", "steps_hex8"}) {
    SCOPED_TRACE(model);
    const Deck deck = read_deck(kDir + model + ".inp");
    const FrdModel frd = read_frd(kDir + model + ".frd", 0);
    vtkUnstructuredGrid* g = frd.grid;
    for (vtkIdType c = 0; c < g->GetNumberOfCells(); ++c) {
      const auto& [type, nodes] = deck.elements.at(static_cast<long long>(g->GetCellData()->GetArray("frd element")->GetTuple1(c)));
      if (type == "C3D6") continue;  // wedges are turned over for VTK: see CellsAreRightHanded
      vtkIdType n = 0;
      const vtkIdType* pts = nullptr;
      g->GetCellPoints(c, n, pts);
      ASSERT_EQ(static_cast<std::size_t>(n), nodes.size());
      for (vtkIdType k = 0; k < n; ++k) EXPECT_EQ(node_number(g, pts[k]), nodes[static_cast<std::size_t>(k)]) << type << " node " << k;
    }
  }
}

// Every face of every cell, as VTK's cell class lists it, points out of the cell (face normal . (face centre -
// cell centre) > 0): the node order is right-handed for VTK. Derived [D] from VTK's face definitions.
TEST(FrdReader, CellsAreRightHanded) {
  for (const std::string model : kModels) {
    SCOPED_TRACE(model);
    const FrdModel frd = read_frd(kDir + model + ".frd", 0);
    auto cell = vtkSmartPointer<vtkGenericCell>::New();
    for (vtkIdType c = 0; c < frd.grid->GetNumberOfCells(); ++c) {
      frd.grid->GetCell(c, cell);
      double centre[3] = {0, 0, 0};
      const vtkIdType n = cell->GetNumberOfPoints();
      for (vtkIdType k = 0; k < n; ++k)
        for (int d = 0; d < 3; ++d) centre[d] += cell->GetPoints()->GetPoint(k)[d] / static_cast<double>(n);
      for (int f = 0; f < cell->GetNumberOfFaces(); ++f) {
        vtkCell* face = cell->GetFace(f);
        double a[3], b[3], o[3], fc[3] = {0, 0, 0};
        face->GetPoints()->GetPoint(0, o);
        face->GetPoints()->GetPoint(1, a);
        face->GetPoints()->GetPoint(2, b);
        for (vtkIdType k = 0; k < face->GetNumberOfPoints(); ++k)
          for (int d = 0; d < 3; ++d) fc[d] += face->GetPoints()->GetPoint(k)[d] / static_cast<double>(face->GetNumberOfPoints());
        const double u[3] = {a[0] - o[0], a[1] - o[1], a[2] - o[2]}, v[3] = {b[0] - o[0], b[1] - o[1], b[2] - o[2]};
        const double nrm[3] = {u[1] * v[2] - u[2] * v[1], u[2] * v[0] - u[0] * v[2], u[0] * v[1] - u[1] * v[0]};
        const double out = nrm[0] * (fc[0] - centre[0]) + nrm[1] * (fc[1] - centre[1]) + nrm[2] * (fc[2] - centre[2]);
        EXPECT_GT(out, 0.0) << "cell " << c << " face " << f;
      }
    }
  }
}

// For every edge of every quadratic cell, as VTK's cell class lists it (two corners, then the mid node), the mid
// node lies halfway between the two corners: all edges of these models are straight with their mid nodes at the
// middle (the decks place them so). A mid node in the wrong slot lies on another edge. (Interpolating with VTK's
// shape functions at a mid node's own parametric coordinates would return that node whatever the order, so the
// check is made in space.)
TEST(FrdReader, MidEdgeNodesLieHalfwayAlongTheirEdges) {
  for (const std::string model : {"bar20", "block_tet10", "block_wedge15"}) {
    SCOPED_TRACE(model);
    const FrdModel frd = read_frd(kDir + model + ".frd", 0);
    auto cell = vtkSmartPointer<vtkGenericCell>::New();
    int checked = 0;
    for (vtkIdType c = 0; c < frd.grid->GetNumberOfCells(); ++c) {
      frd.grid->GetCell(c, cell);
      for (int e = 0; e < cell->GetNumberOfEdges(); ++e) {
        vtkPoints* p = cell->GetEdge(e)->GetPoints();
        ASSERT_EQ(p->GetNumberOfPoints(), 3);
        for (int d = 0; d < 3; ++d)
          EXPECT_NEAR(p->GetPoint(2)[d], 0.5 * (p->GetPoint(0)[d] + p->GetPoint(1)[d]), 1e-9) << "cell " << c << " edge " << e;
        ++checked;
      }
    }
    EXPECT_GT(checked, 0);
  }
}

// bar20.frd, STRESS block of step 1, the record of node 2470 at (0, 0, 5), read by eye:
//  -1      2470 5.01650E+01 1.64499E+01 1.62039E+01 1.30463E+01 4.53595E-14 8.55982E-14
// (SXX SYY SZZ SXY SYZ SZX). z = 5 is a symmetry plane of the bar, so the zx shear there is 0 while xy is not.
TEST(FrdReader, StressAtANodeIsThePrintedRecordWithComponentNames) {
  const FrdModel frd = read_frd(kDir + "bar20.frd", -1);
  vtkUnstructuredGrid* g = frd.grid;
  vtkDataArray* s = g->GetPointData()->GetArray("stress");
  ASSERT_NE(s, nullptr);
  const char* names[6] = {"XX", "YY", "ZZ", "XY", "YZ", "XZ"};
  for (int k = 0; k < 6; ++k) EXPECT_STREQ(s->GetComponentName(k), names[k]);
  vtkIdType p = -1;
  for (vtkIdType i = 0; i < g->GetNumberOfPoints(); ++i)
    if (node_number(g, i) == 2470) p = i;
  ASSERT_GE(p, 0);
  const double expected[6] = {50.1650, 16.4499, 16.2039, 13.0463, 4.53595e-14, 8.55982e-14};
  for (int k = 0; k < 6; ++k) EXPECT_CLOSE(s->GetComponent(p, k), expected[k], 1e-6);
  const double z_disp = g->GetPointData()->GetArray("displacement")->GetComponent(p, 2);
  EXPECT_NEAR(z_disp, 0.0, 1e-12);  // clamped node, printed as 0.00000E+00
}

// Rollers on x = 0, y = 0, z = 0 and a uniform traction T on x = L: the exact solution is sxx = T, all other
// components 0, at every node (linear elasticity, derived [D]); the elements represent it exactly.
TEST(FrdReader, UniformTensionGivesTheTractionAtEveryNode) {
  for (const auto& [model, traction] : {std::pair<std::string, double>{"block_tet10", 30.0}, {"block_wedge15", 25.0}}) {
    SCOPED_TRACE(model);
    const FrdModel frd = read_frd(kDir + model + ".frd", 0);
    vtkDataArray* s = frd.grid->GetPointData()->GetArray("stress");
    for (vtkIdType p = 0; p < s->GetNumberOfTuples(); ++p) {
      EXPECT_CLOSE(s->GetComponent(p, 0), traction, 1e-4);
      for (int k = 1; k < 6; ++k) EXPECT_NEAR(s->GetComponent(p, k), 0.0, 1e-3);
    }
  }
}

TEST(FrdReader, StepsAreListedAndSelected) {
  const std::string file = kDir + "steps_hex8.frd";
  const std::vector<FrdStep> steps = frd_steps(file);
  ASSERT_EQ(steps.size(), 2u);
  EXPECT_EQ(steps[0].number, 1);
  EXPECT_EQ(steps[1].number, 2);
  EXPECT_DOUBLE_EQ(steps[0].value, 1.0);  // ccx: total time 1 after the first static step, 2 after the second
  EXPECT_DOUBLE_EQ(steps[1].value, 2.0);
  EXPECT_EQ(steps[0].blocks, (std::vector<std::string>{"DISP", "STRESS", "ERROR"}));
  // The deck's traction: 40 MPa in step 1, -20 MPa in step 2 (*CLOAD, OP=NEW), uniform stress [D].
  for (const auto& [step, traction] : {std::pair<int, double>{0, 40.0}, {1, -20.0}}) {
    const FrdModel frd = read_frd(file, step);
    EXPECT_EQ(frd.step, step);
    vtkDataArray* s = frd.grid->GetPointData()->GetArray("stress");
    for (vtkIdType p = 0; p < s->GetNumberOfTuples(); ++p) EXPECT_CLOSE(s->GetComponent(p, 0), traction, 1e-4);
  }
  EXPECT_EQ(read_frd(file, 0).element_types, (std::map<std::string, long long>{{"6-node wedge", 16}, {"8-node hexahedron", 8}}));
}

TEST(FrdReader, StepThatDoesNotExistNamesTheSteps) {
  const std::string file = kDir + "steps_hex8.frd";
  EXPECT_EQ(error_of([&] { read_frd(file, 2); }), file + ": has no result step 2; it has 2 (steps 0 to 1)");
  EXPECT_EQ(error_of([&] { read_frd(file, -1); }), file + ": has 2 result steps; name the step to use (steps 0 to 1)");
}

// Section averages over 3 x 3 Gauss points per element face (exact for the biquadratic face interpolation of the
// 20-node hexahedron): in the clamped bar, every cross-section carries F = 5000 N over A = 100 mm2, so the mean
// sxx is F/A = 50 MPa and the mean shears are 0 (equilibrium of the part beyond the section, derived [D]).
// ccx's nodal stresses are extrapolated and averaged, so equilibrium holds to discretization accuracy only.
TEST(FrdReader, SectionAverageOfTheBarEqualsLoadOverArea) {
  const FrdModel frd = read_frd(kDir + "bar20.frd", 0);
  vtkDataArray* s = frd.grid->GetPointData()->GetArray("stress");
  const double g[3] = {0.5 - 0.5 * std::sqrt(0.6), 0.5, 0.5 + 0.5 * std::sqrt(0.6)}, gw[3] = {5.0 / 18, 8.0 / 18, 5.0 / 18};
  auto cell = vtkSmartPointer<vtkGenericCell>::New();
  for (double section : {5.0, 15.0, 25.0, 35.0, 45.0}) {
    SCOPED_TRACE(section);
    std::array<double, 6> force{};
    double area = 0.0;
    for (vtkIdType c = 0; c < frd.grid->GetNumberOfCells(); ++c) {
      frd.grid->GetCell(c, cell);
      double b[6];
      cell->GetBounds(b);
      if (b[0] != section) continue;  // faces r = 0 of the cells that start at the section (r runs along x)
      const double face_area = (b[3] - b[2]) * (b[5] - b[4]);
      double w[20];
      for (int i = 0; i < 3; ++i)
        for (int j = 0; j < 3; ++j) {
          const double pc[3] = {0.0, g[i], g[j]};
          cell->InterpolateFunctions(pc, w);
          double x = 0.0;
          for (int k = 0; k < 20; ++k) x += w[k] * cell->GetPoints()->GetPoint(k)[0];
          ASSERT_NEAR(x, section, 1e-9);
          for (int comp = 0; comp < 6; ++comp)
            for (int k = 0; k < 20; ++k)
              force[static_cast<std::size_t>(comp)] += gw[i] * gw[j] * face_area * w[k] * s->GetComponent(cell->GetPointId(k), comp);
          area += gw[i] * gw[j] * face_area;
        }
    }
    EXPECT_CLOSE(area, 100.0, 1e-12);
    EXPECT_CLOSE(force[0] / area, 50.0, 5e-3);
    EXPECT_NEAR(force[3] / area, 0.0, 0.25);  // xy
    EXPECT_NEAR(force[5] / area, 0.0, 0.25);  // xz
  }
}

TEST(FrdReader, MaterialNumbersBecomeACellArray) {
  const FrdModel frd = read_frd(kDir + "bar20.frd", 0);
  EXPECT_EQ(frd.materials, (std::map<int, std::string>{{1, "STEEL_A"}, {2, "STEEL_B"}}));
  vtkDataArray* m = frd.grid->GetCellData()->GetArray("frd material");
  ASSERT_NE(m, nullptr);
  auto cell = vtkSmartPointer<vtkGenericCell>::New();
  for (vtkIdType c = 0; c < frd.grid->GetNumberOfCells(); ++c) {
    frd.grid->GetCell(c, cell);
    double b[6];
    cell->GetBounds(b);
    EXPECT_EQ(m->GetTuple1(c), b[1] <= 25.0 ? 1.0 : 2.0);  // the deck: STEEL_A for x < 25
  }
}

TEST(FrdReader, ReadMeshAcceptsFrdAndConvertsUnits) {
  QuietReporter reporter;
  const Mesh mesh = read_mesh(kDir + "steps_hex8.frd", 1, LengthUnit::m, reporter);
  double b[6];
  mesh.grid()->GetBounds(b);
  EXPECT_CLOSE(b[1], 20000.0, 1e-12);  // 20 "m" in the file read as 20000 mm
  EXPECT_EQ(mesh.grid()->GetNumberOfCells(), 24);
  ASSERT_EQ(reporter.infos.size(), 1u);
  EXPECT_EQ(reporter.infos[0], "steps_hex8.frd: CalculiX results, result step 1 (step value 2) of 2 (steps 0 to 1), "
                               "blocks DISP, STRESS, ERROR");
}

TEST(FrdReader, InspectShowsTheFirstStep) {
  QuietReporter reporter;
  const ModelSummary s = inspect_model(kDir + "steps_hex8.frd", reporter);
  EXPECT_EQ(s.cells, 24);
  ASSERT_FALSE(s.remarks.empty());
  EXPECT_EQ(s.remarks[0], "CalculiX results, result step 0 (step value 1) of 2 (steps 0 to 1), blocks DISP, STRESS, ERROR");
  bool stress = false;
  for (const ArrayInfo& a : s.arrays)
    if (a.name == "stress") stress = a.looks_like == "stress tensor (order from names: xx=XX, yy=YY, zz=ZZ, xy=XY, yz=YZ, xz=XZ)";
  EXPECT_TRUE(stress);
}

}  // namespace
}  // namespace toehold
