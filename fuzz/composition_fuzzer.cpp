// The composition notation on any text: reactants ("CH4 + 2.4 O2 + 9.03 N2") and analyses
// ("CH4 95 %, C2H6 3 %"). Property: finite, positive amounts and finite, non-negative percentages of
// known species, or a units::InputError. Anything else is a defect.

#include <cmath>

#include "fuzz/fuzz_input.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/composition_notation.hpp"
#include "stackbound/units/input_error.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  namespace core = stackbound::core;
  using stackbound::fuzz::property_failed;
  const std::string_view text = stackbound::fuzz::as_text(data, size);
  const core::SpeciesDatabase& db = stackbound::cases::builtin_species();
  try {
    for (const core::SpeciesAmount& term : core::parse_reactants(text, "--feed", db)) {
      if (!std::isfinite(term.moles) || !(term.moles > 0.0)) property_failed("a reactant amount is not finite and > 0");
      (void)db.at(term.formula);
    }
  } catch (const stackbound::units::InputError&) {
  }
  for (const core::AnalysisVocabulary& vocabulary :
       {core::gas_analysis_vocabulary(db), core::ultimate_analysis_vocabulary()}) {
    try {
      for (const auto& [name, percent] : core::parse_analysis(text, "--gas", vocabulary)) {
        if (!std::isfinite(percent) || percent < 0.0) property_failed("a percentage is negative or not finite");
      }
    } catch (const stackbound::units::InputError&) {
    }
  }
  return 0;
}
