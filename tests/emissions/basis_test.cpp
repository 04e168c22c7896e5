#include "stackbound/emissions/basis.hpp"

#include <string>
#include <vector>

#include <gtest/gtest.h>

#include "stackbound/emissions/concentration.hpp"
#include "tests/support/tolerance.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::emissions {
namespace {

using stackbound::testing::is_close;
using Kind = DiluentReference::Kind;

// Wrong if the example basis of the issue did not parse into unit, moisture and O2 level.
TEST(Basis, ParsesMassUnitDryAndReferenceO2) {
  const Basis basis = parse_basis("mg/Nm3, dry, O2=3%", "--to");
  EXPECT_EQ(basis.unit.symbol, "mg/Nm3");
  EXPECT_TRUE(basis.unit.is_mass());
  EXPECT_EQ(basis.moisture, Moisture::dry);
  EXPECT_EQ(basis.reference.kind(), Kind::o2);
  EXPECT_TRUE(is_close(basis.reference.dry_fraction(), 0.03, stackbound::testing::kExact));
  // Nm3 without named conditions is 0 degC, 101.325 kPa.
  EXPECT_EQ(basis.unit.normal, &units::normal_0C());
}

// Wrong if "ppmvd" did not imply the dry basis, or the reference defaulted to something else than as measured.
TEST(Basis, PpmvdImpliesDryAndAsMeasured) {
  const Basis basis = parse_basis("ppmvd", "--from");
  EXPECT_EQ(basis.moisture, Moisture::dry);
  EXPECT_EQ(basis.reference.kind(), Kind::as_measured);
  EXPECT_FALSE(basis.unit.is_mass());
  EXPECT_TRUE(is_close(basis.unit.factor, 1e-6, stackbound::testing::kExact));
}

// Wrong if keywords were case-sensitive or blanks around '=' and '%' were refused.
TEST(Basis, AcceptsBlanksAndKeywordCase) {
  const Basis basis = parse_basis("ppmv , DRY , co2 = 12 % , As NO2", "--from");
  EXPECT_EQ(basis.reference.kind(), Kind::co2);
  EXPECT_TRUE(is_close(basis.reference.dry_fraction(), 0.12, stackbound::testing::kExact));
  EXPECT_TRUE(basis.as_no2);
}

// Wrong if the micro sign or superscript three were not read as "u" and "3".
TEST(Basis, NormalisesMicroSignAndSuperscriptThree) {
  const Basis basis = parse_basis("\xC2\xB5g/Nm\xC2\xB3, wet", "--from");
  EXPECT_EQ(basis.unit.symbol, "ug/Nm3");
  EXPECT_TRUE(is_close(basis.unit.factor, 1e-9, stackbound::testing::kExact));
}

// Wrong if mg/m3 took default conditions silently, or normal= were ignored.
TEST(Basis, MassPerCubicMetreTakesNamedNormalConditions) {
  EXPECT_EQ(parse_basis("mg/m3, dry, normal=20C", "b").unit.normal, &units::normal_20C());
  EXPECT_EQ(parse_basis("mg/m3, dry", "b", &units::normal_15C()).unit.normal, &units::normal_15C());
  EXPECT_EQ(parse_basis("mg/Nm3, dry", "b", &units::normal_eu_ied()).unit.normal, &units::normal_eu_ied());
}

// Wrong if US EPA units did not carry 20 degC (40 CFR 60.2) or dscf did not imply dry.
TEST(Basis, EpaUnitsCarryTwentyCelsiusAndDry) {
  const Basis basis = parse_basis("gr/dscf", "b");
  EXPECT_EQ(basis.unit.normal, &units::normal_20C());
  EXPECT_EQ(basis.moisture, Moisture::dry);
  EXPECT_EQ(parse_basis("mg/Sm3, wet", "b").unit.normal, &units::normal_15C());
}

// Wrong if our mass units disagreed with the units layer's parser for the same text.
TEST(Basis, MassUnitsAgreeWithTheUnitsLayer) {
  for (const char* symbol : {"mg/Nm3", "ug/Nm3", "g/Nm3", "mg/Sm3", "mg/dscm", "gr/dscf", "lb/dscf"}) {
    SCOPED_TRACE(symbol);
    const auto unit = find_concentration_unit(symbol);
    ASSERT_TRUE(unit.has_value());
    const ConcentrationUnit resolved = mass_unit(symbol, unit->normal != nullptr ? *unit->normal : units::normal_0C());
    const double si = units::parse_quantity(std::string("1 ") + symbol, "x", {units::Dimension::mass_per_amount}).value_si;
    EXPECT_TRUE(is_close(resolved.kg_per_mol_per_unit(), si, 1e-14));
  }
}

// Wrong if the canonical text did not parse back to the same basis.
TEST(Basis, CanonicalTextParsesBackToTheSameBasis) {
  const std::vector<std::string> texts = {"ppmv, wet",         "ppbvd, O2=15%",          "%, dry, CO2=12%",
                                          "mg/Nm3, dry, O2=3%", "mg/m3, dry, normal=60F", "gr/dscf, O2=7%",
                                          "mg/Nm3, dry, O2=3%, as NO2, normal=IED", "lb/scf, wet"};
  for (const std::string& text : texts) {
    SCOPED_TRACE(text);
    const Basis basis = parse_basis(text, "b");
    const Basis again = parse_basis(basis.text(), "b");
    EXPECT_TRUE(basis.same_as(again)) << basis.text() << " vs " << again.text();
    EXPECT_EQ(basis.text(), again.text());
  }
}

// Wrong if an O2 preset key were not resolved to the Annex V value, or its origin were lost.
TEST(Basis, O2PresetKeyResolvesToItsLevel) {
  const Basis basis = parse_basis("mg/Nm3, dry, O2=ied-gas-turbine", "b");
  EXPECT_TRUE(is_close(basis.reference.dry_fraction(), 0.15, stackbound::testing::kExact));
  ASSERT_NE(basis.reference.preset(), nullptr);
  EXPECT_EQ(basis.reference.preset()->key, "ied-gas-turbine");
}

// Wrong if a target basis did not take its missing items from the source (docs/bases.md).
TEST(Basis, TargetInheritsMissingItemsFromTheSource) {
  const Basis from = parse_basis("ppmv, dry, O2=7.2%", "--from");
  const Basis to = complete_basis_from(parse_partial_basis("mg/Nm3", "--to"), from, "--to");
  EXPECT_EQ(to.unit.symbol, "mg/Nm3");
  EXPECT_EQ(to.moisture, Moisture::dry);
  EXPECT_TRUE(to.reference.same_as(from.reference));
  // The unit's implied wet/dry wins over the inherited one.
  const Basis wet = parse_basis("ppmv, wet", "--from");
  EXPECT_EQ(complete_basis_from(parse_partial_basis("gr/dscf", "--to"), wet, "--to").moisture, Moisture::dry);
  // Normal conditions carry over with an inherited unit only.
  const Basis at20 = parse_basis("mg/m3, dry, normal=20C", "--from");
  EXPECT_EQ(complete_basis_from(parse_partial_basis("O2=3%", "--to"), at20, "--to").unit.normal, &units::normal_20C());
}

// Wrong if the number's unit and --from were not combined, or a contradiction between them passed.
TEST(Basis, MergesTheValueUnitWithTheFromText) {
  const PartialBasis merged = merge_partial_bases(parse_partial_basis("ppmvd", "VALUE"), "VALUE",
                                                  parse_partial_basis("ppmv, O2=7.2%", "--from"), "--from");
  const Basis basis = complete_basis(merged, "--from");
  EXPECT_EQ(basis.moisture, Moisture::dry);
  EXPECT_EQ(basis.reference.kind(), Kind::o2);
  EXPECT_THROW_WITH((void)merge_partial_bases(parse_partial_basis("mg/Nm3", "VALUE"), "VALUE",
                                              parse_partial_basis("ppmv", "--from"), "--from"),
                    units::InputError, "unit: VALUE \"mg/Nm3\" and --from \"ppmv\" disagree");
  EXPECT_THROW_WITH((void)merge_partial_bases(parse_partial_basis("ppmvd", "VALUE"), "VALUE",
                                              parse_partial_basis("ppmvw", "--from"), "--from"),
                    units::InputError, "wet/dry: VALUE \"dry\" and --from \"wet\" disagree");
  // A unit's implied wet/dry against an explicit item is caught when the basis is completed.
  const PartialBasis mixed = merge_partial_bases(parse_partial_basis("ppmvd", "VALUE"), "VALUE",
                                                 parse_partial_basis("wet", "--from"), "--from");
  EXPECT_THROW_WITH((void)complete_basis(mixed, "--from"), units::InputError, "ppmvd is a dry unit; it cannot be wet");
}

// At least 20 malformed basis strings and impossible combinations, each refused with its own message.
// Wrong if any of them parsed, or the message did not say what is wrong.
TEST(Basis, MalformedTextIsRefusedWithItsMessage) {
  struct Case {
    const char* text;
    const char* fragment;
  };
  const std::vector<Case> cases = {
      {"", "no unit; give one"},
      {"ppmv", "wet or dry is not stated"},
      {"ppmv, dry, dry", "wet/dry is given twice"},
      {"ppmv, wet, dry", "both wet and dry are given"},
      {"ppmvd, wet", "ppmvd is a dry unit; it cannot be wet"},
      {"gr/dscf, wet", "gr/dscf is a dry unit; it cannot be wet"},
      {"ppmv, dry, O2=3", "O2 level \"3\" needs a % sign"},
      {"ppmv, dry, O2=-1%", "an O2 level must be >= 0 %"},
      {"ppmv, dry, O2=21%", "must be below the O2 content of air"},
      {"ppmv, dry, O2=", "O2= needs a level"},
      {"ppmv, dry, O2=3%%", "write the level in % by volume"},
      {"ppmv, dry, CO2=0%", "a CO2 level must be above 0 % and at most 100 %"},
      {"ppmv, dry, CO2=120%", "a CO2 level must be above 0 % and at most 100 %"},
      {"ppmv, dry, O2=3%, CO2=12%", "a basis has one diluent level"},
      {"ppmv, dry, O2=7.2%, as measured", "\"as measured\" contradicts O2=7.2%"},
      {"ppmv, wet, O2=3%", "defined on the dry basis; write \"dry, O2=3%\""},
      {"mg/m3, dry", "mg/m3 is a volume at unstated conditions"},
      {"mg/dscm, normal=0C", "mg/dscm is defined at 20C"},
      {"mg/Nm3, dry, normal=25C", "unknown normal conditions"},
      {"mg/Nm3, dry, normal=0C, normal=20C", "normal= is given twice"},
      {"ppmv, dry, normal=0C", "normal=0C does not apply to ppmv"},
      {"mg/Nm3, dyr", "did you mean \"dry\"?"},
      {"ppm dry", "items are separated by commas"},
      {"ppmv,, dry", "empty item between commas"},
      {"ppmv, mg/Nm3, dry", "two units: \"ppmv\" and \"mg/Nm3\""},
      {"lb/MMBtu, dry", "is an emission rate, not a concentration basis"},
      {"ppmv, dry, O2=ied-gas-turbin", "unknown reference-O2 preset (did you mean \"ied-gas-turbine\"?)"},
      {"ppmv, dry, as NO2, as NO2", "\"as NO2\" is given twice"},
      {"mg/Nm3, dry, moisture=3%", "unknown item \"moisture=3%\""},
      {"mg/Mm3, dry", "unknown item \"mg/Mm3\""},
  };
  ASSERT_GE(cases.size(), 20U);
  for (const Case& c : cases) {
    SCOPED_TRACE(c.text);
    EXPECT_THROW_WITH((void)parse_basis(c.text, "--to"), units::InputError, c.fragment);
    // Every message names the field and quotes the text.
    EXPECT_THROW_WITH((void)parse_basis(c.text, "--to"), units::InputError, "--to");
  }
}

// Wrong if make_basis let a programmatic basis break the rules that the parser enforces.
TEST(Basis, MakeBasisChecksTheSameRules) {
  EXPECT_THROW_WITH((void)make_basis(mole_unit("ppmv"), Moisture::wet, DiluentReference::o2(0.03)), units::InputError,
                    "defined on the dry basis");
  EXPECT_THROW_WITH((void)make_basis(mole_unit("ppmv"), Moisture::dry, DiluentReference::o2(0.25)), units::InputError,
                    "an O2 level must be >= 0 %");
  EXPECT_THROW_WITH((void)mass_unit("mg/dscm", units::normal_0C()), units::InputError, "mg/dscm is defined at 20C");
  EXPECT_THROW_WITH((void)mole_unit("mg/Nm3"), units::InputError, "not a mole-fraction unit");
  EXPECT_THROW_WITH((void)mass_unit("ppmv", units::normal_0C()), units::InputError, "not a mass-per-normal-volume unit");
}

// Wrong if the forms permits write ("25 ppmvd @ 3% O2", "at 15 % O2", "@ 15% O2 dry") were refused,
// or read as another basis than the comma-separated one they mean.
TEST(Basis, ReadsTheFormsPermitsWrite) {
  const struct {
    const char* written;
    const char* canonical;
  } forms[] = {
      {"ppmvd @ 3% O2", "ppmvd, O2=3%"},
      {"ppmvd at 15 % O2", "ppmvd, O2=15%"},
      {"mg/Nm3 @ 15% O2 dry", "mg/Nm3, dry, O2=15%"},
      {"mg/Nm3 dry @ 6 % O2", "mg/Nm3, dry, O2=6%"},
      {"ppmv, dry @ 7% O2", "ppmv, dry, O2=7%"},
      {"ppmvd @ 12% CO2", "ppmvd, CO2=12%"},
  };
  for (const auto& form : forms) {
    EXPECT_TRUE(parse_basis(form.written, "limit").same_as(parse_basis(form.canonical, "limit"))) << form.written;
  }
  // Text without the form keeps its own errors.
  EXPECT_THROW_WITH((void)parse_basis("ppmvd O2 3", "limit"), units::InputError,
                    "limit = \"ppmvd O2 3\": unknown item \"ppmvd O2 3\": items are separated by commas");
}

// Wrong if a decimal comma ("12,5 ppm") were read as 12 with an empty item, or the message did not
// say what to write.
TEST(Basis, ADecimalCommaSaysToWriteADecimalPoint) {
  EXPECT_THROW_WITH((void)split_stated_value("12,5 ppm, dry", "limit"), units::InputError,
                    "limit = \"12,5 ppm, dry\": a decimal comma; write a decimal point (\"12.5 ppm, dry\"); commas "
                    "separate items");
}

}  // namespace
}  // namespace stackbound::emissions
