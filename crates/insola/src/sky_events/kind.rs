//! What an event is: [`SkyEvent`], its [`SkyEventKind`] and the names they use.

use serde::{Deserialize, Serialize};

use crate::light::TwilightBand;
use crate::occlusion::Occluder;
use crate::seasons::SeasonMark;

/// A body that rises, sets and crosses the meridian.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum SkyBody {
    /// Star `index` (0: the world's star; a second star will be index 1).
    Star(usize),
    /// Moon `index`, in world-file order.
    Moon(usize),
}

impl std::fmt::Display for SkyBody {
    /// `star` for the single star, `star 1` for others, `moon 0`, `moon 1`…
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            SkyBody::Star(0) => f.write_str("star"),
            SkyBody::Star(i) => write!(f, "star {i}"),
            SkyBody::Moon(i) => write!(f, "moon {i}"),
        }
    }
}

/// The four principal phases of a moon, by the difference of its ecliptic longitude and the
/// star's seen from the planet's centre (Meeus, *Astronomical Algorithms*, ch. 49: 0°, 90°,
/// 180°, 270° for a moon that orbits forwards).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum MoonPhase {
    /// The moon passes the star's longitude (its dark side faces the planet).
    New,
    /// A quarter turn past new: half lit, waxing.
    FirstQuarter,
    /// Opposite the star.
    Full,
    /// A quarter turn before new: half lit, waning.
    LastQuarter,
}

impl std::fmt::Display for MoonPhase {
    /// `new`, `first quarter`, `full`, `last quarter`.
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(match self {
            MoonPhase::New => "new",
            MoonPhase::FirstQuarter => "first quarter",
            MoonPhase::Full => "full",
            MoonPhase::LastQuarter => "last quarter",
        })
    }
}

/// A stage of an eclipse.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub enum EclipseStage {
    /// The discs start to overlap (the last instant before, within the tolerance).
    Begins,
    /// The centres are closest.
    Greatest {
        /// Fraction of the light hidden at that instant, 0–1.
        fraction: f64,
    },
    /// The discs no longer overlap.
    Ends,
}

impl std::fmt::Display for EclipseStage {
    /// `begins`, `greatest (63 %)`, `ends`.
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            EclipseStage::Begins => f.write_str("begins"),
            EclipseStage::Greatest { fraction } => {
                write!(f, "greatest ({:.0} %)", 100.0 * fraction)
            }
            EclipseStage::Ends => f.write_str("ends"),
        }
    }
}

/// The ring's shadow arriving at or leaving a place.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum RingShadowStage {
    /// The ring starts to take more than half of the star's beam
    /// ([`crate::rings::RING_SHADOW_THRESHOLD`]).
    Enters,
    /// The ring no longer takes more than half of it.
    Leaves,
}

impl std::fmt::Display for RingShadowStage {
    /// `begins`, `ends`.
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(match self {
            RingShadowStage::Enters => "begins",
            RingShadowStage::Leaves => "ends",
        })
    }
}

/// What happened. Every kind is tied to one place except moon phases, season marks, new years
/// and moon eclipses, which are the same for the whole planet.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub enum SkyEventKind {
    /// The body's upper limb appears: its centre goes above its standard rise altitude
    /// ([`crate::Planet::standard_rise_altitude_rad`],
    /// [`crate::Planet::moon_rise_altitude_rad`]), where its light's `is_up` turns on. For the
    /// star this is also the end of civil twilight and the start of day.
    Rise(SkyBody),
    /// The body's upper limb disappears (the same altitude, going down).
    Set(SkyBody),
    /// The body crosses the local meridian on the upper side (its hour angle passes 0): local
    /// apparent noon for the star.
    Transit(SkyBody),
    /// Morning: the star rises through the band's lower limit, so this twilight begins (and
    /// the deeper phase ends).
    Dawn(TwilightBand),
    /// Evening: the star sinks through the band's lower limit, so this twilight ends.
    Dusk(TwilightBand),
    /// A local day begins at the place (local mean midnight).
    NewDay {
        /// The local day number (day 0 contains time zero at the prime meridian).
        day: i64,
    },
    /// A calendar year begins (years start at whole orbital periods from time zero).
    NewYear {
        /// The year's number on the world's calendar.
        year: i64,
    },
    /// An equinox or solstice.
    Season(SeasonMark),
    /// A moon reaches one of its four principal phases.
    MoonPhase {
        /// Index of the moon.
        moon: usize,
        /// Which phase.
        phase: MoonPhase,
    },
    /// An occluder hides part of a star from the place (a solar eclipse there).
    StarEclipse {
        /// Index of the star (0 today).
        star: usize,
        /// What hides it.
        by: Occluder,
        /// Which stage; `Greatest` carries the hidden fraction of the star's disc.
        stage: EclipseStage,
    },
    /// The planet's shadow dims a moon (a lunar eclipse: the same instant everywhere the moon
    /// is up).
    MoonEclipse {
        /// Index of the moon.
        moon: usize,
        /// Which stage; `Greatest` carries the fraction of the moon's starlight removed.
        stage: EclipseStage,
    },
    /// The ring's shadow enters or leaves the place (see [`crate::rings`]).
    RingShadow {
        /// Entering or leaving.
        stage: RingShadowStage,
        /// The annulus casting it: the one entered, or the one just left (world-file order).
        annulus: usize,
    },
    /// The star crosses the ring plane (the equatorial plane: at the equinoxes), so the ring's
    /// lit face changes; the same instant everywhere.
    RingPlaneCrossing {
        /// `true` going north (the north face becomes the lit one).
        northward: bool,
    },
}

impl std::fmt::Display for SkyEventKind {
    /// Plain words, moons by index (`moon 0 rises`); put names in from the world's spec.
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            SkyEventKind::Rise(b) => write!(f, "{b} rises"),
            SkyEventKind::Set(b) => write!(f, "{b} sets"),
            SkyEventKind::Transit(b) => write!(f, "{b} transits"),
            SkyEventKind::Dawn(band) => write!(f, "dawn: {band} twilight begins"),
            SkyEventKind::Dusk(band) => write!(f, "dusk: {band} twilight ends"),
            SkyEventKind::NewDay { day } => write!(f, "day {day} begins"),
            SkyEventKind::NewYear { year } => write!(f, "year {year} begins"),
            SkyEventKind::Season(mark) => write!(f, "{mark}"),
            SkyEventKind::MoonPhase { moon, phase } => write!(f, "moon {moon} {phase}"),
            SkyEventKind::StarEclipse { star, by, stage } => {
                write!(f, "eclipse of {} by {by} {stage}", SkyBody::Star(*star))
            }
            SkyEventKind::MoonEclipse { moon, stage } => {
                write!(f, "eclipse of moon {moon} {stage}")
            }
            SkyEventKind::RingShadow { stage, annulus } => {
                write!(f, "ring shadow (annulus {annulus}) {stage}")
            }
            SkyEventKind::RingPlaneCrossing { northward } => write!(
                f,
                "star crosses the ring plane going {}",
                if *northward { "north" } else { "south" }
            ),
        }
    }
}

/// One event of the sky with its world instant.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct SkyEvent {
    /// World time, seconds since time zero (see the module docs for the tolerance).
    pub at_s: f64,
    /// What happened.
    pub kind: SkyEventKind,
}

impl std::fmt::Display for SkyEvent {
    /// `t = 123.456 s: star rises`.
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        write!(f, "t = {:.3} s: {}", self.at_s, self.kind)
    }
}
