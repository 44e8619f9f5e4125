#!/usr/bin/env python3
# SPDX-License-Identifier: MIT
"""Keeps docs/rackreach-project.schema.json in step with the project file loader, using a general-purpose
reference validator (python3-jsonschema, JSON Schema draft 2020-12):

* every sample in sample_tasks/, every valid fixture in tests/data/, the published cases in ../shared (when
  present), both outputs of `rackreach template`, and the files `rackreach reslot` and `rackreach import` write
  conform to the schema, and the loader accepts each of them;
* every invalid fixture tests/data/invalid_*.json is rejected by the schema, or, for a rule a schema cannot state,
  is listed in SCHEMA_CANNOT_STATE below with the loader's problem code and JSON path, and the program is checked
  to report exactly that (a listed fixture the schema rejects is an error too: the list stays minimal);
* a few edits of a store fixture show that the unit-dependent bounds (cm/kg against in/lb) agree.

Exit 0 when all hold, 1 with every disagreement listed, 77 (skipped) when jsonschema is not installed.
"""
import argparse
import copy
import json
import os
import shutil
import subprocess
import sys
import tempfile
from pathlib import Path

try:
    import jsonschema
except ImportError:
    print("python3-jsonschema is not installed (bash scripts/install-deps.sh): schema not checked")
    sys.exit(77)

# Invalid fixtures whose rule a JSON Schema cannot state: fixture -> (loader code, JSON path, why).
SCHEMA_CANNOT_STATE = {
    "invalid_not_json": ("parse_error", "jobs[0]", "not JSON: no schema applies to it"),
    "invalid_nan_value": ("parse_error", "jobs[0].tasks[0].origin.h", "NaN is not JSON"),
    "invalid_number_overflow_in_broken_file": ("parse_error", "jobs[0].tasks[0].load",
                                               "a number beyond a double in a file that is not JSON either"),
    "invalid_duplicate_job_ids": ("duplicate_id", "jobs[1].id", "unique ids across array items"),
    "invalid_duplicate_task_ids": ("duplicate_id", "jobs[0].tasks[1].id", "unique ids across array items"),
    "invalid_max_load_below_load": ("out_of_range", "jobs[0].tasks[0].max_load", "one field against another"),
    "invalid_shelf_beam_below_grip": ("out_of_range", "jobs[0].tasks[0].shelf.beam_underside",
                                      "a field against the origin's v"),
    "invalid_levels_overlap": ("out_of_range", "racks[0].levels[1].surface_height", "a level against the one below"),
    "invalid_slot_unknown_part": ("unknown_reference", "slots[0].part", "a reference to another object"),
    "invalid_slot_unknown_level": ("unknown_reference", "slots[0].level", "a reference to another object"),
    "invalid_slot_unknown_rack": ("unknown_reference", "slots[0].rack", "a reference to another object"),
    "invalid_route_unknown_slot": ("unknown_reference", "routes[0].slots[1]", "a reference to another object"),
    "invalid_rack_unknown_zone": ("unknown_reference", "racks[0].zone", "a reference to another object"),
    "invalid_slot_bay_beyond_rack": ("out_of_range", "slots[0].bay", "a field against the referenced rack"),
    "invalid_slot_duplicate_location": ("duplicate_location", "slots[1]", "uniqueness of a field combination"),
    "invalid_workforce_unknown_population": ("file_error", "workforce.population",
                                             "the tables in the data folder are known only at run time"),
}

# Edits of tests/data/store_minimal.rackreach.json (metric): (edits as (keys, value), the loader's code and path, or
# None when it must load). Its numbers are also a valid store in US units, so "units": "us" turns it into one.
STORE = "tests/data/store_minimal.rackreach.json"
US = (["units"], "us")
US_CART = (["zones", 0, "cart_deck_height"], 36.0)  # 90 (cm) is above the 175 cm bound in inches
UNIT_EDITS = [
    ([US], ("out_of_range", "zones[0].cart_deck_height")),
    ([US, US_CART], None),
    ([US, US_CART, (["zones", 0, "standing_distance"], 39.3)], None),  # 99.8 cm
    ([US, US_CART, (["zones", 0, "standing_distance"], 45.0)], ("out_of_range", "zones[0].standing_distance")),  # 114.3 cm
    ([(["zones", 0, "standing_distance"], 45.0)], None),  # 45 cm
    ([US, US_CART, (["parts", 0, "unit_weight"], 4409.0)], None),  # 1999.9 kg
    ([US, US_CART, (["parts", 0, "unit_weight"], 4500.0)], ("out_of_range", "parts[0].unit_weight")),  # 2041 kg
    ([US, US_CART, (["racks", 0, "shelf_depth"], 119.0)], ("out_of_range", "racks[0].shelf_depth")),  # 302 cm
    ([(["racks", 0, "shelf_depth"], 119.0)], None),  # 119 cm
    ([(["racks", 0, "levels", 0, "access"], "truck")], ("invalid_value", "racks[0].levels[0].access")),  # a hand rack's level
]

def strict_load(path):
    def no_constant(name):
        raise ValueError(f"{name} is not JSON")
    with open(path, encoding="utf-8") as f:
        return json.load(f, parse_constant=no_constant)


def run(cli, *args):
    env = dict(os.environ)
    return subprocess.run([cli, *args], capture_output=True, text=True, env=env)


def reported(stderr, file, code, path):
    for line in stderr.splitlines():
        if line.startswith(f"{file}: {path}") and line.rstrip().endswith(f"[{code}]"):
            return True
    return False


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--schema", required=True)
    ap.add_argument("--repo", required=True)
    ap.add_argument("--cli", required=True)
    ap.add_argument("--shared", default="")
    a = ap.parse_args()
    repo = Path(a.repo)
    schema = strict_load(a.schema)
    jsonschema.Draft202012Validator.check_schema(schema)
    validator = jsonschema.Draft202012Validator(schema)
    failures = []
    checked = {"valid": 0, "rejected by the schema": 0, "listed": 0, "edits": 0}

    def schema_errors(doc):
        return sorted(validator.iter_errors(doc), key=lambda e: list(e.absolute_path))

    def expect_valid(name, doc, file_for_loader):
        errs = schema_errors(doc)
        for e in errs[:5]:
            failures.append(f"{name}: the schema rejects what the loader must accept: "
                            f"{'/'.join(map(str, e.absolute_path))}: {e.message}")
        r = run(a.cli, "check", str(file_for_loader))
        if r.returncode != 0:
            failures.append(f"{name}: the loader rejects it:\n{r.stderr}")
        checked["valid"] += 1

    tmp = Path(tempfile.mkdtemp(prefix="rackreach-schema-"))
    valid_files = sorted((repo / "sample_tasks").glob("*.json"))
    valid_files += sorted(p for p in (repo / "tests/data").glob("*.json") if not p.name.startswith("invalid_"))
    if a.shared and Path(a.shared, "reference/cases").is_dir():
        valid_files += sorted(Path(a.shared, "reference/cases").glob("*.input.json"))
    else:
        print("note: ../shared/reference/cases not found: the published cases are not validated here")
    for p in valid_files:
        expect_valid(p.name, strict_load(p), p)

    # What the program writes conforms too.
    for units in ("metric", "us"):
        r = run(a.cli, "template", "--units", units)
        out = tmp / f"template-{units}.json"
        out.write_text(r.stdout)
        expect_valid(f"rackreach template --units {units}", json.loads(r.stdout), out)
    reslotted = tmp / "reslot.rackreach.json"
    r = run(a.cli, "reslot", str(repo / "sample_tasks/kitting-store.rackreach.json"), "--out", str(reslotted),
            "--max-moves", "3")
    if r.returncode != 0:
        failures.append(f"rackreach reslot failed:\n{r.stderr}")
    else:
        expect_valid("the file rackreach reslot writes", strict_load(reslotted), reslotted)
    imported = tmp / "import.rackreach.json"
    store = str(repo / "sample_tasks/kitting-store.rackreach.json")
    parts, slots = str(tmp / "parts.csv"), str(tmp / "slots.csv")
    r = run(a.cli, "export-csv", store, "--parts", parts, "--slots", slots)
    if r.returncode == 0:
        r = run(a.cli, "import", store, "--parts", parts, "--slots", slots, "--out", str(imported))
    if r.returncode != 0:
        failures.append(f"rackreach import failed:\n{r.stderr}")
    else:
        expect_valid("the file rackreach import writes", strict_load(imported), imported)

    invalid = sorted((repo / "tests/data").glob("invalid_*.json"))
    names = {p.stem for p in invalid}
    for stale in sorted(set(SCHEMA_CANNOT_STATE) - names):
        failures.append(f"{stale}: listed in SCHEMA_CANNOT_STATE but there is no such fixture")
    for p in invalid:
        try:
            doc = strict_load(p)
            errs = schema_errors(doc)
        except ValueError:
            doc, errs = None, None  # not JSON
        listed = SCHEMA_CANNOT_STATE.get(p.stem)
        r = run(a.cli, "assess", str(p), "--format", "json")
        if r.returncode != 1:
            failures.append(f"{p.name}: the program exits {r.returncode}, not 1 (invalid input)")
        if errs:
            checked["rejected by the schema"] += 1
            if listed:
                failures.append(f"{p.name}: the schema rejects it ({errs[0].message}); remove it from "
                                "SCHEMA_CANNOT_STATE")
            continue
        if not listed:
            failures.append(f"{p.name}: the loader rejects it but the schema accepts it: state the rule in the "
                            "schema, or list it in SCHEMA_CANNOT_STATE with the loader's code if no schema can")
            continue
        code, path, _why = listed
        checked["listed"] += 1
        if not reported(r.stderr, str(p), code, path):
            failures.append(f"{p.name}: expected the program to report [{code}] at {path!r}; it said:\n{r.stderr}")

    for edits, expected in UNIT_EDITS:
        doc = strict_load(repo / STORE)
        for keys, value in edits:
            target = doc
            for k in keys[:-1]:
                target = target[k]
            target[keys[-1]] = value
        name = "store_minimal with " + ", ".join(f"{'.'.join(map(str, k))} = {v}" for k, v in edits)
        out = tmp / "edited.json"
        out.write_text(json.dumps(doc))
        r = run(a.cli, "check", str(out))
        errs = schema_errors(doc)
        if expected is None:
            if r.returncode != 0 or errs:
                failures.append(f"{name}: must be accepted by both; loader exit {r.returncode} {r.stderr}, schema "
                                f"{errs[0].message if errs else 'accepts'}")
        else:
            code, path = expected
            if not reported(r.stderr, str(out), code, path) or not errs:
                failures.append(f"{name}: must be rejected by both; loader said {r.stderr!r}, schema "
                                f"{'rejects' if errs else 'accepts'}")
        checked["edits"] += 1

    shutil.rmtree(tmp, ignore_errors=True)
    for f in failures:
        print("FAIL:", f)
    print("checked:", ", ".join(f"{v} {k}" for k, v in checked.items()))
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
