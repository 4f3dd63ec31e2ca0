// stations.csv: one row per station with position, hot-spot stresses, range, allowable range, utilization, life
// and status. RFC 4180: comma separated, CRLF line ends, fields with commas, quotes or line breaks in quotes.
// Numbers are written in the shortest form that reads back to the same double; empty where there is no result.
#include "result_files.hpp"

#include "toehold/common/error.hpp"

#include <charconv>
#include <cmath>
#include <fstream>
#include <limits>
#include <system_error>

namespace toehold::detail {
namespace {

bool damage_kind(const Assessment& a) { return a.plan.loading.kind != LoadingKind::range; }

std::string quoted(const std::string& field) {
  if (field.find_first_of(",\"\r\n") == std::string::npos) return field;
  std::string out = "\"";
  for (char ch : field) out += ch == '"' ? std::string("\"\"") : std::string(1, ch);
  return out + "\"";
}

// Shortest decimal text that parses back to exactly `v` ("inf" for infinity, "" for NaN).
std::string number(double v) {
  if (std::isnan(v)) return "";
  char buffer[64];
  const auto [end, ec] = std::to_chars(buffer, buffer + sizeof buffer, v);
  return ec == std::errc() ? std::string(buffer, end) : std::string("nan");
}

class Row {
public:
  Row& text(const std::string& s) { return add(quoted(s)); }
  Row& num(double v) { return add(number(v)); }
  Row& integer(long long v) { return add(std::to_string(v)); }
  Row& empty() { return add(""); }
  const std::string& line() const { return line_; }

private:
  Row& add(const std::string& field) {
    if (!first_) line_ += ',';
    line_ += field;
    first_ = false;
    return *this;
  }
  std::string line_;
  bool first_ = true;
};

std::string steps_between(const Assessment& a, int from, int to);

Row header(const OutputContext& c) {
  Row r;
  r.text("toe").text("toe name").text(kStationId);
  r.text(c.length_name("x")).text(c.length_name("y")).text(c.length_name("z")).text(c.length_name("arc length"));
  for (const auto& step : c.a->steps) r.text(hot_spot_name(step));
  r.text("hot-spot stress range [MPa]").text("range between steps").text("allowable stress range [MPa]");
  r.text(kUtilization).text("life [cycles]").text("status").text("S-N curve");
  if (damage_kind(*c.a))
    r.text("damage [-]").text("damage limit [-]").text("life [repeats]").text("life [years]")
        .text("equivalent stress range at 2e6 [MPa]").text("cycles per repeat").text("governing range [MPa]")
        .text("governing mean [MPa]").text("governing cycles").text("governing damage share [-]")
        .text("mean-stress correction").text("counting");
  if (has_nominal(*c.a))
    r.text("nominal source").text("nominal S-N curve").text("nominal stress range [MPa]")
        .text("nominal range between steps").text("nominal allowable stress range [MPa]")
        .text("nominal utilization [-]").text("nominal life [cycles]")
        .text("structural stress concentration factor [-]").text("governing method");
  if (has_shell(*c.a))
    r.text("shell layer").text("read-out origin").text(c.length_name("offset from intersection line"))
        .text(c.length_name("hot-spot location x")).text(c.length_name("hot-spot location y"))
        .text(c.length_name("hot-spot location z"));
  if (has_linearization(*c.a))
    r.text("linearized structural stress range [MPa]").text("stress range 1 mm below surface [MPa]")
        .text("ratio linearized to surface range [-]").text("linearization problem");
  return r;
}

void shell_fields(const OutputContext& c, const StationResult& s, Row& r) {
  if (!s.shell) {
    for (int k = 0; k < 6; ++k) r.empty();
    return;
  }
  const ShellStationInfo& i = *s.shell;
  r.text(i.layer).text(i.origin).num(c.length(i.offset));
  r.num(c.length(i.hot_spot.x())).num(c.length(i.hot_spot.y())).num(c.length(i.hot_spot.z()));
}

void linearization_fields(const StationResult& s, Row& r) {
  if (!s.through_thickness) {
    for (int k = 0; k < 4; ++k) r.empty();
    return;
  }
  const ThroughThicknessResult& l = *s.through_thickness;
  if (l.ok())
    r.num(l.structural_range).num(l.one_mm_range).num(linearized_ratio(s)).empty();
  else
    r.empty().empty().empty().text(l.problem);
}

void nominal_fields(const OutputContext& c, const ToeResult& toe, const StationResult& s, Row& r) {
  if (!toe.nominal) {
    for (int k = 0; k < 9; ++k) r.empty();
    return;
  }
  r.text(toe.nominal->source).text(toe.nominal->curve);
  if (!s.nominal || !s.nominal->check.ok()) {
    for (int k = 0; k < 7; ++k) r.empty();
    return;
  }
  const NominalCheckResult& n = s.nominal->check;
  r.num(n.range).text(steps_between(*c.a, n.range_from, n.range_to)).num(n.allowable).num(n.utilization).num(n.life);
  if (s.nominal->concentration_factor)
    r.num(*s.nominal->concentration_factor);
  else
    r.empty();
  r.text(s.nominal->governing);
}

void damage_fields(const OutputContext& c, const ToeResult& toe, const StationResult& s, Row& r) {
  if (!s.ok()) {
    for (int k = 0; k < 10; ++k) r.empty();
  } else {
    r.num(s.damage).num(toe.damage_limit).num(s.life_repeats).num(s.life_years).num(s.equivalent_range);
    r.num(s.cycles_per_repeat);
    if (s.governing.empty()) {
      for (int k = 0; k < 4; ++k) r.empty();
    } else {
      const CycleDamage& g = s.governing.front();
      r.num(g.cycle.range).num(g.cycle.mean).num(g.cycle.count).num(g.share);
    }
  }
  r.text(toe.mean_stress).text(c.a->counting);
}

// "<step a> to <step b>", or "" when the range's steps are not known.
std::string steps_between(const Assessment& a, int from, int to) {
  const auto n = static_cast<int>(a.steps.size());
  if (from < 0 || to < 0 || from >= n || to >= n) return "";
  return a.steps[static_cast<std::size_t>(from)] + " to " + a.steps[static_cast<std::size_t>(to)];
}

std::string range_steps(const Assessment& a, const StationResult& s) { return steps_between(a, s.range_from, s.range_to); }

void result_fields(const OutputContext& c, const StationResult& s, Row& r) {
  const std::size_t steps = c.a->steps.size();
  if (!s.ok()) {
    for (std::size_t k = 0; k < steps + 5; ++k) r.empty();
    return;
  }
  for (std::size_t k = 0; k < steps; ++k) {
    if (k < s.hot_spot.size())
      r.num(s.hot_spot[k]);
    else
      r.empty();
  }
  r.num(s.range).text(range_steps(*c.a, s)).num(s.allowable).num(s.utilization).num(s.life);
}

Row station_row(const OutputContext& c, int toe_number, const ToeResult& toe, const StationResult& s) {
  Row r;
  r.integer(toe_number).text(toe.plan.name).integer(s.station.id);
  r.num(c.length(s.station.x.x())).num(c.length(s.station.x.y())).num(c.length(s.station.x.z()));
  r.num(c.length(s.station.arc));
  result_fields(c, s, r);
  r.text(station_status(s)).text(toe.curve);
  if (damage_kind(*c.a)) damage_fields(c, toe, s, r);
  if (has_nominal(*c.a)) nominal_fields(c, toe, s, r);
  if (has_shell(*c.a)) shell_fields(c, s, r);
  if (has_linearization(*c.a)) linearization_fields(s, r);
  return r;
}

}  // namespace

double linearized_ratio(const StationResult& s) {
  if (!s.ok() || !s.through_thickness || !s.through_thickness->ok() || !(s.range > 0.0))
    return std::numeric_limits<double>::quiet_NaN();
  return s.through_thickness->structural_range / s.range;  // NaN stays NaN
}

std::string station_status(const StationResult& s) {
  if (!s.ok()) return "no result: " + s.problem;
  return s.exceeds() ? "exceeds" : "ok";
}

void write_stations_csv(const OutputContext& c, const std::string& path) {
  std::ofstream out(path, std::ios::binary);
  if (!out) throw Error("cannot write result file '" + path + "'; check that the output folder is writable");
  out << header(c).line() << "\r\n";
  for (std::size_t t = 0; t < c.a->toes.size(); ++t)
    for (const auto& s : c.a->toes[t].stations)
      out << station_row(c, static_cast<int>(t + 1), c.a->toes[t], s).line() << "\r\n";
  out.close();
  if (!out) throw Error("cannot write result file '" + path + "'; check that the disk has space");
}

}  // namespace toehold::detail
