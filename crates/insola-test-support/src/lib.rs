//! Fixtures shared by the tests of the core, the command-line almanac and the plugin, so that
//! each package reads them the same way without including another package's files.

pub mod bad_worlds;
