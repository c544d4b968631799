//! The star's events at a place: rise, set, upper transit and the twilight boundaries, from
//! one sample grid.

use std::f64::consts::PI;

use super::filter::{EventFilter, EventGroup};
use super::kind::{SkyBody, SkyEvent, SkyEventKind};
use crate::light::TwilightBand;
use crate::planet::Planet;
use crate::search::{Grid, refine_change};
use crate::sky::Place;

/// What one star's events are decided by at one instant.
#[derive(Debug, Clone, Copy, Default)]
struct OneStar {
    /// Above the star's rise altitude (the light's `is_up`).
    up: bool,
    /// Hour angle in the sense the sky turns, radians.
    hour_angle_rad: f64,
}

/// What the stars' events are decided by at one instant: each shining star (at most two) and
/// the combined twilight.
#[derive(Debug, Clone, Copy)]
struct StarSample {
    /// Each shining star, in [`Planet::shining_stars`] order (unused entries default).
    stars: [OneStar; 2],
    /// At or above each band's lower limit for some shining star, in [`TwilightBand::ALL`]
    /// order (the twilight of the combined light: night only when every star is down).
    above_band: [bool; 3],
}

impl Planet {
    /// Sampling step for the stars' events, seconds: 1/96 of the shorter of the day and year
    /// (and, on a circumbinary world, of the pair's synodic period against the planet's
    /// orbit, over which the stars swing about their barycentre).
    pub(crate) fn star_step_s(&self) -> f64 {
        let base = self.day_s().min(self.year_s());
        let pair = match self.companion() {
            Some(c) if self.primary_is_off_focus() => {
                crate::moons::synodic_period_s(c.pair.period_s, self.year_s())
            }
            _ => f64::INFINITY,
        };
        base.min(pair) / 96.0
    }

    fn star_sample(&self, t_s: f64, place: Place, stars: &[usize]) -> StarSample {
        let mut out = StarSample {
            stars: [OneStar::default(); 2],
            above_band: [false; 3],
        };
        for (slot, &k) in stars.iter().enumerate().take(2) {
            let Some(pos) = self.star_position_of(k, t_s, place) else {
                continue;
            };
            let rise = self
                .standard_rise_altitude_of_rad(k)
                .unwrap_or(self.standard_rise_altitude_rad());
            // Degrees, exactly as `TwilightPhase::from_altitude` compares them.
            let h_deg = pos.altitude_rad.to_degrees();
            for (above, band) in out.above_band.iter_mut().zip(TwilightBand::ALL) {
                *above |= h_deg >= band.lower_limit_deg();
            }
            out.stars[slot] = OneStar {
                up: pos.altitude_rad > rise,
                hour_angle_rad: pos.hour_angle_rad,
            };
        }
        out
    }

    /// Rise, set and transit events of each shining star and the twilight events of their
    /// combined light in `[from_s, to_s)`, as `filter` selects them.
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
        let stars: Vec<usize> = self.shining_stars().collect();
        let sample = |t: f64| self.star_sample(t, place, &stars);
        let grid = Grid::new(from_s, to_s, self.star_step_s());
        let mut a = sample(from_s);
        for (ta, tb) in grid.steps() {
            let b = sample(tb);
            for (slot, &k) in stars.iter().enumerate().take(2) {
                let star = SkyBody::Star(k);
                let (sa, sb) = (a.stars[slot], b.stars[slot]);
                if rise_set && sa.up != sb.up {
                    let at_s = refine_change(ta, tb, sa.up, &mut |t| sample(t).stars[slot].up);
                    let kind = if sb.up {
                        SkyEventKind::Rise(star)
                    } else {
                        SkyEventKind::Set(star)
                    };
                    out.push(SkyEvent { at_s, kind });
                }
                if twilight && slot == 0 {
                    for (j, band) in TwilightBand::ALL.into_iter().enumerate() {
                        if a.above_band[j] != b.above_band[j] {
                            let at_s = refine_change(ta, tb, a.above_band[j], &mut |t| {
                                sample(t).above_band[j]
                            });
                            let kind = if b.above_band[j] {
                                SkyEventKind::Dawn(band)
                            } else {
                                SkyEventKind::Dusk(band)
                            };
                            out.push(SkyEvent { at_s, kind });
                        }
                    }
                }
                // The hour angle grows through 0 at upper transit; its wrap from +π to −π is
                // the lower transit, not an event here.
                let (ha, hb) = (sa.hour_angle_rad, sb.hour_angle_rad);
                if transit && ha <= 0.0 && hb > 0.0 && hb - ha < PI {
                    let at_s = refine_change(ta, tb, false, &mut |t| {
                        sample(t).stars[slot].hour_angle_rad > 0.0
                    });
                    out.push(SkyEvent {
                        at_s,
                        kind: SkyEventKind::Transit(star),
                    });
                }
            }
            a = b;
        }
    }
}
