#include "stackbound/cases/stage_emissions.hpp"

#include <fmt/format.h>

#include "stackbound/emissions/reference_o2_presets.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {

namespace {

namespace em = stackbound::emissions;

struct ReferenceO2 {
  double o2_dry = 0.0;
  std::string text;
  bool from_preset = false;
};

// The user's value, or the plant type's preset.
ReferenceO2 reference_o2(const CaseDefinition& definition, bool describe) {
  const em::ReferenceO2Preset* preset = definition.reference_o2_preset;
  const std::optional<double>& stated = definition.report.reference_o2_fraction;
  if (preset != nullptr) {
    const em::ReferenceO2Choice choice = em::choose_reference_o2(*preset, stated);
    return {choice.o2_dry_fraction, describe ? choice.text() : std::string(), choice.from_preset};
  }
  if (!stated) {
    throw units::InputError(
        "report.reference_o2: report.reference_o2 = \"preset\": needs case.plant_type (a "
        "reference-O2 preset key) or an explicit O2, e.g. reference_o2: 3 %");
  }
  return {*stated, describe ? fmt::format("{:.2f} % (stated in the case file)", *stated * 100.0) : std::string(),
          false};
}

// The figures of a pollutant at the wet mole fraction `wet_fraction` of the stack gas: the one
// conversion path of the bound, the estimate and the ceiling.
em::StackEmission emission_at(const em::Pollutant& pollutant, double wet_fraction, const CaseDefinition& definition,
                              const ResolvedCase& resolved, const StackGas& stack, double reference_o2,
                              bool record_factors) {
  const em::O2Basis o2_basis = definition.report.o2_basis;
  const em::FFactor fd = resolved.f_factors.fd;
  const em::StackEmissionInput input{
      .pollutant = pollutant,
      .pollutant_wet_fraction = wet_fraction,
      .h2o_wet_fraction = stack.h2o_wet,
      .o2_wet_fraction = stack.o2_wet,
      .co2_wet_fraction = stack.co2_wet,
      .wet_flue_gas_flow = units::moles_per_second(stack.wet_mol_per_s),
      .heat_input = units::watts(resolved.rates.feed.heat_input_hhv_W),
      .fd = fd,
      .reference_o2_dry_fraction = reference_o2,
      .normal = definition.report.normal,
      .o2_basis = o2_basis,
      .operating_hours_per_year = definition.report.operating_hours_h,
      .record_factors = record_factors,
  };
  em::StackEmission emission = em::evaluate_stack_emission(input);
  if (o2_basis != em::O2Basis::us_epa_20_9) {
    // Method 19 is written with 20.9 % O2 whatever the O2 basis of the concentration correction.
    em::ConcentrationContext method19_context = stack.context;
    method19_context.o2_basis = em::O2Basis::us_epa_20_9;
    method19_context.record_factors = record_factors;
    emission.method19 = em::method19_o2_dry(emission.ppmvd, fd, method19_context);
  }
  return emission;
}

PollutantBound bound_of(const em::Pollutant& pollutant, const CaseDefinition& definition, const ResolvedCase& resolved,
                        const FiringState& fired, const StackGas& stack, double reference_o2, bool record_factors) {
  const double wet_fraction = wet_fraction_of(fired.equilibrium, pollutant.name);
  return {pollutant.name, wet_fraction,
          emission_at(pollutant, wet_fraction, definition, resolved, stack, reference_o2, record_factors), std::nullopt,
          std::nullopt};
}

std::optional<PollutantFigure> figure_at(const std::optional<double>& wet_fraction, const em::Pollutant& pollutant,
                                         const CaseDefinition& definition, const ResolvedCase& resolved,
                                         const StackGas& stack, double reference_o2, bool record_factors) {
  if (!wet_fraction) return std::nullopt;
  return PollutantFigure{*wet_fraction, emission_at(pollutant, *wet_fraction, definition, resolved, stack,
                                                    reference_o2, record_factors)};
}

}  // namespace

double wet_fraction_of(const core::EquilibriumResult& equilibrium, std::string_view pollutant) {
  if (pollutant == "NOx") return equilibrium.mole_fraction("NO") + equilibrium.mole_fraction("NO2");
  return equilibrium.mole_fraction(pollutant);
}

EmissionFigures emissions_stage(const CaseDefinition& definition, const ResolvedCase& resolved,
                                const FiringState& fired, const StackGas& stack, const EmissionOptions& options,
                                const PostFlame* post_flame) {
  ReferenceO2 reference = reference_o2(definition, options.describe_reference_o2);
  EmissionFigures figures{
      .normal = definition.report.normal,
      .o2_basis = definition.report.o2_basis,
      .reference_o2_dry = reference.o2_dry,
      .reference_o2_text = std::move(reference.text),
      .reference_o2_from_preset = reference.from_preset,
      .pollutants = {},
  };
  figures.pollutants.reserve(definition.report.pollutants.size());
  for (const em::Pollutant& pollutant : definition.report.pollutants) {
    PollutantBound bound =
        bound_of(pollutant, definition, resolved, fired, stack, reference.o2_dry, options.record_factors);
    if (post_flame != nullptr) {
      bound.estimate = figure_at(post_flame->estimate_wet_fraction(pollutant.name), pollutant, definition, resolved,
                                 stack, reference.o2_dry, options.record_factors);
      bound.ceiling = figure_at(post_flame->ceiling_wet_fraction(pollutant.name), pollutant, definition, resolved,
                                stack, reference.o2_dry, options.record_factors);
    }
    figures.pollutants.push_back(std::move(bound));
  }
  return figures;
}

}  // namespace stackbound::cases
