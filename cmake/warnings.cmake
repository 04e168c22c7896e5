# Warnings for our own targets, in one commented list.
#   -Wall -Wextra   : the common set
#   -Wpedantic      : standard C++ only
#   -Wshadow        : a local hiding a member or outer name is a frequent source of unit mix-ups
#   -Wno-restrict   : GCC 12 reports false positives in std::string concatenation at -O3 (GCC bug 105651)
#   -Wconversion is left out: Eigen and yaml-cpp headers trip it in ways we cannot fix.
function(stackbound_set_warnings target)
  target_compile_options(${target} PRIVATE -Wall -Wextra -Wpedantic -Wshadow
    $<$<CXX_COMPILER_ID:GNU>:-Wno-restrict>)
  if(STACKBOUND_WARNINGS_AS_ERRORS)
    target_compile_options(${target} PRIVATE -Werror)
  endif()
endfunction()

# Headers are included with the project prefix, as a library user writes them:
#   #include "stackbound/core/equilibrium.hpp"
# In the build tree, include/stackbound/<layer> is a link to the layer's source folder; the install
# rules (cmake/install.cmake) copy the headers to the same relative paths.
function(stackbound_link_layer_headers name)
  file(MAKE_DIRECTORY ${PROJECT_BINARY_DIR}/include/stackbound)
  file(CREATE_LINK ${PROJECT_SOURCE_DIR}/${name} ${PROJECT_BINARY_DIR}/include/stackbound/${name} SYMBOLIC)
endfunction()

# Declares one layer library: stackbound_<name> with alias stackbound::<name>.
function(stackbound_add_layer name)
  cmake_parse_arguments(ARG "" "" "SOURCES;PUBLIC_LINKS;PRIVATE_LINKS" ${ARGN})
  stackbound_link_layer_headers(${name})
  add_library(stackbound_${name} ${ARG_SOURCES})
  add_library(stackbound::${name} ALIAS stackbound_${name})
  set_target_properties(stackbound_${name} PROPERTIES EXPORT_NAME ${name} POSITION_INDEPENDENT_CODE ON)
  target_include_directories(stackbound_${name} PUBLIC
    $<BUILD_INTERFACE:${PROJECT_BINARY_DIR}/include>
    $<INSTALL_INTERFACE:${CMAKE_INSTALL_INCLUDEDIR}>)
  target_compile_features(stackbound_${name} PUBLIC cxx_std_20)
  target_link_libraries(stackbound_${name} PUBLIC ${ARG_PUBLIC_LINKS} PRIVATE ${ARG_PRIVATE_LINKS})
  stackbound_set_warnings(stackbound_${name})
endfunction()
