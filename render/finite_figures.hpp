#pragma once
// The last check before anything is written: every figure of a document is finite. A NaN or an
// infinity reaching a renderer is a defect of the tool (inputs are checked at load, results by their
// stages), so it is reported as an internal error naming where it sits, and nothing is printed.

#include <stdexcept>
#include <string>

#include <nlohmann/json.hpp>

#include "stackbound/cases/report_document.hpp"

namespace stackbound::render {

// A non-finite figure met at the renderer boundary. Not an input error: the program reports it as an
// internal error with a request to report it.
class NonFiniteFigure : public std::logic_error {
 public:
  using std::logic_error::logic_error;
};

// Throws NonFiniteFigure naming the JSON path of the first number of `document` that is not finite.
void require_finite_json(const nlohmann::json& document);

// The JSON text of `document` (indent 2, final newline). Throws NonFiniteFigure naming the JSON path of
// the first number that is not finite (the JSON library would print it as null).
[[nodiscard]] std::string json_text(const nlohmann::json& document);

// Throws NonFiniteFigure if a summary value, table cell or flag of `report` holds a printed NaN or
// infinity ("nan", "inf", "-inf", as fmt and the standard library print them). Plot series may hold
// NaN: it marks a gap and is never drawn.
void require_finite_figures(const cases::Report& report);

}  // namespace stackbound::render
