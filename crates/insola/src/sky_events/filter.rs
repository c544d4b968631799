//! Which events to look for: [`EventGroup`]s of kinds and the moons to follow.

use serde::{Deserialize, Serialize};

use super::kind::{SkyBody, SkyEventKind};

/// A family of event kinds, the unit an [`EventFilter`] selects.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum EventGroup {
    /// [`SkyEventKind::Rise`] and [`SkyEventKind::Set`] of the star and the moons.
    RiseSet,
    /// [`SkyEventKind::Transit`] of the star and the moons.
    Transit,
    /// [`SkyEventKind::Dawn`] and [`SkyEventKind::Dusk`] of the three twilights.
    Twilight,
    /// [`SkyEventKind::NewDay`].
    NewDay,
    /// [`SkyEventKind::NewYear`].
    NewYear,
    /// [`SkyEventKind::Season`]: equinoxes and solstices.
    Season,
    /// [`SkyEventKind::MoonPhase`].
    MoonPhase,
    /// [`SkyEventKind::StarEclipse`].
    StarEclipse,
    /// [`SkyEventKind::MoonEclipse`].
    MoonEclipse,
    /// [`SkyEventKind::RingShadow`].
    RingShadow,
    /// [`SkyEventKind::RingPlaneCrossing`].
    RingPlane,
}

impl EventGroup {
    /// Every group.
    pub const ALL: [EventGroup; 11] = [
        EventGroup::RiseSet,
        EventGroup::Transit,
        EventGroup::Twilight,
        EventGroup::NewDay,
        EventGroup::NewYear,
        EventGroup::Season,
        EventGroup::MoonPhase,
        EventGroup::StarEclipse,
        EventGroup::MoonEclipse,
        EventGroup::RingShadow,
        EventGroup::RingPlane,
    ];

    /// The group's short name, as [`EventGroup::from_name`] reads it: `rise-set`, `transit`,
    /// `twilight`, `day`, `year`, `season`, `moon-phase`, `star-eclipse`, `moon-eclipse`,
    /// `ring-shadow`, `ring-plane`.
    pub fn name(self) -> &'static str {
        match self {
            EventGroup::RiseSet => "rise-set",
            EventGroup::Transit => "transit",
            EventGroup::Twilight => "twilight",
            EventGroup::NewDay => "day",
            EventGroup::NewYear => "year",
            EventGroup::Season => "season",
            EventGroup::MoonPhase => "moon-phase",
            EventGroup::StarEclipse => "star-eclipse",
            EventGroup::MoonEclipse => "moon-eclipse",
            EventGroup::RingShadow => "ring-shadow",
            EventGroup::RingPlane => "ring-plane",
        }
    }

    /// The group of a short name (see [`EventGroup::name`]); `None` for an unknown name.
    pub fn from_name(name: &str) -> Option<EventGroup> {
        EventGroup::ALL.into_iter().find(|g| g.name() == name)
    }

    fn bit(self) -> u16 {
        1 << (self as u16)
    }
}

impl std::fmt::Display for EventGroup {
    /// The short name.
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(self.name())
    }
}

impl SkyEventKind {
    /// The group this kind belongs to.
    pub fn group(&self) -> EventGroup {
        match self {
            SkyEventKind::Rise(_) | SkyEventKind::Set(_) => EventGroup::RiseSet,
            SkyEventKind::Transit(_) => EventGroup::Transit,
            SkyEventKind::Dawn(_) | SkyEventKind::Dusk(_) => EventGroup::Twilight,
            SkyEventKind::NewDay { .. } => EventGroup::NewDay,
            SkyEventKind::NewYear { .. } => EventGroup::NewYear,
            SkyEventKind::Season(_) => EventGroup::Season,
            SkyEventKind::MoonPhase { .. } => EventGroup::MoonPhase,
            SkyEventKind::StarEclipse { .. } => EventGroup::StarEclipse,
            SkyEventKind::MoonEclipse { .. } => EventGroup::MoonEclipse,
            SkyEventKind::RingShadow { .. } => EventGroup::RingShadow,
            SkyEventKind::RingPlaneCrossing { .. } => EventGroup::RingPlane,
        }
    }
}

/// Which events a search reports: a set of [`EventGroup`]s and the moons to follow (all by
/// default). Events that need no search (days, years, seasons) cost nothing when left out;
/// leaving out the others skips their search.
///
/// ```
/// use insola::sky_events::{EventFilter, EventGroup};
/// let eclipses = EventFilter::only([EventGroup::StarEclipse, EventGroup::MoonEclipse]);
/// assert!(eclipses.has(EventGroup::StarEclipse) && !eclipses.has(EventGroup::RiseSet));
/// ```
#[derive(Debug, Clone, PartialEq, Eq, Serialize, Deserialize)]
pub struct EventFilter {
    groups: u16,
    moons: Option<Vec<usize>>,
}

impl Default for EventFilter {
    /// Every group, every moon.
    fn default() -> Self {
        EventFilter::all()
    }
}

impl EventFilter {
    /// Every group, every moon.
    pub fn all() -> EventFilter {
        EventFilter::only(EventGroup::ALL)
    }

    /// Only these groups, every moon.
    pub fn only(groups: impl IntoIterator<Item = EventGroup>) -> EventFilter {
        EventFilter {
            groups: groups.into_iter().fold(0, |acc, g| acc | g.bit()),
            moons: None,
        }
    }

    /// The same filter, following only the moons with these indices (world-file order; an
    /// index the world does not have is ignored).
    pub fn with_moons(mut self, moons: impl IntoIterator<Item = usize>) -> EventFilter {
        self.moons = Some(moons.into_iter().collect());
        self
    }

    /// `true` if the filter reports `group`.
    pub fn has(&self, group: EventGroup) -> bool {
        self.groups & group.bit() != 0
    }

    /// `true` if the filter follows `body` (every star; the selected moons).
    pub fn follows(&self, body: SkyBody) -> bool {
        match body {
            SkyBody::Star(_) => true,
            SkyBody::Moon(i) => self.moons.as_ref().is_none_or(|m| m.contains(&i)),
        }
    }
}
