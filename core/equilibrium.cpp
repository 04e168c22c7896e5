// The equilibrium solver's class: its construction (the candidates, their checks and their common
// temperature range), the result and error types, and the TP solve's outline. The steps of a solve
// live in the files named in core/equilibrium_steps.hpp.
#include "stackbound/core/equilibrium.hpp"

#include <fmt/format.h>

#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <limits>

#include "stackbound/core/elements.hpp"
#include "stackbound/core/equilibrium_steps.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::core {

std::string detail::element_list(const std::array<bool, kElementCount>& mask) {
  std::string text;
  for (std::size_t k = 0; k < kElementCount; ++k) {
    if (!mask[k]) continue;
    if (!text.empty()) text += ", ";
    text += known_elements()[k].symbol;
  }
  return text;
}

namespace {

using detail::element_list;

// Non-negative least squares min |A x - b|, x >= 0 (Lawson & Hanson, Solving Least Squares Problems,
// 1974, ch. 23); used only to explain a failed solve (are the element proportions reachable at all?).
Eigen::VectorXd nonnegative_least_squares(const Eigen::MatrixXd& A, const Eigen::VectorXd& b) {
  const Eigen::Index m = A.cols();
  Eigen::VectorXd x = Eigen::VectorXd::Zero(m);
  std::vector<bool> passive(static_cast<std::size_t>(m), false);
  const double tolerance = 1e-12 * std::max(1.0, b.cwiseAbs().maxCoeff());
  for (int outer = 0; outer < 3 * m + 10; ++outer) {
    const Eigen::VectorXd w = A.transpose() * (b - A * x);
    Eigen::Index best = -1;
    double best_w = tolerance;
    for (Eigen::Index j = 0; j < m; ++j) {
      if (!passive[static_cast<std::size_t>(j)] && w[j] > best_w) {
        best_w = w[j];
        best = j;
      }
    }
    if (best < 0) break;
    passive[static_cast<std::size_t>(best)] = true;
    for (int inner = 0; inner < 3 * m + 10; ++inner) {
      std::vector<Eigen::Index> set;
      for (Eigen::Index j = 0; j < m; ++j) {
        if (passive[static_cast<std::size_t>(j)]) set.push_back(j);
      }
      Eigen::MatrixXd Ap(A.rows(), static_cast<Eigen::Index>(set.size()));
      for (std::size_t i = 0; i < set.size(); ++i) Ap.col(static_cast<Eigen::Index>(i)) = A.col(set[i]);
      const Eigen::VectorXd z = Ap.completeOrthogonalDecomposition().solve(b);
      if ((z.array() > 0.0).all()) {
        x.setZero();
        for (std::size_t i = 0; i < set.size(); ++i) x[set[i]] = z[static_cast<Eigen::Index>(i)];
        break;
      }
      double alpha = 1.0;
      for (std::size_t i = 0; i < set.size(); ++i) {
        const double zi = z[static_cast<Eigen::Index>(i)];
        const double xi = x[set[i]];
        if (zi <= 0.0 && xi - zi > 0.0) alpha = std::min(alpha, xi / (xi - zi));
      }
      for (std::size_t i = 0; i < set.size(); ++i) {
        x[set[i]] += alpha * (z[static_cast<Eigen::Index>(i)] - x[set[i]]);
        if (x[set[i]] <= 1e-15) {
          x[set[i]] = 0.0;
          passive[static_cast<std::size_t>(set[i])] = false;
        }
      }
    }
  }
  return x;
}

}  // namespace

// ---------------------------------------------------------------------------------------------------
// EquilibriumResult, ConvergenceError

std::size_t EquilibriumResult::index_of(std::string_view formula) const {
  return static_cast<std::size_t>(std::find(species.begin(), species.end(), formula) - species.begin());
}

double EquilibriumResult::mole_fraction(std::string_view formula) const {
  const std::size_t i = index_of(formula);
  return i < mole_fractions.size() ? mole_fractions[i] : 0.0;
}

double EquilibriumResult::moles_of(std::string_view formula) const {
  const std::size_t i = index_of(formula);
  return i < moles.size() ? moles[i] : 0.0;
}

ConvergenceError::ConvergenceError(const std::string& reason, int iterations, double element_residual,
                                   double temperature_K, double pressure_Pa)
    : std::runtime_error(fmt::format("equilibrium did not converge at T = {:g} K, P = {:g} Pa: {} (after {} "
                                     "iterations, element-balance residual {:.3g})",
                                     temperature_K, pressure_Pa, reason, iterations, element_residual)),
      iterations_(iterations),
      element_residual_(element_residual),
      temperature_K_(temperature_K),
      pressure_Pa_(pressure_Pa) {}

// ---------------------------------------------------------------------------------------------------
// Construction

namespace {

// The elements with a positive amount; throws for a negative or non-finite amount, or no atoms at all.
std::array<bool, kElementCount> allowed_elements(const ElementAmounts& elements_present) {
  std::array<bool, kElementCount> allowed{};
  for (std::size_t k = 0; k < kElementCount; ++k) {
    const double amount = elements_present.moles[k];
    if (!std::isfinite(amount) || amount < 0.0) {
      throw units::InputError(fmt::format("element amounts: {} = {}: must be a finite number >= 0 mol",
                                          known_elements()[k].symbol, amount));
    }
    allowed[k] = amount > 0.0;
  }
  if (std::none_of(allowed.begin(), allowed.end(), [](bool b) { return b; })) {
    throw units::InputError("element amounts: every element amount is zero; the feed holds no atoms");
  }
  return allowed;
}

// The database species named in `candidates`, or every species made only of `allowed` elements if
// the list is empty. Throws for an unknown or repeated name, or a species with an element not in the feed.
std::vector<const Species*> chosen_species(const SpeciesDatabase& db, const std::vector<std::string>& candidates,
                                           const std::array<bool, kElementCount>& allowed) {
  std::vector<const Species*> chosen;
  if (candidates.empty()) {
    std::vector<std::string> symbols;
    for (std::size_t k = 0; k < kElementCount; ++k) {
      if (allowed[k]) symbols.emplace_back(known_elements()[k].symbol);
    }
    return db.made_only_of(symbols);
  }
  for (const std::string& name : candidates) {
    const Species& species = db.at(name, "species");
    if (std::find(chosen.begin(), chosen.end(), &species) != chosen.end()) {
      throw units::InputError(fmt::format("species = \"{}\": listed twice", name));
    }
    for (const ElementCount& count : species.composition()) {
      if (!allowed[element_index(count.element)]) {
        throw units::InputError(
            fmt::format("species = \"{}\": contains {}, which is not in the feed (the feed's elements: {}); remove it "
                        "from the product list",
                        name, count.element, element_list(allowed)));
      }
    }
    chosen.push_back(&species);
  }
  return chosen;
}

// FNV-1a hash of the product list: a warm start must come from a solver with the same products.
std::uint64_t product_list_key(const std::vector<std::string>& names) {
  std::uint64_t key = 1469598103934665603ULL;
  for (const std::string& name : names) {
    for (const char ch : name + '\n') {
      key = (key ^ static_cast<unsigned char>(ch)) * 1099511628211ULL;
    }
  }
  return key;
}

}  // namespace

EquilibriumSolver::EquilibriumSolver(const SpeciesDatabase& db, const ElementAmounts& elements_present,
                                     std::vector<std::string> candidates, EquilibriumOptions options)
    : options_(options) {
  if (known_elements().size() != kElementCount) {
    throw std::logic_error("EquilibriumSolver: kElementCount does not match known_elements()");
  }
  element_allowed_ = allowed_elements(elements_present);
  EquilibriumWork::add_candidates(*this, chosen_species(db, candidates, element_allowed_));
  EquilibriumWork::check_products(*this, candidates);
  EquilibriumWork::set_temperature_range(*this);
  independent_all_ = independent_rows(element_allowed_);
  auto tables = std::make_shared<EquilibriumTables>();
  build_terms(element_allowed_, rows_of(independent_all_), tables->gas, tables->condensed);
  tables_ = std::move(tables);
}

EquilibriumWork::Candidate EquilibriumWork::candidate_of(const Species& species) {
  Candidate candidate;
  candidate.species = &species;
  candidate.gas = species.is_gas();
  for (const ElementCount& count : species.composition()) {
    candidate.atoms[element_index(count.element)] += count.count;
  }
  for (std::size_t k = 0; k < kElementCount; ++k) {
    if (candidate.atoms[k] == 0.0) continue;
    candidate.atom_count += candidate.atoms[k];
    candidate.elements[static_cast<std::size_t>(candidate.element_count++)] = k;
  }
  candidate.below_mid = species.record().below_mid;
  candidate.above_mid = species.record().above_mid;
  candidate.mid_K = species.range().mid.value();
  return candidate;
}

void EquilibriumWork::add_candidates(EquilibriumSolver& solver, const std::vector<const Species*>& chosen) {
  // The solver keeps its own copies of the species records, so it may outlive the database.
  auto owned = std::make_shared<std::vector<Species>>();
  owned->reserve(chosen.size());
  for (int pass = 0; pass < 2; ++pass) {  // gases first, then condensed
    for (const Species* chosen_species : chosen) {
      if (chosen_species->is_gas() != (pass == 0)) continue;
      owned->push_back(*chosen_species);
      const Species& species = owned->back();
      solver.candidates_.push_back(candidate_of(species));
      solver.names_.push_back(species.formula());
    }
  }
  solver.species_ = std::move(owned);
  solver.species_key_ = product_list_key(solver.names_);
  solver.gas_count_ = static_cast<std::size_t>(
      std::count_if(solver.candidates_.begin(), solver.candidates_.end(), [](const Candidate& c) { return c.gas; }));
}

void EquilibriumWork::check_products(const EquilibriumSolver& solver, const std::vector<std::string>& candidates) {
  std::string listed;
  for (const std::string& name : candidates) listed += (listed.empty() ? "" : ",") + name;
  if (solver.gas_count_ == 0 && candidates.empty()) {
    throw units::InputError(fmt::format("feed: its elements ({}) form no gas species in the species data, and the "
                                        "equilibrium needs a gas phase; add a gas to the feed (e.g. O2 or N2)",
                                        element_list(solver.element_allowed_)));
  }
  if (solver.gas_count_ == 0) {
    throw units::InputError(fmt::format("species = \"{}\": the product list needs at least one gas species", listed));
  }
  for (std::size_t k = 0; k < kElementCount; ++k) {
    if (!solver.element_allowed_[k]) continue;
    const bool held = std::any_of(solver.candidates_.begin(), solver.candidates_.end(),
                                  [k](const Candidate& c) { return c.atoms[k] > 0.0; });
    if (!held) {
      throw units::InputError(fmt::format(
          "species = \"{}\": no product contains {}, which is in the feed; the product list cannot hold the "
          "feed's elements ({})",
          candidates.empty() ? std::string("(all)") : listed, known_elements()[k].symbol,
          element_list(solver.element_allowed_)));
    }
  }
}

void EquilibriumWork::set_temperature_range(EquilibriumSolver& solver) {
  solver.min_temperature_K_ = 0.0;
  solver.max_temperature_K_ = std::numeric_limits<double>::infinity();
  bool all_cover_reference = true;
  for (const Candidate& c : solver.candidates_) {
    solver.min_temperature_K_ = std::max(solver.min_temperature_K_, c.species->range().low.value());
    solver.max_temperature_K_ = std::min(solver.max_temperature_K_, c.species->range().high.value());
    all_cover_reference = all_cover_reference && c.species->covers(units::kelvin(units::kReferenceTemperature_K));
  }
  solver.covered_low_K_ = solver.min_temperature_K_;
  if (all_cover_reference) {
    solver.min_temperature_K_ = std::min(solver.min_temperature_K_, units::kReferenceTemperature_K);
  }
  if (!(solver.min_temperature_K_ < solver.max_temperature_K_)) {
    throw units::InputError(
        fmt::format("species: the data ranges of the product candidates do not overlap "
                    "(common range {:g}-{:g} K)",
                    solver.min_temperature_K_, solver.max_temperature_K_));
  }
}

std::vector<const EquilibriumWork::Candidate*> EquilibriumWork::usable_candidates(
    const EquilibriumSolver& solver, const std::array<bool, kElementCount>& active) {
  std::vector<const Candidate*> usable;
  for (const Candidate& c : solver.candidates_) {
    bool ok = true;
    for (std::size_t k = 0; k < kElementCount; ++k) ok = ok && (c.atoms[k] == 0.0 || active[k]);
    if (ok) usable.push_back(&c);
  }
  return usable;
}

std::array<bool, kElementCount> EquilibriumSolver::independent_rows(
    const std::array<bool, kElementCount>& active) const {
  std::vector<std::size_t> elements;
  for (std::size_t k = 0; k < kElementCount; ++k) {
    if (active[k]) elements.push_back(k);
  }
  const std::vector<const Candidate*> usable = EquilibriumWork::usable_candidates(*this, active);
  Eigen::MatrixXd formula(static_cast<Eigen::Index>(usable.size()), static_cast<Eigen::Index>(elements.size()));
  for (std::size_t j = 0; j < usable.size(); ++j) {
    for (std::size_t r = 0; r < elements.size(); ++r) {
      formula(static_cast<Eigen::Index>(j), static_cast<Eigen::Index>(r)) = usable[j]->atoms[elements[r]];
    }
  }
  std::array<bool, kElementCount> independent{};
  if (usable.empty()) return independent;
  const Eigen::ColPivHouseholderQR<Eigen::MatrixXd> qr(formula);
  const Eigen::Index rank = qr.rank();
  for (Eigen::Index i = 0; i < rank; ++i) {
    independent[elements[static_cast<std::size_t>(qr.colsPermutation().indices()[i])]] = true;
  }
  return independent;
}

void EquilibriumSolver::build_terms(const std::array<bool, kElementCount>& active,
                                    const std::array<int, kElementCount>& row_of, std::vector<EquilibriumTerm>& gas,
                                    std::vector<EquilibriumTerm>& condensed) const {
  gas.clear();
  condensed.clear();
  for (std::size_t i = 0; i < candidates_.size(); ++i) {
    const Candidate& c = candidates_[i];
    bool usable = true;
    for (std::size_t k = 0; k < kElementCount; ++k) usable = usable && (c.atoms[k] == 0.0 || active[k]);
    if (!usable) continue;
    EquilibriumTerm term;
    term.candidate = i;
    for (std::size_t k = 0; k < kElementCount; ++k) {
      if (c.atoms[k] > 0.0 && row_of[k] >= 0) {
        const std::size_t slot = static_cast<std::size_t>(term.count);
        term.row[slot] = row_of[k];
        term.atoms[slot] = c.atoms[k];
        term.log_atoms[slot] = std::log(c.atoms[k]);
        ++term.count;
      }
    }
    (c.gas ? gas : condensed).push_back(term);
  }
}

std::array<int, kElementCount> EquilibriumSolver::rows_of(const std::array<bool, kElementCount>& independent) {
  std::array<int, kElementCount> row_of{};
  int next = 0;
  for (std::size_t k = 0; k < kElementCount; ++k) row_of[k] = independent[k] ? next++ : -1;
  return row_of;
}

void EquilibriumSolver::check_temperature(double temperature_K) const {
  if (!std::isfinite(temperature_K) || temperature_K <= 0.0) {
    throw units::InputError(
        fmt::format("temperature = {:g} K: must be a finite absolute temperature > 0 K", temperature_K));
  }
  if (temperature_K >= covered_low_K_ && temperature_K <= max_temperature_K_) return;  // every record covers it
  for (const Candidate& c : candidates_) {
    if (!c.species->covers(units::kelvin(temperature_K))) {
      throw units::InputError(fmt::format(
          "temperature = {:g} K: outside the data range of product {} ({:g}-{:g} K); the product candidates "
          "together cover {:g}-{:g} K",
          temperature_K, c.species->formula(), c.species->range().low.value(), c.species->range().high.value(),
          min_temperature_K_, max_temperature_K_));
    }
  }
}

// ---------------------------------------------------------------------------------------------------
// The TP solve

EquilibriumResult EquilibriumSolver::solve_tp(const ElementAmounts& b, units::Temperature temperature,
                                              units::Pressure pressure, const EquilibriumResult* warm_start) const {
  const double temperature_K = temperature.value();
  const double pressure_Pa = pressure.value();
  try {
    return EquilibriumWork::solve(*this, b, temperature_K, pressure_Pa, warm_start);
  } catch (const ConvergenceError&) {
    if (std::optional<EquilibriumResult> rescued = solve_by_trace_continuation(b, temperature_K, pressure_Pa)) {
      return *std::move(rescued);
    }
    // A restricted product list may be unable to reach the feed's element proportions with
    // non-negative amounts; that is bad input, not a numerical failure.
    std::array<bool, kElementCount> active{};
    std::vector<std::size_t> elements;
    for (std::size_t k = 0; k < kElementCount; ++k) {
      active[k] = b.moles[k] > 0.0;
      if (active[k]) elements.push_back(k);
    }
    const std::vector<const Candidate*> usable = EquilibriumWork::usable_candidates(*this, active);
    const double total = b.total();
    Eigen::MatrixXd A(static_cast<Eigen::Index>(elements.size()), static_cast<Eigen::Index>(usable.size()));
    Eigen::VectorXd target(static_cast<Eigen::Index>(elements.size()));
    for (std::size_t r = 0; r < elements.size(); ++r) {
      target[static_cast<Eigen::Index>(r)] = b.moles[elements[r]] / total;
      for (std::size_t j = 0; j < usable.size(); ++j) {
        A(static_cast<Eigen::Index>(r), static_cast<Eigen::Index>(j)) = usable[j]->atoms[elements[r]];
      }
    }
    const Eigen::VectorXd amounts = nonnegative_least_squares(A, target);
    if ((A * amounts - target).norm() > 1e-9) {
      throw units::InputError(fmt::format(
          "species = \"{}\": these products cannot hold the feed's elements in its proportions (elements {}); "
          "add products that can",
          fmt::join(names_, ","), element_list(active)));
    }
    throw;
  }
}

EquilibriumResult EquilibriumWork::solve(const EquilibriumSolver& solver, const ElementAmounts& b_in, double T,
                                         double P, const EquilibriumResult* warm) {
  const detail::TpProblem problem = make_problem(solver, b_in, T, P);
  detail::Iterate iterate = initial_estimate(solver, problem, warm);
  detail::NewtonOutcome outcome = detail::solve_newton(problem, solver.options_, iterate);
  const detail::TemperatureDerivatives derivatives = detail::temperature_derivatives(problem, iterate, outcome);
  return make_result(solver, problem, iterate, outcome, derivatives);
}

}  // namespace stackbound::core
