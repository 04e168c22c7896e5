# Builds one compile-fail target and checks the outcome (see CMakeLists.txt here).
# -DBUILD_DIR, -DTARGET, -DCONFIG, -DEXPECT=pass|fail, -DSOURCE_NAME, -DERROR_REGEX.
execute_process(COMMAND ${CMAKE_COMMAND} --build ${BUILD_DIR} --target ${TARGET} --config ${CONFIG}
                RESULT_VARIABLE result OUTPUT_VARIABLE output ERROR_VARIABLE output)
if(EXPECT STREQUAL "pass")
  if(NOT result EQUAL 0)
    message(FATAL_ERROR "${TARGET}: the control variant must compile, but the build failed:\n${output}")
  endif()
  message(STATUS "${TARGET}: compiles, as expected")
else()
  if(result EQUAL 0)
    message(FATAL_ERROR "${TARGET}: the misuse compiled; the typed boundary does not reject it")
  endif()
  # The error must be the expected one, reported in the test source (not, say, a build-system failure).
  if(NOT output MATCHES "${SOURCE_NAME}" OR NOT output MATCHES "${ERROR_REGEX}")
    message(FATAL_ERROR "${TARGET}: the build failed, but not with an error matching \"${ERROR_REGEX}\" "
                        "in ${SOURCE_NAME}:\n${output}")
  endif()
  message(STATUS "${TARGET}: rejected by the compiler, as expected")
endif()
