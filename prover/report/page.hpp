// The self-contained HTML report: inline CSS, SVG, script and one JSON data block; no network.
//
// Contract with tests (tests/e2e/report_browser.sh): the page reads an initial time from the URL
// fragment (#t=7.5), sets document.body.dataset.ready = "1" after the first render, and records
// every script error or unhandled rejection in <pre id="script-errors">. The data block
// <script type="application/json" id="report-data"> carries, among the rest, the uncovered-area
// samples: "area": {"t_exact": [...], "t": [...], "uncovered": [...], "tolerance": ...}.
#pragma once
#include <string>

#include "report/scene.hpp"

namespace sweepcert {

std::string html_page(const Scene& s);

}  // namespace sweepcert
