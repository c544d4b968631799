//! What hides a star: the one occlusion seam between the bodies that shine and the bodies
//! that get in their way.
//!
//! # Design
//!
//! Insola's sky has two roles:
//!
//! - **shining bodies** — the world's stars: the star of [`crate::WorldSpec::star`] (index 0)
//!   and, with a [`crate::WorldSpec::companion`], a second one (index 1); their light, colour
//!   and position come from [`Planet::star_instant_of`] and [`Planet::star_position_at`]. A
//!   [`StarInstant`] says which star it describes ([`StarInstant::star`]), and every function
//!   here answers for that star.
//! - **occluders** — anything that can stand between a place and a star's disc. Today these
//!   are the moons ([`Occluder::Moon`], in front of either star) and the stars themselves
//!   ([`Occluder::Star`]: the nearer star of a pair passing in front of the farther one, as
//!   seen from the place). A ring (a band of sky with an optical depth) is a new [`Occluder`]
//!   variant with its own cover function in this file, not a change in each consumer.
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
//! Bulk consumers (the star frames of [`crate::star_frame`], a million places per instant) ask
//! in two steps: once per instant, [`Planet::occluders_in_reach`] keeps the occluders that can
//! cover the star from *somewhere* on the planet (a planet-wide test: the elongation seen from
//! the centre against the largest parallax and disc sizes any surface point can see) as
//! [`OccluderSight`]s; then each place costs nothing when that list is empty and a few square
//! roots per listed occluder when it is not ([`OccluderSight::cover`]).
//!
//! Overlapping occluders are not combined: the hidden fraction is the largest single cover
//! (two moons over one star at once are rare enough that the error is accepted; a ring with an
//! optical depth will multiply transmissions instead, which is exact for independent layers).

use glam::DVec3;
use serde::{Deserialize, Serialize};

use crate::planet::Planet;
use crate::sky::{Place, StarInstant};

/// A body that can hide part of a star's disc from a place.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum Occluder {
    /// Moon `index`, in world-file order.
    Moon(usize),
    /// Star `index` (0 the primary, 1 the companion), while it is nearer than the star it
    /// hides.
    Star(usize),
}

impl std::fmt::Display for Occluder {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            Occluder::Moon(i) => write!(f, "moon {i}"),
            // As `SkyBody` names stars: `star` for the primary, `star 1` for the companion.
            Occluder::Star(0) => f.write_str("star"),
            Occluder::Star(i) => write!(f, "star {i}"),
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

/// Margin on the planet-wide reach test, radians (rounding only; common practice, no source).
const REACH_MARGIN_RAD: f64 = 1e-9;

/// One occluder and the star at one instant, in the planet's rotating frame (x toward the prime
/// meridian on the equator, z toward the north pole), so that a place's position is its
/// latitude's and longitude's sines and cosines times the radius: what a place needs to find
/// how much of the star this occluder hides for it.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct OccluderSight {
    /// The occluder.
    pub occluder: Occluder,
    /// The occluder's centre relative to the planet's, rotating frame, metres.
    occluder_m: [f64; 3],
    /// The star's centre relative to the planet's, rotating frame, metres.
    star_m: [f64; 3],
    /// Radius of the occluder, metres.
    occluder_radius_m: f64,
    /// Angular radius of the star's disc, radians (as every cover takes it: seen from the
    /// planet's centre).
    star_radius_rad: f64,
    /// The planet's radius, metres.
    planet_radius_m: f64,
}

impl OccluderSight {
    /// Fraction of the star's disc this occluder hides, 0–1, for the place whose latitude has
    /// sine `sin_lat` and cosine `cos_lat` and whose east longitude has sine `sin_lon` and cosine
    /// `cos_lon`. Agrees with [`Planet::occluder_cover`] to rounding (about 1e-12).
    #[inline]
    pub fn cover(&self, sin_lat: f64, cos_lat: f64, sin_lon: f64, cos_lon: f64) -> f64 {
        let r = self.planet_radius_m;
        let observer = DVec3::new(cos_lat * cos_lon * r, cos_lat * sin_lon * r, sin_lat * r);
        let to_occluder = DVec3::from_array(self.occluder_m) - observer;
        let to_star = DVec3::from_array(self.star_m) - observer;
        let elongation = crate::moons::angle_between(to_occluder, to_star);
        let occluder_radius =
            crate::light::angular_radius(self.occluder_radius_m, to_occluder.length());
        crate::light::covered_fraction(self.star_radius_rad, occluder_radius, elongation)
    }

    /// [`OccluderSight::cover`] for a [`Place`].
    pub fn cover_at(&self, place: Place) -> f64 {
        let (sin_lat, cos_lat) = place.latitude_rad.sin_cos();
        let (sin_lon, cos_lon) = place.longitude_rad.sin_cos();
        self.cover(sin_lat, cos_lat, sin_lon, cos_lon)
    }

    /// `true` if the occluder can hide part of the star from some point of the planet's
    /// surface at this instant (conservative: never `false` while it covers the star anywhere).
    pub fn reaches_planet(&self) -> bool {
        let r = self.planet_radius_m;
        let occluder = DVec3::from_array(self.occluder_m);
        let star = DVec3::from_array(self.star_m);
        let (d_occluder, d_star) = (occluder.length(), star.length());
        if d_occluder <= r || d_star <= r {
            return true;
        }
        // From a point at distance r from the centre, a direction to a body at distance d
        // turns by at most asin(r/d) (the parallax), and the body's disc grows to at most
        // asin(radius/(d − r)); the elongation seen there is at least the centre's minus both
        // parallaxes (triangle inequality on the sphere of directions).
        let parallax = (r / d_occluder).asin() + (r / d_star).asin();
        let largest_disc = crate::light::angular_radius(self.occluder_radius_m, d_occluder - r);
        crate::moons::angle_between(occluder, star) - parallax
            < largest_disc + self.star_radius_rad + REACH_MARGIN_RAD
    }
}

/// Largest cover among `sights` for one place (the module's rule for combining occluders).
#[inline]
pub(crate) fn occlusion_among(
    sights: &[OccluderSight],
    sin_lat: f64,
    cos_lat: f64,
    sin_lon: f64,
    cos_lon: f64,
) -> Occlusion {
    let mut out = Occlusion::CLEAR;
    for sight in sights {
        let cover = sight.cover(sin_lat, cos_lat, sin_lon, cos_lon);
        if cover > out.hidden_fraction {
            out = Occlusion {
                hidden_fraction: cover.min(1.0),
                by: Some(sight.occluder),
            };
        }
    }
    out
}

/// Safety factor on the rate bounds of [`OccluderMotion`] (common practice, no source).
const OCCLUDER_RATE_MARGIN: f64 = 1.25;

/// Geometry of one star in front of (or behind) another, seen from a place.
struct StarOnStar {
    /// Angle between the two centres, radians.
    elongation_rad: f64,
    /// Angular radius of the occluding star's disc seen from the place, radians.
    occluder_radius_rad: f64,
    /// `true` while the occluding star is the nearer.
    nearer: bool,
}

/// Bounds on the stars' motion against the planet ([`Planet::star_motion_bounds`]).
struct StarBounds {
    fastest_m_s: f64,
    closest_m: f64,
    farthest_m: f64,
    largest_radius_m: f64,
    smallest_radius_m: f64,
}

/// How fast an occluder can move against the star (defined with the search primitives, which
/// are the only thing that needs it, so that moons can give theirs without importing this
/// module).
pub use crate::search::OccluderMotion;

impl Planet {
    /// Every occluder of this world, in a fixed order (moons in world-file order, then the
    /// stars that can pass in front of another: both of a circumbinary pair, the primary of a
    /// wide one, which is always the nearer).
    pub fn occluders(&self) -> impl Iterator<Item = Occluder> + '_ {
        let stars: &[usize] = match self.companion().map(|c| c.pair.arrangement) {
            None => &[],
            Some(crate::world::CompanionArrangement::Circumbinary) => &[0, 1],
            Some(crate::world::CompanionArrangement::Wide) => &[0],
        };
        (0..self.moon_orbits().len())
            .map(Occluder::Moon)
            .chain(stars.iter().map(|&k| Occluder::Star(k)))
    }

    /// `true` if `occluder` can ever hide star `star` (a star never hides itself, and the
    /// companion of a wide pair is always farther than the primary).
    pub fn occluder_can_hide(&self, occluder: Occluder, star: usize) -> bool {
        match occluder {
            Occluder::Moon(i) => i < self.moon_orbits().len() && star < self.star_count(),
            Occluder::Star(k) => {
                k != star && star < self.star_count() && self.occluders().any(|o| o == occluder)
            }
        }
    }

    /// `true` if the world has anything that can ever hide a star (lets batch paths skip
    /// the occlusion work on worlds without moons or a second star).
    pub fn has_occluders(&self) -> bool {
        !self.moon_orbits().is_empty() || self.companion().is_some()
    }

    /// `occluder` and the star at a precomputed instant, for many places (`None` for an
    /// occluder this world does not have).
    pub fn occluder_sight(
        &self,
        occluder: Occluder,
        instant: &StarInstant,
    ) -> Option<OccluderSight> {
        match occluder {
            Occluder::Moon(i) => {
                let orbit = self.moon_orbits().get(i)?;
                let tilt = self.spin().tilt_rad;
                let (s, c) = instant.sidereal_angle_rad.sin_cos();
                // Ecliptic → equatorial (about x), then into the rotating frame (about z by
                // minus the rotation angle).
                let rotating = |v: DVec3| {
                    let e = crate::frames::equatorial_from_ecliptic(v, tilt);
                    [c * e.x + s * e.y, c * e.y - s * e.x, e.z]
                };
                let star = crate::star_pair::ecliptic_unit(instant)
                    * (instant.distance_factor * self.semi_major_axis_m());
                Some(OccluderSight {
                    occluder,
                    occluder_m: rotating(orbit.position_at(instant.t_s)),
                    star_m: rotating(star),
                    occluder_radius_m: orbit.radius_m,
                    star_radius_rad: instant.angular_radius_rad,
                    planet_radius_m: self.body().radius_km * 1000.0,
                })
            }
            Occluder::Star(k) => {
                if !self.occluder_can_hide(occluder, instant.star) {
                    return None;
                }
                let occluder_v = self.star_vector_m(k, instant.t_s)?;
                let star = crate::star_pair::ecliptic_unit(instant)
                    * (instant.distance_factor * self.semi_major_axis_m());
                // The nearer star hides the farther one; the order does not change while
                // they overlap (it flips only far from conjunction).
                if occluder_v.length() >= star.length() {
                    return None;
                }
                let tilt = self.spin().tilt_rad;
                let (s, c) = instant.sidereal_angle_rad.sin_cos();
                let rotating = |v: DVec3| {
                    let e = crate::frames::equatorial_from_ecliptic(v, tilt);
                    [c * e.x + s * e.y, c * e.y - s * e.x, e.z]
                };
                Some(OccluderSight {
                    occluder,
                    occluder_m: rotating(occluder_v),
                    star_m: rotating(star),
                    occluder_radius_m: self.star_radius_of_m(k)?,
                    star_radius_rad: instant.angular_radius_rad,
                    planet_radius_m: self.body().radius_km * 1000.0,
                })
            }
        }
    }

    /// The occluders that can hide part of the star from somewhere on the planet at a
    /// precomputed instant (the planet-wide test of [`OccluderSight::reaches_planet`]), in
    /// [`Planet::occluders`] order; empty on most instants and on worlds without moons.
    pub fn occluders_in_reach(&self, instant: &StarInstant) -> Vec<OccluderSight> {
        self.occluders()
            .filter_map(|o| self.occluder_sight(o, instant))
            .filter(OccluderSight::reaches_planet)
            .collect()
    }

    /// Fraction of the star's disc that `occluder` hides for `place` at a precomputed instant,
    /// 0–1 (0 for an occluder this world does not have).
    pub fn occluder_cover(&self, occluder: Occluder, instant: &StarInstant, place: Place) -> f64 {
        match occluder {
            Occluder::Moon(i) => self
                .moon_view(instant, i, place)
                .map_or(0.0, |v| v.star_covered_fraction),
            Occluder::Star(k) => self.star_on_star(k, instant, place).map_or(0.0, |v| {
                crate::light::covered_fraction(
                    instant.angular_radius_rad,
                    v.occluder_radius_rad,
                    v.elongation_rad,
                )
            }),
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
            Occluder::Star(k) => self
                .star_on_star(k, instant, place)
                .map_or(f64::INFINITY, |v| {
                    let gap = v.elongation_rad - v.occluder_radius_rad - instant.angular_radius_rad;
                    if v.nearer {
                        gap
                    } else {
                        // Behind: never an eclipse. Lifted by twice the discs so it stays positive
                        // through the conjunction; the order flips only far from conjunction, where
                        // the gap is large, so the lift never hides a contact.
                        gap + 2.0 * (v.occluder_radius_rad + instant.angular_radius_rad)
                    }
                }),
        }
    }

    /// Star `k` against the star of `instant`, seen from `place` (`None` when star `k` cannot
    /// hide it).
    fn star_on_star(&self, k: usize, instant: &StarInstant, place: Place) -> Option<StarOnStar> {
        if !self.occluder_can_hide(Occluder::Star(k), instant.star) {
            return None;
        }
        let obs = self.observer_offset(instant, place);
        let target = crate::star_pair::ecliptic_unit(instant)
            * (instant.distance_factor * self.semi_major_axis_m())
            - obs;
        let occluder = self.star_vector_m(k, instant.t_s)? - obs;
        Some(StarOnStar {
            elongation_rad: crate::moons::angle_between(target, occluder),
            occluder_radius_rad: crate::light::angular_radius(
                self.star_radius_of_m(k)?,
                occluder.length(),
            ),
            nearer: occluder.length() < target.length(),
        })
    }

    /// Bounds on how fast the stars can move against the planet: fastest speed relative to
    /// it (its orbit about the focus plus, for a star off the focus, its share of the pair's
    /// orbit), closest and farthest distance, largest and smallest radius, for the stars of
    /// `stars`. On a one-star world: the planet's orbit and the star, as before.
    fn star_motion_bounds(&self, stars: &[usize]) -> StarBounds {
        let ours = crate::orbit::OrbitExtremes::of(
            self.semi_major_axis_m(),
            self.spec().orbit.eccentricity,
            self.year_s(),
        );
        let mut b = StarBounds {
            fastest_m_s: 0.0,
            closest_m: f64::INFINITY,
            farthest_m: 0.0,
            largest_radius_m: 0.0,
            smallest_radius_m: f64::INFINITY,
        };
        for &k in stars {
            let radius = self.star_radius_of_m(k).unwrap_or(0.0);
            b.largest_radius_m = b.largest_radius_m.max(radius);
            b.smallest_radius_m = b.smallest_radius_m.min(radius);
            let (speed, closest, farthest) = match self.companion() {
                Some(c) if k == 1 || self.primary_is_off_focus() => {
                    let pair = &c.pair;
                    let rel = crate::orbit::OrbitExtremes::of(
                        pair.separation_m,
                        pair.eccentricity,
                        pair.period_s,
                    );
                    let total = pair.primary_mass_m_sun + pair.companion_mass_m_sun;
                    let share = match (pair.arrangement, k) {
                        (crate::world::CompanionArrangement::Wide, _) => 1.0,
                        (_, 0) => pair.companion_mass_m_sun / total,
                        _ => pair.primary_mass_m_sun / total,
                    };
                    (
                        ours.fastest_m_s + share * rel.fastest_m_s,
                        // |A + B| ≥ |A| − |B| and ≥ |B| − |A| (triangle inequality).
                        (ours.closest_m - share * rel.farthest_m)
                            .max(share * rel.closest_m - ours.farthest_m)
                            .max(radius),
                        ours.farthest_m + share * rel.farthest_m,
                    )
                }
                _ => (ours.fastest_m_s, ours.closest_m, ours.farthest_m),
            };
            b.fastest_m_s = b.fastest_m_s.max(speed);
            b.closest_m = b.closest_m.min(closest);
            b.farthest_m = b.farthest_m.max(farthest);
        }
        b
    }

    /// Bounds on how fast `occluder`'s clearance against star 0 can change, from any place
    /// (`None` for an occluder this world does not have); see
    /// [`Planet::occluder_motion_against`].
    pub fn occluder_motion(&self, occluder: Occluder) -> Option<OccluderMotion> {
        self.occluder_motion_against(occluder, 0)
    }

    /// Bounds on how fast `occluder`'s clearance against star `star` can change, from any
    /// place (`None` for an occluder that cannot hide that star).
    pub fn occluder_motion_against(
        &self,
        occluder: Occluder,
        star: usize,
    ) -> Option<OccluderMotion> {
        if !self.occluder_can_hide(occluder, star) {
            return None;
        }
        let planet_r = self.body().radius_km * 1000.0;
        // Speed of the observer about the planet's axis, m/s (largest at the equator).
        let v_obs = planet_r * std::f64::consts::TAU / self.spin().sidereal_day_s;
        let target = self.star_motion_bounds(&[star]);
        // A direction to a point at distance d moving at relative speed v turns at most v/d;
        // the elongation changes at most as fast as both directions together, and each disc's
        // angular radius at most (radius × the direction's rate).
        let star_rate = (target.fastest_m_s + v_obs) / (target.closest_m - planet_r).max(1.0);
        let star_r_max =
            crate::light::angular_radius(target.largest_radius_m, target.closest_m - planet_r);
        let star_contact =
            crate::light::angular_radius(target.smallest_radius_m, target.farthest_m + planet_r);
        match occluder {
            Occluder::Moon(i) => {
                let orbit = self.moon_orbits().get(i)?;
                let moon = crate::orbit::OrbitExtremes::of(
                    orbit.distance_m,
                    orbit.eccentricity,
                    orbit.period_s,
                );
                let moon_rate = (moon.fastest_m_s + v_obs) / (moon.closest_m - planet_r).max(1.0);
                let moon_r_max = crate::light::angular_radius(
                    orbit.radius_m,
                    (moon.closest_m - planet_r).max(orbit.radius_m),
                );
                let rate = (moon_rate * (1.0 + moon_r_max) + star_rate * (1.0 + star_r_max))
                    * OCCLUDER_RATE_MARGIN;
                let contact =
                    crate::light::angular_radius(orbit.radius_m, moon.farthest_m + planet_r)
                        + star_contact;
                Some(OccluderMotion {
                    max_rate_rad_s: rate,
                    min_contact_rad: contact,
                    longest_s: crate::moons::synodic_period_s(orbit.period_s, self.year_s())
                        .min(self.year_s()),
                })
            }
            Occluder::Star(k) => {
                let pair = &self.companion()?.pair;
                let other = self.star_motion_bounds(&[k]);
                let other_rate =
                    (other.fastest_m_s + v_obs) / (other.closest_m - planet_r).max(1.0);
                let other_r_max = crate::light::angular_radius(
                    other.largest_radius_m,
                    other.closest_m - planet_r,
                );
                let rate = (other_rate * (1.0 + other_r_max) + star_rate * (1.0 + star_r_max))
                    * OCCLUDER_RATE_MARGIN;
                let contact = crate::light::angular_radius(
                    other.smallest_radius_m,
                    other.farthest_m + planet_r,
                ) + star_contact;
                // The pair lines up again once per synodic period of its orbit against the
                // planet's (circumbinary), or of the planet's year against the companion's
                // slow orbit (wide).
                let longest_s = crate::moons::synodic_period_s(pair.period_s, self.year_s());
                Some(OccluderMotion {
                    max_rate_rad_s: rate,
                    min_contact_rad: contact,
                    longest_s: if longest_s.is_finite() {
                        longest_s
                    } else {
                        self.year_s()
                    },
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
