//! Notifications as Bevy messages: what happened in the sky during the frame, in time order.
//!
//! [`SkyNotice`] carries each event of the sky at the reference place — rise, set and transit
//! of the star, each twilight boundary, new day, new year, equinoxes and solstices — with its
//! exact world instant. Every event between the previous frame's instant and this frame's is
//! found (the core samples at most every 1/96 of a day and refines each crossing), so a frame
//! that spans ten days sends ten sunrises, in order, each exactly once. [`WorldChanged`] and
//! [`WorldRejected`] report the world itself.
//!
//! Moons: moonrise and moonset at the reference place, full and new moon, the planet's shadow
//! on each moon and each moon's cover of the star are found the same way
//! ([`collect_moon_notices`]).

use bevy::prelude::*;
use insola::events::{
    ASTRONOMICAL_TWILIGHT_RAD, CIVIL_TWILIGHT_RAD, Crossing, NAUTICAL_TWILIGHT_RAD,
};
use insola::{Place, Planet};
use serde::{Deserialize, Serialize};

use crate::clock::WorldClock;
use crate::season::{SeasonMark, SeasonOfYear};
use crate::settings::InsolaSettings;
use crate::world_asset::ActiveWorld;

/// The three twilights, by the depth of the star's centre below the horizon.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Reflect, Serialize, Deserialize)]
#[reflect(Debug, PartialEq, Clone)]
pub enum TwilightBand {
    /// Down to 6° below the horizon.
    Civil,
    /// Down to 12°.
    Nautical,
    /// Down to 18°.
    Astronomical,
}

impl std::fmt::Display for TwilightBand {
    /// `civil`, `nautical` or `astronomical`.
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(match self {
            TwilightBand::Civil => "civil",
            TwilightBand::Nautical => "nautical",
            TwilightBand::Astronomical => "astronomical",
        })
    }
}

impl std::fmt::Display for SkyNoticeKind {
    /// Plain words, moons by their index in the world file (`moon 0 rises`); put the moon's
    /// name in yourself from the world's spec.
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            SkyNoticeKind::StarRise => write!(f, "star rises"),
            SkyNoticeKind::StarSet => write!(f, "star sets"),
            SkyNoticeKind::StarTransit => write!(f, "star at its highest"),
            SkyNoticeKind::Dawn(band) => write!(f, "dawn: {band} twilight begins"),
            SkyNoticeKind::Dusk(band) => write!(f, "dusk: {band} twilight ends"),
            SkyNoticeKind::NewDay { day } => write!(f, "day {day} begins"),
            SkyNoticeKind::NewYear { year } => write!(f, "year {year} begins"),
            SkyNoticeKind::SeasonTurn { mark, begins } => write!(f, "{mark}: {begins} begins"),
            SkyNoticeKind::MoonRise { moon } => write!(f, "moon {moon} rises"),
            SkyNoticeKind::MoonSet { moon } => write!(f, "moon {moon} sets"),
            SkyNoticeKind::FullMoon { moon } => write!(f, "moon {moon} is full"),
            SkyNoticeKind::NewMoon { moon } => write!(f, "moon {moon} is new"),
            SkyNoticeKind::MoonEclipseBegins { moon } => {
                write!(f, "moon {moon} enters the planet's shadow")
            }
            SkyNoticeKind::MoonEclipseEnds { moon } => {
                write!(f, "moon {moon} leaves the planet's shadow")
            }
            SkyNoticeKind::StarEclipseBegins { moon } => {
                write!(f, "moon {moon} begins to cover the star")
            }
            SkyNoticeKind::StarEclipseEnds { moon } => {
                write!(f, "moon {moon} no longer covers the star")
            }
        }
    }
}

impl TwilightBand {
    /// The altitude of the band's lower limit, radians (−6°, −12°, −18°).
    pub fn lower_limit_rad(self) -> f64 {
        match self {
            TwilightBand::Civil => CIVIL_TWILIGHT_RAD,
            TwilightBand::Nautical => NAUTICAL_TWILIGHT_RAD,
            TwilightBand::Astronomical => ASTRONOMICAL_TWILIGHT_RAD,
        }
    }
}

/// What happened.
#[derive(Debug, Clone, Copy, PartialEq, Reflect, Serialize, Deserialize)]
#[reflect(Debug, PartialEq, Clone)]
pub enum SkyNoticeKind {
    /// The star's upper edge appears: its centre rises through the standard rise altitude
    /// (refraction and the disc's radius included).
    StarRise,
    /// The star's upper edge disappears (the same altitude, going down).
    StarSet,
    /// The star crosses the local meridian at its highest (local apparent noon).
    StarTransit,
    /// Morning: the star rises through the band's lower limit, so this twilight begins
    /// (and the deeper one ends).
    Dawn(TwilightBand),
    /// Evening: the star sinks through the band's lower limit, so this twilight ends.
    Dusk(TwilightBand),
    /// A new local day begins at the reference place (local mean midnight).
    NewDay {
        /// The local day number (day 0 contains time zero at the prime meridian).
        day: i64,
    },
    /// A new calendar year begins.
    NewYear {
        /// The year's number on the world's calendar.
        year: i64,
    },
    /// An equinox or solstice.
    SeasonTurn {
        /// Which turning point.
        mark: SeasonMark,
        /// The season it begins in the reference place's hemisphere.
        begins: SeasonOfYear,
    },
    /// A moon's upper edge appears (its centre rises through minus its angular radius and the
    /// horizon refraction).
    MoonRise {
        /// Index of the moon in the world file's `moons`.
        moon: usize,
    },
    /// A moon's upper edge disappears.
    MoonSet {
        /// Index of the moon.
        moon: usize,
    },
    /// Full moon: the moon stands opposite the star (in ecliptic longitude, seen from the
    /// planet's centre).
    FullMoon {
        /// Index of the moon.
        moon: usize,
    },
    /// New moon: the moon passes the star's ecliptic longitude.
    NewMoon {
        /// Index of the moon.
        moon: usize,
    },
    /// The planet's shadow starts to dim the moon (a lunar eclipse begins; seen everywhere the
    /// moon is up).
    MoonEclipseBegins {
        /// Index of the moon.
        moon: usize,
    },
    /// The moon leaves the planet's shadow.
    MoonEclipseEnds {
        /// Index of the moon.
        moon: usize,
    },
    /// The moon starts to cover the star's disc as seen from the reference place (an eclipse
    /// of the star begins there).
    StarEclipseBegins {
        /// Index of the moon.
        moon: usize,
    },
    /// The moon no longer covers the star's disc at the reference place.
    StarEclipseEnds {
        /// Index of the moon.
        moon: usize,
    },
}

/// One event in the sky at the reference place, with its exact world time.
///
/// Sent in [`InsolaSystems::ComputeSky`](crate::InsolaSystems) in time order; read it with a
/// `MessageReader<SkyNotice>` in `Update`.
///
/// ```
/// use bevy::prelude::*;
/// use bevy_insola::{SkyNotice, SkyNoticeKind};
/// fn ring_the_bell(mut notices: MessageReader<SkyNotice>) {
///     for notice in notices.read() {
///         if notice.kind == SkyNoticeKind::StarRise {
///             info!("the star rose at world second {}", notice.t_s);
///         }
///     }
/// }
/// # App::new().add_message::<SkyNotice>().add_systems(Update, ring_the_bell).update();
/// ```
#[derive(Message, Debug, Clone, Copy, PartialEq, Reflect, Serialize, Deserialize)]
#[reflect(Debug, PartialEq, Clone)]
pub struct SkyNotice {
    /// World time of the event, seconds since time zero (to about a millisecond).
    pub t_s: f64,
    /// What happened.
    pub kind: SkyNoticeKind,
}

/// How the world came to change.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Reflect, Serialize, Deserialize)]
#[reflect(Debug, PartialEq, Clone)]
pub enum WorldChangeCause {
    /// A world file loaded for the first time.
    Loaded,
    /// A world file changed on disk (or in `Assets<WorldFile>`) and was reloaded.
    Reloaded,
    /// Set directly ([`ActiveWorld::set_spec`] or the plugin's builder).
    Set,
}

/// A new world is active (first load, hot reload or direct set).
#[derive(Message, Debug, Clone, PartialEq)]
pub struct WorldChanged {
    /// The world's display name.
    pub name: String,
    /// The [`ActiveWorld::generation`] after the change.
    pub generation: u64,
    /// What caused it.
    pub cause: WorldChangeCause,
}

/// A world was rejected; the last good world (if any) keeps running.
#[derive(Message, Debug, Clone, PartialEq)]
pub struct WorldRejected {
    /// Asset path of the file, or `inline world`.
    pub source: String,
    /// The error, with line, column or field where known.
    pub reason: String,
    /// The dotted field path at fault, when one field is.
    pub field: Option<String>,
    /// `true` if a previous world is still active.
    pub kept_world: bool,
}

/// Reused buffers and the world generation seen last frame.
#[derive(Default)]
pub(crate) struct NoticeScratch {
    generation: u64,
    crossings: Vec<Crossing>,
    notices: Vec<SkyNotice>,
    warned_span: bool,
}

/// Finds every [`SkyNotice`] in `(t0_s, t1_s]` at `place` and appends them, in time order, to
/// `out`. Pure: the plugin's system calls it once per frame; tools can call it directly.
pub fn collect_sky_notices(
    planet: &Planet,
    place: Place,
    t0_s: f64,
    t1_s: f64,
    out: &mut Vec<SkyNotice>,
) {
    let mut scratch = Vec::new();
    collect_into(planet, place, t0_s, t1_s, &mut scratch, out);
}

fn collect_into(
    planet: &Planet,
    place: Place,
    t0: f64,
    t1: f64,
    crossings: &mut Vec<Crossing>,
    out: &mut Vec<SkyNotice>,
) {
    let start = out.len();
    if !runs_forward(t0, t1) {
        return;
    }
    let mut push = |t_s: f64, kind: SkyNoticeKind| out.push(SkyNotice { t_s, kind });
    // Rise and set, then the three twilight limits.
    let thresholds = [
        (planet.standard_rise_altitude_rad(), None),
        (CIVIL_TWILIGHT_RAD, Some(TwilightBand::Civil)),
        (NAUTICAL_TWILIGHT_RAD, Some(TwilightBand::Nautical)),
        (ASTRONOMICAL_TWILIGHT_RAD, Some(TwilightBand::Astronomical)),
    ];
    for (threshold, band) in thresholds {
        crossings.clear();
        planet.altitude_crossings_into(place, t0, t1, threshold, crossings);
        for c in crossings.iter() {
            let kind = match (band, c.rising) {
                (None, true) => SkyNoticeKind::StarRise,
                (None, false) => SkyNoticeKind::StarSet,
                (Some(b), true) => SkyNoticeKind::Dawn(b),
                (Some(b), false) => SkyNoticeKind::Dusk(b),
            };
            push(c.t_s, kind);
        }
    }
    transits_into(planet, place, t0, t1, &mut |t| {
        push(t, SkyNoticeKind::StarTransit)
    });
    // New local days at the reference longitude.
    let day0 = planet.local_day_count(t0, place.longitude_rad).floor();
    let day1 = planet.local_day_count(t1, place.longitude_rad).floor();
    if day1.is_finite() && day0.is_finite() {
        let mut day = day0 + 1.0;
        while day <= day1 {
            push(
                planet
                    .local_day_start_s(day, place.longitude_rad)
                    .clamp(t0, t1),
                SkyNoticeKind::NewDay { day: day as i64 },
            );
            day += 1.0;
        }
    }
    // New calendar years: years start at whole multiples of the orbital period.
    let year_s = planet.year_s();
    let first_year = planet.calendar().first_year;
    let (y0, y1) = ((t0 / year_s).floor(), (t1 / year_s).floor());
    let mut k = y0 + 1.0;
    while k <= y1 {
        push(
            k * year_s,
            SkyNoticeKind::NewYear {
                year: first_year.saturating_add(k as i64),
            },
        );
        k += 1.0;
    }
    // Equinoxes and solstices (exact: the core inverts Kepler's equation).
    for mark in SeasonMark::ALL {
        let mut t = planet
            .orbit()
            .time_of_star_longitude(mark.ecliptic_longitude_rad(), t0);
        while t <= t1 {
            if t > t0 {
                push(
                    t,
                    SkyNoticeKind::SeasonTurn {
                        mark,
                        begins: SeasonOfYear::beginning_at(mark, place.latitude_rad),
                    },
                );
            }
            let next = planet
                .orbit()
                .time_of_star_longitude(mark.ecliptic_longitude_rad(), t + 0.5 * year_s);
            if !runs_forward(t, next) {
                break;
            }
            t = next;
        }
    }
    collect_moon_notices(planet, place, t0, t1, out);
    out[start..].sort_by(|a, b| a.t_s.total_cmp(&b.t_s));
}

/// The moons' notices in `(t0_s, t1_s]`: rise and set at `place`, full and new moon, the
/// planet's shadow on each moon, and each moon's cover of the star at `place`.
///
/// Rise and set come from the core's crossing finder; the others are sampled at most every
/// 1/96 of the shortest of the day, the moon's period and the year, then refined by bisection
/// to a millisecond; an eclipse shorter than one sample can be missed.
pub fn collect_moon_notices(
    planet: &Planet,
    place: Place,
    t0_s: f64,
    t1_s: f64,
    out: &mut Vec<SkyNotice>,
) {
    use std::f64::consts::PI;
    if !runs_forward(t0_s, t1_s) {
        return;
    }
    let mut crossings = Vec::new();
    for (moon, orbit) in planet.moon_orbits().iter().enumerate() {
        // Rise and set: the core's crossing finder at the standard moonrise altitude.
        crossings.clear();
        let rise_altitude = planet.moon_rise_altitude_rad(moon);
        planet.moon_altitude_crossings_into(moon, place, t0_s, t1_s, rise_altitude, &mut crossings);
        out.extend(crossings.iter().map(|c| SkyNotice {
            t_s: c.t_s,
            kind: if c.rising {
                SkyNoticeKind::MoonRise { moon }
            } else {
                SkyNoticeKind::MoonSet { moon }
            },
        }));
        let span = planet.day_s().min(planet.year_s()).min(orbit.period_s);
        let n = ((t1_s - t0_s) / (span / 96.0)).ceil().clamp(1.0, 1.0e7) as usize;
        let step = (t1_s - t0_s) / n as f64;
        // Signed quantities whose zero crossings are the events.
        let view = |t: f64| planet.moon_view(&planet.star_instant(t), moon, place);
        let shadow =
            |t: f64| view(t).map_or(-1.0, |v| if v.shadow_fraction > 0.0 { 1.0 } else { -1.0 });
        let cover = |t: f64| {
            view(t).map_or(-1.0, |v| {
                if v.star_covered_fraction > 0.0 {
                    1.0
                } else {
                    -1.0
                }
            })
        };
        // Moon's ecliptic longitude minus the star's, wrapped to [−π, π): 0 at new moon.
        let from_star = |t: f64| {
            let p = orbit.position_at(t);
            insola::angle::wrap_pi(p.y.atan2(p.x) - planet.star_instant(t).ecliptic_longitude_rad)
        };
        let from_opposition = |t: f64| insola::angle::wrap_pi(from_star(t) - PI);
        let tests: [SignTest; 4] = [
            (
                &shadow,
                SkyNoticeKind::MoonEclipseBegins { moon },
                SkyNoticeKind::MoonEclipseEnds { moon },
                false,
            ),
            (
                &cover,
                SkyNoticeKind::StarEclipseBegins { moon },
                SkyNoticeKind::StarEclipseEnds { moon },
                false,
            ),
            (
                &from_star,
                SkyNoticeKind::NewMoon { moon },
                SkyNoticeKind::NewMoon { moon },
                true,
            ),
            (
                &from_opposition,
                SkyNoticeKind::FullMoon { moon },
                SkyNoticeKind::FullMoon { moon },
                true,
            ),
        ];
        for (f, up_kind, down_kind, angle) in tests {
            let mut a = f(t0_s);
            for i in 0..n {
                let (ta, tb) = (
                    t0_s + i as f64 * step,
                    if i + 1 == n {
                        t1_s
                    } else {
                        t0_s + (i + 1) as f64 * step
                    },
                );
                let b = f(tb);
                // For wrapped angles a jump of about 2π is the wrap, not a crossing.
                if (a >= 0.0) != (b >= 0.0) && !(angle && (b - a).abs() > PI) {
                    let t = bisect_sign(ta, tb, a >= 0.0, f);
                    out.push(SkyNotice {
                        t_s: t,
                        kind: if b >= 0.0 { up_kind } else { down_kind },
                    });
                }
                a = b;
            }
        }
    }
}

/// `true` if `t1` is later than `t0` (false for NaN).
fn runs_forward(t0: f64, t1: f64) -> bool {
    matches!(t1.partial_cmp(&t0), Some(core::cmp::Ordering::Greater))
}

/// A signed function whose zero crossings are events: the function, the notice sent when it
/// turns positive, the one sent when it turns negative, and whether it is a wrapped angle.
type SignTest<'a> = (&'a dyn Fn(f64) -> f64, SkyNoticeKind, SkyNoticeKind, bool);

fn bisect_sign(mut lo: f64, mut hi: f64, lo_positive: bool, f: &dyn Fn(f64) -> f64) -> f64 {
    for _ in 0..64 {
        if hi - lo <= 1e-3 {
            break;
        }
        let mid = 0.5 * (lo + hi);
        if (f(mid) >= 0.0) == lo_positive {
            lo = mid
        } else {
            hi = mid
        }
    }
    0.5 * (lo + hi)
}

/// Upper transits (hour angle passing zero, going up) in `(t0, t1]`, sampled at most every
/// 1/96 of a day and refined by bisection to a millisecond.
fn transits_into(planet: &Planet, place: Place, t0: f64, t1: f64, emit: &mut dyn FnMut(f64)) {
    let max_step = planet.day_s().min(planet.year_s()) / 96.0;
    let n = ((t1 - t0) / max_step).ceil().clamp(1.0, 1.0e7) as usize;
    let step = (t1 - t0) / n as f64;
    let ha = |t: f64| planet.star_position(t, place).hour_angle_rad;
    let mut a = ha(t0);
    for i in 0..n {
        let (ta, tb) = (
            t0 + i as f64 * step,
            if i + 1 == n {
                t1
            } else {
                t0 + (i + 1) as f64 * step
            },
        );
        let b = ha(tb);
        // A wrap from +π to −π is not a transit; a small step up through zero is.
        if a <= 0.0 && b > 0.0 && b - a < std::f64::consts::PI {
            let (mut lo, mut hi) = (ta, tb);
            while hi - lo > 1e-3 {
                let mid = 0.5 * (lo + hi);
                if ha(mid) <= 0.0 {
                    lo = mid
                } else {
                    hi = mid
                }
                if mid == lo && mid == hi {
                    break;
                }
            }
            emit(0.5 * (lo + hi));
        }
        a = b;
    }
}

/// Sends this frame's [`SkyNotice`]s for the span `(previous, now]` of the [`WorldClock`].
pub(crate) fn send_sky_notices(
    world: Res<ActiveWorld>,
    clock: Res<WorldClock>,
    settings: Res<InsolaSettings>,
    mut writer: MessageWriter<SkyNotice>,
    mut scratch: Local<NoticeScratch>,
) {
    let Some(planet) = world.planet() else {
        return;
    };
    if scratch.generation != world.generation() {
        // A new world: its sky is not continuous with the old one, so nothing is announced for
        // the frame in which it arrives.
        scratch.generation = world.generation();
        return;
    }
    let (t0, t1) = (clock.previous().as_secs_f64(), clock.world_time_s());
    if !runs_forward(t0, t1) {
        return;
    }
    if t1 - t0 > settings.max_notified_span_s {
        if !scratch.warned_span {
            warn!(
                "Insola: a frame spanned {:.3e} world seconds (more than `max_notified_span_s` = {:.3e}); no sky notices sent for it",
                t1 - t0,
                settings.max_notified_span_s
            );
            scratch.warned_span = true;
        }
        return;
    }
    let place = settings.reference_place_clamped();
    let NoticeScratch {
        crossings, notices, ..
    } = &mut *scratch;
    notices.clear();
    collect_into(planet, place, t0, t1, crossings, notices);
    writer.write_batch(notices.drain(..));
}
