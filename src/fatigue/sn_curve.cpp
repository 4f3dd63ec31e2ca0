#include "toehold/fatigue/sn_curve.hpp"

#include "toehold/common/error.hpp"
#include "toehold/fatigue/number_text.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <utility>

namespace toehold {

using fatigue_detail::number_text;
namespace {

constexpr double kInf = std::numeric_limits<double>::infinity();

std::string curve_label(const SnCurveSpec& spec) { return "S-N curve '" + spec.name + "'"; }

void check_segment(const SnCurveSpec& spec, std::size_t i) {
  const SnSegment& s = spec.segments[i];
  const std::string where = curve_label(spec) + ": segment " + std::to_string(i + 1);
  if (!std::isfinite(s.slope) || s.slope <= 0.0)
    throw Error(where + " has slope m = " + number_text(s.slope) + "; the slope must be a finite number > 0");
  if (!std::isfinite(s.log10_a))
    throw Error(where + " has a non-finite log10 intercept; give a finite intercept or a point on the line");
}

// Knee between segments a and b: where their lines cross.
SnKnee intersection(const SnSegment& a, const SnSegment& b) {
  const double log_range = (b.log10_a - a.log10_a) / (b.slope - a.slope);
  const double range = std::pow(10.0, log_range);
  return {a.cycles_at(range), range};
}

std::vector<SnKnee> find_knees(const SnCurveSpec& spec) {
  std::vector<SnKnee> knees;
  for (std::size_t i = 0; i + 1 < spec.segments.size(); ++i) {
    const SnSegment& a = spec.segments[i];
    const SnSegment& b = spec.segments[i + 1];
    const std::string pair = "segments " + std::to_string(i + 1) + " and " + std::to_string(i + 2);
    if (a.slope == b.slope)
      throw Error(curve_label(spec) + ": " + pair + " have the same slope " + number_text(a.slope) +
                  " and never meet; merge them or change a slope");
    const SnKnee knee = intersection(a, b);
    if (!knees.empty() && !(knee.cycles > knees.back().cycles))
      throw Error(curve_label(spec) + ": " + pair + " meet at N = " + number_text(knee.cycles) +
                  ", not beyond the previous knee at N = " + number_text(knees.back().cycles) +
                  "; list the segments from the low-cycle end");
    knees.push_back(knee);
  }
  return knees;
}

void check_tail_and_cutoff(const SnCurveSpec& spec) {
  if (!std::isfinite(spec.cutoff_range) || spec.cutoff_range < 0.0)
    throw Error(curve_label(spec) + ": cut-off range " + number_text(spec.cutoff_range) +
                " MPa must be finite and >= 0 (0 = no cut-off)");
  if (!spec.constant_amplitude) return;
  const ConstantAmplitudeTail& tail = *spec.constant_amplitude;
  if (!std::isfinite(tail.knee_cycles) || tail.knee_cycles <= 0.0)
    throw Error(curve_label(spec) + ": constant-amplitude knee at N = " + number_text(tail.knee_cycles) +
                " must be finite and > 0");
  if (std::isnan(tail.slope) || tail.slope <= 0.0)
    throw Error(curve_label(spec) + ": constant-amplitude slope " + number_text(tail.slope) +
                " must be > 0 (infinity for a fatigue limit)");
}

// Band of ranges (MPa) and intercepts where a / ds^m with m <= kMaxWholeSlope stays a normal number.
constexpr int kMaxWholeSlope = 8;
constexpr double kFastRangeLow = 1e-20, kFastRangeHigh = 1e20;
constexpr double kFastInterceptLow = 1e-90, kFastInterceptHigh = 1e90;

// x^m by repeated multiplication, m >= 1.
double whole_power(double x, int m) {
  double p = x;
  for (int i = 1; i < m; ++i) p *= x;
  return p;
}

}  // namespace

std::string to_string(StressKind kind) { return kind == StressKind::normal ? "normal" : "shear"; }
std::string to_string(Amplitude amplitude) {
  return amplitude == Amplitude::constant ? "constant amplitude" : "variable amplitude";
}

SnSegment SnSegment::through(double slope, double range_mpa, double cycles) {
  return {slope, std::log10(cycles) + slope * std::log10(range_mpa)};
}

SnSegment SnSegment::with_intercept(double slope, double log10_a) { return {slope, log10_a}; }

double SnSegment::cycles_at(double range_mpa) const {
  return std::pow(10.0, log10_a - slope * std::log10(range_mpa));
}

double SnSegment::range_at(double cycles) const {
  return std::pow(10.0, (log10_a - std::log10(cycles)) / slope);
}

SnCurve::SnCurve(SnCurveSpec spec) : spec_(std::move(spec)) {
  if (spec_.segments.empty())
    throw Error(curve_label(spec_) + ": no segments; give at least one segment (slope m and a point or log10 "
                                     "intercept)");
  for (std::size_t i = 0; i < spec_.segments.size(); ++i) check_segment(spec_, i);
  knees_ = find_knees(spec_);
  check_tail_and_cutoff(spec_);
  for (const SnSegment& s : spec_.segments) whole_.push_back(whole_slope_form(s));
  if (spec_.constant_amplitude) {
    const double n = spec_.constant_amplitude->knee_cycles;
    ca_knee_ = SnKnee{n, spec_.segments[segment_for_cycles(n)].range_at(n)};
  }
}

void SnCurve::check_range(double range_mpa) const {
  if (!std::isfinite(range_mpa))
    throw Error(curve_label(spec_) + ": stress range " + number_text(range_mpa) +
                " MPa is not finite; check the stress history");
  if (range_mpa < 0.0)
    throw Error(curve_label(spec_) + ": stress range " + number_text(range_mpa) +
                " MPa is negative; give the range (maximum - minimum) as a positive number");
}

std::size_t SnCurve::segment_for_range(double range_mpa) const {
  std::size_t i = 0;
  while (i < knees_.size() && range_mpa < knees_[i].range) ++i;
  return i;
}

std::size_t SnCurve::segment_for_cycles(double cycles) const {
  std::size_t i = 0;
  while (i < knees_.size() && cycles > knees_[i].cycles) ++i;
  return i;
}

double SnCurve::cycles_to_failure(double range_mpa, Amplitude amplitude) const {
  check_range(range_mpa);
  if (range_mpa == 0.0 || range_mpa < spec_.cutoff_range) return kInf;
  if (amplitude == Amplitude::constant && ca_knee_ && range_mpa < ca_knee_->range) {
    const double m = spec_.constant_amplitude->slope;
    if (std::isinf(m)) return kInf;
    return ca_knee_->cycles * std::pow(ca_knee_->range / range_mpa, m);
  }
  return variable_amplitude_cycles(range_mpa);
}

// The segment's fast form, or {0, 0} when it must use the plain one.
SnCurve::WholeSlopeSegment SnCurve::whole_slope_form(const SnSegment& segment) {
  const double intercept = std::pow(10.0, segment.log10_a);
  const bool whole = segment.slope == std::floor(segment.slope) && segment.slope <= kMaxWholeSlope;
  if (!whole || !(intercept >= kFastInterceptLow && intercept <= kFastInterceptHigh)) return {};
  return {intercept, static_cast<int>(segment.slope)};
}

// N on the VA segment that holds range_mpa (> 0): the fast form where it applies, else the plain one.
double SnCurve::variable_amplitude_cycles(double range_mpa) const {
  const std::size_t i = segment_for_range(range_mpa);
  const WholeSlopeSegment& w = whole_[i];
  if (w.slope > 0 && range_mpa >= kFastRangeLow && range_mpa <= kFastRangeHigh)
    return w.intercept / whole_power(range_mpa, w.slope);
  return spec_.segments[i].cycles_at(range_mpa);
}

double SnCurve::allowable_range(double cycles, Amplitude amplitude) const {
  if (std::isnan(cycles) || cycles <= 0.0)
    throw Error(curve_label(spec_) + ": number of cycles " + number_text(cycles) + " must be > 0");
  double range = 0.0;
  if (amplitude == Amplitude::constant && ca_knee_ && cycles > ca_knee_->cycles) {
    const double m = spec_.constant_amplitude->slope;
    range = std::isinf(m) ? ca_knee_->range : ca_knee_->range * std::pow(ca_knee_->cycles / cycles, 1.0 / m);
  } else if (!std::isinf(cycles)) {
    range = spec_.segments[segment_for_cycles(cycles)].range_at(cycles);
  }
  return std::max(range, spec_.cutoff_range);
}

double SnCurve::reference_range() const { return allowable_range(kReferenceCycles, Amplitude::variable); }

std::vector<SnKnee> SnCurve::knees() const { return knees_; }

std::optional<SnKnee> SnCurve::constant_amplitude_knee() const { return ca_knee_; }

std::optional<double> SnCurve::constant_amplitude_slope() const {
  if (!spec_.constant_amplitude) return std::nullopt;
  return spec_.constant_amplitude->slope;
}

std::optional<double> SnCurve::cutoff_range() const {
  if (spec_.cutoff_range > 0.0) return spec_.cutoff_range;
  return std::nullopt;
}

SnCurve SnCurve::scaled(double factor, const std::string& note) const {
  if (!std::isfinite(factor) || factor <= 0.0)
    throw Error(curve_label(spec_) + ": resistance factor " + number_text(factor) +
                " must be finite and > 0");
  SnCurveSpec out = spec_;
  for (SnSegment& s : out.segments) s.log10_a += s.slope * std::log10(factor);
  out.cutoff_range *= factor;
  out.name += ", " + note;
  out.source += "; " + note;
  return SnCurve(std::move(out));
}

}  // namespace toehold
