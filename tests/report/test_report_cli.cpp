// SPDX-License-Identifier: MIT
// `rackreach report` end to end, with no display. The PDF is read back with poppler's pdfinfo and pdftotext and
// the input hash is compared with what coreutils' sha256sum prints (general-purpose reference tools, not ours);
// the slots that must be named are taken from `rackreach assess --format json`.

#include <sys/wait.h>
#include <unistd.h>

#include <catch2/catch.hpp>
#include <cstdlib>
#include <filesystem>
#include <nlohmann/json.hpp>
#include <optional>
#include <regex>
#include <string>

#include "engine/caution.hpp"
#include "tests/shared_reference.hpp"

namespace fs = std::filesystem;
using nlohmann::json;

namespace {

struct Run {
  int exit_code = -1;
  std::string out, err;
};

std::string quote(const std::string& s) {
  std::string q = "'";
  for (char c : s) q += c == '\'' ? std::string("'\\''") : std::string(1, c);
  return q + "'";
}

fs::path temp_dir() {
  const fs::path dir = fs::temp_directory_path() / ("rackreach-report-test-" + std::to_string(::getpid()));
  fs::create_directories(dir);
  return dir;
}

Run run(const std::string& command) {
  static int counter = 0;
  const fs::path dir = temp_dir();
  const std::string out = (dir / ("out" + std::to_string(counter) + ".txt")).string();
  const std::string err = (dir / ("err" + std::to_string(counter++) + ".txt")).string();
  const std::string cmd = command + " >" + quote(out) + " 2>" + quote(err);
  const int status = std::system(cmd.c_str());
  Run r;
  r.exit_code = WIFEXITED(status) ? WEXITSTATUS(status) : -1;
  r.out = shared_reference::read_text(out).value_or("");
  r.err = shared_reference::read_text(err).value_or("");
  return r;
}

Run run_cli(const std::string& args) { return run(quote(RACKREACH_CLI) + " " + args); }

const std::string demo = shared_reference::repo_path("sample_tasks/kitting-store.rackreach.json");

#ifdef RACKREACH_HAVE_REPORT
const std::string plain = shared_reference::repo_path("sample_tasks/kit-cart-loading.rackreach.json");

/// Runs of white space made one space: pdftotext breaks lines where the page does.
std::string squash(const std::string& s) {
  std::string o;
  bool space = false;
  for (char c : s) {
    if (c == ' ' || c == '\n' || c == '\t' || c == '\r' || c == '\f') {
      space = true;
      continue;
    }
    if (space && !o.empty()) o += ' ';
    space = false;
    o += c;
  }
  return o;
}

/// Without any white space: an id broken over two lines of a narrow table cell reads back whole.
std::string strip(const std::string& s) {
  std::string o;
  for (char c : s)
    if (c != ' ' && c != '\n' && c != '\t' && c != '\r' && c != '\f') o += c;
  return o;
}

/// The hash as coreutils prints it.
std::string sha256sum(const std::string& file) {
  const Run r = run("sha256sum " + quote(file));
  REQUIRE(r.exit_code == 0);
  return r.out.substr(0, 64);
}

bool have_tool(const char* tool) { return run(std::string("command -v ") + tool).exit_code == 0; }

/// Everything a report of the demo store must hold, in its text.
void check_demo_content(const std::string& text) {
  const std::string t = squash(text);
  const json project = json::parse(*shared_reference::read_text(demo));
  CHECK_THAT(t, Catch::Matchers::Contains(project["site"].get<std::string>()));
  CHECK_THAT(t, Catch::Matchers::Contains(project["assessor"].get<std::string>()));
  CHECK_THAT(t, Catch::Matchers::Contains(sha256sum(demo)));
  for (const auto& rack : project["racks"]) CHECK_THAT(t, Catch::Matchers::Contains("Rack " + rack["id"].get<std::string>()));
  const Run assess = run_cli("assess " + quote(demo) + " --format json");
  REQUIRE(assess.exit_code == 0);
  const json a = json::parse(assess.out);
  int above = 0;
  for (const auto& f : a["store"]["findings"])
    if (!f["truck_access"].get<bool>() && f["li"].is_number() && f["li"].get<double>() > 1.0) {
      ++above;
      INFO("slot above LI 1: " << f["slot"]);
      CHECK_THAT(t, Catch::Matchers::Contains(" " + f["slot"].get<std::string>() + " "));
    }
  CHECK(above > 0);  // the demo store has slots to name
  CHECK_THAT(t, Catch::Matchers::Contains(squash(rackreach::caution_text)));
  CHECK_THAT(t, Catch::Matchers::Contains("published cases passed: 26 of 26"));
  CHECK_THAT(t, Catch::Matchers::Contains("Sign-off"));
  CHECK_THAT(t, Catch::Matchers::Contains("Level limits"));
  CHECK_THAT(t, Catch::Matchers::Contains("Rackreach 0."));
}

#endif

}  // namespace

#ifdef RACKREACH_HAVE_REPORT

TEST_CASE("Report of the demo store as PDF: pages, site, input hash, racks, slots above LI 1, cautions",
          "[report][pdf]") {
  if (!have_tool("pdftotext") || !have_tool("pdfinfo")) {
    WARN("poppler-utils missing (scripts/install-deps.sh installs them): PDF not read back, not passed");
    return;
  }
  const fs::path pdf = temp_dir() / "demo.pdf";
  fs::remove(pdf);
  const Run r = run_cli("report " + quote(demo) + " --out " + quote(pdf.string()) + " --date 2026-12-01");
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  REQUIRE(fs::exists(pdf));
  const Run info = run("pdfinfo " + quote(pdf.string()));
  REQUIRE(info.exit_code == 0);
  std::smatch m;
  REQUIRE(std::regex_search(info.out, m, std::regex("Pages:\\s+(\\d+)")));
  const int pages = std::stoi(m[1]);
  CHECK(pages >= 10);
  CHECK(pages <= 40);
  CHECK_THAT(info.out, Catch::Matchers::Contains("Rackreach"));  // Creator
  CHECK_THAT(r.out, Catch::Matchers::Contains(std::to_string(pages) + " pages"));
  const Run text = run("pdftotext -layout " + quote(pdf.string()) + " -");
  REQUIRE(text.exit_code == 0);
  check_demo_content(text.out);
  CHECK_THAT(text.out, Catch::Matchers::Contains("page 1 of " + std::to_string(pages)));
  CHECK_THAT(text.out, Catch::Matchers::Contains("page " + std::to_string(pages) + " of " + std::to_string(pages)));
}

TEST_CASE("Report of the demo store as HTML: the same content, drawings as PNG data", "[report][html]") {
  const fs::path html = temp_dir() / "demo.html";
  fs::remove(html);
  const Run r = run_cli("report " + quote(demo) + " --out " + quote(html.string()) + " --date 2026-12-01");
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  const std::string text = shared_reference::read_text(html.string()).value_or("");
  // Tags out, entities back, for the same text checks as the PDF (by hand: std::regex recurses per character and
  // overflows the stack on the embedded images).
  std::string plain_text;
  bool in_tag = false;
  for (char ch : text) {
    if (ch == '<') in_tag = true;
    else if (ch == '>') in_tag = false, plain_text += ' ';
    else if (!in_tag) plain_text += ch;
  }
  for (std::size_t at = 0; (at = plain_text.find("&amp;", at)) != std::string::npos; ++at) plain_text.replace(at, 5, "&");
  check_demo_content(plain_text);
  const json project = json::parse(*shared_reference::read_text(demo));
  std::size_t images = 0;
  for (std::size_t at = 0; (at = text.find("<img src=\"data:image/png;base64,", at)) != std::string::npos; ++at) ++images;
  CHECK(images == project["racks"].size());
}

TEST_CASE("With --date two runs write identical bytes (HTML and PDF)", "[report][determinism]") {
  const fs::path dir = temp_dir();
  // Three runs each: the PDF writer once embedded its fonts in an order that changed from run to run (Qt's per-process
  // hash seed), which two runs alone may miss.
  for (const char* ext : {"html", "pdf"}) {
    std::optional<std::string> first;
    for (int i = 0; i < 3; ++i) {
      const fs::path f = dir / ("same-" + std::to_string(i) + "." + ext);
      REQUIRE(run_cli("report " + quote(demo) + " --out " + quote(f.string()) + " --date 2026-12-01T10:20:30Z").exit_code == 0);
      const auto bytes = shared_reference::read_text(f.string());
      REQUIRE(bytes);
      INFO(ext << " run " << i);
      CHECK(bytes->size() > 1000);
      if (!first) first = bytes;
      else CHECK(*bytes == *first);
    }
  }
  // Another date changes the report's date, and only that.
  const fs::path c = dir / "other-date.html";
  REQUIRE(run_cli("report " + quote(demo) + " --out " + quote(c.string()) + " --date 2026-12-02").exit_code == 0);
  const std::string other = *shared_reference::read_text(c.string());
  const std::string same = *shared_reference::read_text((dir / "same-0.html").string());
  CHECK(other != same);
  auto replace_all = [](std::string s, const std::string& from, const std::string& to) {
    for (std::size_t at = 0; (at = s.find(from, at)) != std::string::npos; at += to.size()) s.replace(at, from.size(), to);
    return s;
  };
  CHECK(replace_all(other, "2026-12-02", "D") == replace_all(same, "2026-12-01T10:20:30Z", "D"));
}

TEST_CASE("A plain lift-job file gets a report: cover, method, tasks, warnings, cautions, sign-off", "[report][plain]") {
  const fs::path pdf = temp_dir() / "plain.pdf";
  const Run r = run_cli("report " + quote(plain) + " --out " + quote(pdf.string()) + " --date 2026-12-01 --assessor "
                        "'Q. Tester' --revision B");
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  if (!have_tool("pdftotext")) {
    WARN("pdftotext missing: text not read back, not passed");
    return;
  }
  const std::string raw = run("pdftotext " + quote(pdf.string()) + " -").out;
  const std::string t = squash(raw);
  const json project = json::parse(*shared_reference::read_text(plain));
  for (const auto& job : project["jobs"])
    for (const auto& task : job["tasks"])
      CHECK_THAT(strip(raw), Catch::Matchers::Contains(task["id"].get<std::string>()));
  for (const char* s : {"Method and settings", "Engine self-check", "Lift jobs, task by task",
                        "Warnings and limits of application", "Cautions", "Sign-off", "Q. Tester", "Revision B"})
    CHECK_THAT(t, Catch::Matchers::Contains(s));
  CHECK_THAT(t, Catch::Matchers::Contains(sha256sum(plain)));
  CHECK_THAT(t, !Catch::Matchers::Contains("Rack elevations"));
}

TEST_CASE("Bad input: exit code and message, nothing written", "[report][invalid]") {
  const fs::path dir = temp_dir();
  const fs::path out = dir / "never.pdf";
  fs::remove(out);
  // A missing file: the loader's words, exit 1.
  Run r = run_cli("report " + quote((dir / "missing.rackreach.json").string()) + " --out " + quote(out.string()));
  CHECK(r.exit_code == 1);
  CHECK_THAT(r.err, Catch::Matchers::Contains("missing.rackreach.json"));
  CHECK_FALSE(fs::exists(out));
  // An invalid project: every problem with its path, exit 1.
  const std::string bad = shared_reference::repo_path("tests/data/invalid_unknown_key.json");
  r = run_cli("report " + quote(bad) + " --out " + quote(out.string()));
  CHECK(r.exit_code == 1);
  CHECK_THAT(r.err, Catch::Matchers::Contains("invalid_unknown_key.json"));
  CHECK_THAT(r.err, Catch::Matchers::Contains("no report was written"));
  CHECK_FALSE(fs::exists(out));
  // An output folder that does not exist: exit 1, the path named.
  const std::string unwritable = (dir / "no-such-folder" / "r.pdf").string();
  r = run_cli("report " + quote(demo) + " --out " + quote(unwritable));
  CHECK(r.exit_code == 1);
  CHECK_THAT(r.err, Catch::Matchers::Contains(unwritable));
  CHECK_FALSE(fs::exists(unwritable));
  // Usage: an output that is neither .pdf nor .html, a date that is not one.
  r = run_cli("report " + quote(demo) + " --out " + quote((dir / "r.docx").string()));
  CHECK(r.exit_code == 2);
  CHECK_THAT(r.err, Catch::Matchers::Contains(".pdf or .html"));
  r = run_cli("report " + quote(demo) + " --out " + quote(out.string()) + " --date 2026-13-01");
  CHECK(r.exit_code == 2);
  CHECK_THAT(r.err, Catch::Matchers::Contains("2026-13-01"));
  CHECK_FALSE(fs::exists(out));
  for (const auto& e : fs::directory_iterator(dir))  // no temporary file left behind
    CHECK(e.path().filename().string().find(".tmp") == std::string::npos);
}

#else

TEST_CASE("Without Qt the report command exists and refuses with exit 2", "[report][no-qt]") {
  const fs::path out = temp_dir() / "never.html";
  fs::remove(out);
  const Run r = run_cli("report " + quote(demo) + " --out " + quote(out.string()));
  CHECK(r.exit_code == 2);
  CHECK_THAT(r.err, Catch::Matchers::Contains("built without Qt"));
  CHECK_FALSE(fs::exists(out));
}

#endif
