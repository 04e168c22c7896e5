#pragma once
// Stage 5 of a run, emissions: the equilibrium bound of each reported pollutant in the stack gas on
// the report's bases: ppmvd, ppmvd and mg/Nm3 at the reference O2, kg/h, t/yr, and per heat input
// (lb/MMBtu, g/GJ) by US EPA Method 19 and by mass balance.

#include <optional>
#include <string>
#include <vector>

#include "stackbound/cases/case_definition.hpp"
#include "stackbound/cases/stage_fire.hpp"
#include "stackbound/cases/stage_post_flame.hpp"
#include "stackbound/cases/stage_resolve.hpp"
#include "stackbound/cases/stage_stack.hpp"
#include "stackbound/emissions/emission_rate.hpp"
#include "stackbound/emissions/reference_correction.hpp"
#include "stackbound/units/normal_conditions.hpp"

namespace stackbound::cases {

// A wet mole fraction in the stack gas and its figures on every basis.
struct PollutantFigure {
  double wet_mole_fraction = 0.0;
  emissions::StackEmission emission;
};

struct PollutantBound {
  std::string name;                // "CO", "NO", "NO2", "NOx", "SO2"
  double wet_mole_fraction = 0.0;  // in the frozen stack gas
  emissions::StackEmission emission;
  // The post-flame estimate and ceiling (stage_post_flame.hpp) on the same bases, by the same
  // conversions as the bound; nullopt where the post-flame stage gives none (NO2, SO2).
  std::optional<PollutantFigure> estimate;
  std::optional<PollutantFigure> ceiling;
};

struct EmissionFigures {
  const units::NormalConditions* normal = nullptr;  // of mg/Nm3 figures and normal volumes
  emissions::O2Basis o2_basis = emissions::O2Basis::us_epa_20_9;
  double reference_o2_dry = 0.0;
  std::string reference_o2_text;  // with its origin (stated or preset); empty unless asked for
  bool reference_o2_from_preset = false;
  std::vector<PollutantBound> pollutants;
};

struct EmissionOptions {
  bool record_factors = true;         // keep the conversion factors behind each figure
  bool describe_reference_o2 = true;  // fill reference_o2_text (report text only; sweeps skip it)
};

// Runs the stage. The reference O2 is the stated one, else the plant type's preset (an InputError
// naming report.reference_o2 when there is neither, which a loaded case never has). With
// `post_flame`, each pollutant it covers also gets its estimate and ceiling.
EmissionFigures emissions_stage(const CaseDefinition& definition, const ResolvedCase& resolved,
                                const FiringState& fired, const StackGas& stack, const EmissionOptions& options = {},
                                const PostFlame* post_flame = nullptr);

// Wet mole fraction of a pollutant in the equilibrium gas (NOx: NO + NO2).
double wet_fraction_of(const core::EquilibriumResult& equilibrium, std::string_view pollutant);

}  // namespace stackbound::cases
