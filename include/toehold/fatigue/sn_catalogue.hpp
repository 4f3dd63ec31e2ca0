// The published S-N curves by name: IIW FAT classes, EN 1993-1-9 detail categories and DNVGL-RP-C203 curves in
// air, plus user-defined curves. parse_sn_curve is the one place that maps the strings users type to curves.
// Values, sources and which numbers are from memory: docs/sn-curves.md.
#pragma once

#include "toehold/fatigue/sn_curve.hpp"

#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace toehold {

// Parent material of an IIW FAT class (the slopes and knees are the same; the FAT values differ).
enum class SnMaterial {
  steel,      // structural steel
  aluminium,  // aluminium alloys
};

std::string to_string(SnMaterial material);

// IIW 2016 (IIW-2259-15) sec. 3.7: N = 2e6 (FAT/ds)^m. Normal stress: m = 3 to the knee at 1e7, then m = 5 for
// variable amplitude and m = 22 for constant amplitude. Shear: m = 5 to the knee at 1e8, then m = 22.
// fat: characteristic stress range at 2e6 cycles, MPa, finite and > 0 (any value, not only the listed classes).
SnCurve iiw_fat(double fat, SnMaterial material = SnMaterial::steel, StressKind kind = StressKind::normal);

// EN 1993-1-9:2005 sec. 7.1, Fig. 7.1 and 7.2. category: ds_C at 2e6 cycles, MPa, one of
// en_1993_categories(kind). Normal: m = 3 to ds_D at 5e6, m = 5 to ds_L at 1e8, no damage below ds_L;
// constant amplitude: no damage below ds_D. Shear: m = 5 to ds_L at 1e8, no damage below ds_L.
SnCurve en_1993_detail(double category, StressKind kind = StressKind::normal);
// The detail categories of EN 1993-1-9 for the given stress kind, MPa, largest first.
std::vector<double> en_1993_categories(StressKind kind);

// DNVGL-RP-C203 (2016) Table 2-1, S-N curves in air: log N = log a1 - 3 log ds up to 1e7 (m1 = 4 for B1, B2),
// log a2 - 5 log ds beyond; same curve for constant and variable amplitude. Carries the thickness rule k, t_ref.
// curve: one of dnv_air_curve_names(), e.g. "D" or "C1" (case-insensitive).
SnCurve dnv_air_curve(std::string_view curve);
std::vector<std::string> dnv_air_curve_names();

// A user curve from FAT (MPa at 2e6 cycles), slopes m1..mk and the k-1 knee cycles between them (increasing).
// Optional cut-off (MPa, 0 = none) and constant-amplitude tail. kind defaults to normal stress.
struct FatCurveInput {
  std::string name;               // label used in messages and reports
  double fat = 0.0;               // MPa at 2e6 cycles, > 0
  std::vector<double> slopes;     // m1, m2, ..., each > 0; at least one
  std::vector<double> knees;      // N at each change of slope; slopes.size() - 1 values, increasing
  double cutoff_range = 0.0;      // MPa, 0 = none
  std::optional<ConstantAmplitudeTail> constant_amplitude;
  StressKind kind = StressKind::normal;
};
SnCurve user_fat_curve(const FatCurveInput& input);
// A user curve from segments given by slope and log10 intercept (see SnSegment::with_intercept).
SnCurve user_segment_curve(const std::string& name, const std::vector<SnSegment>& segments,
                           double cutoff_range = 0.0, StressKind kind = StressKind::normal);

// Parses the names users type (case-insensitive, words separated by spaces):
//   "IIW FAT <class> [steel|aluminium] [normal|shear]"   e.g. "IIW FAT 90", "IIW FAT 36 aluminium"
//   "EN 1993-1-9 <category> [normal|shear]" or "EN <category> [normal|shear]"   e.g. "EN 71", "EN 100 shear"
//   "DNV <curve>" or "DNVGL-RP-C203 <curve>" [air]   e.g. "DNV D", "DNV C1 air"
// Unknown names throw Error listing what is accepted.
SnCurve parse_sn_curve(std::string_view text);
// The accepted spellings, as listed in parse errors.
std::string sn_curve_spellings();

// The allowable Miner sum a curve's code gives when the plan names none: 1.0 for EN 1993-1-9 and DNVGL-RP-C203
// curves, 0.5 for IIW and user curves (IIW 2016 sec. 4.3.1 [M]). `basis` receives the reason, for the outputs.
double default_damage_limit(const SnCurve& curve, std::string& basis);

}  // namespace toehold
