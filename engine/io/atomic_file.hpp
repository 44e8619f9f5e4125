// SPDX-License-Identifier: MIT
#pragma once
// Writes that never leave a half-written file: the content goes to a temporary file in the same folder, is
// flushed to disk, and is renamed over the target. On failure the old file is untouched.

#include <optional>
#include <string>
#include <string_view>

namespace rackreach {

/// Writes `content` to `path` atomically; returns an error in plain words, or nothing on success.
std::optional<std::string> write_file_atomically(const std::string& path, std::string_view content);

}  // namespace rackreach
