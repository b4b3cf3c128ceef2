# Finds the Debian packages turnfield builds on; scripts/setup installs them.
find_package(Eigen3 3.4 REQUIRED NO_MODULE)
find_package(tomlplusplus REQUIRED)
find_package(CLI11 REQUIRED)
find_package(fmt REQUIRED)
find_package(nlohmann_json 3.10 REQUIRED)
find_package(VTK 9.1 REQUIRED COMPONENTS CommonCore CommonDataModel CommonMisc IOXML)

# Gmsh 4.8 ships neither a CMake config nor a pkg-config file.
find_path(GMSH_INCLUDE_DIR gmsh.h REQUIRED)
find_library(GMSH_LIBRARY gmsh REQUIRED)
add_library(tf_gmsh INTERFACE)
target_include_directories(tf_gmsh SYSTEM INTERFACE ${GMSH_INCLUDE_DIR})
target_link_libraries(tf_gmsh INTERFACE ${GMSH_LIBRARY})

# SuiteSparse 5.12 neither; Eigen's CholmodSupport includes <cholmod.h>, so the folder goes on the path.
find_path(SUITESPARSE_INCLUDE_DIR cholmod.h PATH_SUFFIXES suitesparse REQUIRED)
find_library(CHOLMOD_LIBRARY cholmod REQUIRED)
find_library(UMFPACK_LIBRARY umfpack REQUIRED)
find_library(SUITESPARSE_CONFIG_LIBRARY suitesparseconfig REQUIRED)
add_library(tf_suitesparse INTERFACE)
target_include_directories(tf_suitesparse SYSTEM INTERFACE ${SUITESPARSE_INCLUDE_DIR})
target_link_libraries(tf_suitesparse INTERFACE ${CHOLMOD_LIBRARY} ${UMFPACK_LIBRARY} ${SUITESPARSE_CONFIG_LIBRARY})
