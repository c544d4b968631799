//! The entry point: [`Planet::sky_events_into`] checks the interval, runs the searches the
//! filter asks for and puts their events in order.

use super::filter::{EventFilter, EventGroup};
use super::kind::{SkyBody, SkyEvent, SkyEventKind};
use crate::error::QueryError;
use crate::planet::Planet;
use crate::search::Grid;
use crate::sky::Place;

/// Most samples one search may take: an interval that would need more is refused with
/// [`QueryError::IntervalTooLong`] (about a minute of work; split the interval instead).
pub const MAX_EVENT_SAMPLES: f64 = 1.0e8;

impl Planet {
    /// Appends to `out` every event selected by `filter` at `place` in `[from_s, to_s)` (world
    /// seconds), in time order (see the [module docs](crate::sky_events) for the conventions
    /// and the 1 ms tolerance). Appends nothing when `from_s == to_s`; reuses `out`'s capacity.
    ///
    /// Errors: [`QueryError::BadInterval`] if an end is not finite or `to_s < from_s`;
    /// [`QueryError::IntervalTooLong`] if a selected search would need more than
    /// [`MAX_EVENT_SAMPLES`] samples.
    pub fn sky_events_into(
        &self,
        place: Place,
        from_s: f64,
        to_s: f64,
        filter: &EventFilter,
        out: &mut Vec<SkyEvent>,
    ) -> Result<(), QueryError> {
        check_interval(from_s, to_s)?;
        if to_s == from_s {
            return Ok(());
        }
        if let Some(step) = self.finest_step_s(filter) {
            let max_s = step * MAX_EVENT_SAMPLES;
            if Grid::count(from_s, to_s, step) > MAX_EVENT_SAMPLES {
                return Err(QueryError::IntervalTooLong {
                    length_s: to_s - from_s,
                    max_s,
                });
            }
        }
        let start = out.len();
        if filter.has(EventGroup::NewYear) {
            self.new_years_into(from_s, to_s, out);
        }
        if filter.has(EventGroup::NewDay) {
            self.new_days_into(place, from_s, to_s, out);
        }
        if filter.has(EventGroup::Season) {
            self.season_marks_into(from_s, to_s, out);
        }
        self.star_events_into(place, from_s, to_s, filter, out);
        for moon in self.followed_moons(filter) {
            self.moon_sky_events_into(moon, place, from_s, to_s, filter, out);
            if filter.has(EventGroup::MoonPhase) {
                self.moon_phases_into(moon, from_s, to_s, out);
            }
        }
        if filter.has(EventGroup::StarEclipse) {
            self.star_eclipses_into(place, from_s, to_s, filter, out);
        }
        if filter.has(EventGroup::MoonEclipse) {
            for moon in self.followed_moons(filter) {
                self.moon_eclipses_into(moon, from_s, to_s, out);
            }
        }
        if filter.has(EventGroup::RingShadow) {
            self.ring_shadow_events_into(place, from_s, to_s, out);
        }
        if filter.has(EventGroup::RingPlane) {
            self.ring_plane_crossings_into(from_s, to_s, out);
        }
        out[start..].sort_by(|a, b| {
            a.at_s
                .total_cmp(&b.at_s)
                .then(same_instant_rank(&a.kind).cmp(&same_instant_rank(&b.kind)))
        });
        Ok(())
    }

    /// Every event selected by `filter` at `place` in `[from_s, to_s)`, in time order; see
    /// [`Planet::sky_events_into`].
    ///
    /// ```
    /// use insola::sky_events::{EventFilter, EventGroup, SkyEventKind};
    /// use insola::{Place, Planet, WorldSpec};
    /// let spec = WorldSpec::from_ron_str(r#"(
    ///     name: "Ennavel",
    ///     star: (temperature_k: 5600, radius_r_sun: 1.0, luminosity_l_sun: 1.0),
    ///     orbit: (semi_major_axis_au: 1.0, eccentricity: 0.02,
    ///             periapsis_longitude_deg: 100, period_days: 300),
    ///     spin: (obliquity_deg: 20, solar_day_hours: 22),
    /// )"#).unwrap();
    /// let planet = Planet::new(&spec).unwrap();
    /// let place = Place::from_degrees(10.0, 0.0).unwrap();
    /// let filter = EventFilter::only([EventGroup::RiseSet]);
    /// let week = planet.sky_events_between(place, 0.0, 7.0 * planet.day_s(), &filter).unwrap();
    /// assert_eq!(week.len(), 14);
    /// assert!(matches!(week[0].kind, SkyEventKind::Rise(_)));
    /// ```
    pub fn sky_events_between(
        &self,
        place: Place,
        from_s: f64,
        to_s: f64,
        filter: &EventFilter,
    ) -> Result<Vec<SkyEvent>, QueryError> {
        let mut out = Vec::new();
        self.sky_events_into(place, from_s, to_s, filter, &mut out)?;
        Ok(out)
    }

    /// Indices of the moons `filter` follows.
    pub(crate) fn followed_moons<'a>(
        &'a self,
        filter: &'a EventFilter,
    ) -> impl Iterator<Item = usize> + 'a {
        (0..self.moon_orbits().len()).filter(|&i| filter.follows(SkyBody::Moon(i)))
    }

    /// The finest sampling step among the searches `filter` selects, seconds (`None` when it
    /// selects none that samples).
    fn finest_step_s(&self, filter: &EventFilter) -> Option<f64> {
        let mut steps = Vec::new();
        let sky = filter.has(EventGroup::RiseSet) || filter.has(EventGroup::Transit);
        if sky || filter.has(EventGroup::Twilight) {
            steps.push(self.star_step_s());
        }
        if filter.has(EventGroup::NewDay) {
            steps.push(self.day_s());
        }
        if filter.has(EventGroup::RingShadow) && self.has_ring_shadow() {
            steps.push(self.ring_shadow_step_s());
        }
        for moon in self.followed_moons(filter) {
            if sky {
                steps.extend(self.moon_sky_step_s(moon));
            }
            if filter.has(EventGroup::MoonPhase) {
                steps.extend(self.moon_phase_step_s(moon));
            }
            if filter.has(EventGroup::StarEclipse) || filter.has(EventGroup::MoonEclipse) {
                // The walk takes a few dozen steps per conjunction.
                steps.push(
                    crate::moons::synodic_period_s(
                        self.moon_orbits()[moon].period_s,
                        self.year_s(),
                    )
                    .min(self.year_s())
                        / 256.0,
                );
            }
        }
        steps.into_iter().reduce(f64::min)
    }
}

/// Checks that `[from_s, to_s)` is finite and runs forward (or is empty).
fn check_interval(from_s: f64, to_s: f64) -> Result<(), QueryError> {
    let bad = |reason| QueryError::BadInterval {
        from_s,
        to_s,
        reason,
    };
    if !from_s.is_finite() || !to_s.is_finite() {
        return Err(bad("both ends must be finite"));
    }
    if to_s < from_s {
        return Err(bad("the end comes before the start"));
    }
    Ok(())
}

/// Order of kinds at one instant (see the module docs).
fn same_instant_rank(kind: &SkyEventKind) -> u8 {
    match kind.group() {
        EventGroup::NewYear => 0,
        EventGroup::NewDay => 1,
        EventGroup::Season => 2,
        EventGroup::Twilight => 3,
        EventGroup::RiseSet => 4,
        EventGroup::Transit => 5,
        EventGroup::MoonPhase => 6,
        EventGroup::StarEclipse => 7,
        EventGroup::MoonEclipse => 8,
        EventGroup::RingShadow => 9,
        EventGroup::RingPlane => 10,
    }
}
