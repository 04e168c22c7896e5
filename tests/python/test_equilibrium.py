"""stackbound.equilibrium against `stackbound equilibrium ... --format json`."""
import pytest

import stackbound
from conftest import cli_error, cli_json

FEED = "CH4 + 2.4 O2 + 9.03 N2"


def test_fixed_temperature_is_the_command_lines_json():
    # Wrong if the module solved another problem, or its default pressure were not exactly 1 atm.
    result = stackbound.equilibrium(FEED, "1800K")
    assert result == cli_json("equilibrium", "--feed", FEED, "--temperature", "1800K", "--format", "json")
    assert result["pressure_Pa"] == 101325.0


def test_adiabatic_with_feed_temperature_and_pressure_is_the_command_lines_json():
    result = stackbound.equilibrium("H2 + 0.5 O2 + 1.88 N2", adiabatic=True, pressure="10bar", feed_temperature="600K")
    assert result == cli_json("equilibrium", "--feed", "H2 + 0.5 O2 + 1.88 N2", "--adiabatic", "--feed-temperature",
                              "600K", "--pressure", "10bar", "--format", "json")
    assert result["mode"] == "adiabatic"


def test_thermal_no_after_a_residence_time_is_the_command_lines_json():
    result = stackbound.equilibrium(FEED, "1900K", residence_time="20ms")
    assert result == cli_json("equilibrium", "--feed", FEED, "--temperature", "1900K", "--residence-time", "20ms",
                              "--format", "json")
    assert result["thermal_no"]["residence_time_s"] == pytest.approx(0.02, rel=1e-12)


def test_a_species_list_is_the_comma_separated_option():
    by_list = stackbound.equilibrium("CO2", "3000K", species=["CO2", "CO", "O2"])
    assert by_list == cli_json("equilibrium", "--feed", "CO2", "--temperature", "3000K", "--species", "CO2,CO,O2",
                               "--format", "json")
    assert set(by_list["mole_fractions"]) == {"CO2", "CO", "O2"}


def test_adiabatic_with_heat_loss_is_the_command_lines_json():
    result = stackbound.equilibrium("CH4 + 2 O2 + 7.52 N2", adiabatic=True, heat_loss="5%")
    assert result == cli_json("equilibrium", "--feed", "CH4 + 2 O2 + 7.52 N2", "--adiabatic", "--heat-loss", "5%",
                              "--format", "json")


# Documented in docs/python.md (section "Errors").
EQUILIBRIUM_ERRORS = [
    ({"feed": FEED}, ["--feed", FEED]),
    ({"feed": FEED, "temperature": "1800K", "adiabatic": True}, ["--feed", FEED, "--temperature", "1800K", "--adiabatic"]),
    ({"feed": FEED, "temperature": "1800K", "pressure": "1e308 Pa"},
     ["--feed", FEED, "--temperature", "1800K", "--pressure", "1e308 Pa"]),
    ({"feed": "CH4 + 2 Q2", "temperature": "1800K"}, ["--feed", "CH4 + 2 Q2", "--temperature", "1800K"]),
    ({"feed": FEED, "temperature": "1800K", "residence_time": "2 h"},
     ["--feed", FEED, "--temperature", "1800K", "--residence-time", "2 h"]),
    ({"feed": FEED, "temperature": "9000K"}, ["--feed", FEED, "--temperature", "9000K"]),
    ({"feed": FEED, "temperature": "1800K", "heat_loss": "5%"}, ["--feed", FEED, "--temperature", "1800K", "--heat-loss", "5%"]),
]


@pytest.mark.parametrize("keywords, options", EQUILIBRIUM_ERRORS, ids=lambda v: str(v)[:40])
def test_bad_input_is_input_error_with_the_command_lines_message(keywords, options):
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.equilibrium(**keywords)
    assert str(raised.value) == cli_error("equilibrium", *options)


def test_adiabatic_must_be_true_or_false():
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.equilibrium(FEED, adiabatic="yes")
    assert str(raised.value) == "--adiabatic = 'yes': expected True or False"
