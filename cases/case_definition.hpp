#pragma once
// A case as the case file states it, every value parsed and checked when the file is loaded
// (case_file.hpp): quantities in SI, choices as enums, measured values and stated limits as
// concentrations and rates on their stated bases, the plant type as its reference-O2 preset. Plain
// data: the run (pipeline.hpp) takes it as it is and never parses text; sweeps change fields of a copy.
// Field-by-field documentation: docs/case-file.md.

#include <memory>
#include <optional>
#include <string>
#include <variant>
#include <vector>

#include "stackbound/cases/readings_spec.hpp"
#include "stackbound/core/combustion.hpp"
#include "stackbound/core/fuel.hpp"
#include "stackbound/emissions/concentration.hpp"
#include "stackbound/emissions/emission_rate.hpp"
#include "stackbound/emissions/limit_screening.hpp"
#include "stackbound/emissions/pollutant.hpp"
#include "stackbound/emissions/reference_correction.hpp"
#include "stackbound/emissions/reference_o2_presets.hpp"
#include "stackbound/units/normal_conditions.hpp"
#include "stackbound/units/quantity_parser.hpp"
#include "stackbound/units/warning.hpp"

namespace stackbound::cases {

struct GasComponent {
  std::string formula;
  double percent = 0.0;
};

enum class FuelKind { preset, gas, ultimate, blend };

struct BlendComponent;  // a FuelSpec and its fraction, below

struct FuelSpec {
  FuelKind kind = FuelKind::preset;
  std::string name;                     // as stated; empty: the preset's name, "gas fuel", "fuel" or "fuel blend"
  std::string field = "fuel";           // path in the file ("fuel.blend[1]"), naming the fuel in errors
  std::string preset;                   // kind preset: a built-in fuel
  core::GasFuelSpec gas;                // kind gas: composition and basis (name and field filled in)
  core::CondensedFuelSpec condensed;    // kind ultimate: analysis, state, heating value (name and field filled in)
  // Kind blend: the components and the fraction each takes (by `blend_by`), fractions summing to 1.
  // A vector of a type completed below: std::vector allows that, std::pair does not.
  std::vector<BlendComponent> blend;
  core::BlendBasis blend_by = core::BlendBasis::mass;
};

struct BlendComponent {
  FuelSpec fuel;
  double fraction = 0.0;
};

struct FuelFeedSpec {
  FuelSpec fuel;
  units::ParsedQuantity feed_rate;             // mass flow, molar flow (normal volume) or power
  // The heating value a heat-input feed_rate is on (fuel.heating_value_basis; HHV by default).
  core::HeatInputBasis heat_input_basis = core::HeatInputBasis::hhv;
  double temperature_K = 298.15;
  // Fraction of the fuel-bound nitrogen leaving as NO (core/fuel_nitrogen.hpp), 0 ... 1; nullopt: the
  // typical band of the fuel's class (post-flame stage).
  std::optional<double> nitrogen_conversion;
};

struct AirSpec {
  double temperature_K = 298.15;               // air (preheat) temperature at the burner
  std::optional<double> relative_humidity;     // fraction, at ambient temperature and pressure
  double ambient_temperature_K = 288.15;
  double ambient_pressure_Pa = 101325.0;
  std::optional<double> humidity_ratio_kg_per_kg;  // absolute humidity, kg water / kg dry air
  std::optional<double> o2_fraction;           // enriched oxidant: O2 mole fraction of the dry oxidant
};

enum class OperatingMode { excess_air, lambda, equivalence_ratio, flue_o2 };

struct OperatingSpec {
  OperatingMode mode = OperatingMode::excess_air;
  double value = 0.0;                          // excess-air fraction, lambda, phi or O2 fraction
  bool flue_o2_dry = true;
};

// The key of the operating point's value in the file ("operating_point.excess_air" ...).
std::string_view operating_field(OperatingMode mode);

// A primary zone (core/primary_zone.hpp): the fuel burns first with part of the oxidant, given by the
// zone's equivalence ratio or by the share of the oxidant entering it; the rest mixes in afterwards.
struct PrimaryZoneCaseSpec {
  std::optional<double> equivalence_ratio;     // exactly one of the two is stated
  std::optional<double> air_share;             // fraction of the oxidant, (0, 1]
  double residence_time_s = 0.0;               // required
  double heat_loss_fraction = 0.0;             // of the heat input, lost in the zone; default 0 (adiabatic)
  bool heat_loss_stated = false;
};

struct FiringSpec {
  bool adiabatic = false;
  double temperature_K = 0.0;                  // when not adiabatic
  double heat_loss_fraction = 0.0;             // when adiabatic: fraction of the heat input lost
  double pressure_Pa = 101325.0;
  std::vector<std::string> species;            // product candidates; empty = all that fit
  // Time at the firing temperature (the post-flame hold), s. Default 20 ms, an assumption the report
  // states (kDefaultResidenceTime_s).
  double residence_time_s = 0.020;
  bool residence_time_stated = false;
  std::optional<PrimaryZoneCaseSpec> primary_zone;  // requires adiabatic
};

// The post-flame path after the hold: linear cooling to `cooling_to` over `cooling_time`
// (core/post_flame.hpp). Unstated values are defaults the report states as assumptions.
struct PostFlameSpec {
  std::optional<double> cooling_to_K;          // nullopt: the stack temperature (stated or its default)
  double cooling_time_s = 1.0;
  bool cooling_time_stated = false;
};

// A measured concentration as stated ("3.2 %, dry", "18 ppm, dry"), on its stated basis.
struct MeasuredValue {
  emissions::Concentration value;
  std::string text;                            // as written, for the report
};

struct MeasuredFraction {
  double fraction = 0.0;                       // moisture: H2O mole fraction of the wet gas
  std::string text;
};

struct MeasuredSpec {
  std::optional<MeasuredValue> o2;
  std::optional<MeasuredValue> co;
  std::optional<MeasuredValue> no;
  std::optional<MeasuredValue> nox;
  std::optional<MeasuredFraction> moisture;
};

struct StackSpec {
  double temperature_K = 423.15;
  bool temperature_stated = false;             // false: the default above (150 degC)
  double pressure_Pa = 101325.0;
  MeasuredSpec measured;
};

// A stated limit: a concentration on its basis ("100 mg/Nm3, dry, O2=3%") or a rate ("5 kg/h",
// "0.1 lb/MMBtu"; never per useful output, which needs an efficiency a case does not state).
struct LimitSpec {
  std::string pollutant;                       // one of report.pollutants
  std::string text;                            // as written, for the report
  std::variant<emissions::Concentration, emissions::RateLimit> limit;
};

// Which F-factors the rates per heat input (Method 19) use: the fuel's own, computed from its
// composition (default); the published defaults of Method 19 Table 19-2 (emissions/published_f_factors.hpp)
// for the fuel preset's type or a named table entry; or the case's own.
enum class FFactorChoice { computed, published, stated };

struct FFactorSpec {
  FFactorChoice choice = FFactorChoice::computed;
  std::string table_key;                        // published: the entry; empty: the fuel preset's
  std::optional<emissions::FFactor> fd, fw, fc;  // stated (Fd required); unstated ones stay computed
};

struct ReportSpec {
  std::optional<double> reference_o2_fraction;  // nullopt: the plant type's preset
  emissions::O2Basis o2_basis = emissions::O2Basis::us_epa_20_9;  // 20.9 % (US EPA) or 21 % (EU)
  const units::NormalConditions* normal = &units::normal_0C();    // of mg/Nm3 figures and normal volumes
  // Owns `normal` when the case states its temperature and pressure ("25 degC, 101.325 kPa"); shared,
  // so copies of the definition (sweep points) keep it.
  std::shared_ptr<const units::StatedNormalConditions> stated_normal;
  std::vector<emissions::Pollutant> pollutants{emissions::pollutant_by_name("CO", "report.pollutants"),
                                               emissions::pollutant_by_name("NO", "report.pollutants"),
                                               emissions::pollutant_by_name("NOx", "report.pollutants")};
  double operating_hours_h = 8760.0;
  std::vector<LimitSpec> limits;
  FFactorSpec f_factors;
};

struct CaseDefinition {
  std::string origin;                          // file name, for messages
  std::string source_sha256;                   // SHA-256 of the case file's bytes (cases/sha256.hpp)
  std::string title;
  std::string description;
  std::string plant_type;                      // key of a reference-O2 preset, or empty
  const emissions::ReferenceO2Preset* reference_o2_preset = nullptr;  // of plant_type; none when empty
  FuelFeedSpec fuel;
  AirSpec air;
  OperatingSpec operating;
  FiringSpec firing;
  PostFlameSpec post_flame;
  StackSpec stack;
  ReportSpec report;
  // Legal but implausible values found at load (a fraction typed as a percent ...); the run adds its
  // own (run_warnings.hpp) and every output prints them all.
  std::vector<units::Warning> warnings;
  std::optional<ReadingsSpec> readings;        // the analyser-data mapping of `stackbound reduce`
};

}  // namespace stackbound::cases
