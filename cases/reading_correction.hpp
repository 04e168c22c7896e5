#pragma once
// One analyser reading on the case's bases, by the emissions layer's own conversions
// (emissions/concentration.hpp): dry, at the reference O2 on the case's O2 basis, mg/Nm3 at the
// report's normal conditions (NOx as NO2), a mass rate when a flow is mapped; the Fo ratio when O2 and
// CO2 are mapped (emissions/fo_factor.hpp); NOx at 15 % O2 corrected to ISO ambient conditions for a
// gas turbine with mapped ambient columns (emissions/gas_turbine_iso.hpp).

#include <array>
#include <cstddef>
#include <optional>
#include <vector>

#include "stackbound/cases/case_definition.hpp"
#include "stackbound/cases/readings_csv.hpp"
#include "stackbound/emissions/basis.hpp"

namespace stackbound::cases {

// The per-pollutant figures kept for averages, in this order.
enum class FigureKey : std::size_t { ppmvd, ppmvd_at_ref_o2, mg_per_Nm3_at_ref_o2, kg_per_h, iso_corrected_ppmvd_at_15_o2 };
inline constexpr std::size_t kFigureKeys = 5;
inline constexpr std::size_t kMaxReadingPollutants = 4;

struct CorrectedReading {
  // By index of ReadingsSpec::pollutants, by FigureKey; NaN where a figure does not apply.
  std::array<std::array<double, kFigureKeys>, kMaxReadingPollutants> figures{};
  double o2_dry_fraction = 0.0;       // NaN when O2 is not mapped
  std::optional<double> fo;           // when O2 and CO2 are mapped
};

class ReadingCorrector {
 public:
  // `reference_o2_dry_fraction`: the case's reference O2 (stated or the plant type's preset).
  ReadingCorrector(const CaseDefinition& definition, const ReadingsSpec& spec, double reference_o2_dry_fraction);

  // Throws units::InputError (a conversion the reading's values make impossible).
  [[nodiscard]] CorrectedReading correct(const RawReading& reading) const;

  // Whether the gas-turbine ISO column is computed, and whether its humidity / pressure terms are
  // assumed at ISO (not mapped): for the report's assumptions.
  [[nodiscard]] bool gas_turbine_iso() const { return gas_turbine_iso_; }

 private:
  [[nodiscard]] double iso_factor(const RawReading& reading) const;

  const ReadingsSpec& spec_;
  emissions::O2Basis o2_basis_;
  std::vector<emissions::Basis> targets_;       // ppmvd, ppmvd at ref, mg/Nm3 at ref
  double reference_o2_ = 0.0;
  double kg_per_mol_per_mg_ = 0.0;              // of mg/Nm3 at the report's normal conditions
  std::vector<double> molar_masses_;            // per pollutant, of its mass basis (NO2 for NOx)
  emissions::Basis at_15_o2_;
  std::optional<std::size_t> nox_index_;
  bool gas_turbine_iso_ = false;
};

}  // namespace stackbound::cases
