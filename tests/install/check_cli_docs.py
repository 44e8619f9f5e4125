#!/usr/bin/env python3
# SPDX-License-Identifier: MIT
"""Keeps the manual page, the bash completion and `--version` in step with the CLI itself.

  check_cli_docs.py man        --cli BIN --man docs/rackreach.1 --version X.Y.Z
  check_cli_docs.py completion --cli BIN --completion app/cli/completion/rackreach.bash --repo DIR --data DIR
  check_cli_docs.py version    --cli BIN --version X.Y.Z [--gui BIN] [--qt yes|no]

The subcommands, their options and the options' choices are read from `rackreach --help` and every
`rackreach SUB --help` (CLI11's own help), so a new subcommand or option fails these checks until the manual page
and the completion name it.
"""
import argparse
import os
import re
import subprocess
import sys
from pathlib import Path


def help_of(cli, words):
    r = subprocess.run([cli, *words, "--help"], capture_output=True, text=True)
    if r.returncode != 0:
        raise SystemExit(f"`rackreach {' '.join(words)} --help` exited {r.returncode}: {r.stderr}")
    return r.stdout


def parse_help(text):
    """(options {name: [choices]}, subcommands [names]) of one CLI11 help text."""
    options, subcommands, section = {}, [], None
    for line in text.splitlines():
        if re.match(r"^\S.*:$", line):
            section = line[:-1]
            continue
        m = re.match(r"^  (\S+)", line)
        if not m or not section:
            continue
        if section == "Options" and m.group(1).startswith("-"):
            names = m.group(1).split(",")
            choices = re.search(r":\{([^}]*)\}", line)
            for n in names:
                options[n] = choices.group(1).split(",") if choices else []
        elif section == "Subcommands":
            subcommands.append(m.group(1))
    return options, subcommands


def command_tree(cli):
    """{"": top-level options, "assess": its options, "population show": ...} and the subcommand lists."""
    tree, subs = {}, {}

    def walk(words):
        options, children = parse_help(help_of(cli, words))
        tree[" ".join(words)] = options
        subs[" ".join(words)] = children
        for c in children:
            walk(words + [c])

    walk([])
    return tree, subs


def check_man(a, tree, failures):
    roff = Path(a.man).read_text(encoding="utf-8")
    th = re.search(r'^\.TH RACKREACH 1 "[^"]*" "rackreach ([^"]+)"', roff, re.M)
    if not th or th.group(1) != a.version:
        failures.append(f"the .TH line must name rackreach {a.version} (the project's version)")
    text = re.sub(r"\\f[BIRP]", "", roff).replace("\\-", "-")
    lines = text.splitlines()
    # The COMMANDS section: each subcommand's entry runs to the next subcommand's entry.
    try:
        start = lines.index(".SH COMMANDS")
    except ValueError:
        failures.append("the manual page has no COMMANDS section")
        return
    end = next((i for i in range(start + 1, len(lines)) if lines[i].startswith(".SH ")), len(lines))
    entries, current = {}, None
    for i in range(start + 1, end):
        if lines[i - 1] == ".TP" and re.match(r"^\.B[IR]? ", lines[i]):
            words = lines[i].split(None, 1)[1].replace('"', "").split()
            name = " ".join(w for w in words if re.match(r"^[a-z][a-z-]*$", w))
            if name and name in tree:
                current = name
                entries[current] = []
                continue
        if current:
            entries[current].append(lines[i])
    global_text = "\n".join(lines[end:])
    for command, options in tree.items():
        if command and not [c for c in tree if c.startswith(command + " ")] and command not in entries:
            failures.append(f"manual page: no entry for `rackreach {command}` in COMMANDS")
            continue
        if command and command not in entries:
            continue  # a group (population): its own entries are its subcommands
        body = "\n".join(entries.get(command, [])) if command else global_text
        for opt, choices in options.items():
            if opt in ("-h", "--help") and command:
                continue  # stated once, under OPTIONS
            if not re.search(r"(^|[\s\[|(,\"])" + re.escape(opt) + r"($|[\s\]|),\"])", body, re.M):
                where = f"`rackreach {command}`" if command else "OPTIONS"
                failures.append(f"manual page: {opt} is missing from the entry of {where}")
            for c in choices:
                if c not in body:
                    failures.append(f"manual page: {command} {opt}: choice {c!r} is not named")
    for opt in ("-h", "--help", "--version"):
        if opt not in global_text:
            failures.append(f"manual page: OPTIONS must describe {opt}")
    print(f"man: {len(tree)} commands checked against {a.man}")


def complete(a, words, cwd):
    script = (f"source {sh(a.completion)}; COMP_WORDS=({' '.join(sh(w) for w in words)}); "
              f"COMP_CWORD={len(words) - 1}; _rackreach; printf '%s\\n' \"${{COMPREPLY[@]}}\"")
    env = {"PATH": os.environ.get("PATH", "/usr/bin:/bin"), "RACKREACH_DATA_DIR": a.data}
    r = subprocess.run(["bash", "--norc", "--noprofile", "-c", script], capture_output=True, text=True, cwd=cwd,
                       env=env)
    if r.returncode != 0:
        raise SystemExit(f"bash failed on {words}: {r.stderr}")
    return set(x for x in r.stdout.splitlines() if x)


def sh(s):
    return "'" + s.replace("'", "'\\''") + "'"


def check_completion(a, tree, subs, failures):
    cwd = a.repo
    n = 0
    for command, options in tree.items():
        words = ["rackreach"] + (command.split() if command else [])
        if subs[command]:
            got = complete(a, words + [""], cwd)
            n += 1
            if got != set(subs[command]):
                failures.append(f"completion of `{' '.join(words)} ` offers {sorted(got)}, not {subs[command]}")
        got = complete(a, words + ["-"], cwd)
        n += 1
        missing = set(options) - got
        if missing:
            failures.append(f"completion of `{' '.join(words)} -` lacks {sorted(missing)}")
        for opt, choices in options.items():
            if choices:
                got = complete(a, words + [opt, ""], cwd)
                n += 1
                if got != set(choices):
                    failures.append(f"completion of `{' '.join(words)} {opt} ` offers {sorted(got)}, not {choices}")
    # Files and tables.
    for words, expect in [
        (["rackreach", "assess", "sample_tasks/kitting"], "sample_tasks/kitting-store.rackreach.json"),
        (["rackreach", "reslot", "sample_tasks/kitting-store.rackreach.json", "--costs-out", "tests/data/csv/parts_m"],
         "tests/data/csv/parts_marlow_valley.csv"),
        (["rackreach", "population", "show", "ansur"], "ansur1988"),
        (["rackreach", "population", "show", "ansur"], "ansur2"),
    ]:
        got = complete(a, words, cwd)
        n += 1
        if expect not in got:
            failures.append(f"completion of `{' '.join(words)}` lacks {expect} (offers {sorted(got)})")
    # --option=value: bash splits the word at '='.
    for words in (["rackreach", "assess", "--format", "=", ""], ["rackreach", "assess", "--format", "="]):
        got = complete(a, words, cwd)
        n += 1
        if got != set(tree["assess"]["--format"]):
            failures.append(f"completion of `{' '.join(words)}` offers {sorted(got)}")
    got = complete(a, ["rackreach", "assess", "sample_tasks/kitting"], cwd)
    if any(not g.endswith(".json") and not os.path.isdir(os.path.join(cwd, g)) for g in got):
        failures.append(f"a project file completion offers a file that is not *.json: {sorted(got)}")
    print(f"completion: {n} completions checked")


def check_version(a, failures):
    def run(cli, env_extra):
        env = {k: v for k, v in os.environ.items() if k != "RACKREACH_DATA_DIR"}
        env.update(env_extra)
        return subprocess.run([cli, "--version"], capture_output=True, text=True, env=env)

    for program, cli in [("rackreach", a.cli)] + ([("rackreach-gui", a.gui)] if a.gui else []):
        r = run(cli, {})
        lines = r.stdout.splitlines()
        if r.returncode != 0 or not lines or lines[0] != f"{program} {a.version}":
            failures.append(f"{program} --version must exit 0 and start with '{program} {a.version}': {r.stdout!r}")
            continue
        fields = dict(l.split(":", 1) for l in lines[1:] if ":" in l)
        for key in ("commit", "compiler", "build type", "Qt", "data folder"):
            if not fields.get(key, "").strip():
                failures.append(f"{program} --version: no '{key}:' line")
        qt = fields.get("Qt", "")
        if a.qt == "yes" and not re.match(r"^\s*6\.\d+", qt):
            failures.append(f"{program} --version: the Qt line must give the Qt 6 version: {qt!r}")
        if a.qt == "no" and not qt.strip().startswith("none"):
            failures.append(f"{program} --version: built without the desktop app, the Qt line must say none: {qt!r}")
        folder = fields.get("data folder", "").strip().split(" (")[0]
        if not Path(folder, "ansur2.json").is_file():
            failures.append(f"{program} --version: the data folder {folder!r} holds no ansur2.json")
        # A folder named on purpose is used as named, and a wrong one is reported as such.
        r = run(cli, {"RACKREACH_DATA_DIR": "/nonexistent/rackreach-tables"})
        if r.returncode != 0 or "none: no population tables" not in r.stdout or "/nonexistent/rackreach-tables" not in r.stdout:
            failures.append(f"{program} --version with a wrong RACKREACH_DATA_DIR must name it: {r.stdout!r}")
    print("version: checked")


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("what", choices=["man", "completion", "version"])
    ap.add_argument("--cli", required=True)
    ap.add_argument("--man")
    ap.add_argument("--completion")
    ap.add_argument("--repo", default=".")
    ap.add_argument("--data", default="")
    ap.add_argument("--version")
    ap.add_argument("--gui", default="")
    ap.add_argument("--qt", choices=["yes", "no"], default=None)
    a = ap.parse_args()
    failures = []
    if a.what == "version":
        check_version(a, failures)
    else:
        tree, subs = command_tree(a.cli)
        if len(subs[""]) < 8:
            failures.append(f"`rackreach --help` lists only {subs['']}")
        if a.what == "man":
            check_man(a, tree, failures)
        else:
            check_completion(a, tree, subs, failures)
    for f in failures:
        print("FAIL:", f)
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
