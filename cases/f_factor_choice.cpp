#include "stackbound/cases/f_factor_choice.hpp"

#include <vector>

#include <fmt/format.h>
#include <fmt/ranges.h>

#include "stackbound/emissions/published_f_factors.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {

namespace em = stackbound::emissions;

namespace {

const em::PublishedFFactors& table_entry(const FFactorSpec& spec, const FuelSpec& fuel) {
  if (!spec.table_key.empty()) return *em::find_published_f_factors(spec.table_key);
  if (fuel.kind == FuelKind::preset) {
    if (const em::PublishedFFactors* entry = em::published_f_factors_of_preset(fuel.preset)) return *entry;
  }
  std::vector<std::string_view> keys;
  for (const em::PublishedFFactors& entry : em::published_f_factors()) keys.push_back(entry.key);
  throw units::InputError(fmt::format(
      "f_factors = \"published\": the fuel is not a preset with an entry in Method 19 Table 19-2; name the "
      "entry, e.g. f_factors: {{published: natural_gas}} (entries: {}), or give the permit's: {{Fd: 8710 dscf/MMBtu}}",
      fmt::join(keys, ", ")));
}

}  // namespace

std::string_view f_factor_choice_name(FFactorChoice choice) {
  switch (choice) {
    case FFactorChoice::computed: return "computed";
    case FFactorChoice::published: return "published";
    case FFactorChoice::stated: break;
  }
  return "stated";
}

FFactorsUsed choose_f_factors(const FFactorSpec& spec, const FuelSpec& fuel, const core::FFactors& computed) {
  FFactorsUsed used;
  used.choice = spec.choice;
  used.fd = em::FFactor::from_scm_per_J(em::FFactorKind::dry, computed.fd_m3_per_J);
  used.fw = em::FFactor::from_scm_per_J(em::FFactorKind::wet, computed.fw_m3_per_J);
  used.fc = em::FFactor::from_scm_per_J(em::FFactorKind::carbon, computed.fc_m3_per_J);
  switch (spec.choice) {
    case FFactorChoice::computed:
      used.source = "computed from the fuel's composition and HHV (Method 19 definitions, Eqs. 19-13 to 19-15)";
      return used;
    case FFactorChoice::published: {
      const em::PublishedFFactors& entry = table_entry(spec, fuel);
      used.fd = em::FFactor::from_scf_per_MMBtu(em::FFactorKind::dry, entry.fd_dscf_per_MMBtu);
      used.fc = em::FFactor::from_scf_per_MMBtu(em::FFactorKind::carbon, entry.fc_scf_per_MMBtu);
      if (entry.fw_wscf_per_MMBtu) used.fw = em::FFactor::from_scf_per_MMBtu(em::FFactorKind::wet, *entry.fw_wscf_per_MMBtu);
      used.source = fmt::format("published for {}: {}{}", entry.fuel_type, em::kPublishedFFactorsSource,
                                entry.fw_wscf_per_MMBtu ? "" : " (no Fw listed: Fw computed from the fuel)");
      return used;
    }
    case FFactorChoice::stated: break;
  }
  used.fd = *spec.fd;
  if (spec.fw) used.fw = *spec.fw;
  if (spec.fc) used.fc = *spec.fc;
  used.source = fmt::format("stated in the case file (report.f_factors){}",
                            spec.fw && spec.fc ? "" : "; those not stated computed from the fuel");
  return used;
}

}  // namespace stackbound::cases
