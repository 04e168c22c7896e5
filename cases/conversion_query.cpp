#include "stackbound/cases/conversion_query.hpp"

#include <optional>

#include <fmt/format.h>

#include "stackbound/emissions/basis.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/normal_conditions.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::cases {

namespace {

namespace em = stackbound::emissions;

std::optional<double> optional_fraction(const std::string& text, std::string_view option) {
  if (text.empty()) return std::nullopt;
  return units::parse_fraction(text, option);
}

std::string context_hint(em::ContextPiece piece) {
  switch (piece) {
    case em::ContextPiece::moisture:
      return "give it with --moisture (H2O fraction of the wet gas, e.g. --moisture 12%)";
    case em::ContextPiece::measured_o2:
      return "give it with --o2 (dry, e.g. --o2 7.2%) or state the O2 level in --from";
    case em::ContextPiece::measured_co2:
      return "give it with --co2 (dry, e.g. --co2 9.5%) or state the CO2 level in --from";
    case em::ContextPiece::molar_mass:
      return "give it with --molar-mass (e.g. --molar-mass \"200.59 g/mol\")";
  }
  return "";
}

em::Pollutant pollutant_from(const ConversionQuery& query) {
  std::optional<double> molar_mass;
  if (!query.molar_mass.empty()) {
    const units::ParsedQuantity parsed =
        units::parse_quantity(query.molar_mass, "--molar-mass", {units::Dimension::mass_per_amount});
    const std::string_view symbol = parsed.unit->symbol;
    if (symbol != "g/mol" && symbol != "kg/kmol" && symbol != "kg/mol") {
      throw units::InputError(
          fmt::format("--molar-mass = \"{}\": a molar mass is needed; accepted units: g/mol, kg/kmol, "
                      "kg/mol",
                      query.molar_mass));
    }
    molar_mass = parsed.value_si;
  }
  return em::resolve_pollutant(query.pollutant, molar_mass, "POLLUTANT");
}

std::vector<em::Caution> cautions_for(const em::Basis& from, const em::Basis& to,
                                      const std::vector<em::AppliedFactor>& factors) {
  std::vector<em::Caution> cautions;
  if (from.reference.preset() != nullptr || to.reference.preset() != nullptr)
    cautions.push_back(em::Caution::confirm_presets);
  for (const em::AppliedFactor& factor : factors) {
    if (factor.name == "O2 correction factor") {
      cautions.push_back(em::Caution::o2_correction_validity);
      break;
    }
  }
  cautions.push_back(em::Caution::ideal_gas);
  cautions.push_back(em::Caution::authorities_govern);
  return cautions;
}

std::vector<const em::ReferenceO2Preset*> presets_of(const em::Basis& from, const em::Basis& to) {
  std::vector<const em::ReferenceO2Preset*> presets;
  if (from.reference.preset() != nullptr) presets.push_back(from.reference.preset());
  if (to.reference.preset() != nullptr && to.reference.preset() != from.reference.preset()) {
    presets.push_back(to.reference.preset());
  }
  return presets;
}

}  // namespace

ConversionAnswer convert_query(const ConversionQuery& query) {
  const auto [number, value_basis_text] = em::split_stated_value(query.value, "VALUE");
  const em::Pollutant pollutant = pollutant_from(query);
  const units::NormalConditions* default_normal =
      query.normal.empty() ? nullptr : &units::normal_conditions_by_key(query.normal, "--normal");

  const em::PartialBasis from_partial =
      em::merge_partial_bases(em::parse_partial_basis(value_basis_text, "VALUE"), "VALUE",
                              em::parse_partial_basis(query.from, "--from"), "--from");
  const em::Basis from = em::complete_basis(from_partial, "--from", default_normal);
  const em::Basis to = em::complete_basis_from(em::parse_partial_basis(query.to, "--to"), from, "--to", default_normal);
  const em::Concentration input(number, pollutant, from, "VALUE");

  em::ConcentrationContext context;
  context.moisture_fraction = optional_fraction(query.moisture, "--moisture");
  context.o2_dry_fraction = optional_fraction(query.o2, "--o2");
  context.co2_dry_fraction = optional_fraction(query.co2, "--co2");
  context.o2_basis =
      query.o2_basis.empty() ? em::O2Basis::us_epa_20_9 : em::parse_o2_basis(query.o2_basis, "--o2-basis");
  if (context.o2_dry_fraction)
    em::check_o2_level(*context.o2_dry_fraction, context.o2_basis, "--o2 (measured O2, dry)");
  if (context.co2_dry_fraction) em::check_co2_level(*context.co2_dry_fraction, "--co2 (measured CO2, dry)");
  if (context.moisture_fraction && (*context.moisture_fraction < 0.0 || *context.moisture_fraction >= 1.0)) {
    throw units::InputError(fmt::format(
        "--moisture = \"{}\": the H2O fraction of the wet gas must be >= 0 % and below 100 %", query.moisture));
  }

  em::Conversion conversion = [&] {
    try {
      return input.convert(to, context);
    } catch (const em::MissingContextError& missing) {
      throw units::InputError(fmt::format("{}; {}", missing.what(), context_hint(missing.piece())));
    }
  }();
  const em::Concentration& result = conversion.result;
  const std::vector<em::Caution> cautions = cautions_for(input.basis(), result.basis(), conversion.factors);
  const std::vector<const em::ReferenceO2Preset*> presets = presets_of(input.basis(), result.basis());
  return {pollutant, input, conversion, context, cautions, presets};
}

}  // namespace stackbound::cases
