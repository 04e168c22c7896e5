"""stackbound.sweep against `stackbound sweep ... --format csv`: the same points, the same numbers."""
import csv
import io

import numpy
import pytest

import stackbound
from conftest import EXAMPLES, HEATER, cli_error, run_cli

GAS_BOILER = EXAMPLES / "gas_boiler.yaml"
WOOD_CHIPS = EXAMPLES / "wood_chip_boiler.yaml"


def cli_rows(*arguments):
    code, out, err = run_cli("sweep", *arguments)
    assert code == 0, err
    lines = [line for line in out.splitlines() if not line.startswith("#")]
    return list(csv.reader(io.StringIO("\n".join(lines))))


def assert_same_as_csv(columns, rows, parameters):
    """Each number of the module, printed as the CSV prints it, is the CSV's cell."""
    header, body = rows[0], rows[1:]
    lengths = {len(v) for v in columns.values()}
    assert lengths == {len(body)}
    result_keys = [k for k in columns if k not in ("point", "status", "error") and not k.startswith("vary_")]
    assert len(header) == 1 + parameters + 1 + len(result_keys) + 1
    for i, row in enumerate(body):
        assert int(row[0]) == columns["point"][i]
        for k, key in enumerate(k for k in columns if k.startswith("vary_")):
            assert float(row[1 + k]) == float(f"{columns[key][i]:.10g}")
        assert row[1 + parameters] == columns["status"][i]
        for m, key in enumerate(result_keys):
            cell = row[2 + parameters + m]
            value = columns[key][i]
            if cell == "":
                assert numpy.isnan(value), key
            else:
                assert f"{value:.8g}" == f"{float(cell):.8g}", (key, value, cell)


def test_a_sweep_is_the_command_lines_csv():
    # Wrong if a point, a column or a number differed from the command line's sweep.
    columns = stackbound.sweep(str(GAS_BOILER), ["excess_air=5%:45%:9"])
    assert_same_as_csv(columns, cli_rows(GAS_BOILER, "--vary", "excess_air=5%:45%:9"), 1)
    assert list(columns)[:2] == ["point", "vary_excess_air_percent"]
    assert list(columns)[-2:] == ["status", "error"]


def test_a_two_parameter_sweep_is_the_command_lines_csv():
    vary = ["air_preheat=20degC:320degC:7", "heat_loss=10%:30%:3"]
    columns = stackbound.sweep(WOOD_CHIPS, vary)
    assert_same_as_csv(columns, cli_rows(WOOD_CHIPS, "--vary", vary[0], "--vary", vary[1]), 2)
    assert len(columns["point"]) == 21


def test_vary_as_a_dict_is_the_list_of_texts():
    by_dict = stackbound.sweep(GAS_BOILER, {"excess_air": "5%:45%:5", "reference_o2": "3%:15%:3"})
    by_list = stackbound.sweep(GAS_BOILER, ["excess_air=5%:45%:5", "reference_o2=3%:15%:3"])
    assert by_dict.keys() == by_list.keys()
    for key in by_dict:
        assert numpy.array_equal(numpy.asarray(by_dict[key]), numpy.asarray(by_list[key]), equal_nan=key not in ("status", "error"))


def test_numeric_columns_are_numpy_arrays_that_pandas_takes_as_is():
    import pandas
    columns = stackbound.sweep(HEATER, ["excess_air=5%:45%:9"])
    for key, column in columns.items():
        if key in ("status", "error"):
            assert isinstance(column, list)
        else:
            assert isinstance(column, numpy.ndarray) and column.dtype in (numpy.float64, numpy.int64), key
    frame = pandas.DataFrame(columns)
    assert frame.shape == (9, len(columns))
    assert frame["vary_excess_air_percent"].iloc[-1] == pytest.approx(45.0)


def test_a_sweep_of_a_hundred_thousand_points_returns_arrays_of_that_length():
    # Wrong if a large grid were truncated or its columns came back of different lengths.
    columns = stackbound.sweep(GAS_BOILER, ["reference_o2=1%:15%:100000"])
    assert all(len(column) == 100_000 for column in columns.values())
    assert isinstance(columns["NOx_mg_per_Nm3_at_ref_o2"], numpy.ndarray)
    assert columns["status"].count("ok") == 100_000
    assert numpy.all(numpy.diff(columns["vary_reference_o2_percent"]) > 0)


def test_failed_points_are_rows_with_the_command_lines_error_and_nan_figures(heater_file):
    # A firing temperature beyond the species data fails those points; the others still run. Wrong
    # if the module stopped at the first failure, or named the failure otherwise than the CSV does.
    vary = "firing_temperature=1500K:6000K:4"
    columns = stackbound.sweep(heater_file, [vary])
    code, out, _ = run_cli("sweep", heater_file, "--vary", vary)
    assert code == 4
    rows = list(csv.reader(io.StringIO("\n".join(l for l in out.splitlines() if not l.startswith("#")))))[1:]
    assert columns["status"] == [row[2] for row in rows] == ["ok", "ok", "failed", "failed"]
    assert columns["error"] == [row[-1] for row in rows]
    assert columns["error"][2].startswith(f"{heater_file}:")
    assert numpy.isnan(columns["NO_ppmvd"][2]) and numpy.isfinite(columns["NO_ppmvd"][1])


# Documented in docs/python.md (section "Errors").
SWEEP_ERRORS = [
    (["excess_air=45%:5%:9"], {}, ["--vary", "excess_air=45%:5%:9"]),
    (["excess_air=5%:45%"], {}, ["--vary", "excess_air=5%:45%"]),
    (["exces_air=5%:45%:9"], {}, ["--vary", "exces_air=5%:45%:9"]),
    (["excess_air=5%:45%:1000", "reference_o2=1%:15%:1000"], {"max_points": 1000},
     ["--vary", "excess_air=5%:45%:1000", "--vary", "reference_o2=1%:15%:1000", "--max-points", "1000"]),
    (["heat_loss=10%:30%:3"], {}, ["--vary", "heat_loss=10%:30%:3"]),
]


@pytest.mark.parametrize("vary, keywords, options", SWEEP_ERRORS, ids=lambda v: str(v)[:40])
def test_bad_input_is_input_error_with_the_command_lines_message(vary, keywords, options):
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.sweep(str(GAS_BOILER), vary, **keywords)
    assert str(raised.value) == cli_error("sweep", GAS_BOILER, *options)


def test_vary_of_the_wrong_type_is_input_error():
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.sweep(GAS_BOILER, 5)
    assert str(raised.value) == ('--vary = 5: expected a list of PARAM=FROM:TO:STEPS texts or a dict '
                                 '{PARAM: "FROM:TO:STEPS"}')


def test_ctrl_c_stops_a_long_sweep_with_keyboard_interrupt():
    # Wrong if a notebook user could not interrupt a long sweep (the library runs without the GIL).
    import _thread
    import threading
    timer = threading.Timer(0.3, _thread.interrupt_main)
    timer.start()
    try:
        with pytest.raises(KeyboardInterrupt):
            stackbound.sweep(GAS_BOILER, ["reference_o2=1%:15%:100000", "excess_air=5%:45%:10"])
    finally:
        timer.cancel()
