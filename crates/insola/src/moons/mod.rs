//! Moons: orbits around the planet, where they stand in the local sky, their phase, light and
//! eclipses.
//!
//! Each moon follows a fixed Keplerian orbit around the planet's centre (no perturbations, no
//! precession of its node), with its inclination and node measured from the planet's orbital
//! plane (the ecliptic frame, see [`crate::frames`]). Positions are topocentric: the observer's
//! offset from the planet's centre is included, so a moon's parallax, and therefore where a
//! solar eclipse is seen, comes out right.
//!
//! One file per job: `crate::moon_orbit` (the ellipse, [`MoonOrbit`]), `view` (where a moon
//! stands for a place, [`MoonView`]), `rise` (rise and set), `shadow` (how far a moon is from
//! the planet's shadow, for the event finder); moonlight is `crate::lighting`'s. A moon's world-file section is
//! [`crate::world::MoonSpec`].

mod rise;
mod shadow;
mod view;

// The ellipse is a leaf module of its own, so that `Planet` can hold moon orbits without
// importing the sky work here (which is written as methods on `Planet`).
pub use crate::moon_orbit::*;
pub use view::*;

#[cfg(test)]
mod tests;
