//! World files: the description of a planet, its star and its sky (the whole `*.world.ron`
//! schema, one file per section), loading, and validation.
//!
//! | section | type | file |
//! |---|---|---|
//! | the world, star, orbit, spin, epoch | [`WorldSpec`], [`StarSpec`], [`OrbitSpec`], [`SpinSpec`], [`EpochSpec`] | `spec.rs` |
//! | `atmosphere` | [`AtmosphereSpec`] | `atmosphere.rs` |
//! | `body` | [`BodySpec`] | `body.rs` |
//! | `moons` | [`MoonSpec`] | `moon.rs` |
//! | `calendar` | [`CalendarSpec`] | `calendar.rs` |
//! | `calendar.moon_months` | [`MoonMonthsSpec`] | `moon_months.rs` |
//! | `companion` | [`CompanionSpec`], [`StellarOrbitSpec`] | `companion.rs` |
//! | `climate` | [`crate::climate::ClimateSpec`] | `climate/spec.rs` |

mod atmosphere;
mod body;
mod calendar;
mod companion;
mod load;
mod moon;
mod moon_months;
mod spec;
mod utc;
mod validate;

pub use atmosphere::*;
pub use body::*;
pub use calendar::*;
pub use companion::*;
pub use load::*;
pub use moon::*;
pub use moon_months::*;
pub use spec::*;
pub use utc::*;
pub use validate::*;
