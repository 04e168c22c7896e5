# The Python module `stackbound` (python/): built when a Python 3 interpreter with its headers, numpy
# and pybind11 are found (Debian: python3-dev, python3-numpy, pybind11-dev; scripts/install-deps).
#   STACKBOUND_PYTHON              build it (default: ON when everything is found)
#   Python3_EXECUTABLE             the interpreter (default: Debian's /usr/bin/python3 when it exists;
#                                  the python3 first on PATH may be another one without numpy)
#   STACKBOUND_PYTHON_INSTALL_DIR  where `cmake --install` puts it: the interpreter's site-packages
#                                  relative to the install prefix (or an absolute path); see below
# Sanitizer and fuzzing builds leave it out: an extension with AddressSanitizer cannot be loaded by
# an interpreter built without it.
if(NOT DEFINED Python3_EXECUTABLE AND EXISTS /usr/bin/python3)
  set(Python3_EXECUTABLE /usr/bin/python3 CACHE FILEPATH "Python interpreter of the stackbound module")
endif()
set(stackbound_python_found OFF)
set(stackbound_python_skipped "")  # why it is not built, for the configure log and the skipped test
if(NOT STACKBOUND_SANITIZE AND NOT STACKBOUND_BUILD_FUZZERS)
  find_package(Python3 COMPONENTS Interpreter Development NumPy)
  if(Python3_FOUND)
    find_package(pybind11 CONFIG)
    if(pybind11_FOUND)
      set(stackbound_python_found ON)
    else()
      set(stackbound_python_skipped "missing pybind11 (Debian pybind11-dev)")
    endif()
  else()
    set(stackbound_python_skipped "missing Python 3 with its headers and numpy (Debian python3-dev, python3-numpy)")
  endif()
else()
  set(stackbound_python_skipped "sanitizer and fuzzing builds leave it out")
endif()
option(STACKBOUND_PYTHON "Build the Python module stackbound (python/)" ${stackbound_python_found})
if(STACKBOUND_PYTHON AND NOT stackbound_python_found)
  message(FATAL_ERROR "STACKBOUND_PYTHON is ON but the Python module cannot be built: ${stackbound_python_skipped}")
endif()
if(NOT STACKBOUND_PYTHON)
  if(stackbound_python_found)
    set(stackbound_python_skipped "STACKBOUND_PYTHON=OFF")
  endif()
  message(STATUS "Python module: skipped (${stackbound_python_skipped})")
  return()
endif()

# The interpreter's own site-packages (where its package installer puts modules; on Debian
# /usr/local/lib/python3.X/dist-packages, which Python3_SITEARCH does not name), relative to the install
# prefix when below it (the default prefix /usr/local), else to the interpreter's prefix (a virtual
# environment): cmake --install --prefix P then puts the module in P/lib/python3.X/...
execute_process(COMMAND ${Python3_EXECUTABLE} -c "import sys, sysconfig; print(sysconfig.get_paths()['platlib']); print(sys.prefix)"
                OUTPUT_VARIABLE stackbound_python_paths OUTPUT_STRIP_TRAILING_WHITESPACE)
string(REPLACE "\n" ";" stackbound_python_paths "${stackbound_python_paths}")
list(GET stackbound_python_paths 0 stackbound_python_platlib)
list(GET stackbound_python_paths 1 stackbound_python_prefix)
if(stackbound_python_platlib MATCHES "^${CMAKE_INSTALL_PREFIX}/")
  file(RELATIVE_PATH stackbound_python_site ${CMAKE_INSTALL_PREFIX} ${stackbound_python_platlib})
else()
  file(RELATIVE_PATH stackbound_python_site ${stackbound_python_prefix} ${stackbound_python_platlib})
endif()
set(STACKBOUND_PYTHON_INSTALL_DIR ${stackbound_python_site} CACHE PATH
    "Where cmake --install puts the stackbound Python module (relative to the install prefix, or absolute)")
message(STATUS "Python module: ${Python3_EXECUTABLE} (${Python3_VERSION}), built into ${PROJECT_BINARY_DIR}/python, "
               "installed into <prefix>/${STACKBOUND_PYTHON_INSTALL_DIR}")
