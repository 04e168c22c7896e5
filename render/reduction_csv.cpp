#include <cmath>

#include <fmt/format.h>

#include "stackbound/render/csv_cell.hpp"
#include "stackbound/render/reduction_output.hpp"

namespace stackbound::render {

using namespace stackbound::cases;

namespace {

std::string cell(double v) { return std::isfinite(v) ? fmt::format("{:.6g}", v) : std::string(); }


}  // namespace

// Columns: start, end, valid, invalid_reason, readings, excluded, missing, O2, Fo, then per pollutant
// each figure with its unit in the header ("NOx_mg_per_Nm3_at_ref_o2"); empty cells where no value.
std::string reduction_csv_header(const ReductionDocument& document) {
  std::string out = "start,end,valid,invalid_reason,readings,excluded_readings,missing_readings,o2_percent_dry,fo";
  for (const std::string& p : document.pollutants) {
    for (std::size_t k = 0; k < kFigureKeys; ++k) {
      if (figure_reported(document, p, static_cast<FigureKey>(k))) out += fmt::format(",{}_{}", p, figure_key_name(static_cast<FigureKey>(k)));
    }
    out += fmt::format(",{}_validated_mg_per_Nm3_at_ref_o2", p);
  }
  return out + '\n';
}

std::string reduction_csv_row(const ReductionDocument& document, const ReductionPeriod& period) {
  std::string out = fmt::format("{},{},{},{},{},{},{},{},{}", period.start_text, period.end_text, period.valid ? "true" : "false",
                                csv_cell(period.invalid_reason), period.readings, period.excluded, period.missing,
                                cell(period.o2_percent_dry), cell(period.fo));
  for (const PeriodPollutant& v : period.values) {
    for (std::size_t k = 0; k < kFigureKeys; ++k) {
      if (figure_reported(document, v.pollutant, static_cast<FigureKey>(k))) out += "," + cell(v.figures[k]);
    }
    out += "," + cell(v.validated_mg_per_Nm3_at_ref_o2);
  }
  return out + '\n';
}

std::string render_reduction_csv(const ReductionDocument& document) {
  std::string out = reduction_csv_header(document);
  for (const ReductionPeriod& period : document.periods) out += reduction_csv_row(document, period);
  return out;
}

std::string render_reduction(const ReductionDocument& document, const std::string& format) {
  if (format == "csv") return render_reduction_csv(document);
  if (format == "html") return render_reduction_html(document);
  return reduction_json(document).dump(2) + "\n";
}

}  // namespace stackbound::render
