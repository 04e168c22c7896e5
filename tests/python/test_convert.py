"""stackbound.convert against `stackbound convert ... --format json`."""
import pytest

import stackbound
from conftest import cli_error, cli_json

# (value, pollutant, from, to, keyword arguments, the same as command-line options)
CONVERSIONS = [
    ("35 ppm", "CO", "dry, O2=7.2%", "mg/Nm3, dry, O2=3%", {}, []),
    ("25 ppmvd", "NOx", "O2=15%", "mg/Nm3", {"normal": "IED", "o2_basis": "21"}, ["--normal", "IED", "--o2-basis", "21"]),
    ("120 mg/Nm3", "SO2", "wet", "ppmv, dry, O2=6%", {"moisture": "11%", "o2": "8.1%"},
     ["--moisture", "11%", "--o2", "8.1%"]),
    ("0.02 gr/dscf", "PM", "", "mg/Nm3", {}, []),
    ("40 ppmvd", "NOx", "O2=ied-gas-turbine", "mg/Nm3", {}, []),
    ("2.1 ug/Nm3", "Hg", "dry", "ppbv", {"molar_mass": "200.59 g/mol"}, ["--molar-mass", "200.59 g/mol"]),
]


@pytest.mark.parametrize("value, pollutant, source, target, keywords, options", CONVERSIONS, ids=lambda v: str(v)[:20])
def test_convert_is_the_command_lines_json(value, pollutant, source, target, keywords, options):
    # Wrong if the module applied other factors than the command, or changed a number.
    result = stackbound.convert(value, pollutant, source, target, **keywords)
    arguments = ["convert", value, pollutant, "--to", target, *options, "--format", "json"]
    if source:
        arguments += ["--from", source]
    assert result == cli_json(*arguments)
    assert {"value", "unit", "basis", "factors"} <= set(result)


def test_a_number_takes_its_unit_from_the_basis():
    # Wrong if a Python number were read differently from the same number written as text.
    assert stackbound.convert(35, "CO", "ppm, dry, O2=7.2%", "mg/Nm3, dry, O2=3%") == \
        stackbound.convert("35", "CO", "ppm, dry, O2=7.2%", "mg/Nm3, dry, O2=3%")


# Documented in docs/python.md (section "Errors").
CONVERT_ERRORS = [
    (("120 mg/Nm3", "SO2", "wet", "ppmv, dry"), {}, ["120 mg/Nm3", "SO2", "--from", "wet", "--to", "ppmv, dry"]),
    (("35 ppm", "CO", "dry", "mg/Nm3"), {"o2": "25%"}, ["35 ppm", "CO", "--from", "dry", "--to", "mg/Nm3", "--o2", "25%"]),
    (("35 bananas", "CO", "dry", "mg/Nm3"), {}, ["35 bananas", "CO", "--from", "dry", "--to", "mg/Nm3"]),
    (("35 ppm", "XYZ", "dry", "mg/Nm3"), {}, ["35 ppm", "XYZ", "--from", "dry", "--to", "mg/Nm3"]),
]


@pytest.mark.parametrize("arguments, keywords, options", CONVERT_ERRORS, ids=lambda v: str(v)[:20])
def test_bad_input_is_input_error_with_the_command_lines_message(arguments, keywords, options):
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.convert(*arguments, **keywords)
    assert str(raised.value) == cli_error("convert", *options)


def test_a_missing_moisture_names_the_keyword_the_command_line_names():
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.convert("120 mg/Nm3", "SO2", "wet", "ppmv, dry")
    assert "--moisture" in str(raised.value)


def test_an_option_of_the_wrong_type_is_input_error():
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.convert("35 ppm", "CO", "dry", "mg/Nm3", o2=["3%"])
    assert str(raised.value) == "--o2 = ['3%']: a list; expected text such as \"15 %\" or a number"
