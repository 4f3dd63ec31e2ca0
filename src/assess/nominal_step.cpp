// The nominal-stress method of a toe: locating its source in the model, reading it per load step, and putting
// its check beside the hot-spot result of every station (docs/nominal-method.md, sections 8 to 11).
#include "nominal_step.hpp"

#include "toehold/common/error.hpp"
#include "toehold/toe/surface_walk.hpp"

#include <cmath>
#include <sstream>

namespace toehold::detail {
namespace {

using nominal::NominalSource;

std::string label(const ToePlan& toe) { return "toe '" + toe.name + "' [toe.nominal]"; }

std::string short_number(double v) {
  std::ostringstream os;
  os.precision(4);
  os << v;
  return os.str();
}

std::string point_text(const Vec3& x) {
  std::ostringstream os;
  os.precision(4);
  os << "(" << x.x() << ", " << x.y() << ", " << x.z() << ") mm";
  return os.str();
}

SnCurve nominal_curve(const Plan& plan, const ToePlan& toe) {
  try {
    return find_curve(plan, toe.nominal->curve);
  } catch (const Error& e) {
    throw Error(label(toe) + " key curve: " + e.what());
  }
}

void check_counts(const Plan& plan, const ToePlan& toe) {
  const ToeNominalPlan& n = *toe.nominal;
  const std::size_t steps = plan.steps.size();
  const auto refuse = [&](const char* key, std::size_t count) {
    throw Error(label(toe) + ": key " + key + " has " + std::to_string(count) + " values but the plan has " +
                std::to_string(steps) + " load steps; give one value per load step, in plan order");
  };
  if (!n.values_MPa.empty() && n.values_MPa.size() != steps) refuse("values", n.values_MPa.size());
  if (n.weld_group && n.weld_group->loads.size() != steps) refuse("weld_group loads", n.weld_group->loads.size());
}

void check_kind(const ToePlan& toe, const SnCurve& curve) {
  const ToeNominalPlan& n = *toe.nominal;
  const StressKind kind = n.weld_group ? nominal::stress_kind_of(n.weld_group->measure)
                          : n.source == NominalSource::given ? curve.kind()
                                                             : StressKind::normal;
  if (kind == curve.kind()) return;
  throw Error(label(toe) + ": the nominal stress of source \"" + nominal::to_string(n.source) + "\" is a " +
              to_string(kind) + " stress but the curve '" + curve.name() + "' is for " + to_string(curve.kind()) +
              " stress; give a " + to_string(kind) + " stress detail class" +
              (kind == StressKind::shear ? ", e.g. \"IIW FAT 80 shear\"" : ", e.g. \"IIW FAT 80\""));
}

SectionStress cut_section(const ToePlan& toe, const Mesh& mesh, const StressField& field, const SectionSpec& spec) {
  try {
    return section_stress(mesh, field, spec);
  } catch (const Error& e) {
    throw Error(label(toe) + ": " + e.what());
  }
}

std::string section_description(const SectionSpec& s, const SectionStress& cut) {
  std::ostringstream os;
  os.precision(4);
  os << "membrane stress on the cut through " << point_text(s.point_mm) << " normal to (" << cut.normal.x() << ", "
     << cut.normal.y() << ", " << cut.normal.z() << "): " << cut.area_mm2 << " mm2 over " << cut.cut_cells
     << " cells";
  return os.str();
}

// Cuts the plane once with a zero field, so that a cut that misses the plate fails before any step is read.
void prepare_section(const ModelGeometry& g, const ToePlan& toe, NominalToeState& state) {
  const auto cells = static_cast<std::size_t>(g.mesh.grid()->GetNumberOfCells());
  const StressField zero(Association::cell, std::vector<double>(6 * cells, 0.0));
  state.description = section_description(state.plan.section, cut_section(toe, g.mesh, zero, state.plan.section));
}

// The sample point of one station, distance_mm along its read-out direction on the surface.
void place_sample(const ModelGeometry& g, const WeldSide& weld, const ToePlan& toe, const StationResult& r,
                  NominalToeState& state) {
  state.hosts.emplace_back();
  state.samples.emplace_back(Vec3::Zero());
  state.station_values.emplace_back();
  const double d = state.plan.distance_mm;
  if (!r.ok()) {
    state.problems.push_back("the station has no hot-spot result");
    return;
  }
  const Walk walk = walk_surface(g.surface, weld, r.station.facet, r.station.x, r.station.frame.readout, {d});
  if (walk.targets.empty()) {
    state.problems.push_back("the read-out path ends before " + short_number(d) + " mm: " + walk.stop_reason);
    return;
  }
  const Vec3 x = walk.targets.front().x;
  state.samples.back() = x;
  auto host = g.locator.locate(x, 0.05 * toe.thickness, [&weld](long long c) { return weld.is_weld_cell(c); });
  if (!host) {
    state.problems.push_back("the sample point at " + short_number(d) + " mm lies off the model");
    return;
  }
  state.hosts.back() = std::move(host);
  state.problems.emplace_back();
}

void prepare_surface(const ModelGeometry& g, const WeldSide& weld, PlacedToe& toe, NominalToeState& state) {
  for (const PlacedStation& s : toe.stations) place_sample(g, weld, toe.result.plan, s.result, state);
  state.description = "surface stress across the toe at " + short_number(state.plan.distance_mm) +
                      " mm along each station's read-out path";
}

std::string weld_group_description(const WeldGroupPlan& w) {
  const nominal::WeldGroupProperties p = nominal::weld_group_properties(w.shape);
  return "throat stress (" + nominal::to_string(w.measure) + ") of " + p.label + ": leg " +
         short_number(p.leg_mm) + " mm, throat area " + short_number(p.area_mm2) + " mm2, length " +
         short_number(p.length_mm) + " mm";
}

std::string given_description(const ToeNominalPlan& n) {
  return n.range_MPa ? "range " + short_number(*n.range_MPa) + " MPa given in the plan"
                     : "one nominal stress per load step given in the plan";
}

}  // namespace

void prepare_nominal(const Plan& plan, const ModelGeometry& geometry, const WeldSide& weld, PlacedToe& toe) {
  const ToePlan& tp = toe.result.plan;
  if (!tp.nominal) return;
  const SnCurve curve = nominal_curve(plan, tp);
  check_counts(plan, tp);
  check_kind(tp, curve);
  auto state = std::make_shared<NominalToeState>(*tp.nominal, curve);
  state->mesh = &geometry.mesh;
  switch (tp.nominal->source) {
    case NominalSource::given: state->description = given_description(*tp.nominal); break;
    case NominalSource::section: prepare_section(geometry, tp, *state); break;
    case NominalSource::surface_distance: prepare_surface(geometry, weld, toe, *state); break;
    case NominalSource::weld_group: state->description = weld_group_description(*tp.nominal->weld_group); break;
  }
  toe.nominal = std::move(state);
}

void record_nominal_step(PlacedToe& toe, const StressField& field) {
  if (!toe.nominal) return;
  NominalToeState& s = *toe.nominal;
  if (s.plan.source == NominalSource::section) {
    s.toe_values.push_back(cut_section(toe.result.plan, *s.mesh, field, s.plan.section).membrane_MPa);
    return;
  }
  if (s.plan.source != NominalSource::surface_distance) return;
  for (std::size_t i = 0; i < s.hosts.size(); ++i)
    if (s.hosts[i])
      s.station_values[i].push_back(normal_stress(interpolate(field, *s.hosts[i]),
                                                  toe.stations[i].result.station.frame.readout));
}

}  // namespace toehold::detail
