// The Newton iteration of a TP solve (NASA RP-1311, ch. 2-3, TP form). Each pass assembles the Newton
// system at the current iterate, then either stops (converged, and no absent condensed species may
// enter), admits a condensed species, extrapolates a slow step, or takes a Newton step under the
// RP-1311 step control (a condensed species whose amount goes negative leaves).
#include <algorithm>
#include <cmath>
#include <limits>

#include "stackbound/core/equilibrium_steps.hpp"

namespace stackbound::core {

namespace {

using detail::Iterate;
using detail::NewtonFactorisation;
using detail::NewtonProgress;
using detail::NewtonSystem;
using detail::Term;
using detail::TpProblem;
using detail::Vector;

// Step control of NASA RP-1311 (eqs. 3.1-3.3): a species above mole fraction 1e-8 may grow by at most
// e^2 per step (and n by e^0.4); a trace species may rise to at most mole fraction 1e-4 in one step.
constexpr double kTraceLogFraction = -18.420680743952367;        // ln 1e-8
constexpr double kTraceCeilingLogFraction = -9.210340371976184;  // ln 1e-4
// Condensed phase entry: g_c/RT - sum_k a_kc pi_k below this (dimensionless) admits the species.
constexpr double kPhaseEntryTolerance = -1e-10;
constexpr int kMaxPhaseChanges = 20;
// A full Newton step that leaves more than this fraction of the residual triggers step extrapolation.
constexpr double kSlowRatio = 0.2;

[[noreturn]] void fail(const TpProblem& problem, const char* reason, int iterations, double element_residual) {
  throw ConvergenceError(reason, iterations, element_residual, problem.temperature_K, problem.pressure_Pa);
}

// --- Newton system

// Assembles the gas part of the RP-1311 system (eqs. 2.24-2.26, TP form) at the iterate: mu_j/RT, the
// amounts entered, the lower triangle of the element rows with their right-hand sides, and the gas
// part of each balance. Returns false if leaving out the negligible species (`skip_traces`) left a
// balance row empty.
bool assemble_gas(const TpProblem& problem, const Iterate& iterate, bool skip_traces, NewtonSystem& system) {
  const int E = problem.rows;
  int included_count = 0;
  for (std::size_t c = 0; c < problem.condensed.size(); ++c) {
    if (iterate.included[c] != 0) system.condensed_position[c] = E + included_count++;
  }
  system.included_count = included_count;
  system.dim = E + included_count + 1;
  system.M.setZero(system.dim, system.dim);
  system.rhs.setZero(system.dim);
  system.bgas = {};
  double sum_n = 0.0;
  double sum_nmu = 0.0;
  for (std::size_t j = 0; j < problem.gas.size(); ++j) {
    const Term& t = problem.gas[j];
    const double ln_fraction = iterate.lnn[j] - iterate.lnN;
    const double muj = t.g + ln_fraction;
    system.mu[j] = muj;
    if (skip_traces && iterate.lnn[j] < t.negligible_ln_moles) {
      system.n[j] = 0.0;
      continue;
    }
    const double nj = std::exp(std::max(ln_fraction, detail::kMatrixFloorLogFraction) + iterate.lnN);
    system.n[j] = nj;
    sum_n += nj;
    sum_nmu += nj * muj;
    for (int p = 0; p < t.count; ++p) {
      const int kp = t.row[static_cast<std::size_t>(p)];
      const double an = t.atoms[static_cast<std::size_t>(p)] * nj;
      system.bgas[static_cast<std::size_t>(kp)] += an;
      system.rhs[kp] += an * muj;
      for (int q = 0; q <= p; ++q) {
        system.M(kp, t.row[static_cast<std::size_t>(q)]) += an * t.atoms[static_cast<std::size_t>(q)];
      }
    }
  }
  system.sum_n = sum_n;
  system.sum_nmu = sum_nmu;
  bool empty_row = false;
  if (skip_traces) {
    for (int r = 0; r < E; ++r) empty_row = empty_row || !(system.M(r, r) > 0.0);
  }
  return !empty_row;
}

// Completes the system: the upper triangle of the element rows, the condensed rows and columns, the
// balance residuals on the right-hand side, the total-moles row; and the residuals of the iterate.
void finish_system(const TpProblem& problem, const Iterate& iterate, NewtonSystem& system) {
  const int E = problem.rows;
  const int nrow = system.dim - 1;
  detail::Matrix& M = system.M;
  // Species rows were entered in increasing order, so only the lower triangle (k >= i) was filled.
  for (int k = 0; k < E; ++k) {
    for (int i = 0; i < k; ++i) M(i, k) = M(k, i);
  }
  system.N = std::exp(iterate.lnN);
  std::array<double, kElementCount> residual{};
  for (std::size_t r = 0; r < static_cast<std::size_t>(E); ++r) residual[r] = problem.bs[r] - system.bgas[r];
  for (std::size_t c = 0; c < problem.condensed.size(); ++c) {
    if (iterate.included[c] == 0) continue;
    const Term& t = problem.condensed[c];
    const int pos = system.condensed_position[c];
    for (int p = 0; p < t.count; ++p) {
      const int kp = t.row[static_cast<std::size_t>(p)];
      const double a = t.atoms[static_cast<std::size_t>(p)];
      residual[static_cast<std::size_t>(kp)] -= a * iterate.nc[c];
      M(kp, pos) = a;
      M(pos, kp) = a;
    }
    system.rhs[pos] = t.g;
  }
  system.element_residual = 0.0;
  for (int r = 0; r < E; ++r) {
    const std::size_t ur = static_cast<std::size_t>(r);
    system.element_residual = std::max(system.element_residual, std::abs(residual[ur]) / problem.bs[ur]);
    system.rhs[r] += residual[ur];
    M(r, nrow) = system.bgas[ur];
    M(nrow, r) = system.bgas[ur];
  }
  M(nrow, nrow) = system.sum_n - system.N;
  system.rhs[nrow] = system.N - system.sum_n + system.sum_nmu;
  system.moles_residual = std::abs(system.N - system.sum_n) / system.N;
}

// --- Convergence test and condensed-phase test

// Balances and total moles within the tolerance (the caller asks for a full Newton step as well).
bool converged(const NewtonSystem& system, const EquilibriumOptions& options) {
  return system.element_residual <= options.element_tolerance && system.moles_residual <= options.element_tolerance;
}

// RP-1311 sec. 3.4: the absent condensed species with the most negative affinity g_c/RT - a_c.pi below
// kPhaseEntryTolerance, or -1 (none, or the phase rule allows no more condensed species).
int entering_condensed(const TpProblem& problem, const Iterate& iterate, const NewtonSystem& system) {
  int entering = -1;
  if (system.included_count >= problem.rows) return entering;
  double most_negative = kPhaseEntryTolerance;
  for (std::size_t c = 0; c < problem.condensed.size(); ++c) {
    if (iterate.included[c] != 0) continue;
    const Term& t = problem.condensed[c];
    double affinity = t.g;
    for (int p = 0; p < t.count; ++p) {
      affinity -= t.atoms[static_cast<std::size_t>(p)] *
                  iterate.pi[static_cast<std::size_t>(t.row[static_cast<std::size_t>(p)])];
    }
    if (affinity < most_negative) {
      most_negative = affinity;
      entering = static_cast<int>(c);
    }
  }
  return entering;
}

// A phase change (entry or exit) restarts the step counting of the extrapolation; too many fail.
void count_phase_change(const TpProblem& problem, const NewtonSystem& system, NewtonProgress& progress) {
  progress.full_step = false;
  progress.previous_full_step = false;
  if (++progress.phase_changes > kMaxPhaseChanges) {
    fail(problem, "condensed species keep entering and leaving", progress.iterations, system.element_residual);
  }
}

// --- Step extrapolation

// The worst residual (balances and total moles) at the state t times the last change of (pi, n, n_c)
// beyond the current one, every gas amount following from (pi, n) exactly; infinite if a condensed
// amount would not stay positive. `adopt`: the iterate moves to that state.
double extrapolated_residual(const TpProblem& problem, double t, bool adopt, Iterate& iterate,
                             NewtonProgress& progress) {
  const std::size_t E = static_cast<std::size_t>(problem.rows);
  const double lnN_t = iterate.lnN + t * (iterate.lnN - progress.lnN_old);
  std::array<double, kElementCount> pi_t{};
  for (std::size_t r = 0; r < E; ++r) pi_t[r] = iterate.pi[r] + t * (iterate.pi[r] - progress.pi_old[r]);
  std::array<double, kElementCount> b_t{};
  double sum = 0.0;
  for (std::size_t j = 0; j < problem.gas.size(); ++j) {
    const Term& term = problem.gas[j];
    const double ln_fraction = detail::plus_potentials(-term.g, term, pi_t);
    const double nj = std::exp(std::max(ln_fraction, detail::kMatrixFloorLogFraction) + lnN_t);
    if (adopt) iterate.lnn[j] = std::max(ln_fraction, detail::kStateFloorLogFraction) + lnN_t;
    sum += nj;
    for (int p = 0; p < term.count; ++p) {
      b_t[static_cast<std::size_t>(term.row[static_cast<std::size_t>(p)])] +=
          term.atoms[static_cast<std::size_t>(p)] * nj;
    }
  }
  for (std::size_t c = 0; c < problem.condensed.size(); ++c) {
    if (iterate.included[c] == 0) continue;
    const double amount = iterate.nc[c] + t * (iterate.nc[c] - progress.nc_old[c]);
    if (!(amount > 0.0)) return std::numeric_limits<double>::infinity();
    const Term& term = problem.condensed[c];
    for (int p = 0; p < term.count; ++p) {
      b_t[static_cast<std::size_t>(term.row[static_cast<std::size_t>(p)])] +=
          term.atoms[static_cast<std::size_t>(p)] * amount;
    }
    if (adopt) iterate.nc[c] = amount;
  }
  const double N_t = std::exp(lnN_t);
  double worst = std::abs(N_t - sum) / N_t;
  for (std::size_t r = 0; r < E; ++r) worst = std::max(worst, std::abs(problem.bs[r] - b_t[r]) / problem.bs[r]);
  if (adopt) {
    progress.pi_old = iterate.pi;
    progress.lnN_old = iterate.lnN;
    iterate.pi = pi_t;
    iterate.lnN = lnN_t;
  }
  return std::isfinite(worst) ? worst : std::numeric_limits<double>::infinity();
}

// After two full Newton steps every gas amount follows from (pi, n) exactly, and a step that cut the
// residual by less than kSlowRatio is usually one species in excess shrinking by a factor e per step
// (the linearised balance asks for n_j -> 0). Longer steps along the last (pi, n, n_c) change are tried
// (2, 4, ... 64 times it); the best residual wins. Returns true if the iterate moved.
bool extrapolate(const TpProblem& problem, double combined_residual, Iterate& iterate, NewtonProgress& progress) {
  double best_t = 0.0;
  double best = combined_residual;
  for (double t = 1.0; t <= 63.0; t = 2.0 * t + 1.0) {
    const double trial = extrapolated_residual(problem, t, false, iterate, progress);
    if (!(trial < best)) break;
    best = trial;
    best_t = t;
  }
  if (!(best_t > 0.0)) return false;
  (void)extrapolated_residual(problem, best_t, true, iterate, progress);
  progress.previous_residual = std::numeric_limits<double>::infinity();
  return true;
}

// --- Step control

// Turns `mu` into the corrections of ln n_j (from the new pi and d ln n) and returns the step length
// lambda of RP-1311 eqs. 3.1-3.3.
double step_length(const TpProblem& problem, const Iterate& iterate, double dlnN, std::vector<double>& mu) {
  double largest = 5.0 * std::abs(dlnN);
  double lambda2 = 1.0;
  for (std::size_t j = 0; j < problem.gas.size(); ++j) {
    const Term& t = problem.gas[j];
    const double dj = detail::plus_potentials(-mu[j] + dlnN, t, iterate.pi);
    mu[j] = dj;
    if (dj <= 0.0) continue;
    const double ln_fraction = iterate.lnn[j] - iterate.lnN;
    if (ln_fraction <= kTraceLogFraction) {
      const double rise = dj - dlnN;
      if (rise > 0.0) lambda2 = std::min(lambda2, (kTraceCeilingLogFraction - ln_fraction) / rise);
    } else {
      largest = std::max(largest, dj);
    }
  }
  const double lambda1 = largest > 2.0 ? 2.0 / largest : 1.0;
  return std::min({1.0, lambda1, lambda2});
}

// Moves the iterate by lambda times the correction `x`; a condensed species whose amount does not stay
// positive leaves the system (RP-1311 sec. 3.4).
void apply_step(const TpProblem& problem, const Vector& x, double lambda, double dlnN, const NewtonSystem& system,
                NewtonProgress& progress, Iterate& iterate) {
  const double lnN_new = iterate.lnN + lambda * dlnN;
  for (std::size_t j = 0; j < problem.gas.size(); ++j) {
    iterate.lnn[j] = std::max(iterate.lnn[j] + lambda * system.mu[j], lnN_new + detail::kStateFloorLogFraction);
  }
  iterate.lnN = lnN_new;
  for (std::size_t c = 0; c < problem.condensed.size(); ++c) {
    if (iterate.included[c] == 0) continue;
    iterate.nc[c] += lambda * x[system.condensed_position[c]];
    if (!(iterate.nc[c] > 0.0)) {
      iterate.nc[c] = 0.0;
      iterate.included[c] = 0;
      count_phase_change(problem, system, progress);
    }
  }
}

// One Newton step: solve the system, take the new element potentials, and move the amounts under
// the step control.
void newton_step(const TpProblem& problem, NewtonSystem& system, NewtonFactorisation& lu, NewtonProgress& progress,
                 Iterate& iterate) {
  lu.compute(system.M, problem.rows, std::max(system.sum_n, system.N));
  const Vector x = lu.solve(system.rhs);
  ++progress.iterations;
  if (!x.allFinite()) fail(problem, "singular Newton system", progress.iterations, system.element_residual);
  for (int r = 0; r < problem.rows; ++r) iterate.pi[static_cast<std::size_t>(r)] = x[r];
  const double dlnN = x[system.dim - 1];
  const double lambda = step_length(problem, iterate, dlnN, system.mu);
  progress.full_step = lambda >= 1.0;
  apply_step(problem, x, lambda, dlnN, system, progress, iterate);
}

// The state before a Newton step, for a later extrapolation along it.
void remember_state(double combined_residual, const Iterate& iterate, NewtonProgress& progress) {
  progress.previous_residual = combined_residual;
  progress.previous_full_step = progress.full_step;
  progress.pi_old = iterate.pi;
  progress.lnN_old = iterate.lnN;
  progress.nc_old = iterate.nc;
}

}  // namespace

detail::NewtonOutcome detail::solve_newton(const TpProblem& problem, const EquilibriumOptions& options,
                                           Iterate& iterate) {
  NewtonOutcome outcome;
  NewtonSystem& system = outcome.system;
  system.n.assign(problem.gas.size(), 0.0);
  system.mu.assign(problem.gas.size(), 0.0);
  system.condensed_position.assign(problem.condensed.size(), 0);
  NewtonProgress progress;
  progress.full_step = iterate.polished;
  progress.lnN_old = iterate.lnN;
  progress.nc_old.assign(problem.condensed.size(), 0.0);
  while (true) {
    if (!assemble_gas(problem, iterate, progress.skip_traces, system)) {
      progress.skip_traces = false;  // a balance row went empty: assemble every species
      continue;
    }
    progress.skip_traces = true;
    finish_system(problem, iterate, system);
    if (progress.full_step && converged(system, options)) {
      // Converged for this set of condensed species; test the absent ones.
      const int entering = entering_condensed(problem, iterate, system);
      if (entering < 0) break;
      count_phase_change(problem, system, progress);
      iterate.included[static_cast<std::size_t>(entering)] = 1;
      iterate.nc[static_cast<std::size_t>(entering)] = 0.0;
      continue;
    }
    if (progress.iterations >= options.max_iterations) {
      fail(problem, "iteration limit reached", progress.iterations, system.element_residual);
    }
    const double combined_residual = std::max(system.element_residual, system.moles_residual);
    if (progress.full_step && progress.previous_full_step &&
        combined_residual > kSlowRatio * progress.previous_residual &&
        extrapolate(problem, combined_residual, iterate, progress)) {
      continue;  // re-assemble at the extrapolated state
    }
    remember_state(combined_residual, iterate, progress);
    newton_step(problem, system, outcome.lu, progress, iterate);
  }
  outcome.iterations = progress.iterations;
  return outcome;
}

}  // namespace stackbound::core
