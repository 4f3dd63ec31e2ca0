// S-N curve: fatigue resistance as a piecewise log-linear relation between stress range and cycles to failure,
// with an optional cut-off and separate constant-amplitude (CA) and variable-amplitude (VA) rules beyond the knee.
// Stress ranges are in MPa, cycles are counts; one implementation shared by the hot-spot and nominal methods.
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

namespace toehold {

// Which stress the curve is for; the standards give different slopes and knees for each.
enum class StressKind {
  normal,  // normal stress range (direct or hot-spot stress perpendicular to the weld)
  shear,   // shear stress range (nominal method only)
};

// Which rule applies beyond the knee point.
enum class Amplitude {
  constant,  // constant-amplitude loading: the CA tail (e.g. IIW slope 22, EN fatigue limit)
  variable,  // variable-amplitude loading and Miner sums: the VA segments (e.g. m2 = 5) and the cut-off
};

std::string to_string(StressKind kind);
std::string to_string(Amplitude amplitude);

// One straight line in log-log space: log10 N = log10_a - m log10(ds), ds in MPa.
struct SnSegment {
  double slope = 3.0;    // m, dimensionless, > 0 (inverse slope of the log-log line)
  double log10_a = 0.0;  // log10 of the intercept a in N = a ds^-m, with ds in MPa

  // The line of slope m through the point (range_mpa, cycles).
  static SnSegment through(double slope, double range_mpa, double cycles);
  // The line of slope m with the given log10 intercept (DNV-RP-C203 style tables).
  static SnSegment with_intercept(double slope, double log10_a);

  double cycles_at(double range_mpa) const;  // N at range ds (MPa) on this line
  double range_at(double cycles) const;      // ds (MPa) at N cycles on this line
};

// A corner of the curve: where one segment ends and the next begins.
struct SnKnee {
  double cycles = 0.0;  // N at the knee
  double range = 0.0;   // ds at the knee, MPa
};

// How constant-amplitude loading departs from the VA curve: at knee_cycles the CA curve continues with its own
// slope (IIW: 22 beyond 1e7) or turns horizontal (slope = infinity: a fatigue limit, EN 1993-1-9 ds_D).
struct ConstantAmplitudeTail {
  double knee_cycles = 1e7;  // N where the CA curve leaves the VA curve, > 0
  double slope = 22.0;       // m beyond the knee, > 0; std::numeric_limits<double>::infinity() = fatigue limit
};

// Thickness rule carried with curves that have one (DNV-RP-C203 sec. 2.4.3: ds x (t/t_ref)^k for t > t_ref).
struct SnThicknessRule {
  double exponent = 0.0;      // k, dimensionless
  double reference_mm = 25.0;  // t_ref, mm
};

// Everything needed to build a curve. Segments are listed from the low-cycle end; consecutive segments meet at
// their intersection (the knee), so slopes must differ and the knees must move to more cycles along the list.
struct SnCurveSpec {
  std::string name;     // short label, e.g. "IIW FAT 90 steel normal"
  std::string source;   // document, section and detail, e.g. "IIW 2016 (IIW-2259-15) sec. 3.7, FAT 90, ..."
  std::string edition;  // document and edition only, e.g. "IIW 2016 (IIW-2259-15)"
  StressKind kind = StressKind::normal;
  std::vector<SnSegment> segments;                          // VA curve, at least one segment
  std::optional<ConstantAmplitudeTail> constant_amplitude;  // none: CA loading uses the VA curve
  double cutoff_range = 0.0;  // MPa; ranges strictly below do no damage under either rule; 0 = no cut-off
  std::optional<SnThicknessRule> thickness;
};

// Reference number of cycles of the FAT class and of the EN detail category.
inline constexpr double kReferenceCycles = 2e6;

class SnCurve {
public:
  // Checks the spec and throws Error naming the curve when it is not a valid curve.
  explicit SnCurve(SnCurveSpec spec);

  // Cycles to failure at stress range ds (MPa, >= 0, finite). Returns std::numeric_limits<double>::infinity()
  // when the range does no damage (below the cut-off, below a CA fatigue limit, or ds = 0).
  // On a segment of whole slope m <= 8 it is a / ds^m by multiplication (within 1e-14 relative of
  // SnSegment::cycles_at, closer to the exact line); other slopes use cycles_at itself.
  double cycles_to_failure(double range_mpa, Amplitude amplitude = Amplitude::variable) const;
  // Allowable stress range (MPa) at N cycles (> 0; infinity gives the range that does no damage, possibly 0).
  double allowable_range(double cycles, Amplitude amplitude = Amplitude::variable) const;
  // Stress range at kReferenceCycles = 2e6 (the FAT value or EN ds_C), MPa.
  double reference_range() const;

  std::vector<SnKnee> knees() const;                        // VA knees, in order of increasing N
  std::optional<SnKnee> constant_amplitude_knee() const;    // where CA departs from VA, if it does
  std::optional<double> constant_amplitude_slope() const;   // CA slope beyond that knee (inf = fatigue limit)
  std::optional<double> cutoff_range() const;               // MPa, if the curve has a cut-off
  const std::vector<SnSegment>& segments() const { return spec_.segments; }
  double first_slope() const { return spec_.segments.front().slope; }  // m1

  const std::string& name() const { return spec_.name; }
  const std::string& source() const { return spec_.source; }
  const std::string& edition() const { return spec_.edition; }
  StressKind kind() const { return spec_.kind; }
  const std::optional<SnThicknessRule>& thickness() const { return spec_.thickness; }
  const SnCurveSpec& spec() const { return spec_; }

  // The same curve with every stress range multiplied by factor (> 0): a resistance correction such as f(t),
  // f(R) or 1/gamma_M. Knee cycles stay where they are. note is appended to the name and source.
  SnCurve scaled(double factor, const std::string& note) const;

private:
  // A VA segment prepared for fast evaluation: N = a / ds^m with ds^m by multiplication when m is a whole
  // number 1..8 (the usual 3 and 5) and ds lies in a band where no power can overflow or underflow. The same
  // line as SnSegment::cycles_at (10^(log10_a - m log10 ds)) to a few ulp, without a log and a pow per call.
  struct WholeSlopeSegment {
    double intercept = 0.0;  // a = 10^log10_a, N at ds = 1 MPa; 0 when the segment uses the plain form
    int slope = 0;           // m when it is a whole number 1..8, else 0 (plain form)
  };

  std::size_t segment_for_range(double range_mpa) const;
  std::size_t segment_for_cycles(double cycles) const;
  void check_range(double range_mpa) const;
  double variable_amplitude_cycles(double range_mpa) const;
  static WholeSlopeSegment whole_slope_form(const SnSegment& segment);

  SnCurveSpec spec_;
  std::vector<SnKnee> knees_;
  std::optional<SnKnee> ca_knee_;
  std::vector<WholeSlopeSegment> whole_;  // one per VA segment
};

}  // namespace toehold
