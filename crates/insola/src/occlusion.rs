//! What hides a star: the one occlusion seam between the bodies that shine and the bodies
//! that get in their way.
//!
//! # Design
//!
//! Insola's sky has two roles:
//!
//! - **shining bodies** — the world's stars. Today a world has one, the star of
//!   [`crate::WorldSpec::star`]; its light, colour and position come from
//!   [`Planet::star_instant`] and [`Planet::star_position_at`].
//! - **occluders** — anything that can stand between a place and a star's disc. Today these
//!   are the moons ([`Occluder::Moon`]). A ring (a band of sky with an optical depth) and a
//!   second star passing in front of the first are new [`Occluder`] variants with their own
//!   cover function in this file, not changes in each consumer.
//!
//! A new occluder also says how far it is from the star ([`Planet::occluder_clearance_rad`],
//! negative while it covers it) and how fast that can change ([`Planet::occluder_motion`]), so
//! the event finder can walk to each of its eclipses without knowing what it is.
//!
//! Every consumer that needs "how much of the star's light gets through here and now" asks
//! this module and nothing else: [`Planet::lighting`] (the star's beam and the sky light it
//! feeds), observers and batch insolation ([`Planet::top_of_atmosphere_insolation_w_m2`]),
//! and the event finder (eclipses are the intervals where an occluder's cover is positive,
//! found through [`Planet::occluders`] and [`Planet::occluder_cover`]). Because they share
//! one definition, an observer at the scene's reference place sees exactly the eclipse the
//! scene's light shows.
//!
//! Overlapping occluders are not combined: the hidden fraction is the largest single cover
//! (two moons over one star at once are rare enough that the error is accepted; a ring with an
//! optical depth will multiply transmissions instead, which is exact for independent layers).

use serde::{Deserialize, Serialize};

use crate::planet::Planet;
use crate::sky::{Place, StarInstant};

/// A body that can hide part of a star's disc from a place.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum Occluder {
    /// Moon `index`, in world-file order.
    Moon(usize),
}

impl std::fmt::Display for Occluder {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            Occluder::Moon(i) => write!(f, "moon {i}"),
        }
    }
}

/// How much of the star's disc is hidden for one place at one instant.
#[derive(Debug, Clone, Copy, PartialEq, Default, Serialize, Deserialize)]
pub struct Occlusion {
    /// Fraction of the star's disc (and so of its light, for a uniform disc) hidden, 0–1.
    pub hidden_fraction: f64,
    /// The occluder that hides the most, if any hides anything.
    pub by: Option<Occluder>,
}

impl Occlusion {
    /// Nothing in the way.
    pub const CLEAR: Occlusion = Occlusion {
        hidden_fraction: 0.0,
        by: None,
    };

    /// Fraction of the star's light that gets through, 0–1.
    pub fn transmitted_fraction(&self) -> f64 {
        1.0 - self.hidden_fraction
    }
}

/// Safety factor on the rate bounds of [`OccluderMotion`] (common practice, no source).
const OCCLUDER_RATE_MARGIN: f64 = 1.25;

/// How fast an occluder can move against the star (defined with the search primitives, which
/// are the only thing that needs it, so that moons can give theirs without importing this
/// module).
pub use crate::search::OccluderMotion;

impl Planet {
    /// Every occluder of this world, in a fixed order (moons in world-file order).
    pub fn occluders(&self) -> impl Iterator<Item = Occluder> + '_ {
        (0..self.moon_orbits().len()).map(Occluder::Moon)
    }

    /// `true` if the world has anything that can ever hide its star (lets batch paths skip
    /// the occlusion work on worlds without moons).
    pub fn has_occluders(&self) -> bool {
        !self.moon_orbits().is_empty()
    }

    /// Fraction of the star's disc that `occluder` hides for `place` at a precomputed instant,
    /// 0–1 (0 for an occluder this world does not have).
    pub fn occluder_cover(&self, occluder: Occluder, instant: &StarInstant, place: Place) -> f64 {
        match occluder {
            Occluder::Moon(i) => self
                .moon_view(instant, i, place)
                .map_or(0.0, |v| v.star_covered_fraction),
        }
    }

    /// Angular gap between the edges of `occluder`'s disc and the star's for `place` at a
    /// precomputed instant, radians: positive while they are apart, negative while they
    /// overlap, so `occluder_cover > 0` exactly when this is `< 0` (`+∞` for an occluder this
    /// world does not have). The event finder walks toward its zeros.
    pub fn occluder_clearance_rad(
        &self,
        occluder: Occluder,
        instant: &StarInstant,
        place: Place,
    ) -> f64 {
        match occluder {
            Occluder::Moon(i) => self
                .moon_view(instant, i, place)
                .map_or(f64::INFINITY, |v| {
                    v.elongation_rad - v.angular_radius_rad - instant.angular_radius_rad
                }),
        }
    }

    /// Bounds on how fast `occluder`'s clearance can change, from any place (`None` for an
    /// occluder this world does not have).
    pub fn occluder_motion(&self, occluder: Occluder) -> Option<OccluderMotion> {
        match occluder {
            Occluder::Moon(i) => {
                let orbit = self.moon_orbits().get(i)?;
                let planet_r = self.body().radius_km * 1000.0;
                // Speed of the observer about the planet's axis, m/s (largest at the equator).
                let v_obs = planet_r * std::f64::consts::TAU / self.spin().sidereal_day_s;
                let moon = crate::orbit::OrbitExtremes::of(
                    orbit.distance_m,
                    orbit.eccentricity,
                    orbit.period_s,
                );
                let ours = crate::orbit::OrbitExtremes::of(
                    self.semi_major_axis_m(),
                    self.spec().orbit.eccentricity,
                    self.year_s(),
                );
                // A direction to a point at distance d moving at relative speed v turns at most
                // v/d; the elongation changes at most as fast as both directions together, and
                // each disc's angular radius at most (radius × the direction's rate).
                let moon_rate = (moon.fastest_m_s + v_obs) / (moon.closest_m - planet_r).max(1.0);
                let star_rate = (ours.fastest_m_s + v_obs) / (ours.closest_m - planet_r).max(1.0);
                let moon_r_max = crate::light::angular_radius(
                    orbit.radius_m,
                    (moon.closest_m - planet_r).max(orbit.radius_m),
                );
                let star_r_max =
                    crate::light::angular_radius(self.star_radius_m(), ours.closest_m - planet_r);
                let rate = (moon_rate * (1.0 + moon_r_max) + star_rate * (1.0 + star_r_max))
                    * OCCLUDER_RATE_MARGIN;
                let contact =
                    crate::light::angular_radius(orbit.radius_m, moon.farthest_m + planet_r)
                        + crate::light::angular_radius(
                            self.star_radius_m(),
                            ours.farthest_m + planet_r,
                        );
                Some(OccluderMotion {
                    max_rate_rad_s: rate,
                    min_contact_rad: contact,
                    longest_s: crate::moons::synodic_period_s(orbit.period_s, self.year_s())
                        .min(self.year_s()),
                })
            }
        }
    }

    /// How much of the star is hidden for `place` at a precomputed instant (see the module
    /// docs for how occluders combine).
    pub fn star_occlusion(&self, instant: &StarInstant, place: Place) -> Occlusion {
        let mut out = Occlusion::CLEAR;
        for occluder in self.occluders() {
            let cover = self.occluder_cover(occluder, instant, place);
            if cover > out.hidden_fraction {
                out = Occlusion {
                    hidden_fraction: cover.min(1.0),
                    by: Some(occluder),
                };
            }
        }
        out
    }

    /// Fraction of the star's disc hidden for `place` (solar eclipse), 0–1: the
    /// [`Occlusion::hidden_fraction`] of [`Planet::star_occlusion`].
    pub fn star_eclipse_fraction(&self, instant: &StarInstant, place: Place) -> f64 {
        self.star_occlusion(instant, place).hidden_fraction
    }

    /// Top-of-atmosphere insolation on a horizontal surface at `place`, W m⁻², with the star's
    /// occlusion applied: the one definition shared by lighting, observers and climate
    /// forcing at an instant.
    pub fn top_of_atmosphere_insolation_w_m2(&self, instant: &StarInstant, place: Place) -> f64 {
        let clear = self.star_position_at(instant, place).toa_insolation_w_m2;
        if clear == 0.0 || !self.has_occluders() {
            return clear;
        }
        clear * self.star_occlusion(instant, place).transmitted_fraction()
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::WorldSpec;
    use crate::lighting::LightMode;

    fn shaded_world() -> Planet {
        // A moon as large in the sky as the star, new at time zero (invented test world).
        let text = r#"(name: "Umbrel", star: (temperature_k: 5772, radius_r_sun: 1, flux_at_mean_distance_w_m2: 1361),
            orbit: (semi_major_axis_au: 1, eccentricity: 0, periapsis_longitude_deg: 0, period_days: 360),
            spin: (obliquity_deg: 0, solar_day_hours: 24),
            moons: [(name: "Shade", radius_km: 1800, distance_km: 380000, period_days: 27, phase_at_zero_deg: 0)])"#;
        Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap()
    }

    #[test]
    fn the_moon_in_front_is_named_and_dims_every_consumer_alike() {
        let p = shaded_world();
        let place = Place::from_degrees(0.0, 180.0).unwrap();
        let i = p.star_instant(0.0);
        let o = p.star_occlusion(&i, place);
        assert_eq!(o.by, Some(Occluder::Moon(0)));
        assert!(o.hidden_fraction > 0.99, "{}", o.hidden_fraction);
        let light = p.lighting(0.0, place, LightMode::Ground);
        assert_eq!(light.star_eclipse_fraction, o.hidden_fraction);
        assert_eq!(
            light.toa_insolation_w_m2,
            p.top_of_atmosphere_insolation_w_m2(&i, place)
        );
    }

    #[test]
    fn clear_far_from_the_shadow_and_on_moonless_worlds() {
        let p = shaded_world();
        let i = p.star_instant(0.0);
        let far = Place::from_degrees(60.0, 180.0).unwrap();
        assert_eq!(p.star_occlusion(&i, far), Occlusion::CLEAR);
        let bare = crate::Planet::new(
            &WorldSpec::from_ron_str(
                r#"(name: "Bare", star: (temperature_k: 5772, radius_r_sun: 1, flux_at_mean_distance_w_m2: 1361),
                    orbit: (semi_major_axis_au: 1, eccentricity: 0, periapsis_longitude_deg: 0, period_days: 360),
                    spin: (obliquity_deg: 0, solar_day_hours: 24))"#,
            )
            .unwrap(),
        )
        .unwrap();
        assert!(!bare.has_occluders());
        assert_eq!(bare.occluders().count(), 0);
        let place = Place::from_degrees(0.0, 180.0).unwrap();
        let i = bare.star_instant(0.0);
        assert_eq!(
            bare.top_of_atmosphere_insolation_w_m2(&i, place),
            bare.star_position_at(&i, place).toa_insolation_w_m2
        );
    }
}
