// Cost of the emissions layer per sweep point: evaluate_stack_emission for one pollutant (NOx as NO2),
// with and without the AppliedFactor list (DESIGN budget: a sweep point <= 25 us CPU in all).
// The flue gas is an invented, typical natural-gas composition.
#include <benchmark/benchmark.h>

#include "stackbound/emissions/emission_rate.hpp"

namespace {

namespace em = stackbound::emissions;
namespace units = stackbound::units;

// Invented natural-gas flue gas, wet mole fractions: NOx 100 ppmv, H2O 17 %, O2 2.5 %, CO2 8.5 %;
// reference O2 3 % dry, mg/Nm3 at 0 degC, O2 basis 20.9 %. Flow, heat input and Fd are invented
// round numbers of the right size (Fd about 8710 dscf/MMBtu).
em::StackEmissionInput natural_gas_nox(bool record_factors) {
  em::StackEmissionInput input;
  input.pollutant = em::pollutant_by_name("NOx", "bench");
  input.pollutant_wet_fraction = 1e-4;
  input.h2o_wet_fraction = 0.17;
  input.o2_wet_fraction = 0.025;
  input.co2_wet_fraction = 0.085;
  input.wet_flue_gas_flow = units::moles_per_second(120.0);
  input.heat_input = units::watts(10.0e6);
  input.fd = em::FFactor::from_scf_per_MMBtu(em::FFactorKind::dry, 8710.0);
  input.reference_o2_dry_fraction = 0.03;
  input.normal = &units::normal_0C();
  input.o2_basis = em::O2Basis::us_epa_20_9;
  input.record_factors = record_factors;
  return input;
}

void BM_EvaluateStackEmission(benchmark::State& state) {
  em::StackEmissionInput input = natural_gas_nox(state.range(0) != 0);
  for (auto _ : state) {
    const em::StackEmission emission = em::evaluate_stack_emission(input);
    benchmark::DoNotOptimize(emission.mg_per_Nm3_at_reference.result.value());
    benchmark::DoNotOptimize(emission.method19.kg_per_J);
    // A slightly different fraction each time, so that nothing is reused between points.
    input.pollutant_wet_fraction = input.pollutant_wet_fraction > 2e-4 ? 1e-4 : input.pollutant_wet_fraction * 1.0001;
  }
}
BENCHMARK(BM_EvaluateStackEmission)->ArgName("record_factors")->Arg(1)->Arg(0);

}  // namespace
