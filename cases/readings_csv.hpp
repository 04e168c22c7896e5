#pragma once
// A streaming reader of analyser readings (CSV with a header row), one row at a time in constant
// memory: the `readings` mapping picks the columns, numbers are parsed with fast_float, time stamps as
// ISO 8601 (an offset or Z taken as is, else the mapping's zone) or by the mapping's format. A row that
// cannot be a reading is returned as a RowProblem with its line and kind, never silently dropped.
// Blank lines and lines starting with '#' are skipped (comments, such as an "invented data" note).

#include <array>
#include <cstddef>
#include <istream>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "stackbound/cases/reading_clock.hpp"
#include "stackbound/cases/readings_spec.hpp"
#include "stackbound/emissions/reference_correction.hpp"

namespace stackbound::cases {

enum class RowProblemKind {
  field_count,       // not as many fields as the header
  not_a_number,      // a mapped value is no finite number
  empty_value,       // a mapped value is empty
  bad_time,          // the time stamp cannot be read
  nonexistent_time,  // a local time inside a daylight-saving gap
  out_of_order,      // earlier than the previous reading
  duplicate_time,    // the same instant as the previous reading
  impossible_value,  // O2 above 21 % (or at the O2 basis), a negative concentration, moisture >= 100 % ...
};
inline constexpr std::size_t kRowProblemKinds = 8;
std::string_view row_problem_name(RowProblemKind kind);  // "field_count", ...

struct RowProblem {
  RowProblemKind kind = RowProblemKind::field_count;
  std::size_t line = 0;
  std::string detail;  // "column NOx = \"abc\": not a number"
};

struct RawReading {
  SysSeconds time{};
  std::size_t line = 0;
  std::array<double, kReadingSlots> values{};  // slot units (readings_spec.hpp); unmapped slots 0
  int status = -1;            // index into ReadingStatusSpec::exclude; -1: not excluded
  bool calibration = false;   // the status is a calibration or maintenance value
};

class ReadingsCsvReader {
 public:
  // Reads the header; throws units::InputError "<origin>:<line>: ..." when a mapped column is missing.
  ReadingsCsvReader(const ReadingsSpec& spec, emissions::O2Basis o2_basis, std::istream& input, std::string origin);

  enum class Next { reading, problem, end };
  // The next row: a reading (filled in `reading`) or a problem (in `problem`), or the end.
  Next next(RawReading& reading, RowProblem& problem);

  [[nodiscard]] std::size_t bytes_read() const { return bytes_; }
  [[nodiscard]] const std::string& origin() const { return origin_; }
  [[nodiscard]] ReadingClock& clock() { return clock_; }

 private:
  bool read_line();
  void split();
  std::optional<RowProblem> parse_time(std::string_view text, SysSeconds& time);
  std::optional<RowProblem> parse_values(RawReading& reading);

  const ReadingsSpec& spec_;
  emissions::O2Basis o2_basis_;
  std::istream& input_;
  std::string origin_;
  ReadingClock clock_;
  std::string line_;
  std::vector<std::string_view> fields_;
  std::size_t line_number_ = 0;
  std::size_t bytes_ = 0;
  std::size_t header_fields_ = 0;
  std::size_t time_index_ = 0;
  std::optional<std::size_t> status_index_;
  std::array<std::optional<std::size_t>, kReadingSlots> slot_index_{};
  std::optional<SysSeconds> previous_;
};

}  // namespace stackbound::cases
