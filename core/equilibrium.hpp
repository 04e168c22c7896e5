#pragma once
// Chemical equilibrium of an ideal-gas mixture plus pure condensed species (graphite) at fixed
// temperature and pressure: minimum Gibbs energy under the element balances, by the element-potential
// method (Gordon & McBride, NASA RP-1311, 1994, ch. 2-3; Smith & Missen, Chemical Reaction
// Equilibrium Analysis, 1982). Newton on the element potentials pi_k, the total gas moles n and the
// condensed amounts, with gas amounts carried as ln n_j (trace species never go negative), the
// RP-1311 step-size control, and condensed species entered / removed by their chemical-potential test.
//   gas:       mu_j/RT = g_j(T)/RT + ln(n_j/n) + ln(P/P0),  P0 = 1 bar (the data's standard state)
//   condensed: mu_c/RT = g_c(T)/RT
//   optimum:   mu_j/RT = sum_k a_kj pi_k for every present species; sum_j a_kj n_j = b_k.
// Cold start: the linear-programming estimate (White, Johnson & Dantzig, J. Chem. Phys. 28 (1958) 751)
// with element potentials fitted to its major species; warm start: a nearby solution's element
// potentials moved along their temperature slopes. Slow (factor-e) steps are extrapolated.
// Applies to ideal gases (low-to-moderate pressure); fails (ConvergenceError) only if Newton does not
// converge within the iteration limit, which is reported with the diagnostics, never hidden.
// The HP problem (adiabatic flame) is solve_hp(), implemented in core/adiabatic_flame.cpp.

#include <array>
#include <cstddef>
#include <cstdint>
#include <memory>
#include <optional>
#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

#include "stackbound/core/element_amounts.hpp"
#include "stackbound/core/species_database.hpp"
#include "stackbound/units/quantities.hpp"

namespace stackbound::core {

struct EquilibriumTables;  // the solver's precomputed species rows (core/equilibrium_steps.hpp)
struct EquilibriumTerm;    // one species' rows in the Newton system (core/equilibrium_steps.hpp)

struct EquilibriumResult {
  double temperature_K = 0.0;
  double pressure_Pa = 0.0;
  std::vector<std::string> species;    // product formulas, solver order (gases first, then condensed)
  std::vector<double> moles;           // per species, mol (condensed included)
  std::vector<double> mole_fractions;  // gas-phase mole fractions (condensed species: 0); gas sums to 1
  double total_gas_moles = 0.0;        // mol
  int iterations = 0;                  // Newton iterations (for HP: summed over the TP solves)
  double element_residual = 0.0;       // max over elements of |b_k(products) - b_k(feed)| / b_k(feed)
  bool graphite_present = false;
  double enthalpy_J = 0.0;                         // total H of the products at T (formation enthalpies included)
  double frozen_heat_capacity_J_per_K = 0.0;       // sum n_j cp_j, composition fixed
  double equilibrium_heat_capacity_J_per_K = 0.0;  // dH/dT at fixed P with the composition shifting
  // pi_k = lambda_k/RT per known_elements() index (0 for an element absent or in a dependent row).
  std::array<double, kElementCount> element_potentials{};
  // d pi_k / d ln T and d ln(n_gas) / d ln T at fixed P along the equilibrium (NaN where unknown);
  // they let a warm start at a nearby temperature begin from a first-order prediction.
  std::array<double, kElementCount> element_potential_slopes{};
  double gas_moles_slope = 0.0;
  int temperature_iterations = 0;  // HP only: Newton steps on T
  std::uint64_t species_key = 0;   // identifies the solver's product list (for warm starts)

  // The state as quantities. The raw fields above stay: the solver's inner loops, warm starts and the
  // renderers read them, and keeping them keeps every stored number bit-identical.
  [[nodiscard]] units::Temperature temperature() const { return units::kelvin(temperature_K); }
  [[nodiscard]] units::Pressure pressure() const { return units::pascals(pressure_Pa); }
  [[nodiscard]] units::Energy enthalpy() const { return units::joules(enthalpy_J); }
  [[nodiscard]] units::Amount total_gas_amount() const { return units::moles(total_gas_moles); }

  // 0 if `formula` is not a product.
  [[nodiscard]] double mole_fraction(std::string_view formula) const;
  [[nodiscard]] double moles_of(std::string_view formula) const;
  // Index of `formula` in `species`, or species.size() if absent.
  [[nodiscard]] std::size_t index_of(std::string_view formula) const;
};

// Newton failed to converge (or met a singular system). what() carries the diagnostics.
class ConvergenceError : public std::runtime_error {
 public:
  ConvergenceError(const std::string& reason, int iterations, double element_residual, double temperature_K,
                   double pressure_Pa);
  [[nodiscard]] int iterations() const { return iterations_; }
  [[nodiscard]] double element_residual() const { return element_residual_; }
  [[nodiscard]] double temperature_K() const { return temperature_K_; }
  [[nodiscard]] double pressure_Pa() const { return pressure_Pa_; }
  [[nodiscard]] units::Temperature temperature() const { return units::kelvin(temperature_K_); }
  [[nodiscard]] units::Pressure pressure() const { return units::pascals(pressure_Pa_); }

 private:
  int iterations_;
  double element_residual_;
  double temperature_K_;
  double pressure_Pa_;
};

// Solver settings. The defaults suit every use in the tool.
struct EquilibriumOptions {
  // Iteration limit of one TP solve (each phase change restarts nothing; the count is shared).
  int max_iterations = 200;
  // Convergence: max over elements of |b_k(products) - b_k(feed)| / b_k(feed), reached with a full
  // Newton step. 1e-12 leaves two decades of margin to the 1e-10 the tool promises.
  double element_tolerance = 1e-12;
  // HP: Newton steps on T, and the enthalpy tolerance relative to the heat capacity (|dH| / cp, K).
  int max_temperature_iterations = 50;
  double temperature_tolerance_K = 1e-6;
};

class EquilibriumSolver {
 public:
  // Built once per (database, element set, candidate list); immutable; solve_*() are const and
  // thread-safe. The solver copies the records it uses: it does not refer to `db` afterwards. `candidates` empty =
  // every database species whose elements are all among those with a nonzero amount in `elements_present`. Throws
  // units::InputError (field "species") for an unknown candidate, a candidate containing an element not present, a
  // duplicate, or an element present in the feed that no candidate contains.
  EquilibriumSolver(const SpeciesDatabase& db, const ElementAmounts& elements_present,
                    std::vector<std::string> candidates = {}, EquilibriumOptions options = {});

  // Equilibrium at T and P. `b` may only hold elements present at construction (zero amounts are
  // allowed: that element's row and its species are dropped for this solve). Throws
  // units::InputError for bad T, P or b (temperature outside a candidate's data range, non-positive
  // pressure, empty or negative b, an element unknown to this solver, element proportions the
  // candidates cannot hold), ConvergenceError if Newton fails. `warm_start`: a result of this solver
  // (any b) at the same pressure and within 5 % in T seeds the iteration (its element potentials,
  // moved along their temperature slopes); any other warm start is ignored and the solve starts
  // cold (linear-programming estimate). The answer does not depend on the start.
  [[nodiscard]] EquilibriumResult solve_tp(const ElementAmounts& b, units::Temperature temperature,
                                           units::Pressure pressure,
                                           const EquilibriumResult* warm_start = nullptr) const;

  // HP: products whose enthalpy equals `target_enthalpy` (the caller subtracts any heat loss), by a
  // safeguarded Newton on T using the equilibrium heat capacity, each TP solve warm-started.
  // Throws units::InputError if the temperature would leave the candidates' common data range.
  [[nodiscard]] EquilibriumResult solve_hp(const ElementAmounts& b, units::Energy target_enthalpy,
                                           units::Pressure pressure,
                                           const EquilibriumResult* warm_start = nullptr) const;

  // Product formulas in solver order (as in EquilibriumResult::species).
  [[nodiscard]] const std::vector<std::string>& species() const { return names_; }
  // Common data range of all candidates (a TP temperature must lie inside).
  [[nodiscard]] units::Temperature min_temperature() const { return units::kelvin(min_temperature_K_); }
  [[nodiscard]] units::Temperature max_temperature() const { return units::kelvin(max_temperature_K_); }
  [[nodiscard]] const EquilibriumOptions& options() const { return options_; }

 private:
  struct Candidate {
    const Species* species = nullptr;
    std::array<double, kElementCount> atoms{};  // a_kj by known_elements() index
    bool gas = true;
    // Copies of the NASA-7 coefficients, so one ln T serves every species.
    std::array<double, 7> below_mid{};
    std::array<double, 7> above_mid{};
    double mid_K = 0.0;
    double atom_count = 0.0;                            // atoms per molecule
    int element_count = 0;                              // entries of `elements`
    std::array<std::size_t, kElementCount> elements{};  // indices k with atoms[k] > 0
  };
  friend struct EquilibriumWork;
  void check_temperature(double temperature_K) const;
  // A failed TP solve of a feed with trace elements (below 1e-6 of its atoms) retried by
  // continuation: trace elements raised to 1e-6, then lowered a decade per solve, each solve
  // warm-started from the last, down to the feed itself. Empty if there is no trace element or a
  // step fails. Only called after a failure, so converged answers are untouched.
  [[nodiscard]] std::optional<EquilibriumResult> solve_by_trace_continuation(const ElementAmounts& b,
                                                                             double temperature_K,
                                                                             double pressure_Pa) const;
  // Balance rows of every candidate made only of `active` elements; row_of[k] = row of element k or -1.
  void build_terms(const std::array<bool, kElementCount>& active, const std::array<int, kElementCount>& row_of,
                   std::vector<EquilibriumTerm>& gas, std::vector<EquilibriumTerm>& condensed) const;
  static std::array<int, kElementCount> rows_of(const std::array<bool, kElementCount>& independent);
  // Elements (by known_elements() index) whose balance rows are linearly independent over the given
  // active elements and candidates (a restricted product list may make rows dependent).
  [[nodiscard]] std::array<bool, kElementCount> independent_rows(const std::array<bool, kElementCount>& active) const;

  std::shared_ptr<const std::vector<Species>> species_;  // the candidates' records (Candidate::species)
  std::vector<Candidate> candidates_;                    // gases first, then condensed
  std::vector<std::string> names_;
  std::size_t gas_count_ = 0;
  std::array<bool, kElementCount> element_allowed_{};
  std::array<bool, kElementCount> independent_all_{};  // independent_rows(element_allowed_)
  std::shared_ptr<const EquilibriumTables> tables_;    // species rows for every element present
  double min_temperature_K_ = 0.0;
  double max_temperature_K_ = 0.0;
  double covered_low_K_ = 0.0;  // from here to max_temperature_K_ every candidate's range applies
  std::uint64_t species_key_ = 0;
  EquilibriumOptions options_;
};

}  // namespace stackbound::core
