// SPDX-License-Identifier: MIT
#include "engine/io/atomic_file.hpp"

#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

#include <cerrno>
#include <cstdio>
#include <cstring>
#include <vector>

namespace rackreach {

std::optional<std::string> write_file_atomically(const std::string& path, std::string_view content) {
  std::string pattern = path + ".tmp-XXXXXX";
  std::vector<char> name(pattern.begin(), pattern.end());
  name.push_back('\0');
  const int fd = ::mkstemp(name.data());
  if (fd < 0) return "cannot create a temporary file beside " + path + ": " + std::strerror(errno);
  auto fail = [&](const char* what) {
    const std::string err = std::string(what) + " " + path + ": " + std::strerror(errno);
    ::close(fd);
    ::unlink(name.data());
    return err;
  };
  const char* p = content.data();
  std::size_t left = content.size();
  while (left > 0) {
    const ssize_t n = ::write(fd, p, left);
    if (n < 0) {
      if (errno == EINTR) continue;
      return fail("cannot write");
    }
    p += n;
    left -= static_cast<std::size_t>(n);
  }
  if (::fchmod(fd, 0644) != 0) return fail("cannot set permissions of");
  if (::fsync(fd) != 0) return fail("cannot flush");
  if (::close(fd) != 0) {
    ::unlink(name.data());
    return "cannot close the temporary file for " + path + ": " + std::strerror(errno);
  }
  if (std::rename(name.data(), path.c_str()) != 0) {
    const std::string err = "cannot replace " + path + ": " + std::strerror(errno);
    ::unlink(name.data());
    return err;
  }
  return std::nullopt;
}

}  // namespace rackreach
