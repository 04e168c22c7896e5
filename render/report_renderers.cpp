#include "stackbound/render/report_renderers.hpp"

namespace stackbound::render {

std::string render_report(const Report& report, const std::string& format) {
  if (format == "csv") return render_csv(report);
  if (format == "html") return render_html(report);
  return render_text(report);
}

}  // namespace stackbound::render
