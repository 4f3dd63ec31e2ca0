// toehold_bench: times the assessment of a generated model against only reading its files with VTK, for a
// series of load steps and for unit load cases times a long load history (docs/performance.md). The files go
// into a temporary folder that is removed at the end (or into --keep DIR, kept and reused by later runs of the
// same size). Not a test: run it by hand, in a Release build.
#include "toehold/assess/assessment.hpp"
#include "toehold/common/reporter.hpp"
#include "toehold/plan/plan.hpp"

#include <vtkCellArray.h>
#include <vtkCellData.h>
#ifdef TOEHOLD_BENCH_TEXT_READER
#include <vtkDelimitedTextReader.h>
#endif
#include <vtkFloatArray.h>
#include <vtkIntArray.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLUnstructuredGridReader.h>
#include <vtkXMLUnstructuredGridWriter.h>

#include <sys/resource.h>
#include <sys/wait.h>
#include <unistd.h>

#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <functional>
#include <map>
#include <string>
#include <vector>

namespace fs = std::filesystem;

namespace {

struct Size {
  int nx = 250, ny = 80, nz = 50;  // hex cells along x (1000 mm), y (200 mm), z (20 mm): 1e6 cells
  int steps = 200;                 // load steps of the series
  int stations = 10000;            // stations along the toe (series)
  int uc_stations = 100;           // stations along the toe (unit cases)
  long rows = 1000000;             // rows of the unit-case load history
  std::string only;                // "series" or "units": run that case alone; empty: both
  std::string keep;                // folder to write the files into and keep (reused when already written)
  bool phases = false;             // print the time of each phase of the assessment (from the reporter)
};

constexpr double kLx = 1000, kLy = 200, kLz = 20, kToeY = 100;

// Box of hex cells with the weld region (3) at y < 100 mm and the toe marker on the top face at y = 100 mm.
vtkSmartPointer<vtkUnstructuredGrid> box(const Size& n) {
  auto grid = vtkSmartPointer<vtkUnstructuredGrid>::New();
  vtkNew<vtkPoints> points;
  points->SetDataTypeToFloat();
  vtkNew<vtkIntArray> toe;
  toe->SetName("toe");
  for (int k = 0; k <= n.nz; ++k)
    for (int j = 0; j <= n.ny; ++j)
      for (int i = 0; i <= n.nx; ++i) {
        const double y = kLy * j / n.ny;
        points->InsertNextPoint(kLx * i / n.nx, y, kLz * k / n.nz);
        toe->InsertNextValue(k == n.nz && std::abs(y - kToeY) < 1e-9 ? 1 : 0);
      }
  grid->SetPoints(points);
  grid->GetPointData()->AddArray(toe);
  const auto id = [&](int i, int j, int k) { return static_cast<vtkIdType>((k * (n.ny + 1) + j) * (n.nx + 1) + i); };
  vtkNew<vtkIntArray> region;
  region->SetName("region");
  grid->Allocate(static_cast<vtkIdType>(n.nx) * n.ny * n.nz);
  for (int k = 0; k < n.nz; ++k)
    for (int j = 0; j < n.ny; ++j)
      for (int i = 0; i < n.nx; ++i) {
        const vtkIdType c[8] = {id(i, j, k),     id(i + 1, j, k),     id(i + 1, j + 1, k),     id(i, j + 1, k),
                                id(i, j, k + 1), id(i + 1, j, k + 1), id(i + 1, j + 1, k + 1), id(i, j + 1, k + 1)};
        grid->InsertNextCell(VTK_HEXAHEDRON, 8, c);
        region->InsertNextValue(kLy * (j + 0.5) / n.ny < kToeY ? 3 : 1);
      }
  grid->GetCellData()->AddArray(region);
  return grid;
}

// Stress of one step: across the toe a * (1 + d / 50) (d from the toe), along it 0.3 a, shear 0.1 a; MPa.
void set_stress(vtkUnstructuredGrid* grid, const std::string& name, double a) {
  vtkNew<vtkFloatArray> s;
  s->SetName(name.c_str());
  s->SetNumberOfComponents(6);
  const char* names[6] = {"XX", "YY", "ZZ", "XY", "YZ", "XZ"};
  for (int c = 0; c < 6; ++c) s->SetComponentName(c, names[c]);
  const vtkIdType n = grid->GetNumberOfPoints();
  s->SetNumberOfTuples(n);
  double x[3];
  for (vtkIdType p = 0; p < n; ++p) {
    grid->GetPoint(p, x);
    const double across = a * (1 + std::abs(x[1] - kToeY) / 50);
    const float v[6] = {float(0.3 * a), float(across), 0.f, float(0.1 * a), 0.f, 0.f};
    s->SetTypedTuple(p, v);
  }
  grid->GetPointData()->RemoveArray(name.c_str());
  grid->GetPointData()->AddArray(s);
}

void write(vtkUnstructuredGrid* grid, const std::string& path) {
  vtkNew<vtkXMLUnstructuredGridWriter> w;
  w->SetFileName(path.c_str());
  w->SetInputData(grid);
  w->SetDataModeToAppended();
  w->EncodeAppendedDataOff();
  w->SetCompressorTypeToNone();
  if (w->Write() != 1) throw std::runtime_error("cannot write " + path);
}

double amplitude(int step) { return 80.0 * std::sin(0.37 * step) + 30.0 * std::sin(1.9 * step + 0.5); }

void write_series(const fs::path& dir, const Size& n) {
  auto grid = box(n);
  std::ofstream pvd(dir / "series.pvd");
  pvd << "<?xml version=\"1.0\"?>\n<VTKFile type=\"Collection\" version=\"0.1\">\n<Collection>\n";
  for (int k = 0; k < n.steps; ++k) {
    const std::string file = "step_" + std::to_string(k) + ".vtu";
    set_stress(grid, "stress", amplitude(k));
    write(grid, (dir / file).string());
    pvd << "<DataSet timestep=\"" << k << "\" file=\"" << file << "\"/>\n";
  }
  pvd << "</Collection>\n</VTKFile>\n";
}

void write_unit_cases(const fs::path& dir, const Size& n) {
  auto grid = box(n);
  set_stress(grid, "stress", 100.0);
  write(grid, (dir / "unit_a.vtu").string());
  set_stress(grid, "stress", -40.0);
  write(grid, (dir / "unit_b.vtu").string());
  std::ofstream csv(dir / "history.csv");
  csv << "time,a,b\n";
  for (long t = 0; t < n.rows; ++t) {
    const auto x = static_cast<double>(t);
    csv << t << "," << std::sin(0.013 * x) + 0.3 * std::sin(0.31 * x) << "," << std::cos(0.007 * x) << "\n";
  }
}

std::string plan_text(const std::string& model, const std::string& steps_and_loading, double spacing) {
  return "[model]\nfile = \"" + model + "\"\nlength_unit = \"mm\"\nstress_unit = \"MPa\"\nstress = \"stress\"\n"
         "region_array = \"region\"\n" + steps_and_loading +
         "[[toe]]\nname = \"toe\"\nmarker_array = \"toe\"\nmarker_value = 1\nweld_regions = [3]\nthickness = 20\n"
         "spacing = " + std::to_string(spacing) + "\ncurve = \"IIW FAT 90\"\n";
}

struct Measured {
  double seconds = 0;
  double peak_mb = 0;
};

// Runs `work` in a child process: its wall time and peak resident memory, alone.
Measured in_child(const std::function<void()>& work) {
  int pipe_fd[2];
  if (pipe(pipe_fd) != 0) throw std::runtime_error("pipe failed");
  const pid_t pid = fork();
  if (pid == 0) {
    const auto t0 = std::chrono::steady_clock::now();
    work();
    const double s = std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
    if (::write(pipe_fd[1], &s, sizeof s) != static_cast<ssize_t>(sizeof s)) _exit(1);
    _exit(0);
  }
  int status = 0;
  rusage usage{};
  wait4(pid, &status, 0, &usage);
  Measured m;
  if (::read(pipe_fd[0], &m.seconds, sizeof m.seconds) != static_cast<ssize_t>(sizeof m.seconds) || status != 0)
    throw std::runtime_error("benchmark child failed");
  close(pipe_fd[0]);
  close(pipe_fd[1]);
  m.peak_mb = static_cast<double>(usage.ru_maxrss) / 1024.0;
  return m;
}

void read_only(const std::vector<std::string>& files) {
  for (const auto& f : files) {
    vtkNew<vtkXMLUnstructuredGridReader> r;
    r->SetFileName(f.c_str());
    r->Update();
  }
}

#ifdef TOEHOLD_BENCH_TEXT_READER
constexpr bool kHasTextReader = true;
// The history CSV read the way VTK reads a delimited table: header row, numeric columns detected.
void read_history_with_vtk(const std::string& file) {
  vtkNew<vtkDelimitedTextReader> r;
  r->SetFileName(file.c_str());
  r->SetHaveHeaders(true);
  r->SetDetectNumericColumns(true);
  r->Update();
}
#else
constexpr bool kHasTextReader = false;  // the build found no VTK text reader
void read_history_with_vtk(const std::string&) {}
#endif

// Prints the time since the start at each message and at the first and last progress report of each task, so
// the phases of the assessment can be read off (--phases).
class PhaseReporter final : public toehold::Reporter {
public:
  void info(const std::string& message) override { stamp(message); }
  void warn(const std::string&) override {}
  void progress(const std::string& what, std::size_t done, std::size_t total) override {
    if (done == 0 && !started_[what]++) stamp(what + ": start");
    if (done == total) stamp(what + ": done");
  }

private:
  void stamp(const std::string& what) {
    const double s = std::chrono::duration<double>(std::chrono::steady_clock::now() - t0_).count();
    std::printf("    %8.3f s  %s\n", s, what.c_str());
    std::fflush(stdout);
  }
  std::chrono::steady_clock::time_point t0_ = std::chrono::steady_clock::now();
  std::map<std::string, int> started_;
};

void assess(const std::string& text, const std::string& path, bool phases) {
  toehold::NullReporter quiet;
  PhaseReporter timed;
  const toehold::Plan plan = toehold::parse_plan(text, path);
  const toehold::Assessment a = toehold::run_assessment(plan, phases ? static_cast<toehold::Reporter&>(timed) : quiet);
  std::printf("    %d stations, %d without result\n", a.stations(), a.stations_without_result());
  std::fflush(stdout);
}

void report(const char* what, const Measured& read, const Measured& run) {
  std::printf("%s\n  read only (VTK): %8.2f s, peak %7.0f MB\n  assessment:      %8.2f s, peak %7.0f MB\n"
              "  ratio: %.2f\n", what, read.seconds, read.peak_mb, run.seconds, run.peak_mb,
              run.seconds / read.seconds);
  std::fflush(stdout);
}

Size parse_args(int argc, char** argv) {
  Size n;
  for (int i = 1; i < argc; ++i) {
    const std::string key = argv[i];
    if (key == "--phases") {
      n.phases = true;
      continue;
    }
    if (i + 1 >= argc) throw std::runtime_error("option " + key + " needs a value");
    const std::string text = argv[++i];
    const long v = std::atol(text.c_str());
    if (key == "--only" && text != "series" && text != "units")
      throw std::runtime_error("--only takes series or units");
    if (key == "--nx") n.nx = int(v);
    else if (key == "--ny") n.ny = int(v);
    else if (key == "--nz") n.nz = int(v);
    else if (key == "--steps") n.steps = int(v);
    else if (key == "--stations") n.stations = int(v);
    else if (key == "--uc-stations") n.uc_stations = int(v);
    else if (key == "--rows") n.rows = v;
    else if (key == "--only") n.only = text;
    else if (key == "--keep") n.keep = text;
    else throw std::runtime_error("unknown option " + key);
  }
  return n;
}

// The size a kept folder was written for: its files are reused only by a run of the same size.
std::string size_text(const Size& n, const char* what) {
  return std::string(what) + " " + std::to_string(n.nx) + " " + std::to_string(n.ny) + " " + std::to_string(n.nz) +
         " " + std::to_string(what[0] == 's' ? n.steps : n.rows);
}

bool already_written(const fs::path& dir, const std::string& stamp) {
  std::ifstream in(dir / (stamp.substr(0, stamp.find(' ')) + ".size"));
  std::string line;
  return std::getline(in, line) && line == stamp;
}

void mark_written(const fs::path& dir, const std::string& stamp) {
  std::ofstream(dir / (stamp.substr(0, stamp.find(' ')) + ".size")) << stamp << "\n";
}

void run_series(const fs::path& dir, const Size& n, bool keep) {
  const std::string stamp = size_text(n, "series");
  if (!keep || !already_written(dir, stamp)) {
    write_series(dir, n);
    if (keep) mark_written(dir, stamp);
  }
  std::vector<std::string> files;
  for (int k = 0; k < n.steps; ++k) files.push_back((dir / ("step_" + std::to_string(k) + ".vtu")).string());
  const std::string series = plan_text((dir / "series.pvd").string(),
                                       "[[step]]\nname = \"t\"\npvd_steps = \"all\"\n[loading]\n"
                                       "kind = \"series\"\n", kLx / n.stations);
  const Measured read = in_child([&] { read_only(files); });
  const Measured run = in_child([&] { assess(series, (dir / "series.toml").string(), n.phases); });
  report("series", read, run);
  if (!keep)
    for (const auto& f : files) fs::remove(f);
}

void run_units(const fs::path& dir, const Size& n, bool keep) {
  const std::string stamp = size_text(n, "units");
  if (!keep || !already_written(dir, stamp)) {
    write_unit_cases(dir, n);
    if (keep) mark_written(dir, stamp);
  }
  const std::string units = plan_text((dir / "unit_a.vtu").string(),
                                      "[[step]]\nname = \"a\"\n[[step]]\nname = \"b\"\nfile = \"unit_b.vtu\"\n"
                                      "[loading]\nkind = \"unit-cases\"\nhistory = \"history.csv\"\n",
                                      kLx / n.uc_stations);
  const std::vector<std::string> files{(dir / "unit_a.vtu").string(), (dir / "unit_b.vtu").string()};
  const Measured read = in_child([&] { read_only(files); });
  const Measured run = in_child([&] { assess(units, (dir / "units.toml").string(), n.phases); });
  report("unit cases", read, run);
  const std::string history = (dir / "history.csv").string();
  if (!kHasTextReader) {
    std::printf("  (no VTK text reader in this build: the history CSV is not in the read-only pass)\n");
    return;
  }
  const Measured read_all = in_child([&] {
    read_only(files);
    read_history_with_vtk(history);
  });
  std::printf("  read only (VTK), the .vtu files and the history CSV (vtkDelimitedTextReader): %8.2f s, peak %7.0f MB\n"
              "  ratio to that: %.2f\n", read_all.seconds, read_all.peak_mb, run.seconds / read_all.seconds);
  std::fflush(stdout);
}

}  // namespace

int main(int argc, char** argv) {
  Size n;
  try {
    n = parse_args(argc, argv);
  } catch (const std::exception& e) {
    std::fprintf(stderr, "toehold_bench: %s\n", e.what());
    return 2;
  }
  const bool keep = !n.keep.empty();
  const fs::path dir = keep ? fs::path(n.keep) : fs::temp_directory_path() / ("toehold-bench-" + std::to_string(getpid()));
  fs::create_directories(dir);
  std::printf("model: %d x %d x %d = %ld hex cells; series of %d steps, %d stations; unit cases: 2 x %ld rows, "
              "%d stations\n", n.nx, n.ny, n.nz, long(n.nx) * n.ny * n.nz, n.steps, n.stations, n.rows,
              n.uc_stations);
  std::fflush(stdout);
  try {
    if (n.only != "units") run_series(dir, n, keep);
    if (n.only != "series") run_units(dir, n, keep);
  } catch (const std::exception& e) {
    std::fprintf(stderr, "toehold_bench: %s\n", e.what());
    if (!keep) fs::remove_all(dir);
    return 1;
  }
  if (!keep) fs::remove_all(dir);
  return 0;
}
