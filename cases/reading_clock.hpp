#pragma once
// Time stamps of analyser readings and the local calendar their periods follow: an IANA time zone
// from the system's time-zone database (Howard Hinnant's date library, tz.h with the OS tzdata), or UTC.
// Hours are local hours keyed by their UTC start, so a daylight-saving autumn night has two distinct
// 02:00 hours and a spring night none; days are local calendar days of 23, 24 or 25 hours.

#include <chrono>
#include <optional>
#include <string>
#include <string_view>

namespace date {
class time_zone;
}

namespace stackbound::cases {

using SysSeconds = std::chrono::time_point<std::chrono::system_clock, std::chrono::seconds>;

class ReadingClock {
 public:
  // "UTC" or an IANA name ("Europe/Berlin"). Throws units::InputError naming `field` for an unknown zone.
  ReadingClock(const std::string& zone, std::string_view field);

  [[nodiscard]] const std::string& zone_name() const { return name_; }
  [[nodiscard]] bool is_utc() const { return zone_ == nullptr; }

  // A local wall-clock time (seconds since 1970-01-01 00:00 local) as UTC. In an autumn overlap the
  // earlier instant is taken unless it is not after `previous` (the readings run forward); nullopt
  // for a time that does not exist (the spring gap).
  std::optional<SysSeconds> from_local(std::chrono::seconds local_since_epoch, std::optional<SysSeconds> previous);

  // UTC offset in force at `t`.
  std::chrono::seconds offset_at(SysSeconds t);
  // Start of the local hour and of the local day holding `t`; start of the next local day.
  SysSeconds hour_start(SysSeconds t);
  SysSeconds day_start(SysSeconds t);
  SysSeconds next_day_start(SysSeconds day_start);
  // Start of the local calendar month holding `t`, and of the next.
  SysSeconds month_start(SysSeconds t);
  SysSeconds next_month_start(SysSeconds month_start);
  // "2026-03-29T03:00:00+02:00" (local time with its offset; "Z" in UTC).
  std::string text(SysSeconds t);

 private:
  SysSeconds local_midnight_to_sys(std::chrono::seconds local_since_epoch);

  std::string name_;
  const date::time_zone* zone_ = nullptr;  // nullptr: UTC
  // The offset interval last looked up: readings come in order, so nearly every lookup hits it.
  SysSeconds cached_begin_{};
  SysSeconds cached_end_{};
  std::chrono::seconds cached_offset_{0};
};

}  // namespace stackbound::cases
