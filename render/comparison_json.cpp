#include "stackbound/render/comparison_json.hpp"

#include "stackbound/cases/run_document.hpp"

namespace stackbound::render {

using namespace stackbound::cases;

nlohmann::json comparison_json(const Comparison& c, const Provenance& provenance) {
  nlohmann::json digests = nlohmann::json::array();
  for (const RunResult& run : c.runs) digests.push_back(run.definition.source_sha256);
  nlohmann::json cases = nlohmann::json::array();
  for (std::size_t i = 0; i < c.runs.size(); ++i) {
    nlohmann::json values = nlohmann::json::object();
    nlohmann::json differences = nlohmann::json::object();
    for (std::size_t k = 0; k < c.columns.size(); ++k) {
      const double value = c.values[i][k];
      const double first = c.values[0][k];
      if (is_missing(c.columns[k], value) || is_missing(c.columns[k], first) ||
          (c.bases_differ && depends_on_reference_basis(c.columns[k]))) {
        values[c.columns[k].key] = is_missing(c.columns[k], value) ? nlohmann::json(nullptr) : nlohmann::json(value);
        differences[c.columns[k].key] = {{"absolute", nullptr}, {"relative", nullptr}};
        continue;
      }
      values[c.columns[k].key] = value;
      const auto rel = relative_difference(value, first);
      differences[c.columns[k].key] = {{"absolute", value - first}, {"relative", rel ? nlohmann::json(*rel) : nlohmann::json(nullptr)}};
    }
    cases.push_back({{"label", std::string(1, static_cast<char>('A' + i))},
                     {"file", c.runs[i].definition.origin},
                     {"title", c.runs[i].definition.title},
                     {"case_sha256", c.runs[i].definition.source_sha256},
                     {"basis", c.bases[i]},
                     {"values", values},
                     {"difference_from_first", differences},
                     {"findings", c.runs[i].screening.findings}});
  }
  nlohmann::json units = nlohmann::json::object();
  for (const MetricColumn& column : c.columns) units[column.key] = column.header;
  return {{"provenance", {{"version", provenance.version}, {"run_at", provenance.run_at}, {"case_sha256", digests}}},
          {"bound_statement", kBoundStatement},
          {"cases", cases},
          {"columns", units},
          {"flags", c.flags},
          {"cautions", c.cautions}};
}

}  // namespace stackbound::render
