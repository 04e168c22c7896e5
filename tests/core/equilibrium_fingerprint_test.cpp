// The TP solver's answers stay the same to the last bit: for every point of the robustness grid
// (cold starts) and of its warm-started sweep (tests/core/equilibrium_grid.hpp), the Newton iteration
// count and a 64-bit FNV-1a hash over the bits of every number of the result equal the ones stored
// in tests/core/expected/equilibrium_grid_{cold,warm}.txt. A change meant to keep the results (a
// refactoring) must pass as is; a change that moves them on purpose regenerates the files with
//   STACKBOUND_WRITE_EQUILIBRIUM_GRID=1 build/tests/core/core_tests --gtest_filter='EquilibriumFingerprint.*'
// and says why in its commit. The hashes are of IEEE doubles computed on x86-64 with the project's
// flags (no fused multiply-add); a platform that rounds differently needs its own files.

#include <gtest/gtest.h>

#include <bit>
#include <cstdint>
#include <cstdlib>
#include <fstream>
#include <sstream>
#include <string>
#include <string_view>
#include <vector>

#include "stackbound/core/equilibrium.hpp"
#include "tests/core/equilibrium_grid.hpp"

namespace stackbound::core {
namespace {

// 64-bit FNV-1a over bytes; numbers enter as their 8 bytes, least significant first, on every host.
class Fnv1a {
 public:
  void add_bits(std::uint64_t bits) {
    for (int byte = 0; byte < 8; ++byte) {
      hash_ = (hash_ ^ ((bits >> (8 * byte)) & 0xffU)) * 1099511628211ULL;
    }
  }
  void add(double value) { add_bits(std::bit_cast<std::uint64_t>(value)); }
  void add(const std::vector<double>& values) {
    add_bits(values.size());
    for (const double value : values) add(value);
  }
  void add(std::string_view text) {
    add_bits(text.size());
    for (const char ch : text) add_bits(static_cast<unsigned char>(ch));
  }
  [[nodiscard]] std::uint64_t value() const { return hash_; }

 private:
  std::uint64_t hash_ = 14695981039346656037ULL;
};

// What the file keeps of one solve: the iteration count (-1 for a solve that threw) and the hash.
struct Fingerprint {
  int iterations = 0;
  std::uint64_t hash = 0;
  friend bool operator==(const Fingerprint&, const Fingerprint&) = default;
};

// Hash of every number of the result (amounts, fractions, T, P, residual, enthalpy, heat
// capacities, element potentials and their slopes, flags and counts).
Fingerprint fingerprint_of(const EquilibriumResult& r) {
  Fnv1a h;
  h.add(r.temperature_K);
  h.add(r.pressure_Pa);
  h.add(r.moles);
  h.add(r.mole_fractions);
  h.add(r.total_gas_moles);
  h.add(r.element_residual);
  h.add(r.enthalpy_J);
  h.add(r.frozen_heat_capacity_J_per_K);
  h.add(r.equilibrium_heat_capacity_J_per_K);
  for (const double pi : r.element_potentials) h.add(pi);
  for (const double slope : r.element_potential_slopes) h.add(slope);
  h.add(r.gas_moles_slope);
  h.add_bits(r.graphite_present ? 1U : 0U);
  h.add_bits(static_cast<std::uint64_t>(r.temperature_iterations));
  h.add_bits(r.species_key);
  return {r.iterations, h.value()};
}

// A solve that throws is kept too (hash of its message), so that a point that starts failing differs.
Fingerprint fingerprint_of_error(const std::exception& error) {
  Fnv1a h;
  h.add(std::string_view(error.what()));
  return {-1, h.value()};
}

struct Computed {
  grid::Point point;
  Fingerprint fingerprint;
};

// Every point of the cold-start grid, each solve started cold.
std::vector<Computed> cold_grid() {
  std::vector<Computed> computed;
  grid::for_each_cold_point([&](const grid::Point& point, const EquilibriumSolver& solver, const ElementAmounts& b) {
    try {
      computed.push_back({point, fingerprint_of(solver.solve_tp(b, units::kelvin(point.temperature_K),
                                                                units::pascals(point.pressure_Pa())))});
    } catch (const std::exception& error) {
      computed.push_back({point, fingerprint_of_error(error)});
    }
  });
  return computed;
}

// Every point of the sweep, each solve warm-started from the previous successful one.
std::vector<Computed> warm_sweep() {
  std::vector<Computed> computed;
  EquilibriumResult previous;
  bool have_previous = false;
  grid::for_each_sweep_point([&](const grid::Point& point, const EquilibriumSolver& solver, const ElementAmounts& b) {
    try {
      EquilibriumResult r = solver.solve_tp(b, units::kelvin(point.temperature_K), units::pascals(point.pressure_Pa()),
                                            have_previous ? &previous : nullptr);
      computed.push_back({point, fingerprint_of(r)});
      previous = std::move(r);
      have_previous = true;
    } catch (const std::exception& error) {
      computed.push_back({point, fingerprint_of_error(error)});
    }
  });
  return computed;
}

std::string stored_path(std::string_view sweep) {
  return std::string(STACKBOUND_SOURCE_DIR) + "/tests/core/expected/equilibrium_grid_" + std::string(sweep) + ".txt";
}

std::string hex(std::uint64_t value) {
  std::ostringstream text;
  text << std::hex << value;
  return std::string(16 - text.str().size(), '0') + text.str();
}

// One line a point: index, iterations, hash in hex.
void write_stored(std::string_view sweep, const std::vector<Computed>& computed) {
  std::ofstream out(stored_path(sweep));
  out << "# equilibrium " << sweep << " grid: point index, Newton iterations, FNV-1a hash of the result\n"
      << "# written by tests/core/equilibrium_fingerprint_test.cpp (STACKBOUND_WRITE_EQUILIBRIUM_GRID=1)\n";
  for (std::size_t i = 0; i < computed.size(); ++i) {
    out << i << ' ' << computed[i].fingerprint.iterations << ' ' << hex(computed[i].fingerprint.hash) << '\n';
  }
  ASSERT_TRUE(out.good()) << "cannot write " << stored_path(sweep);
}

struct Stored {
  std::size_t index = 0;
  Fingerprint fingerprint;
};

std::vector<Stored> read_stored(std::string_view sweep) {
  std::ifstream in(stored_path(sweep));
  std::vector<Stored> stored;
  std::string line;
  while (std::getline(in, line)) {
    if (line.empty() || line[0] == '#') continue;
    std::istringstream fields(line);
    Stored entry;
    fields >> entry.index >> entry.fingerprint.iterations >> std::hex >> entry.fingerprint.hash;
    if (!fields) ADD_FAILURE() << stored_path(sweep) << ": unreadable line \"" << line << "\"";
    stored.push_back(entry);
  }
  return stored;
}

std::string describe(std::string_view sweep, std::size_t index, const grid::Point& p) {
  std::ostringstream text;
  text << sweep << " point " << index << " (" << p.fuel << ", phi " << p.phi << ", T " << p.temperature_K << " K, P "
       << p.pressure_atm << " atm)";
  return text.str();
}

// Compares point by point and names the first point that differs.
void expect_stored(std::string_view sweep, const std::vector<Computed>& computed) {
  if (std::getenv("STACKBOUND_WRITE_EQUILIBRIUM_GRID") != nullptr) write_stored(sweep, computed);
  const std::vector<Stored> stored = read_stored(sweep);
  ASSERT_EQ(stored.size(), computed.size()) << stored_path(sweep) << " holds another number of points";
  for (std::size_t i = 0; i < computed.size(); ++i) {
    ASSERT_EQ(stored[i].index, i) << stored_path(sweep) << ": points out of order";
    const Fingerprint& now = computed[i].fingerprint;
    const Fingerprint& then = stored[i].fingerprint;
    ASSERT_TRUE(now == then) << "first differing point: " << describe(sweep, i, computed[i].point) << ": iterations "
                             << now.iterations << " (stored " << then.iterations << "), fingerprint " << hex(now.hash)
                             << " (stored " << hex(then.hash) << ")";
  }
}

// Wrong if any cold-started TP solve of the robustness grid gives another iteration count or a
// result that differs in any bit from the stored one.
TEST(EquilibriumFingerprint, ColdStartGridRepeatsTheStoredResultsBitForBit) { expect_stored("cold", cold_grid()); }

// Wrong if any warm-started TP solve of the sweep gives another iteration count or a result that
// differs in any bit from the stored one.
TEST(EquilibriumFingerprint, WarmStartedSweepRepeatsTheStoredResultsBitForBit) {
  expect_stored("warm", warm_sweep());
}

}  // namespace
}  // namespace stackbound::core
