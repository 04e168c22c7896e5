#include "stackbound/render/run_output.hpp"

#include "stackbound/cases/run_document.hpp"
#include "stackbound/render/finite_figures.hpp"
#include "stackbound/render/report_renderers.hpp"
#include "stackbound/render/run_json.hpp"

namespace stackbound::render {

std::string render_run(const cases::RunResult& result, const std::string& format, const cases::Provenance& provenance) {
  if (format == "json") return json_text(run_json(result, provenance));
  return render_report(cases::run_document(result, provenance), format);
}

}  // namespace stackbound::render
