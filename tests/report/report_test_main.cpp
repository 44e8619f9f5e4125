// SPDX-License-Identifier: MIT
// Catch2 runner for the report writer: a QGuiApplication (no widgets) on the offscreen platform, as the desktop
// app's export and the CLI have one.
#define CATCH_CONFIG_RUNNER
#include <catch2/catch.hpp>

#include <QGuiApplication>

int main(int argc, char** argv) {
  if (qEnvironmentVariableIsEmpty("QT_QPA_PLATFORM")) qputenv("QT_QPA_PLATFORM", "offscreen");
  QGuiApplication app(argc, argv);
  return Catch::Session().run(argc, argv);
}
