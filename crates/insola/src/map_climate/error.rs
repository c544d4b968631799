//! Typed errors for surface maps and the map climate model.

use thiserror::Error;

use super::cycle::MapClimate;
use crate::error::SpecError;

/// Bad input for a surface map: a raster, a shape list or a resampling request.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum SurfaceMapError {
    /// A raster or grid with no cells.
    #[error("the {what} has no cells ({width} × {height})")]
    Empty {
        /// What was empty (e.g. `surface map`, `model grid`).
        what: &'static str,
        /// Columns given.
        width: usize,
        /// Rows given.
        height: usize,
    },
    /// A grid dimension outside the allowed range.
    #[error("the {what} is {width} × {height}; allowed {allowed}")]
    BadSize {
        /// What was sized (e.g. `model grid`).
        what: &'static str,
        /// Columns given.
        width: usize,
        /// Rows given.
        height: usize,
        /// The allowed sizes in words.
        allowed: &'static str,
    },
    /// A list of per-cell values whose length does not match the raster.
    #[error("`{what}` has {got} values for a {width} × {height} raster ({expected} needed)")]
    WrongLength {
        /// Which list (e.g. `kinds`, `elevation_m`).
        what: &'static str,
        /// Values given.
        got: usize,
        /// Values needed, `width × height`.
        expected: usize,
        /// Columns of the raster.
        width: usize,
        /// Rows of the raster.
        height: usize,
    },
    /// A cell value that is not finite or out of range.
    #[error("`{what}` at row {row}, column {column} is {value}: allowed {allowed}")]
    BadValue {
        /// Which quantity (e.g. `elevation_m`).
        what: &'static str,
        /// Row of the raster (0 = northernmost).
        row: usize,
        /// Column of the raster (0 = westernmost, at 180° W).
        column: usize,
        /// The value given.
        value: f64,
        /// The allowed range in words.
        allowed: &'static str,
    },
    /// A shape of a surface layout that cannot be drawn.
    #[error("shape {index} of the surface layout: {reason}")]
    BadShape {
        /// Index of the shape in the layout (0-based).
        index: usize,
        /// What is wrong with it.
        reason: String,
    },
    /// A surface layout file that cannot be parsed.
    #[error("surface layout: {0}")]
    Syntax(String),
}

/// An error from building or equilibrating the map climate.
#[derive(Debug, Clone, Error)]
pub enum MapClimateError {
    /// The climate parameters or the orbit forcing are invalid.
    #[error(transparent)]
    Spec(#[from] SpecError),
    /// The surface map is invalid.
    #[error(transparent)]
    Surface(#[from] SurfaceMapError),
    /// No periodic state within `max_years`; `last` is the final year run, usable as an
    /// estimate.
    #[error(
        "no periodic map climate after {years} years: the last year changed by {residual_k:.4} K (tolerance {tolerance_k} K); the world may be near an ice tipping point"
    )]
    NotConverged {
        /// Years run.
        years: u32,
        /// Largest change of any cell over the last year, K.
        residual_k: f64,
        /// The tolerance asked for, K.
        tolerance_k: f64,
        /// The last year run.
        last: Box<MapClimate>,
    },
}
