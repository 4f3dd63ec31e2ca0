// Provenance of a run: sizes and SHA-256 of the input files compared with coreutils sha256sum (an independent
// implementation), missing files recorded rather than thrown, and the text lines the VTK field data carries.
#include "support/support.hpp"
#include "toehold/output/provenance.hpp"

#include <cstdio>
#include <fstream>
#include <regex>
#include <string>

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

void write(const std::string& path, const std::string& text) {
  std::ofstream out(path, std::ios::binary);
  out << text;
}

class RunInputs : public ::testing::Test {
protected:
  void SetUp() override {
    write(dir.file("plan.toml"), "title = \"beam\"\r\n[model]\nfile = \"beam.vtu\"\n");
    std::string model;
    for (int i = 0; i < 100000; ++i) model += static_cast<char>(i * 7 % 256);
    write(dir.file("beam.vtu"), model);
    a.plan.path = dir.file("plan.toml");
    a.plan.text = "title = \"beam\"\r\n[model]\nfile = \"beam.vtu\"\n";
    a.plan.defaults_applied = {"toe 'a': spacing = 0 (a station at every toe node)"};
    a.input_files = {dir.file("beam.vtu"), dir.file("gone.vtu")};
  }
  TempDir dir;
  Assessment a;
};

TEST_F(RunInputs, HashesAndSizesMatchSha256sum) {
  const Provenance p = collect_provenance(a);
  ASSERT_EQ(p.files.size(), 3u);
  EXPECT_EQ(p.files[0].role, "plan");
  EXPECT_EQ(p.files[0].path, dir.file("plan.toml"));
  EXPECT_EQ(p.files[0].sha256, sha256sum(dir.file("plan.toml")));
  EXPECT_EQ(p.files[0].size_bytes, 42u);  // bytes of the plan text written above, counted by hand [D]
  EXPECT_EQ(p.files[1].role, "model");
  EXPECT_EQ(p.files[1].sha256, sha256sum(dir.file("beam.vtu")));
  EXPECT_EQ(p.files[1].size_bytes, 100000u);
  EXPECT_EQ(p.files[1].sha256.size(), 64u);
}

TEST_F(RunInputs, MissingFileIsRecordedNotThrown) {
  const Provenance p = collect_provenance(a);
  const InputFileRecord& gone = p.files[2];
  EXPECT_FALSE(gone.read());
  EXPECT_EQ(gone.sha256, "");
  EXPECT_EQ(gone.problem, "cannot open file '" + dir.file("gone.vtu") +
                              "' to compute its SHA-256; check that it exists and is readable");
}

TEST_F(RunInputs, RecordsToolTimePlatformPlanAndDefaults) {
  const Provenance p = collect_provenance(a);
  EXPECT_EQ(p.tool_version, TOEHOLD_VERSION);
  EXPECT_TRUE(std::regex_match(p.written_utc, std::regex("\\d{4}-\\d\\d-\\d\\dT\\d\\d:\\d\\d:\\d\\dZ")));
  EXPECT_EQ(p.platform.rfind("Linux ", 0), 0u) << p.platform;
  EXPECT_EQ(p.plan_text, a.plan.text);
  EXPECT_EQ(p.defaults_applied, a.plan.defaults_applied);
}

TEST(ProvenanceLines, KeepTheHeadLinesThenHashesDefaultsAndPlan) {
  Provenance p;
  p.tool_version = "9.8.7";
  p.written_utc = "2024-05-01T12:00:00Z";
  p.platform = "Linux 6.1 #1 x86_64";
  p.plan_path = "/p/plan.toml";
  p.plan_text = "title = \"x\"\r\n\n[model]";
  p.files = {{"plan", "/p/plan.toml", 24, std::string(64, 'a'), ""},
             {"model", "/p/m.vtu", 0, "", "gone"}};
  p.defaults_applied = {"toe 'a': spacing = 0"};
  const std::vector<std::string> expected{"toehold 9.8.7",
                                          "plan: /p/plan.toml",
                                          "input: /p/m.vtu",
                                          "written: 2024-05-01T12:00:00Z",
                                          "platform: Linux 6.1 #1 x86_64",
                                          "sha256: " + std::string(64, 'a') + " 24 bytes plan /p/plan.toml",
                                          "sha256: not available for model /p/m.vtu (gone)",
                                          "default: toe 'a': spacing = 0",
                                          "plan | title = \"x\"",
                                          "plan | ",
                                          "plan | [model]"};
  EXPECT_EQ(provenance_lines(p), expected);
}

}  // namespace
}  // namespace toehold::test
