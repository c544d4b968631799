//! Light of the sky (being written).
mod airmass;
mod atmosphere;
pub mod cie1931;
mod colour;
mod spectrum;

pub use airmass::*;
pub use atmosphere::*;
pub use colour::*;
pub use spectrum::*;
