#pragma once
// A case as the case file states it, with every number already parsed into SI by the units layer.
// Plain data: loading (case_file.hpp) fills it and reports located errors; the runner (runner.hpp)
// turns it into a fuel, an oxidant, an operating point and the equilibrium problem. Sweeps change
// fields of a copy. Field-by-field documentation: docs/case-file.md.

#include <optional>
#include <string>
#include <vector>

#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::cases {

// Where a value came from, for errors raised after loading (e.g. a basis text parsed by the runner).
struct SourceText {
  std::string text;
  std::string location;  // "file:line:column"
  std::string path;      // field path, e.g. "stack.measured.co"
};

struct GasComponent {
  std::string formula;
  double percent = 0.0;
};

struct FuelSpec {
  std::string name;                        // for reports; defaults to the preset name or "fuel"
  std::string preset;                      // non-empty: a built-in fuel
  std::vector<GasComponent> gas;           // non-empty: a gas by composition
  std::string gas_basis = "mole";          // mole | mass
  // Ultimate analysis in percent by mass (C, H, O, N, S, ash, moisture), on `ultimate_basis`:
  // as_received sums to 100 with ash and moisture; dry sums to 100 with ash (moisture as received);
  // dry_ash_free sums to 100 without ash and moisture (ash on the dry basis, moisture as received).
  std::vector<GasComponent> ultimate;
  std::string ultimate_basis = "as_received";  // as_received | dry | dry_ash_free
  std::string state = "solid";                 // solid | liquid (ultimate analyses only)
  std::optional<double> heating_value_J_per_kg;  // measured, on the analysis basis
  std::string heating_value_basis = "HHV";     // HHV | LHV
  std::string heating_value_correlation;       // instead of a measured value: channiwala_parikh | boie
  std::optional<double> specific_heat_J_per_kg_K;  // of the as-fired liquid/solid fuel
  std::string field = "fuel";                  // path in the file, for messages ("fuel.blend[1]")
  std::string location;                        // "file:line:column" of this fuel's mapping
  std::string kind_location;                   // of its preset / gas / ultimate / blend value
  // Blend components and the fraction each takes (by `blend_by`), fractions summing to 1.
  std::vector<std::pair<FuelSpec, double>> blend;
  std::string blend_by = "mass";               // mass | mole | heat
};

struct FuelFeedSpec {
  FuelSpec fuel;
  units::ParsedQuantity feed_rate;             // mass flow, molar flow (normal volume) or power
  SourceText feed_rate_text;
  double temperature_K = 298.15;
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
  std::string location;                        // of the value, for errors found when it is used
};

struct FiringSpec {
  bool adiabatic = false;
  double temperature_K = 0.0;                  // when not adiabatic
  double heat_loss_fraction = 0.0;             // when adiabatic: fraction of the heat input lost
  double pressure_Pa = 101325.0;
  std::vector<std::string> species;            // product candidates; empty = all that fit
  std::string location;                        // of the temperature (or of the section when adiabatic)
};

struct MeasuredSpec {
  std::optional<SourceText> o2;                // e.g. "3.2 %, dry"
  std::optional<SourceText> co;
  std::optional<SourceText> no;
  std::optional<SourceText> nox;
  std::optional<SourceText> moisture;          // e.g. "17 %"
};

struct StackSpec {
  double temperature_K = 423.15;
  double pressure_Pa = 101325.0;
  MeasuredSpec measured;
};

struct LimitSpec {
  std::string pollutant;
  SourceText limit;                            // "100 mg/Nm3, dry, O2=3%", "0.1 lb/MMBtu", "5 kg/h"
};

struct ReportSpec {
  std::optional<double> reference_o2_fraction;  // nullopt: the preset for the plant type
  double o2_basis_percent = 20.9;               // 20.9 (US EPA) or 21 (EU)
  std::string normal_conditions = "0C";
  std::vector<std::string> pollutants{"CO", "NO", "NOx"};
  double operating_hours_h = 8760.0;
  std::vector<LimitSpec> limits;
  std::string reference_o2_location;           // of report.reference_o2 (or the file)
};

struct CaseDefinition {
  std::string origin;                          // file name, for messages
  std::string title;
  std::string description;
  std::string plant_type;                       // key of a reference-O2 preset, or empty
  std::string plant_type_location;
  FuelFeedSpec fuel;
  AirSpec air;
  OperatingSpec operating;
  FiringSpec firing;
  StackSpec stack;
  ReportSpec report;
};

}  // namespace stackbound::cases
