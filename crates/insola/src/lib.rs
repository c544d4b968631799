#![doc = include_str!("../README.md")]

pub mod angle;
pub mod batch;
pub mod binary_orbit;
#[cfg(feature = "built-in-worlds")]
pub mod built_in_worlds;
pub mod calendar;
pub mod calendar_design;
pub mod climate;
pub mod constants;
mod dates;
pub mod error;
pub mod events;
pub mod frames;
pub mod insolation;
mod inverse_trig;
mod lanes;
mod leap_rules;
pub mod light;
pub mod lighting;
pub mod map_climate;
mod moon_orbit;
pub mod moons;
pub mod occlusion;
pub mod orbit;
mod parallel;
mod place;
mod planet;
pub mod rings;
mod search;
pub mod seasons;
mod sky;
pub mod sky_events;
pub mod spin;
pub mod star_frame;
pub mod star_pair;
pub mod star_track;
mod widest_vectors;
pub mod world;
mod world_climate;

pub use error::{QueryError, SpecError};
pub use planet::Planet;
pub use sky::{Place, PreparedPlace, StarInstant, StarPosition};
pub use star_frame::{PlaceF32, PlaceSky, PlaceSkyF32, StarFrame, StarFrameF32};
pub use world::WorldSpec;
pub use world_climate::{LocalClimate, WorldClimate};
