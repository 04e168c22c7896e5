// NO from fuel nitrogen (core/fuel_nitrogen.hpp): the 100 % ceiling against hand mass balances, the
// estimate from a conversion fraction, the typical bands and bad input. Fuels are the built-in
// presets (typical values) and an invented test gas.

#include "stackbound/core/fuel_nitrogen.hpp"

#include <gtest/gtest.h>

#include <cmath>
#include <string>
#include <vector>

#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/combustion.hpp"
#include "stackbound/core/fuel_presets.hpp"
#include "stackbound/core/oxidant.hpp"
#include "stackbound/units/input_error.hpp"
#include "tests/support/tolerance.hpp"

namespace stackbound::core {
namespace {

using stackbound::testing::is_close;
using stackbound::testing::kExact;

const SpeciesDatabase& db() { return cases::builtin_species(); }

// Atomic weights, g/mol. Source: IUPAC CIAAW 2021 conventional values (N 14.007, O 15.999).
constexpr double kN_g = 14.007;
constexpr double kO_g = 15.999;

// Wrong if the ceiling were not one NO per fuel N atom: residual oil No. 6 (preset) holds 0.3 % N as
// received, i.e. 3.0 g N per kg, 3.0 / 14.007 mol; as NO that is x 30.006 g/mol, as NO2 x 46.005.
TEST(FuelNitrogen, CeilingEqualsTheFuelNitrogenConvertedToNoByMassBalance) {
  const Fuel oil = preset_fuel("residual_oil_no6", db());
  const FuelNitrogenNo no = fuel_nitrogen_no(oil, 1.0, "ceiling");
  const double mol_N = 3.0 / kN_g;
  EXPECT_TRUE(is_close(no.fuel_nitrogen_mol_per_kg, mol_N, 1e-12));
  EXPECT_TRUE(is_close(no.no_ceiling_mol_per_kg, mol_N, 1e-12));
  EXPECT_TRUE(is_close(no.no_ceiling_kg_per_kg(), mol_N * (kN_g + kO_g) * 1e-3, 1e-12));
  EXPECT_TRUE(is_close(no.no_ceiling_as_no2_kg_per_kg(), mol_N * (kN_g + 2.0 * kO_g) * 1e-3, 1e-12));
  // Bituminous coal (preset): 1.5 % N dry with 8 % moisture as received -> 1.5 x 0.92 = 1.38 % as
  // received, 13.8 g N per kg.
  const FuelNitrogenNo coal = fuel_nitrogen_no(preset_fuel("bituminous_coal", db()), 1.0, "ceiling");
  EXPECT_TRUE(is_close(coal.no_ceiling_mol_per_kg, 13.8 / kN_g, 1e-12));
}

// Wrong if the N2 of a fuel gas were counted as fuel-bound nitrogen (it forms only thermal NO), or
// the N of a nitrogen compound in the gas were not. Invented gas: CH4 97, NH3 1, N2 2 mole %.
TEST(FuelNitrogen, CountsNitrogenCompoundsOfAFuelGasButNotItsN2) {
  GasFuelSpec spec;
  spec.composition_percent = {{"CH4", 97.0}, {"NH3", 1.0}, {"N2", 2.0}};
  const Fuel gas = Fuel::gas(spec, db());
  const double molar_mass_kg = 0.97 * db().at("CH4").molar_mass_kg_per_mol() +
                               0.01 * db().at("NH3").molar_mass_kg_per_mol() +
                               0.02 * db().at("N2").molar_mass_kg_per_mol();
  EXPECT_TRUE(is_close(fuel_bound_nitrogen_mol_per_kg(gas), 0.01 / molar_mass_kg, 1e-12));
  // Pipeline natural gas (preset) holds N2 only: no fuel-bound nitrogen.
  EXPECT_TRUE(is_close(fuel_bound_nitrogen_mol_per_kg(preset_fuel("natural_gas", db())), 0.0, 0.0, 1e-12));
}

// Wrong if the estimate were not the conversion fraction times the ceiling, or a fraction above
// 100 % (which would create nitrogen) or below 0 were accepted.
TEST(FuelNitrogen, EstimateIsTheFractionOfTheCeilingAndNeverAboveIt) {
  const Fuel oil = preset_fuel("distillate_oil_no2", db());
  const FuelNitrogenNo no = fuel_nitrogen_no(oil, 0.45, "assumed for this test");
  EXPECT_TRUE(is_close(no.no_estimate_mol_per_kg, 0.45 * no.no_ceiling_mol_per_kg, 1e-15));
  EXPECT_TRUE(is_close(no.no_ceiling_mol_per_kg, 0.5 / kN_g, 1e-12));  // 0.05 % N as received
  EXPECT_EQ(no.conversion_source, "assumed for this test");
  EXPECT_THROW_WITH((void)fuel_nitrogen_no(oil, 1.2, ""), units::InputError,
                    "fuel_nitrogen.conversion = 1.2: must be a fraction between 0 and 1 (0-100 %)");
  EXPECT_THROW_WITH((void)fuel_nitrogen_no(oil, -0.1, "", "case.fuel_n_conversion"), units::InputError,
                    "case.fuel_n_conversion = -0.1");
  EXPECT_THROW_WITH((void)fuel_nitrogen_no(oil, std::nan(""), ""), units::InputError, "fuel_nitrogen.conversion = nan");
}

// Wrong if a band left 0-100 %, lost its typical status or source, or differed from the figures
// carried in core/fuel_nitrogen.cpp (oils 20-90 %, pulverized coal 15-35 %; common practice / from memory).
TEST(FuelNitrogen, TypicalBandsAreWithinZeroToOneHundredPercentWithTheirSource) {
  const ConversionBand oil = typical_conversion_band(FuelNitrogenClass::oil);
  const ConversionBand coal = typical_conversion_band(FuelNitrogenClass::pulverized_coal);
  EXPECT_TRUE(is_close(oil.low_fraction, 0.20, kExact));
  EXPECT_TRUE(is_close(oil.high_fraction, 0.90, kExact));
  EXPECT_TRUE(is_close(coal.low_fraction, 0.15, kExact));
  EXPECT_TRUE(is_close(coal.high_fraction, 0.35, kExact));
  for (const ConversionBand& band : {oil, coal}) {
    EXPECT_GE(band.low_fraction, 0.0);
    EXPECT_LE(band.low_fraction, band.high_fraction);
    EXPECT_LE(band.high_fraction, 1.0);
    EXPECT_EQ(band.status, "typical");
    EXPECT_NE(band.source.find("from memory"), std::string_view::npos);
  }
  const FuelNitrogenNoBand range =
      fuel_nitrogen_no_band(preset_fuel("bituminous_coal", db()), FuelNitrogenClass::pulverized_coal);
  EXPECT_TRUE(is_close(range.low.no_estimate_mol_per_kg, 0.15 * range.low.no_ceiling_mol_per_kg, 1e-15));
  EXPECT_TRUE(is_close(range.high.no_estimate_mol_per_kg, 0.35 * range.high.no_ceiling_mol_per_kg, 1e-15));
  EXPECT_EQ(range.low.conversion_source, std::string(coal.source));
}

// Wrong if a preset named in the class mapping no longer existed (a renamed preset would silently
// lose its band), or a preset without a band in our sources were given one.
TEST(FuelNitrogen, PresetClassesNameExistingPresetsOnly) {
  std::vector<std::string> mapped;
  for (const FuelPreset& preset : fuel_presets()) {
    if (fuel_nitrogen_class_of_preset(preset.key)) mapped.emplace_back(preset.key);
  }
  EXPECT_EQ(mapped, (std::vector<std::string>{"distillate_oil_no2", "residual_oil_no6", "bituminous_coal"}));
  EXPECT_EQ(fuel_nitrogen_class_of_preset("residual_oil_no6"), FuelNitrogenClass::oil);
  EXPECT_EQ(fuel_nitrogen_class_of_preset("bituminous_coal"), FuelNitrogenClass::pulverized_coal);
  EXPECT_FALSE(fuel_nitrogen_class_of_preset("wood_chips"));
  EXPECT_FALSE(fuel_nitrogen_class_of_preset("no_such_fuel"));
}

// Wrong if the flue-gas mole fraction were taken on the wrong basis: the same NO is a larger share
// of the dry flue gas than of the wet one, by the ratio of their amounts.
TEST(FuelNitrogen, MoleFractionInTheFlueGasUsesTheNamedBasis) {
  const Fuel oil = preset_fuel("residual_oil_no6", db());
  const CombustionResult burnt = burn(oil, Oxidant{}, OperatingPoint::with_excess_air(0.15), db());
  const double no = fuel_nitrogen_no(oil, 0.5, "assumed").no_estimate_mol_per_kg;
  const double dry = fuel_no_mole_fraction(no, burnt.flue, GasBasis::dry);
  const double wet = fuel_no_mole_fraction(no, burnt.flue, GasBasis::wet);
  EXPECT_TRUE(is_close(dry / wet,
                       burnt.flue.total_mol_per_kg(GasBasis::wet) / burnt.flue.total_mol_per_kg(GasBasis::dry), 1e-12));
  EXPECT_GT(dry, wet);
  EXPECT_THROW_WITH((void)fuel_no_mole_fraction(-1.0, burnt.flue, GasBasis::dry), units::InputError,
                    "fuel NO = -1 mol/kg: must be finite and >= 0 mol/kg");
}

}  // namespace
}  // namespace stackbound::core
