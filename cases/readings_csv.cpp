#include "stackbound/cases/readings_csv.hpp"

#include <algorithm>
#include <cmath>
#include <sstream>

// date::parse's internals trip a false -Wmaybe-uninitialized of GCC 12 at -O3 (in the library's code).
#if defined(__GNUC__) && !defined(__clang__)
#pragma GCC diagnostic ignored "-Wmaybe-uninitialized"
#endif
#include <date/date.h>
#include <fast_float/fast_float.h>
#include <fmt/format.h>

#include "stackbound/units/input_error.hpp"
#include "stackbound/units/plain_text.hpp"

namespace stackbound::cases {

namespace {

// Far above any analyser export: a longer line is refused as not a readings file.
constexpr std::size_t kMaxLineBytes = std::size_t{1} << 16;

std::string_view trim(std::string_view text) {
  while (!text.empty() && (text.front() == ' ' || text.front() == '\t')) text.remove_prefix(1);
  while (!text.empty() && (text.back() == ' ' || text.back() == '\t' || text.back() == '\r')) text.remove_suffix(1);
  if (text.size() >= 2 && text.front() == '"' && text.back() == '"') text = text.substr(1, text.size() - 2);
  return text;
}

// Digits of a fixed width at `text[at]`; -1 when not all digits.
int digits(std::string_view text, std::size_t at, std::size_t width) {
  if (at + width > text.size()) return -1;
  int value = 0;
  for (std::size_t i = at; i < at + width; ++i) {
    if (text[i] < '0' || text[i] > '9') return -1;
    value = value * 10 + (text[i] - '0');
  }
  return value;
}

struct IsoTime {
  std::chrono::seconds local{0};          // wall-clock seconds since the epoch
  std::optional<std::chrono::seconds> offset;  // stated offset (Z: 0)
};

// "YYYY-MM-DD[T ]hh:mm[:ss[.fff]][Z|+hh:mm|+hhmm|-hh:mm]"; nullopt when it is not that.
std::optional<IsoTime> parse_iso(std::string_view s) {
  const int y = digits(s, 0, 4), mo = digits(s, 5, 2), d = digits(s, 8, 2), h = digits(s, 11, 2), mi = digits(s, 14, 2);
  if (y < 0 || mo < 0 || d < 0 || h < 0 || mi < 0 || s[4] != '-' || s[7] != '-' || (s[10] != 'T' && s[10] != ' ') ||
      s[13] != ':') {
    return std::nullopt;
  }
  std::size_t at = 16;
  int sec = 0;
  if (at < s.size() && s[at] == ':') {
    sec = digits(s, at + 1, 2);
    if (sec < 0) return std::nullopt;
    at += 3;
    if (at < s.size() && (s[at] == '.' || s[at] == ',')) {  // fractions of a second are dropped
      ++at;
      while (at < s.size() && s[at] >= '0' && s[at] <= '9') ++at;
    }
  }
  const date::year_month_day ymd{date::year{y}, date::month{static_cast<unsigned>(mo)}, date::day{static_cast<unsigned>(d)}};
  if (!ymd.ok() || h > 23 || mi > 59 || sec > 59) return std::nullopt;
  IsoTime time;
  time.local = date::sys_days{ymd}.time_since_epoch() + std::chrono::hours(h) + std::chrono::minutes(mi) +
               std::chrono::seconds(sec);
  if (at == s.size()) return time;
  if (s[at] == 'Z' && at + 1 == s.size()) {
    time.offset = std::chrono::seconds{0};
    return time;
  }
  if (s[at] != '+' && s[at] != '-') return std::nullopt;
  const int oh = digits(s, at + 1, 2);
  const std::size_t minute_at = (at + 3 < s.size() && s[at + 3] == ':') ? at + 4 : at + 3;
  const int om = digits(s, minute_at, 2);
  if (oh < 0 || om < 0 || oh > 18 || om > 59 || minute_at + 2 != s.size()) return std::nullopt;
  const std::chrono::seconds offset = std::chrono::hours(oh) + std::chrono::minutes(om);
  time.offset = s[at] == '-' ? -offset : offset;
  return time;
}

// An impossible value of a slot (SI / slot units), or nullopt.
std::optional<std::string> impossible(ReadingSlot slot, double v, emissions::O2Basis basis) {
  // Far beyond any stack gas in any unit; keeps sums finite.
  if (std::abs(v) > 1e12) return "implausibly large";
  switch (slot) {
    case ReadingSlot::o2:
      if (v < 0.0 || v > 0.21) return "O2 must be between 0 % and 21 %";
      if (v * 100.0 >= emissions::o2_basis_percent(basis)) return "O2 at or above the O2 basis: no correction possible";
      return std::nullopt;
    case ReadingSlot::co2: return (v < 0.0 || v > 1.0) ? std::optional<std::string>("CO2 must be between 0 % and 100 %") : std::nullopt;
    case ReadingSlot::moisture: return (v < 0.0 || v >= 1.0) ? std::optional<std::string>("moisture must be >= 0 % and < 100 %") : std::nullopt;
    case ReadingSlot::ambient_humidity: return (v < 0.0 || v > 1.0) ? std::optional<std::string>("relative humidity must be between 0 % and 100 %") : std::nullopt;
    case ReadingSlot::ambient_temperature: return v <= 0.0 ? std::optional<std::string>("temperature must be above 0 K") : std::nullopt;
    case ReadingSlot::ambient_pressure:
    case ReadingSlot::inlet_pressure: return v <= 0.0 ? std::optional<std::string>("pressure must be above 0 Pa") : std::nullopt;
    default: return v < 0.0 ? std::optional<std::string>("must not be negative") : std::nullopt;
  }
}

}  // namespace

std::string_view row_problem_name(RowProblemKind kind) {
  switch (kind) {
    case RowProblemKind::field_count: return "field_count";
    case RowProblemKind::not_a_number: return "not_a_number";
    case RowProblemKind::empty_value: return "empty_value";
    case RowProblemKind::bad_time: return "bad_time";
    case RowProblemKind::nonexistent_time: return "nonexistent_time";
    case RowProblemKind::out_of_order: return "out_of_order";
    case RowProblemKind::duplicate_time: return "duplicate_time";
    case RowProblemKind::impossible_value: break;
  }
  return "impossible_value";
}

ReadingsCsvReader::ReadingsCsvReader(const ReadingsSpec& spec, emissions::O2Basis o2_basis, std::istream& input,
                                     std::string origin)
    : spec_(spec), o2_basis_(o2_basis), input_(input), origin_(std::move(origin)), clock_(spec.time.zone, "readings.time.zone") {
  if (!read_line()) throw units::InputError(fmt::format("{}: no header row (the file is empty)", origin_));
  split();
  header_fields_ = fields_.size();
  std::vector<std::string> names;
  for (std::string_view f : fields_) names.emplace_back(trim(f));
  const auto index_of = [&](const std::string& column, const std::string& field) {
    const auto found = std::find(names.begin(), names.end(), column);
    if (found == names.end()) {
      std::vector<std::string> shown;
      for (const std::string& name : names) shown.push_back(units::printable(name));
      throw units::InputError(fmt::format("{}:{}: {} = \"{}\": no such column in the header; the columns are {}", origin_,
                                          line_number_, field, column, fmt::join(shown, ", ")));
    }
    return static_cast<std::size_t>(found - names.begin());
  };
  time_index_ = index_of(spec.time.column, "readings.time.column");
  if (spec.status) status_index_ = index_of(spec.status->column, "readings.status.column");
  for (std::size_t slot = 0; slot < kReadingSlots; ++slot) {
    const auto& source = spec.sources[slot];
    if (source && !source->constant) slot_index_[slot] = index_of(source->column, source->field + ".column");
  }
}

bool ReadingsCsvReader::read_line() {
  while (std::getline(input_, line_)) {
    ++line_number_;
    bytes_ += line_.size() + 1;
    if (line_.size() > kMaxLineBytes) {
      throw units::InputError(fmt::format("{}:{}: a line of {} bytes: not a readings file (at most {} bytes a line)", origin_,
                                          line_number_, line_.size(), kMaxLineBytes));
    }
    if (line_number_ == 1 && line_.rfind("\xEF\xBB\xBF", 0) == 0) line_.erase(0, 3);  // a UTF-8 byte-order mark
    const std::string_view text = trim(line_);
    if (text.empty() || text.front() == '#') continue;
    return true;
  }
  return false;
}

void ReadingsCsvReader::split() {
  fields_.clear();
  const std::string_view text(line_);
  std::size_t start = 0;
  bool quoted = false;
  for (std::size_t i = 0; i < text.size(); ++i) {
    if (text[i] == '"') quoted = !quoted;
    if (text[i] == spec_.delimiter && !quoted) {
      fields_.push_back(text.substr(start, i - start));
      start = i + 1;
    }
  }
  fields_.push_back(text.substr(start));
}

std::optional<RowProblem> ReadingsCsvReader::parse_time(std::string_view text, SysSeconds& time) {
  const auto bad = [&](RowProblemKind kind, std::string_view why) {
    return RowProblem{kind, line_number_, fmt::format("column {} = \"{}\": {}", spec_.time.column, units::printable(text), why)};
  };
  std::optional<IsoTime> parsed;
  if (spec_.time.format.empty()) {
    parsed = parse_iso(text);
    if (!parsed) return bad(RowProblemKind::bad_time, "not an ISO 8601 time (YYYY-MM-DDThh:mm[:ss][+hh:mm])");
  } else {
    std::istringstream stream{std::string(text)};
    date::local_seconds local;
    stream >> date::parse(spec_.time.format, local);
    if (stream.fail()) return bad(RowProblemKind::bad_time, fmt::format("does not match the format \"{}\"", spec_.time.format));
    parsed = IsoTime{local.time_since_epoch(), std::nullopt};
  }
  if (parsed->offset) {
    time = SysSeconds{parsed->local - *parsed->offset};
    return std::nullopt;
  }
  const std::optional<SysSeconds> converted = clock_.from_local(parsed->local, previous_);
  if (!converted) return bad(RowProblemKind::nonexistent_time, fmt::format("does not exist in {} (daylight-saving gap)", clock_.zone_name()));
  time = *converted;
  return std::nullopt;
}

std::optional<RowProblem> ReadingsCsvReader::parse_values(RawReading& reading) {
  for (std::size_t slot = 0; slot < kReadingSlots; ++slot) {
    const auto& source = spec_.sources[slot];
    if (!source) continue;
    if (source->constant) {
      reading.values[slot] = *source->constant;
      continue;
    }
    const std::string_view text = trim(fields_[*slot_index_[slot]]);
    if (text.empty()) return RowProblem{RowProblemKind::empty_value, line_number_, fmt::format("column {} is empty", source->column)};
    double raw = 0.0;
    const auto result = fast_float::from_chars(text.data(), text.data() + text.size(), raw);
    if (result.ec != std::errc() || result.ptr != text.data() + text.size() || !std::isfinite(raw)) {
      return RowProblem{RowProblemKind::not_a_number, line_number_,
                        fmt::format("column {} = \"{}\": not a number", source->column, units::printable(text))};
    }
    const double value = raw * source->scale + source->offset;
    if (const auto why = impossible(static_cast<ReadingSlot>(slot), value, o2_basis_)) {
      return RowProblem{RowProblemKind::impossible_value, line_number_,
                        fmt::format("column {} = {} {}: {}", source->column, text, source->unit, *why)};
    }
    reading.values[slot] = value;
  }
  return std::nullopt;
}

ReadingsCsvReader::Next ReadingsCsvReader::next(RawReading& reading, RowProblem& problem) {
  if (!read_line()) return Next::end;
  split();
  reading.line = line_number_;
  if (fields_.size() != header_fields_) {
    problem = {RowProblemKind::field_count, line_number_,
               fmt::format("{} fields, the header has {}", fields_.size(), header_fields_)};
    return Next::problem;
  }
  std::optional<RowProblem> found = parse_time(trim(fields_[time_index_]), reading.time);
  if (!found && previous_ && reading.time == *previous_) {
    found = RowProblem{RowProblemKind::duplicate_time, line_number_, fmt::format("{} repeats the previous reading's time", clock_.text(reading.time))};
  } else if (!found && previous_ && reading.time < *previous_) {
    found = RowProblem{RowProblemKind::out_of_order, line_number_,
                       fmt::format("{} is before the previous reading ({})", clock_.text(reading.time), clock_.text(*previous_))};
  }
  if (!found) found = parse_values(reading);
  if (found) {
    problem = std::move(*found);
    return Next::problem;
  }
  previous_ = reading.time;
  reading.status = -1;
  reading.calibration = false;
  if (status_index_) {
    const std::string_view status = trim(fields_[*status_index_]);
    const auto& exclude = spec_.status->exclude;
    for (std::size_t i = 0; i < exclude.size(); ++i) {
      if (status == exclude[i]) {
        reading.status = static_cast<int>(i);
        const auto& calibration = spec_.status->calibration;
        reading.calibration = std::find(calibration.begin(), calibration.end(), status) != calibration.end();
        break;
      }
    }
  }
  return Next::reading;
}

}  // namespace stackbound::cases
