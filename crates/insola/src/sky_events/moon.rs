//! A moon's events: rise, set and upper transit at a place, and its four principal phases.

use std::f64::consts::{FRAC_PI_2, PI};

use glam::DVec3;

use super::filter::{EventFilter, EventGroup};
use super::kind::{MoonPhase, SkyBody, SkyEvent, SkyEventKind};
use crate::orbit::OrbitExtremes;
use crate::planet::Planet;
use crate::search::{Grid, refine_change};
use crate::sky::Place;

/// What a moon's sky events are decided by at one instant.
#[derive(Debug, Clone, Copy)]
struct MoonSample {
    /// Above its rise altitude (its light's `is_up`).
    up: bool,
    /// Hour angle in the sense the sky turns, radians `[−π, π)`.
    hour_angle_rad: f64,
}

/// Hour angle, in the sense the sky turns, of a direction in the local east-north-up frame at
/// latitude `latitude_rad`, radians `[−π, π)`: the inverse of the star's east-north-up formula
/// in `sky.rs` (−x = cos δ sin H, cos φ z − sin φ y = cos δ cos H).
fn hour_angle_of(enu: DVec3, latitude_rad: f64, sense: f64) -> f64 {
    let (s, c) = latitude_rad.sin_cos();
    crate::angle::wrap_pi(sense * (-enu.x).atan2(c * enu.z - s * enu.y))
}

impl Planet {
    fn moon_sample(&self, moon: usize, t_s: f64, place: Place) -> MoonSample {
        let rise = self.moon_rise_altitude_rad(moon);
        match self.moon_view(&self.star_instant(t_s), moon, place) {
            Some(v) => MoonSample {
                up: v.altitude_rad > rise,
                hour_angle_rad: hour_angle_of(
                    v.direction_enu,
                    place.latitude_rad,
                    self.spin().sense.sign(),
                ),
            },
            None => MoonSample {
                up: false,
                hour_angle_rad: PI,
            },
        }
    }

    /// Rise, set and upper transit of moon `moon` in `[from_s, to_s)`, as `filter` selects
    /// them. A moon whose orbit outruns the planet's turn crosses the sky backwards: its upper
    /// transit is still the hour angle passing 0, in either direction.
    pub(super) fn moon_sky_events_into(
        &self,
        moon: usize,
        place: Place,
        from_s: f64,
        to_s: f64,
        filter: &EventFilter,
        out: &mut Vec<SkyEvent>,
    ) {
        let (rise_set, transit) = (
            filter.has(EventGroup::RiseSet),
            filter.has(EventGroup::Transit),
        );
        let Some(step) = self.moon_sky_step_s(moon) else {
            return;
        };
        if !(rise_set || transit) {
            return;
        }
        let body = SkyBody::Moon(moon);
        let sample = |t: f64| self.moon_sample(moon, t, place);
        let mut a = sample(from_s);
        for (ta, tb) in Grid::new(from_s, to_s, step).steps() {
            let b = sample(tb);
            if rise_set && a.up != b.up {
                let at_s = refine_change(ta, tb, a.up, &mut |t| sample(t).up);
                let kind = if b.up {
                    SkyEventKind::Rise(body)
                } else {
                    SkyEventKind::Set(body)
                };
                out.push(SkyEvent { at_s, kind });
            }
            let (ha, hb) = (a.hour_angle_rad, b.hour_angle_rad);
            if transit && (ha > 0.0) != (hb > 0.0) && (hb - ha).abs() < PI {
                let old = ha > 0.0;
                let at_s = refine_change(ta, tb, old, &mut |t| sample(t).hour_angle_rad > 0.0);
                out.push(SkyEvent {
                    at_s,
                    kind: SkyEventKind::Transit(body),
                });
            }
            a = b;
        }
    }

    /// Moon `moon`'s ecliptic longitude minus the star's, seen from the planet's centre,
    /// radians `[0, 2π)`: 0 at new moon, π at full.
    fn moon_elongation_in_longitude_rad(&self, moon: usize, t_s: f64) -> f64 {
        let p = self.moon_orbits()[moon].position_at(t_s);
        let star = self.orbit().state_at(t_s).star_longitude_rad;
        crate::angle::wrap_tau(p.y.atan2(p.x) - star)
    }

    /// Sampling step for moon phases, seconds: an eighth of a quarter turn at the fastest the
    /// moon and the star can move apart (`None` for a bad index).
    pub(crate) fn moon_phase_step_s(&self, moon: usize) -> Option<f64> {
        let orbit = self.moon_orbits().get(moon)?;
        let m = OrbitExtremes::of(orbit.distance_m, orbit.eccentricity, orbit.period_s);
        let ours = OrbitExtremes::of(
            self.semi_major_axis_m(),
            self.spec().orbit.eccentricity,
            self.year_s(),
        );
        Some(FRAC_PI_2 / 8.0 / (m.fastest_rad_s + ours.fastest_rad_s))
    }

    /// New moon, first quarter, full moon and last quarter of moon `moon` in `[from_s, to_s)`:
    /// where the elongation in longitude passes 0°, 90°, 180°, 270° (Meeus, *Astronomical
    /// Algorithms*, ch. 49). The quarter after new is the first whichever way the moon goes.
    pub(super) fn moon_phases_into(
        &self,
        moon: usize,
        from_s: f64,
        to_s: f64,
        out: &mut Vec<SkyEvent>,
    ) {
        let Some(step) = self.moon_phase_step_s(moon) else {
            return;
        };
        let quadrant =
            |t: f64| (self.moon_elongation_in_longitude_rad(moon, t) / FRAC_PI_2) as u8 % 4;
        let mut a = quadrant(from_s);
        for (ta, tb) in Grid::new(from_s, to_s, step).steps() {
            let b = quadrant(tb);
            if a != b {
                self.quarter_changes_into(moon, ta, tb, a, b, &quadrant, 0, out);
            }
            a = b;
        }
    }

    /// Resolves a change of quadrant from `qa` at `ta` to `qb` at `tb` into its quarter
    /// crossings (splitting the step if it spans two).
    #[allow(clippy::too_many_arguments)]
    fn quarter_changes_into(
        &self,
        moon: usize,
        ta: f64,
        tb: f64,
        qa: u8,
        qb: u8,
        quadrant: &dyn Fn(f64) -> u8,
        depth: u32,
        out: &mut Vec<SkyEvent>,
    ) {
        let forward = (qb + 4 - qa) % 4;
        let (boundary, waxing_order) = match forward {
            1 => (qb, true),
            3 => (qa, false),
            _ => {
                // Two quarters in one step (a moon racing past the ecliptic pole): split it.
                if depth < 40 && tb - ta > super::EVENT_TIME_TOLERANCE_S {
                    let mid = 0.5 * (ta + tb);
                    let qm = quadrant(mid);
                    if qm != qa {
                        self.quarter_changes_into(moon, ta, mid, qa, qm, quadrant, depth + 1, out);
                    }
                    if qm != qb {
                        self.quarter_changes_into(moon, mid, tb, qm, qb, quadrant, depth + 1, out);
                    }
                }
                return;
            }
        };
        let at_s = refine_change(ta, tb, true, &mut |t| quadrant(t) == qa);
        let phase = match (boundary, waxing_order) {
            (0, _) => MoonPhase::New,
            (2, _) => MoonPhase::Full,
            (1, true) | (3, false) => MoonPhase::FirstQuarter,
            _ => MoonPhase::LastQuarter,
        };
        out.push(SkyEvent {
            at_s,
            kind: SkyEventKind::MoonPhase { moon, phase },
        });
    }
}
