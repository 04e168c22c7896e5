#include "stackbound/cases/run_metrics.hpp"

#include <fmt/format.h>

#include "stackbound/emissions/reference_correction.hpp"

namespace stackbound::cases {

std::vector<MetricColumn> run_metric_columns(const RunResult& r, bool reference_o2_varies) {
  const std::string ref = reference_o2_varies ? std::string("@ reference O2")
                                              : fmt::format("@ {} % O2", emissions::percent_text(r.emissions.reference_o2_dry));
  std::vector<MetricColumn> columns = {
      {"firing_temperature_K", "firing temperature [K]"},
      {"excess_air_percent", "excess air [%]"},
      {"flue_o2_dry_percent", "flue O2 [% dry]"},
      {"moisture_percent", "flue H2O [% wet]"},
      {"heat_input_MW", "heat input [MW HHV]"},
      {"stack_flow_wet_Nm3_per_h", fmt::format("stack flow [Nm3/h wet, {}]", r.emissions.normal->key)},
  };
  for (const PollutantBound& p : r.emissions.pollutants) {
    columns.push_back({p.name + "_ppmvd", p.name + " bound [ppmvd]"});
    columns.push_back({p.name + "_ppmvd_at_ref_o2", fmt::format("{} bound [ppmvd {}]", p.name, ref)});
    columns.push_back({p.name + "_mg_per_Nm3_at_ref_o2", fmt::format("{} bound [mg/Nm3 {}]", p.name, ref)});
    columns.push_back({p.name + "_kg_per_h", p.name + " bound [kg/h]"});
    columns.push_back({p.name + "_lb_per_MMBtu", p.name + " bound [lb/MMBtu]"});
  }
  for (const PollutantBound& p : r.emissions.pollutants) {
    if (!post_flame_covers(p.name)) continue;
    for (const std::string_view kind : {"estimate", "ceiling"}) {
      const std::string key = fmt::format("{}_{}", p.name, kind);
      columns.push_back({key + "_ppmvd_at_ref_o2", fmt::format("{} {} [ppmvd {}]", p.name, kind, ref), true});
      columns.push_back({key + "_mg_per_Nm3_at_ref_o2", fmt::format("{} {} [mg/Nm3 {}]", p.name, kind, ref), true});
      columns.push_back({key + "_kg_per_h", fmt::format("{} {} [kg/h]", p.name, kind), true});
    }
  }
  return columns;
}

std::vector<double> run_metric_values(const RunResult& r) {
  std::vector<double> values = {
      r.fired.temperature_K,
      r.resolved.combustion.excess_air() * 100.0,
      r.stack.o2_dry * 100.0,
      r.stack.h2o_wet * 100.0,
      r.resolved.rates.feed.heat_input_hhv_W / 1e6,
      r.stack.wet_mol_per_s * r.emissions.normal->molar_volume_m3_per_mol() * 3600.0,
  };
  for (const PollutantBound& p : r.emissions.pollutants) {
    const emissions::StackEmission& e = p.emission;
    values.push_back(e.ppmvd.value());
    values.push_back(e.ppmvd_at_reference.value());
    values.push_back(e.mg_per_Nm3_at_reference.result.value());
    values.push_back(e.mass_rate.value() * 3600.0);
    values.push_back(e.method19.lb_per_MMBtu());
  }
  for (const PollutantBound& p : r.emissions.pollutants) {
    if (!post_flame_covers(p.name)) continue;
    for (const std::optional<PollutantFigure>* figure : {&p.estimate, &p.ceiling}) {
      if (!*figure) {
        values.insert(values.end(), 3, kMissingFigure);
        continue;
      }
      const emissions::StackEmission& e = (*figure)->emission;
      values.push_back(e.ppmvd_at_reference.value());
      values.push_back(e.mg_per_Nm3_at_reference.result.value());
      values.push_back(e.mass_rate.value() * 3600.0);
    }
  }
  return values;
}

}  // namespace stackbound::cases
