"""Speed of stackbound.sweep against the command line's sweep of the same 10^4 points (issue: within 10 %).

Times `stackbound sweep CASE --vary ... --vary ...` (CSV to /dev/null, from process start to exit) and
stackbound.sweep(CASE, [...]) on the same grid (the module imported once, as a script or notebook has
it), each RUNS times in turn, and prints both medians and their ratio. Both use all cores.

    PYTHONPATH=build/python /usr/bin/python3 bench/python_sweep.py [BUILD_DIR] [RUNS]
"""
import pathlib
import statistics
import subprocess
import sys
import time

import stackbound

SOURCE_DIR = pathlib.Path(__file__).resolve().parents[1]
CASE = SOURCE_DIR / "cases" / "examples" / "gas_boiler.yaml"
# 100 x 100 = 10^4 points, each a new equilibrium (the firing temperature changes at every point).
VARY = ["excess_air=5%:45%:100", "firing_temperature=1600K:1900K:100"]


def time_cli(binary):
    arguments = [str(binary), "sweep", str(CASE)]
    for text in VARY:
        arguments += ["--vary", text]
    start = time.perf_counter()
    subprocess.run(arguments, check=True, stdout=subprocess.DEVNULL)
    return time.perf_counter() - start


def time_module():
    start = time.perf_counter()
    columns = stackbound.sweep(str(CASE), VARY)
    elapsed = time.perf_counter() - start
    assert len(columns["point"]) == 10_000 and columns["status"].count("ok") == 10_000
    return elapsed


def main():
    build = pathlib.Path(sys.argv[1]) if len(sys.argv) > 1 else SOURCE_DIR / "build"
    runs = int(sys.argv[2]) if len(sys.argv) > 2 else 7
    time_cli(build / "stackbound")  # warm the file cache and the species data
    time_module()
    cli, module = [], []
    for _ in range(runs):
        cli.append(time_cli(build / "stackbound"))
        module.append(time_module())
    cli_median, module_median = statistics.median(cli), statistics.median(module)
    print(f"sweep of 10^4 points ({' x '.join(VARY)}), median of {runs} runs:")
    print(f"  command line (stackbound sweep, CSV to /dev/null): {cli_median * 1e3:8.1f} ms")
    print(f"  Python module (stackbound.sweep, numpy columns):   {module_median * 1e3:8.1f} ms")
    print(f"  module / command line: {module_median / cli_median:.3f} (target <= 1.10)")
    return 0 if module_median <= 1.10 * cli_median else 1


if __name__ == "__main__":
    sys.exit(main())
