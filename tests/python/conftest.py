"""Shared pieces of the Python module's tests: the command line to compare with, and invented cases.

The tests run the program build/stackbound only to compare its output with the module's; the module
itself never starts a process. CTest sets STACKBOUND_BINARY and STACKBOUND_SOURCE_DIR (tests/python/
CMakeLists.txt); run by hand, the defaults are the repository and its build/ folder.
"""
import json
import os
import pathlib
import subprocess

import pytest

SOURCE_DIR = pathlib.Path(os.environ.get("STACKBOUND_SOURCE_DIR", pathlib.Path(__file__).resolve().parents[2]))
BINARY = pathlib.Path(os.environ.get("STACKBOUND_BINARY", SOURCE_DIR / "build" / "stackbound"))
EXAMPLES = SOURCE_DIR / "cases" / "examples"
EXAMPLE_CASES = sorted(EXAMPLES.glob("*.yaml"))

# An invented gas-fired heater as a dict with the case-file schema (INVENTED DEMO PLANT).
HEATER = {
    "case": {"title": "Invented test heater H-9 (not a real facility)", "plant_type": "ied-liquid-gaseous"},
    "fuel": {"preset": "natural_gas", "feed_rate": "2.5 MW"},
    "operating_point": {"excess_air": "12 %"},
    "firing": {"temperature": "1780 K"},
    "report": {"reference_o2": "3 %", "pollutants": ["CO", "NO", "NOx"]},
}


def run_cli(*args):
    """(exit code, stdout, stderr) of build/stackbound with these arguments, run from the repository."""
    done = subprocess.run([str(BINARY), *map(str, args)], capture_output=True, text=True, cwd=SOURCE_DIR)
    return done.returncode, done.stdout, done.stderr


def cli_json(*args):
    """The JSON document the command line prints for these arguments (it must succeed)."""
    code, out, err = run_cli(*args)
    assert code == 0, err
    return json.loads(out)


def cli_error(*args):
    """The message of an input error of the command line (exit code 2), without "stackbound: error: "."""
    code, out, err = run_cli(*args)
    assert code == 2, (code, out, err)
    assert out == ""
    prefix = "stackbound: error: "
    assert err.startswith(prefix), err
    return err[len(prefix):].rstrip("\n")


def write_case(path, document):
    """Writes a case dict as a case file: JSON is YAML, so the command line reads the same document."""
    path.write_text(json.dumps(document, indent=1), encoding="utf-8")
    return path


@pytest.fixture
def heater_file(tmp_path):
    return write_case(tmp_path / "heater.yaml", HEATER)


def without_run_time(document):
    """The document with its provenance's run time taken out (two runs a second apart differ only there)."""
    run_at = document["provenance"].pop("run_at")
    assert len(run_at) == len("2026-12-03T18:49:07Z") and run_at.endswith("Z"), run_at
    return document
