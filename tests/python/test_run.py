"""stackbound.run against `stackbound run --format json`: the same document, the same errors."""
import copy

import pytest

import stackbound
from conftest import EXAMPLE_CASES, HEATER, cli_error, cli_json, without_run_time, write_case


@pytest.mark.parametrize("case", EXAMPLE_CASES, ids=lambda p: p.stem)
def test_run_of_a_case_file_is_the_command_lines_json(case):
    # Wrong if the module ran another calculation than the command, or lost or rounded a number.
    assert without_run_time(stackbound.run(str(case))) == without_run_time(cli_json("run", case, "--format", "json"))


def test_run_accepts_a_path_object():
    # Wrong if only str paths worked (pathlib is what scripts pass).
    case = EXAMPLE_CASES[0]
    assert without_run_time(stackbound.run(case)) == without_run_time(stackbound.run(str(case)))


def test_run_of_a_dict_is_the_run_of_the_same_case_file(heater_file):
    # Wrong if a dict were read by other rules than a case file; only the case's origin differs.
    from_dict = stackbound.run(HEATER)
    from_cli = cli_json("run", heater_file, "--format", "json")
    assert from_dict["case"].pop("file") == "<dict>"
    assert from_cli["case"].pop("file") == str(heater_file)
    # The fingerprint of a dict is of the case as YAML text, not of the file's bytes.
    assert len(from_dict["provenance"].pop("case_sha256")) == 64
    from_cli["provenance"].pop("case_sha256")
    assert without_run_time(from_dict) == without_run_time(from_cli)


def test_numbers_come_back_as_python_floats_and_texts_as_str():
    # Wrong if figures came back as text, or the document held other types than JSON's.
    report = stackbound.run(HEATER)

    def walk(value):
        if isinstance(value, dict):
            assert all(isinstance(k, str) for k in value)
            for item in value.values():
                walk(item)
        elif isinstance(value, list):
            for item in value:
                walk(item)
        else:
            assert value is None or isinstance(value, (bool, int, float, str)), type(value)
    walk(report)
    assert isinstance(report["case"]["title"], str)
    assert isinstance(report["combustion"]["air_ratio"], float)


def test_numbers_of_a_dict_case_may_be_python_numbers():
    # Wrong if a number in the dict were refused or read differently from its text in a file.
    case = copy.deepcopy(HEATER)
    case["operating_point"] = {"lambda": 1.12}  # a Python float where a file holds 1.12
    with_text = copy.deepcopy(HEATER)
    with_text["operating_point"] = {"lambda": "1.12"}
    report = stackbound.run(case)
    assert report == stackbound.run(with_text)
    assert report["combustion"]["air_ratio"] == 1.12


def test_a_bad_value_in_a_case_file_is_the_command_lines_message(tmp_path):
    # Wrong if the module's message differed from what the command line prints for the same file.
    case = copy.deepcopy(HEATER)
    case["firing"]["temperature"] = "1780 furlongs"
    path = write_case(tmp_path / "bad.yaml", case)
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.run(str(path))
    assert str(raised.value) == cli_error("run", path)
    assert str(raised.value).startswith(f"{path}:")


def test_a_run_error_of_a_case_file_names_its_position_as_the_command_line_does(tmp_path):
    # Wrong if an error found while running (not at load) lost its file position in the module.
    case = copy.deepcopy(HEATER)
    case["firing"]["temperature"] = "5000 K"
    path = write_case(tmp_path / "hot.yaml", case)
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.run(path)
    assert str(raised.value) == cli_error("run", path)


def test_a_missing_case_file_is_the_command_lines_message(tmp_path):
    missing = tmp_path / "nowhere.yaml"
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.run(str(missing))
    assert str(raised.value) == cli_error("run", missing)


# Documented in docs/python.md (section "Errors"): the dict's errors name the field path.
DICT_ERRORS = [
    (("operating_point", "excess_air"), "lots",
     '<dict>: operating_point.excess_air = "lots": no number found; expected a fraction (% or ppm); accepted units: '
     '%, ppm, ppmv, ppb, ppbv'),
    (("operating_point", "exces_air"), "15 %",
     '<dict>: operating_point: unknown key "exces_air" (did you mean "excess_air"?); accepted keys: excess_air, '
     'lambda, equivalence_ratio, flue_o2, flue_o2_basis'),
    (("firing", "temperature"), "5000 K",
     "<dict>: firing.temperature: temperature = 5000 K: outside the data range of product CO2 (200-3500 K); the "
     "product candidates together cover 200-3500 K"),
    (("fuel", "feed_rate"), [1, 2],
     "<dict>: fuel.feed_rate: expected a single value, not a list or mapping"),
]


@pytest.mark.parametrize("path, value, message", DICT_ERRORS, ids=lambda v: str(v)[:30])
def test_an_error_in_a_dict_names_the_field_path(tmp_path, path, value, message):
    # Wrong if the message lost the field path, or differed from the file's message beyond the position.
    case = copy.deepcopy(HEATER)
    section, key = path
    if key == "exces_air":
        del case[section]["excess_air"]
    case[section][key] = value
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.run(case)
    text = str(raised.value)
    assert text == message
    # The same case as a file: the command line's message, with file:line:column for "<dict>" (and, for
    # an error found while running, for the field path).
    from_file = cli_error("run", write_case(tmp_path / "case.yaml", case)).split(": ", 1)[1]
    assert text.removeprefix("<dict>: ") in (from_file, f"{section}.{key}: {from_file}")


def test_an_object_that_is_not_a_case_is_refused():
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.run(42)
    assert str(raised.value) == ("case = 42: a int; expected the path of a case file or a dict with the case-file "
                                 "schema (docs/case-file.md)")


def test_a_value_python_cannot_put_in_a_case_is_refused_with_its_path():
    case = copy.deepcopy(HEATER)
    case["operating_point"]["excess_air"] = object
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.run(case)
    assert str(raised.value) == ("<dict>: operating_point.excess_air = <class 'object'>: a type; expected text, a "
                                 "number, true or false, a list or a dict")


def test_a_key_that_is_not_text_is_refused():
    case = copy.deepcopy(HEATER)
    case["report"][3] = "x"
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.run(case)
    assert str(raised.value) == "<dict>: report: the key 3 is a int; keys are text"


def test_a_dict_nested_too_deep_is_refused_without_a_crash():
    # Wrong if a deeply nested dict exhausted the stack instead of raising InputError.
    deep = {}
    inner = deep
    for _ in range(200):
        inner["a"] = {}
        inner = inner["a"]
    case = copy.deepcopy(HEATER)
    case["case"]["description"] = deep
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.run(case)
    assert "nested deeper than 64 levels" in str(raised.value)


def test_input_error_is_a_value_error_and_convergence_error_its_own_class():
    assert issubclass(stackbound.InputError, ValueError)
    assert issubclass(stackbound.ConvergenceError, Exception)
    assert not issubclass(stackbound.ConvergenceError, stackbound.InputError)


def test_the_module_version_is_the_projects():
    # Wrong if the module reported another version than the CMake project it was built from.
    import re
    from conftest import SOURCE_DIR
    project = re.search(r"project\(stackbound VERSION (\S+)", (SOURCE_DIR / "CMakeLists.txt").read_text()).group(1)
    assert stackbound.__version__ == project


def test_text_without_a_utf8_form_is_input_error_not_a_crash():
    # Wrong if a lone surrogate (possible in a Python str, not in a file) escaped as another error.
    case = copy.deepcopy(HEATER)
    case["case"]["title"] = "boiler \ud800"
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.run(case)
    assert str(raised.value) == ("<dict>: case.title: the text has no UTF-8 form (it holds a lone surrogate); give "
                                 "valid Unicode text")
    with pytest.raises(stackbound.InputError):
        stackbound.run("\ud800.yaml")


def test_a_control_character_in_a_dict_case_is_refused_as_in_a_case_file():
    # Wrong if a NUL or a C1 control in a dict value or key passed into the report, as it did before
    # (a case file refuses them at load).
    case = copy.deepcopy(HEATER)
    case["case"]["title"] = "H-101\x00\x85"
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.run(case)
    assert str(raised.value) == ('<dict>: case.title = "H-101\\x00\\u0085": control character U+0000 is not '
                                 'allowed in a text file; remove it')
    case = copy.deepcopy(HEATER)
    case["case"]["ti\x01tle"] = case["case"].pop("title")
    with pytest.raises(stackbound.InputError, match="control character U[+]0001"):
        stackbound.run(case)


@pytest.mark.parametrize("value", [float("nan"), float("inf"), -1e308, 10**400, True, None, [], {}],
                         ids=repr)
def test_any_value_of_a_field_is_a_result_or_input_error(value):
    # Wrong if some Python value crashed the module or escaped as another exception type.
    case = copy.deepcopy(HEATER)
    case["firing"]["temperature"] = value
    with pytest.raises(stackbound.InputError):
        stackbound.run(case)
