"""stackbound.reduce against `stackbound reduce CASE READINGS --format json`."""
import csv

import numpy
import pandas
import pytest

import stackbound
from conftest import EXAMPLES, HEATER, cli_error, cli_json

CASE = EXAMPLES / "gas_turbine.yaml"
READINGS = EXAMPLES / "gas_turbine_readings.csv"
# The demo file starts with two comment lines: its line L is line L - 2 of the dict's CSV text.
COMMENT_LINES = 2
TEXT_COLUMNS = ("time", "status")


def csv_columns():
    """The demo readings read with the csv module: a dict of lists of texts, as the file has them."""
    with open(READINGS, newline="", encoding="utf-8") as file:
        rows = csv.DictReader(line for line in file if not line.startswith("#"))
        columns = {name: [] for name in rows.fieldnames}
        for row in rows:
            for name, text in row.items():
                columns[name].append(text)
    return columns


def as_file_document(document):
    """A document of the dict's readings with the file's name and line numbers, to compare with the file's."""
    document["readings_file"] = str(READINGS)
    for row in document["summary"]["bad_rows"]["first"]:
        row["line"] += COMMENT_LINES
    return document


@pytest.mark.parametrize("rules", ["none", "us-part60", "eu-ied"])
def test_a_readings_file_is_the_command_lines_json(rules):
    # Wrong if the module read the readings, applied the rule set or rendered the document otherwise.
    result = stackbound.reduce(str(CASE), str(READINGS), rules=rules)
    assert result == cli_json("reduce", CASE, READINGS, "--rules", rules, "--format", "json")
    assert result["rule_set"] == rules
    assert result["summary"]["bad_rows"]["total"] == 4


def test_averages_and_coverage_overrides_are_the_command_lines_options():
    # Wrong if a keyword were dropped or mapped to another option.
    result = stackbound.reduce(CASE, READINGS, rules="us-part60", average="3h", strict=False, list_bad_rows=2,
                               min_quadrants=3, min_hour_coverage="80 %", max_invalid_hours=2, min_valid_hours="90 %")
    assert result == cli_json("reduce", CASE, READINGS, "--rules", "us-part60", "--average", "3h", "--list-bad-rows",
                              "2", "--min-quadrants", "3", "--min-hour-coverage", "80 %", "--max-invalid-hours", "2",
                              "--min-valid-hours", "90 %", "--format", "json")
    assert len(result["summary"]["bad_rows"]["first"]) == 2
    rolling = stackbound.reduce(CASE, READINGS, rules="eu-ied", average="6h rolling")
    assert rolling == cli_json("reduce", CASE, READINGS, "--rules", "eu-ied", "--average", "6h", "rolling",
                               "--format", "json")


@pytest.mark.parametrize("rules", ["none", "us-part60", "eu-ied"])
def test_the_readings_as_a_dict_of_texts_give_the_files_document(rules):
    # Wrong if the dict's columns did not reach the same reader in the same order and with the same texts.
    result = stackbound.reduce(CASE, csv_columns(), rules=rules)
    assert result["readings_file"] == "<readings dict>"
    assert as_file_document(result) == stackbound.reduce(CASE, READINGS, rules=rules)


def test_numpy_columns_give_the_document_of_their_numbers_as_text():
    # Wrong if a number lost digits on the way from the numpy buffer to the reader, or NaN were not an
    # empty cell (a missing value).
    texts = csv_columns()
    arrays, shortest = {}, {}
    for name, column in texts.items():
        if name in TEXT_COLUMNS:
            arrays[name] = shortest[name] = column
            continue
        values = numpy.array(pandas.to_numeric(pandas.Series(column), errors="coerce"), dtype=float)
        arrays[name] = values
        shortest[name] = ["" if numpy.isnan(v) else repr(float(v)) for v in values]
    result = stackbound.reduce(CASE, arrays, rules="us-part60")
    assert result == stackbound.reduce(CASE, shortest, rules="us-part60")
    # The "---" of the file's NOx column is NaN in the array: an empty value rather than not a number.
    assert result["summary"]["bad_rows"]["by_kind"]["empty_value"] == 2
    assert result["summary"]["bad_rows"]["by_kind"]["not_a_number"] == 0


def test_a_dataframes_columns_give_the_files_document():
    # Wrong if the numbers pandas parsed (floats, ints) did not come back to the same doubles; only the
    # echo of an impossible value shows the number as Python writes it ("99.9", the file has "99.90").
    frame = pandas.read_csv(READINGS, comment="#")
    result = stackbound.reduce(CASE, frame.to_dict("list"), rules="us-part60")
    assert stackbound.reduce(CASE, {name: frame[name] for name in frame}, rules="us-part60") == result
    echo = result["summary"]["bad_rows"]["first"][2]
    assert echo["detail"] == "column O2 = 99.9 %: O2 must be between 0 % and 21 %"
    echo["detail"] = "column O2 = 99.90 %: O2 must be between 0 % and 21 %"
    assert as_file_document(result) == stackbound.reduce(CASE, READINGS, rules="us-part60")


def test_strict_stops_at_the_first_bad_row_with_the_command_lines_message():
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.reduce(CASE, READINGS, strict=True)
    message = cli_error("reduce", CASE, READINGS, "--strict")
    assert str(raised.value) == message
    assert message.startswith(f"{READINGS}:556: not_a_number: ")
    with pytest.raises(stackbound.InputError) as from_dict:
        stackbound.reduce(CASE, csv_columns(), strict=True)
    assert str(from_dict.value) == message.replace(f"{READINGS}:556:", "<readings dict>:554:")


# Documented in docs/python.md (section "Errors").
REDUCE_ERRORS = [
    ({"rules": "us-part61"}, ["--rules", "us-part61"]),
    ({"average": "fortnight"}, ["--average", "fortnight"]),
    ({"min_quadrants": 5}, ["--min-quadrants", "5"]),
    ({"max_invalid_hours": 25}, ["--max-invalid-hours", "25"]),
    ({"min_hour_coverage": "120 %"}, ["--min-hour-coverage", "120 %"]),
    ({"min_valid_hours": "-5 %"}, ["--min-valid-hours=-5 %"]),
]


@pytest.mark.parametrize("keywords, options", REDUCE_ERRORS, ids=lambda v: str(v)[:40])
def test_bad_options_are_input_errors_with_the_command_lines_message(keywords, options):
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.reduce(CASE, READINGS, **keywords)
    assert str(raised.value) == cli_error("reduce", CASE, READINGS, *options)


def test_a_missing_readings_file_and_a_case_without_readings_are_the_command_lines_errors(heater_file):
    with pytest.raises(stackbound.InputError) as missing:
        stackbound.reduce(CASE, "no/such.csv")
    assert str(missing.value) == cli_error("reduce", CASE, "no/such.csv")
    with pytest.raises(stackbound.InputError) as no_section:
        stackbound.reduce(heater_file, READINGS)
    assert str(no_section.value) == cli_error("reduce", heater_file, READINGS)
    with pytest.raises(stackbound.InputError) as from_dict:
        stackbound.reduce(HEATER, csv_columns())
    assert str(from_dict.value) == "<dict>: the case file has no readings section (docs/case-file.md, \"readings\")"


def test_a_missing_column_is_named_with_the_columns_given():
    columns = csv_columns()
    del columns["NOx"]
    del columns["load"]
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.reduce(CASE, columns)
    assert str(raised.value) == ('readings: no column "NOx", which the case\'s readings section maps; the dict\'s '
                                 "columns are time, O2, CO2, CO, H2O, flow, T_amb, RH, status")


def test_columns_of_unequal_length_are_named_with_their_lengths():
    columns = csv_columns()
    columns["CO"] = numpy.array([float(v or "nan") for v in columns["CO"][:-3]])
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.reduce(CASE, columns)
    assert str(raised.value) == ('readings: column "CO" has 1393 values, column "time" has 1396; the columns must be '
                                 "of equal length")


def test_cells_the_reader_cannot_take_are_input_errors():
    # Wrong if a comma in a status split the row silently into more fields, or a value were not a cell.
    columns = csv_columns()
    columns["status"][7] = "OK, checked"
    with pytest.raises(stackbound.InputError) as comma:
        stackbound.reduce(CASE, columns)
    assert str(comma.value) == ('readings["status"][7] = "OK, checked": holds the delimiter ",", a quote or a line '
                                "break, or starts the row with '#'; the readings reader takes none of these in a value")
    columns = csv_columns()
    columns["NOx"][3] = {"ppm": 9}
    with pytest.raises(stackbound.InputError) as odd:
        stackbound.reduce(CASE, columns)
    assert str(odd.value) == "readings[\"NOx\"][3] = {'ppm': 9}: a dict; expected a number, text, a date-time or None"
    with pytest.raises(stackbound.InputError) as not_a_sequence:
        stackbound.reduce(CASE, dict(csv_columns(), NOx=9.0))
    assert str(not_a_sequence.value) == ('readings["NOx"] = 9.0: a float; expected a sequence of values (a list, a '
                                         "numpy array)")
    with pytest.raises(stackbound.InputError) as two_dimensions:
        stackbound.reduce(CASE, dict(csv_columns(), NOx=numpy.zeros((1396, 2))))
    assert str(two_dimensions.value) == 'readings["NOx"]: an array of 2 dimensions; expected one value a row'


def test_readings_must_be_a_path_or_a_dict_and_keywords_their_types():
    with pytest.raises(stackbound.InputError) as raised:
        stackbound.reduce(CASE, [1, 2])
    assert str(raised.value) == ("readings = [1, 2]: a list; expected the path of a readings CSV or a dict of "
                                 "equal-length columns")
    with pytest.raises(stackbound.InputError) as strict:
        stackbound.reduce(CASE, READINGS, strict="yes")
    assert str(strict.value) == "--strict = 'yes': expected True or False"
    with pytest.raises(stackbound.InputError) as quadrants:
        stackbound.reduce(CASE, READINGS, min_quadrants="3")
    assert str(quadrants.value) == "--min-quadrants = '3': expected a whole number"


def test_datetimes_are_read_by_their_iso_form():
    # Wrong if a pandas Timestamp column (parse_dates) were not the same instants as the texts.
    frame = pandas.read_csv(READINGS, comment="#")
    frame["time"] = [pandas.Timestamp(t) for t in frame["time"]]
    assert stackbound.reduce(CASE, frame.to_dict("list"))["periods"] == \
        stackbound.reduce(CASE, pandas.read_csv(READINGS, comment="#").to_dict("list"))["periods"]
