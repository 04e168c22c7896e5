#include "stackbound/core/species.hpp"

#include <gtest/gtest.h>

#include "stackbound/cases/species_file.hpp"
#include "tests/support/tolerance.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::core {
namespace {

using stackbound::testing::is_close;
const SpeciesDatabase& db() { return cases::builtin_species(); }

// Wrong if a record were lost or renamed when the data file was written.
TEST(SpeciesData, HoldsEveryPublishedRecordByFormula) {
  for (const char* formula : {"CO2", "CO", "O2", "O", "H2O", "H2", "H", "OH", "HO2", "H2O2", "N2", "N", "NO", "NO2",
                              "N2O", "NH3", "HCN", "Ar", "He", "CH4", "C2H6", "C3H8", "n-C4H10", "i-C4H10", "n-C5H12", "i-C5H12", "n-C6H14", "C2H4",
                              "C2H2", "C3H6", "CH3OH", "CH2O", "SO2", "SO3", "SO", "H2S", "COS", "S", "HS", "C(gr)"}) {
    EXPECT_NE(db().find(formula), nullptr) << formula;
  }
  EXPECT_EQ(db().size(), 40u);
}

// Wrong if names were matched case-insensitively (AR vs Ar) or typos were accepted.
TEST(SpeciesData, NamesAreCaseSensitiveAndTyposGetASuggestion) {
  EXPECT_EQ(db().find("AR"), nullptr);
  EXPECT_THROW_WITH((void)db().at("co2", "--feed"), units::InputError,
                    "--feed = \"co2\": unknown species; did you mean \"CO2\"?");
}

// Wrong if evaluation silently extrapolated beyond the fitted range.
TEST(Species, EvaluationOutsideTheRangeIsAnErrorNamingTheRange) {
  EXPECT_THROW_WITH((void)db().at("CO2").cp_over_R(units::kelvin(4000.0)), units::InputError,
                    "species CO2: temperature 4000 K is outside its data range 200-3500 K");
  EXPECT_THROW_WITH((void)db().at("NO").h_over_RT(units::kelvin(150.0)), units::InputError,
                    "outside its data range 200-6000 K");
}

// Wrong if SO2-type records (fitted from 300 K) could not be used for ambient feeds at 298.15 K,
// or if that allowance leaked to other temperatures below 300 K.
TEST(Species, ThreeHundredKelvinRecordsAreEvaluableAtStandardTemperatureOnly) {
  const Species& so2 = db().at("SO2");
  EXPECT_NO_THROW((void)so2.h_over_RT(units::kelvin(units::kReferenceTemperature_K)));
  EXPECT_THROW((void)so2.h_over_RT(units::kelvin(299.0)), units::InputError);
  EXPECT_THROW((void)so2.h_over_RT(units::kelvin(250.0)), units::InputError);
}

// Wrong if the two polynomial intervals were swapped or miscoded: both sides of T_mid must agree.
TEST(Species, PolynomialsAreContinuousAtTheMidpoint) {
  for (const Species& species : db().all()) {
    const double mid = species.range().mid.value();
    EXPECT_TRUE(is_close(species.cp_over_R_unchecked(mid - 1e-9), species.cp_over_R_unchecked(mid + 1e-9), 2e-3, 2e-3))
        << species.formula();
    EXPECT_TRUE(is_close(species.h_over_RT_unchecked(mid - 1e-9), species.h_over_RT_unchecked(mid + 1e-9), 1e-3, 2e-3))
        << species.formula();
  }
}

// Wrong if molar masses did not use the IUPAC conventional atomic weights.
TEST(Species, MolarMassFromConventionalAtomicWeights) {
  // Source: IUPAC CIAAW 2021 conventional atomic weights C 12.011, O 15.999, N 14.007, S 32.06.
  EXPECT_TRUE(is_close(db().at("CO2").molar_mass_kg_per_mol() * 1e3, 44.009, 1e-12));
  EXPECT_TRUE(is_close(db().at("NO2").molar_mass_kg_per_mol() * 1e3, 46.005, 1e-12));
  EXPECT_TRUE(is_close(db().at("SO2").molar_mass_kg_per_mol() * 1e3, 64.058, 1e-12));
}

}  // namespace
}  // namespace stackbound::core
