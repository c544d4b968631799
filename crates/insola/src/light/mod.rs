//! Light of the sky (being written).
mod airmass;
mod atmosphere;
pub mod cie1931;
mod colour;
mod daylight;
mod extinction;
mod spectrum;
mod twilight;

pub use airmass::*;
pub use atmosphere::*;
pub use colour::*;
pub use daylight::*;
pub use extinction::*;
pub use spectrum::*;
pub use twilight::*;
mod sky_light;
mod star_light;
pub use sky_light::*;
pub use star_light::*;
