// SPDX-License-Identifier: MIT
// The report document built from a project and its assessment: the sections a plain lift-job file gets, the
// cover's record (site, assessor, revision, dates, hash), a failed self-check on the cover, and the HTML text.

#include <catch2/catch.hpp>

#include "app/report/report_document.hpp"
#include "app/report/report_html.hpp"
#include "engine/caution.hpp"
#include "engine/io/project_file.hpp"
#include "tests/shared_reference.hpp"

using namespace rackreach;
using namespace rackreach::report;

namespace {

struct Built {
  Project project;
  ProjectAssessment assessment;
  ReportDocument doc;
};

Built build(const std::string& sample, ReportContext ctx) {
  LoadResult r = load_project_file(shared_reference::repo_path(sample));
  REQUIRE(r.project);
  Built b{*r.project, {}, {}};
  b.assessment = assess_project(b.project, AssessOptions{});
  b.doc = build_report(b.project, b.assessment, ctx);
  return b;
}

ReportContext context() {
  ReportContext ctx;
  ctx.input_name = "kit-cart-loading.rackreach.json";
  ctx.input_sha256 = std::string(64, 'a');
  ctx.input_bytes = 123;
  ctx.generated_at = "2026-12-01T08:00:00Z";
  ctx.tool_version = "test";
  ctx.self_check = run_self_check();
  return ctx;
}

std::vector<std::string> titles(const ReportDocument& d) {
  std::vector<std::string> t;
  for (const Section& s : d.sections) t.push_back(s.title);
  return t;
}

std::string cover_value(const ReportDocument& d, const std::string& key) {
  for (const auto& row : d.cover.rows)
    if (row[0].text == key) return row[1].text;
  return "(missing)";
}

}  // namespace

TEST_CASE("A plain lift-job file gets cover, method, self-check, tasks, warnings, cautions and sign-off",
          "[report][document]") {
  const Built b = build("sample_tasks/kit-cart-loading.rackreach.json", context());
  CHECK(titles(b.doc) == std::vector<std::string>{"Method and settings", "Engine self-check", "Lift jobs, task by task",
                                                  "Warnings and limits of application, per task", "Cautions",
                                                  "Sign-off"});
  CHECK(cover_value(b.doc, "Input SHA-256") == std::string(64, 'a'));
  CHECK(cover_value(b.doc, "Report date") == "2026-12-01T08:00:00Z");
  CHECK(cover_value(b.doc, "Site") == b.project.info.site.value_or("not given"));
  CHECK(cover_value(b.doc, "Revision") == b.project.info.revision.value_or("not given"));
  CHECK_THAT(cover_value(b.doc, "Engine self-check"), Catch::Matchers::StartsWith("published cases passed: 26 of 26"));
  // Every task of the file appears in the warnings table, once.
  const Section& w = b.doc.sections[3];
  const Table* per_task = nullptr;
  for (const Block& bl : w.blocks)
    if (const Table* t = std::get_if<Table>(&bl); t && t->header.size() == 4) per_task = t;
  REQUIRE(per_task);
  std::size_t tasks = 0;
  for (const LiftJob& j : b.project.jobs) tasks += j.tasks.size();
  std::size_t rows = 0;
  for (const auto& row : per_task->rows) rows += row[0].text.find(", task ") != std::string::npos ? 1 : 0;
  CHECK(rows == tasks);
}

TEST_CASE("Options override the file's site, assessor and revision", "[report][document]") {
  ReportContext ctx = context();
  ctx.site = "Other site";
  ctx.assessor = "A. Reviewer";
  ctx.revision = "C";
  const Built b = build("sample_tasks/kit-cart-loading.rackreach.json", ctx);
  CHECK(cover_value(b.doc, "Site") == "Other site");
  CHECK(cover_value(b.doc, "Assessor") == "A. Reviewer");
  CHECK(cover_value(b.doc, "Revision") == "C");
  const auto& sign = std::get<SignOff>(b.doc.sections.back().blocks.back());
  CHECK(sign.names.front() == "A. Reviewer");
}

TEST_CASE("A failed self-check is on the cover in an alarm notice, and in the HTML", "[report][document]") {
  ReportContext ctx = context();
  std::vector<CheckCase> cases = find_check_cases();
  cases[1].values[0].expected = 0.99;  // HM of the metric case is 1.00: must fail
  ctx.self_check = run_self_check(cases);
  const Built b = build("sample_tasks/kit-cart-loading.rackreach.json", ctx);
  REQUIRE(!b.doc.cover_blocks.empty());
  const auto* alarm = std::get_if<Notice>(&b.doc.cover_blocks.front());
  REQUIRE(alarm);
  CHECK(alarm->alarm);
  CHECK_THAT(alarm->title, Catch::Matchers::Contains("FAILED"));
  const std::string html = render_html(b.doc, HtmlOptions{});
  CHECK_THAT(html, Catch::Matchers::Contains("ENGINE SELF-CHECK FAILED"));
  CHECK_THAT(html, Catch::Matchers::Contains("FAIL</b>"));
}

TEST_CASE("HTML: the caution, escaped text, a missing drawing said in words", "[report][document]") {
  ReportDocument d;
  d.title = "T <&>";
  d.sections.push_back(Section{"S", false, {Paragraph{"a < b"}, RackDrawing{0, "R1", false, "Rack R1"}}});
  d.cover_blocks.push_back(Notice{"Caution", caution_text, false});
  const std::string html = render_html(d, HtmlOptions{});
  CHECK_THAT(html, Catch::Matchers::Contains("T &lt;&amp;&gt;"));
  CHECK_THAT(html, Catch::Matchers::Contains("a &lt; b"));
  CHECK_THAT(html, Catch::Matchers::Contains(caution_text));
  CHECK_THAT(html, Catch::Matchers::Contains("Drawing of rack R1 not included"));
}
