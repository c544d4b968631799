//! Climate on the map: a two-dimensional seasonal energy balance model over land and sea.
//!
//! The zonal model ([`crate::climate`]) gives one temperature per latitude band. This module
//! resolves longitude too, so a continent's interior bakes in summer and freezes in winter while
//! its coast stays mild, and a world locked to its star gets a hot day side, a frozen night side
//! and a ring between. The model is the zonal model's equation with an east–west diffusion term
//! and a heat capacity per cell (North, Mengel & Short 1983, J. Geophys. Res. 88, 6576: a
//! seasonal energy balance model resolving the continents, in which land and sea differ by
//! heat capacity); see [`MapEnergyBalanceModel`] for the equation, the grid and the solver.
//!
//! # Pieces
//!
//! * [`SurfaceMap`]: an equirectangular raster of [`SurfaceKind`] (sea, land, ice sheet) with
//!   optional elevation, from a row-major grid, a function, or shapes in degrees
//!   ([`SurfaceLayout`]: polygons and rectangles, the RON form of a land file). Decoding images
//!   is left to the caller (the `insola` CLI reads PNG files): the core keeps no image
//!   dependency, and an engine has its own image loader.
//! * [`SurfaceMap::resample`] to a [`MapGrid`] ([`Resampling::AreaFraction`], exact, or
//!   [`Resampling::Nearest`]), giving a [`CellSurface`].
//! * [`MapForcing`]: daily-mean sunlight on fast rotators, instantaneous on slow ones, fixed
//!   in each column's sky on locked worlds.
//! * [`equilibrate_map`]: the periodic year, as a [`MapClimate`] with queries at any latitude
//!   and longitude, land and sea summaries, [`ThermalZone`]s, growing seasons and
//!   [`HabitabilityFinding`]s. [`Planet::equilibrate_map_climate`](crate::Planet) does it all
//!   from a world.
//!
//! # Limits
//!
//! Everything the zonal model leaves out (clouds, water vapour, sea-ice thermodynamics,
//! currents, winds: transport is diffusion only, the same over land and sea), the same
//! ice-free albedo over land and sea, and a daily-mean forcing that ignores the day on fast
//! rotators (the queries add the zonal model's day-night layer). A uniform map gives the zonal
//! model's answer, so the zonal model stays the fast default. Insola's numbers are for games and
//! invented worlds, not for any real-world decision.

mod cycle;
mod equilibrium;
mod error;
mod forcing;
mod grid;
mod model;
mod observer_table;
mod resample;
mod shapes;
mod solver;
mod surface;
#[cfg(test)]
mod validation;
#[cfg(test)]
mod validation_two_stars;
mod world;
mod zones;

pub use cycle::*;
pub use equilibrium::*;
pub use error::*;
pub use forcing::*;
pub use grid::*;
pub use model::*;
pub use resample::*;
pub use shapes::*;
pub use surface::*;
pub use world::*;
pub use zones::*;
