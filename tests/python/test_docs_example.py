"""The worked example of docs/python.md: the script in python/examples/ runs and writes its PNG."""
import os
import pathlib
import subprocess
import sys

import stackbound
from conftest import SOURCE_DIR

SCRIPT = SOURCE_DIR / "python" / "examples" / "excess_air_sweep.py"
DOCS = SOURCE_DIR / "docs" / "python.md"


def test_the_docs_quote_the_example_script_verbatim():
    # Wrong if the guide showed code that is not the script the next test runs.
    assert SCRIPT.read_text(encoding="utf-8") in DOCS.read_text(encoding="utf-8")


def test_the_example_runs_and_writes_its_png(tmp_path):
    # Wrong if the example failed, printed no table, or wrote no PNG image.
    png = tmp_path / "excess_air_sweep.png"
    environment = dict(os.environ, PYTHONPATH=str(pathlib.Path(stackbound.__file__).parent), MPLBACKEND="Agg",
                       MPLCONFIGDIR=str(tmp_path / "matplotlib"))
    done = subprocess.run([sys.executable, str(SCRIPT), str(png)], capture_output=True, text=True, cwd=tmp_path,
                          env=environment)
    assert done.returncode == 0, done.stderr
    assert "NOx_mg_per_Nm3_at_ref_o2" in done.stdout
    assert f"wrote {png}" in done.stdout
    assert png.read_bytes()[:8] == b"\x89PNG\r\n\x1a\n"
    assert png.stat().st_size > 10_000
