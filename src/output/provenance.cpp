// Collecting the provenance of a run: hashes of the input files, the time, the platform.
#include "toehold/output/provenance.hpp"

#include "toehold/common/error.hpp"
#include "toehold/common/sha256.hpp"

#include <sys/utsname.h>

#include <ctime>
#include <sstream>

namespace toehold {
namespace {

std::string platform_text() {
  utsname u{};
  if (uname(&u) != 0) return "unknown";
  return std::string(u.sysname) + " " + u.release + " " + u.version + " " + u.machine;
}

InputFileRecord record(const std::string& role, const std::string& path) {
  InputFileRecord r;
  r.role = role;
  r.path = path;
  try {
    const FileDigest d = sha256_file(path);
    r.size_bytes = d.size_bytes;
    r.sha256 = d.sha256;
  } catch (const Error& e) {
    r.problem = e.what();
  }
  return r;
}

std::vector<InputFileRecord> input_records(const Assessment& a) {
  std::vector<InputFileRecord> files{record("plan", a.plan.path)};
  for (const auto& f : a.input_files) files.push_back(record("model", f));
  if (!a.plan.loading.history_file.empty()) files.push_back(record("load history", a.plan.loading.history_file));
  return files;
}

std::vector<std::string> text_lines(const std::string& text) {
  std::vector<std::string> lines;
  std::istringstream in(text);
  for (std::string line; std::getline(in, line);) {
    if (!line.empty() && line.back() == '\r') line.pop_back();
    lines.push_back(line);
  }
  return lines;
}

}  // namespace

std::string utc_now() {
  const std::time_t now = std::time(nullptr);
  std::tm parts{};
  gmtime_r(&now, &parts);
  char text[32];
  std::strftime(text, sizeof text, "%Y-%m-%dT%H:%M:%SZ", &parts);
  return text;
}

Provenance collect_provenance(const Assessment& a) {
  Provenance p;
  p.tool_version = TOEHOLD_VERSION;
  p.written_utc = utc_now();
  p.platform = platform_text();
  p.plan_path = a.plan.path;
  p.plan_text = a.plan.text;
  p.files = input_records(a);
  p.defaults_applied = a.plan.defaults_applied;
  return p;
}

std::vector<std::string> provenance_lines(const Provenance& p) {
  std::vector<std::string> lines{"toehold " + p.tool_version, "plan: " + p.plan_path};
  for (const auto& f : p.files)
    if (f.role == "model") lines.push_back("input: " + f.path);
  lines.push_back("written: " + p.written_utc);
  lines.push_back("platform: " + p.platform);
  for (const auto& f : p.files) {
    if (f.read())
      lines.push_back("sha256: " + f.sha256 + " " + std::to_string(f.size_bytes) + " bytes " + f.role + " " + f.path);
    else
      lines.push_back("sha256: not available for " + f.role + " " + f.path + " (" + f.problem + ")");
  }
  for (const auto& d : p.defaults_applied) lines.push_back("default: " + d);
  for (const auto& line : text_lines(p.plan_text)) lines.push_back("plan | " + line);
  return lines;
}

}  // namespace toehold
