// SPDX-License-Identifier: MIT
// `rackreach report FILE --out FILE.pdf|FILE.html [--date D] [--site S] [--assessor A] [--revision R]
//                   [--rounding full|worksheet] [--duration-rule 2021|1994]`: the audit report.

#include <fstream>
#include <iostream>
#include <sstream>

#include "app/cli/commands.hpp"
#include "engine/io/project_file.hpp"

#ifdef RACKREACH_HAVE_REPORT
#include <QGuiApplication>
#include <QHashSeed>

#include <memory>

#include "app/report/report_writer.hpp"
#endif

namespace rackreach::cli {
namespace {

struct ReportArgs {
  std::string file, out, date, site, assessor, revision, rounding = "full", duration_rule;
};

#ifdef RACKREACH_HAVE_REPORT
/// Qt's own notes about the session (no runtime folder, no display settings) say nothing about the report: they
/// are left out; its warnings and errors go to stderr as they are.
void filter_qt_messages(QtMsgType type, const QMessageLogContext&, const QString& message) {
  if (type == QtDebugMsg || type == QtInfoMsg) return;
  if (message.startsWith(QLatin1String("QStandardPaths:"))) return;
  std::cerr << "rackreach report (Qt): " << message.toStdString() << "\n";
}

void run_report(const ReportArgs& args, int& exit_code) {
  report::ReportOptions options;
  if (!args.date.empty()) options.date = args.date;
  if (!args.site.empty()) options.site = args.site;
  if (!args.assessor.empty()) options.assessor = args.assessor;
  if (!args.revision.empty()) options.revision = args.revision;
  options.rounding = args.rounding == "worksheet" ? RoundingMode::worksheet : RoundingMode::full;
  if (!args.duration_rule.empty()) options.duration_rule = find_duration_rule(args.duration_rule);
  if (const auto problems = report::validate_report_options(options, args.out); !problems.empty()) {
    for (const std::string& p : problems) std::cerr << "rackreach report: " << p << "\n";
    exit_code = exit_usage;
    return;
  }
  // The bytes read are the bytes hashed and the bytes loaded.
  std::ifstream in(args.file, std::ios::binary);
  if (!in) {
    load_or_report(args.file, exit_code);  // says why in the loader's words (file_error)
    if (exit_code == exit_ok) exit_code = exit_invalid_input;
    return;
  }
  std::ostringstream ss;
  ss << in.rdbuf();
  const std::string bytes = ss.str();
  LoadResult loaded = load_project_text(bytes);
  if (!loaded.project) {
    print_problems(args.file, loaded.problems, "no report was written");
    exit_code = exit_invalid_input;
    return;
  }
  // The report lays out text and draws with Qt Gui; it needs no display.
  std::unique_ptr<QGuiApplication> qt;
  if (!QCoreApplication::instance()) {
    if (qEnvironmentVariableIsEmpty("QT_QPA_PLATFORM")) qputenv("QT_QPA_PLATFORM", "offscreen");
    // Qt's hashes are seeded at random per process, and the PDF writer embeds its fonts in hash order: a fixed
    // seed, before Qt hashes anything, makes two runs write the same bytes.
    QHashSeed::setDeterministicGlobalSeed();
    qInstallMessageHandler(filter_qt_messages);
    static int qt_argc = 1;
    static char qt_name[] = "rackreach";
    static char* qt_argv[] = {qt_name, nullptr};
    qt = std::make_unique<QGuiApplication>(qt_argc, qt_argv);
  }
  const report::ReportResult r = report::write_report(*loaded.project, {args.file, bytes}, args.out, options);
  if (!r.written) {
    for (const std::string& p : r.problems) std::cerr << args.file << ": " << p << "\n";
    std::cerr << args.file << ": no report was written\n";
    exit_code = exit_invalid_input;
    return;
  }
  std::cout << args.out << ": " << (r.pages ? std::to_string(r.pages) + " pages, " : std::string()) << r.bytes
            << " bytes" << (r.self_check_passed ? "" : "; ENGINE SELF-CHECK FAILED, see the report") << "\n";
}
#else
void run_report(const ReportArgs&, int& exit_code) {
  std::cerr << "rackreach report: this build has no report writer (it was built without Qt, -DRACKREACH_GUI=OFF); "
               "the PDF and HTML report need Qt 6 Gui. Rebuild with -DRACKREACH_GUI=ON, or use `rackreach assess "
               "--format html|json|csv` for the results without the audit record.\n";
  exit_code = exit_usage;
}
#endif

}  // namespace

void add_report_command(CLI::App& app, int& exit_code) {
  auto* cmd = app.add_subcommand("report", "Write the audit report (PDF or HTML): inputs, method, results, cautions, "
                                           "sign-off");
  auto args = std::make_shared<ReportArgs>();
  cmd->add_option("FILE", args->file, "project file (*.rackreach.json)")->required();
  cmd->add_option("--out", args->out, "the report to write (atomically): FILE.pdf or FILE.html")->required();
  cmd->add_option("--date", args->date,
                  "the report's date, YYYY-MM-DD or YYYY-MM-DDTHH:MM:SSZ (default: now, UTC); fixed, two runs write "
                  "the same bytes");
  cmd->add_option("--site", args->site, "site (default: the project file's)");
  cmd->add_option("--assessor", args->assessor, "assessor (default: the project file's)");
  cmd->add_option("--revision", args->revision, "revision of the assessment (default: the project file's)");
  cmd->add_option("--rounding", args->rounding, "full precision, or worksheet (as the published examples print)")
      ->check(CLI::IsMember({"full", "worksheet"}))
      ->capture_default_str();
  cmd->add_option("--duration-rule", args->duration_rule, "recovery rule for the short duration: 2021 or 1994")
      ->check(CLI::IsMember({"2021", "1994"}));
  cmd->callback([args, &exit_code] { run_report(*args, exit_code); });
}

}  // namespace rackreach::cli
