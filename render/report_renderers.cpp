#include "stackbound/render/report_renderers.hpp"

#include "stackbound/render/finite_figures.hpp"

namespace stackbound::render {

std::string render_report(const Report& report, const std::string& format) {
  require_finite_figures(report);
  if (format == "csv") return render_csv(report);
  if (format == "html") return render_html(report);
  return render_text(report);
}

}  // namespace stackbound::render
