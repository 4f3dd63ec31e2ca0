// results.json of the hand-made sample assessment: validated against the JSON Schema in docs/results-schema.md by
// the project's standard-library checker, and spot values (infinity, no result, escaping) as documented there.
#include "output/sample_results.hpp"
#include "output/schema_check.hpp"
#include "support/support.hpp"
#include "toehold/output/json_results.hpp"
#include "toehold/output/provenance.hpp"

#include <cstdio>
#include <fstream>
#include <string>

namespace toehold::test {
namespace {

class SampleJson : public ::testing::Test {
protected:
  void SetUp() override {
    grid = sample_grid();
    a = sample_assessment(grid);
    json = format_results_json(a, collect_provenance(a), LengthUnit::m);
  }
  vtkSmartPointer<vtkUnstructuredGrid> grid;
  Assessment a;
  std::string json;
};

TEST_F(SampleJson, ValidatesAgainstTheDocumentedSchema) {
  std::string said;
  EXPECT_EQ(check_schema(json, said), 0) << said;
}

TEST_F(SampleJson, CheckerRejectsADocumentMissingAKey) {
  std::string broken = json;
  const auto at = broken.find("\"arc_length\"");
  ASSERT_NE(at, std::string::npos);
  broken.replace(at, 12, "\"arc_lenght\"");
  std::string said;
  EXPECT_EQ(check_schema(broken, said), 1);
  EXPECT_NE(said.find("missing key \"arc_length\""), std::string::npos) << said;
}

TEST_F(SampleJson, CarriesVersionUnitsAndValuesAsDocumented) {
  EXPECT_NE(json.find("\"schema_version\": \"1.2\""), std::string::npos);
  EXPECT_NE(json.find("\"units\": {\"length\": \"m\", \"stress\": \"MPa\"}"), std::string::npos);
  EXPECT_NE(json.find("\"life_cycles\": \"infinite\""), std::string::npos);  // station 2 of toe 1
  EXPECT_NE(json.find("\"utilization\": 1.675"), std::string::npos);
  EXPECT_NE(json.find("\"arc_length\": 1,"), std::string::npos);  // 1000 mm in metres [D]
  EXPECT_NE(json.find("\"problem\": \"read-out path stops at a plate edge\""), std::string::npos);
  EXPECT_NE(json.find("\"result\": null"), std::string::npos);
  EXPECT_NE(json.find("\"lift, \\\"swung\\\"\""), std::string::npos);
  EXPECT_NE(json.find("\"outside_model\": 0.00025"), std::string::npos);  // 0.25 mm [D]
  for (const char* not_json : {": inf", ": nan", ": -nan", "Infinity", "NaN"})
    EXPECT_EQ(json.find(not_json), std::string::npos) << not_json;
}

}  // namespace
}  // namespace toehold::test
