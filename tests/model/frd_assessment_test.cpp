// The whole assessment on a CalculiX .frd gives the same stations and hot-spot stresses as on the same results
// written to .vtu, and the values the deck's loads imply.
#include "support/support.hpp"
#include "toehold/assess/assessment.hpp"
#include "toehold/model/frd_reader.hpp"
#include "toehold/plan/plan.hpp"

#include <vtkXMLUnstructuredGridWriter.h>

namespace toehold {
namespace {

using test::TempDir;

const std::string kDir = std::string(TOEHOLD_SOURCE_DIR) + "/meshes/calculix/";

class QuietReporter final : public Reporter {
public:
  void info(const std::string&) override {}
  void warn(const std::string&) override {}
  void progress(const std::string&, std::size_t, std::size_t) override {}
};

// steps_hex8 (20 x 10 x 10 mm, rollers): a toe across the top face at x = 10 with the "attachment" on the x < 10
// side, t = 5 mm, so the fine-linear read-out points (0.4t, 1.0t) sit at x = 12 and 15.
const char* kPlan = R"(
[model]
file = "steps_hex8.frd"
length_unit = "mm"
stress_unit = "MPa"
stress = "stress"

[[step]]
name = "pull"

[[step]]
name = "push"

[[toe]]
name = "across"
points = [[10, 1, 10], [10, 9, 10]]
weld_point = [5, 5, 9]
thickness = 5
spacing = 2
scheme = "fine-linear"
curve = "IIW FAT 100"

[requirement]
cycles = 2e6
)";

void write_vtu(vtkUnstructuredGrid* grid, const std::string& path) {
  auto w = vtkSmartPointer<vtkXMLUnstructuredGridWriter>::New();
  w->SetFileName(path.c_str());
  w->SetInputData(grid);
  ASSERT_EQ(w->Write(), 1);
}

TEST(FrdAssessment, SameResultsAsTheResultsWrittenToVtu) {
  // The plan format takes pvd_step for .pvd files only, so the steps of the .frd are set here.
  Plan frd_plan = parse_plan(kPlan, kDir + "plan.toml");
  for (std::size_t i = 0; i < frd_plan.steps.size(); ++i) frd_plan.steps[i].step = static_cast<int>(i);
  TempDir dir;
  frd_plan.output_folder = dir.file("out-frd");
  Plan vtu_plan = frd_plan;
  for (std::size_t i = 0; i < vtu_plan.steps.size(); ++i) {
    const std::string vtu = dir.file("step" + std::to_string(i) + ".vtu");
    write_vtu(read_frd(kDir + "steps_hex8.frd", static_cast<int>(i)).grid, vtu);
    vtu_plan.steps[i].file = vtu;
    vtu_plan.steps[i].step = -1;
  }
  vtu_plan.model.file = vtu_plan.steps[0].file;
  vtu_plan.output_folder = dir.file("out-vtu");
  QuietReporter reporter;
  const Assessment from_frd = run_assessment(frd_plan, reporter);
  const Assessment from_vtu = run_assessment(vtu_plan, reporter);
  ASSERT_EQ(from_frd.toes.size(), 1u);
  const auto& a = from_frd.toes[0].stations;
  const auto& b = from_vtu.toes[0].stations;
  ASSERT_EQ(a.size(), b.size());
  ASSERT_GE(a.size(), 3u);
  for (std::size_t s = 0; s < a.size(); ++s) {
    ASSERT_TRUE(a[s].ok()) << a[s].problem;
    ASSERT_TRUE(b[s].ok()) << b[s].problem;
    for (std::size_t k = 0; k < 2; ++k) EXPECT_CLOSE(a[s].hot_spot[k], b[s].hot_spot[k], 1e-12);
    EXPECT_CLOSE(a[s].range, b[s].range, 1e-12);
    // Uniform stress from the deck's tractions, 40 and -20 MPa across the toe: range 60 MPa (derived [D]).
    EXPECT_CLOSE(a[s].hot_spot[0], 40.0, 1e-4);
    EXPECT_CLOSE(a[s].hot_spot[1], -20.0, 1e-4);
    EXPECT_CLOSE(a[s].range, 60.0, 1e-4);
  }
}

}  // namespace
}  // namespace toehold
