// SPDX-License-Identifier: MIT
#pragma once
// SHA-256 (FIPS 180-4) of a byte string, as lowercase hex. Used to record which raw file a table came from.

#include <string>
#include <string_view>

namespace rackreach {

std::string calc_sha256_hex(std::string_view bytes);

}  // namespace rackreach
