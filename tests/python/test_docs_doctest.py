"""Every `>>>` example of docs/python.md, errors included, gives exactly the text printed there."""
import doctest
import os

import stackbound
from conftest import SOURCE_DIR


def test_the_examples_and_documented_errors_of_the_guide_hold():
    # Wrong if a documented error message or result differed from what the module gives.
    previous = os.getcwd()
    os.chdir(SOURCE_DIR)  # the examples name cases/examples/... as a user in the repository does
    try:
        result = doctest.testfile(str(SOURCE_DIR / "docs" / "python.md"), module_relative=False,
                                  globs={"stackbound": stackbound}, report=True, verbose=False)
    finally:
        os.chdir(previous)
    assert result.attempted >= 25
    assert result.failed == 0
