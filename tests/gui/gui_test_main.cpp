// SPDX-License-Identifier: MIT
// Catch2 runner for the app's tests: a QApplication must exist before any widget, on the offscreen platform.
#define CATCH_CONFIG_RUNNER
#include <catch2/catch.hpp>

#include <QApplication>

int main(int argc, char** argv) {
  if (qEnvironmentVariableIsEmpty("QT_QPA_PLATFORM")) qputenv("QT_QPA_PLATFORM", "offscreen");
  QApplication app(argc, argv);
  return Catch::Session().run(argc, argv);
}
