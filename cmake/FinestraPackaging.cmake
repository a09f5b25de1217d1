# Installation layout (GNUInstallDirs) and the Debian package (CPack). `cpack` in a build tree
# produces finestra_<version>_<arch>.deb; .ci/run builds, installs and runs it.

# Examples (invented scenarios) for the installed programs and the Python module.
install(DIRECTORY ${PROJECT_SOURCE_DIR}/examples/ DESTINATION ${CMAKE_INSTALL_DATADIR}/finestra/examples
        PATTERN "__pycache__" EXCLUDE)

if(FINESTRA_BUILD_GUI)
  set(FINESTRA_APP_ID org.finestra.Finestra)
  configure_file(${PROJECT_SOURCE_DIR}/resources/packaging/${FINESTRA_APP_ID}.metainfo.xml
                 ${PROJECT_BINARY_DIR}/packaging/${FINESTRA_APP_ID}.metainfo.xml @ONLY)
  install(FILES ${PROJECT_SOURCE_DIR}/resources/finestra.desktop DESTINATION ${CMAKE_INSTALL_DATADIR}/applications)
  install(FILES ${PROJECT_BINARY_DIR}/packaging/${FINESTRA_APP_ID}.metainfo.xml DESTINATION ${CMAKE_INSTALL_DATADIR}/metainfo)
  install(FILES ${PROJECT_SOURCE_DIR}/resources/packaging/finestra-mime.xml
          DESTINATION ${CMAKE_INSTALL_DATADIR}/mime/packages RENAME finestra.xml)
  install(FILES ${PROJECT_SOURCE_DIR}/resources/icons/finestra.svg
          DESTINATION ${CMAKE_INSTALL_DATADIR}/icons/hicolor/scalable/apps)
  install(FILES ${PROJECT_SOURCE_DIR}/resources/icons/finestra.svg
          DESTINATION ${CMAKE_INSTALL_DATADIR}/icons/hicolor/scalable/mimetypes
          RENAME application-x-finestra-project+json.svg)
endif()

set(CPACK_GENERATOR DEB)
set(CPACK_PACKAGE_NAME finestra)
set(CPACK_PACKAGE_VERSION ${PROJECT_VERSION})
set(CPACK_PACKAGE_VENDOR "Finestra developers")
set(CPACK_PACKAGE_CONTACT "Finestra developers <finestra@localhost>")
set(CPACK_PACKAGE_DESCRIPTION_SUMMARY "fine structure of group-IV vacancy centres in diamond")
string(CONCAT CPACK_PACKAGE_DESCRIPTION
       "Levels, optical lines, spectra, peak fitting, strain estimates and magnet planning for SiV-, GeV-,\n"
       "SnV- and PbV- centres in diamond: the desktop application finestra, the command line finestra-cli\n"
       "and the Python module finestra, with invented example projects in /usr/share/finestra/examples.")
set(CPACK_PACKAGING_INSTALL_PREFIX /usr)
set(CPACK_DEBIAN_FILE_NAME DEB-DEFAULT)
set(CPACK_DEBIAN_PACKAGE_SECTION science)
set(CPACK_DEBIAN_PACKAGE_PRIORITY optional)
# Library dependencies are read from the binaries (dpkg-shlibdeps, package dpkg-dev); the rest are
# run-time needs the linker cannot see: Qt's platform plugins for the window, and for the Python
# module the interpreter it was built for and NumPy (Debian 12 names).
set(CPACK_DEBIAN_PACKAGE_SHLIBDEPS ON)
set(FINESTRA_DEB_DEPENDS)
if(FINESTRA_BUILD_GUI)
  list(APPEND FINESTRA_DEB_DEPENDS "qt6-qpa-plugins")
endif()
if(FINESTRA_BUILD_PYTHON)
  get_property(FINESTRA_PYTHON_DEPENDS GLOBAL PROPERTY FINESTRA_DEB_PYTHON_DEPENDS)  # app/python
  list(APPEND FINESTRA_DEB_DEPENDS ${FINESTRA_PYTHON_DEPENDS})
  set(CPACK_DEBIAN_PACKAGE_SUGGESTS "python3-matplotlib")
endif()
list(JOIN FINESTRA_DEB_DEPENDS ", " CPACK_DEBIAN_PACKAGE_DEPENDS)
include(CPack)
