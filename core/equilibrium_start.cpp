// The initial-estimate step of a TP solve. Warm start: a nearby solution's element potentials moved
// along their temperature slopes. Cold start: the linear-programming estimate (White, Johnson &
// Dantzig, J. Chem. Phys. 28 (1958) 751) with element potentials fitted to its major species.
#include <algorithm>
#include <cmath>
#include <limits>

#include "stackbound/core/equilibrium_steps.hpp"

namespace stackbound::core {

namespace {

using detail::Iterate;
using detail::Matrix;
using detail::Term;
using detail::TpProblem;
using detail::Vector;

// A basis species of the linear-programming start with zero amount (a degenerate vertex, e.g. O2 of
// an exactly stoichiometric feed) starts at mole fraction e^-8 (3e-4); chosen on the robustness grid
// (fewest Newton iterations), not a physical constant.
constexpr double kDegenerateBasisLogFraction = -8.0;
// Within e^0.05 (about 5 %) in T the warm start's element potentials, carried along their
// temperature slopes, seed the solve; beyond, the cold start converges as fast or faster.
constexpr double kPredictorLogTemperatureRange = 0.05;
// Simplex pivots smaller than this are not taken.
constexpr double kPivotTolerance = 1e-11;

// The linear program of the cold start: minimise sum_j n_j g_j/RT without the mixing terms, subject to
// the element balances and n >= 0. The optimal basis holds the major species; its dual values are
// first element potentials, from which every other gas species starts at ln(n_j/n) = -(g_j - a_j.pi)
// (<= 0 at the optimum). Dense two-phase simplex; artificial variables only for rows without a
// single-element species. Columns: the gases, then the condensed species, then the artificials.
class LinearProgrammingStart {
 public:
  explicit LinearProgrammingStart(const TpProblem& problem)
      : gas_(problem.gas),
        condensed_(problem.condensed),
        E_(problem.rows),
        S_(static_cast<int>(problem.gas.size())),
        n_(S_ + static_cast<int>(problem.condensed.size())) {
    crash_basis();
    set_tableau(problem.bs);
  }

  // Both phases of the simplex; false if it stalls or the element proportions are infeasible.
  bool solve() { return (artificials_ == 0 || phase_one()) && phase_two(); }

  // The start read off the optimal basis: its gas amounts and n, every other gas species at its
  // reduced cost below n, the condensed species of the basis included.
  void set_start(Iterate& iterate) const;

  [[nodiscard]] const std::array<int, kElementCount>& basis() const { return basis_; }

 private:
  [[nodiscard]] const Term& term(int j) const {
    return j < S_ ? gas_[static_cast<std::size_t>(j)] : condensed_[static_cast<std::size_t>(j - S_)];
  }
  void crash_basis();
  void set_tableau(const std::array<double, kElementCount>& bs);
  void pivot(int r, int j);
  bool run(int allowed_columns);
  bool phase_one();
  bool phase_two();

  using Tableau = Eigen::Matrix<double, Eigen::Dynamic, Eigen::Dynamic, Eigen::RowMajor>;
  const std::vector<Term>& gas_;
  const std::vector<Term>& condensed_;
  int E_;  // balance rows
  int S_;  // gas columns
  int n_;  // species columns
  int artificials_ = 0;
  int columns_ = 0;  // species, artificials and the right-hand side
  int rhs_ = 0;      // column of the right-hand side
  std::array<int, kElementCount> basis_{};
  Tableau t_;  // rows 0..E-1: B^-1 [A | I_art | b]; row E: reduced costs of the current phase
};

// Crash basis: per row, the cheapest species made of that element alone, else an artificial variable.
void LinearProgrammingStart::crash_basis() {
  for (int r = 0; r < E_; ++r) {
    basis_[static_cast<std::size_t>(r)] = -1;
    double best = std::numeric_limits<double>::infinity();
    for (int j = 0; j < n_; ++j) {
      const Term& t = term(j);
      if (t.count == 1 && t.row[0] == r && t.g / t.atoms[0] < best) {
        best = t.g / t.atoms[0];
        basis_[static_cast<std::size_t>(r)] = j;
      }
    }
    if (basis_[static_cast<std::size_t>(r)] < 0) basis_[static_cast<std::size_t>(r)] = n_ + artificials_++;
  }
}

void LinearProgrammingStart::set_tableau(const std::array<double, kElementCount>& bs) {
  columns_ = n_ + artificials_ + 1;
  rhs_ = columns_ - 1;
  t_ = Tableau::Zero(E_ + 1, columns_);
  for (int j = 0; j < n_; ++j) {
    const Term& s = term(j);
    for (int p = 0; p < s.count; ++p) t_(s.row[static_cast<std::size_t>(p)], j) = s.atoms[static_cast<std::size_t>(p)];
  }
  for (int r = 0; r < E_; ++r) {
    t_(r, rhs_) = bs[static_cast<std::size_t>(r)];
    const int j = basis_[static_cast<std::size_t>(r)];
    if (j >= n_) {
      t_(r, j) = 1.0;
    } else {
      t_.row(r) /= t_(r, j);  // a single-element species has an entry in its own row only
    }
  }
}

void LinearProgrammingStart::pivot(int r, int j) {
  t_.row(r) /= t_(r, j);
  for (int i = 0; i <= E_; ++i) {
    if (i != r && t_(i, j) != 0.0) t_.row(i) -= t_(i, j) * t_.row(r);
  }
  basis_[static_cast<std::size_t>(r)] = j;
}

// Simplex iterations over the first `allowed_columns` columns (most negative reduced cost enters,
// minimum ratio leaves) until optimal (true) or stalled / unbounded (false).
bool LinearProgrammingStart::run(int allowed_columns) {
  for (int step = 0; step < 50 + 10 * (E_ + n_); ++step) {
    int entering = -1;
    double most_negative = -1e-10;
    for (int j = 0; j < allowed_columns; ++j) {
      if (t_(E_, j) < most_negative) {
        most_negative = t_(E_, j);
        entering = j;
      }
    }
    if (entering < 0) return true;
    int leaving = -1;
    double best_ratio = std::numeric_limits<double>::infinity();
    for (int r = 0; r < E_; ++r) {
      if (t_(r, entering) > kPivotTolerance) {
        const double ratio = t_(r, rhs_) / t_(r, entering);
        if (ratio < best_ratio) {
          best_ratio = ratio;
          leaving = r;
        }
      }
    }
    if (leaving < 0) return false;  // unbounded: cannot happen with non-negative compositions
    pivot(leaving, entering);
  }
  return false;
}

// Phase 1: minimise the sum of the artificial variables, then pivot the artificials out of the basis.
bool LinearProgrammingStart::phase_one() {
  for (int r = 0; r < E_; ++r) {
    if (basis_[static_cast<std::size_t>(r)] >= n_) t_.row(E_) -= t_.row(r);
  }
  for (int j = n_; j < n_ + artificials_; ++j) t_(E_, j) = 0.0;
  if (!run(n_)) return false;
  if (-t_(E_, rhs_) > 1e-9) return false;  // infeasible proportions
  for (int r = 0; r < E_; ++r) {
    if (basis_[static_cast<std::size_t>(r)] < n_) continue;
    int j = 0;
    while (j < n_ && std::abs(t_(r, j)) <= kPivotTolerance) ++j;
    if (j == n_) return false;
    pivot(r, j);
  }
  return true;
}

// Phase 2: reduced costs d_j = c_j - c_B B^-1 A_j, minimised.
bool LinearProgrammingStart::phase_two() {
  for (int j = 0; j < columns_; ++j) t_(E_, j) = j < n_ ? term(j).g : 0.0;
  for (int r = 0; r < E_; ++r) t_.row(E_) -= term(basis_[static_cast<std::size_t>(r)]).g * t_.row(r);
  return run(n_);
}

void LinearProgrammingStart::set_start(Iterate& iterate) const {
  // Element potentials from the optimal basis (B^T pi = c_B); the reduced costs are g_j - a_j.pi.
  double gas_total = 0.0;
  for (int r = 0; r < E_; ++r) {
    const int j = basis_[static_cast<std::size_t>(r)];
    if (j < S_) gas_total += std::max(t_(r, rhs_), 0.0);
  }
  if (gas_total <= 0.0) gas_total = 0.1;  // everything condensed: the gas starts small
  iterate.lnN = std::log(gas_total);
  for (int j = 0; j < S_; ++j) iterate.lnn[static_cast<std::size_t>(j)] = iterate.lnN - std::max(t_(E_, j), 0.0);
  for (int r = 0; r < E_; ++r) {
    const int j = basis_[static_cast<std::size_t>(r)];
    const double amount = t_(r, rhs_);
    if (j < S_) {
      iterate.lnn[static_cast<std::size_t>(j)] =
          amount > 0.0 ? std::log(amount) : iterate.lnN + kDegenerateBasisLogFraction;
    } else if (amount > 0.0) {
      iterate.nc[static_cast<std::size_t>(j - S_)] = amount;
      iterate.included[static_cast<std::size_t>(j - S_)] = 1;
    }
  }
}

// Element potentials that make the basis species' chemical potentials, mixing terms included,
// exact: sum_k a_kb pi_k = g_b/RT + ln(n_b/n) (gas), = g_b/RT (condensed). Every other gas species
// then starts in equilibrium with them, unless that overfills the gas (sum x >> 1).
void polish_to_basis_potentials(const TpProblem& problem, const std::array<int, kElementCount>& basis,
                                Iterate& iterate) {
  const int E = problem.rows;
  const std::size_t S = problem.gas.size();
  Matrix basis_matrix = Matrix::Zero(E, E);
  Vector potentials_rhs(E);
  for (int r = 0; r < E; ++r) {
    const int j = basis[static_cast<std::size_t>(r)];
    const bool is_gas = j < static_cast<int>(S);
    const Term& t =
        is_gas ? problem.gas[static_cast<std::size_t>(j)] : problem.condensed[static_cast<std::size_t>(j) - S];
    for (int p = 0; p < t.count; ++p)
      basis_matrix(r, t.row[static_cast<std::size_t>(p)]) = t.atoms[static_cast<std::size_t>(p)];
    potentials_rhs[r] = t.g + (is_gas ? iterate.lnn[static_cast<std::size_t>(j)] - iterate.lnN : 0.0);
  }
  const Vector potentials = basis_matrix.partialPivLu().solve(potentials_rhs);
  if (!potentials.allFinite()) return;
  std::vector<double> polished(S);
  double fraction_sum = 0.0;
  for (std::size_t j = 0; j < S; ++j) {
    const Term& t = problem.gas[j];
    const double ln_fraction = detail::plus_potentials(-t.g, t, potentials);
    polished[j] = std::max(ln_fraction, detail::kStateFloorLogFraction) + iterate.lnN;
    fraction_sum += std::exp(std::min(ln_fraction, 50.0));
  }
  if (fraction_sum < 1.5) {
    iterate.lnn = std::move(polished);
    for (int r = 0; r < E; ++r) iterate.pi[static_cast<std::size_t>(r)] = potentials[r];
    iterate.polished = true;
  }
}

}  // namespace

detail::Iterate detail::blank_iterate(const TpProblem& problem) {
  Iterate iterate;
  iterate.lnn.assign(problem.gas.size(), 0.0);
  iterate.nc.assign(problem.condensed.size(), 0.0);
  iterate.included.assign(problem.condensed.size(), 0);
  return iterate;
}

// Returns the linear-programming start, polished; a uniform start if the simplex stalls.
detail::Iterate detail::cold_start(const TpProblem& problem) {
  Iterate iterate = blank_iterate(problem);
  LinearProgrammingStart linear_program(problem);
  if (!linear_program.solve()) {
    const double each = std::log(0.1 / static_cast<double>(problem.gas.size()));
    std::fill(iterate.lnn.begin(), iterate.lnn.end(), each);
    return iterate;
  }
  linear_program.set_start(iterate);
  polish_to_basis_potentials(problem, linear_program.basis(), iterate);
  return iterate;
}

detail::Iterate EquilibriumWork::initial_estimate(const EquilibriumSolver& solver, const detail::TpProblem& problem,
                                                  const EquilibriumResult* warm) {
  if (warm != nullptr && warm_start_applies(solver, problem, *warm)) {
    detail::Iterate iterate = detail::blank_iterate(problem);
    if (warm_start(solver, problem, *warm, iterate)) return iterate;
  }
  return detail::cold_start(problem);
}

// A warm start far from T (a sweep's jump) converges slower than the linear-programming start; so
// does one at another pressure, where the predicted mole fractions would not sum to 1. It must come
// from this solver's product list and carry temperature slopes.
bool EquilibriumWork::warm_start_applies(const EquilibriumSolver& solver, const detail::TpProblem& problem,
                                         const EquilibriumResult& warm) {
  return warm.species_key == solver.species_key_ && warm.moles.size() == solver.names_.size() &&
         std::abs(std::log(warm.temperature_K / problem.temperature_K)) <= kPredictorLogTemperatureRange &&
         std::abs(std::log(problem.pressure_Pa / warm.pressure_Pa)) <= 1e-12 && std::isfinite(warm.gas_moles_slope);
}

// Warm start: the warm start's element potentials carried to the new T along their temperature
// slopes (a first-order predictor) give every gas amount at once, in equilibrium with each other:
// ln n_j = ln n - g_j/RT + sum_k a_kj pi_k. Each element present now must have been present then.
// Returns false (iterate untouched) if the warm start cannot seed this problem.
bool EquilibriumWork::warm_start(const EquilibriumSolver& solver, const detail::TpProblem& problem,
                                 const EquilibriumResult& warm, detail::Iterate& iterate) {
  const int E = problem.rows;
  const double log_temperature_step = std::log(problem.temperature_K / warm.temperature_K);
  bool usable = true;
  for (int r = 0; r < E && usable; ++r) {
    const std::size_t k = problem.element_of_row[static_cast<std::size_t>(r)];
    bool carried = false;
    for (std::size_t i = 0; i < solver.candidates_.size() && !carried; ++i) {
      carried = solver.candidates_[i].atoms[k] > 0.0 && warm.moles[i] > 0.0;
    }
    usable = carried && std::isfinite(warm.element_potentials[k]) && std::isfinite(warm.element_potential_slopes[k]);
  }
  double atoms = 0.0;
  for (std::size_t i = 0; i < solver.candidates_.size(); ++i) atoms += solver.candidates_[i].atom_count * warm.moles[i];
  double gas_total = 0.0;
  for (const detail::Term& t : problem.gas) gas_total += warm.moles[t.candidate];
  if (!(usable && atoms > 0.0 && std::isfinite(atoms) && gas_total > 0.0)) return false;

  for (int r = 0; r < E; ++r) {
    const std::size_t k = problem.element_of_row[static_cast<std::size_t>(r)];
    iterate.pi[static_cast<std::size_t>(r)] =
        warm.element_potentials[k] + warm.element_potential_slopes[k] * log_temperature_step;
  }
  iterate.lnN = std::log(gas_total / atoms) + warm.gas_moles_slope * log_temperature_step;
  for (std::size_t j = 0; j < problem.gas.size(); ++j) {
    const detail::Term& t = problem.gas[j];
    const double ln_fraction = detail::plus_potentials(-t.g, t, iterate.pi);
    iterate.lnn[j] = std::max(ln_fraction, detail::kStateFloorLogFraction) + iterate.lnN;
  }
  std::size_t count = 0;
  for (std::size_t c = 0; c < problem.condensed.size(); ++c) {
    const double x = warm.moles[problem.condensed[c].candidate] / atoms;
    if (x > 0.0 && count < static_cast<std::size_t>(E)) {
      iterate.nc[c] = x;
      iterate.included[c] = 1;
      ++count;
    }
  }
  iterate.polished = true;
  return true;
}

}  // namespace stackbound::core
