//! Notifications as Bevy messages: what happened in the sky during the frame, in time order.
//!
//! The core's event finder ([`insola::sky_events`]) finds every event of the sky at the
//! reference place between the previous frame's instant and this frame's — rise, set and
//! transit of the star and each moon, each twilight boundary, new day, new year, equinoxes and
//! solstices, moon phases, eclipses of the star and of the moons — and this module only sends
//! each one as a [`SkyNotice`]. A frame that spans ten days sends ten sunrises, in order, each
//! exactly once (the finder's intervals are half-open, so consecutive frames neither miss nor
//! repeat an event). [`WorldChanged`] and [`WorldRejected`] report the world itself.
//!
//! The kinds are the core's [`SkyEventKind`]; choose which are sent with
//! [`InsolaSettings::notices`].

use bevy::prelude::*;
pub use insola::light::TwilightBand;
pub use insola::sky_events::{
    EclipseStage, EventFilter, EventGroup, MoonPhase, SkyBody, SkyEvent, SkyEventKind,
};
use serde::{Deserialize, Serialize};

use crate::clock::WorldClock;
use crate::season::SeasonOfYear;
use crate::settings::InsolaSettings;
use crate::world_asset::ActiveWorld;

/// One event in the sky at the reference place, with its world time.
///
/// Sent in [`InsolaSystems::ComputeSky`](crate::InsolaSystems) in time order; read it with a
/// `MessageReader<SkyNotice>` in `Update`.
///
/// ```
/// use bevy::prelude::*;
/// use bevy_insola::{SkyBody, SkyEventKind, SkyNotice};
/// fn ring_the_bell(mut notices: MessageReader<SkyNotice>) {
///     for notice in notices.read() {
///         if notice.kind == SkyEventKind::Rise(SkyBody::Star(0)) {
///             info!("the star rose at world second {}", notice.world_time_s);
///         }
///     }
/// }
/// # App::new().add_message::<SkyNotice>().add_systems(Update, ring_the_bell).update();
/// ```
#[derive(Message, Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct SkyNotice {
    /// World time of the event, seconds since time zero (to the core's
    /// [`EVENT_TIME_TOLERANCE_S`](insola::sky_events::EVENT_TIME_TOLERANCE_S), 1 ms; new days,
    /// new years and season marks exactly).
    pub world_time_s: f64,
    /// What happened.
    pub kind: SkyEventKind,
}

impl SkyNotice {
    /// The season an equinox or solstice notice begins in the hemisphere of `latitude_rad`
    /// (`None` for other kinds).
    pub fn season_begins(&self, latitude_rad: f64) -> Option<SeasonOfYear> {
        match self.kind {
            SkyEventKind::Season(mark) => Some(SeasonOfYear::beginning_at(mark, latitude_rad)),
            _ => None,
        }
    }
}

impl From<SkyEvent> for SkyNotice {
    fn from(event: SkyEvent) -> SkyNotice {
        SkyNotice {
            world_time_s: event.at_s,
            kind: event.kind,
        }
    }
}

impl std::fmt::Display for SkyNotice {
    /// `t = 123.456 s: star rises`.
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        write!(f, "t = {:.3} s: {}", self.world_time_s, self.kind)
    }
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

/// Reused buffer, the world generation seen last frame, and which warnings were given.
#[derive(Default)]
pub(crate) struct NoticeScratch {
    generation: u64,
    events: Vec<SkyEvent>,
    warned_span: bool,
    warned_error: bool,
}

/// Sends this frame's [`SkyNotice`]s for the span `[previous, now)` of the [`WorldClock`].
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
    // Notices are sent only while time runs forward.
    if !matches!(t1.partial_cmp(&t0), Some(core::cmp::Ordering::Greater)) {
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
        events,
        warned_error,
        ..
    } = &mut *scratch;
    events.clear();
    if let Err(e) = planet.sky_events_into(place, t0, t1, &settings.notices, events) {
        if !*warned_error {
            warn!("Insola: no sky notices for this frame: {e}");
            *warned_error = true;
        }
        return;
    }
    writer.write_batch(events.drain(..).map(SkyNotice::from));
}
