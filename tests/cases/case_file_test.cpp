// Broken case files, run through the program as a user runs them: each must fail with exit code 2, a
// message naming the file, line and column, the field, the value and what is accepted, and leave no
// output file behind.

#include "stackbound/cases/case_file.hpp"

#include <filesystem>
#include <fstream>
#include <string>
#include <variant>

#include <gtest/gtest.h>

#include "stackbound/emissions/basis.hpp"
#include "tests/support/run_binary.hpp"
#include "tests/support/tolerance.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {
namespace {

namespace fs = std::filesystem;
using stackbound::testing::run_stackbound;

// A small valid case; each broken case replaces one piece of it. Line numbers below refer to it.
constexpr const char* kValidCase =
    "case:\n"                              // 1
    "  title: Test boiler (invented)\n"    // 2
    "fuel:\n"                              // 3
    "  preset: natural_gas\n"              // 4
    "  feed_rate: 100 Nm3/h\n"             // 5
    "operating_point:\n"                   // 6
    "  excess_air: 15 %\n"                 // 7
    "firing:\n"                            // 8
    "  temperature: 1800 K\n"              // 9
    "report:\n"                            // 10
    "  reference_o2: 3 %\n";               // 11

std::string replaced(std::string text, const std::string& from, const std::string& to) {
  const std::size_t at = text.find(from);
  if (at == std::string::npos) {
    ADD_FAILURE() << "test setup: \"" << from << "\" not in the valid case";
    return text;
  }
  return text.replace(at, from.size(), to);
}

struct BrokenCase {
  const char* name;
  std::string text;
  const char* expected;  // fragment of the message, after "broken.yaml"
};

fs::path scratch_dir() {
  const fs::path dir = fs::temp_directory_path() / ("stackbound_case_file_test_" + std::to_string(::getpid()));
  fs::create_directories(dir);
  return dir;
}

// Wrong if the valid case itself failed: then every broken case below would pass for the wrong reason.
TEST(CaseFile, TheBaseCaseRunsAndWritesItsOutput) {
  const fs::path dir = scratch_dir();
  const fs::path file = dir / "valid.yaml";
  std::ofstream(file) << kValidCase;
  const fs::path output = dir / "valid.html";
  const auto run = run_stackbound({"run", file.string(), "--format", "html", "--output", output.string()});
  EXPECT_EQ(run.exit_code, 0) << run.err;
  EXPECT_TRUE(fs::exists(output));
  EXPECT_FALSE(fs::exists(output.string() + ".partial"));
  fs::remove_all(dir);
}

// Wrong if any broken case were accepted, reported without its line, or left a (partial) output file.
TEST(CaseFile, BrokenCasesFailWithLocatedMessagesAndNoOutputFile) {
  const std::string v = kValidCase;
  const BrokenCase cases[] = {
      {"bad YAML", replaced(v, "title: Test boiler (invented)", "title: [unclosed"), ":3:5: not valid YAML"},
      {"empty file", "", ":1:1: the case file must be a YAML mapping"},
      {"unknown top-level key", replaced(v, "firing:", "firng:"),
       ":8:1: (top level): unknown key \"firng\" (did you mean \"firing\"?)"},
      {"unknown key in a section", replaced(v, "  title:", "  tittle:"),
       ":2:3: case: unknown key \"tittle\" (did you mean \"title\"?); accepted keys: title, description, plant_type"},
      {"missing section", replaced(v, "operating_point:\n  excess_air: 15 %\n", ""),
       ":1:1: (top level): missing required key \"operating_point\""},
      {"missing field", replaced(v, "  feed_rate: 100 Nm3/h\n", ""), ":4:3: fuel: missing required key \"feed_rate\""},
      {"wrong dimension", replaced(v, "100 Nm3/h", "100 degC"),
       ":5:14: fuel.feed_rate = \"100 degC\": \"degC\" is a temperature"},
      {"unknown unit", replaced(v, "100 Nm3/h", "100 Nm3/hour"), ":5:14: fuel.feed_rate = \"100 Nm3/hour\": unknown unit"},
      {"missing unit", replaced(v, "15 %", "15"), ":7:15: operating_point.excess_air = \"15\": a unit is required"},
      {"impossible excess air", replaced(v, "15 %", "-80 %"),
       ":7:15: operating_point.excess_air = \"-80 %\": must be above -75 % (a mixture 4 times richer than stoichiometric) and at most 1000 %"},
      {"two operating modes", replaced(v, "  excess_air: 15 %\n", "  excess_air: 15 %\n  lambda: 1.2\n"),
       ":7:3: operating_point: has more than one of: excess_air, lambda, equivalence_ratio, flue_o2"},
      {"flue O2 above air", replaced(v, "  excess_air: 15 %", "  flue_o2: 25 %"),
       ":7:12: operating_point.flue_o2 = 25 % (dry): the flue O2 must be at least 0 % and below the oxidant's O2"},
      {"temperature and adiabatic", replaced(v, "  temperature: 1800 K\n", "  temperature: 1800 K\n  adiabatic: true\n"),
       ":9:3: firing: give either temperature or adiabatic: true, not both"},
      {"below absolute zero", replaced(v, "1800 K", "-300 degC"), ":9:16: firing.temperature = \"-300 degC\":"},
      {"heat loss without adiabatic", replaced(v, "  temperature: 1800 K\n", "  temperature: 1800 K\n  heat_loss: 10 %\n"),
       ":10:14: firing.heat_loss = \"10 %\": applies only with adiabatic: true"},
      {"unknown O2 basis", replaced(v, "  reference_o2: 3 %\n", "  reference_o2: 3 %\n  o2_basis: \"22\"\n"),
       ":12:13: report.o2_basis = \"22\": not an accepted value"},
      {"unknown normal conditions", replaced(v, "  reference_o2: 3 %\n", "  reference_o2: 3 %\n  normal_conditions: 25C\n"),
       ":12:22: report.normal_conditions = \"25C\": not an accepted value"},
      {"unknown fuel preset", replaced(v, "natural_gas", "natural_gass"),
       ":4:11: fuel.preset = \"natural_gass\": unknown fuel preset; did you mean \"natural_gas\"?"},
      {"unknown gas species", replaced(v, "  preset: natural_gas", "  gas: {CH5: 100 %}"),
       ":4:8: fuel.gas = \"CH5\": unknown species"},
      {"composition far from 100 %", replaced(v, "  preset: natural_gas", "  gas: {CH4: 80 %}"),
       ":4:8: fuel.gas: the mole percentages sum to 80 %"},
      {"composition as text in the command-line notation", replaced(v, "  preset: natural_gas", "  gas: CH4 95 %, N2 5 %"),
       ":4:8: fuel.gas = \"CH4 95 %, N2 5 %\": a composition in a file is a YAML mapping: write {CH4: 95 %, N2: 5 %}"},
      {"composition as text in the former notation", replaced(v, "  preset: natural_gas", "  gas: \"CH4=95, N2=5 %\""),
       ":4:8: fuel.gas = \"CH4=95, N2=5 %\": a composition in a file is a YAML mapping: write {CH4: 95 %, N2: 5 %}"},
      {"ultimate analysis as text", replaced(v, "  preset: natural_gas", "  ultimate: C 80 %, H 20"),
       ":4:13: fuel.ultimate = \"C 80 %, H 20\": expected a mapping of percentages, e.g. {C: 75 %, H: 5 %"},
      {"relative humidity above 100 %", replaced(v, "operating_point:", "air:\n  relative_humidity: 150 %\noperating_point:"),
       ":7:22: air.relative_humidity = \"150 %\": must be between 0 % and 100 %"},
      {"limit for a pollutant not reported",
       replaced(v, "  reference_o2: 3 %\n", "  reference_o2: 3 %\n  limits:\n    - pollutant: SO2\n      limit: 35 mg/Nm3, dry, O2=3%\n"),
       ":14:14: report.limits: pollutant \"SO2\" is not among report.pollutants (CO, NO, NOx)"},
      {"malformed limit", replaced(v, "  reference_o2: 3 %\n", "  reference_o2: 3 %\n  limits:\n    - pollutant: CO\n      limit: lots\n"),
       ":14:14: "},
      {"malformed measured value",
       replaced(v, "report:", "stack:\n  measured:\n    co: about twenty\nreport:"),
       ":12:9: stack.measured.co = \"about twenty\": no number found; give a number with its unit"},
      {"preset reference O2 without a plant type", replaced(v, "reference_o2: 3 %", "reference_o2: preset"),
       ":11:17: report.reference_o2 = \"preset\": needs case.plant_type"},
      {"unknown plant type", replaced(v, "  title: Test boiler (invented)\n", "  title: Test boiler (invented)\n  plant_type: boiler\n"),
       ":3:15: case.plant_type = \"boiler\": unknown reference-O2 preset"},
      {"firing temperature outside the data", replaced(v, "1800 K", "4000 K"),
       ":9:16: temperature = 4000 K: outside the data range of product CO2 (200-3500 K)"},
      {"negative feed rate", replaced(v, "100 Nm3/h", "-100 Nm3/h"), ":5:14: fuel.feed_rate = \"-100 Nm3/h\": must be > 0"},
      {"no operating hours", replaced(v, "  reference_o2: 3 %\n", "  reference_o2: 3 %\n  operating_hours: 0 h\n"),
       ":12:20: report.operating_hours = \"0 h\": must be more than 0 h and at most 8784 h (a leap year)"},
  };
  const fs::path dir = scratch_dir();
  for (const BrokenCase& broken : cases) {
    const fs::path file = dir / "broken.yaml";
    std::ofstream(file) << broken.text;
    const fs::path output = dir / "report.html";
    fs::remove(output);
    const auto run = run_stackbound({"run", file.string(), "--format", "html", "--output", output.string()});
    EXPECT_EQ(run.exit_code, 2) << broken.name << ": " << run.err;
    EXPECT_NE(run.err.find(file.string() + broken.expected), std::string::npos)
        << broken.name << "\n  message: " << run.err << "  expected: " << file.string() << broken.expected;
    EXPECT_EQ(run.out, "") << broken.name;
    EXPECT_FALSE(fs::exists(output)) << broken.name << ": an output file was left behind";
    EXPECT_FALSE(fs::exists(output.string() + ".partial")) << broken.name;
  }
  fs::remove_all(dir);
}

// Wrong if a missing case file were reported without its name.
TEST(CaseFile, UnreadableFileIsNamed) {
  EXPECT_THROW_WITH(load_case("/nonexistent/plant.yaml"), units::InputError,
                    "CASE = \"/nonexistent/plant.yaml\": no such case file");
}

// Wrong if the parser lost or rescaled a field: every number arrives in SI.
TEST(CaseFile, ValuesArriveInSiUnits) {
  const CaseDefinition c = parse_case(replaced(kValidCase, "1800 K", "1526.85 degC"), "inline.yaml");
  EXPECT_EQ(c.title, "Test boiler (invented)");
  EXPECT_EQ(c.fuel.fuel.preset, "natural_gas");
  EXPECT_TRUE(stackbound::testing::is_close(c.firing.temperature_K, 1800.0, 1e-12));
  EXPECT_TRUE(stackbound::testing::is_close(c.operating.value, 0.15, 1e-12));
  EXPECT_TRUE(stackbound::testing::is_close(c.report.reference_o2_fraction.value_or(0.0), 0.03, 1e-12));
  // Source: CODATA 2018 molar volume 22.41396954 L/mol at 273.15 K, 101.325 kPa: 100 Nm3/h in mol/s.
  EXPECT_TRUE(stackbound::testing::is_close(c.fuel.feed_rate.value_si, 100.0 / 0.02241396954 / 3600.0, 1e-9));
}

// Wrong if a measured value, a stated limit, a choice or the plant type reached the run as text: the
// loaded case holds them as concentrations on their bases, rates, enums and the preset itself.
TEST(CaseFile, MeasuredValuesLimitsAndChoicesArriveTyped) {
  std::string text = replaced(kValidCase, "report:", "stack:\n  measured:\n    co: 18 ppm, dry\n    moisture: 17 %\nreport:");
  text = replaced(text, "  title: Test boiler (invented)\n", "  title: Test boiler (invented)\n  plant_type: ied-solid\n");
  text += "  o2_basis: \"21\"\n  normal_conditions: 20C\n  pollutants: [CO, NOx]\n  limits:\n"
          "    - {pollutant: NOx, limit: \"100 mg/Nm3, dry, O2=6%\"}\n    - {pollutant: CO, limit: 5 kg/h}\n";
  const CaseDefinition c = parse_case(text, "typed.yaml");
  ASSERT_NE(c.reference_o2_preset, nullptr);
  EXPECT_EQ(c.reference_o2_preset->key, "ied-solid");
  EXPECT_EQ(c.report.o2_basis, emissions::O2Basis::eu_21);
  EXPECT_EQ(c.report.normal, &units::normal_20C());
  ASSERT_EQ(c.report.pollutants.size(), 2u);
  EXPECT_TRUE(c.report.pollutants[1].expressed_as_no2);
  ASSERT_TRUE(c.stack.measured.co.has_value());
  EXPECT_EQ(c.stack.measured.co->value.basis().moisture, emissions::Moisture::dry);
  EXPECT_TRUE(stackbound::testing::is_close(c.stack.measured.co->value.value(), 18.0, 0.0));
  EXPECT_EQ(c.stack.measured.co->text, "18 ppm, dry");
  ASSERT_TRUE(c.stack.measured.moisture.has_value());
  EXPECT_TRUE(stackbound::testing::is_close(c.stack.measured.moisture->fraction, 0.17, 1e-15));
  ASSERT_EQ(c.report.limits.size(), 2u);
  const auto* concentration = std::get_if<emissions::Concentration>(&c.report.limits[0].limit);
  ASSERT_NE(concentration, nullptr);
  EXPECT_TRUE(stackbound::testing::is_close(concentration->basis().reference.dry_fraction(), 0.06, 1e-15));
  EXPECT_EQ(concentration->basis().unit.normal, &units::normal_20C()) << "the limit's normal conditions are the report's";
  const auto* rate = std::get_if<emissions::RateLimit>(&c.report.limits[1].limit);
  ASSERT_NE(rate, nullptr);
  EXPECT_EQ(rate->kind, emissions::RateKind::mass_flow);
  EXPECT_EQ(c.fuel.fuel.kind, FuelKind::preset);
}

// Wrong if what the runner used to find (a bad measured value or limit, a missing reference O2, an
// unknown plant type) waited for a run: loading alone must refuse it, at its position.
TEST(CaseFile, BadValuesAreRefusedAtLoadWithoutRunning) {
  const std::string v = kValidCase;
  EXPECT_THROW_WITH(parse_case(replaced(v, "report:", "stack:\n  measured:\n    co: about twenty\nreport:"), "f.yaml"),
                    units::InputError, "f.yaml:12:9: stack.measured.co = \"about twenty\": no number found");
  EXPECT_THROW_WITH(
      parse_case(v + "  limits:\n    - pollutant: SO2\n      limit: 35 mg/Nm3, dry, O2=3%\n", "f.yaml"),
      units::InputError, "f.yaml:14:14: report.limits: pollutant \"SO2\" is not among report.pollutants (CO, NO, NOx)");
  EXPECT_THROW_WITH(parse_case(v + "  limits:\n    - pollutant: CO\n      limit: 250 mg/kWh\n", "f.yaml"),
                    units::InputError,
                    "f.yaml:14:14: report.limits[0].limit = \"250 mg/kWh\": a limit per useful output needs an efficiency");
  EXPECT_THROW_WITH(parse_case(replaced(v, "reference_o2: 3 %", "reference_o2: preset"), "f.yaml"), units::InputError,
                    "f.yaml:11:17: report.reference_o2 = \"preset\": needs case.plant_type");
  EXPECT_THROW_WITH(parse_case(replaced(v, "report:\n  reference_o2: 3 %\n", ""), "f.yaml"), units::InputError,
                    "f.yaml: report.reference_o2 = \"preset\": needs case.plant_type");
  EXPECT_THROW_WITH(parse_case(v + "  pollutants: [CO, XYZ]\n", "f.yaml"), units::InputError,
                    "f.yaml:12:20: report.pollutants = \"XYZ\": unknown pollutant");
}

// Wrong if the loader lost where a field was written: a run's error names the field path, and the
// positions recorded at load are what turn it back into file:line:column.
TEST(CaseFile, TheLoaderRecordsWhereEachFieldWasWritten) {
  const LoadedCase loaded = parse_case_file(kValidCase, "f.yaml");
  EXPECT_EQ(loaded.sources.location_of("fuel.feed_rate"), "f.yaml:5:14");
  EXPECT_EQ(loaded.sources.location_of("firing.temperature"), "f.yaml:9:16");
  EXPECT_EQ(loaded.sources.location_of("operating_point.excess_air"), "f.yaml:7:15");
  // A section the file leaves out is reported at the file.
  EXPECT_EQ(loaded.sources.location_of("air"), "f.yaml");
  EXPECT_EQ(loaded.sources.location_of("stack.measured.co"), "f.yaml");
  EXPECT_EQ(loaded.sources.location_of("nonsense"), std::nullopt);
}

}  // namespace
}  // namespace stackbound::cases

namespace stackbound::cases {
namespace {

// Wrong if nonsense pressures and feeds ran and were screened (1e308 Pa "below the limit", exit 0):
// each is refused at load with the range stated.
TEST(CaseFile, PhysicalInputsOutsideThePlausibleRangesAreRefused) {
  const std::string v = kValidCase;
  EXPECT_THROW_WITH((void)parse_case(replaced(v, "  temperature: 1800 K\n", "  temperature: 1800 K\n  pressure: 1e308 Pa\n"), "f.yaml"),
                    units::InputError,
                    "f.yaml:10:13: firing.pressure = \"1e308 Pa\": outside 1 kPa to 10000 kPa, the range this tool accepts "
                    "for a firing pressure (ideal-gas equilibrium)");
  EXPECT_THROW_WITH((void)parse_case(replaced(v, "  temperature: 1800 K\n", "  temperature: 1800 K\n  pressure: 1e-300 Pa\n"), "f.yaml"),
                    units::InputError, "firing.pressure = \"1e-300 Pa\": outside 1 kPa to 10000 kPa");
  EXPECT_THROW_WITH((void)parse_case(replaced(v, "100 Nm3/h", "1e-300 kg/h"), "f.yaml"), units::InputError,
                    "fuel.feed_rate = \"1e-300 kg/h\": outside 1e-07 kg/s to 10000 kg/s, the range this tool accepts for a fuel feed");
  EXPECT_THROW_WITH((void)parse_case(replaced(v, "100 Nm3/h", "1e308 kg/h"), "f.yaml"), units::InputError,
                    "fuel.feed_rate = \"1e308 kg/h\": outside");
  EXPECT_THROW_WITH((void)parse_case(replaced(v, "report:", "stack:\n  pressure: 3 bar\nreport:"), "f.yaml"),
                    units::InputError, "stack.pressure = \"3 bar\": outside 50 kPa to 200 kPa");
  EXPECT_NO_THROW((void)parse_case(replaced(v, "  temperature: 1800 K\n", "  temperature: 1800 K\n  pressure: 25 bar\n"), "f.yaml"))
      << "a gas-turbine combustor pressure is in range";
}

}  // namespace
}  // namespace stackbound::cases
