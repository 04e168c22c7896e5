#include "stackbound/cases/stage_stack.hpp"

#include "stackbound/units/constants.hpp"

namespace stackbound::cases {

StackGas stack_stage(const StackSpec& stack, emissions::O2Basis o2_basis, const ResolvedCase& resolved,
                     const FiringState& fired, bool record_factors) {
  const core::EquilibriumResult& gas = fired.equilibrium;
  const double h2o = gas.mole_fraction("H2O");
  const double o2 = gas.mole_fraction("O2");
  const double co2 = gas.mole_fraction("CO2");
  const double wet_mol_per_s = gas.total_gas_moles * resolved.rates.feed.mass_flow_kg_per_s;
  emissions::ConcentrationContext context = emissions::ConcentrationContext::from_wet_flue_gas(h2o, o2, co2, o2_basis);
  context.record_factors = record_factors;
  return StackGas{
      .h2o_wet = h2o,
      .o2_wet = o2,
      .co2_wet = co2,
      .o2_dry = context.o2_dry_fraction.value_or(0.0),
      .co2_dry = context.co2_dry_fraction.value_or(0.0),
      .wet_mol_per_s = wet_mol_per_s,
      .dry_mol_per_s = wet_mol_per_s * (1.0 - h2o),
      .actual_m3_per_s = wet_mol_per_s * units::kGasConstant_J_per_mol_K * stack.temperature_K / stack.pressure_Pa,
      .context = context,
  };
}

}  // namespace stackbound::cases
