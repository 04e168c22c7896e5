"""stackbound.fuel against `stackbound fuel ... --format json`."""
import json

import pytest

import stackbound
from conftest import cli_error, cli_json

# An invented refinery fuel gas (INVENTED; not the analysis of any real gas).
FUEL_GAS = {"gas": {"CH4": "88 %", "C2H6": "6 %", "C3H8": "2 %", "H2": "2 %", "N2": "2 %"}, "feed_rate": "850 Nm3/h",
            "temperature": "30 degC"}


@pytest.fixture
def fuel_file(tmp_path):
    path = tmp_path / "fuel_gas.yaml"
    path.write_text(json.dumps({"fuel": FUEL_GAS}), encoding="utf-8")
    return path


def test_a_fuel_file_is_the_command_lines_json(fuel_file):
    # Wrong if the module burned the fuel differently from `stackbound fuel FILE`.
    result = stackbound.fuel(str(fuel_file), excess_air="15%")
    assert result == cli_json("fuel", fuel_file, "--excess-air", "15%", "--format", "json")
    assert result["feed"]["fuel_Nm3_per_h"] == pytest.approx(850.0, rel=1e-9)


def test_a_fuel_dict_is_the_same_fuel_as_the_file(fuel_file):
    # Wrong if a dict were read by other rules than a fuel file.
    from_file = stackbound.fuel(fuel_file, excess_air="15%")
    assert stackbound.fuel(FUEL_GAS, excess_air="15%") == from_file
    assert stackbound.fuel({"fuel": FUEL_GAS}, excess_air="15%") == from_file


def test_a_preset_with_conditions_is_the_command_lines_json():
    result = stackbound.fuel({"preset": "natural_gas"}, flue_o2="3 %", rate="25 MMBtu/h")
    assert result == cli_json("fuel", "--preset", "natural_gas", "--flue-o2", "3 %", "--rate", "25 MMBtu/h",
                              "--format", "json")


def test_humid_air_and_lambda_are_the_command_lines_json():
    result = stackbound.fuel({"preset": "wood_chips"}, lambda_=1.5, relative_humidity="70%", ambient_temperature="10degC")
    assert result == cli_json("fuel", "--preset", "wood_chips", "--lambda", "1.5", "--relative-humidity", "70%",
                              "--ambient-temperature", "10degC", "--format", "json")


# Documented in docs/python.md (section "Errors").
FUEL_ERRORS = [
    ({"excess_air": "15%", "lambda_": "1.2"}, ["--excess-air", "15%", "--lambda", "1.2"]),
    ({"rate": "1e9 t/h"}, ["--rate", "1e9 t/h"]),
    ({"relative_humidity": "60%", "humidity_ratio": "0.01"}, ["--relative-humidity", "60%", "--humidity-ratio", "0.01"]),
    ({"ambient_pressure": "1 bar"}, ["--ambient-pressure", "1 bar"]),
]


@pytest.mark.parametrize("keywords, options", FUEL_ERRORS, ids=lambda v: str(v)[:40])
def test_bad_conditions_are_input_error_with_the_command_lines_message(keywords, options):
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.fuel({"preset": "natural_gas"}, **keywords)
    assert str(raised.value) == cli_error("fuel", "--preset", "natural_gas", *options)


def test_an_unknown_species_in_a_dict_names_the_field():
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.fuel({"gas": {"CH5": "100 %"}})
    assert str(raised.value).startswith("<dict>: fuel.gas")


def test_a_choice_the_command_line_checks_is_checked_here_too():
    # Wrong if a basis other than dry or wet were taken silently as dry.
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.fuel({"preset": "natural_gas"}, flue_o2="3%", flue_o2_basis="moist")
    assert str(raised.value) == '--flue-o2-basis = "moist": not an accepted value; accepted: dry, wet'
