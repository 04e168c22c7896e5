#include "cases/run_metrics.hpp"

#include <fmt/format.h>

#include "emissions/reference_correction.hpp"

namespace stackbound::cases {

std::vector<Metric> run_metrics(const RunResult& r) {
  const std::string ref = fmt::format("@ {} % O2", emissions::percent_text(r.reference_o2_dry));
  std::vector<Metric> metrics = {
      {"firing_temperature_K", "firing temperature [K]", r.firing_temperature_K},
      {"excess_air_percent", "excess air [%]", r.combustion.excess_air() * 100.0},
      {"flue_o2_dry_percent", "flue O2 [% dry]", r.stack_o2_dry * 100.0},
      {"moisture_percent", "flue H2O [% wet]", r.stack_h2o_wet * 100.0},
      {"heat_input_MW", "heat input [MW HHV]", r.rates.feed.heat_input_hhv_W / 1e6},
      {"stack_flow_wet_Nm3_per_h", fmt::format("stack flow [Nm3/h wet, {}]", r.normal->key),
       r.stack_wet_mol_per_s * r.normal->molar_volume_m3_per_mol() * 3600.0},
  };
  for (const PollutantBound& p : r.pollutants) {
    const emissions::StackEmission& e = p.emission;
    metrics.push_back({p.name + "_ppmvd", p.name + " bound [ppmvd]", e.ppmvd.value()});
    metrics.push_back({p.name + "_ppmvd_at_ref_o2", fmt::format("{} bound [ppmvd {}]", p.name, ref), e.ppmvd_at_reference.value()});
    metrics.push_back({p.name + "_mg_per_Nm3_at_ref_o2", fmt::format("{} bound [mg/Nm3 {}]", p.name, ref),
                       e.mg_per_Nm3_at_reference.result.value()});
    metrics.push_back({p.name + "_kg_per_h", p.name + " bound [kg/h]", e.mass_rate.value() * 3600.0});
    metrics.push_back({p.name + "_lb_per_MMBtu", p.name + " bound [lb/MMBtu]", e.method19.lb_per_MMBtu()});
  }
  return metrics;
}

}  // namespace stackbound::cases
