// Writes the result files in order into an OutputFolder: the VTK files with the provenance as field data, the
// ParaView collection that opens them together, the CSV, results.json, report.html and view_results.py.
#include "toehold/output/results_writer.hpp"

#include "result_files.hpp"
#include "toehold/common/error.hpp"
#include "toehold/output/json_results.hpp"
#include "toehold/output/paraview_script.hpp"
#include "toehold/output/provenance.hpp"
#include "toehold/output/report_html.hpp"
#include "toehold/output/svg_plot.hpp"

#include <filesystem>
#include <fstream>
#include <map>

namespace toehold {
namespace detail {
namespace {

void write_text(const std::string& text, const std::string& path) {
  std::ofstream out(path, std::ios::binary);
  out << text;
  out.close();
  if (!out) throw Error("cannot write result file '" + path + "'; check that the output folder is writable");
}

}  // namespace

std::vector<std::string> provenance_lines(const Assessment& a) { return toehold::provenance_lines(collect_provenance(a)); }

void write_collection_pvd(const std::vector<std::string>& files, const std::string& path) {
  std::ofstream out(path, std::ios::binary);
  out << "<?xml version=\"1.0\"?>\n"
      << "<VTKFile type=\"Collection\" version=\"0.1\" byte_order=\"LittleEndian\">\n  <Collection>\n";
  for (std::size_t i = 0; i < files.size(); ++i)
    out << "    <DataSet timestep=\"0\" group=\"\" part=\"" << i << "\" file=\"" << xml_escaped(files[i]) << "\"/>\n";
  out << "  </Collection>\n</VTKFile>\n";
  out.close();
  if (!out) throw Error("cannot write result file '" + path + "'; check that the output folder is writable");
}

}  // namespace detail

namespace {

// Step names become array names; two steps must not share one, also after detail::vtk_safe_name.
void require_unique_steps(const Assessment& a) {
  std::map<std::string, std::string> seen;  // safe name -> step name
  for (const auto& step : a.steps) {
    const auto [at, added] = seen.emplace(detail::vtk_safe_name(step), step);
    if (added) continue;
    if (at->second == step)
      throw Error("load step name '" + step + "' is used twice; give each step of the plan its own name");
    throw Error("load step names '" + at->second + "' and '" + step + "' give the same VTK array name '" + at->first +
                "'; rename one of them");
  }
}

detail::OutputContext context_for(const Assessment& a, const Provenance& p, LengthUnit out_unit) {
  detail::OutputContext c;
  c.a = &a;
  c.mm_per_unit = mm_per(out_unit);
  c.unit = to_string(out_unit);
  c.provenance = provenance_lines(p);
  return c;
}

}  // namespace

std::vector<std::string> write_result_files(const Assessment& a, const Mesh& model, OutputFolder& out,
                                            LengthUnit out_unit, const FileWrittenHook& on_file) {
  require_unique_steps(a);
  const Provenance provenance = collect_provenance(a);
  const detail::OutputContext c = context_for(a, provenance, out_unit);
  std::vector<std::string> written;
  const auto done = [&](const char* name) {
    written.emplace_back(name);
    if (on_file) on_file(name);
  };
  detail::write_stations_vtp(c, out.path_for(kStationsVtp));
  done(kStationsVtp);
  detail::write_readout_vtp(c, out.path_for(kReadoutVtp));
  done(kReadoutVtp);
  detail::write_model_vtu(c, model, out.path_for(kModelVtu));
  done(kModelVtu);
  detail::write_collection_pvd({kModelVtu, kStationsVtp, kReadoutVtp}, out.path_for(kResultsPvd));
  done(kResultsPvd);
  detail::write_stations_csv(c, out.path_for(kStationsCsv));
  done(kStationsCsv);
  detail::write_text(format_results_json(a, provenance, out_unit), out.path_for(kResultsJson));
  done(kResultsJson);
  detail::write_text(format_report_html(a, provenance, out_unit), out.path_for(kReportHtml));
  done(kReportHtml);
  detail::write_text(paraview_script_text(), out.path_for(kViewScript));
  done(kViewScript);
  return written;
}

std::vector<std::string> write_results(const Assessment& a, const Mesh& model, const std::string& folder,
                                       LengthUnit out_unit, const FileWrittenHook& on_file) {
  OutputFolder out(folder);
  const std::vector<std::string> names = write_result_files(a, model, out, out_unit, on_file);
  out.commit();
  std::vector<std::string> paths;
  for (const auto& name : names) paths.push_back((std::filesystem::path(folder) / name).string());
  return paths;
}

}  // namespace toehold
