// The equilibrium solver on any feed of the known elements (amounts from 1 down to 1e-14 of each
// other, or absent), any temperature in the data range and pressure from 1 kPa to 10 MPa. Property: a
// result whose mole fractions are finite, non-negative and sum to 1 and whose products hold the
// feed's atoms (recomputed here from the species' formulas, to 1e-9 relative), or a documented error
// (units::InputError, core::ConvergenceError). Anything else is a defect.

#include <algorithm>
#include <cmath>

#include "fuzz/fuzz_input.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/elements.hpp"
#include "stackbound/core/equilibrium.hpp"

namespace {

namespace core = stackbound::core;
using stackbound::fuzz::property_failed;

// Each element absent (byte below 64) or 10^-e with e in [0, 14].
core::ElementAmounts feed_from(stackbound::fuzz::ByteReader& bytes) {
  core::ElementAmounts b;
  for (double& moles : b.moles) {
    const std::uint8_t choice = bytes.next();
    moles = choice < 64 ? 0.0 : std::pow(10.0, -14.0 * (choice - 64) / 191.0);
  }
  return b;
}

void check_result(const core::SpeciesDatabase& db, const core::ElementAmounts& b, const core::EquilibriumResult& r) {
  double sum = 0.0;
  for (const double x : r.mole_fractions) {
    if (!std::isfinite(x) || x < 0.0) property_failed("a mole fraction is negative or not finite");
    sum += x;
  }
  if (std::abs(sum - 1.0) > 1e-9) property_failed("gas mole fractions do not sum to 1");
  core::ElementAmounts products;
  for (std::size_t j = 0; j < r.species.size(); ++j) products.add_species(db.at(r.species[j]), r.moles[j]);
  for (std::size_t k = 0; k < core::kElementCount; ++k) {
    if (b.moles[k] > 0.0 && std::abs(products.moles[k] - b.moles[k]) > 1e-9 * b.moles[k] + 1e-12 * b.total()) {
      property_failed("products do not hold the feed's atoms");
    }
  }
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  stackbound::fuzz::ByteReader bytes(data, size);
  const core::SpeciesDatabase& db = stackbound::cases::builtin_species();
  const core::ElementAmounts b = feed_from(bytes);
  if (b.total() <= 0.0) return 0;
  try {
    const core::EquilibriumSolver solver(db, b);
    const double T = bytes.in_range(std::max(300.0, solver.min_temperature().value()),
                                    std::min(5000.0, solver.max_temperature().value()));
    const double P = std::pow(10.0, bytes.in_range(3.0, 7.0));
    check_result(db, b, solver.solve_tp(b, stackbound::units::kelvin(T), stackbound::units::pascals(P)));
  } catch (const stackbound::units::InputError&) {
  } catch (const core::ConvergenceError&) {
  }
  return 0;
}
