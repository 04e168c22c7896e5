# Install rules and a CMake package, so that another project can
#   find_package(stackbound) ; target_link_libraries(app PRIVATE stackbound::render)   # or any lower layer
include(CMakePackageConfigHelpers)

install(TARGETS stackbound_units stackbound_core stackbound_emissions stackbound_cases stackbound_render
        EXPORT stackboundTargets
        ARCHIVE DESTINATION ${CMAKE_INSTALL_LIBDIR}
        LIBRARY DESTINATION ${CMAKE_INSTALL_LIBDIR})
install(TARGETS stackbound RUNTIME DESTINATION ${CMAKE_INSTALL_BINDIR})
foreach(layer units core emissions cases render)
  install(DIRECTORY ${PROJECT_SOURCE_DIR}/${layer}/
          DESTINATION ${CMAKE_INSTALL_INCLUDEDIR}/stackbound/${layer}
          FILES_MATCHING PATTERN "*.hpp" PATTERN "examples" EXCLUDE
          # internal to the equilibrium solver's sources, not part of the interface
          PATTERN "equilibrium_steps.hpp" EXCLUDE)
endforeach()
install(FILES ${PROJECT_BINARY_DIR}/include/stackbound/version.hpp DESTINATION ${CMAKE_INSTALL_INCLUDEDIR}/stackbound)
install(EXPORT stackboundTargets NAMESPACE stackbound::
        DESTINATION ${CMAKE_INSTALL_LIBDIR}/cmake/stackbound)
configure_package_config_file(${PROJECT_SOURCE_DIR}/cmake/stackboundConfig.cmake.in
  ${PROJECT_BINARY_DIR}/stackboundConfig.cmake
  INSTALL_DESTINATION ${CMAKE_INSTALL_LIBDIR}/cmake/stackbound)
write_basic_package_version_file(${PROJECT_BINARY_DIR}/stackboundConfigVersion.cmake
  COMPATIBILITY SameMinorVersion)
install(FILES ${PROJECT_BINARY_DIR}/stackboundConfig.cmake
              ${PROJECT_BINARY_DIR}/stackboundConfigVersion.cmake
        DESTINATION ${CMAKE_INSTALL_LIBDIR}/cmake/stackbound)
