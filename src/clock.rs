//! The world clock: exact world time, its rate, pause, steps and jumps, and the calendar.
//!
//! World time is kept as whole seconds (`i64`) plus a fraction of a second (`f64` in `[0, 1)`),
//! so it never drifts however long a game runs or however fast the clock turns: each frame adds
//! `rate × real delta`, split into its whole and fractional parts, and only the fraction is
//! rounded (to about 10⁻¹⁶ s). An `f32` or a summed `f64` of seconds would lose milliseconds
//! within a few game years at a high rate.
//!
//! The clock reads the *real* frame time ([`Time<Real>`]), not [`Time<Virtual>`], whose steps are
//! capped at 250 ms; it does follow the virtual clock's pause if
//! [`WorldClock::follows_virtual_pause`] is set (the default), so pausing the game pauses the sky.

use core::time::Duration;

use bevy::prelude::*;
use insola::Planet;
use insola::calendar::CalendarDate;
use serde::{Deserialize, Serialize};

/// An instant of world time: seconds since the world's time zero, kept exactly.
///
/// `WorldInstant` is whole seconds plus a fraction in `[0, 1)`, so adding a billion small steps
/// gives the same instant as adding their exact sum (to well below a microsecond).
///
/// ```
/// use bevy_insola::WorldInstant;
/// let mut t = WorldInstant::from_secs_f64(10.25);
/// t.add_secs(0.875);
/// assert_eq!(t.whole_seconds(), 11);
/// assert_eq!(t.fraction(), 0.125);
/// assert_eq!(t.as_secs_f64(), 11.125);
/// ```
#[derive(Debug, Clone, Copy, PartialEq, PartialOrd, Default, Reflect, Serialize, Deserialize)]
#[reflect(Debug, PartialEq, Default, Clone)]
pub struct WorldInstant {
    /// Whole seconds since time zero (floor of the instant; negative before time zero).
    seconds: i64,
    /// Fraction of a second after `seconds`, in `[0, 1)`.
    fraction: f64,
}

impl WorldInstant {
    /// Time zero of the world.
    pub const ZERO: WorldInstant = WorldInstant {
        seconds: 0,
        fraction: 0.0,
    };

    /// The instant `t_s` seconds after time zero. Non-finite input gives time zero; values beyond
    /// ±9.2×10¹⁸ s saturate.
    pub fn from_secs_f64(t_s: f64) -> WorldInstant {
        let mut t = WorldInstant::ZERO;
        t.add_secs(t_s);
        t
    }

    /// The instant from whole seconds and a fraction of a second (the fraction is wrapped into
    /// `[0, 1)`, carrying whole seconds).
    pub fn from_parts(seconds: i64, fraction: f64) -> WorldInstant {
        let mut t = WorldInstant {
            seconds,
            fraction: 0.0,
        };
        t.add_secs(fraction);
        t
    }

    /// Whole seconds since time zero (the floor of the instant).
    pub fn whole_seconds(&self) -> i64 {
        self.seconds
    }

    /// Fraction of a second after [`WorldInstant::whole_seconds`], in `[0, 1)`.
    pub fn fraction(&self) -> f64 {
        self.fraction
    }

    /// Seconds since time zero as an `f64` (what the core's sky queries take). Its resolution
    /// is about 60 µs after 10¹¹ s (3 000 Earth-like years), ample for the sky.
    pub fn as_secs_f64(&self) -> f64 {
        self.seconds as f64 + self.fraction
    }

    /// Adds `delta_s` seconds (negative moves back). Exact in the whole seconds; the fraction is
    /// rounded once, to about 10⁻¹⁶ s. Non-finite deltas are ignored.
    pub fn add_secs(&mut self, delta_s: f64) {
        if !delta_s.is_finite() {
            return;
        }
        let whole = delta_s.floor();
        // Exact: `delta_s - floor(delta_s)` is representable for every finite f64.
        let mut fraction = self.fraction + (delta_s - whole);
        let mut carry = whole as i64; // saturating cast
        if fraction >= 1.0 {
            fraction -= 1.0;
            carry = carry.saturating_add(1);
        }
        self.seconds = self.seconds.saturating_add(carry);
        self.fraction = fraction.clamp(0.0, 1.0 - f64::EPSILON);
    }

    /// This instant moved by `delta_s` seconds.
    pub fn plus_secs(mut self, delta_s: f64) -> WorldInstant {
        self.add_secs(delta_s);
        self
    }

    /// `self − earlier` in seconds (exact whole-second difference plus the fractions).
    pub fn secs_since(&self, earlier: WorldInstant) -> f64 {
        self.seconds.saturating_sub(earlier.seconds) as f64 + (self.fraction - earlier.fraction)
    }
}

/// A typed error for clock settings that make no sense.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum ClockError {
    /// A rate, step or time that is NaN or infinite.
    #[error("`{what}` = {value} must be a finite number")]
    NotFinite {
        /// Which argument.
        what: &'static str,
        /// The value given.
        value: f64,
    },
    /// A calendar reading outside the world's calendar or an hour outside the day.
    #[error("`{what}` = {value} is out of range: allowed {allowed}")]
    OutOfRange {
        /// Which argument.
        what: &'static str,
        /// The value given.
        value: f64,
        /// The allowed range in words.
        allowed: String,
    },
    /// A calendar reading the world's calendar does not have (a day past the year's end…).
    #[error(transparent)]
    Calendar(insola::calendar::CalendarError),
}

/// The world clock: the current world instant, how fast it runs, and whether it is paused.
///
/// Updated once per frame in [`InsolaSystems::AdvanceClock`](crate::InsolaSystems); after that
/// set, [`WorldClock::now`] is this frame's instant and [`WorldClock::previous`] the last
/// frame's, and every notification between them has been or is about to be sent.
///
/// Save games: serialise it with serde (JSON and RON both round-trip exactly; with serde_json
/// enable its `float_roundtrip` feature for bit-exact fractions). A save holds the exact
/// instant (whole seconds and fraction), the previous instant, the rate, whether it is paused
/// (a clock saved paused restores paused), any pending [`WorldClock::step`], whether it follows
/// `Time<Virtual>`'s pause, the frame-time cap and the real-seconds-per-day setting. A pending
/// jump is not saved (the restored clock is already at its instant); the world itself is the
/// world file's, not the clock's.
///
/// ```
/// use bevy_insola::WorldClock;
/// use core::time::Duration;
/// let mut clock = WorldClock::default().with_rate(3600.0); // an hour per real second
/// clock.tick(Duration::from_millis(500));
/// assert_eq!(clock.now().as_secs_f64(), 1800.0);
/// clock.pause();
/// clock.tick(Duration::from_secs(5));
/// assert_eq!(clock.world_time_s(), 1800.0);
/// ```
#[derive(Resource, Debug, Clone, PartialEq, Reflect, Serialize, Deserialize)]
#[reflect(Resource, Debug, Default, Clone)]
#[serde(default)]
pub struct WorldClock {
    now: WorldInstant,
    previous: WorldInstant,
    rate: f64,
    paused: bool,
    /// Exact world seconds to add at the next tick, even when paused (from [`WorldClock::step`]).
    pending_step_s: f64,
    #[serde(skip)]
    jumped: bool,
    #[serde(skip)]
    pending_jump: bool,
    /// Stop the world clock while [`Time<Virtual>`] is paused. Default `true`.
    pub follows_virtual_pause: bool,
    /// Largest real frame time the clock accepts, seconds; longer frames (a hitch, a debugger
    /// stop) count as this much. Default `None`: no limit. (An `Option` rather than an infinite
    /// number, so that JSON save games, which have no infinity, round-trip.)
    pub max_real_delta_s: Option<f64>,
    /// When set, the rate follows the active world: one local solar day passes in this many
    /// real seconds, for whatever world is loaded now or later. Cleared by
    /// [`WorldClock::set_rate`]. Default `None` (the rate is as set).
    pub real_seconds_per_day: Option<f64>,
}

impl Default for WorldClock {
    fn default() -> Self {
        WorldClock {
            now: WorldInstant::ZERO,
            previous: WorldInstant::ZERO,
            rate: WorldClock::DEFAULT_RATE,
            paused: false,
            pending_step_s: 0.0,
            jumped: false,
            pending_jump: false,
            follows_virtual_pause: true,
            max_real_delta_s: None,
            real_seconds_per_day: None,
        }
    }
}

impl WorldClock {
    /// Default rate: 60 world seconds per real second (a 24-hour day in 24 minutes).
    pub const DEFAULT_RATE: f64 = 60.0;

    /// A clock at `start`, running at [`WorldClock::DEFAULT_RATE`].
    pub fn starting_at(start: WorldInstant) -> WorldClock {
        WorldClock {
            now: start,
            previous: start,
            ..default()
        }
    }

    /// This clock with `rate` world seconds per real second (non-finite values leave it).
    pub fn with_rate(mut self, rate: f64) -> WorldClock {
        let _ = self.set_rate(rate);
        self
    }

    /// This frame's world instant.
    pub fn now(&self) -> WorldInstant {
        self.now
    }

    /// This frame's world time, seconds since time zero.
    pub fn world_time_s(&self) -> f64 {
        self.now.as_secs_f64()
    }

    /// The previous frame's world instant (the start of this frame's span).
    pub fn previous(&self) -> WorldInstant {
        self.previous
    }

    /// World seconds covered by this frame (`now − previous`; negative when running backwards).
    pub fn frame_span_s(&self) -> f64 {
        self.now.secs_since(self.previous)
    }

    /// `true` if the clock was moved by [`WorldClock::jump_to`] (or a date jump) before this
    /// frame's tick; notifications are not sent for the skipped span.
    pub fn jumped_this_frame(&self) -> bool {
        self.jumped
    }

    /// World seconds per real second. May be negative (time runs back; notifications are only
    /// sent while it runs forward).
    pub fn rate(&self) -> f64 {
        self.rate
    }

    /// Sets the rate in world seconds per real second.
    pub fn set_rate(&mut self, rate: f64) -> Result<(), ClockError> {
        if !rate.is_finite() {
            return Err(ClockError::NotFinite {
                what: "rate",
                value: rate,
            });
        }
        self.rate = rate;
        self.real_seconds_per_day = None;
        Ok(())
    }

    /// Sets the rate so that one world day (`planet.day_s()`) passes in `real_s` real seconds.
    pub fn set_real_seconds_per_day(
        &mut self,
        planet: &Planet,
        real_s: f64,
    ) -> Result<(), ClockError> {
        if !(real_s.is_finite() && real_s > 0.0) {
            return Err(ClockError::OutOfRange {
                what: "real_s",
                value: real_s,
                allowed: "greater than 0".into(),
            });
        }
        self.set_rate(planet.day_s() / real_s)
    }

    /// Stops the clock (steps and jumps still work).
    pub fn pause(&mut self) {
        self.paused = true;
    }

    /// Restarts the clock.
    pub fn resume(&mut self) {
        self.paused = false;
    }

    /// Pauses a running clock or resumes a paused one.
    pub fn toggle_pause(&mut self) {
        self.paused = !self.paused;
    }

    /// `true` while paused.
    pub fn is_paused(&self) -> bool {
        self.paused
    }

    /// Advances the clock by exactly `world_s` seconds at the next tick, paused or not;
    /// notifications for the span are sent as for normal running.
    pub fn step(&mut self, world_s: f64) -> Result<(), ClockError> {
        if !world_s.is_finite() {
            return Err(ClockError::NotFinite {
                what: "world_s",
                value: world_s,
            });
        }
        self.pending_step_s += world_s;
        Ok(())
    }

    /// Moves the clock to `instant` without sending notifications for the skipped span.
    pub fn jump_to(&mut self, instant: WorldInstant) {
        self.now = instant;
        self.previous = instant;
        self.pending_jump = true;
    }

    /// Moves the clock to a calendar reading: `year`, `day_of_year` (0-based) and `hour_of_day`
    /// (hours since local mean midnight at the prime meridian, `[0, day length)`).
    pub fn jump_to_date(
        &mut self,
        planet: &Planet,
        year: i64,
        day_of_year: u64,
        hour_of_day: f64,
    ) -> Result<(), ClockError> {
        let day_h = planet.day_s() / 3600.0;
        if !(hour_of_day.is_finite()
            && hour_of_day >= 0.0
            && hour_of_day < day_h.max(f64::MIN_POSITIVE))
        {
            return Err(ClockError::OutOfRange {
                what: "hour_of_day",
                value: hour_of_day,
                allowed: format!("0 up to the day length ({day_h} h)"),
            });
        }
        let t = planet
            .time_of_date(year, day_of_year, hour_of_day)
            .map_err(ClockError::Calendar)?;
        self.jump_to(WorldInstant::from_secs_f64(t));
        Ok(())
    }

    /// Moves the clock to a month date: `year`, `month` (index into the calendar's months, from
    /// 0), `day_of_month` (from 1) and `hour_of_day` (as for [`WorldClock::jump_to_date`]).
    pub fn jump_to_month_date(
        &mut self,
        planet: &Planet,
        year: i64,
        month: usize,
        day_of_month: u64,
        hour_of_day: f64,
    ) -> Result<(), ClockError> {
        let t = planet
            .time_of_month_date(year, month, day_of_month, hour_of_day)
            .map_err(ClockError::Calendar)?;
        self.jump_to(WorldInstant::from_secs_f64(t));
        Ok(())
    }

    /// Moves the clock to a date written in the calendar's text form: `YEAR-DAY` (day of year
    /// from 1) or `YEAR/MONTH/DAY` (month by name or number), optionally followed by
    /// `THH:MM[:SS]` — the same syntax as the `insola` command's `--date`.
    pub fn jump_to_date_text(&mut self, planet: &Planet, text: &str) -> Result<(), ClockError> {
        let t = planet
            .time_of_date_text(text)
            .map_err(ClockError::Calendar)?;
        self.jump_to(WorldInstant::from_secs_f64(t));
        Ok(())
    }

    /// Moves the clock to `hour_of_day` of the current calendar day (see
    /// [`WorldClock::jump_to_date`]).
    pub fn jump_to_hour_of_day(
        &mut self,
        planet: &Planet,
        hour_of_day: f64,
    ) -> Result<(), ClockError> {
        let date = self.date(planet);
        self.jump_to_date(planet, date.year, date.day_of_year, hour_of_day)
    }

    /// The current instant read on the world's calendar.
    pub fn date(&self, planet: &Planet) -> CalendarDate {
        planet.date_at(self.world_time_s())
    }

    /// Advances by one frame of `real_delta` real time: `previous` becomes the old `now`, then
    /// `now` moves by `rate × real_delta` (unless paused) plus any pending step.
    ///
    /// The plugin calls this once per frame; call it yourself to drive a clock outside an app.
    pub fn tick(&mut self, real_delta: Duration) {
        self.tick_scaled(real_delta, self.paused);
    }

    fn tick_scaled(&mut self, real_delta: Duration, paused: bool) {
        self.previous = self.now;
        self.jumped = core::mem::take(&mut self.pending_jump);
        if !paused {
            let real_s = match self.max_real_delta_s {
                Some(cap) => real_delta.as_secs_f64().min(cap.max(0.0)),
                None => real_delta.as_secs_f64(),
            };
            self.now.add_secs(self.rate * real_s);
        }
        let step = core::mem::take(&mut self.pending_step_s);
        if step != 0.0 {
            self.now.add_secs(step);
        }
    }
}

/// Advances the [`WorldClock`] by the real frame time.
pub(crate) fn advance_world_clock(
    mut clock: ResMut<WorldClock>,
    real: Res<Time<Real>>,
    virt: Option<Res<Time<Virtual>>>,
    world: Option<Res<crate::ActiveWorld>>,
) {
    if let Some(real_s) = clock.real_seconds_per_day
        && let Some(planet) = world.as_deref().and_then(crate::ActiveWorld::planet)
        && real_s.is_finite()
        && real_s > 0.0
    {
        let rate = planet.day_s() / real_s;
        if clock.rate != rate {
            clock.rate = rate;
        }
    }
    let virtual_paused = clock.follows_virtual_pause && virt.is_some_and(|v| v.is_paused());
    let paused = clock.paused || virtual_paused;
    clock.tick_scaled(real.delta(), paused);
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn fraction_carries_and_borrows() {
        let mut t = WorldInstant::from_secs_f64(-0.25);
        assert_eq!((t.whole_seconds(), t.fraction()), (-1, 0.75));
        t.add_secs(0.5);
        assert_eq!((t.whole_seconds(), t.fraction()), (0, 0.25));
        t.add_secs(-1.5);
        assert_eq!((t.whole_seconds(), t.fraction()), (-2, 0.75));
        assert_eq!(t.secs_since(WorldInstant::ZERO), -1.25);
        t.add_secs(f64::NAN);
        assert_eq!(t.as_secs_f64(), -1.25);
    }

    #[test]
    fn ten_thousand_years_at_a_high_rate_do_not_drift() {
        // A 400-day year per real minute at 60 frames per second of 16 666 667 ns: the exact
        // sum is computed in integer nanoseconds × an integer rate.
        let rate: i128 = 576_000; // world s per real s (400 × 86 400 / 60)
        let dt_ns: i128 = 16_666_667;
        let year_s: i128 = 400 * 86_400;
        let frames = (10_000 * year_s * 1_000_000_000) / (rate * dt_ns);
        let mut clock = WorldClock::default().with_rate(rate as f64);
        let dt = Duration::from_nanos(dt_ns as u64);
        for _ in 0..frames {
            clock.tick(dt);
        }
        // Exact: rate × dt × frames nanoseconds.
        let exact_ns = rate * dt_ns * frames;
        let exact_whole = (exact_ns / 1_000_000_000) as i64;
        let exact_frac = (exact_ns % 1_000_000_000) as f64 * 1e-9;
        let now = clock.now();
        let err_s = (now.whole_seconds() - exact_whole) as f64 + (now.fraction() - exact_frac);
        assert!(
            exact_whole > 10_000 * 400 * 86_400 - 10_000,
            "at least 10 000 years less one frame"
        );
        assert!(err_s.abs() < 1e-3, "drift {err_s} s after {frames} frames");
    }

    #[test]
    fn pause_step_and_jump() {
        let mut clock = WorldClock::default().with_rate(10.0);
        clock.pause();
        clock.tick(Duration::from_secs(1));
        assert_eq!(clock.world_time_s(), 0.0);
        clock.step(2.5).unwrap();
        clock.tick(Duration::from_secs(1));
        assert_eq!(
            (clock.previous().as_secs_f64(), clock.world_time_s()),
            (0.0, 2.5)
        );
        clock.resume();
        clock.jump_to(WorldInstant::from_secs_f64(100.0));
        clock.tick(Duration::from_secs(1));
        assert!(clock.jumped_this_frame());
        assert_eq!(
            (clock.previous().as_secs_f64(), clock.world_time_s()),
            (100.0, 110.0)
        );
        clock.tick(Duration::ZERO);
        assert!(!clock.jumped_this_frame());
        assert!(clock.set_rate(f64::NAN).is_err());
        assert!(clock.step(f64::INFINITY).is_err());
    }

    #[test]
    fn save_and_restore_is_exact() {
        let mut clock = WorldClock::default().with_rate(1234.5678);
        for _ in 0..1000 {
            clock.tick(Duration::from_nanos(16_666_667));
        }
        let text = ron::to_string(&clock).unwrap();
        let back: WorldClock = ron::from_str(&text).unwrap();
        assert_eq!(back, clock);
        assert_eq!(
            back.now().as_secs_f64().to_bits(),
            clock.now().as_secs_f64().to_bits()
        );
    }
}
