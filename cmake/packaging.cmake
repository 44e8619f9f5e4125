# SPDX-License-Identifier: MIT
# The Debian package: `cpack -G DEB` in the build folder gives rackreach_VERSION_ARCH.deb, installed under /usr.
# Its Depends line comes from dpkg-shlibdeps (dpkg-dev) reading the programs' shared libraries: libc, libstdc++
# and, with the desktop app, Qt 6 Widgets.
set(CPACK_GENERATOR DEB)
set(CPACK_PACKAGE_NAME rackreach)
set(CPACK_PACKAGE_VENDOR "Rackreach developers")
set(CPACK_PACKAGE_CONTACT "Rackreach developers <developers@rackreach.example>")
set(CPACK_PACKAGE_VERSION ${PROJECT_VERSION})
set(CPACK_PACKAGE_DESCRIPTION_SUMMARY "${PROJECT_DESCRIPTION}")
set(CPACK_PACKAGING_INSTALL_PREFIX /usr)
set(CPACK_STRIP_FILES ON)
set(CPACK_DEBIAN_FILE_NAME DEB-DEFAULT)
set(CPACK_DEBIAN_PACKAGE_MAINTAINER "${CPACK_PACKAGE_CONTACT}")
set(CPACK_DEBIAN_PACKAGE_SECTION science)
set(CPACK_DEBIAN_PACKAGE_PRIORITY optional)
set(CPACK_DEBIAN_PACKAGE_SHLIBDEPS ON)
set(CPACK_DEBIAN_PACKAGE_SUGGESTS bash-completion)
if(RACKREACH_GUI)
  # The desktop app needs a Qt platform plugin (xcb, wayland) to open a window; the CLI does not.
  set(CPACK_DEBIAN_PACKAGE_RECOMMENDS qt6-qpa-plugins)
endif()
# The Description's first line is CPACK_PACKAGE_DESCRIPTION_SUMMARY; this is the long text below it.
set(CPACK_DEBIAN_PACKAGE_DESCRIPTION
    "Rackreach screens the picks of a picking or kitting store for lifting and reach
risk: from the rack layout, the parts and the demand it derives the lift every
slot causes and evaluates it with the Revised NIOSH Lifting Equation (RWL, LI,
CLI, VLI) and with reach checks for a workforce drawn from anthropometric survey
data. It ranks the slots, says what each needs and writes tables, HTML, JSON and
CSV. It screens; it does not certify.
.
The package holds the command-line tool rackreach, the desktop app rackreach-gui
when built with it, the population tables, sample projects, the project file's
JSON Schema, a manual page and bash completion.")
include(CPack)
