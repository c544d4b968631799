//! Every event of the sky over any interval, in time order: rise, set and transit of the star
//! and each moon, the twilight boundaries, new days and years, equinoxes and solstices, moon
//! phases, eclipses of the star and of the moons, and on ringed worlds the ring's shadow and the
//! star's crossings of the ring plane ([`SkyEventKind::RingShadow`],
//! [`SkyEventKind::RingPlaneCrossing`]; see `ring.rs`).
//!
//! Ask [`Planet::sky_events_between`] (or [`Planet::sky_events_into`] to reuse a buffer) for
//! a place, an interval and an [`EventFilter`]; each [`SkyEvent`] carries its world instant
//! and a [`SkyEventKind`].
//!
//! # Conventions
//!
//! - **Time** is world time in seconds since the world's time zero, as everywhere in the crate.
//! - **Interval**: half-open, `[from_s, to_s)`. An event that is a change of state (rise, set,
//!   a twilight boundary, the start or end of an eclipse…) is reported at the last instant
//!   found in the old state, within [`EVENT_TIME_TOLERANCE_S`] (1 ms) before the change; the
//!   state is sampled at both ends, so a change in `(from_s, to_s]` is reported once, at an
//!   instant in `[from_s, to_s)`. Splitting an interval in two therefore gives the same events
//!   (a frame-by-frame clock gets each one exactly once). Exact events (new day, new year,
//!   season marks) are reported when their instant lies in `[from_s, to_s)`.
//! - **Tolerance**: every instant found by search is within [`EVENT_TIME_TOLERANCE_S`] of the
//!   model's instant; season marks, new days and new years are exact (no search).
//! - **Order**: by instant; events at the same instant in a fixed order — new year, new day,
//!   season mark, then twilight, rise/set, transit, moon phase, eclipse of the star, eclipse of
//!   a moon, ring shadow, ring-plane crossing; within one kind in the order the search found
//!   them (star before moons, moons in world-file order).
//! - **One rule per decision**: rise and set are where the body's light turns on and off
//!   (`BodyLight::is_up`: centre strictly above [`Planet::standard_rise_altitude_rad`] or
//!   [`Planet::moon_rise_altitude_rad`]); twilight boundaries are where
//!   [`crate::light::TwilightPhase::from_altitude`] changes; eclipses of the star are where an
//!   occluder's cover in [`crate::occlusion`] turns positive, so a second star added there is
//!   found here unchanged; eclipses of a moon are where its
//!   [`crate::moons::MoonView::shadow_fraction`] turns positive; the ring's shadow (no disc to
//!   walk to) is where [`crate::rings::RingShadow::is_shadowed`] changes, sampled (`ring.rs`).
//!
//! # How the search works, and its limits
//!
//! Rise, set, transit, twilight and moon phases are sampled on an even grid — at most every
//! 1/96 of the shortest period that moves them (day, year, the moon's period, the moon's own
//! day over a place; for phases an eighth of a quarter turn at the moon's fastest) — and each
//! change between two samples is refined by bisection. A pair of changes closer together than
//! one sample (a star grazing a threshold) can be missed.
//!
//! Eclipses are short, so a grid fine enough for them would be slow; instead the search walks
//! along the occluder's clearance (the angular gap between the discs) in steps of
//! `clearance / largest rate`, which cannot step over a contact, down to a floor of a
//! thousandth of the shortest central eclipse: only an eclipse shorter than that floor can be
//! missed. Far from conjunction the steps are long, so ten years of a fast moon's eclipses
//! take a few hundred thousand evaluations.
//!
//! Greatest eclipse is where the clearance stops falling and starts to rise (the centres are
//! closest); it is reported with the hidden fraction at that instant.

mod calendar_marks;
mod eclipse;
mod filter;
mod finder;
mod kind;
mod moon;
mod ring;
mod star;

pub use crate::search::EVENT_TIME_TOLERANCE_S;
pub use filter::{EventFilter, EventGroup};
pub use finder::MAX_EVENT_SAMPLES;
pub use kind::{EclipseStage, MoonPhase, RingShadowStage, SkyBody, SkyEvent, SkyEventKind};

#[allow(unused_imports)] // for the doc links above
use crate::planet::Planet;

#[cfg(test)]
mod tests;
