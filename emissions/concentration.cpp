#include "stackbound/emissions/concentration.hpp"

#include <cmath>
#include <utility>

#include <fmt/format.h>

namespace stackbound::emissions {

namespace {

std::string number_text(double value, int significant = 10) { return fmt::format("{:.{}g}", value, significant); }

double need_moisture(const ConcentrationContext& context, const Basis& from, const Basis& to) {
  if (!context.moisture_fraction) {
    throw MissingContextError(ContextPiece::moisture,
                              fmt::format("missing context: the stack-gas moisture (H2O mole fraction of the wet gas) "
                                          "is needed to convert \"{}\" to \"{}\" (wet <-> dry)",
                                          from.text(), to.text()));
  }
  const double moisture = *context.moisture_fraction;
  if (!std::isfinite(moisture) || moisture < 0.0 || moisture >= 1.0) {
    throw units::InputError(fmt::format("moisture = {} %: the H2O fraction of the wet gas must be >= 0 % and below 100 %",
                                        percent_text(moisture)));
  }
  return moisture;
}

double need_measured(const std::optional<double>& level, ContextPiece piece, const DiluentReference& from,
                     const DiluentReference& to) {
  if (!level) {
    const std::string_view gas = piece == ContextPiece::measured_o2 ? "O2" : "CO2";
    throw MissingContextError(piece, fmt::format("missing context: the measured {} (dry) is needed to convert from {} to "
                                                 "{}",
                                                 gas, from.text(), to.text()));
  }
  return *level;
}

// The factors of one conversion, in the order applied. When not recording (a sweep), nothing is
// built: `detail` is a callable that writes the detail text, called only for a recorded factor.
class FactorLog {
 public:
  explicit FactorLog(bool record) : record_(record) {}
  template <typename Detail>
  void add(std::string_view name, double value, std::string_view unit, Detail&& detail) {
    if (record_) factors_.push_back({std::string(name), value, std::string(unit), std::forward<Detail>(detail)()});
  }
  [[nodiscard]] std::vector<AppliedFactor> take() { return std::move(factors_); }

 private:
  bool record_;
  std::vector<AppliedFactor> factors_;
};

void push_o2(FactorLog& factors, double& working, double from, double to, O2Basis basis, std::string_view from_label,
             std::string_view to_label) {
  const double factor = o2_correction_factor(from, to, basis, from_label, to_label);
  working *= factor;
  factors.add("O2 correction factor", factor, "1", [&] { return o2_correction_text(from, to, basis); });
}

void push_co2(FactorLog& factors, double& working, double from, double to, std::string_view from_label,
              std::string_view to_label) {
  const double factor = co2_correction_factor(from, to, from_label, to_label);
  working *= factor;
  factors.add("CO2 correction factor", factor, "1", [&] { return co2_correction_text(from, to); });
}

// Dry basis: from one diluent level to another, through "as measured" when the kinds differ.
void change_level(const DiluentReference& from, const DiluentReference& to, const ConcentrationContext& context,
                  double& working, FactorLog& factors) {
  using Kind = DiluentReference::Kind;
  constexpr std::string_view kSourceO2 = "O2 level of the source basis";
  constexpr std::string_view kTargetO2 = "O2 level of the target basis";
  constexpr std::string_view kSourceCo2 = "CO2 level of the source basis";
  constexpr std::string_view kTargetCo2 = "CO2 level of the target basis";
  if (from.kind() == Kind::o2 && to.kind() == Kind::o2) {
    push_o2(factors, working, from.dry_fraction(), to.dry_fraction(), context.o2_basis, kSourceO2, kTargetO2);
    return;
  }
  if (from.kind() == Kind::co2 && to.kind() == Kind::co2) {
    push_co2(factors, working, from.dry_fraction(), to.dry_fraction(), kSourceCo2, kTargetCo2);
    return;
  }
  if (from.kind() == Kind::o2) {
    const double measured = need_measured(context.o2_dry_fraction, ContextPiece::measured_o2, from, to);
    push_o2(factors, working, from.dry_fraction(), measured, context.o2_basis, kSourceO2, "measured O2");
  } else if (from.kind() == Kind::co2) {
    const double measured = need_measured(context.co2_dry_fraction, ContextPiece::measured_co2, from, to);
    push_co2(factors, working, from.dry_fraction(), measured, kSourceCo2, "measured CO2");
  }
  if (to.kind() == Kind::o2) {
    const double measured = need_measured(context.o2_dry_fraction, ContextPiece::measured_o2, from, to);
    push_o2(factors, working, measured, to.dry_fraction(), context.o2_basis, "measured O2", kTargetO2);
  } else if (to.kind() == Kind::co2) {
    const double measured = need_measured(context.co2_dry_fraction, ContextPiece::measured_co2, from, to);
    push_co2(factors, working, measured, to.dry_fraction(), "measured CO2", kTargetCo2);
  }
}

void push_molar_volume(FactorLog& factors, const ConcentrationUnit& unit) {
  const units::NormalConditions& normal = *unit.normal;
  factors.add("molar volume", normal.molar_volume_m3_per_mol() * 1e3, "L/mol", [&] {
    return fmt::format("ideal gas, V_m = R T / p at {} (R = 8.314462618 J/(mol K), CODATA 2018)", normal.description);
  });
}

std::string molar_mass_detail(const Pollutant& pollutant, bool as_no2) {
  if (as_no2) return fmt::format("{} expressed as NO2 (IUPAC atomic weights)", pollutant.name);
  if (find_pollutant(pollutant.name)) return fmt::format("{} (IUPAC atomic weights)", pollutant.name);
  return fmt::format("{} (given by the user)", pollutant.name);
}

// Checks a basis for use with this pollutant; NOx is always "as NO2".
Basis adapt_basis(Basis basis, const Pollutant& pollutant, std::string_view field) {
  if (pollutant.expressed_as_no2) basis.as_no2 = true;
  if (basis.as_no2 && !pollutant.is_nitrogen_oxide()) {
    throw units::InputError(fmt::format("{} = \"{}\": \"as NO2\" applies to NO, NO2 and NOx only, not to {}", field,
                                        basis.text(), pollutant.name));
  }
  return make_basis(std::move(basis.unit), basis.moisture, basis.reference, basis.as_no2, field);
}

// The molar mass of a mass basis; the message text for an unknown one is formed only then.
double molar_mass_for(const Pollutant& pollutant, bool as_no2, const Basis& source, const Basis& target) {
  if (as_no2 || pollutant.has_molar_mass()) return basis_molar_mass_kg_per_mol(pollutant, as_no2, "");
  return basis_molar_mass_kg_per_mol(pollutant, as_no2,
                                     fmt::format("to convert {} to {}", source.unit.symbol, target.unit.symbol));
}

const ConcentrationUnit& ppmv_unit() {
  static const ConcentrationUnit unit = mole_unit("ppmv");
  return unit;
}

}  // namespace

std::string_view context_piece_name(ContextPiece piece) {
  switch (piece) {
    case ContextPiece::moisture: return "moisture";
    case ContextPiece::measured_o2: return "measured O2";
    case ContextPiece::measured_co2: return "measured CO2";
    case ContextPiece::molar_mass: return "molar mass";
  }
  return "context";
}

ConcentrationContext ConcentrationContext::from_wet_flue_gas(double h2o_wet_fraction, double o2_wet_fraction,
                                                             std::optional<double> co2_wet_fraction, O2Basis o2_basis) {
  const auto check = [](double fraction, std::string_view what) {
    if (!std::isfinite(fraction) || fraction < 0.0 || fraction >= 1.0) {
      throw units::InputError(fmt::format("{} = {}: a wet mole fraction must be >= 0 and below 1", what, fraction));
    }
  };
  check(h2o_wet_fraction, "flue gas H2O (wet)");
  check(o2_wet_fraction, "flue gas O2 (wet)");
  if (co2_wet_fraction) check(*co2_wet_fraction, "flue gas CO2 (wet)");
  const double sum = h2o_wet_fraction + o2_wet_fraction + co2_wet_fraction.value_or(0.0);
  if (sum > 1.0 + 1e-12) {
    throw units::InputError(fmt::format("flue gas H2O + O2 + CO2 (wet) = {}: the mole fractions sum above 1", sum));
  }
  ConcentrationContext context;
  context.moisture_fraction = h2o_wet_fraction;
  context.o2_dry_fraction = o2_wet_fraction / (1.0 - h2o_wet_fraction);
  if (co2_wet_fraction) context.co2_dry_fraction = *co2_wet_fraction / (1.0 - h2o_wet_fraction);
  context.o2_basis = o2_basis;
  return context;
}

double basis_molar_mass_kg_per_mol(const Pollutant& pollutant, bool as_no2, std::string_view purpose) {
  if (as_no2) return no2_molar_mass_kg_per_mol();
  if (!pollutant.has_molar_mass()) {
    throw MissingContextError(
        ContextPiece::molar_mass,
        fmt::format("missing context: the molar mass of \"{}\" (not a built-in pollutant) is needed {}{}", pollutant.name,
                    purpose, pollutant_name_hint(pollutant.name)));
  }
  return pollutant.molar_mass_kg_per_mol;
}

Concentration::Concentration(double value, Pollutant pollutant, Basis basis, std::string_view field)
    : value_(value), pollutant_(std::move(pollutant)), basis_(adapt_basis(std::move(basis), pollutant_, field)) {
  if (!std::isfinite(value) || value < 0.0) {
    throw units::InputError(fmt::format("{} = {} {}: a concentration must be a finite number >= 0", field, value,
                                        basis_.unit.symbol));
  }
  if (!basis_.unit.is_mass() && value * basis_.unit.factor > 1.0) {
    throw units::InputError(fmt::format("{} = {} {}: a mole fraction cannot exceed 100 %", field, number_text(value),
                                        basis_.unit.symbol));
  }
}

Concentration Concentration::from_mole_fraction(double mole_fraction, Pollutant pollutant, Moisture moisture) {
  const bool as_no2 = pollutant.expressed_as_no2;
  return Concentration(mole_fraction * 1e6, std::move(pollutant),
                       make_basis(ppmv_unit(), moisture, DiluentReference::as_measured(), as_no2),
                       "mole fraction");
}

Conversion Concentration::convert(const Basis& target_in, const ConcentrationContext& context) const {
  Basis target = adapt_basis(target_in, pollutant_, "target basis");
  const Basis& source = basis_;
  FactorLog factors(context.record_factors);

  // 1. unit -> SI working value: mole fraction, or kg of pollutant per mol of gas.
  double working = source.unit.is_mass() ? value_ * source.unit.kg_per_mol_per_unit() : value_ * source.unit.factor;

  // 2-4. wet/dry and diluent level; amounts of gas scale mole fractions and masses alike.
  const bool same_level = source.reference.same_as(target.reference);
  if (!same_level || source.moisture != target.moisture) {
    if (source.moisture == Moisture::wet) {
      const double moisture = need_moisture(context, source, target);
      const double factor = 1.0 / (1.0 - moisture);
      working *= factor;
      factors.add("dry/wet factor", factor, "1", [&] {
        return fmt::format("wet -> dry: 1/(1 - {}), moisture {} %", number_text(moisture), percent_text(moisture));
      });
    }
    if (!same_level) change_level(source.reference, target.reference, context, working, factors);
    if (target.moisture == Moisture::wet) {
      const double moisture = need_moisture(context, source, target);
      const double factor = 1.0 - moisture;
      working *= factor;
      factors.add("dry/wet factor", factor, "1", [&] {
        return fmt::format("dry -> wet: 1 - {}, moisture {} %", number_text(moisture), percent_text(moisture));
      });
    }
  }

  // 5. mole <-> mass through the molar mass.
  const bool source_mass = source.unit.is_mass();
  const bool target_mass = target.unit.is_mass();
  if (!source_mass && target_mass) {
    const double molar_mass = molar_mass_for(pollutant_, target.as_no2, source, target);
    working *= molar_mass;
    factors.add("molar mass", molar_mass * 1e3, "g/mol", [&] { return molar_mass_detail(pollutant_, target.as_no2); });
    push_molar_volume(factors, target.unit);
  } else if (source_mass && !target_mass) {
    const double molar_mass = molar_mass_for(pollutant_, source.as_no2, source, target);
    working /= molar_mass;
    factors.add("molar mass", molar_mass * 1e3, "g/mol", [&] { return molar_mass_detail(pollutant_, source.as_no2); });
    push_molar_volume(factors, source.unit);
  } else if (source_mass && target_mass) {
    if (source.as_no2 != target.as_no2) {
      const double from = molar_mass_for(pollutant_, source.as_no2, source, target);
      const double to = molar_mass_for(pollutant_, target.as_no2, source, target);
      working *= to / from;
      factors.add("molar-mass ratio", to / from, "1", [&] {
        return fmt::format("{} / {}", molar_mass_detail(pollutant_, target.as_no2),
                           molar_mass_detail(pollutant_, source.as_no2));
      });
    }
    if (source.unit.normal != target.unit.normal) {
      const double factor = source.unit.normal->molar_volume_m3_per_mol() / target.unit.normal->molar_volume_m3_per_mol();
      factors.add("normal-conditions factor", factor, "1", [&] {
        return fmt::format("V_m({}) / V_m({}) = {} L/mol / {} L/mol (ideal gas)", source.unit.normal->key,
                           target.unit.normal->key, number_text(source.unit.normal->molar_volume_m3_per_mol() * 1e3),
                           number_text(target.unit.normal->molar_volume_m3_per_mol() * 1e3));
      });
    }
  }

  // 6. SI -> target unit.
  const double value = target_mass ? working / target.unit.kg_per_mol_per_unit() : working / target.unit.factor;
  if (!std::isfinite(value)) {
    throw units::InputError(fmt::format("{}: converting to \"{}\" overflows the range of numbers", text(), target.text()));
  }
  return {Concentration(Unchecked{}, value, pollutant_, std::move(target)), factors.take()};
}

Concentration Concentration::to(const Basis& target, const ConcentrationContext& context) const {
  ConcentrationContext without_factors = context;
  without_factors.record_factors = false;
  return convert(target, without_factors).result;
}

std::string Concentration::text(int significant) const {
  const std::string basis = basis_.text();
  const std::string rest = basis.substr(basis_.unit.symbol.size() + 2);
  return fmt::format("{} {} {} ({})", number_text(value_, significant), basis_.unit.symbol, pollutant_.name, rest);
}

}  // namespace stackbound::emissions
