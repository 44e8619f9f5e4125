# SPDX-License-Identifier: MIT
# Included by the top CMakeLists.txt before any target when RACKREACH_FUZZ is ON: every library is built with
# libFuzzer's coverage instrumentation and AddressSanitizer + UndefinedBehaviorSanitizer, so that the fuzz targets
# see into the loaders. UBSan stops at the first report (-fno-sanitize-recover), which libFuzzer records as a crash.
if(NOT CMAKE_CXX_COMPILER_ID STREQUAL "Clang")
  message(FATAL_ERROR "RACKREACH_FUZZ needs clang (libFuzzer): configure with -DCMAKE_CXX_COMPILER=clang++")
endif()
add_compile_options(-fsanitize=fuzzer-no-link,address,undefined -fno-sanitize-recover=undefined
                    -fno-omit-frame-pointer -gline-tables-only)  # line numbers in reports; full -g costs build time
add_link_options(-fsanitize=address,undefined)
