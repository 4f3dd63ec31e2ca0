// The provenance in the written files: field data "toehold provenance" of every VTK file, results.json and
// report.html name the plan and model files with the SHA-256 that sha256sum computes.
#include "output/sample_results.hpp"
#include "support/support.hpp"
#include "toehold/output/results_writer.hpp"

#include <vtkFieldData.h>
#include <vtkNew.h>
#include <vtkPolyData.h>
#include <vtkStringArray.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLPolyDataReader.h>
#include <vtkXMLUnstructuredGridReader.h>

#include <algorithm>
#include <cstdio>
#include <fstream>
#include <sstream>

namespace toehold::test {
namespace {

std::string sha256sum(const std::string& path) {
  FILE* pipe = popen(("sha256sum '" + path + "'").c_str(), "r");
  if (!pipe) return "";
  char buffer[256] = {};
  const char* got = std::fgets(buffer, sizeof buffer, pipe);
  pclose(pipe);
  return got ? std::string(buffer).substr(0, 64) : "";
}

std::vector<std::string> field_lines(vtkDataObject* data) {
  std::vector<std::string> out;
  auto* a = vtkStringArray::SafeDownCast(data->GetFieldData()->GetAbstractArray("toehold provenance"));
  if (a)
    for (vtkIdType i = 0; i < a->GetNumberOfValues(); ++i) out.push_back(a->GetValue(i));
  return out;
}

std::string text_of(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  std::ostringstream os;
  os << in.rdbuf();
  return os.str();
}

bool has(const std::vector<std::string>& lines, const std::string& line) {
  return std::find(lines.begin(), lines.end(), line) != lines.end();
}

class WrittenProvenance : public ::testing::Test {
protected:
  void SetUp() override {
    grid = sample_grid();
    a = sample_assessment(grid);
    plan_text = "title = \"provenance\"\n# a comment, kept verbatim\n";
    {
      std::ofstream out(dir.file("plan.toml"), std::ios::binary);
      out << plan_text;
      std::ofstream model(dir.file("beam.vtu"), std::ios::binary);
      model << "not really a model, but bytes to hash\n";
    }
    a.plan.path = dir.file("plan.toml");
    a.plan.text = plan_text;
    a.input_files = {dir.file("beam.vtu")};
    files = write_results(a, Mesh(grid, "beam.vtu", LengthUnit::m), dir.file("results"), LengthUnit::m);
  }
  std::string out(const std::string& name) const { return dir.file("results") + "/" + name; }

  TempDir dir;
  vtkSmartPointer<vtkUnstructuredGrid> grid;
  Assessment a;
  std::string plan_text;
  std::vector<std::string> files;
};

TEST_F(WrittenProvenance, FilesListTheReportJsonAndScript) {
  for (const char* name : {kResultsJson, kReportHtml, kViewScript})
    EXPECT_TRUE(std::find(files.begin(), files.end(), out(name)) != files.end()) << name;
}

TEST_F(WrittenProvenance, EveryVtkFileCarriesHashesAndThePlan) {
  const std::string plan_line = "sha256: " + sha256sum(dir.file("plan.toml")) + " " +
                                std::to_string(plan_text.size()) + " bytes plan " + dir.file("plan.toml");
  const std::string model_line = "sha256: " + sha256sum(dir.file("beam.vtu")) + " 38 bytes model " +
                                 dir.file("beam.vtu");
  for (const std::string name : {"stations.vtp", "readout.vtp"}) {
    vtkNew<vtkXMLPolyDataReader> reader;
    reader->SetFileName(out(name).c_str());
    reader->Update();
    const auto lines = field_lines(reader->GetOutput());
    EXPECT_TRUE(has(lines, plan_line)) << name;
    EXPECT_TRUE(has(lines, model_line)) << name;
    EXPECT_TRUE(has(lines, "plan | # a comment, kept verbatim")) << name;
    EXPECT_EQ(lines.at(1), "plan: " + dir.file("plan.toml"));
  }
  vtkNew<vtkXMLUnstructuredGridReader> reader;
  reader->SetFileName(out("model.vtu").c_str());
  reader->Update();
  EXPECT_TRUE(has(field_lines(reader->GetOutput()), plan_line));
}

TEST_F(WrittenProvenance, JsonAndReportNameTheSameHashes) {
  const std::string json = text_of(out(kResultsJson));
  const std::string html = text_of(out(kReportHtml));
  for (const std::string& file : {dir.file("plan.toml"), dir.file("beam.vtu")}) {
    const std::string digest = sha256sum(file);
    EXPECT_NE(json.find("\"sha256\": \"" + digest + "\""), std::string::npos) << file;
    EXPECT_NE(html.find(digest), std::string::npos) << file;
  }
  EXPECT_NE(json.find("\"plan_text\": \"title = \\\"provenance\\\"\\n# a comment, kept verbatim\\n\""),
            std::string::npos);
}

}  // namespace
}  // namespace toehold::test
