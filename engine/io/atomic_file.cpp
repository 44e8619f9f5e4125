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
namespace {

std::string folder_of(const std::string& path) {
  const auto slash = path.rfind('/');
  if (slash == std::string::npos) return ".";
  return slash == 0 ? "/" : path.substr(0, slash);
}

}  // namespace

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
      return fail("cannot write");  // e.g. ENOSPC (disk full) or EFBIG (file size limit)
    }
    p += n;
    left -= static_cast<std::size_t>(n);
  }
  // A file that is replaced keeps its permissions; a new one gets rw-r--r--.
  struct stat old {};
  const mode_t mode = ::stat(path.c_str(), &old) == 0 && S_ISREG(old.st_mode) ? (old.st_mode & 07777) : 0644;
  if (::fchmod(fd, mode) != 0) return fail("cannot set permissions of");
  if (::fsync(fd) != 0) return fail("cannot flush");
  if (::close(fd) != 0) {
    const std::string err = "cannot close the temporary file for " + path + ": " + std::strerror(errno);
    ::unlink(name.data());
    return err;
  }
  if (std::rename(name.data(), path.c_str()) != 0) {
    const std::string err = "cannot replace " + path + ": " + std::strerror(errno);
    ::unlink(name.data());
    return err;
  }
  // The rename itself is made durable by flushing the folder (best effort: some file systems refuse it).
  const int dir = ::open(folder_of(path).c_str(), O_RDONLY | O_DIRECTORY);
  if (dir >= 0) {
    (void)::fsync(dir);
    ::close(dir);
  }
  return std::nullopt;
}

}  // namespace rackreach
