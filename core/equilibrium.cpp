#include "stackbound/core/equilibrium.hpp"

#include <fmt/format.h>

#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <limits>

#include "stackbound/core/elements.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"

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

using Term = EquilibriumTerm;

// Rows of every candidate when every element present at construction is present in the solve.
struct EquilibriumTables {
  std::vector<Term> gas;
  std::vector<Term> condensed;
};

namespace {

constexpr double kR = units::kGasConstant_J_per_mol_K;

// Largest Newton system: 7 element rows + at most 7 condensed rows (phase rule) + the total-moles row.
constexpr int kMaxDimension = 2 * static_cast<int>(kElementCount) + 2;
using Matrix = Eigen::Matrix<double, Eigen::Dynamic, Eigen::Dynamic, 0, kMaxDimension, kMaxDimension>;
using Vector = Eigen::Matrix<double, Eigen::Dynamic, 1, 0, kMaxDimension, 1>;

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

// Step control of NASA RP-1311 (eqs. 3.1-3.3): a species above mole fraction 1e-8 may grow by at most
// e^2 per step (and n by e^0.4); a trace species may rise to at most mole fraction 1e-4 in one step.
constexpr double kTraceLogFraction = -18.420680743952367;        // ln 1e-8
constexpr double kTraceCeilingLogFraction = -9.210340371976184;  // ln 1e-4
// Amounts below e^-690 of n (about 1e-300) enter the Newton matrix at that floor, so that no balance
// row becomes exactly zero; the reported amounts keep their own (smaller) values.
constexpr double kMatrixFloorLogFraction = -690.0;
// ln(n_j/n) is kept above this so that it stays a finite number.
constexpr double kStateFloorLogFraction = -1.0e5;
// A basis species of the linear-programming start with zero amount (a degenerate vertex, e.g. O2 of
// an exactly stoichiometric feed) starts at mole fraction e^-8 (3e-4); chosen on the robustness grid
// (fewest Newton iterations), not a physical constant.
constexpr double kDegenerateBasisLogFraction = -8.0;
// Within e^0.05 (about 5 %) in T the warm start's element potentials, carried along their
// temperature slopes, seed the solve; beyond, the cold start converges as fast or faster.
constexpr double kPredictorLogTemperatureRange = 0.05;
// Condensed phase entry: g_c/RT - sum_k a_kc pi_k below this (dimensionless) admits the species.
constexpr double kPhaseEntryTolerance = -1e-10;
constexpr int kMaxPhaseChanges = 20;
// A species below e^-60 of every balance it enters is left out of the Newton matrix.
constexpr double kNegligibleLogShare = -60.0;
// A full Newton step that leaves more than this fraction of the residual triggers step extrapolation.
constexpr double kSlowRatio = 0.2;
// A dependent balance row (restricted product list) that misses by more than this is infeasible.
constexpr double kDependentRowTolerance = 1e-9;

void nasa7_properties(const std::array<double, 7>& a, double T, double lnT, double& g, double& h, double& cp) {
  const double T2 = T * T;
  const double T3 = T2 * T;
  const double T4 = T3 * T;
  cp = a[0] + a[1] * T + a[2] * T2 + a[3] * T3 + a[4] * T4;
  h = a[0] + a[1] * T / 2 + a[2] * T2 / 3 + a[3] * T3 / 4 + a[4] * T4 / 5 + a[5] / T;
  const double s = a[0] * lnT + a[1] * T + a[2] * T2 / 2 + a[3] * T3 / 3 + a[4] * T4 / 4 + a[6];
  g = h - s;
}

std::string element_list(const std::array<bool, kElementCount>& mask) {
  std::string text;
  for (std::size_t k = 0; k < kElementCount; ++k) {
    if (!mask[k]) continue;
    if (!text.empty()) text += ", ";
    text += known_elements()[k].symbol;
  }
  return text;
}

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

// Cold-start estimate (the linear-programming initial estimate of White, Johnson & Dantzig, J. Chem.
// Phys. 28 (1958) 751): minimise sum_j n_j g_j/RT without the mixing terms, subject to the element
// balances and n >= 0. The optimal basis holds the major species; its dual values are first
// element potentials, from which every other gas species starts at ln(n_j/n) = -(g_j - a_j.pi)
// (<= 0 at the optimum). Dense two-phase simplex; artificial variables only for rows without a
// single-element species. Returns false (caller uses a uniform start) if the simplex stalls.
bool linear_programming_start(const std::vector<Term>& gas, const std::vector<Term>& condensed, int E,
                              const std::array<double, kElementCount>& bs, std::vector<double>& lnn, double& lnN,
                              std::vector<double>& nc, std::vector<char>& included,
                              std::array<int, kElementCount>& optimal_basis) {
  const int S = static_cast<int>(gas.size());
  const int n = S + static_cast<int>(condensed.size());
  const auto term = [&](int j) -> const Term& {
    return j < S ? gas[static_cast<std::size_t>(j)] : condensed[static_cast<std::size_t>(j - S)];
  };
  // Crash basis: per row, the cheapest species made of that element alone.
  std::array<int, kElementCount> basis{};
  int artificials = 0;
  for (int r = 0; r < E; ++r) {
    basis[static_cast<std::size_t>(r)] = -1;
    double best = std::numeric_limits<double>::infinity();
    for (int j = 0; j < n; ++j) {
      const Term& t = term(j);
      if (t.count == 1 && t.row[0] == r && t.g / t.atoms[0] < best) {
        best = t.g / t.atoms[0];
        basis[static_cast<std::size_t>(r)] = j;
      }
    }
    if (basis[static_cast<std::size_t>(r)] < 0) basis[static_cast<std::size_t>(r)] = n + artificials++;
  }
  // Tableau rows 0..E-1: B^-1 [A | I_art | b]; row E: reduced costs of the current phase.
  const int columns = n + artificials + 1;
  const int rhs = columns - 1;
  Eigen::Matrix<double, Eigen::Dynamic, Eigen::Dynamic, Eigen::RowMajor> t =
      Eigen::Matrix<double, Eigen::Dynamic, Eigen::Dynamic, Eigen::RowMajor>::Zero(E + 1, columns);
  for (int j = 0; j < n; ++j) {
    const Term& s = term(j);
    for (int p = 0; p < s.count; ++p) t(s.row[static_cast<std::size_t>(p)], j) = s.atoms[static_cast<std::size_t>(p)];
  }
  for (int r = 0; r < E; ++r) {
    t(r, rhs) = bs[static_cast<std::size_t>(r)];
    const int j = basis[static_cast<std::size_t>(r)];
    if (j >= n) {
      t(r, j) = 1.0;
    } else {
      t.row(r) /= t(r, j);  // a single-element species has an entry in its own row only
    }
  }
  const auto pivot = [&](int r, int j) {
    t.row(r) /= t(r, j);
    for (int i = 0; i <= E; ++i) {
      if (i != r && t(i, j) != 0.0) t.row(i) -= t(i, j) * t.row(r);
    }
    basis[static_cast<std::size_t>(r)] = j;
  };
  constexpr double kPivotTolerance = 1e-11;
  const auto run = [&](int allowed_columns) {
    for (int step = 0; step < 50 + 10 * (E + n); ++step) {
      int entering = -1;
      double most_negative = -1e-10;
      for (int j = 0; j < allowed_columns; ++j) {
        if (t(E, j) < most_negative) {
          most_negative = t(E, j);
          entering = j;
        }
      }
      if (entering < 0) return true;
      int leaving = -1;
      double best_ratio = std::numeric_limits<double>::infinity();
      for (int r = 0; r < E; ++r) {
        if (t(r, entering) > kPivotTolerance) {
          const double ratio = t(r, rhs) / t(r, entering);
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
  };
  if (artificials > 0) {
    // Phase 1: minimise the sum of the artificial variables.
    for (int r = 0; r < E; ++r) {
      if (basis[static_cast<std::size_t>(r)] >= n) t.row(E) -= t.row(r);
    }
    for (int j = n; j < n + artificials; ++j) t(E, j) = 0.0;
    if (!run(n)) return false;
    if (-t(E, rhs) > 1e-9) return false;  // infeasible proportions
    for (int r = 0; r < E; ++r) {
      if (basis[static_cast<std::size_t>(r)] < n) continue;
      int j = 0;
      while (j < n && std::abs(t(r, j)) <= kPivotTolerance) ++j;
      if (j == n) return false;
      pivot(r, j);
    }
  }
  // Phase 2: reduced costs d_j = c_j - c_B B^-1 A_j.
  for (int j = 0; j < columns; ++j) t(E, j) = j < n ? term(j).g : 0.0;
  for (int r = 0; r < E; ++r) t.row(E) -= term(basis[static_cast<std::size_t>(r)]).g * t.row(r);
  if (!run(n)) return false;

  // Element potentials from the optimal basis (B^T pi = c_B); the reduced costs are g_j - a_j.pi.
  double gas_total = 0.0;
  for (int r = 0; r < E; ++r) {
    const int j = basis[static_cast<std::size_t>(r)];
    if (j < S) gas_total += std::max(t(r, rhs), 0.0);
  }
  if (gas_total <= 0.0) gas_total = 0.1;  // everything condensed: the gas starts small
  lnN = std::log(gas_total);
  for (int j = 0; j < S; ++j) lnn[static_cast<std::size_t>(j)] = lnN - std::max(t(E, j), 0.0);
  for (int r = 0; r < E; ++r) {
    const int j = basis[static_cast<std::size_t>(r)];
    const double amount = t(r, rhs);
    if (j < S) {
      lnn[static_cast<std::size_t>(j)] = amount > 0.0 ? std::log(amount) : lnN + kDegenerateBasisLogFraction;
    } else if (amount > 0.0) {
      nc[static_cast<std::size_t>(j - S)] = amount;
      included[static_cast<std::size_t>(j - S)] = 1;
    }
  }
  optimal_basis = basis;
  return true;
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

EquilibriumSolver::EquilibriumSolver(const SpeciesDatabase& db, const ElementAmounts& elements_present,
                                     std::vector<std::string> candidates, EquilibriumOptions options)
    : options_(options) {
  if (known_elements().size() != kElementCount) {
    throw std::logic_error("EquilibriumSolver: kElementCount does not match known_elements()");
  }
  for (std::size_t k = 0; k < kElementCount; ++k) {
    const double amount = elements_present.moles[k];
    if (!std::isfinite(amount) || amount < 0.0) {
      throw units::InputError(fmt::format("element amounts: {} = {}: must be a finite number >= 0 mol",
                                          known_elements()[k].symbol, amount));
    }
    element_allowed_[k] = amount > 0.0;
  }
  if (std::none_of(element_allowed_.begin(), element_allowed_.end(), [](bool b) { return b; })) {
    throw units::InputError("element amounts: every element amount is zero; the feed holds no atoms");
  }

  std::vector<const Species*> chosen;
  if (candidates.empty()) {
    std::vector<std::string> symbols;
    for (std::size_t k = 0; k < kElementCount; ++k) {
      if (element_allowed_[k]) symbols.emplace_back(known_elements()[k].symbol);
    }
    chosen = db.made_only_of(symbols);
  } else {
    for (const std::string& name : candidates) {
      const Species& species = db.at(name, "species");
      if (std::find(chosen.begin(), chosen.end(), &species) != chosen.end()) {
        throw units::InputError(fmt::format("species = \"{}\": listed twice", name));
      }
      for (const ElementCount& count : species.composition()) {
        if (!element_allowed_[element_index(count.element)]) {
          throw units::InputError(fmt::format(
              "species = \"{}\": contains {}, which is not in the feed (the feed's elements: {}); remove it "
              "from the product list",
              name, count.element, element_list(element_allowed_)));
        }
      }
      chosen.push_back(&species);
    }
  }

  // The solver keeps its own copies of the species records, so it may outlive the database.
  auto owned = std::make_shared<std::vector<Species>>();
  owned->reserve(chosen.size());
  for (int pass = 0; pass < 2; ++pass) {
    for (const Species* chosen_species : chosen) {
      if (chosen_species->is_gas() != (pass == 0)) continue;
      owned->push_back(*chosen_species);
      const Species* species = &owned->back();
      Candidate candidate;
      candidate.species = species;
      candidate.gas = species->is_gas();
      for (const ElementCount& count : species->composition()) {
        candidate.atoms[element_index(count.element)] += count.count;
      }
      for (std::size_t k = 0; k < kElementCount; ++k) {
        if (candidate.atoms[k] == 0.0) continue;
        candidate.atom_count += candidate.atoms[k];
        candidate.elements[static_cast<std::size_t>(candidate.element_count++)] = k;
      }
      candidate.below_mid = species->record().below_mid;
      candidate.above_mid = species->record().above_mid;
      candidate.mid_K = species->range().mid_K;
      candidates_.push_back(candidate);
      names_.push_back(species->formula());
    }
  }
  species_ = std::move(owned);
  // FNV-1a hash of the product list: a warm start must come from a solver with the same products.
  species_key_ = 1469598103934665603ULL;
  for (const std::string& name : names_) {
    for (const char ch : name + '\n') {
      species_key_ = (species_key_ ^ static_cast<unsigned char>(ch)) * 1099511628211ULL;
    }
  }
  gas_count_ = static_cast<std::size_t>(
      std::count_if(candidates_.begin(), candidates_.end(), [](const Candidate& c) { return c.gas; }));

  std::string listed;
  for (const std::string& name : candidates) listed += (listed.empty() ? "" : ",") + name;
  if (gas_count_ == 0) {
    throw units::InputError(fmt::format("species = \"{}\": the product list needs at least one gas species",
                                        candidates.empty() ? std::string("(all)") : listed));
  }
  for (std::size_t k = 0; k < kElementCount; ++k) {
    if (!element_allowed_[k]) continue;
    const bool held =
        std::any_of(candidates_.begin(), candidates_.end(), [k](const Candidate& c) { return c.atoms[k] > 0.0; });
    if (!held) {
      throw units::InputError(fmt::format(
          "species = \"{}\": no product contains {}, which is in the feed; the product list cannot hold the "
          "feed's elements ({})",
          candidates.empty() ? std::string("(all)") : listed, known_elements()[k].symbol,
          element_list(element_allowed_)));
    }
  }

  min_temperature_K_ = 0.0;
  max_temperature_K_ = std::numeric_limits<double>::infinity();
  bool all_cover_reference = true;
  for (const Candidate& c : candidates_) {
    min_temperature_K_ = std::max(min_temperature_K_, c.species->range().low_K);
    max_temperature_K_ = std::min(max_temperature_K_, c.species->range().high_K);
    all_cover_reference = all_cover_reference && c.species->covers(units::kReferenceTemperature_K);
  }
  covered_low_K_ = min_temperature_K_;
  if (all_cover_reference) min_temperature_K_ = std::min(min_temperature_K_, units::kReferenceTemperature_K);
  if (!(min_temperature_K_ < max_temperature_K_)) {
    throw units::InputError(
        fmt::format("species: the data ranges of the product candidates do not overlap "
                    "(common range {:g}-{:g} K)",
                    min_temperature_K_, max_temperature_K_));
  }
  independent_all_ = independent_rows(element_allowed_);
  auto tables = std::make_shared<EquilibriumTables>();
  build_terms(element_allowed_, rows_of(independent_all_), tables->gas, tables->condensed);
  tables_ = std::move(tables);
}

std::array<bool, kElementCount> EquilibriumSolver::independent_rows(
    const std::array<bool, kElementCount>& active) const {
  std::vector<std::size_t> elements;
  for (std::size_t k = 0; k < kElementCount; ++k) {
    if (active[k]) elements.push_back(k);
  }
  std::vector<const Candidate*> usable;
  for (const Candidate& c : candidates_) {
    bool ok = true;
    for (std::size_t k = 0; k < kElementCount; ++k) ok = ok && (c.atoms[k] == 0.0 || active[k]);
    if (ok) usable.push_back(&c);
  }
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
    Term term;
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
    if (!c.species->covers(temperature_K)) {
      throw units::InputError(fmt::format(
          "temperature = {:g} K: outside the data range of product {} ({:g}-{:g} K); the product candidates "
          "together cover {:g}-{:g} K",
          temperature_K, c.species->formula(), c.species->range().low_K, c.species->range().high_K, min_temperature_K_,
          max_temperature_K_));
    }
  }
}

// ---------------------------------------------------------------------------------------------------
// The TP solve

struct EquilibriumWork {
  static EquilibriumResult solve(const EquilibriumSolver& solver, const ElementAmounts& b_in, double T, double P,
                                 const EquilibriumResult* warm);
};

EquilibriumResult EquilibriumSolver::solve_tp(const ElementAmounts& b, double temperature_K, double pressure_Pa,
                                              const EquilibriumResult* warm_start) const {
  try {
    return EquilibriumWork::solve(*this, b, temperature_K, pressure_Pa, warm_start);
  } catch (const ConvergenceError&) {
    // A restricted product list may be unable to reach the feed's element proportions with
    // non-negative amounts; that is bad input, not a numerical failure.
    std::array<bool, kElementCount> active{};
    std::vector<std::size_t> elements;
    for (std::size_t k = 0; k < kElementCount; ++k) {
      active[k] = b.moles[k] > 0.0;
      if (active[k]) elements.push_back(k);
    }
    std::vector<const Candidate*> usable;
    for (const Candidate& c : candidates_) {
      bool ok = true;
      for (std::size_t k = 0; k < kElementCount; ++k) ok = ok && (c.atoms[k] == 0.0 || active[k]);
      if (ok) usable.push_back(&c);
    }
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
  using Candidate = EquilibriumSolver::Candidate;
  const EquilibriumOptions& options = solver.options_;
  solver.check_temperature(T);
  if (!std::isfinite(P) || P <= 0.0) {
    throw units::InputError(fmt::format("pressure = {:g} Pa: must be a finite pressure > 0 Pa", P));
  }

  // Active elements: those with a positive amount. Rows: the independent ones among them.
  std::array<bool, kElementCount> active{};
  double scale = 0.0;
  for (std::size_t k = 0; k < kElementCount; ++k) {
    const double amount = b_in.moles[k];
    if (!std::isfinite(amount) || amount < 0.0) {
      throw units::InputError(fmt::format("element amounts: {} = {}: must be a finite number >= 0 mol",
                                          known_elements()[k].symbol, amount));
    }
    if (amount > 0.0 && !solver.element_allowed_[k]) {
      throw units::InputError(
          fmt::format("element amounts: {} = {:g} mol, but this solver was built for the elements {} only",
                      known_elements()[k].symbol, amount, element_list(solver.element_allowed_)));
    }
    active[k] = amount > 0.0;
    scale += amount;
  }
  if (!(scale > 0.0) || !std::isfinite(scale)) {
    throw units::InputError("element amounts: every element amount is zero; the feed holds no atoms");
  }
  const std::array<bool, kElementCount> independent =
      active == solver.element_allowed_ ? solver.independent_all_ : solver.independent_rows(active);
  std::array<int, kElementCount> row_of{};
  std::array<std::size_t, kElementCount> element_of_row{};
  int E = 0;
  for (std::size_t k = 0; k < kElementCount; ++k) {
    row_of[k] = -1;
    if (independent[k]) {
      row_of[k] = E;
      element_of_row[static_cast<std::size_t>(E)] = k;
      ++E;
    }
  }
  std::array<double, kElementCount> bs{};
  std::array<double, kElementCount> ln_bs{};
  for (int r = 0; r < E; ++r) {
    bs[static_cast<std::size_t>(r)] = b_in.moles[element_of_row[static_cast<std::size_t>(r)]] / scale;
    ln_bs[static_cast<std::size_t>(r)] = std::log(bs[static_cast<std::size_t>(r)]);
  }

  // Active species (no element with zero amount) with their properties at T.
  const double lnT = std::log(T);
  const double lnP = std::log(P / units::kStandardStatePressure_Pa);
  std::vector<Term> gas;
  std::vector<Term> condensed;
  if (active == solver.element_allowed_) {
    gas = solver.tables_->gas;
    condensed = solver.tables_->condensed;
  } else {
    solver.build_terms(active, row_of, gas, condensed);
  }
  for (std::vector<Term>* terms : {&gas, &condensed}) {
    for (Term& term : *terms) {
      const Candidate& c = solver.candidates_[term.candidate];
      nasa7_properties(T < c.mid_K ? c.below_mid : c.above_mid, T, lnT, term.g, term.h, term.cp);
      if (c.gas) term.g += lnP;
      term.negligible_ln_moles =
          term.count > 0 ? std::numeric_limits<double>::infinity() : -std::numeric_limits<double>::infinity();
      for (int p = 0; p < term.count; ++p) {
        const std::size_t up = static_cast<std::size_t>(p);
        term.negligible_ln_moles = std::min(term.negligible_ln_moles, ln_bs[static_cast<std::size_t>(term.row[up])] -
                                                                          term.log_atoms[up] + kNegligibleLogShare);
      }
    }
  }
  const std::size_t S = gas.size();
  const std::size_t C = condensed.size();
  if (S == 0) {
    throw units::InputError(
        fmt::format("element amounts: with the elements {} present, no gas product remains", element_list(active)));
  }

  // Initial state: ln n_j, ln n, condensed amounts (all per mole of feed atoms).
  std::vector<double> lnn(S);
  std::vector<double> nc(C, 0.0);
  std::vector<char> included(C, 0);
  double lnN = std::log(0.1);
  bool warm_used = false;
  bool polished_start = false;  // the gas amounts already satisfy mu_j/RT = sum_k a_kj pi_k
  std::array<double, kElementCount> pi{};
  // A warm start far from T (a sweep's jump) converges slower than the linear-programming start.
  // Warm start: near the warm start's temperature, at the same pressure, its element potentials
  // carried to the new T along their temperature slopes (a first-order predictor) give every gas
  // amount at once, in equilibrium with each other: ln n_j = ln n - g_j/RT + sum_k a_kj pi_k. Each
  // element present now must have been present then. Otherwise (a jump in T, or another pressure,
  // where the predicted mole fractions would not sum to 1) the cold start below is the better one.
  if (warm != nullptr && warm->species_key == solver.species_key_ && warm->moles.size() == solver.names_.size() &&
      std::abs(std::log(warm->temperature_K / T)) <= kPredictorLogTemperatureRange &&
      std::abs(std::log(P / warm->pressure_Pa)) <= 1e-12 && std::isfinite(warm->gas_moles_slope)) {
    const double log_temperature_step = std::log(T / warm->temperature_K);
    bool usable = true;
    for (int r = 0; r < E && usable; ++r) {
      const std::size_t k = element_of_row[static_cast<std::size_t>(r)];
      bool carried = false;
      for (std::size_t i = 0; i < solver.candidates_.size() && !carried; ++i) {
        carried = solver.candidates_[i].atoms[k] > 0.0 && warm->moles[i] > 0.0;
      }
      usable =
          carried && std::isfinite(warm->element_potentials[k]) && std::isfinite(warm->element_potential_slopes[k]);
    }
    double atoms = 0.0;
    for (std::size_t i = 0; i < solver.candidates_.size(); ++i)
      atoms += solver.candidates_[i].atom_count * warm->moles[i];
    double gas_total = 0.0;
    for (const Term& t : gas) gas_total += warm->moles[t.candidate];
    if (usable && atoms > 0.0 && std::isfinite(atoms) && gas_total > 0.0) {
      for (int r = 0; r < E; ++r) {
        const std::size_t k = element_of_row[static_cast<std::size_t>(r)];
        pi[static_cast<std::size_t>(r)] =
            warm->element_potentials[k] + warm->element_potential_slopes[k] * log_temperature_step;
      }
      lnN = std::log(gas_total / atoms) + warm->gas_moles_slope * log_temperature_step;
      for (std::size_t j = 0; j < S; ++j) {
        const Term& t = gas[j];
        double ln_fraction = -t.g;
        for (int p = 0; p < t.count; ++p) {
          ln_fraction +=
              t.atoms[static_cast<std::size_t>(p)] * pi[static_cast<std::size_t>(t.row[static_cast<std::size_t>(p)])];
        }
        lnn[j] = std::max(ln_fraction, kStateFloorLogFraction) + lnN;
      }
      std::size_t count = 0;
      for (std::size_t c = 0; c < C; ++c) {
        const double x = warm->moles[condensed[c].candidate] / atoms;
        if (x > 0.0 && count < static_cast<std::size_t>(E)) {
          nc[c] = x;
          included[c] = 1;
          ++count;
        }
      }
      warm_used = true;
      polished_start = true;
    }
  }
  std::array<int, kElementCount> lp_basis{};
  if (!warm_used) {
    if (!linear_programming_start(gas, condensed, E, bs, lnn, lnN, nc, included, lp_basis)) {
      const double each = std::log(0.1 / static_cast<double>(S));
      std::fill(lnn.begin(), lnn.end(), each);
    } else {
      // Element potentials that make the basis species' chemical potentials, mixing terms included,
      // exact: sum_k a_kb pi_k = g_b/RT + ln(n_b/n) (gas), = g_b/RT (condensed). Every other gas
      // species then starts in equilibrium with them, unless that overfills the gas (sum x >> 1).
      Matrix basis_matrix = Matrix::Zero(E, E);
      Vector potentials_rhs(E);
      for (int r = 0; r < E; ++r) {
        const int j = lp_basis[static_cast<std::size_t>(r)];
        const bool is_gas = j < static_cast<int>(S);
        const Term& t = is_gas ? gas[static_cast<std::size_t>(j)] : condensed[static_cast<std::size_t>(j) - S];
        for (int p = 0; p < t.count; ++p)
          basis_matrix(r, t.row[static_cast<std::size_t>(p)]) = t.atoms[static_cast<std::size_t>(p)];
        potentials_rhs[r] = t.g + (is_gas ? lnn[static_cast<std::size_t>(j)] - lnN : 0.0);
      }
      const Vector potentials = basis_matrix.partialPivLu().solve(potentials_rhs);
      if (potentials.allFinite()) {
        std::vector<double> polished(S);
        double fraction_sum = 0.0;
        for (std::size_t j = 0; j < S; ++j) {
          const Term& t = gas[j];
          double ln_fraction = -t.g;
          for (int p = 0; p < t.count; ++p) {
            ln_fraction += t.atoms[static_cast<std::size_t>(p)] * potentials[t.row[static_cast<std::size_t>(p)]];
          }
          polished[j] = std::max(ln_fraction, kStateFloorLogFraction) + lnN;
          fraction_sum += std::exp(std::min(ln_fraction, 50.0));
        }
        if (fraction_sum < 1.5) {
          lnn = std::move(polished);
          for (int r = 0; r < E; ++r) pi[static_cast<std::size_t>(r)] = potentials[r];
          polished_start = true;
        }
      }
    }
  }

  std::vector<double> n(S);
  std::vector<double> mu(S);
  Matrix M;
  Vector rhs;
  Vector x;
  NewtonFactorisation lu;
  int iterations = 0;
  int phase_changes = 0;
  bool full_step = polished_start;
  bool skip_traces = true;
  double element_residual = std::numeric_limits<double>::infinity();
  // The state before the last Newton step, for the extrapolation below.
  bool previous_full_step = false;
  double previous_residual = std::numeric_limits<double>::infinity();
  std::array<double, kElementCount> pi_old{};
  double lnN_old = lnN;
  std::vector<double> nc_old(C, 0.0);
  int dim = 0;
  std::vector<int> condensed_position(C, 0);  // row/column of included condensed c

  while (true) {
    // Assemble the RP-1311 system (eq. 2.24-2.26, TP form) at the current state.
    int included_count = 0;
    for (std::size_t c = 0; c < C; ++c) {
      if (included[c] != 0) condensed_position[c] = E + included_count++;
    }
    dim = E + included_count + 1;
    const int nrow = dim - 1;
    M.setZero(dim, dim);
    rhs.setZero(dim);
    std::array<double, kElementCount> bgas{};
    double sum_n = 0.0;
    double sum_nmu = 0.0;
    for (std::size_t j = 0; j < S; ++j) {
      const Term& t = gas[j];
      const double ln_fraction = lnn[j] - lnN;
      const double muj = t.g + ln_fraction;
      mu[j] = muj;
      if (skip_traces && lnn[j] < t.negligible_ln_moles) {
        n[j] = 0.0;
        continue;
      }
      const double nj = std::exp(std::max(ln_fraction, kMatrixFloorLogFraction) + lnN);
      n[j] = nj;
      sum_n += nj;
      sum_nmu += nj * muj;
      for (int p = 0; p < t.count; ++p) {
        const int kp = t.row[static_cast<std::size_t>(p)];
        const double an = t.atoms[static_cast<std::size_t>(p)] * nj;
        bgas[static_cast<std::size_t>(kp)] += an;
        rhs[kp] += an * muj;
        for (int q = 0; q <= p; ++q) {
          M(kp, t.row[static_cast<std::size_t>(q)]) += an * t.atoms[static_cast<std::size_t>(q)];
        }
      }
    }
    // Skipping negligible species must not empty a balance row; if it did, assemble them all.
    if (skip_traces) {
      bool empty_row = false;
      for (int r = 0; r < E; ++r) empty_row = empty_row || !(M(r, r) > 0.0);
      if (empty_row) {
        skip_traces = false;
        continue;
      }
    }
    skip_traces = true;
    // Species rows were entered in increasing order, so only the lower triangle (k >= i) was filled.
    for (int k = 0; k < E; ++k) {
      for (int i = 0; i < k; ++i) M(i, k) = M(k, i);
    }
    const double N = std::exp(lnN);
    std::array<double, kElementCount> residual{};
    for (int r = 0; r < E; ++r)
      residual[static_cast<std::size_t>(r)] = bs[static_cast<std::size_t>(r)] - bgas[static_cast<std::size_t>(r)];
    for (std::size_t c = 0; c < C; ++c) {
      if (included[c] == 0) continue;
      const Term& t = condensed[c];
      const int pos = condensed_position[c];
      for (int p = 0; p < t.count; ++p) {
        const int kp = t.row[static_cast<std::size_t>(p)];
        const double a = t.atoms[static_cast<std::size_t>(p)];
        residual[static_cast<std::size_t>(kp)] -= a * nc[c];
        M(kp, pos) = a;
        M(pos, kp) = a;
      }
      rhs[pos] = t.g;
    }
    element_residual = 0.0;
    for (int r = 0; r < E; ++r) {
      element_residual =
          std::max(element_residual, std::abs(residual[static_cast<std::size_t>(r)]) / bs[static_cast<std::size_t>(r)]);
      rhs[r] += residual[static_cast<std::size_t>(r)];
      M(r, nrow) = bgas[static_cast<std::size_t>(r)];
      M(nrow, r) = bgas[static_cast<std::size_t>(r)];
    }
    M(nrow, nrow) = sum_n - N;
    rhs[nrow] = N - sum_n + sum_nmu;
    const double moles_residual = std::abs(N - sum_n) / N;

    if (full_step && element_residual <= options.element_tolerance && moles_residual <= options.element_tolerance) {
      // Converged for this set of condensed species; test the absent ones (RP-1311 sec. 3.4).
      int entering = -1;
      double most_negative = kPhaseEntryTolerance;
      if (included_count < E) {
        for (std::size_t c = 0; c < C; ++c) {
          if (included[c] != 0) continue;
          const Term& t = condensed[c];
          double affinity = t.g;
          for (int p = 0; p < t.count; ++p) {
            affinity -=
                t.atoms[static_cast<std::size_t>(p)] * pi[static_cast<std::size_t>(t.row[static_cast<std::size_t>(p)])];
          }
          if (affinity < most_negative) {
            most_negative = affinity;
            entering = static_cast<int>(c);
          }
        }
      }
      if (entering < 0) break;
      if (++phase_changes > kMaxPhaseChanges) {
        throw ConvergenceError("condensed species keep entering and leaving", iterations, element_residual, T, P);
      }
      included[static_cast<std::size_t>(entering)] = 1;
      nc[static_cast<std::size_t>(entering)] = 0.0;
      full_step = false;
      previous_full_step = false;
      continue;
    }
    if (iterations >= options.max_iterations) {
      throw ConvergenceError("iteration limit reached", iterations, element_residual, T, P);
    }

    // Step extrapolation. After two full Newton steps every gas amount follows from (pi, n) exactly,
    // and a step that cut the residual by less than kSlowRatio is usually one species in excess
    // shrinking by a factor e per step (the linearised balance asks for n_j -> 0). Longer steps
    // along the last (pi, n, n_c) change are tried (2, 4, ... 64 times it); the best residual wins.
    const double combined_residual = std::max(element_residual, moles_residual);
    if (full_step && previous_full_step && combined_residual > kSlowRatio * previous_residual) {
      const auto residual_at = [&](double t, bool adopt) {
        const double lnN_t = lnN + t * (lnN - lnN_old);
        std::array<double, kElementCount> pi_t{};
        for (int r = 0; r < E; ++r) {
          const std::size_t ur = static_cast<std::size_t>(r);
          pi_t[ur] = pi[ur] + t * (pi[ur] - pi_old[ur]);
        }
        std::array<double, kElementCount> b_t{};
        double sum = 0.0;
        for (std::size_t j = 0; j < S; ++j) {
          const Term& term = gas[j];
          double ln_fraction = -term.g;
          for (int p = 0; p < term.count; ++p) {
            ln_fraction += term.atoms[static_cast<std::size_t>(p)] *
                           pi_t[static_cast<std::size_t>(term.row[static_cast<std::size_t>(p)])];
          }
          const double nj = std::exp(std::max(ln_fraction, kMatrixFloorLogFraction) + lnN_t);
          if (adopt) lnn[j] = std::max(ln_fraction, kStateFloorLogFraction) + lnN_t;
          sum += nj;
          for (int p = 0; p < term.count; ++p) {
            b_t[static_cast<std::size_t>(term.row[static_cast<std::size_t>(p)])] +=
                term.atoms[static_cast<std::size_t>(p)] * nj;
          }
        }
        for (std::size_t c = 0; c < C; ++c) {
          if (included[c] == 0) continue;
          const double amount = nc[c] + t * (nc[c] - nc_old[c]);
          if (!(amount > 0.0)) return std::numeric_limits<double>::infinity();
          const Term& term = condensed[c];
          for (int p = 0; p < term.count; ++p) {
            b_t[static_cast<std::size_t>(term.row[static_cast<std::size_t>(p)])] +=
                term.atoms[static_cast<std::size_t>(p)] * amount;
          }
          if (adopt) nc[c] = amount;
        }
        const double N_t = std::exp(lnN_t);
        double worst = std::abs(N_t - sum) / N_t;
        for (int r = 0; r < E; ++r) {
          const std::size_t ur = static_cast<std::size_t>(r);
          worst = std::max(worst, std::abs(bs[ur] - b_t[ur]) / bs[ur]);
        }
        if (adopt) {
          pi_old = pi;
          lnN_old = lnN;
          pi = pi_t;
          lnN = lnN_t;
        }
        return std::isfinite(worst) ? worst : std::numeric_limits<double>::infinity();
      };
      double best_t = 0.0;
      double best = combined_residual;
      for (double t = 1.0; t <= 63.0; t = 2.0 * t + 1.0) {
        const double trial = residual_at(t, false);
        if (!(trial < best)) break;
        best = trial;
        best_t = t;
      }
      if (best_t > 0.0) {
        (void)residual_at(best_t, true);
        previous_residual = std::numeric_limits<double>::infinity();
        continue;  // re-assemble at the extrapolated state
      }
    }
    previous_residual = combined_residual;
    previous_full_step = full_step;
    pi_old = pi;
    lnN_old = lnN;
    nc_old = nc;

    lu.compute(M, E, std::max(sum_n, N));
    x = lu.solve(rhs);
    ++iterations;
    if (!x.allFinite()) {
      throw ConvergenceError("singular Newton system", iterations, element_residual, T, P);
    }
    for (int r = 0; r < E; ++r) pi[static_cast<std::size_t>(r)] = x[r];
    const double dlnN = x[nrow];

    // Corrections of the gas species and the step length lambda.
    double largest = 5.0 * std::abs(dlnN);
    double lambda2 = 1.0;
    for (std::size_t j = 0; j < S; ++j) {
      const Term& t = gas[j];
      double dj = -mu[j] + dlnN;
      for (int p = 0; p < t.count; ++p) {
        dj += t.atoms[static_cast<std::size_t>(p)] * pi[static_cast<std::size_t>(t.row[static_cast<std::size_t>(p)])];
      }
      mu[j] = dj;  // reuse as the correction of ln n_j
      if (dj <= 0.0) continue;
      const double ln_fraction = lnn[j] - lnN;
      if (ln_fraction <= kTraceLogFraction) {
        const double rise = dj - dlnN;
        if (rise > 0.0) lambda2 = std::min(lambda2, (kTraceCeilingLogFraction - ln_fraction) / rise);
      } else {
        largest = std::max(largest, dj);
      }
    }
    const double lambda1 = largest > 2.0 ? 2.0 / largest : 1.0;
    const double lambda = std::min({1.0, lambda1, lambda2});
    full_step = lambda >= 1.0;
    const double lnN_new = lnN + lambda * dlnN;
    for (std::size_t j = 0; j < S; ++j) {
      lnn[j] = std::max(lnn[j] + lambda * mu[j], lnN_new + kStateFloorLogFraction);
    }
    lnN = lnN_new;
    for (std::size_t c = 0; c < C; ++c) {
      if (included[c] == 0) continue;
      nc[c] += lambda * x[condensed_position[c]];
      if (!(nc[c] > 0.0)) {  // RP-1311 sec. 3.4: a condensed species that goes negative leaves
        nc[c] = 0.0;
        included[c] = 0;
        full_step = false;
        previous_full_step = false;
        if (++phase_changes > kMaxPhaseChanges) {
          throw ConvergenceError("condensed species keep entering and leaving", iterations, element_residual, T, P);
        }
      }
    }
  }

  // Converged: M holds the Newton matrix at the solution. Equilibrium heat capacity from the
  // temperature derivatives (RP-1311 eqs. 2.56-2.58 in TP form): same matrix, right-hand side -h.
  const int nrow = dim - 1;
  Vector rhs_T = Vector::Zero(dim);
  double frozen_cp = 0.0;
  double enthalpy = 0.0;
  for (std::size_t j = 0; j < S; ++j) {
    const Term& t = gas[j];
    const double nh = n[j] * t.h;
    frozen_cp += n[j] * t.cp;
    enthalpy += nh;
    rhs_T[nrow] -= nh;
    for (int p = 0; p < t.count; ++p)
      rhs_T[t.row[static_cast<std::size_t>(p)]] -= t.atoms[static_cast<std::size_t>(p)] * nh;
  }
  for (std::size_t c = 0; c < C; ++c) {
    if (included[c] == 0) continue;
    frozen_cp += nc[c] * condensed[c].cp;
    enthalpy += nc[c] * condensed[c].h;
    rhs_T[condensed_position[c]] = -condensed[c].h;
  }
  double equilibrium_cp = frozen_cp;
  std::array<double, kElementCount> result_potential_slopes{};
  double result_gas_moles_slope = std::numeric_limits<double>::quiet_NaN();
  result_potential_slopes.fill(std::numeric_limits<double>::quiet_NaN());
  // The factorisation of the last Newton step serves: its matrix differs from the one at the
  // solution by the last (converged) correction, far below the accuracy a heat capacity needs.
  if (iterations == 0) {  // converged at the start: factorise the matrix at the solution
    lu.compute(M, E, std::exp(lnN));
  }
  if (lu.dimension() == dim) {
    const Vector derivative = lu.solve(rhs_T);
    if (derivative.allFinite()) {
      const double dlnN = derivative[nrow];
      result_gas_moles_slope = dlnN;
      for (int r = 0; r < E; ++r) {
        result_potential_slopes[element_of_row[static_cast<std::size_t>(r)]] = derivative[r];
      }
      for (std::size_t j = 0; j < S; ++j) {
        const Term& t = gas[j];
        double dln = dlnN + t.h;
        for (int p = 0; p < t.count; ++p) {
          dln += t.atoms[static_cast<std::size_t>(p)] * derivative[t.row[static_cast<std::size_t>(p)]];
        }
        equilibrium_cp += n[j] * t.h * dln;
      }
      for (std::size_t c = 0; c < C; ++c) {
        if (included[c] != 0) equilibrium_cp += condensed[c].h * derivative[condensed_position[c]];
      }
    }
  }

  EquilibriumResult result;
  result.temperature_K = T;
  result.pressure_Pa = P;
  result.species = solver.names_;
  result.species_key = solver.species_key_;
  result.moles.assign(solver.names_.size(), 0.0);
  result.mole_fractions.assign(solver.names_.size(), 0.0);
  double gas_total = 0.0;
  for (std::size_t j = 0; j < S; ++j) {
    const double moles = (n[j] > 0.0 && lnn[j] - lnN > kMatrixFloorLogFraction ? n[j] : std::exp(lnn[j])) * scale;
    result.moles[gas[j].candidate] = moles;
    gas_total += moles;
  }
  for (std::size_t j = 0; j < S; ++j) {
    result.mole_fractions[gas[j].candidate] = result.moles[gas[j].candidate] / gas_total;
  }
  for (std::size_t c = 0; c < C; ++c) {
    const double moles = included[c] != 0 ? nc[c] * scale : 0.0;
    result.moles[condensed[c].candidate] = moles;
    if (moles > 0.0 && solver.names_[condensed[c].candidate] == "C(gr)") result.graphite_present = true;
  }
  result.total_gas_moles = gas_total;
  result.iterations = iterations;
  result.enthalpy_J = enthalpy * kR * T * scale;
  result.frozen_heat_capacity_J_per_K = frozen_cp * kR * scale;
  result.equilibrium_heat_capacity_J_per_K = equilibrium_cp * kR * scale;
  result.element_potentials.fill(0.0);
  for (int r = 0; r < E; ++r)
    result.element_potentials[element_of_row[static_cast<std::size_t>(r)]] = pi[static_cast<std::size_t>(r)];
  result.element_potential_slopes = result_potential_slopes;
  result.gas_moles_slope = result_gas_moles_slope;

  // Element balances of the reported amounts, every active element (dependent rows included).
  ElementAmounts products;
  for (const std::vector<Term>* terms : {&gas, &condensed}) {
    for (const Term& t : *terms) {
      const Candidate& c = solver.candidates_[t.candidate];
      for (int e = 0; e < c.element_count; ++e) {
        const std::size_t k = c.elements[static_cast<std::size_t>(e)];
        products.moles[k] += c.atoms[k] * result.moles[t.candidate];
      }
    }
  }
  result.element_residual = 0.0;
  double dependent_residual = 0.0;
  for (std::size_t k = 0; k < kElementCount; ++k) {
    if (!active[k]) continue;
    const double miss = std::abs(products.moles[k] - b_in.moles[k]) / b_in.moles[k];
    result.element_residual = std::max(result.element_residual, miss);
    if (!independent[k]) dependent_residual = std::max(dependent_residual, miss);
  }
  if (dependent_residual > kDependentRowTolerance) {
    throw units::InputError(fmt::format(
        "species = \"{}\": these products cannot hold the feed's elements in its proportions (elements {}); "
        "add products that can",
        fmt::join(solver.names_, ","), element_list(active)));
  }
  if (!(result.element_residual <= 1e3 * options.element_tolerance)) {
    throw ConvergenceError("element balances not met at the end", iterations, result.element_residual, T, P);
  }
  return result;
}

}  // namespace stackbound::core
