// SPDX-License-Identifier: MIT
// write_file_atomically under real write errors: a file size limit (RLIMIT_FSIZE, with SIGXFSZ ignored, so that
// write() fails with EFBIG exactly as on a full disk it fails with ENOSPC) and a rename that fails. The previous
// file must stay byte for byte, no temporary file may be left behind, and the error must say why.

#include <signal.h>
#include <sys/resource.h>
#include <sys/wait.h>
#include <unistd.h>

#include <catch2/catch.hpp>
#include <cerrno>
#include <cstring>
#include <filesystem>
#include <fstream>
#include <sstream>
#include <string>

#include "engine/io/atomic_file.hpp"

namespace fs = std::filesystem;

namespace {

fs::path fresh_dir(const std::string& name) {
  const fs::path d = fs::temp_directory_path() / ("rackreach-atomic-" + name + "-" + std::to_string(::getpid()));
  fs::remove_all(d);
  fs::create_directories(d);
  return d;
}

std::string read_all(const fs::path& p) {
  std::ifstream in(p, std::ios::binary);
  std::ostringstream ss;
  ss << in.rdbuf();
  return ss.str();
}

std::size_t entries(const fs::path& d) {
  std::size_t n = 0;
  for (const auto& e : fs::directory_iterator(d)) {
    (void)e;
    ++n;
  }
  return n;
}

/// Runs write_file_atomically(path, content) in a child process whose files may not grow beyond `limit_bytes`;
/// returns the child's error text ("" on success).
std::string write_in_limited_child(const fs::path& path, const std::string& content, rlim_t limit_bytes) {
  int pipe_fd[2];
  REQUIRE(::pipe(pipe_fd) == 0);
  const pid_t pid = ::fork();
  REQUIRE(pid >= 0);
  if (pid == 0) {
    ::close(pipe_fd[0]);
    ::signal(SIGXFSZ, SIG_IGN);  // write() then fails with EFBIG instead of killing the process
    const rlimit lim{limit_bytes, limit_bytes};
    if (::setrlimit(RLIMIT_FSIZE, &lim) != 0) ::_exit(3);
    const auto err = rackreach::write_file_atomically(path.string(), content);
    const std::string msg = err ? *err : std::string();
    if (::write(pipe_fd[1], msg.data(), msg.size()) < 0) ::_exit(4);
    ::_exit(err ? 1 : 0);
  }
  ::close(pipe_fd[1]);
  std::string msg;
  char buf[512];
  ssize_t n;
  while ((n = ::read(pipe_fd[0], buf, sizeof buf)) > 0) msg.append(buf, static_cast<std::size_t>(n));
  ::close(pipe_fd[0]);
  int status = 0;
  ::waitpid(pid, &status, 0);
  REQUIRE(WIFEXITED(status));
  CHECK(WEXITSTATUS(status) == (msg.empty() ? 0 : 1));
  return msg;
}

}  // namespace

TEST_CASE("Atomic write: a new file and a replaced file get the whole content, nothing else is left", "[io][atomic]") {
  const fs::path d = fresh_dir("ok");
  const fs::path f = d / "out.json";
  REQUIRE_FALSE(rackreach::write_file_atomically(f.string(), "first\n"));
  CHECK(read_all(f) == "first\n");
  fs::permissions(f, fs::perms::owner_read | fs::perms::owner_write);  // 0600 must survive the replace
  REQUIRE_FALSE(rackreach::write_file_atomically(f.string(), "second\n"));
  CHECK(read_all(f) == "second\n");
  CHECK((fs::status(f).permissions() & fs::perms::all) == (fs::perms::owner_read | fs::perms::owner_write));
  CHECK(entries(d) == 1);
  fs::remove_all(d);
}

TEST_CASE("Atomic write: a write that fails (file size limit, EFBIG) keeps the old file byte for byte",
          "[io][atomic][crash]") {
  const fs::path d = fresh_dir("efbig");
  const fs::path f = d / "project.rackreach.json";
  std::string old = "{\"rackreach\": 1}\n";
  for (int i = 0; i < 50; ++i) old += "old line " + std::to_string(i) + "\n";
  REQUIRE_FALSE(rackreach::write_file_atomically(f.string(), old));
  // The old file is about 700 bytes; the new content is 1 MB against a limit of 64 kB.
  const std::string big(1 << 20, 'x');
  const std::string err = write_in_limited_child(f, big, 64 * 1024);
  INFO(err);
  CHECK_THAT(err, Catch::Matchers::StartsWith("cannot write " + f.string()));
  CHECK_THAT(err, Catch::Matchers::Contains(std::strerror(EFBIG)));
  CHECK(read_all(f) == old);
  CHECK(entries(d) == 1);  // no temporary file left behind
  // The same limit lets a small file through: the limit, not the test, made the big write fail.
  CHECK(write_in_limited_child(f, "small\n", 64 * 1024).empty());
  CHECK(read_all(f) == "small\n");
  fs::remove_all(d);
}

TEST_CASE("Atomic write: a rename that fails keeps what was there and removes the temporary file",
          "[io][atomic][crash]") {
  const fs::path d = fresh_dir("rename");
  // The target is a folder that holds a file: rename() of a file over it fails (EISDIR).
  const fs::path target = d / "out.json";
  fs::create_directories(target);
  std::ofstream(target / "keep.txt") << "kept";
  const auto err = rackreach::write_file_atomically(target.string(), "new content");
  REQUIRE(err);
  CHECK_THAT(*err, Catch::Matchers::StartsWith("cannot replace " + target.string() + ": "));
  CHECK_THAT(*err, Catch::Matchers::Contains(std::strerror(EISDIR)));
  CHECK(fs::is_directory(target));
  CHECK(read_all(target / "keep.txt") == "kept");
  CHECK(entries(d) == 1);
  fs::remove_all(d);
}

TEST_CASE("Atomic write: a folder that does not exist is an error naming the file, nothing is created",
          "[io][atomic]") {
  const fs::path d = fresh_dir("nofolder");
  const fs::path f = d / "missing" / "out.json";
  const auto err = rackreach::write_file_atomically(f.string(), "x");
  REQUIRE(err);
  CHECK_THAT(*err, Catch::Matchers::Contains(f.string()));
  CHECK_THAT(*err, Catch::Matchers::Contains(std::strerror(ENOENT)));
  CHECK(entries(d) == 0);
  fs::remove_all(d);
}
