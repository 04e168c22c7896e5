#include <cmath>

#include "stackbound/cases/readings_csv.hpp"
#include "stackbound/render/reduction_output.hpp"

namespace stackbound::render {

namespace {

using nlohmann::json;
using namespace stackbound::cases;

json number(double v) { return std::isfinite(v) ? json(v) : json(nullptr); }

json period_values(const ReductionDocument& document, const ReductionPeriod& period) {
  json values = json::object();
  for (const PeriodPollutant& p : period.values) {
    json figures = json::object();
    for (std::size_t k = 0; k < kFigureKeys; ++k) {
      const auto key = static_cast<FigureKey>(k);
      if (!figure_reported(document, p.pollutant, key)) continue;
      figures[std::string(figure_key_name(key))] = number(p.figures[k]);
    }
    figures["validated_mg_per_Nm3_at_ref_o2"] = number(p.validated_mg_per_Nm3_at_ref_o2);
    values[p.pollutant] = figures;
  }
  return values;
}

json periods_json(const ReductionDocument& document) {
  json periods = json::array();
  for (const ReductionPeriod& p : document.periods) {
    periods.push_back({{"start", p.start_text},
                       {"end", p.end_text},
                       {"valid", p.valid},
                       {"invalid_reason", p.valid ? json(nullptr) : json(p.invalid_reason)},
                       {"operating", p.operating},
                       {"readings", p.readings},
                       {"excluded_readings", p.excluded},
                       {"missing_readings", p.missing},
                       {"valid_hours", p.valid_hours},
                       {"invalid_hours", p.invalid_hours},
                       {"o2_percent_dry", number(p.o2_percent_dry)},
                       {"fo", number(p.fo)},
                       {"values", period_values(document, p)}});
  }
  return periods;
}

json statistics_json(const FigureStatistics& s) {
  return {{"max", number(s.max)}, {"mean", number(s.mean)}, {"periods", s.periods}};
}

json pollutant_summary_json(const ReductionDocument& document, const PollutantSummary& p) {
  json figures = json::object();
  for (std::size_t k = 0; k < kFigureKeys; ++k) {
    const auto key = static_cast<FigureKey>(k);
    if (!figure_reported(document, p.pollutant, key)) continue;
    figures[std::string(figure_key_name(key))] = statistics_json(p.figures[k]);
  }
  figures["validated_mg_per_Nm3_at_ref_o2"] = statistics_json(p.validated);
  json out = {{"figures", figures},
              {"limit", p.limit_text.empty() ? json(nullptr) : json(p.limit_text)},
              {"limit_mg_per_Nm3_at_ref_o2", number(p.limit_mg_per_Nm3_at_ref_o2)},
              {"periods_compared", p.periods_compared},
              {"periods_above_limit", p.periods_above_limit}};
  if (p.eu) {
    out["eu_ied_tallies"] = {{"valid_days", p.eu->valid_days},
                             {"days_above_110_percent_of_limit", p.eu->days_above_110_percent},
                             {"months", p.eu->months},
                             {"months_above_limit", p.eu->months_above_limit},
                             {"valid_hours", p.eu->valid_hours},
                             {"hours_above_200_percent_of_limit", p.eu->hours_above_200_percent}};
  }
  return out;
}

json fo_json(const std::optional<FoSummary>& fo) {
  if (!fo) return nullptr;
  return {{"readings", fo->readings},
          {"expected", number(fo->expected)},
          {"range", fo->range ? json{{"fuel", fo->range->fuel}, {"low", fo->range->low}, {"high", fo->range->high}} : json(nullptr)},
          {"below_range", fo->below_range},
          {"above_range", fo->above_range},
          {"mean", number(fo->mean)},
          {"min", number(fo->min)},
          {"max", number(fo->max)},
          {"p05", number(fo->p05)},
          {"median", number(fo->median)},
          {"p95", number(fo->p95)}};
}

json bad_rows_json(const ProblemSummary& problems) {
  json counts = json::object();
  for (std::size_t k = 0; k < kRowProblemKinds; ++k) counts[std::string(row_problem_name(static_cast<RowProblemKind>(k)))] = problems.counts[k];
  json first = json::array();
  for (const RowProblem& p : problems.first) first.push_back({{"line", p.line}, {"kind", row_problem_name(p.kind)}, {"detail", p.detail}});
  return {{"total", problems.total()}, {"by_kind", counts}, {"first", first}};
}

json pairs_json(const std::vector<std::pair<std::string, std::size_t>>& pairs) {
  json out = json::object();
  for (const auto& [name, count] : pairs) out[name] = count;
  return out;
}

json summary_json(const ReductionDocument& document) {
  const ReductionSummary& s = document.summary;
  json pollutants = json::object();
  for (const PollutantSummary& p : s.pollutants) pollutants[p.pollutant] = pollutant_summary_json(document, p);
  return {{"first_reading", s.first_reading},
          {"last_reading", s.last_reading},
          {"rows", s.rows},
          {"readings", s.readings},
          {"valid_readings", s.valid_readings},
          {"missing_readings", s.missing_readings},
          {"zero_load_readings", s.zero_load_readings},
          {"excluded_by_status", pairs_json(s.excluded_by_status)},
          {"hours", s.hours},
          {"operating_hours", s.operating_hours},
          {"valid_hours", s.valid_hours},
          {"invalid_hours_by_reason", pairs_json(s.invalid_hours_by_reason)},
          {"availability_percent", number(s.availability_percent)},
          {"periods", s.periods},
          {"valid_periods", s.valid_periods},
          {"pollutants", pollutants},
          {"fo", fo_json(s.fo)},
          {"bad_rows", bad_rows_json(s.problems)}};
}

}  // namespace

json reduction_json(const ReductionDocument& document) {
  json rules = json::array();
  for (const RuleNote& r : document.rules_applied) rules.push_back({{"name", r.name}, {"rule", r.text}, {"source", r.source}});
  return {{"schema", "stackbound-reduce/1"},
          {"case", {{"title", document.title}, {"file", document.case_origin}}},
          {"readings_file", document.readings_origin},
          {"time_zone", document.zone},
          {"rule_set", document.rules},
          {"average", document.average},
          {"reference_o2", document.reference_o2},
          {"reference_o2_percent", document.reference_o2_percent},
          {"o2_basis", document.o2_basis},
          {"normal_conditions", document.normal_conditions},
          {"periods", periods_json(document)},
          {"summary", summary_json(document)},
          {"rules", rules},
          {"warnings", document.warnings},
          {"cautions", document.cautions}};
}

}  // namespace stackbound::render
