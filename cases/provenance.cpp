#include "stackbound/cases/provenance.hpp"

#include <fmt/format.h>

#include "stackbound/version.hpp"

namespace stackbound::cases {

std::string format_run_time(std::chrono::system_clock::time_point run_at) {
  // system_clock is UTC (Unix time); the civil date and time of day by the C++20 calendar types.
  const auto day = std::chrono::floor<std::chrono::days>(run_at);
  const std::chrono::year_month_day date{day};
  const std::chrono::hh_mm_ss time{std::chrono::floor<std::chrono::seconds>(run_at - day)};
  return fmt::format("{:04d}-{:02d}-{:02d}T{:02d}:{:02d}:{:02d}Z", static_cast<int>(date.year()),
                     static_cast<unsigned>(date.month()), static_cast<unsigned>(date.day()), time.hours().count(),
                     time.minutes().count(), time.seconds().count());
}

Provenance make_provenance(const CaseDefinition& definition, std::chrono::system_clock::time_point run_at) {
  return {kVersion, format_run_time(run_at), definition.source_sha256};
}

std::string provenance_line(const Provenance& p) {
  return fmt::format("stackbound {}, run at {}, case file SHA-256 {}", p.version, p.run_at, p.case_sha256);
}

std::vector<std::pair<std::string, std::string>> provenance_summary(const Provenance& p) {
  return {{"Tool version", fmt::format("stackbound {}", p.version)},
          {"Run at", p.run_at},
          {"Case file SHA-256", p.case_sha256}};
}

}  // namespace stackbound::cases
