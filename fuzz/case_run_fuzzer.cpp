// A case file of any bytes, loaded, run and rendered in every format. Property: either every format
// renders, or loading/running ends in a documented error (units::InputError, core::ConvergenceError).
// A yaml-cpp, JSON-library or standard-library exception, a crash or a sanitizer report is a defect.

#include "fuzz/fuzz_input.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/equilibrium.hpp"
#include "stackbound/render/run_output.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  namespace cases = stackbound::cases;
  try {
    const cases::RunResult result =
        cases::run_case(cases::parse_case(stackbound::fuzz::as_text(data, size), "fuzz.yaml"), cases::builtin_species());
    const cases::Provenance provenance = cases::make_provenance(result.definition, {});
    for (const char* format : {"text", "json", "csv", "html"}) {
      if (stackbound::render::render_run(result, format, provenance).empty())
        stackbound::fuzz::property_failed("empty report");
    }
  } catch (const stackbound::units::InputError&) {
  } catch (const stackbound::core::ConvergenceError&) {
  }
  return 0;
}
