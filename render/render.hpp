#pragma once
// Umbrella header of the render layer: the report document as text, CSV and HTML (inline SVG plots),
// a run and a comparison as JSON, sweeps as CSV and HTML.
#include "stackbound/render/comparison_json.hpp"
#include "stackbound/render/csv_cell.hpp"
#include "stackbound/render/report_renderers.hpp"
#include "stackbound/render/run_json.hpp"
#include "stackbound/render/run_output.hpp"
#include "stackbound/render/svg_plot.hpp"
#include "stackbound/render/sweep_csv.hpp"
#include "stackbound/render/sweep_html.hpp"
#include "stackbound/render/warnings_json.hpp"
