// SPDX-License-Identifier: MIT
// The command line end to end: the published cases through the loader and the CLI's JSON output, every sample
// with empty stderr, every invalid fixture with exit 1 and nothing written, exit codes.

#include <sys/wait.h>

#include <catch2/catch.hpp>
#include <cerrno>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <filesystem>
#include <fstream>
#include <nlohmann/json.hpp>
#include <set>
#include <string>
#include <vector>

#include "tests/shared_reference.hpp"

namespace fs = std::filesystem;
using nlohmann::json;

namespace {

struct Run {
  int exit_code = -1;
  std::string out;
  std::string err;
};

std::string quote(const std::string& s) {
  std::string q = "'";
  for (char c : s) q += c == '\'' ? std::string("'\\''") : std::string(1, c);
  return q + "'";
}

Run run_cli(const std::string& args) {
  static int counter = 0;
  const fs::path dir = fs::temp_directory_path() / ("rackreach-cli-test-" + std::to_string(::getpid()));
  fs::create_directories(dir);
  const std::string out = (dir / ("out" + std::to_string(counter) + ".txt")).string();
  const std::string err = (dir / ("err" + std::to_string(counter++) + ".txt")).string();
  const std::string cmd = quote(RACKREACH_CLI) + " " + args + " >" + quote(out) + " 2>" + quote(err);
  const int status = std::system(cmd.c_str());
  Run r;
  r.exit_code = WIFEXITED(status) ? WEXITSTATUS(status) : -1;
  r.out = shared_reference::read_text(out).value_or("");
  r.err = shared_reference::read_text(err).value_or("");
  return r;
}

/// Compares the engine's JSON for one end of a task with an expected block at a tolerance.
void check_point(const json& actual, const json& expected, double rel_tol, double abs_tol, const std::string& where) {
  for (auto it = expected.begin(); it != expected.end(); ++it) {
    INFO(where << "." << it.key() << ": expected " << it.value() << ", got " << actual.value(it.key(), json()));
    REQUIRE(actual.contains(it.key()));
    REQUIRE(actual[it.key()].is_number());
    const double e = it.value().get<double>();
    const double a = actual[it.key()].get<double>();
    CHECK(std::abs(a - e) <= std::max(abs_tol, rel_tol * std::abs(e)));
  }
}

}  // namespace

TEST_CASE("Published cases through the CLI's JSON output, worksheet and full", "[cli][cases]") {
  // Sources per case in ../shared/reference/cases/*.expected.json: [HB06] 46.7.2 (dish-washing, US units) and the
  // metric package-inspection exercise. Worksheet values at printed precision; full values to 1e-3 relative.
  for (const char* name : {"handbook-dishwashing", "metric-package-inspection"}) {
    const std::string input = shared_reference::path(std::string("reference/cases/") + name + ".input.json");
    const auto expected_text =
        shared_reference::read_text(shared_reference::path(std::string("reference/cases/") + name + ".expected.json"));
    if (!expected_text) {
      WARN("published case " << name << " not found in ../shared: skipped, not passed");
      continue;
    }
    const json expected = json::parse(*expected_text);
    for (const char* mode : {"worksheet", "full"}) {
      const Run r = run_cli("assess " + quote(input) + " --format json --rounding " + mode);
      INFO(name << " " << mode << " stderr: " << r.err);
      REQUIRE(r.exit_code == 0);
      CHECK(r.err.empty());
      const json out = json::parse(r.out);
      CHECK(out["units"]["system"] == expected["units"]);
      CHECK(out["rounding"] == mode);
      for (const auto& ejob : expected["jobs"]) {
        const json* ajob = nullptr;
        for (const auto& j : out["jobs"])
          if (j["id"] == ejob["id"]) ajob = &j;
        REQUIRE(ajob);
        for (const auto& etask : ejob["tasks"]) {
          const json* atask = nullptr;
          for (const auto& t : (*ajob)["tasks"])
            if (t["id"] == etask["id"]) atask = &t;
          REQUIRE(atask);
          CHECK((*atask)["governing"] == etask["governing"]);
          const json& block = etask[mode];
          const bool ws = std::string(mode) == "worksheet";
          for (const char* end : {"origin", "destination"})
            if (block.contains(end))
              check_point((*atask)[end], block[end], ws ? 0.0 : 1e-3, ws ? 1e-9 : 0.0,
                          std::string(name) + "." + mode + "." + end);
        }
      }
    }
  }
}

TEST_CASE("Every sample runs cleanly: readable table and valid JSON, empty stderr", "[cli][samples]") {
  const fs::path dir = shared_reference::repo_path("sample_tasks");
  int count = 0;
  for (const auto& entry : fs::directory_iterator(dir)) {
    if (entry.path().extension() != ".json") continue;
    ++count;
    const std::string file = quote(entry.path().string());
    INFO(entry.path().filename().string());
    const Run table = run_cli("assess " + file);
    CHECK(table.exit_code == 0);
    CHECK(table.err.empty());
    CHECK_THAT(table.out, Catch::Matchers::Contains("Caution: Results screen lifting"));
    const Run js = run_cli("assess " + file + " --format json");
    CHECK(js.exit_code == 0);
    CHECK(js.err.empty());
    const json out = json::parse(js.out);
    CHECK(out["engine"]["version"].is_string());
    CHECK(out["units"]["length"].is_string());
    for (const auto& job : out["jobs"])
      for (const auto& task : job["tasks"]) {
        CHECK((task["li"].is_null() || task["li"].is_number()));
        CHECK((task["li"].is_null() == task["outside_equation"].get<bool>()));
      }
    const Run csv = run_cli("assess " + file + " --format csv");
    CHECK(csv.exit_code == 0);
    CHECK(csv.err.empty());
    const Run check = run_cli("check " + file);
    CHECK(check.exit_code == 0);
  }
  CHECK(count >= 3);
}

TEST_CASE("Invalid input: exit 1, the JSON path named, nothing written to --out", "[cli][invalid]") {
  const fs::path dir = shared_reference::repo_path("tests/data");
  int count = 0;
  for (const auto& entry : fs::directory_iterator(dir)) {
    const std::string stem = entry.path().stem().string();
    if (stem.rfind("invalid_", 0) != 0) continue;
    ++count;
    INFO(stem);
    const fs::path out = fs::temp_directory_path() / ("rackreach-should-not-exist-" + stem + ".json");
    fs::remove(out);
    const Run r = run_cli("assess " + quote(entry.path().string()) + " --format json --out " + quote(out.string()));
    CHECK(r.exit_code == 1);
    CHECK_THAT(r.err, Catch::Matchers::Contains(entry.path().string()));
    CHECK_THAT(r.err, Catch::Matchers::Contains("["));  // every message carries its problem code
    CHECK_FALSE(fs::exists(out));
    CHECK(r.out.empty());
  }
  CHECK(count >= 15);
}

TEST_CASE("Reach results in assess for tasks with shelf geometry", "[cli][reach]") {
  const std::string sample = quote(shared_reference::repo_path("sample_tasks/motor-mount-truck-level.rackreach.json"));
  const Run js = run_cli("assess " + sample + " --format json");
  REQUIRE(js.exit_code == 0);
  CHECK(js.err.empty());
  const json out = json::parse(js.out);
  REQUIRE(out.contains("reach_model"));
  CHECK(out["reach_model"]["workforce"] == "ansur2, 50% women");
  CHECK(out["reach_model"]["parameters_cm"]["ankle_to_rack_face"] == 25.0);
  int with_reach = 0;
  for (const auto& job : out["jobs"])
    for (const auto& task : job["tasks"]) {
      if (!task.contains("reach")) continue;
      ++with_reach;
      const auto& r = task["reach"];
      // The model's H is the standing distance plus the grip depth; V is the grip height (the origin's V).
      CHECK(r["v_cm"] == task["input"]["origin"]["v"]);
      CHECK(r["h_cm"].get<double>() == Approx(task["input"]["origin"]["h"].get<double>()));
      if (task["id"] == "top-shelf-back") {
        // V 182 cm is above the equation's 175 cm: the reach result and the equation agree (VM = 0).
        CHECK(task["origin"]["vm"] == 0.0);
        bool v_limit = false;
        for (const auto& c : r["checks"]) v_limit = v_limit || (c["code"] == "equation_v_limit" && !c["passed"]);
        CHECK(v_limit);
        CHECK(r["depth_zone"] == "beyond maximum reach");
      }
    }
  CHECK(with_reach == 2);
  const Run table = run_cli("assess " + sample);
  CHECK_THAT(table.out, Catch::Matchers::Contains("Reach, task top-shelf-back"));
  CHECK_THAT(table.out, Catch::Matchers::Contains("NOT MET: small worker (5th percentile"));
  // An unknown workforce table is invalid input, named by its JSON path.
  const Run bad = run_cli("assess " + quote(shared_reference::repo_path("tests/data/invalid_workforce_unknown_population.json")));
  CHECK(bad.exit_code == 1);
  CHECK_THAT(bad.err, Catch::Matchers::Contains("no-such-table"));
}

namespace {

/// Compares two JSON documents: the same structure and strings, numbers within a relative tolerance.
void check_same_json(const json& a, const json& e, const std::string& where) {
  INFO(where);
  REQUIRE(a.type() == e.type());
  if (e.is_object()) {
    REQUIRE(a.size() == e.size());
    for (auto it = e.begin(); it != e.end(); ++it) {
      REQUIRE(a.contains(it.key()));
      if (it.key() == "input") continue;  // the path the file was given as
      check_same_json(a[it.key()], it.value(), where + "." + it.key());
    }
  } else if (e.is_array()) {
    REQUIRE(a.size() == e.size());
    for (std::size_t i = 0; i < e.size(); ++i) check_same_json(a[i], e[i], where + "[" + std::to_string(i) + "]");
  } else if (e.is_number()) {
    CHECK(a.get<double>() == Approx(e.get<double>()).epsilon(1e-9).margin(1e-12));
  } else {
    CHECK(a == e);
  }
}

}  // namespace

TEST_CASE("The demo store's review is a golden test", "[cli][store][golden]") {
  // Golden output written by this version and checked by hand against the slot-review rules (our own example).
  const std::string sample = quote(shared_reference::repo_path("sample_tasks/kitting-store.rackreach.json"));
  const Run js = run_cli("assess " + sample + " --format json");
  REQUIRE(js.exit_code == 0);
  CHECK(js.err.empty());
  const auto expected = shared_reference::read_text(shared_reference::repo_path("tests/expected/kitting-store.assess.json"));
  REQUIRE(expected);
  check_same_json(json::parse(js.out), json::parse(*expected), "$");
  // Every band, a truck part, a move to the waist zone, a reach failure and the shift-over-8-hours caution.
  const json out = json::parse(js.out);
  std::set<std::string> bands, remedies;
  bool reach_failure = false;
  for (const auto& f : out["store"]["findings"]) {
    bands.insert(f["band"].get<std::string>());
    for (const auto& r : f["remedies"]) remedies.insert(r["remedy"].get<std::string>());
    if (f.contains("reach") && !f["reach"]["failure"].is_null()) reach_failure = true;
  }
  for (const char* b : {"within limit", "elevated", "high", "very high", "outside equation"}) CHECK(bands.count(b));
  CHECK(remedies.count("move to waist zone"));
  CHECK(remedies.count("truck level only"));
  CHECK(reach_failure);
  bool over_8h = false;
  for (const auto& w : out["store"]["warnings"]) over_8h = over_8h || w["code"] == "limit.duration_over_8h";
  CHECK(over_8h);
  CHECK(out["store"]["routes"].size() == 3);
  // The other formats run cleanly too.
  for (const char* f : {"table", "csv", "html"}) {
    const Run r = run_cli("assess " + sample + " --format " + f);
    INFO(f);
    CHECK(r.exit_code == 0);
    CHECK(r.err.empty());
  }
  const Run limits = run_cli("limits " + sample);
  CHECK(limits.exit_code == 0);
  CHECK_THAT(limits.out, Catch::Matchers::Contains("Level limits"));
  CHECK(run_cli("assess " + sample + " --fail-above 1.0").exit_code == 3);
}

TEST_CASE("CSV round trip through the CLI: export the demo store's parts and slots, import them, same review",
          "[cli][csv]") {
  const std::string sample = quote(shared_reference::repo_path("sample_tasks/kitting-store.rackreach.json"));
  const fs::path dir = fs::temp_directory_path() / ("rackreach-csv-" + std::to_string(::getpid()));
  fs::create_directories(dir);
  const std::string parts = quote((dir / "parts.csv").string()), slots = quote((dir / "slots.csv").string());
  const std::string out = quote((dir / "imported.rackreach.json").string());
  const Run ex = run_cli("export-csv " + sample + " --parts " + parts + " --slots " + slots);
  REQUIRE(ex.exit_code == 0);
  const Run im = run_cli("import " + sample + " --parts " + parts + " --slots " + slots + " --out " + out);
  INFO(im.err);
  REQUIRE(im.exit_code == 0);
  const json a = json::parse(run_cli("assess " + sample + " --format json").out);
  const json b = json::parse(run_cli("assess " + out + " --format json").out);
  check_same_json(b["store"], a["store"], "store");
  // A slot list that names racks the project does not have: exit 1, every problem named, nothing written.
  const std::string bad_out = quote((dir / "not-written.json").string());
  const Run bad = run_cli("import " + sample + " --parts " +
                          quote(shared_reference::repo_path("tests/data/csv/parts_marlow_valley.csv")) + " --slots " +
                          quote(shared_reference::repo_path("tests/data/csv/slots_marlow_valley.csv")) + " --out " + bad_out);
  CHECK(bad.exit_code == 1);
  CHECK_THAT(bad.err, Catch::Matchers::Contains("names no rack of the file"));
  CHECK_FALSE(fs::exists(dir / "not-written.json"));
  fs::remove_all(dir);
}

TEST_CASE("Re-slotting the demo store: moves a supervisor can act on, an improvement, and a fixed point",
          "[cli][reslot]") {
  const std::string sample = quote(shared_reference::repo_path("sample_tasks/kitting-store.rackreach.json"));
  const fs::path dir = fs::temp_directory_path() / ("rackreach-reslot-" + std::to_string(::getpid()));
  fs::create_directories(dir);
  const std::string out = quote((dir / "new.rackreach.json").string());
  const std::string costs = quote((dir / "costs.csv").string());
  const Run r = run_cli("reslot " + sample + " --out " + out + " --format json --costs-out " + costs);
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  CHECK(r.err.empty());
  const json plan = json::parse(r.out);
  CHECK(plan["proven_optimal"] == true);
  CHECK(plan["objective_after"].get<double>() <= plan["objective_before"].get<double>());
  CHECK(plan["objective_after"].get<double>() == Approx(0.0).margin(1e-9));
  REQUIRE_FALSE(plan["moves"].empty());
  // Every move goes to a slot the solver was allowed to use for that part (the costs file lists exactly those).
  const std::string cost_text = shared_reference::read_text((dir / "costs.csv").string()).value_or("");
  for (const auto& m : plan["moves"]) {
    INFO(m.dump());
    const std::string needle = m["part"].get<std::string>() + "@" + m["from"].get<std::string>() + "," +
                               m["to"].get<std::string>() + ",";
    CHECK(cost_text.find(needle) != std::string::npos);
  }
  // The new project assesses with fewer slots above LI 1.0 (common practice: count of slots over the limit).
  auto above = [](const json& review) {
    int n = 0;
    for (const auto& f : review["store"]["findings"]) n += f["li"].is_number() && f["li"].get<double>() > 1.0;
    return n;
  };
  const json a_before = json::parse(run_cli("assess " + sample + " --format json").out);
  const Run after_run = run_cli("assess " + out + " --format json");
  REQUIRE(after_run.exit_code == 0);
  CHECK(above(json::parse(after_run.out)) < above(a_before));
  // Re-slotting the proposal changes nothing.
  const Run again = run_cli("reslot " + out + " --out " + quote((dir / "again.json").string()) + " --format json");
  REQUIRE(again.exit_code == 0);
  CHECK(json::parse(again.out)["moves"].empty());
  // A move cap holds.
  const Run capped = run_cli("reslot " + sample + " --out " + quote((dir / "capped.json").string()) +
                             " --format json --max-moves 2");
  REQUIRE(capped.exit_code == 0);
  CHECK(json::parse(capped.out)["moves"].size() <= 2);
  fs::remove_all(dir);
}

TEST_CASE("Exit codes: usage 2, --fail-above 3, --version, template round trip", "[cli][exit]") {
  CHECK(run_cli("").exit_code == 2);
  CHECK(run_cli("assess").exit_code == 2);
  CHECK(run_cli("assess x.json --format yaml").exit_code == 2);
  const Run v = run_cli("--version");
  CHECK(v.exit_code == 0);
  CHECK_THAT(v.out, Catch::Matchers::StartsWith("rackreach "));
  const std::string sample = quote(shared_reference::repo_path("sample_tasks/kit-cart-loading.rackreach.json"));
  CHECK(run_cli("assess " + sample + " --fail-above 5").exit_code == 0);
  const Run over = run_cli("assess " + sample + " --fail-above 1.0");
  CHECK(over.exit_code == 3);
  CHECK_THAT(over.err, Catch::Matchers::Contains("impeller-floor"));
  // An unreadable file is invalid input, named.
  const Run missing = run_cli("assess /nonexistent/x.rackreach.json");
  CHECK(missing.exit_code == 1);
  CHECK_THAT(missing.err, Catch::Matchers::Contains("/nonexistent/x.rackreach.json"));
  // --out writes the same text as standard output.
  const fs::path out = fs::temp_directory_path() / "rackreach-cli-out.json";
  fs::remove(out);
  CHECK(run_cli("assess " + sample + " --format json --out " + quote(out.string())).exit_code == 0);
  CHECK(shared_reference::read_text(out.string()) == run_cli("assess " + sample + " --format json").out);
  for (const char* units : {"metric", "us"}) {
    const Run t = run_cli(std::string("template --units ") + units);
    REQUIRE(t.exit_code == 0);
    const fs::path tf = fs::temp_directory_path() / (std::string("rackreach-template-") + units + ".json");
    {
      std::FILE* f = std::fopen(tf.c_str(), "w");
      std::fputs(t.out.c_str(), f);
      std::fclose(f);
    }
    CHECK(run_cli("check " + quote(tf.string())).exit_code == 0);
  }
}

namespace {

/// Runs the CLI with its files limited to `limit_blocks` blocks of the shell's `ulimit -f` and SIGXFSZ ignored
/// (an ignored signal stays ignored across exec), so that a write beyond the limit fails with EFBIG as a write to a
/// full disk fails with ENOSPC. Standard output goes to /dev/null, which has no size.
Run run_cli_with_file_size_limit(const std::string& args, int limit_blocks) {
  const fs::path dir = fs::temp_directory_path() / ("rackreach-cli-test-" + std::to_string(::getpid()));
  fs::create_directories(dir);
  const std::string err = (dir / "limited-err.txt").string();
  const std::string cmd = "ulimit -f " + std::to_string(limit_blocks) + "; trap '' XFSZ; " + quote(RACKREACH_CLI) +
                          " " + args + " >/dev/null 2>" + quote(err);
  const int status = std::system(cmd.c_str());
  Run r;
  r.exit_code = WIFEXITED(status) ? WEXITSTATUS(status) : -1;
  r.err = shared_reference::read_text(err).value_or("");
  return r;
}

std::size_t files_in(const fs::path& dir) {
  std::size_t n = 0;
  for (const auto& e : fs::directory_iterator(dir)) n += e.is_regular_file() ? 1 : 0;
  return n;
}

}  // namespace

TEST_CASE("Every bad CSV fixture through rackreach import: exit 1, its file named, nothing written",
          "[cli][invalid][csv]") {
  const fs::path csv = shared_reference::repo_path("tests/data/csv");
  const std::string base = quote(shared_reference::repo_path("tests/data/csv/import_base.rackreach.json"));
  const std::string good_parts = quote((csv / "parts_marlow_valley.csv").string());
  const std::string good_slots = quote((csv / "slots_marlow_valley.csv").string());
  const fs::path out = fs::temp_directory_path() / ("rackreach-import-" + std::to_string(::getpid()) + ".json");
  // The good pair imports into the base project: the exits below come from the bad files.
  fs::remove(out);
  const Run good = run_cli("import " + base + " --parts " + good_parts + " --slots " + good_slots + " --out " +
                           quote(out.string()));
  INFO(good.err);
  REQUIRE(good.exit_code == 0);
  REQUIRE(fs::exists(out));
  fs::remove(out);
  int count = 0;
  for (const auto& entry : fs::directory_iterator(csv)) {
    const std::string name = entry.path().filename().string();
    if (entry.path().extension() != ".csv" || name.find("marlow_valley") != std::string::npos) continue;
    ++count;
    INFO(name);
    const bool parts = name.rfind("parts_", 0) == 0;
    const std::string file = quote(entry.path().string());
    const Run r = run_cli("import " + base + " --parts " + (parts ? file : good_parts) + " --slots " +
                          (parts ? good_slots : file) + " --out " + quote(out.string()));
    INFO(r.err);
    CHECK(r.exit_code == 1);
    CHECK_THAT(r.err, Catch::Matchers::Contains(entry.path().string()));
    CHECK_THAT(r.err, Catch::Matchers::Contains("["));
    CHECK_FALSE(fs::exists(out));
  }
  CHECK(count >= 40);
}

TEST_CASE("Every bad population table through the CLI: exit 1, its file named, nothing written",
          "[cli][invalid][population]") {
  const fs::path tables = shared_reference::repo_path("tests/anthropometry/data");
  const fs::path dir = fs::temp_directory_path() / ("rackreach-population-" + std::to_string(::getpid()));
  fs::create_directories(dir);
  const fs::path out = dir / "review.json";
  auto project_with = [&](const std::string& population) {
    json p = json::parse(*shared_reference::read_text(shared_reference::repo_path("tests/data/invalid_negative_load.json")));
    p["jobs"][0]["tasks"][0]["load"] = 10;
    p["jobs"][0]["tasks"][0]["shelf"] = {{"grip_depth", 20}};  // a reach check, which needs the workforce
    p["workforce"] = {{"population", population}};
    const fs::path f = dir / "project.rackreach.json";
    std::ofstream(f) << p.dump(2);
    return f.string();
  };
  // The shipped table and a good table of a user's: exit 0 (so the exits below come from the bad tables).
  fs::remove(out);
  const Run good = run_cli("assess " + quote(project_with("ansur2")) + " --format json --out " + quote(out.string()));
  INFO(good.err);
  REQUIRE(good.exit_code == 0);
  REQUIRE(fs::exists(out));
  CHECK(run_cli("population show " + quote((tables / "user_table_5_50_95.json").string())).exit_code == 0);
  int count = 0;
  for (const auto& entry : fs::directory_iterator(tables)) {
    const std::string name = entry.path().filename().string();
    if (name.rfind("invalid_", 0) != 0) continue;
    ++count;
    INFO(name);
    fs::remove(out);
    const Run r = run_cli("assess " + quote(project_with(entry.path().string())) + " --format json --out " +
                          quote(out.string()));
    INFO(r.err);
    CHECK(r.exit_code == 1);
    CHECK_THAT(r.err, Catch::Matchers::Contains(entry.path().string()));
    CHECK_FALSE(fs::exists(out));
    const Run show = run_cli("population show " + quote(entry.path().string()));
    CHECK(show.exit_code == 1);
    CHECK_THAT(show.err, Catch::Matchers::Contains(entry.path().string()));
  }
  CHECK(count >= 20);
  fs::remove_all(dir);
}

TEST_CASE("Every file the CLI writes survives a failing write: the old file byte for byte, no temporary file",
          "[cli][atomic][crash]") {
  const std::string sample = quote(shared_reference::repo_path("sample_tasks/kitting-store.rackreach.json"));
  const fs::path dir = fs::temp_directory_path() / ("rackreach-efbig-" + std::to_string(::getpid()));
  fs::remove_all(dir);
  fs::create_directories(dir);
  const fs::path target = dir / "previous.out";
  const std::string old = "the previous file, which must survive\n";
  const std::string t = quote(target.string());
  const fs::path csv = dir / "csv";
  fs::create_directories(csv);
  REQUIRE(run_cli("export-csv " + sample + " --parts " + quote((csv / "parts.csv").string()) + " --slots " +
                  quote((csv / "slots.csv").string()))
              .exit_code == 0);
  const std::string parts = quote((csv / "parts.csv").string()), slots = quote((csv / "slots.csv").string());
  // Each command writes more than the limit of 2 blocks (1 or 2 kB, as the shell counts) to `target`.
  const std::vector<std::string> commands = {
      "assess " + sample + " --format json --out " + t,
      "assess " + sample + " --format html --out " + t,
      "assess " + sample + " --format csv --out " + t,
      "assess " + sample + " --format table --out " + t,
      "limits " + sample + " --format json --out " + t,
      "import " + sample + " --parts " + parts + " --slots " + slots + " --out " + t,
      "export-csv " + sample + " --parts " + t + " --slots " + quote((dir / "slots-not-reached.csv").string()),
      "reslot " + sample + " --out " + t,
      "reslot " + sample + " --out " + quote((dir / "reslot.json").string()) + " --costs-out " + t,
  };
  for (const std::string& c : commands) {
    INFO(c);
    std::ofstream(target, std::ios::binary | std::ios::trunc) << old;
    const Run r = run_cli_with_file_size_limit(c, 2);
    INFO(r.err);
    CHECK(r.exit_code != 0);
    CHECK_THAT(r.err, Catch::Matchers::Contains(std::strerror(EFBIG)));
    CHECK(shared_reference::read_text(target.string()).value_or("") == old);
    for (const auto& e : fs::directory_iterator(dir))
      CHECK(e.path().filename().string().find(".tmp-") == std::string::npos);
    fs::remove(dir / "reslot.json");
  }
  // Without the limit every one of them writes its file (so the failures above were the writes').
  for (const std::string& c : commands) {
    INFO(c);
    std::ofstream(target, std::ios::binary | std::ios::trunc) << old;
    const Run r = run_cli(c);
    INFO(r.err);
    CHECK(r.exit_code == 0);
    CHECK(shared_reference::read_text(target.string()).value_or("") != old);
  }
  CHECK(files_in(dir) >= 1);
  fs::remove_all(dir);
}
