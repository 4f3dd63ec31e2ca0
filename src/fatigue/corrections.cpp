#include "toehold/fatigue/corrections.hpp"

#include "toehold/common/error.hpp"
#include "toehold/fatigue/number_text.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <utility>

namespace toehold {

using fatigue_detail::number_text;
namespace {

constexpr std::array<std::pair<std::string_view, IiwThicknessCategory>, 3> kThicknessCategories{{
    {"as_welded_transverse", IiwThicknessCategory::as_welded_transverse},
    {"toe_ground_or_butt", IiwThicknessCategory::toe_ground_or_butt},
    {"butt_ground_longitudinal", IiwThicknessCategory::butt_ground_longitudinal},
}};

constexpr std::array<std::pair<std::string_view, IiwMeanStressCase>, 3> kMeanStressCases{{
    {"stress_relieved", IiwMeanStressCase::stress_relieved},
    {"small_residual_stress", IiwMeanStressCase::small_residual_stress},
    {"high_residual_stress", IiwMeanStressCase::high_residual_stress},
}};

template <class Table>
std::string spellings(const Table& table) {
  std::string out;
  for (const auto& [name, value] : table) out += (out.empty() ? "" : ", ") + std::string(name);
  return out;
}

template <class Table>
auto parse(const Table& table, std::string_view text, const std::string& where, const char* kind) {
  for (const auto& [name, value] : table)
    if (name == text) return value;
  throw Error(where + ": unknown " + kind + " '" + std::string(text) + "'; use one of " + spellings(table));
}

template <class Table, class Value>
std::string name_of(const Table& table, Value v) {
  for (const auto& [name, value] : table)
    if (value == v) return std::string(name);
  return "?";
}

void require_positive(double value, const std::string& what) {
  if (!std::isfinite(value) || value <= 0.0)
    throw Error(what + " " + number_text(value) + " must be finite and > 0");
}

void require_non_negative(double value, const std::string& what) {
  if (!std::isfinite(value) || value < 0.0)
    throw Error(what + " " + number_text(value) + " must be finite and >= 0");
}

}  // namespace

double iiw_thickness_exponent(IiwThicknessCategory category) {
  switch (category) {
    case IiwThicknessCategory::as_welded_transverse: return 0.3;
    case IiwThicknessCategory::toe_ground_or_butt: return 0.2;
    case IiwThicknessCategory::butt_ground_longitudinal: return 0.1;
  }
  return 0.3;
}

std::string to_string(IiwThicknessCategory category) { return name_of(kThicknessCategories, category); }

IiwThicknessCategory parse_iiw_thickness_category(std::string_view text, const std::string& where) {
  return parse(kThicknessCategories, text, where, "IIW thickness category");
}

double iiw_effective_thickness(double t_mm, double toe_distance_mm) {
  require_positive(t_mm, "IIW effective thickness: plate thickness t (mm)");
  require_positive(toe_distance_mm, "IIW effective thickness: toe distance L (mm)");
  return toe_distance_mm / t_mm <= 2.0 ? 0.5 * toe_distance_mm : t_mm;
}

double iiw_thickness_factor(double t_eff_mm, double n) {
  require_positive(t_eff_mm, "IIW thickness factor: effective thickness (mm)");
  require_non_negative(n, "IIW thickness factor: exponent n");
  return t_eff_mm > 25.0 ? std::pow(25.0 / t_eff_mm, n) : 1.0;
}

double iiw_thickness_factor(double t_eff_mm, IiwThicknessCategory category) {
  return iiw_thickness_factor(t_eff_mm, iiw_thickness_exponent(category));
}

double dnv_thickness_factor(double t_mm, double t_ref_mm, double k) {
  require_positive(t_mm, "DNV thickness factor: thickness t (mm)");
  require_positive(t_ref_mm, "DNV thickness factor: reference thickness t_ref (mm)");
  require_non_negative(k, "DNV thickness factor: exponent k");
  return t_mm > t_ref_mm ? std::pow(t_mm / t_ref_mm, k) : 1.0;
}

std::string to_string(IiwMeanStressCase c) { return name_of(kMeanStressCases, c); }

IiwMeanStressCase parse_iiw_mean_stress_case(std::string_view text, const std::string& where) {
  return parse(kMeanStressCases, text, where, "IIW mean-stress case");
}

double iiw_mean_stress_factor(double stress_ratio, IiwMeanStressCase c) {
  if (!std::isfinite(stress_ratio))
    throw Error("IIW mean-stress factor: stress ratio R = " + number_text(stress_ratio) +
                " is not finite; give R = s_min / s_max of a cycle with s_max != 0");
  const double r = std::max(stress_ratio, -1.0);  // constant below R = -1
  switch (c) {
    case IiwMeanStressCase::stress_relieved: return std::max(1.0, 1.2 - 0.4 * r);
    case IiwMeanStressCase::small_residual_stress: return std::max(1.0, 0.9 - 0.4 * r);
    case IiwMeanStressCase::high_residual_stress: return 1.0;
  }
  return 1.0;
}

double stress_ratio(double s_min, double s_max) {
  if (!std::isfinite(s_min) || !std::isfinite(s_max) || s_max == 0.0 || s_min > s_max)
    throw Error("stress ratio: s_min = " + number_text(s_min) + " MPa and s_max = " + number_text(s_max) +
                " MPa must be finite with s_min <= s_max and s_max != 0");
  return s_min / s_max;
}

double axial_misalignment_factor(double e_mm, double t_mm) {
  require_non_negative(e_mm, "axial misalignment: offset e (mm)");
  require_positive(t_mm, "axial misalignment: plate thickness t (mm)");
  return 1.0 + 3.0 * e_mm / t_mm;
}

std::string to_string(FailureConsequence c) {
  return c == FailureConsequence::low ? "low consequence" : "high consequence";
}

std::string to_string(FatigueDesignConcept c) {
  return c == FatigueDesignConcept::fail_safe ? "fail-safe (damage tolerant)" : "safe life";
}

double iiw_gamma_m(FatigueDesignConcept concept_, FailureConsequence consequence) {
  const bool high = consequence == FailureConsequence::high;
  if (concept_ == FatigueDesignConcept::fail_safe) return high ? 1.15 : 1.00;
  return high ? 1.30 : 1.15;
}

double en_gamma_mf(FatigueDesignConcept concept_, FailureConsequence consequence) {
  const bool high = consequence == FailureConsequence::high;
  if (concept_ == FatigueDesignConcept::fail_safe) return high ? 1.15 : 1.00;
  return high ? 1.35 : 1.15;
}

namespace {

template <class Fn>
std::vector<NamedFactor> factor_table(const std::string& prefix, Fn factor) {
  std::vector<NamedFactor> rows;
  for (FatigueDesignConcept dc : {FatigueDesignConcept::fail_safe, FatigueDesignConcept::safe_life})
    for (FailureConsequence fc : {FailureConsequence::low, FailureConsequence::high})
      rows.push_back({prefix + ", " + to_string(dc) + ", " + to_string(fc), factor(dc, fc)});
  return rows;
}

}  // namespace

std::vector<NamedFactor> iiw_gamma_m_table() { return factor_table("IIW 2016 gamma_M", iiw_gamma_m); }
std::vector<NamedFactor> en_gamma_mf_table() {
  return factor_table("EN 1993-1-9:2005 Table 3.1 gamma_Mf", en_gamma_mf);
}

double PartialSafetyFactors::on_stress_range() const {
  require_positive(gamma_f, "partial safety factor gamma_F");
  require_positive(gamma_m, "partial safety factor gamma_M");
  return gamma_f * gamma_m;
}

}  // namespace toehold
