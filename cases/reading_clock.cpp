#include "stackbound/cases/reading_clock.hpp"

#include <date/date.h>
#include <date/tz.h>

#include <fmt/format.h>

#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {

namespace {

using std::chrono::seconds;

date::local_seconds as_local(seconds since_epoch) { return date::local_seconds{since_epoch}; }

}  // namespace

ReadingClock::ReadingClock(const std::string& zone, std::string_view field) : name_(zone) {
  if (zone == "UTC" || zone == "Z" || zone == "Etc/UTC") {
    name_ = "UTC";
    return;
  }
  try {
    zone_ = date::locate_zone(zone);
  } catch (const std::exception&) {
    throw units::InputError(fmt::format("{} = \"{}\": not a time zone of the system's time-zone database "
                                        "(/usr/share/zoneinfo); use UTC or an IANA name such as Europe/Berlin",
                                        field, zone));
  }
}

std::optional<SysSeconds> ReadingClock::from_local(seconds local_since_epoch, std::optional<SysSeconds> previous) {
  if (zone_ == nullptr) return SysSeconds{local_since_epoch};
  // Fast path: the offset interval of the previous reading.
  const SysSeconds guess{local_since_epoch - cached_offset_};
  if (guess >= cached_begin_ && guess < cached_end_ && guess - cached_begin_ >= std::chrono::hours(2) &&
      cached_end_ - guess >= std::chrono::hours(2)) {
    return guess;
  }
  const date::local_info info = zone_->get_info(as_local(local_since_epoch));
  if (info.result == date::local_info::nonexistent) return std::nullopt;
  SysSeconds t{local_since_epoch - info.first.offset};
  if (info.result == date::local_info::ambiguous) {
    const SysSeconds later{local_since_epoch - info.second.offset};
    if (previous && t <= *previous) t = later;
  }
  offset_at(t);
  return t;
}

seconds ReadingClock::offset_at(SysSeconds t) {
  if (zone_ == nullptr) return seconds{0};
  if (t >= cached_begin_ && t < cached_end_) return cached_offset_;
  const date::sys_info info = zone_->get_info(t);
  cached_begin_ = SysSeconds{info.begin.time_since_epoch()};
  cached_end_ = SysSeconds{info.end.time_since_epoch()};
  cached_offset_ = info.offset;
  return cached_offset_;
}

SysSeconds ReadingClock::hour_start(SysSeconds t) {
  const seconds offset = offset_at(t);
  const seconds local = t.time_since_epoch() + offset;
  return SysSeconds{std::chrono::floor<std::chrono::hours>(local) - offset};
}

SysSeconds ReadingClock::local_midnight_to_sys(seconds local_since_epoch) {
  if (zone_ == nullptr) return SysSeconds{local_since_epoch};
  // choose::earliest: a midnight inside a gap (a few zones shift at midnight) maps to the gap's end.
  return SysSeconds{zone_->to_sys(as_local(local_since_epoch), date::choose::earliest).time_since_epoch()};
}

SysSeconds ReadingClock::day_start(SysSeconds t) {
  const seconds local = t.time_since_epoch() + offset_at(t);
  return local_midnight_to_sys(std::chrono::floor<date::days>(local));
}

SysSeconds ReadingClock::next_day_start(SysSeconds day) {
  const seconds local = day.time_since_epoch() + offset_at(day);
  return local_midnight_to_sys(std::chrono::floor<date::days>(local) + date::days{1});
}

SysSeconds ReadingClock::month_start(SysSeconds t) {
  const seconds local = t.time_since_epoch() + offset_at(t);
  const date::year_month_day ymd{date::sys_days{std::chrono::floor<date::days>(local)}};
  const date::sys_days first{ymd.year() / ymd.month() / 1};
  return local_midnight_to_sys(first.time_since_epoch());
}

SysSeconds ReadingClock::next_month_start(SysSeconds month) {
  const seconds local = month.time_since_epoch() + offset_at(month);
  const date::year_month_day ymd{date::sys_days{std::chrono::floor<date::days>(local)}};
  const date::year_month next = date::year_month{ymd.year(), ymd.month()} + date::months{1};
  return local_midnight_to_sys(date::sys_days{next / 1}.time_since_epoch());
}

std::string ReadingClock::text(SysSeconds t) {
  if (zone_ == nullptr) return date::format("%FT%TZ", t);
  const seconds offset = offset_at(t);
  const date::local_seconds local{t.time_since_epoch() + offset};
  const auto minutes = std::chrono::duration_cast<std::chrono::minutes>(offset).count();
  const long magnitude = minutes < 0 ? -minutes : minutes;
  return date::format("%FT%T", local) + fmt::format("{}{:02}:{:02}", minutes < 0 ? '-' : '+', magnitude / 60, magnitude % 60);
}

}  // namespace stackbound::cases
