// Shell and solid models of one T-joint solved by CalculiX 2.20 (meshes/shell_ccx/): a gusset (8 mm) on a base
// plate (10 mm), a 20 mm wide strip spanning 200 mm between line supports, pulled up at the gusset's top edge
// with F = 600 N. The shell .vtu was converted from ccx's expanded-brick .frd by frd_to_shell_vtu.py; the solid
// is read from ccx's own .frd. Checks: the shell layers read at the read-out points are the solver's numbers,
// the hot-spot stress of the shell against beam theory and against the solid model of the same joint.
#include "toehold/assess/assessment.hpp"
#include "toehold/common/reporter.hpp"
#include "toehold/hotspot/definition.hpp"
#include "toehold/plan/plan.hpp"
#include "toehold/readout/extrapolation.hpp"
#include "toehold/readout/scheme.hpp"
#include "toehold/shell/shell_layers.hpp"
#include "toehold/shell/shell_toe.hpp"

#include "support/support.hpp"

#include <cmath>
#include <fstream>
#include <map>
#include <memory>
#include <string>
#include <tuple>
#include <vector>

namespace toehold {
namespace {

const std::string kDir = std::string(TOEHOLD_SOURCE_DIR) + "/meshes/shell_ccx/";

// The joint (make_decks.py), mm and N.
constexpr double kT = 10.0;      // base plate thickness
constexpr double kTatt = 8.0;    // gusset thickness
constexpr double kL = 100.0;     // half span: supports at y = -100 and +100
constexpr double kB = 20.0;      // strip width along the toe
constexpr double kF = 600.0;     // pull on the gusset

// Beam theory for the base plate, a simply supported beam of span 2L with the central load F: bending moment
// M(d) = F/2 (L - d) at distance d from the mid-span (the intersection line), surface stress
// s(d) = 6 M / (b t^2) = 6 * 300 * (100 - d) / (20 * 100) = 0.9 (100 - d) MPa; the weld side (+z, the gusset
// side) is in tension. s(0) = 90 MPa, s(4) = 86.4 MPa, s(10) = 81.0 MPa. Derived [D].
double beam_surface_stress(double d) { return 6.0 * (kF / 2.0) * (kL - d) / (kB * kT * kT); }

struct ShellModel {
  ShellMesh shells;
  std::unique_ptr<ShellSurface> surface;
  ShellLayerStress layers;
};

ShellModel read_shell_model() {
  NullReporter reporter;
  ShellModel m{read_shell_mesh(kDir + "shell_tjoint.vtu", -1, LengthUnit::mm, {0.0, "thickness"}, reporter),
               nullptr, {}};
  m.surface = std::make_unique<ShellSurface>(m.shells);
  ShellStressSpec spec;
  spec.top.array = "stress_top";
  spec.bottom.array = "stress_bottom";
  m.layers = read_shell_layers(m.shells, spec, StressUnit::MPa);
  return m;
}

// The toe on the base plate's y < 0 side: the intersection line nodes (marker "toe"), the base plate is region 1.
ShellToeSpec toe_spec() {
  ShellToeSpec spec;
  spec.name = "gusset toe";
  spec.marker_array = "toe";
  spec.marker_value = 1;
  spec.region_array = "region";
  spec.plate_value = 1;
  spec.plate_point = Vec3(10.0, -50.0, 0.0);
  return spec;
}

// The station at x = 10 mm (mid-width), with its read-out points at `distances` (mm from the intersection line).
ShellStation mid_station(const ShellModel& m, const std::vector<double>& distances) {
  ShellToe toe = trace_shell_toe(*m.surface, toe_spec());
  for (ShellStation& st : toe.stations) {
    if (std::abs(st.x.x() - 10.0) > 1e-9) continue;
    place_shell_readout(*m.surface, toe_spec(), st, distances);
    return st;
  }
  ADD_FAILURE() << "no station at x = 10 mm";
  return {};
}

// The .frd's own records for the expanded nodes of the shell nodes at x = 10 mm (shell_tjoint_frd_x10.txt,
// verbatim lines: " -1", node number I10, then 3 coordinates or 6 stresses in E12.5). Keyed by the expanded
// node's position (y, z) in mm, rounded to 1e-3 mm.
struct FrdRecord {
  Vec3 x = Vec3::Zero();
  Voigt stress{};  // SXX SYY SZZ SXY SYZ SZX = internal xx, yy, zz, xy, yz, xz
};
std::map<std::pair<long, long>, FrdRecord> read_excerpt() {
  std::ifstream in(kDir + "shell_tjoint_frd_x10.txt");
  EXPECT_TRUE(in.good());
  std::map<std::pair<long, long>, FrdRecord> out;
  std::string label, coords, values;
  while (std::getline(in, label)) {
    if (label.rfind("shell ", 0) != 0) continue;
    std::getline(in, coords);
    std::getline(in, values);
    FrdRecord r;
    for (int k = 0; k < 3; ++k) r.x[k] = std::stod(coords.substr(13 + 12 * static_cast<std::size_t>(k), 12));
    for (int k = 0; k < 6; ++k)
      r.stress[static_cast<std::size_t>(k)] = std::stod(values.substr(13 + 12 * static_cast<std::size_t>(k), 12));
    out[{std::lround(r.x.y() * 1000), std::lround(r.x.z() * 1000)}] = r;
  }
  return out;
}

TEST(CcxShell, ConvertedModelHasTheDecksPlatesThicknessesAndToeLine) {
  const ShellModel m = read_shell_model();
  ASSERT_EQ(m.shells.cell_count(), 56);  // the deck: 2 x 20 base plate and 2 x 8 gusset S8R elements
  const ShellToe toe = trace_shell_toe(*m.surface, toe_spec());
  ASSERT_EQ(toe.stations.size(), 5u);  // 2 quadratic cells along the 20 mm toe: 5 nodes
  for (const ShellStation& st : toe.stations) {
    EXPECT_EQ(st.problem, "");
    EXPECT_CLOSE(st.thickness, kT, 1e-12);            // base plate, from the cell-data array
    EXPECT_EQ(st.layer, ShellLayer::top);             // the gusset stands on the base cells' normal side (+z)
    EXPECT_CLOSE((st.frame.normal - Vec3::UnitZ()).norm(), 0.0, 1e-9);
    EXPECT_CLOSE((st.frame.readout + Vec3::UnitY()).norm(), 0.0, 1e-9);  // towards the plate point, -y
    EXPECT_CLOSE(st.x.y(), 0.0, 1e-12);
    EXPECT_CLOSE(st.x.z(), 0.0, 1e-12);
  }
  for (long long c = 0; c < m.shells.cell_count(); ++c)  // gusset cells 8 mm, base cells 10 mm
    EXPECT_TRUE(m.shells.thickness(c) == kT || m.shells.thickness(c) == kTatt) << c;
}

TEST(CcxShell, LayerReadingsAtReadoutPointsAreTheSolversSurfaceStresses) {
  const ShellModel m = read_shell_model();
  const ReadoutScheme scheme = make_scheme(SchemeKind::fine_linear, HotSpotType::a, kT);
  const ShellStation st = mid_station(m, scheme.distances);
  ASSERT_EQ(st.problem, "");
  const std::vector<Tensor> top = shell_readings(st, m.layers);
  ShellStation other = st;
  other.layer = ShellLayer::bottom;
  const std::vector<Tensor> bottom = shell_readings(other, m.layers);
  const auto records = read_excerpt();
  for (std::size_t i = 0; i < st.points.size(); ++i) {
    // 0.4t = 4 mm and 1.0t = 10 mm fall on shell nodes (4 mm cells: a corner at y = -4, a mid-edge node at
    // y = -10), so the nearest node's .frd record must be reproduced to the reading's round-off.
    const Vec3 p = st.points[i].x;
    EXPECT_CLOSE(p.y(), -scheme.distances[i], 1e-9);
    for (const auto& [side, z, readings] :
         {std::tuple{"top", 5.0, &top}, std::tuple{"bottom", -5.0, &bottom}}) {
      const auto it = records.find({std::lround(p.y() * 1000), std::lround(z * 1000)});
      ASSERT_NE(it, records.end()) << side << " node at y = " << p.y();
      const Voigt read = voigt_from_tensor((*readings)[i]);
      for (std::size_t k = 0; k < 6; ++k)
        EXPECT_CLOSE(read[k], it->second.stress[k], 1e-9) << side << " y " << p.y() << " component " << k;
    }
  }
}

TEST(CcxShell, ShellHotSpotStressFromTheIntersectionLineMatchesBeamTheory) {
  const ShellModel m = read_shell_model();
  const ReadoutScheme scheme = make_scheme(SchemeKind::fine_linear, HotSpotType::a, kT);
  const ShellStation st = mid_station(m, scheme.distances);
  ASSERT_EQ(st.problem, "");
  std::vector<double> s;
  for (const Tensor& t : shell_readings(st, m.layers)) s.push_back(normal_stress(t, st.frame.readout));
  // Beam theory [D] at 4 and 10 mm; 1 % for the S8R solution: the moment is statically determinate, so only the
  // local disturbance of the plate junction (decaying over about one thickness) separates the two [D].
  EXPECT_CLOSE(s[0], beam_surface_stress(4.0), 0.01);
  EXPECT_CLOSE(s[1], beam_surface_stress(10.0), 0.01);
  // IIW type a, fine mesh: 1.67 s(0.4t) - 0.67 s(1.0t) (IIW 2016 sec. 3.3.3, from memory [M]); on the linear
  // beam field it gives s(0) = 90 MPa exactly [D].
  const double hot_spot = extrapolate(scheme, s);
  EXPECT_CLOSE(hot_spot, beam_surface_stress(0.0), 0.01);
  const Tensor tensor_hot_spot = extrapolate(scheme, shell_readings(st, m.layers));
  EXPECT_CLOSE(evaluate(HotSpotDefinition::perpendicular, tensor_hot_spot, st.frame, {}).value, hot_spot, 1e-12);
}

// The solid model through toehold's own solid path: the .frd read directly, the toe at the gusset face
// (y = -4 mm, z = 5 mm), fine-linear read-out on the base plate's top surface. The plan's default loading is a
// range between two steps, so the file's one step is named twice; only its hot-spot stress is used.
double solid_hot_spot_at_mid_width() {
  const char* plan_text = R"(
[model]
file = "solid_tjoint.frd"
length_unit = "mm"
stress_unit = "MPa"
stress = "stress"

[[step]]
name = "pull"

[[step]]
name = "pull again"

[[toe]]
name = "gusset toe"
points = [[0, -4, 5], [20, -4, 5]]
weld_point = [10, 0, 10]
thickness = 10
spacing = 10
scheme = "fine-linear"
curve = "IIW FAT 100"

[requirement]
cycles = 2e6
)";
  test::TempDir dir;
  Plan plan = parse_plan(plan_text, kDir + "plan.toml");
  plan.output_folder = dir.file("out");
  NullReporter reporter;
  const Assessment a = run_assessment(plan, reporter);
  EXPECT_EQ(a.toes.size(), 1u);
  for (const StationResult& r : a.toes.at(0).stations) {
    if (std::abs(r.station.x.x() - 10.0) > 1e-6) continue;
    EXPECT_TRUE(r.ok()) << r.problem;
    EXPECT_CLOSE((r.station.frame.readout + Vec3::UnitY()).norm(), 0.0, 1e-9);
    return r.hot_spot.at(0);
  }
  ADD_FAILURE() << "no solid station at x = 10 mm";
  return 0.0;
}

TEST(CcxShell, SolidHotSpotStressAtTheGussetFaceMatchesBeamTheory) {
  // The solid's toe lies t_att/2 = 4 mm from the mid-span: beam theory gives 86.4 MPa there [D]. The structural
  // stress at a toe is the nominal stress plus the joint's own (linear) structural concentration, which for a
  // thin plate attachment is a few per cent: 5 % allowed (common practice, no source).
  const double solid = solid_hot_spot_at_mid_width();
  EXPECT_GE(solid, beam_surface_stress(kTatt / 2.0));
  EXPECT_LE(solid, 1.05 * beam_surface_stress(kTatt / 2.0));
}

TEST(CcxShell, ShellFromTheIntersectionLineIsConservativeAgainstTheSolid) {
  const ShellModel m = read_shell_model();
  const ReadoutScheme scheme = make_scheme(SchemeKind::fine_linear, HotSpotType::a, kT);
  const ShellStation st = mid_station(m, scheme.distances);
  ASSERT_EQ(st.problem, "");
  std::vector<double> s;
  for (const Tensor& t : shell_readings(st, m.layers)) s.push_back(normal_stress(t, st.frame.readout));
  const double shell = extrapolate(scheme, s);
  const double solid = solid_hot_spot_at_mid_width();
  // A shell model without the weld, read from the intersection line, gives a somewhat higher hot-spot stress
  // than the solid (IIW 2016 sec. 3.3.3 and Niemi, Fricke, Maddox 2018 on shell models, from memory [M]). Here
  // the moment gradient alone makes it 90 / 86.4 = 1.042 [D]; the solid's own structural concentration at the
  // toe takes some of that back. Bounds: higher (conservative), by at most 10 % (1.042 plus the 5 % allowed
  // above, rounded up; common practice, no source).
  EXPECT_GE(shell, solid);
  EXPECT_LE(shell, 1.10 * solid);
}

TEST(CcxShell, ShellReadAtTheGussetFaceAgreesWithTheSolid) {
  // The shell's surface stress carried to the solid's toe position: read-out points at 4 mm + 0.4t and 4 mm +
  // 1.0t from the intersection line, extrapolated linearly to 4 mm (the IIW rule measured from the weld toe
  // instead of the intersection line, the published alternative for shells, from memory [M]; the IACS Common
  // Structural Rules do the same for the flange of web-stiffened cruciform joints, reading the shell stress at
  // a point shifted from the intersection line to the actual weld toe, [4.2.1] of their hot-spot section, seen
  // on imorules.com [S2]). Same location
  // and the same rule as the solid: 3 % (beam theory puts both at 86.4 MPa [D]; the solid's local structural
  // concentration, bounded by 5 % above, is partly captured by the shell's junction; common practice, no source).
  const ShellModel m = read_shell_model();
  const double a = kTatt / 2.0;
  const std::vector<double> at{a + 0.4 * kT, a + 1.0 * kT};
  const ShellStation st = mid_station(m, at);
  ASSERT_EQ(st.problem, "");
  const std::vector<double> w = lagrange_weights(a, at);
  double shell = 0.0;
  const std::vector<Tensor> readings = shell_readings(st, m.layers);
  for (std::size_t i = 0; i < readings.size(); ++i) shell += w[i] * normal_stress(readings[i], st.frame.readout);
  EXPECT_CLOSE(shell, beam_surface_stress(a), 0.01);  // beam theory [D], 1 % as above
  EXPECT_CLOSE(shell, solid_hot_spot_at_mid_width(), 0.03);
}

}  // namespace
}  // namespace toehold
