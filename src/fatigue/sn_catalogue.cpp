#include "toehold/fatigue/sn_catalogue.hpp"

#include "toehold/common/error.hpp"
#include "toehold/fatigue/number_text.hpp"

#include <algorithm>
#include <array>
#include <cctype>
#include <cmath>
#include <cstdlib>
#include <limits>
#include <sstream>

namespace toehold {

using fatigue_detail::number_text;
namespace {

constexpr double kInf = std::numeric_limits<double>::infinity();
const std::string kIiwEdition = "IIW 2016 (IIW-2259-15)";
const std::string kEnEdition = "EN 1993-1-9:2005";
const std::string kDnvEdition = "DNVGL-RP-C203 (2016)";

// DNVGL-RP-C203 2016 Table 2-1, curves in air. C..F: [S2] (REFERENCE-VALUES.md); the others [M].
struct DnvRow {
  const char* name;
  double m1;
  double log_a1;  // N <= 1e7
  double log_a2;  // N > 1e7, m2 = 5
  double k;       // thickness exponent
  bool from_memory;
};
constexpr std::array<DnvRow, 14> kDnvAir{{
    {"B1", 4.0, 15.117, 17.146, 0.00, true},  {"B2", 4.0, 14.885, 16.856, 0.00, true},
    {"C", 3.0, 12.592, 16.320, 0.05, false},  {"C1", 3.0, 12.449, 16.081, 0.10, false},
    {"C2", 3.0, 12.301, 15.835, 0.15, false}, {"D", 3.0, 12.164, 15.606, 0.20, false},
    {"E", 3.0, 12.010, 15.350, 0.20, false},  {"F", 3.0, 11.855, 15.091, 0.25, false},
    {"F1", 3.0, 11.699, 14.832, 0.25, true},  {"F3", 3.0, 11.546, 14.576, 0.25, true},
    {"G", 3.0, 11.398, 14.330, 0.25, true},   {"W1", 3.0, 11.261, 14.101, 0.25, true},
    {"W2", 3.0, 11.107, 13.845, 0.25, true},  {"W3", 3.0, 10.970, 13.617, 0.25, true},
}};
constexpr double kDnvReferenceThickness = 25.0;  // mm, welded connections other than tubular joints [M]

constexpr std::array<double, 14> kEnNormal{160, 140, 125, 112, 100, 90, 80, 71, 63, 56, 50, 45, 40, 36};
constexpr std::array<double, 2> kEnShear{100, 80};

std::string lower(std::string_view text) {
  std::string out(text);
  for (char& c : out) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return out;
}

std::string upper(std::string_view text) {
  std::string out(text);
  for (char& c : out) c = static_cast<char>(std::toupper(static_cast<unsigned char>(c)));
  return out;
}

std::string stress_words(StressKind kind) { return to_string(kind) + " stress"; }

template <class List>
std::string joined(const List& list) {
  std::string out;
  for (const auto& item : list) {
    std::ostringstream os;
    os << item;
    out += (out.empty() ? "" : ", ") + os.str();
  }
  return out;
}

void check_fat(double fat, const std::string& what) {
  if (!std::isfinite(fat) || fat <= 0.0)
    throw Error(what + ": FAT " + number_text(fat) + " MPa must be finite and > 0");
}

}  // namespace

std::string to_string(SnMaterial material) { return material == SnMaterial::steel ? "steel" : "aluminium"; }

SnCurve iiw_fat(double fat, SnMaterial material, StressKind kind) {
  check_fat(fat, "IIW S-N curve");
  const bool normal = kind == StressKind::normal;
  const double m1 = normal ? 3.0 : 5.0;
  const double knee = normal ? 1e7 : 1e8;
  const double m2 = normal ? 5.0 : 22.0;  // shear: 22 beyond 1e8 for both rules [M]
  SnCurveSpec spec;
  spec.name = "IIW FAT " + number_text(fat) + " (" + to_string(material) + ", " + stress_words(kind) + ")";
  spec.edition = kIiwEdition;
  spec.source = kIiwEdition + " sec. 3.7, FAT " + number_text(fat) + ", " + to_string(material) + ", " +
                stress_words(kind);
  spec.kind = kind;
  const SnSegment first = SnSegment::through(m1, fat, kReferenceCycles);
  spec.segments = {first, SnSegment::through(m2, first.range_at(knee), knee)};
  if (normal) spec.constant_amplitude = ConstantAmplitudeTail{knee, 22.0};
  return SnCurve(std::move(spec));
}

std::vector<double> en_1993_categories(StressKind kind) {
  if (kind == StressKind::normal) return {kEnNormal.begin(), kEnNormal.end()};
  return {kEnShear.begin(), kEnShear.end()};
}

SnCurve en_1993_detail(double category, StressKind kind) {
  const std::vector<double> allowed = en_1993_categories(kind);
  if (std::find(allowed.begin(), allowed.end(), category) == allowed.end())
    throw Error("EN 1993-1-9 S-N curve: detail category " + number_text(category) + " is not a " +
                stress_words(kind) + " category; use one of " + joined(allowed));
  SnCurveSpec spec;
  spec.name = "EN 1993-1-9 detail category " + number_text(category) + " (" + stress_words(kind) + ")";
  spec.edition = kEnEdition;
  spec.source = kEnEdition + " sec. 7.1, Fig. " + (kind == StressKind::normal ? "7.1" : "7.2") +
                ", detail category " + number_text(category) + ", " + stress_words(kind);
  spec.kind = kind;
  if (kind == StressKind::normal) {
    const double ds_d = std::cbrt(2.0 / 5.0) * category;  // at 5e6
    spec.segments = {SnSegment::through(3.0, category, kReferenceCycles), SnSegment::through(5.0, ds_d, 5e6)};
    spec.cutoff_range = ds_d * std::pow(5e6 / 1e8, 1.0 / 5.0);  // ds_L at 1e8
    spec.constant_amplitude = ConstantAmplitudeTail{5e6, kInf};   // fatigue limit ds_D
  } else {
    spec.segments = {SnSegment::through(5.0, category, kReferenceCycles)};
    spec.cutoff_range = category * std::pow(kReferenceCycles / 1e8, 1.0 / 5.0);  // ds_L at 1e8
  }
  return SnCurve(std::move(spec));
}

std::vector<std::string> dnv_air_curve_names() {
  std::vector<std::string> names;
  for (const DnvRow& row : kDnvAir) names.emplace_back(row.name);
  return names;
}

SnCurve dnv_air_curve(std::string_view curve) {
  const std::string key = upper(curve);
  const auto row = std::find_if(kDnvAir.begin(), kDnvAir.end(), [&](const DnvRow& r) { return key == r.name; });
  if (row == kDnvAir.end())
    throw Error("DNVGL-RP-C203 S-N curve '" + std::string(curve) + "' is not a curve in air; use one of " +
                joined(dnv_air_curve_names()));
  SnCurveSpec spec;
  spec.name = "DNV curve " + key + " (in air)";
  spec.edition = kDnvEdition;
  spec.source = kDnvEdition + " Table 2-1, curve " + key + " in air, k = " + number_text(row->k) +
                ", t_ref = " + number_text(kDnvReferenceThickness) + " mm" +
                (row->from_memory ? "; table values from memory" : "");
  spec.segments = {SnSegment::with_intercept(row->m1, row->log_a1), SnSegment::with_intercept(5.0, row->log_a2)};
  spec.thickness = SnThicknessRule{row->k, kDnvReferenceThickness};
  return SnCurve(std::move(spec));
}

SnCurve user_fat_curve(const FatCurveInput& input) {
  const std::string what = "user S-N curve '" + input.name + "'";
  check_fat(input.fat, what);
  if (input.slopes.empty()) throw Error(what + ": no slopes; give at least the slope m1");
  if (input.knees.size() + 1 != input.slopes.size())
    throw Error(what + ": " + std::to_string(input.slopes.size()) + " slopes need " +
                std::to_string(input.slopes.size() - 1) + " knee(s), got " + std::to_string(input.knees.size()));
  SnCurveSpec spec;
  spec.name = input.name;
  spec.edition = "user-defined";
  spec.source = "user-defined: FAT " + number_text(input.fat) + ", m = " + joined(input.slopes) +
                (input.knees.empty() ? "" : ", knees at N = " + joined(input.knees));
  spec.kind = input.kind;
  spec.cutoff_range = input.cutoff_range;
  spec.constant_amplitude = input.constant_amplitude;
  spec.segments.push_back(SnSegment::through(input.slopes[0], input.fat, kReferenceCycles));
  for (std::size_t i = 0; i < input.knees.size(); ++i) {
    const double n = input.knees[i];
    if (!std::isfinite(n) || n <= 0.0 || (i > 0 && n <= input.knees[i - 1]))
      throw Error(what + ": knee " + std::to_string(i + 1) + " at N = " + number_text(n) +
                  " must be finite, > 0 and beyond the previous knee");
    spec.segments.push_back(SnSegment::through(input.slopes[i + 1], spec.segments.back().range_at(n), n));
  }
  return SnCurve(std::move(spec));
}

SnCurve user_segment_curve(const std::string& name, const std::vector<SnSegment>& segments, double cutoff_range,
                           StressKind kind) {
  SnCurveSpec spec;
  spec.name = name;
  spec.edition = "user-defined";
  spec.source = "user-defined: " + std::to_string(segments.size()) + " segment(s) of slope and log10 intercept";
  spec.kind = kind;
  spec.segments = segments;
  spec.cutoff_range = cutoff_range;
  return SnCurve(std::move(spec));
}

namespace {

std::vector<std::string> words_of(std::string_view text) {
  std::istringstream in{std::string(text)};
  std::vector<std::string> words;
  for (std::string w; in >> w;) words.push_back(lower(w));
  return words;
}

bool parse_number(const std::string& word, double& value) {
  if (word.empty()) return false;
  char* end = nullptr;
  value = std::strtod(word.c_str(), &end);
  return end == word.c_str() + word.size() && std::isfinite(value);
}

[[noreturn]] void unknown_curve(std::string_view text) {
  throw Error("S-N curve '" + std::string(text) + "' is not recognised; use " + sn_curve_spellings());
}

// Reads optional trailing words into material and stress kind; false if a word is not one of them.
bool read_options(const std::vector<std::string>& words, std::size_t from, SnMaterial* material,
                  StressKind& kind) {
  for (std::size_t i = from; i < words.size(); ++i) {
    const std::string& w = words[i];
    if (w == "normal") kind = StressKind::normal;
    else if (w == "shear") kind = StressKind::shear;
    else if (material && w == "steel") *material = SnMaterial::steel;
    else if (material && (w == "aluminium" || w == "aluminum")) *material = SnMaterial::aluminium;
    else return false;
  }
  return true;
}

SnCurve parse_iiw(const std::vector<std::string>& words, std::string_view text) {
  double fat = 0.0;
  SnMaterial material = SnMaterial::steel;
  StressKind kind = StressKind::normal;
  if (words.size() < 3 || words[1] != "fat" || !parse_number(words[2], fat) ||
      !read_options(words, 3, &material, kind))
    unknown_curve(text);
  return iiw_fat(fat, material, kind);
}

SnCurve parse_en(const std::vector<std::string>& words, std::string_view text) {
  std::size_t at = 1;
  if (words[0] == "en" && words.size() > 1 && words[1] == "1993-1-9") at = 2;
  double category = 0.0;
  StressKind kind = StressKind::normal;
  if (words.size() <= at || !parse_number(words[at], category) || !read_options(words, at + 1, nullptr, kind))
    unknown_curve(text);
  return en_1993_detail(category, kind);
}

SnCurve parse_dnv(const std::vector<std::string>& words, std::string_view text) {
  if (words.size() < 2 || words.size() > 3 || (words.size() == 3 && words[2] != "air")) unknown_curve(text);
  return dnv_air_curve(upper(words[1]));
}

}  // namespace

std::string sn_curve_spellings() {
  return "'IIW FAT <class> [steel|aluminium] [normal|shear]', 'EN 1993-1-9 <category> [normal|shear]' "
         "(normal: " + joined(kEnNormal) + "; shear: " + joined(kEnShear) + ") or 'DNV <curve>' (" +
         joined(dnv_air_curve_names()) + ")";
}

SnCurve parse_sn_curve(std::string_view text) {
  const std::vector<std::string> words = words_of(text);
  if (words.empty()) unknown_curve(text);
  const std::string& head = words[0];
  if (head == "iiw") return parse_iiw(words, text);
  if (head == "en" || head == "en1993-1-9") return parse_en(words, text);
  if (head == "dnv" || head == "dnvgl-rp-c203" || head == "dnv-rp-c203") return parse_dnv(words, text);
  unknown_curve(text);
}

double default_damage_limit(const SnCurve& curve, std::string& basis) {
  const std::string& e = curve.edition();
  if (e.rfind("EN 1993", 0) == 0 || e.rfind("DNV", 0) == 0) {
    basis = "EN 1993-1-9 / DNVGL-RP-C203 allowable Miner sum for its curve";
    return 1.0;
  }
  basis = "IIW 2016 sec. 4.3.1 allowable Miner sum";
  return 0.5;
}

}  // namespace toehold
