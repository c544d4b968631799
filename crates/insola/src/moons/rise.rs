//! When a moon rises and sets: its standard rise altitude and its altitude crossings.

use crate::light::angular_radius;
use crate::planet::Planet;
use crate::sky::Place;

impl Planet {
    /// Standard altitude of moonrise and moonset for moon `index`, radians: the geometric
    /// altitude at which the upper limb of its disc (at its mean distance) touches the
    /// refracted horizon — the same rule as the star's
    /// ([`Planet::standard_rise_altitude_rad`]); parallax is already in the topocentric
    /// position. The moon's light is on exactly above it.
    pub fn moon_rise_altitude_rad(&self, index: usize) -> f64 {
        let r = self
            .moon_orbits()
            .get(index)
            .map_or(0.0, |o| angular_radius(o.radius_m, o.distance_m));
        crate::light::rise_altitude_rad(self.atmosphere().refraction_scale(), r)
    }

    /// Longest sampling step that follows moon `index` across this world's sky, seconds: 1/96
    /// of the shortest of the day, the year, the moon's period and the moon's own day over a
    /// place (`None` for a bad index).
    pub(crate) fn moon_sky_step_s(&self, index: usize) -> Option<f64> {
        let orbit = self.moon_orbits().get(index)?;
        // The moon's sky period over a place: 1/P = |1/P_rotation − 1/P_moon| (standard).
        let rot = self.spin().sense.sign() / self.spin().sidereal_day_s;
        let rel = (rot - 1.0 / orbit.period_s).abs();
        let moon_day = if rel > 0.0 { 1.0 / rel } else { f64::INFINITY };
        Some(
            self.day_s()
                .min(orbit.period_s)
                .min(moon_day)
                .min(self.year_s())
                / 96.0,
        )
    }

    /// Every crossing of `threshold_rad` by moon `index`'s centre in `[t0_s, t1_s)` at
    /// `place`, in time order (moonrise when `rising`; see [`crate::search::Crossing`]). Samples at most every 1/96 of the
    /// shortest of the day, the moon's period and the moon's own day over this place.
    pub fn moon_altitude_crossings_into(
        &self,
        index: usize,
        place: Place,
        t0_s: f64,
        t1_s: f64,
        threshold_rad: f64,
        out: &mut Vec<crate::search::Crossing>,
    ) {
        let Some(max_step) = self.moon_sky_step_s(index) else {
            return;
        };
        let f = |t: f64| {
            let i = self.star_instant(t);
            self.moon_view(&i, index, place)
                .map_or(-1.0, |v| v.altitude_rad)
                - threshold_rad
        };
        crate::search::crossings_of(&f, t0_s, t1_s, max_step, out);
    }
}
