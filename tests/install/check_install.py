#!/usr/bin/env python3
# SPDX-License-Identifier: MIT
"""The installed layout: `cmake --install BUILD --prefix TMP` installs exactly the files of the product (no
headers, libraries, tests or tools), and the installed CLI, run with RACKREACH_DATA_DIR removed from its
environment, finds its population tables relative to itself, also after the whole prefix is moved elsewhere
(as a .deb puts it in /usr), and reviews an installed sample exactly as the build tree's CLI does.

  check_install.py --build BUILD --work TMPDIR --gui ON|OFF --cli BUILD_CLI --repo SOURCE [--cmake CMAKE]
"""
import argparse
import json
import os
import shutil
import subprocess
import sys
from pathlib import Path

SAMPLES = ["kit-cart-loading.rackreach.json", "kitting-store.rackreach.json",
           "motor-mount-truck-level.rackreach.json", "receiving-dock-us.rackreach.json"]
FILES = (["bin/rackreach",
          "share/rackreach/population/ansur1988.json", "share/rackreach/population/ansur2.json",
          "share/rackreach/population/README.md",
          "share/rackreach/rackreach-project.schema.json",
          "share/man/man1/rackreach.1.gz",
          "share/bash-completion/completions/rackreach",
          "share/doc/rackreach/README.md", "share/doc/rackreach/anthropometry.md"]
         + [f"share/rackreach/samples/{s}" for s in SAMPLES])
GUI_FILES = ["bin/rackreach-gui", "share/man/man1/rackreach-gui.1.gz", "share/applications/rackreach-gui.desktop",
             "share/icons/hicolor/scalable/apps/rackreach.svg"]


def run(cmd, env_extra=None):
    env = {k: v for k, v in os.environ.items() if k != "RACKREACH_DATA_DIR"}
    env.update(env_extra or {})
    return subprocess.run([str(c) for c in cmd], capture_output=True, text=True, env=env)


def without_input(text):
    doc = json.loads(text)
    doc.pop("input", None)
    return doc


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--build", required=True)
    ap.add_argument("--work", required=True)
    ap.add_argument("--gui", choices=["ON", "OFF"], required=True)
    ap.add_argument("--cli", required=True, help="the build tree's rackreach, for the reference review")
    ap.add_argument("--repo", required=True)
    ap.add_argument("--cmake", default="cmake")
    a = ap.parse_args()
    failures = []
    work = Path(a.work)
    shutil.rmtree(work, ignore_errors=True)
    work.mkdir(parents=True)
    prefix = work / "prefix"
    r = run([a.cmake, "--install", a.build, "--prefix", prefix])
    if r.returncode != 0:
        print(f"FAIL: cmake --install exited {r.returncode}:\n{r.stdout}\n{r.stderr}")
        return 1

    expected = set(FILES) | (set(GUI_FILES) if a.gui == "ON" else set())
    installed = {str(p.relative_to(prefix)) for p in prefix.rglob("*") if p.is_file() or p.is_symlink()}
    for f in sorted(expected - installed):
        failures.append(f"not installed: {f}")
    for f in sorted(installed - expected):
        failures.append(f"installed but not part of the product: {f}")
    programs = ["bin/rackreach"] + (["bin/rackreach-gui"] if a.gui == "ON" else [])
    for p in programs:
        if (prefix / p).is_file() and not os.access(prefix / p, os.X_OK):
            failures.append(f"{p} is not executable")
        d = run(["readelf", "-d", prefix / p])
        if "RUNPATH" in d.stdout or "RPATH" in d.stdout:
            failures.append(f"{p} keeps a run path into the build tree")

    reference = run([a.cli, "assess", Path(a.repo, "sample_tasks/kitting-store.rackreach.json"),
                     "--format", "json"], {"RACKREACH_DATA_DIR": ""})

    def check_prefix(where):
        data = where / "share/rackreach/population"
        cli = where / "bin/rackreach"
        sample = where / "share/rackreach/samples/kitting-store.rackreach.json"
        r = run([cli, "assess", sample, "--format", "json"])
        if r.returncode != 0:
            failures.append(f"{where}: the installed CLI exits {r.returncode} on the installed sample:\n{r.stderr}")
        elif r.stderr:
            failures.append(f"{where}: the installed CLI writes to stderr:\n{r.stderr}")
        else:
            review = without_input(r.stdout)
            if not str(review.get("reach_model", {}).get("workforce", "")).startswith("ansur2"):
                failures.append(f"{where}: the review names no ansur2 workforce: {review.get('reach_model')}")
            if reference.returncode == 0 and review != without_input(reference.stdout):
                failures.append(f"{where}: the installed review differs from the build tree's")
        for s in SAMPLES:
            r = run([cli, "assess", where / "share/rackreach/samples" / s])
            if r.returncode != 0:
                failures.append(f"{where}: assess {s} exits {r.returncode}:\n{r.stderr}")
        r = run([cli, "population", "list"])
        if r.returncode != 0 or f"Population tables in {data}\n" not in r.stdout:
            failures.append(f"{where}: population list does not use {data}:\n{r.stdout}{r.stderr}")
        for p in programs:
            r = run([where / p, "--version"], {"QT_QPA_PLATFORM": "offscreen"})
            if f"data folder: {data} (installed" not in r.stdout:
                failures.append(f"{where}: {p} --version does not name {data} (installed):\n{r.stdout}")
        # An explicit folder wins, and a wrong one is named in a clear error.
        r = run([cli, "assess", sample], {"RACKREACH_DATA_DIR": "/nonexistent/rackreach-tables"})
        if r.returncode != 1 or "/nonexistent/rackreach-tables (RACKREACH_DATA_DIR)" not in r.stderr:
            failures.append(f"{where}: a wrong RACKREACH_DATA_DIR is not reported: exit {r.returncode}\n{r.stderr}")

    check_prefix(prefix)
    moved = work / "moved" / "elsewhere"
    moved.parent.mkdir()
    prefix.rename(moved)  # a relocated prefix, as a package or an unpacked archive puts it
    check_prefix(moved)
    for page in sorted(f for f in expected if f.startswith("share/man/")):
        if run(["gzip", "-t", moved / page]).returncode != 0:
            failures.append(f"{page} is not a valid gzip file")

    for f in failures:
        print("FAIL:", f)
    print(f"installed {len(installed)} files; checked at {prefix} and moved to {moved}")
    if not failures:
        shutil.rmtree(work, ignore_errors=True)
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
