# Sanitizer and fuzzing builds (clang; see scripts/check-sanitizers and scripts/fuzz).
#   STACKBOUND_SANITIZE=ON       every target with AddressSanitizer and UndefinedBehaviorSanitizer; any
#                                undefined behaviour stops the program (no recovery), so a test fails
#   STACKBOUND_BUILD_FUZZERS=ON  the libFuzzer harnesses in fuzz/; every target gets coverage
#                                instrumentation (-fsanitize=fuzzer-no-link), the harnesses the fuzzer's main
option(STACKBOUND_SANITIZE "Build everything with AddressSanitizer and UndefinedBehaviorSanitizer" OFF)
option(STACKBOUND_BUILD_FUZZERS "Build the libFuzzer harnesses in fuzz/ (clang only)" OFF)

if(STACKBOUND_SANITIZE)
  add_compile_options(-fsanitize=address,undefined -fno-sanitize-recover=all -fno-omit-frame-pointer)
  add_link_options(-fsanitize=address,undefined)
endif()

if(STACKBOUND_BUILD_FUZZERS)
  if(NOT CMAKE_CXX_COMPILER_ID STREQUAL "Clang")
    message(FATAL_ERROR "STACKBOUND_BUILD_FUZZERS needs clang (libFuzzer): configure with -DCMAKE_CXX_COMPILER=clang++")
  endif()
  add_compile_options(-fsanitize=fuzzer-no-link)
endif()
