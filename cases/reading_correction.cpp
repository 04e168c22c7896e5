#include "stackbound/cases/reading_correction.hpp"

#include <cmath>
#include <limits>

#include "stackbound/core/oxidant.hpp"
#include "stackbound/emissions/concentration.hpp"
#include "stackbound/emissions/fo_factor.hpp"
#include "stackbound/emissions/gas_turbine_iso.hpp"
#include "stackbound/emissions/reference_correction.hpp"

namespace stackbound::cases {

namespace {

namespace em = stackbound::emissions;
constexpr double kNaN = std::numeric_limits<double>::quiet_NaN();
constexpr double kSecondsPerHour = 3600.0;

double value_of(const RawReading& reading, ReadingSlot slot) { return reading.values[static_cast<std::size_t>(slot)]; }

}  // namespace

ReadingCorrector::ReadingCorrector(const CaseDefinition& definition, const ReadingsSpec& spec,
                                   double reference_o2_dry_fraction)
    : spec_(spec),
      o2_basis_(definition.report.o2_basis),
      reference_o2_(reference_o2_dry_fraction),
      at_15_o2_(em::make_basis(em::mole_unit("ppmv"), em::Moisture::dry, em::DiluentReference::o2(0.15))) {
  const units::NormalConditions& normal = *definition.report.normal;
  const em::DiluentReference reference = em::DiluentReference::o2(reference_o2_dry_fraction);
  targets_ = {em::make_basis(em::mole_unit("ppmv"), em::Moisture::dry, em::DiluentReference::as_measured()),
              em::make_basis(em::mole_unit("ppmv"), em::Moisture::dry, reference),
              em::make_basis(em::mass_unit("mg/Nm3", normal), em::Moisture::dry, reference)};
  kg_per_mol_per_mg_ = targets_[2].unit.kg_per_mol_per_unit();
  for (std::size_t i = 0; i < spec.pollutants.size(); ++i) {
    const em::Pollutant& pollutant = spec.pollutants[i].pollutant;
    molar_masses_.push_back(em::basis_molar_mass_kg_per_mol(pollutant, pollutant.expressed_as_no2, "to give mg/Nm3"));
    if (pollutant.name == "NOx") nox_index_ = i;
  }
  gas_turbine_iso_ = definition.plant_type.find("gas-turbine") != std::string::npos && nox_index_ &&
                     spec.source(ReadingSlot::ambient_temperature).has_value();
}

double ReadingCorrector::iso_factor(const RawReading& reading) const {
  const double t_K = value_of(reading, ReadingSlot::ambient_temperature);
  const double p_Pa = spec_.source(ReadingSlot::ambient_pressure) ? value_of(reading, ReadingSlot::ambient_pressure) : 101325.0;
  em::GasTurbineAmbient ambient{units::kelvin(t_K), em::kIsoHumidityRatio, std::nullopt, std::nullopt};
  if (spec_.source(ReadingSlot::ambient_humidity)) {
    const double rh = value_of(reading, ReadingSlot::ambient_humidity);
    ambient.humidity_ratio_kg_per_kg =
        core::Humidity::relative(rh, units::kelvin(t_K), units::pascals(p_Pa), "readings.ambient_humidity").humidity_ratio();
  }
  if (spec_.reference_inlet_pressure_Pa) {
    ambient.observed_inlet_pressure = units::pascals(value_of(reading, ReadingSlot::inlet_pressure));
    ambient.reference_inlet_pressure = units::pascals(*spec_.reference_inlet_pressure_Pa);
  }
  return em::gas_turbine_iso_factor(ambient);
}

CorrectedReading ReadingCorrector::correct(const RawReading& reading) const {
  CorrectedReading out;
  em::ConcentrationContext context;
  context.o2_basis = o2_basis_;
  context.record_factors = false;
  const bool has_moisture = spec_.source(ReadingSlot::moisture).has_value();
  const double h2o = has_moisture ? value_of(reading, ReadingSlot::moisture) : 0.0;
  if (has_moisture) context.moisture_fraction = h2o;
  out.o2_dry_fraction = kNaN;
  if (spec_.source(ReadingSlot::o2)) {
    const double o2 = value_of(reading, ReadingSlot::o2);
    out.o2_dry_fraction = spec_.o2_dry ? o2 : o2 / (1.0 - h2o);
    context.o2_dry_fraction = out.o2_dry_fraction;
  }
  if (spec_.source(ReadingSlot::co2)) {
    const double co2 = value_of(reading, ReadingSlot::co2);
    context.co2_dry_fraction = spec_.co2_dry ? co2 : co2 / (1.0 - h2o);
  }
  const bool has_flow = spec_.source(ReadingSlot::flow).has_value();
  double co_dry_fraction = 0.0;
  for (std::size_t i = 0; i < spec_.pollutants.size(); ++i) {
    const PollutantReading& mapped = spec_.pollutants[i];
    const em::Concentration measured(value_of(reading, mapped.slot), mapped.pollutant, mapped.basis, spec_.source(mapped.slot)->field);
    auto& figures = out.figures[i];
    figures.fill(kNaN);
    // Without a measured O2 a value stated at an O2 level has no "as measured" figures (ppmvd, mass rate).
    const bool as_measured_known =
        context.o2_dry_fraction || mapped.basis.reference.kind() == em::DiluentReference::Kind::as_measured;
    // One conversion by Concentration::to to ppmvd as measured; the rest by the same factors convert
    // applies: the O2 correction factor, the molar mass over the molar volume.
    double at_ref = kNaN;
    if (as_measured_known) {
      const double ppmvd = measured.to(targets_[0], context).value();
      figures[static_cast<std::size_t>(FigureKey::ppmvd)] = ppmvd;
      at_ref = ppmvd * em::o2_correction_factor(*context.o2_dry_fraction, reference_o2_, o2_basis_);
      if (has_flow) {
        const double dry_flow_mol_per_s = value_of(reading, ReadingSlot::flow) * (spec_.flow_dry ? 1.0 : 1.0 - h2o);
        figures[static_cast<std::size_t>(FigureKey::kg_per_h)] =
            ppmvd * 1e-6 * molar_masses_[i] * dry_flow_mol_per_s * kSecondsPerHour;
      }
    } else {
      at_ref = measured.to(targets_[1], context).value();
    }
    figures[static_cast<std::size_t>(FigureKey::ppmvd_at_ref_o2)] = at_ref;
    figures[static_cast<std::size_t>(FigureKey::mg_per_Nm3_at_ref_o2)] = at_ref * 1e-6 * molar_masses_[i] / kg_per_mol_per_mg_;
    if (gas_turbine_iso_ && nox_index_ == i) {
      figures[static_cast<std::size_t>(FigureKey::iso_corrected_ppmvd_at_15_o2)] =
          measured.to(at_15_o2_, context).value() * iso_factor(reading);
    }
    if (mapped.pollutant.name == "CO") co_dry_fraction = figures[0] * 1e-6;
  }
  if (context.o2_dry_fraction && context.co2_dry_fraction) {
    out.fo = em::fo_ratio(*context.o2_dry_fraction, *context.co2_dry_fraction, co_dry_fraction);
  }
  return out;
}

}  // namespace stackbound::cases
