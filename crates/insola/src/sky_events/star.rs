//! The star's events at a place: rise, set, upper transit and the twilight boundaries, from
//! one sample grid.

use std::f64::consts::PI;

use super::filter::{EventFilter, EventGroup};
use super::kind::{SkyBody, SkyEvent, SkyEventKind};
use crate::light::TwilightBand;
use crate::planet::Planet;
use crate::search::{Grid, refine_change};
use crate::sky::Place;

/// What the star's events are decided by at one instant.
#[derive(Debug, Clone, Copy)]
struct StarSample {
    /// Above the rise altitude (the light's `is_up`).
    up: bool,
    /// At or above each band's lower limit, in [`TwilightBand::ALL`] order.
    above_band: [bool; 3],
    /// Hour angle in the sense the sky turns, radians.
    hour_angle_rad: f64,
}

impl Planet {
    /// Sampling step for the star's events, seconds: 1/96 of the shorter of the day and year.
    pub(crate) fn star_step_s(&self) -> f64 {
        self.day_s().min(self.year_s()) / 96.0
    }

    fn star_sample(&self, t_s: f64, place: Place) -> StarSample {
        let pos = self.star_position(t_s, place);
        // Degrees, exactly as `TwilightPhase::from_altitude` compares them.
        let h_deg = pos.altitude_rad.to_degrees();
        StarSample {
            up: pos.altitude_rad > self.standard_rise_altitude_rad(),
            above_band: TwilightBand::ALL.map(|b| h_deg >= b.lower_limit_deg()),
            hour_angle_rad: pos.hour_angle_rad,
        }
    }

    /// Rise, set, transit and twilight events of the star in `[from_s, to_s)`, as `filter`
    /// selects them.
    pub(super) fn star_events_into(
        &self,
        place: Place,
        from_s: f64,
        to_s: f64,
        filter: &EventFilter,
        out: &mut Vec<SkyEvent>,
    ) {
        let (rise_set, transit, twilight) = (
            filter.has(EventGroup::RiseSet),
            filter.has(EventGroup::Transit),
            filter.has(EventGroup::Twilight),
        );
        if !(rise_set || transit || twilight) {
            return;
        }
        let star = SkyBody::Star(0);
        let sample = |t: f64| self.star_sample(t, place);
        let grid = Grid::new(from_s, to_s, self.star_step_s());
        let mut a = sample(from_s);
        for (ta, tb) in grid.steps() {
            let b = sample(tb);
            if rise_set && a.up != b.up {
                let at_s = refine_change(ta, tb, a.up, &mut |t| sample(t).up);
                let kind = if b.up {
                    SkyEventKind::Rise(star)
                } else {
                    SkyEventKind::Set(star)
                };
                out.push(SkyEvent { at_s, kind });
            }
            if twilight {
                for (k, band) in TwilightBand::ALL.into_iter().enumerate() {
                    if a.above_band[k] != b.above_band[k] {
                        let at_s = refine_change(ta, tb, a.above_band[k], &mut |t| {
                            sample(t).above_band[k]
                        });
                        let kind = if b.above_band[k] {
                            SkyEventKind::Dawn(band)
                        } else {
                            SkyEventKind::Dusk(band)
                        };
                        out.push(SkyEvent { at_s, kind });
                    }
                }
            }
            // The hour angle grows through 0 at upper transit; its wrap from +π to −π is the
            // lower transit, not an event here.
            let (ha, hb) = (a.hour_angle_rad, b.hour_angle_rad);
            if transit && ha <= 0.0 && hb > 0.0 && hb - ha < PI {
                let at_s = refine_change(ta, tb, false, &mut |t| sample(t).hour_angle_rad > 0.0);
                out.push(SkyEvent {
                    at_s,
                    kind: SkyEventKind::Transit(star),
                });
            }
            a = b;
        }
    }
}
