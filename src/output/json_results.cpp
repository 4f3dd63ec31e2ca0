// results.json after docs/results-schema.md: one writer function per object of the schema.
#include "toehold/output/json_results.hpp"

#include "result_files.hpp"

#include "toehold/output/json_writer.hpp"
#include "toehold/output/summary.hpp"
#include "toehold/nominal/names.hpp"

#include <cmath>

namespace toehold {
namespace {

struct Context {
  const Assessment& a;
  double mm_per_unit;  // divide mm by this for the output unit
  double length(double mm) const { return mm / mm_per_unit; }
  std::vector<double> position(const Vec3& x_mm) const {
    return {length(x_mm.x()), length(x_mm.y()), length(x_mm.z())};
  }
};

bool uses_damage(const Assessment& a) { return a.plan.loading.kind != LoadingKind::range; }

// A number that may be infinite (no damage): the number, or the string "infinite".
void maybe_infinite(JsonWriter& w, const char* name, double v) {
  w.key(name);
  if (std::isinf(v) && v > 0)
    w.value("infinite");
  else
    w.value(v);
}

void write_provenance(JsonWriter& w, const Provenance& p) {
  w.key("provenance").begin_object();
  w.field("tool", "toehold").field("tool_version", p.tool_version).field("written_utc", p.written_utc);
  w.field("platform", p.platform).field("plan_path", p.plan_path).field("plan_text", p.plan_text);
  w.key("files").begin_array();
  for (const auto& f : p.files) {
    w.begin_object().field("role", f.role).field("path", f.path);
    if (f.read()) {
      w.field("size_bytes", static_cast<long long>(f.size_bytes)).field("sha256", f.sha256);
      w.key("problem").null();
    } else {
      w.key("size_bytes").null().key("sha256").null().field("problem", f.problem);
    }
    w.end_object();
  }
  w.end_array();
  w.key("defaults_applied").strings(p.defaults_applied);
  w.end_object();
}

void write_run(JsonWriter& w, const Context& c, LengthUnit out_unit) {
  const Plan& plan = c.a.plan;
  w.field("title", plan.title).field("caution", kCaution);
  w.key("units").begin_object(true).field("length", to_string(out_unit)).field("stress", "MPa").end_object();
  w.key("model").begin_object().field("file", plan.model.file);
  w.field("length_unit", to_string(plan.model.length_unit)).field("stress_unit", to_string(plan.model.stress_unit));
  // volume_cells counts the model's cells: volume cells of a solid model, shell cells of a shell model.
  w.field("points", c.a.model_points).field("volume_cells", c.a.model_cells);
  w.field("cell_kind", plan.model.shell ? "shell" : "volume").end_object();
  w.key("steps").strings(c.a.steps);
  w.key("loading").begin_object().field("kind", to_string(plan.loading.kind)).field("counting", c.a.counting);
  w.field("repeats_per_year", plan.loading.repeats_per_year).end_object();
  const RequirementPlan& r = plan.requirement;
  w.key("requirement").begin_object().field("cycles", r.cycles).field("gamma_M", r.gamma_M);
  w.field("gamma_F", r.gamma_F).field("design_life_years", r.design_life_years).end_object();
  const int total = c.a.stations(), exceed = c.a.stations_exceeding(), none = c.a.stations_without_result();
  w.key("counts").begin_object(true).field("stations", total).field("pass", total - exceed - none);
  w.field("exceed", exceed).field("without_result", none).end_object();
  w.key("warnings").strings(c.a.warnings);
}

void write_scheme(JsonWriter& w, const ReadoutScheme& s) {
  w.key("scheme").begin_object().field("name", to_string(s.kind)).field("hot_spot_type", to_string(s.type));
  w.field("label", s.label).field("source", s.source);
  w.key("distances").numbers(s.distances);
  w.key("weights").numbers(s.weights).end_object();
}

void write_frame(JsonWriter& w, const Station& s) {
  w.key("frame");
  if (!s.problem.empty()) {
    w.null();
    return;
  }
  const auto v = [](const Vec3& x) { return std::vector<double>{x.x(), x.y(), x.z()}; };
  w.begin_object().key("tangent").numbers(v(s.frame.tangent)).key("normal").numbers(v(s.frame.normal));
  w.key("readout").numbers(v(s.frame.readout)).end_object();
}

void write_points(JsonWriter& w, const Context& c, const StationResult& s) {
  w.key("readout_points").begin_array();
  for (const auto& p : s.points) {
    w.begin_object().field("distance", c.length(p.distance)).key("position").numbers(c.position(p.x));
    w.field("cell", p.cell).field("outside_model", c.length(p.off_model));
    w.key("normal_stress").numbers(p.normal_stress).end_object();
  }
  w.end_array();
  w.key("path").begin_array();
  for (const auto& x : s.path) w.numbers(c.position(x));
  w.end_array();
}

void write_damage(JsonWriter& w, const ToeResult& t, const StationResult& s) {
  w.field("damage", s.damage).field("damage_limit", t.damage_limit);
  maybe_infinite(w, "life_repeats", s.life_repeats);
  maybe_infinite(w, "life_years", s.life_years);
  w.field("equivalent_range", s.equivalent_range).field("cycles_per_repeat", s.cycles_per_repeat);
  w.key("governing_cycles").begin_array();
  for (const auto& g : s.governing)
    w.begin_object(true).field("range", g.cycle.range).field("mean", g.cycle.mean).field("count", g.cycle.count)
        .field("damage", g.damage).field("share", g.share).end_object();
  w.end_array();
}

void write_result(JsonWriter& w, const Context& c, const ToeResult& t, const StationResult& s) {
  w.key("result");
  if (!s.ok()) {
    w.null();
    return;
  }
  w.begin_object().key("hot_spot").numbers(s.hot_spot).field("range", s.range);
  w.key("range_steps");
  if (s.range_from >= 0 && s.range_to >= 0)
    w.begin_array(true).value(s.range_from).value(s.range_to).end_array();
  else
    w.null();
  w.field("range_angle_deg", s.range_angle_deg).field("allowable", s.allowable);
  w.field("utilization", s.utilization);
  maybe_infinite(w, "life_cycles", s.life);
  if (uses_damage(c.a)) write_damage(w, t, s);
  w.end_object();
}

std::string status_of(const StationResult& s) {
  if (!s.ok()) return "no result";
  return s.exceeds() ? "exceeds" : "ok";
}

void write_station_nominal(JsonWriter& w, const Context& c, const StationResult& s);

void text_or_null(JsonWriter& w, const char* name, const std::string& text) {
  w.key(name);
  if (text.empty())
    w.null();
  else
    w.value(text);
}

void write_station_shell(JsonWriter& w, const Context& c, const StationResult& s) {
  if (!s.shell) return;
  const ShellStationInfo& i = *s.shell;
  w.key("shell").begin_object().field("layer", i.layer).field("origin", i.origin);
  w.field("offset", c.length(i.offset)).key("hot_spot_position").numbers(c.position(i.hot_spot));
  w.field("thickness_mm", i.thickness);
  std::vector<double> from;
  for (double d : i.from_intersection) from.push_back(c.length(d));
  w.key("from_intersection").numbers(from).end_object();
}

// The ratio of the linearized structural range to the surface range (as in stations.csv); NaN writes null.
void write_station_line(JsonWriter& w, const StationResult& s) {
  if (!s.through_thickness) return;
  const ThroughThicknessResult& l = *s.through_thickness;
  w.key("through_thickness").begin_object().field("rule", l.rule).field("points", l.points);
  w.field("thickness_mm", l.thickness);
  text_or_null(w, "problem", l.problem);
  text_or_null(w, "note", l.note);
  w.field("stop_depth_mm", l.stop_depth);  // NaN writes null
  w.key("membrane").numbers(l.membrane).key("bending").numbers(l.bending);
  w.key("structural").numbers(l.structural).key("peak").numbers(l.peak);
  w.key("hot_spot").numbers(l.hot_spot).key("one_mm").numbers(l.one_mm);
  w.field("structural_range", l.structural_range);
  w.key("range_steps");
  if (l.range_from >= 0 && l.range_to >= 0)
    w.begin_array(true).value(l.range_from).value(l.range_to).end_array();
  else
    w.null();
  w.field("one_mm_range", l.one_mm_range).field("ratio_to_surface", detail::linearized_ratio(s)).end_object();
}

void write_station(JsonWriter& w, const Context& c, const ToeResult& t, const StationResult& s) {
  w.begin_object().field("id", s.station.id).key("position").numbers(c.position(s.station.x));
  w.field("arc_length", c.length(s.station.arc));
  w.key("node");
  if (s.station.node >= 0)
    w.value(s.station.node);
  else
    w.null();
  write_frame(w, s.station);
  w.field("status", status_of(s)).key("problem");
  if (s.ok())
    w.null();
  else
    w.value(s.problem);
  w.key("notes").strings(s.notes);
  write_points(w, c, s);
  write_result(w, c, t, s);
  write_station_nominal(w, c, s);
  write_station_shell(w, c, s);
  write_station_line(w, s);
  w.end_object();
}

void write_steps(JsonWriter& w, const char* name, int from, int to) {
  w.key(name);
  if (from >= 0 && to >= 0)
    w.begin_array(true).value(from).value(to).end_array();
  else
    w.null();
}

void write_nominal_check(JsonWriter& w, const Context& c, const NominalCheckResult& n) {
  w.key("check").begin_object().key("problem");
  if (n.ok())
    w.null();
  else
    w.value(n.problem);
  w.key("values").numbers(n.values).field("range", n.range);
  write_steps(w, "range_steps", n.range_from, n.range_to);
  w.field("allowable", n.allowable).field("utilization", n.utilization);
  maybe_infinite(w, "life_cycles", n.life);
  if (uses_damage(c.a)) {
    w.field("damage", n.damage).field("damage_limit", n.damage_limit);
    maybe_infinite(w, "life_repeats", n.life_repeats);
    maybe_infinite(w, "life_years", n.life_years);
    w.field("equivalent_range", n.equivalent_range);
  }
  w.end_object();
}

void write_station_nominal(JsonWriter& w, const Context& c, const StationResult& s) {
  if (!s.nominal) return;
  const StationNominal& n = *s.nominal;
  w.key("nominal").begin_object();
  write_nominal_check(w, c, n.check);
  w.key("sample_position");
  if (n.sample_x)
    w.numbers(c.position(*n.sample_x));
  else
    w.null();
  w.key("concentration_factor");
  if (n.concentration_factor)
    w.value(*n.concentration_factor);
  else
    w.null();
  text_or_null(w, "governing", n.governing);
  w.field("verdict", n.verdict).end_object();
}

void write_infinite_life(JsonWriter& w, const InfiniteLifeResult& r) {
  const nominal::WeldCheck& k = r.check;
  w.begin_object().field("material", k.material.name).field("material_source", k.material.source);
  w.field("shear", k.shear).field("ultimate", k.ultimate_MPa).field("yield", k.yield_MPa);
  w.field("specimen_endurance", k.endurance.specimen_MPa);
  w.key("marin").begin_object(true).field("k_a", k.endurance.k_a).field("k_b", k.endurance.k_b);
  w.field("k_c", k.endurance.k_c).field("k_d", k.endurance.k_d).field("k_e", k.endurance.k_e);
  w.field("k_f", k.endurance.k_f).end_object();
  w.field("endurance", k.endurance.endurance_MPa).field("concentration_factor", k.concentration_factor);
  w.field("nominal_alternating", k.nominal_alternating_MPa).field("nominal_mean", k.nominal_mean_MPa);
  w.field("alternating", k.alternating_MPa).field("mean", k.mean_MPa);
  w.key("factors_of_safety").begin_object(true);
  maybe_infinite(w, "goodman", k.goodman);
  maybe_infinite(w, "gerber", k.gerber);
  maybe_infinite(w, "asme_elliptic", k.asme_elliptic);
  maybe_infinite(w, "first_cycle_yield", k.first_cycle_yield);
  w.end_object();
  w.field("criterion", nominal::to_string(k.criterion)).field("governing", nominal::to_string(k.governing));
  maybe_infinite(w, "factor_of_safety", k.factor_of_safety);
  write_steps(w, "steps", r.from, r.to);
  w.field("cycle", r.cycle).end_object();
}

void write_toe_nominal(JsonWriter& w, const Context& c, const ToeResult& t) {
  if (!t.nominal) return;
  const ToeNominalResult& n = *t.nominal;
  w.key("nominal").begin_object().field("source", n.source).field("description", n.description);
  w.field("curve", n.curve).field("curve_source", n.curve_source).field("stress_kind", n.stress_kind);
  w.field("per_station", n.per_station);
  write_nominal_check(w, c, n.check);
  w.key("worst_station");
  if (n.worst >= 0)
    w.value(t.stations[static_cast<std::size_t>(n.worst)].station.id);
  else
    w.null();
  text_or_null(w, "governing", n.governing);
  w.key("infinite_life");
  if (n.infinite_life) {
    write_infinite_life(w, *n.infinite_life);
  } else {
    w.null();
  }
  w.key("notes").strings(n.notes).end_object();
}

void write_toe(JsonWriter& w, const Context& c, int number, const ToeResult& t) {
  w.begin_object().field("number", number).field("name", t.plan.name).field("closed", t.line.closed);
  w.field("length", c.length(t.line.length())).field("thickness_mm", t.plan.thickness);
  write_scheme(w, t.scheme);
  w.field("definition", t.definition);
  w.key("curve").begin_object().field("plan_name", t.plan.curve).field("name", t.curve);
  w.field("source", t.curve_source).field("thickness_factor", t.thickness_factor).end_object();
  w.key("worst_station");
  if (t.worst >= 0)
    w.value(t.stations[static_cast<std::size_t>(t.worst)].station.id);
  else
    w.null();
  write_toe_nominal(w, c, t);
  w.key("stations").begin_array();
  for (const auto& s : t.stations) write_station(w, c, t, s);
  w.end_array().end_object();
}

}  // namespace

std::string format_results_json(const Assessment& a, const Provenance& p, LengthUnit out_unit) {
  const Context c{a, mm_per(out_unit)};
  JsonWriter w;
  w.begin_object().field("schema_version", kResultsSchemaVersion);
  write_run(w, c, out_unit);
  write_provenance(w, p);
  w.key("toes").begin_array();
  for (std::size_t t = 0; t < a.toes.size(); ++t) write_toe(w, c, static_cast<int>(t + 1), a.toes[t]);
  w.end_array().end_object();
  return w.text();
}

}  // namespace toehold
