#include "stackbound/core/fuel_nitrogen.hpp"

#include <fmt/format.h>

#include <cmath>
#include <utility>

#include "stackbound/core/elements.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::core {

namespace {

double atomic_weight_kg_per_mol(std::string_view symbol) {
  return element_by_symbol(symbol).atomic_weight_g_per_mol * 1e-3;
}

}  // namespace

std::string_view to_string(FuelNitrogenClass fuel_class) {
  switch (fuel_class) {
    case FuelNitrogenClass::oil:
      return "oil";
    case FuelNitrogenClass::pulverized_coal:
      return "pulverized_coal";
  }
  return "oil";
}

ConversionBand typical_conversion_band(FuelNitrogenClass fuel_class) {
  switch (fuel_class) {
    case FuelNitrogenClass::pulverized_coal:
      // Typical band 15-35 %: common practice / from memory. The share of fuel NO in the total (over
      // 75 %) and its fall with rising coal N: "Pollutant control through staged combustion of
      // pulverized coal", Phase I report FE-1817-2, University of Arizona, 1976 (OSTI 7146846),
      // abstract - stored copy.
      return {0.15, 0.35, "typical",
              "typical band for pulverized coal, common practice / from memory; fuel NO over 75 % of total NO and "
              "falling conversion with coal N per report FE-1817-2 (Univ. of Arizona, 1976), abstract"};
    case FuelNitrogenClass::oil:
      break;
  }
  // Typical band 20-90 %, falling as the fuel N rises: common practice / from memory. Consistent with
  // H. R. Hazard, "Conversion of fuel nitrogen to NOx in a compact combustor", J. Eng. Power 96(3)
  // (1974) 185-188, abstract - stored copy: about 90 % at very low fuel N, about 55 % at higher N.
  return {0.20, 0.90, "typical",
          "typical band for fuel oils (falling with N content), common practice / from memory; consistent with "
          "Hazard, J. Eng. Power 96(3) (1974) 185-188, abstract: about 90 % at very low N, about 55 % at higher N"};
}

std::optional<FuelNitrogenClass> fuel_nitrogen_class_of_preset(std::string_view preset_key) {
  if (preset_key == "distillate_oil_no2" || preset_key == "residual_oil_no6") return FuelNitrogenClass::oil;
  if (preset_key == "bituminous_coal") return FuelNitrogenClass::pulverized_coal;
  return std::nullopt;
}

double fuel_bound_nitrogen_mol_per_kg(const Fuel& fuel) {
  double nitrogen = fuel.element_mol_per_kg()[element_index("N")];
  for (const auto& [formula, mol_per_kg] : fuel.gas_mol_per_kg()) {
    if (formula == "N2") nitrogen -= 2.0 * mol_per_kg;
  }
  // Rounding of the subtraction must not leave a negative trace.
  return nitrogen > 0.0 ? nitrogen : 0.0;
}

double nitric_oxide_molar_mass_kg_per_mol() { return atomic_weight_kg_per_mol("N") + atomic_weight_kg_per_mol("O"); }

double nitrogen_dioxide_molar_mass_kg_per_mol() {
  return atomic_weight_kg_per_mol("N") + 2.0 * atomic_weight_kg_per_mol("O");
}

FuelNitrogenNo fuel_nitrogen_no(const Fuel& fuel, double conversion_fraction, std::string conversion_source,
                                std::string_view field) {
  if (!(std::isfinite(conversion_fraction) && conversion_fraction >= 0.0 && conversion_fraction <= 1.0)) {
    throw units::InputError(
        fmt::format("{} = {:g}: must be a fraction between 0 and 1 (0-100 %); fuel nitrogen cannot convert to more NO "
                    "than it holds",
                    field, conversion_fraction));
  }
  FuelNitrogenNo result;
  result.fuel_nitrogen_mol_per_kg = fuel_bound_nitrogen_mol_per_kg(fuel);
  result.conversion_fraction = conversion_fraction;
  result.conversion_source = std::move(conversion_source);
  // One NO per N atom.
  result.no_ceiling_mol_per_kg = result.fuel_nitrogen_mol_per_kg;
  result.no_estimate_mol_per_kg = conversion_fraction * result.fuel_nitrogen_mol_per_kg;
  return result;
}

FuelNitrogenNoBand fuel_nitrogen_no_band(const Fuel& fuel, FuelNitrogenClass fuel_class) {
  const ConversionBand band = typical_conversion_band(fuel_class);
  const std::string source(band.source);
  return {band, fuel_nitrogen_no(fuel, band.low_fraction, source), fuel_nitrogen_no(fuel, band.high_fraction, source)};
}

double fuel_no_mole_fraction(double no_mol_per_kg, const FlueGas& flue, GasBasis basis) {
  if (!(std::isfinite(no_mol_per_kg) && no_mol_per_kg >= 0.0)) {
    throw units::InputError(fmt::format("fuel NO = {:g} mol/kg: must be finite and >= 0 mol/kg", no_mol_per_kg));
  }
  const double total_mol_per_kg = flue.total_mol_per_kg(basis);
  if (!(total_mol_per_kg > 0.0)) {
    throw units::InputError(
        fmt::format("flue gas ({} basis): holds no gas to express the fuel NO in", to_string(basis)));
  }
  return no_mol_per_kg / total_mol_per_kg;
}

}  // namespace stackbound::core
