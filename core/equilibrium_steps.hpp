#pragma once
// Internal to the equilibrium solver (core/equilibrium*.cpp), not part of the library's interface (not
// installed): the species rows of the Newton system, the state one TP solve passes from step to step,
// and the steps. A TP solve (EquilibriumWork::solve, core/equilibrium.cpp) runs them in this order:
//   problem           elements, balance rows and species properties at T      equilibrium_problem.cpp
//   initial estimate  warm start, or the linear-programming start, polished   equilibrium_start.cpp
//   Newton iteration  per pass: Newton system, convergence test,              equilibrium_newton.cpp
//                     condensed-phase test, step extrapolation, step control
//   result            temperature derivatives, amounts, balance checks        equilibrium_result.cpp
// Every quantity of the iteration is per mole of feed atoms (the problem's `scale`).
// The steps keep the floating-point operations of the solver, term for term and in the same order:
// the robustness grid's results are fixed to the last bit (tests/core/equilibrium_fingerprint_test.cpp).

#include <Eigen/Dense>
#include <array>
#include <cmath>
#include <cstddef>
#include <limits>
#include <string>
#include <vector>

#include "stackbound/core/equilibrium.hpp"

namespace stackbound::core {

// One product species as the Newton system sees it: its balance rows and, per solve, its
// dimensionless properties at T.
struct EquilibriumTerm {
  std::size_t candidate = 0;
  double g = 0.0;   // gas: g/RT + ln(P/P0); condensed: g/RT
  double h = 0.0;   // h/RT
  double cp = 0.0;  // cp/R
  int count = 0;    // number of independent balance rows the species enters
  // ln n_j below which the species' share of every balance it enters is under e^-60 (about 1e-26):
  // it is left out of the Newton matrix (its ln n_j is still updated exactly).
  double negligible_ln_moles = -std::numeric_limits<double>::infinity();
  std::array<int, kElementCount> row{};
  std::array<double, kElementCount> atoms{};
  std::array<double, kElementCount> log_atoms{};
};

// Rows of every candidate when every element present at construction is present in the solve.
struct EquilibriumTables {
  std::vector<EquilibriumTerm> gas;
  std::vector<EquilibriumTerm> condensed;
};

namespace detail {

using Term = EquilibriumTerm;

// Largest Newton system: 7 element rows + at most 7 condensed rows (phase rule) + the total-moles row.
inline constexpr int kMaxDimension = 2 * static_cast<int>(kElementCount) + 2;
using Matrix = Eigen::Matrix<double, Eigen::Dynamic, Eigen::Dynamic, 0, kMaxDimension, kMaxDimension>;
using Vector = Eigen::Matrix<double, Eigen::Dynamic, 1, 0, kMaxDimension, 1>;

// Amounts below e^-690 of n (about 1e-300) enter the Newton matrix at that floor, so that no balance
// row becomes exactly zero; the reported amounts keep their own (smaller) values.
inline constexpr double kMatrixFloorLogFraction = -690.0;
// ln(n_j/n) is kept above this so that it stays a finite number.
inline constexpr double kStateFloorLogFraction = -1.0e5;

// LU factorisation (partial pivoting) of the Newton matrix with symmetric diagonal scaling, so that
// the rows of trace elements stay well conditioned.
class NewtonFactorisation {
 public:
  // `moles_scale`: the total-moles row and column are scaled by 1/sqrt(moles_scale).
  void compute(const Matrix& M, int element_rows, double moles_scale) {
    dimension_ = static_cast<int>(M.rows());
    scaling_.setOnes(dimension_);
    for (int r = 0; r < element_rows; ++r) {
      if (M(r, r) > 0.0) scaling_[r] = 1.0 / std::sqrt(M(r, r));
    }
    scaling_[dimension_ - 1] = 1.0 / std::sqrt(moles_scale);
    lu_.compute(scaling_.asDiagonal() * M * scaling_.asDiagonal());
  }
  [[nodiscard]] Vector solve(const Vector& rhs) const {
    return scaling_.asDiagonal() * lu_.solve(scaling_.asDiagonal() * rhs);
  }
  [[nodiscard]] int dimension() const { return dimension_; }

 private:
  int dimension_ = 0;
  Vector scaling_;
  Eigen::PartialPivLU<Matrix> lu_;
};

// One TP solve: the balance rows (the independent ones among the elements with a positive amount),
// the element amounts per mole of feed atoms, and the usable species with their properties at T.
struct TpProblem {
  double temperature_K = 0.0;
  double pressure_Pa = 0.0;
  std::array<bool, kElementCount> active{};       // by known_elements() index: amount > 0
  std::array<bool, kElementCount> independent{};  // active elements that have a balance row
  std::array<int, kElementCount> row_of{};        // balance row of element k, or -1
  std::array<std::size_t, kElementCount> element_of_row{};
  int rows = 0;                               // number of balance rows, E
  ElementAmounts b;                           // the feed's element amounts, mol
  double scale = 0.0;                         // mol of feed atoms
  std::array<double, kElementCount> bs{};     // b per row / scale
  std::array<double, kElementCount> ln_bs{};  // ln bs
  std::vector<Term> gas;
  std::vector<Term> condensed;
};

// The unknowns of the iteration: ln n_j of the gases, ln n, the condensed amounts (those included in
// the system) and the element potentials pi per row.
struct Iterate {
  std::vector<double> lnn;
  double lnN = std::log(0.1);
  std::vector<double> nc;
  std::vector<char> included;
  std::array<double, kElementCount> pi{};
  // True if the gas amounts already satisfy mu_j/RT = sum_k a_kj pi_k (the first step may count as full).
  bool polished = false;
};

// The state a start begins from: ln n_j = 0, n = 0.1, no condensed species, pi = 0.
[[nodiscard]] Iterate blank_iterate(const TpProblem& problem);

// The Newton system (RP-1311 eqs. 2.24-2.26, TP form) assembled at an iterate, with its residuals.
// Its vectors are sized once per solve and refilled at every assembly.
struct NewtonSystem {
  Matrix M;
  Vector rhs;
  int dim = 0;                               // rows + included condensed + 1 (total moles)
  int included_count = 0;                    // condensed species in the system
  std::vector<int> condensed_position;       // row/column of included condensed c
  std::vector<double> n;                     // gas amounts entered in M (0 for a left-out trace)
  std::vector<double> mu;                    // mu_j/RT; after the solve, the correction of ln n_j
  std::array<double, kElementCount> bgas{};  // gas part of each balance
  double sum_n = 0.0;                        // sum of n
  double sum_nmu = 0.0;                      // sum of n mu/RT
  double N = 0.0;                            // exp(ln n) at assembly
  double element_residual = std::numeric_limits<double>::infinity();
  double moles_residual = std::numeric_limits<double>::infinity();
};

// What the iteration carries from one pass to the next: counts, step kinds and the state before the
// last Newton step (for the step extrapolation).
struct NewtonProgress {
  int iterations = 0;
  int phase_changes = 0;
  bool full_step = false;   // the last step was a full Newton step
  bool skip_traces = true;  // leave negligible species out of the matrix
  bool previous_full_step = false;
  double previous_residual = std::numeric_limits<double>::infinity();
  std::array<double, kElementCount> pi_old{};
  double lnN_old = 0.0;
  std::vector<double> nc_old;
};

// The converged iteration: the system at the solution and the factorisation of the last Newton step.
struct NewtonOutcome {
  NewtonSystem system;
  NewtonFactorisation lu;
  int iterations = 0;
};

// start + sum_p a_p pi_row(p) over the species' rows, summed in row order (the order fixes the rounding).
template <class Potentials>
double plus_potentials(double start, const Term& t, const Potentials& pi) {
  double sum = start;
  for (int p = 0; p < t.count; ++p) {
    const std::size_t up = static_cast<std::size_t>(p);
    sum += t.atoms[up] * pi[t.row[up]];
  }
  return sum;
}

// "C, H, O": the symbols of the elements set in `mask` (equilibrium.cpp).
std::string element_list(const std::array<bool, kElementCount>& mask);

// --- Initial estimate (equilibrium_start.cpp)
// Cold start: the linear-programming estimate with element potentials fitted to its major species, or
// a uniform start if the simplex stalls.
[[nodiscard]] Iterate cold_start(const TpProblem& problem);

// --- Newton iteration (equilibrium_newton.cpp)
// Iterates from `iterate` to convergence (every condensed species tested); throws ConvergenceError.
[[nodiscard]] NewtonOutcome solve_newton(const TpProblem& problem, const EquilibriumOptions& options, Iterate& iterate);

// --- Result (equilibrium_result.cpp)
// d pi / d ln T, d ln n / d ln T and the heat capacities at the converged state.
struct TemperatureDerivatives {
  double frozen_cp = 0.0;                                // sum n_j cp_j/R per mole of feed atoms
  double enthalpy = 0.0;                                 // sum n_j h_j/RT per mole of feed atoms
  double equilibrium_cp = 0.0;                           // d(H/R)/dT per mole of feed atoms
  std::array<double, kElementCount> potential_slopes{};  // by known_elements() index, NaN where unknown
  double gas_moles_slope = std::numeric_limits<double>::quiet_NaN();
};
[[nodiscard]] TemperatureDerivatives temperature_derivatives(const TpProblem& problem, const Iterate& iterate,
                                                             NewtonOutcome& outcome);

}  // namespace detail

// The solver's friend: the steps that need its private members (construction and one TP solve).
struct EquilibriumWork {
  using Candidate = EquilibriumSolver::Candidate;

  // One TP solve: problem, initial estimate, Newton iteration, result (equilibrium.cpp).
  static EquilibriumResult solve(const EquilibriumSolver& solver, const ElementAmounts& b_in, double T, double P,
                                 const EquilibriumResult* warm);

  // Construction (equilibrium.cpp): the candidates in solver order (gases first), their checks and
  // their common temperature range.
  static Candidate candidate_of(const Species& species);
  static void add_candidates(EquilibriumSolver& solver, const std::vector<const Species*>& chosen);
  static void check_products(const EquilibriumSolver& solver, const std::vector<std::string>& candidates);
  static void set_temperature_range(EquilibriumSolver& solver);
  // Candidates made only of `active` elements, in solver order.
  static std::vector<const Candidate*> usable_candidates(const EquilibriumSolver& solver,
                                                         const std::array<bool, kElementCount>& active);

  // Problem (equilibrium_problem.cpp): checks T, P and b; throws units::InputError.
  static detail::TpProblem make_problem(const EquilibriumSolver& solver, const ElementAmounts& b_in, double T,
                                        double P);
  static std::array<bool, kElementCount> active_elements(const EquilibriumSolver& solver, const ElementAmounts& b_in,
                                                         double& scale);
  static void set_rows(const EquilibriumSolver& solver, detail::TpProblem& problem);
  static void set_species_at_temperature(const EquilibriumSolver& solver, detail::TpProblem& problem);

  // Initial estimate (equilibrium_start.cpp): the warm start if `warm` qualifies, else the cold start.
  static detail::Iterate initial_estimate(const EquilibriumSolver& solver, const detail::TpProblem& problem,
                                          const EquilibriumResult* warm);
  static bool warm_start_applies(const EquilibriumSolver& solver, const detail::TpProblem& problem,
                                 const EquilibriumResult& warm);
  static bool warm_start(const EquilibriumSolver& solver, const detail::TpProblem& problem,
                         const EquilibriumResult& warm, detail::Iterate& iterate);

  // Result (equilibrium_result.cpp): amounts in mol, properties, and the final balance checks.
  static EquilibriumResult make_result(const EquilibriumSolver& solver, const detail::TpProblem& problem,
                                       const detail::Iterate& iterate, const detail::NewtonOutcome& outcome,
                                       const detail::TemperatureDerivatives& derivatives);
  static void set_amounts(const EquilibriumSolver& solver, const detail::TpProblem& problem,
                          const detail::Iterate& iterate, const detail::NewtonSystem& system,
                          EquilibriumResult& result);
  static void check_balances(const EquilibriumSolver& solver, const detail::TpProblem& problem,
                             EquilibriumResult& result);
};

}  // namespace stackbound::core
