#include "curve_command.hpp"

#include "console.hpp"
#include "toehold/common/error.hpp"
#include "toehold/fatigue/sn_catalogue.hpp"

#include <cmath>
#include <cstdio>
#include <sstream>

namespace toehold::cli {
namespace {

std::string num(double v) {
  if (std::isinf(v)) return "infinite (no damage)";
  char buffer[64];
  std::snprintf(buffer, sizeof buffer, "%.4g", v);
  return buffer;
}

std::string segments_text(const SnCurve& curve) {
  std::ostringstream os;
  const auto knees = curve.knees();
  for (std::size_t i = 0; i < curve.segments().size(); ++i) {
    const SnSegment& s = curve.segments()[i];
    os << "    m = " << num(s.slope) << ", log10 a = " << num(s.log10_a);
    if (i < knees.size()) os << ", up to the knee at N = " << num(knees[i].cycles) << " (" << num(knees[i].range) << " MPa)";
    os << "\n";
  }
  return os.str();
}

std::string tail_text(const SnCurve& curve) {
  std::ostringstream os;
  if (const auto knee = curve.constant_amplitude_knee()) {
    const double m = *curve.constant_amplitude_slope();
    os << "  constant amplitude: leaves the curve at N = " << num(knee->cycles) << " (" << num(knee->range)
       << " MPa), then " << (std::isinf(m) ? std::string("horizontal (fatigue limit)") : "slope m = " + num(m)) << "\n";
  } else {
    os << "  constant amplitude: same curve as variable amplitude\n";
  }
  os << "  cut-off: " << (curve.cutoff_range() ? num(*curve.cutoff_range()) + " MPa" : std::string("none")) << "\n";
  return os.str();
}

}  // namespace

void setup_curve(CLI::App& app, CurveOptions& options) {
  auto* sub = app.add_subcommand("curve", "Look up an S-N curve: source, knees, allowable range at N cycles "
                                          "(--cycles) and life at a stress range (--range)");
  sub->add_option("name", options.name, "curve name as in a plan, e.g. \"IIW FAT 90\", \"EN 71\", \"DNV D\"")
      ->required();
  sub->add_option("--cycles", options.cycles, "number of cycles N (> 0): print the allowable stress range");
  sub->add_option("--range", options.range, "stress range in MPa (>= 0): print the cycles to failure");
}

std::string format_curve(const CurveOptions& options) {
  const SnCurve curve = parse_sn_curve(options.name);
  std::ostringstream os;
  os << curve.name() << "\n  source: " << curve.source() << "\n  edition: " << curve.edition() << "\n";
  os << "  stress: " << to_string(curve.kind()) << "; range at 2e6 cycles: " << num(curve.reference_range())
     << " MPa\n  segments (log10 N = log10 a - m log10 ds, ds in MPa):\n" << segments_text(curve) << tail_text(curve);
  if (options.cycles) {
    if (!(*options.cycles > 0) || !std::isfinite(*options.cycles))
      throw Error("--cycles " + num(*options.cycles) + ": give a finite number of cycles greater than 0");
    os << "allowable stress range at N = " << num(*options.cycles) << ": "
       << num(curve.allowable_range(*options.cycles, Amplitude::variable)) << " MPa (variable amplitude), "
       << num(curve.allowable_range(*options.cycles, Amplitude::constant)) << " MPa (constant amplitude)\n";
  }
  if (options.range) {
    if (!(*options.range >= 0) || !std::isfinite(*options.range))
      throw Error("--range " + num(*options.range) + ": give a finite stress range of 0 MPa or more");
    os << "cycles to failure at " << num(*options.range) << " MPa: "
       << num(curve.cycles_to_failure(*options.range, Amplitude::variable)) << " (variable amplitude), "
       << num(curve.cycles_to_failure(*options.range, Amplitude::constant)) << " (constant amplitude)\n";
  }
  return os.str();
}

int run_curve(const CurveOptions& options) {
  std::fputs(format_curve(options).c_str(), stdout);
  return kPass;
}

}  // namespace toehold::cli
