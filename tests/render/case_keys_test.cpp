// Every key of the case file is used or refused (issue 12): for each key docs/case-file.md documents,
// a case that states it (or states it differently) gives another result (the run's JSON) than the
// same case without it, or is refused at load. A key that is read and then ignored fails here. A
// second test checks that the list below and the keys of the document are the same.

#include <fstream>
#include <map>
#include <regex>
#include <set>
#include <sstream>
#include <string>
#include <vector>

#include <gtest/gtest.h>
#include <yaml-cpp/yaml.h>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/reduction.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/render/reduction_output.hpp"
#include "stackbound/render/run_json.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::render {
namespace {

// A gas boiler at a stated firing temperature, with most optional keys stated.
constexpr const char* kFixed = R"(case:
  title: Key walk (invented)
  description: base
  plant_type: ied-liquid-gaseous
fuel:
  preset: natural_gas
  feed_rate: 10 MW
air:
  temperature: 25 degC
  relative_humidity: 50 %
  ambient_temperature: 15 degC
  ambient_pressure: 1 atm
operating_point:
  excess_air: 15 %
firing:
  temperature: 1800 K
  pressure: 1 atm
  residence_time: 20 ms
post_flame:
  cooling_to: 450 K
  cooling_time: 1 s
stack:
  temperature: 150 degC
  pressure: 1 atm
  measured:
    o2: 3 %, dry
    co: 20 ppm, dry
report:
  reference_o2: 3 %
  o2_basis: "20.9"
  normal_conditions: 0C
  pollutants: [CO, NO, NOx]
  operating_hours: 8000 h
  limits:
    - pollutant: NOx
      limit: 100 mg/Nm3, dry, O2=3%
)";

// Adiabatic, with a primary zone: the keys that only an adiabatic flame reads.
constexpr const char* kAdiabatic = R"(case:
  title: Key walk, adiabatic (invented)
fuel:
  preset: natural_gas
  feed_rate: 10 MW
  temperature: 25 degC
air:
  temperature: 25 degC
operating_point:
  excess_air: 150 %
firing:
  adiabatic: true
  heat_loss: 5 %
  primary_zone: {equivalence_ratio: 0.6, residence_time: 8 ms, heat_loss: 1 %}
report:
  reference_o2: 15 %
)";

// A solid fuel by its ultimate analysis.
constexpr const char* kUltimate = R"(case:
  title: Key walk, ultimate (invented)
  plant_type: ied-solid
fuel:
  ultimate: {C: 50 %, H: 6 %, O: 42.5 %, N: 1 %, S: 0.1 %, ash: 0.4 %}
  heating_value: 20 MJ/kg
  feed_rate: 1 t/h
  temperature: 60 degC
operating_point:
  excess_air: 40 %
firing:
  adiabatic: true
report:
  reference_o2: 6 %
)";

// A blend of two gases.
constexpr const char* kBlend = R"(case:
  title: Key walk, blend (invented)
fuel:
  blend:
    - {preset: natural_gas, fraction: 70 %}
    - {gas: {H2: 100 %}, fraction: 30 %}
  feed_rate: 10 MW
operating_point:
  excess_air: 15 %
firing:
  temperature: 1800 K
report:
  reference_o2: 3 %
)";

// One edit of a case: set `path` to the YAML `value`, or remove it when value is "~remove".
struct Edit {
  std::string path;
  std::string value;
};

// A documented key and a variant that must change the result (`refused` empty) or be refused
// with a message containing `refused`.
struct KeyCheck {
  std::string key;  // as documented: "fuel.blend[].fraction"
  const char* base;
  std::vector<Edit> edits;
  std::string refused;
};

std::vector<std::string> split_path(const std::string& path) {
  std::vector<std::string> parts;
  std::stringstream in(path);
  for (std::string part; std::getline(in, part, '.');) parts.push_back(part);
  return parts;
}

// yaml-cpp nodes are handles: assigning to a sub-node edits the document.
void apply(YAML::Node root, const Edit& edit) {
  const std::vector<std::string> parts = split_path(edit.path);
  std::vector<YAML::Node> chain{root};
  for (std::size_t i = 0; i + 1 < parts.size(); ++i) {
    const std::string& part = parts[i];
    const std::size_t bracket = part.find('[');
    YAML::Node next = bracket == std::string::npos
                          ? chain.back()[part]
                          : chain.back()[part.substr(0, bracket)][std::stoi(part.substr(bracket + 1))];
    chain.push_back(next);
  }
  if (edit.value == "~remove") {
    chain.back().remove(parts.back());
  } else {
    chain.back()[parts.back()] = YAML::Load(edit.value);
  }
}

std::string edited(const char* base, const std::vector<Edit>& edits) {
  YAML::Node root = YAML::Load(base);
  for (const Edit& edit : edits) apply(root, edit);
  YAML::Emitter out;
  out << root;
  return out.c_str();
}

std::string source_file(const std::string& relative) {
  std::ifstream in(std::string(STACKBOUND_SOURCE_DIR) + "/" + relative);
  std::stringstream text;
  text << in.rdbuf();
  return text.str();
}

// The gas-turbine example: the base of the `readings` keys (its section maps the invented day's CSV).
const char* readings_case() {
  static const std::string text = source_file("cases/examples/gas_turbine.yaml");
  return text.c_str();
}

// The run's JSON without the file name (the same for both); for a case with a readings section, also
// the reduction of the example's invented day of readings.
std::string result_of(const std::string& text) {
  cases::LoadedCase loaded = cases::parse_case_file(text, "keys.yaml");
  std::string reduction;
  if (loaded.definition.readings) {
    std::istringstream csv(source_file("cases/examples/gas_turbine_readings.csv"));
    reduction = reduction_json(cases::with_positions(loaded.sources, [&] {
                  return cases::reduce_readings(loaded.definition, cases::builtin_species(), csv, "readings.csv", {});
                })).dump();
  }
  const cases::RunResult run = cases::with_positions(
      loaded.sources, [&] { return cases::run_case(std::move(loaded.definition), cases::builtin_species()); });
  return run_json(run, cases::Provenance{}).dump() + reduction;
}

const std::vector<KeyCheck>& key_checks() {
  static const std::vector<KeyCheck> checks = {
      {"case.title", kFixed, {{"case.title", "Other title"}}, ""},
      {"case.description", kFixed, {{"case.description", "other"}}, ""},
      {"case.plant_type", kFixed, {{"case.plant_type", "ied-gas-engine"}}, ""},
      {"fuel.name", kFixed, {{"fuel.name", "plant gas"}}, ""},
      {"fuel.preset", kFixed, {{"fuel.preset", "propane"}}, ""},
      {"fuel.gas", kFixed, {{"fuel.preset", "~remove"}, {"fuel.gas", "{CH4: 100 %}"}}, ""},
      {"fuel.gas_basis", kFixed, {{"fuel.preset", "~remove"}, {"fuel.gas", "{CH4: 90 %, C2H6: 10 %}"}, {"fuel.gas_basis", "mass"}}, ""},
      {"fuel.gas_basis", kFixed, {{"fuel.gas_basis", "mass"}}, "fuel.gas_basis = \"mass\": applies only with fuel.gas, not with fuel.preset"},
      {"fuel.ultimate", kUltimate, {{"fuel.ultimate", "{C: 52 %, H: 6 %, O: 40.5 %, N: 1 %, S: 0.1 %, ash: 0.4 %}"}}, ""},
      {"fuel.ultimate_basis", kUltimate, {{"fuel.ultimate_basis", "dry"}, {"fuel.ultimate.moisture", "20 %"}}, ""},
      {"fuel.state", kUltimate, {{"fuel.state", "liquid"}}, ""},
      {"fuel.state", kFixed, {{"fuel.state", "liquid"}}, "fuel.state = \"liquid\": applies only with fuel.ultimate, not with fuel.preset"},
      {"fuel.heating_value", kUltimate, {{"fuel.heating_value", "19 MJ/kg"}}, ""},
      {"fuel.heating_value", kFixed, {{"fuel.heating_value", "50 MJ/kg"}}, "fuel.heating_value = \"50 MJ/kg\": applies only with fuel.ultimate, not with fuel.preset"},
      {"fuel.heating_value_correlation", kUltimate, {{"fuel.heating_value", "~remove"}, {"fuel.heating_value_correlation", "boie"}}, ""},
      {"fuel.specific_heat", kUltimate, {{"fuel.specific_heat", "1.5"}}, ""},
      {"fuel.heating_value_basis", kFixed, {{"fuel.heating_value_basis", "LHV"}}, ""},
      {"fuel.heating_value_basis", kUltimate, {{"fuel.heating_value_basis", "LHV"}}, ""},
      {"fuel.heating_value_basis", kFixed, {{"fuel.feed_rate", "800 kg/h"}, {"fuel.heating_value_basis", "LHV"}},
       "fuel.heating_value_basis = \"LHV\": states the basis of a heat-input fuel.feed_rate (\"12 MW\") or of "
       "fuel.heating_value; this case has neither (feed_rate \"800 kg/h\" is not a heat input)"},
      {"fuel.blend", kBlend, {{"fuel.blend[1].gas", "{H2: 50 %, CO: 50 %}"}}, ""},
      {"fuel.blend_by", kBlend, {{"fuel.blend_by", "heat"}}, ""},
      {"fuel.blend_by", kFixed, {{"fuel.blend_by", "heat"}}, "fuel.blend_by = \"heat\": applies only with fuel.blend, not with fuel.preset"},
      {"fuel.blend[].fraction", kBlend, {{"fuel.blend[0].fraction", "80 %"}, {"fuel.blend[1].fraction", "20 %"}}, ""},
      {"fuel.feed_rate", kFixed, {{"fuel.feed_rate", "12 MW"}}, ""},
      {"fuel.temperature", kAdiabatic, {{"fuel.temperature", "200 degC"}}, ""},
      {"fuel.nitrogen_conversion", kUltimate, {{"fuel.nitrogen_conversion", "10 %"}}, ""},
      {"air.temperature", kAdiabatic, {{"air.temperature", "300 degC"}}, ""},
      {"air.relative_humidity", kFixed, {{"air.relative_humidity", "90 %"}}, ""},
      {"air.ambient_temperature", kFixed, {{"air.ambient_temperature", "30 degC"}}, ""},
      {"air.ambient_temperature", kAdiabatic, {{"air.ambient_temperature", "30 degC"}},
       "air.ambient_temperature = \"30 degC\": applies only with air.relative_humidity"},
      {"air.ambient_pressure", kFixed, {{"air.ambient_pressure", "90 kPa"}}, ""},
      {"air.humidity_ratio", kFixed, {{"air.relative_humidity", "~remove"}, {"air.ambient_temperature", "~remove"}, {"air.ambient_pressure", "~remove"}, {"air.humidity_ratio", "0.02"}}, ""},
      {"air.o2_enrichment", kFixed, {{"air.o2_enrichment", "25 %"}}, ""},
      {"operating_point.excess_air", kFixed, {{"operating_point.excess_air", "25 %"}}, ""},
      {"operating_point.lambda", kFixed, {{"operating_point.excess_air", "~remove"}, {"operating_point.lambda", "1.3"}}, ""},
      {"operating_point.equivalence_ratio", kFixed, {{"operating_point.excess_air", "~remove"}, {"operating_point.equivalence_ratio", "0.8"}}, ""},
      {"operating_point.flue_o2", kFixed, {{"operating_point.excess_air", "~remove"}, {"operating_point.flue_o2", "4 %"}}, ""},
      {"operating_point.flue_o2_basis", kFixed, {{"operating_point.excess_air", "~remove"}, {"operating_point.flue_o2", "4 %"}, {"operating_point.flue_o2_basis", "wet"}}, ""},
      {"firing.temperature", kFixed, {{"firing.temperature", "1850 K"}}, ""},
      {"firing.adiabatic", kFixed, {{"firing.temperature", "~remove"}, {"firing.adiabatic", "true"}}, ""},
      {"firing.heat_loss", kAdiabatic, {{"firing.heat_loss", "10 %"}}, ""},
      {"firing.pressure", kFixed, {{"firing.pressure", "2 atm"}}, ""},
      {"firing.species", kFixed, {{"firing.species", "[CO2, CO, H2O, H2, O2, N2, NO, Ar, O, OH]"}}, ""},
      {"firing.residence_time", kFixed, {{"firing.residence_time", "50 ms"}}, ""},
      {"firing.primary_zone", kAdiabatic, {{"firing.primary_zone", "~remove"}}, ""},
      {"firing.primary_zone.equivalence_ratio", kAdiabatic, {{"firing.primary_zone.equivalence_ratio", "0.7"}}, ""},
      {"firing.primary_zone.air_share", kAdiabatic, {{"firing.primary_zone.equivalence_ratio", "~remove"}, {"firing.primary_zone.air_share", "50 %"}}, ""},
      {"firing.primary_zone.residence_time", kAdiabatic, {{"firing.primary_zone.residence_time", "4 ms"}}, ""},
      {"firing.primary_zone.heat_loss", kAdiabatic, {{"firing.primary_zone.heat_loss", "3 %"}}, ""},
      {"post_flame.cooling_to", kFixed, {{"post_flame.cooling_to", "800 K"}}, ""},
      {"post_flame.cooling_time", kFixed, {{"post_flame.cooling_time", "3 s"}}, ""},
      {"stack.temperature", kFixed, {{"stack.temperature", "180 degC"}}, ""},
      {"stack.pressure", kFixed, {{"stack.pressure", "95 kPa"}}, ""},
      {"stack.measured", kFixed, {{"stack.measured", "~remove"}}, ""},
      {"stack.measured.o2", kFixed, {{"stack.measured.o2", "4 %, dry"}}, ""},
      {"stack.measured.co", kFixed, {{"stack.measured.co", "30 ppm, dry"}}, ""},
      {"stack.measured.no", kFixed, {{"stack.measured.no", "30 ppm, dry"}}, ""},
      {"stack.measured.nox", kFixed, {{"stack.measured.nox", "30 ppm, dry"}}, ""},
      {"stack.measured.moisture", kFixed, {{"stack.measured.moisture", "15 %"}}, ""},
      {"report.reference_o2", kFixed, {{"report.reference_o2", "6 %"}}, ""},
      {"report.o2_basis", kFixed, {{"report.o2_basis", "\"21\""}}, ""},
      {"report.normal_conditions", kFixed, {{"report.normal_conditions", "20C"}}, ""},
      {"report.normal_conditions", kFixed, {{"report.normal_conditions", "25 degC, 101.325 kPa"}}, ""},
      {"report.pollutants", kFixed, {{"report.pollutants", "[CO, NO, NOx, SO2]"}}, ""},
      {"report.operating_hours", kFixed, {{"report.operating_hours", "4000 h"}}, ""},
      {"report.f_factors", kFixed, {{"report.f_factors", "published"}}, ""},
      {"report.f_factors", kFixed, {{"report.f_factors", "{Fd: 8700 dscf/MMBtu}"}}, ""},
      {"report.limits", kFixed, {{"report.limits", "~remove"}}, ""},
      {"report.limits[].pollutant", kFixed, {{"report.limits[0].pollutant", "NO"}}, ""},
      {"report.limits[].limit", kFixed, {{"report.limits[0].limit", "200 mg/Nm3, dry, O2=3%"}}, ""},
      {"readings.time", readings_case(), {{"readings.time", "{column: time, zone: UTC}"}}, ""},
      {"readings.moisture", readings_case(), {{"readings.moisture", "{value: 10 %}"}}, ""},
      {"readings.flow", readings_case(), {{"readings.flow", "~remove"}}, ""},
      {"readings.load", readings_case(), {{"readings.load", "{value: 0 MW}"}}, ""},
      {"readings.status", readings_case(), {{"readings.status", "~remove"}}, ""},
      {"readings.interval", readings_case(), {{"readings.interval", "2 min"}}, ""},
      {"readings.delimiter", readings_case(), {{"readings.delimiter", "\";\""}},
       "readings.time.column = \"time\": no such column in the header"},
      {"readings.fo_range", readings_case(), {{"readings.fo_range", "bituminous-coal"}}, ""},
  };
  return checks;
}

// Wrong if a documented key were read and then ignored (the result unchanged), or refused with
// another message than its own.
TEST(CaseKeys, EveryDocumentedKeyChangesTheResultOrIsRefused) {
  std::map<const char*, std::string> base_results;
  for (const char* base : {kFixed, kAdiabatic, kUltimate, kBlend, readings_case()}) base_results[base] = result_of(base);
  for (const KeyCheck& check : key_checks()) {
    const std::string text = edited(check.base, check.edits);
    if (check.refused.empty()) {
      std::string result;
      EXPECT_NO_THROW(result = result_of(text)) << check.key;
      EXPECT_TRUE(result != base_results[check.base]) << check.key << " changed nothing:\n" << text;
    } else {
      try {
        result_of(text);
        ADD_FAILURE() << check.key << " was not refused:\n" << text;
      } catch (const units::InputError& error) {
        EXPECT_NE(std::string(error.what()).find(check.refused), std::string::npos) << check.key << ": " << error.what();
      }
    }
  }
}

// The keys docs/case-file.md documents: the key column of the tables under a heading that names a
// section ("## `fuel` (required)", "### `firing.primary_zone`").
std::set<std::string> documented_keys() {
  std::ifstream doc(std::string(STACKBOUND_SOURCE_DIR) + "/docs/case-file.md");
  const std::regex heading(R"(^#{2,3} `([a-z_.\[\]]+)`.*)");
  const std::regex other_heading(R"(^#{1,3} .*)");
  const std::regex row(R"(^\| `([A-Za-z0-9_]+)` \|.*)");
  std::set<std::string> keys;
  std::string section;
  std::smatch match;
  for (std::string line; std::getline(doc, line);) {
    if (std::regex_match(line, match, heading)) {
      section = match[1];
    } else if (std::regex_match(line, other_heading)) {
      section.clear();
    } else if (!section.empty() && std::regex_match(line, match, row)) {
      keys.insert(section + "." + std::string(match[1]));
    }
  }
  return keys;
}

// Wrong if a key were documented and not checked above, or checked and not documented.
TEST(CaseKeys, TheCheckedKeysAreTheDocumentedKeys) {
  std::set<std::string> checked;
  for (const KeyCheck& check : key_checks()) checked.insert(check.key);
  const std::set<std::string> documented = documented_keys();
  EXPECT_GT(documented.size(), 50U);
  for (const std::string& key : documented) EXPECT_TRUE(checked.count(key)) << key << " is documented, not checked";
  for (const std::string& key : checked) EXPECT_TRUE(documented.count(key)) << key << " is checked, not documented";
}

}  // namespace
}  // namespace stackbound::render
