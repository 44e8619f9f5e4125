// SPDX-License-Identifier: MIT
// report::write_report(), the function the desktop app's File > Export report calls: the SHA-256 against
// coreutils' sha256sum, a failed write that leaves the old file as it was, the options checked first.

#include <unistd.h>

#include <catch2/catch.hpp>
#include <cstdio>
#include <filesystem>
#include <string>

#include "app/report/report_writer.hpp"
#include "engine/io/project_file.hpp"
#include "tests/shared_reference.hpp"

namespace fs = std::filesystem;
using namespace rackreach;
using namespace rackreach::report;

namespace {

std::string sha256sum(const std::string& file) {
  std::string out;
  if (FILE* p = ::popen(("sha256sum '" + file + "'").c_str(), "r")) {
    char buf[128];
    while (std::fgets(buf, sizeof buf, p)) out += buf;
    ::pclose(p);
  }
  return out.substr(0, 64);
}

fs::path temp_dir() {
  const fs::path dir = fs::temp_directory_path() / ("rackreach-report-writer-" + std::to_string(::getpid()));
  fs::create_directories(dir);
  return dir;
}

}  // namespace

TEST_CASE("SHA-256 of the input equals sha256sum's (coreutils), for every sample and for no bytes", "[report][hash]") {
  for (const auto& e : fs::directory_iterator(shared_reference::repo_path("sample_tasks"))) {
    INFO(e.path());
    const auto bytes = shared_reference::read_text(e.path().string());
    REQUIRE(bytes);
    CHECK(calc_sha256_hex(*bytes) == sha256sum(e.path().string()));
  }
  // FIPS 180-4's value for the empty message.
  CHECK(calc_sha256_hex("") == "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
}

TEST_CASE("write_report: HTML of a plain lift-job file, from the bytes given", "[report][writer]") {
  const std::string file = shared_reference::repo_path("sample_tasks/kit-cart-loading.rackreach.json");
  const std::string bytes = *shared_reference::read_text(file);
  const LoadResult loaded = load_project_text(bytes);
  REQUIRE(loaded.project);
  const fs::path out = temp_dir() / "plain.html";
  ReportOptions o;
  o.date = "2026-12-01";
  const ReportResult r = write_report(*loaded.project, {"kit-cart-loading.rackreach.json", bytes}, out.string(), o);
  INFO((r.problems.empty() ? std::string() : r.problems.front()));
  REQUIRE(r.written);
  CHECK(r.self_check_passed);
  const std::string html = *shared_reference::read_text(out.string());
  CHECK(r.bytes == html.size());
  CHECK_THAT(html, Catch::Matchers::Contains(sha256sum(file)));
  CHECK_THAT(html, Catch::Matchers::Contains("kit-cart-loading.rackreach.json"));
}

TEST_CASE("write_report: a failed write leaves the old file as it was; bad options write nothing", "[report][writer]") {
  const std::string file = shared_reference::repo_path("sample_tasks/kit-cart-loading.rackreach.json");
  const std::string bytes = *shared_reference::read_text(file);
  const LoadResult loaded = load_project_text(bytes);
  REQUIRE(loaded.project);
  // The output path is a folder with a file in it: the rename over it fails, and what was there stays (this fails
  // for root as well, unlike a read-only folder).
  const fs::path dir = temp_dir() / "occupied";
  const fs::path out = dir / "old.pdf";
  fs::create_directories(out);
  { std::FILE* f = std::fopen((out / "keep").string().c_str(), "w"); std::fputs("old", f); std::fclose(f); }
  ReportResult r = write_report(*loaded.project, {"p", bytes}, out.string(), {});
  CHECK_FALSE(r.written);
  REQUIRE(!r.problems.empty());
  CHECK_THAT(r.problems.front(), Catch::Matchers::Contains(out.string()));
  CHECK(fs::is_directory(out));
  CHECK(*shared_reference::read_text((out / "keep").string()) == "old");
  for (const auto& e : fs::directory_iterator(dir)) CHECK(e.path() == out);  // no temporary file left beside it
  ReportOptions bad;
  bad.date = "01/12/2026";
  r = write_report(*loaded.project, {"p", bytes}, (dir / "new.pdf").string(), bad);
  CHECK_FALSE(r.written);
  CHECK_THAT(r.problems.front(), Catch::Matchers::Contains("01/12/2026"));
  r = write_report(*loaded.project, {"p", bytes}, (dir / "new.txt").string(), {});
  CHECK_FALSE(r.written);
  CHECK_FALSE(fs::exists(dir / "new.pdf"));
  CHECK_FALSE(fs::exists(dir / "new.txt"));
}
