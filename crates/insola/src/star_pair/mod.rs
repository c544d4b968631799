//! Each star of the world through the sky queries: per-star instants and positions, the
//! summed top-of-atmosphere insolation, and the daily mean of a two-star world.
//!
//! Star 0 is the primary (the world's `star`; every one-star function of the crate is star 0
//! and gives the same numbers as before on a one-star world), star 1 the companion of
//! [`crate::world::CompanionSpec`]. A star's [`StarInstant`] carries its index; its distance
//! factor is its distance over the *planet's* semi-major axis, its flux `L / (4π d²)` and its
//! declination and right ascension come from its full ecliptic direction (a wide companion
//! stands off the planet's orbital plane). Mean longitude and the equation of time keep the
//! meaning of the clock: the mean motion of the planet's orbit about its focus.

use glam::DVec3;

use crate::angle::{wrap_pi, wrap_tau};
use crate::frames::equatorial_from_ecliptic;
use crate::planet::Planet;
use crate::sky::{Place, StarInstant, StarPosition, small_asin};
use crate::world::CompanionArrangement;

/// Quadrature nodes per day for the daily mean of a two-star world (midpoint rule on a smooth
/// integrand: the band's instantaneous mean; common practice, no source).
pub const DAILY_MEAN_NODES: usize = 24;

impl Planet {
    /// Number of stars: 1, or 2 with a companion.
    pub fn star_count(&self) -> usize {
        if self.companion().is_some() { 2 } else { 1 }
    }

    /// `true` on a circumbinary world, where the primary is not at the planet's orbital focus.
    pub(crate) fn primary_is_off_focus(&self) -> bool {
        self.companion()
            .is_some_and(|c| c.pair.arrangement == CompanionArrangement::Circumbinary)
    }

    /// `true` if the world has a companion that gives light (its luminosity above 0).
    pub fn has_shining_companion(&self) -> bool {
        self.companion().is_some_and(|c| c.pair.companion_shines())
    }

    /// The stars that give light, primary first (a dark companion, of luminosity 0, is left
    /// out: it has no rise, set or eclipse worth reporting, though it can still hide the
    /// primary).
    pub fn shining_stars(&self) -> impl Iterator<Item = usize> + '_ {
        std::iter::once(0).chain(self.has_shining_companion().then_some(1))
    }

    /// Radius of star `k`, metres (`None` for a star the world does not have).
    pub fn star_radius_of_m(&self, k: usize) -> Option<f64> {
        match k {
            0 => Some(self.star_radius_m()),
            1 => self.companion().map(|c| c.pair.companion_radius_m),
            _ => None,
        }
    }

    /// The spectral light model of star `k`.
    pub fn light_model_of(&self, k: usize) -> Option<&crate::light::StarLightModel> {
        match k {
            0 => Some(self.light_model()),
            1 => self.companion().map(|c| &c.light_model),
            _ => None,
        }
    }

    /// Standard rise altitude of star `k`'s centre, radians (its own disc size; star 0:
    /// [`Planet::standard_rise_altitude_rad`]).
    pub fn standard_rise_altitude_of_rad(&self, k: usize) -> Option<f64> {
        self.light_model_of(k).map(|m| m.rise_altitude_rad())
    }

    /// Flux of star `k` at the planet's semi-major axis, W m⁻² (its flux at distance factor
    /// `ρ` is this over `ρ²`).
    pub fn flux_at_mean_distance_of_w_m2(&self, k: usize) -> Option<f64> {
        match k {
            0 => Some(self.flux_at_mean_distance_w_m2()),
            1 => self.companion().map(|c| c.flux_at_mean_distance_w_m2),
            _ => None,
        }
    }

    /// The place-independent state of star `k` at `t_s` (`None` for a star the world does not
    /// have). Star 0 is [`Planet::star_instant`].
    pub fn star_instant_of(&self, k: usize, t_s: f64) -> Option<StarInstant> {
        match k {
            0 => Some(self.star_instant(t_s)),
            1 if self.companion().is_some() => Some(self.paired_star_instant(1, t_s)),
            _ => None,
        }
    }

    /// Every star's instant at `t_s`, primary first.
    pub fn star_instants(&self, t_s: f64) -> Vec<StarInstant> {
        (0..self.star_count())
            .filter_map(|k| self.star_instant_of(k, t_s))
            .collect()
    }

    /// Star `k` seen from `place` at `t_s` (`None` for a star the world does not have).
    pub fn star_position_of(&self, k: usize, t_s: f64, place: Place) -> Option<StarPosition> {
        self.star_instant_of(k, t_s)
            .map(|i| self.star_position_at(&i, place))
    }

    /// Position of star `k` relative to the planet's centre at `t_s`, ecliptic frame, metres.
    pub fn star_vector_m(&self, k: usize, t_s: f64) -> Option<DVec3> {
        let o = self.orbit().state_at(t_s);
        let (sl, cl) = o.star_longitude_sin_cos;
        let focus = DVec3::new(cl, sl, 0.0) * (self.semi_major_axis_m() * o.distance_factor);
        match (k, self.companion()) {
            (0, None) => Some(focus),
            (0 | 1, Some(c)) => Some(focus + c.pair.offsets_from_focus_m(t_s)[k]),
            _ => None,
        }
    }

    /// Star `k`'s instant on a world with a companion, from its ecliptic vector.
    pub(crate) fn paired_star_instant(&self, k: usize, t_s: f64) -> StarInstant {
        let o = self.orbit().state_at(t_s);
        let v = self.star_vector_m(k, t_s).unwrap_or(DVec3::X);
        let d = v.length();
        let u = v / d;
        let eq = equatorial_from_ecliptic(u, self.spin().tilt_rad);
        let sin_dec = eq.z.clamp(-1.0, 1.0);
        let cos_dec = (1.0 - sin_dec * sin_dec).sqrt();
        let ra = wrap_tau(eq.y.atan2(eq.x));
        let distance_factor = d / self.semi_major_axis_m();
        let flux = self.flux_at_mean_distance_of_w_m2(k).unwrap_or(0.0);
        let radius = self.star_radius_of_m(k).unwrap_or(0.0);
        StarInstant {
            t_s,
            ecliptic_longitude_rad: wrap_tau(u.y.atan2(u.x)),
            star_mean_longitude_rad: o.star_mean_longitude_rad,
            declination_rad: sin_dec.asin(),
            right_ascension_rad: ra,
            distance_factor,
            distance_au: self.spec().orbit.semi_major_axis_au * distance_factor,
            sidereal_angle_rad: self.spin().sidereal_angle_rad(t_s),
            equation_of_time_rad: wrap_pi(
                self.spin().sense.sign() * (o.star_mean_longitude_rad - ra),
            ),
            toa_flux_w_m2: flux / (distance_factor * distance_factor),
            angular_radius_rad: small_asin((radius / d).min(1.0)),
            star: k,
            ecliptic_latitude_rad: u.z.clamp(-1.0, 1.0).asin(),
            sin_declination: sin_dec,
            cos_declination: cos_dec,
        }
    }

    /// Top-of-atmosphere insolation on a horizontal surface at `place` and `t_s` from every
    /// star, W m⁻²: `Σ_k F_k cos z_k · (1 − hidden_k)`, each star's transmission from the
    /// occlusion seam (moons and the other star). On a one-star world this is
    /// [`Planet::top_of_atmosphere_insolation_w_m2`] of [`Planet::star_instant`].
    pub fn total_top_of_atmosphere_insolation_w_m2(&self, t_s: f64, place: Place) -> f64 {
        (0..self.star_count())
            .filter_map(|k| self.star_instant_of(k, t_s))
            .map(|i| self.top_of_atmosphere_insolation_w_m2(&i, place))
            .sum()
    }

    /// The band-mean (zonal-mean) top-of-atmosphere insolation at `latitude_rad` at the
    /// instant `t_s`, summed over the stars, W m⁻²: for each star Berger's daily-mean formula
    /// with that star's declination and flux, which is exactly the mean over all longitudes of
    /// a latitude circle at one instant (the hour angle runs over every value around the
    /// circle), times the fraction of the star the other star leaves visible from the planet's
    /// centre (the same for every place to within the planet's parallax).
    pub fn band_mean_insolation_at_w_m2(&self, t_s: f64, latitude_rad: f64) -> f64 {
        let instants = self.star_instants(t_s);
        instants
            .iter()
            .map(|i| {
                let hidden = self.star_hidden_from_centre(i, &instants);
                crate::insolation::daily_mean_w_m2(
                    i.toa_flux_w_m2,
                    latitude_rad,
                    i.declination_rad,
                    1.0,
                ) * (1.0 - hidden)
            })
            .sum()
    }

    /// Fraction of star `instant.star` hidden by a nearer star of `all`, seen from the planet's
    /// centre.
    pub(crate) fn star_hidden_from_centre(
        &self,
        instant: &StarInstant,
        all: &[StarInstant],
    ) -> f64 {
        let mut hidden: f64 = 0.0;
        for other in all {
            if other.star == instant.star || other.distance_factor >= instant.distance_factor {
                continue;
            }
            let (a, b) = (ecliptic_unit(instant), ecliptic_unit(other));
            let elongation = crate::moons::angle_between(a, b);
            hidden = hidden.max(crate::light::covered_fraction(
                instant.angular_radius_rad,
                other.angular_radius_rad,
                elongation,
            ));
        }
        hidden.min(1.0)
    }

    /// Daily-mean top-of-atmosphere insolation at `latitude_rad` over the day centred on
    /// `t_s` on a world with a shining companion, W m⁻²: the band mean
    /// ([`Planet::band_mean_insolation_at_w_m2`]) averaged by the midpoint rule over
    /// [`DAILY_MEAN_NODES`] instants of the day (the pair moves within a day, so the one-star
    /// shortcut of taking declination and distance once does not hold).
    pub fn two_star_daily_mean_insolation_w_m2(&self, t_s: f64, latitude_rad: f64) -> f64 {
        let day = self.day_s();
        let n = DAILY_MEAN_NODES as f64;
        (0..DAILY_MEAN_NODES)
            .map(|j| {
                let t = t_s + day * ((j as f64 + 0.5) / n - 0.5);
                self.band_mean_insolation_at_w_m2(t, latitude_rad)
            })
            .sum::<f64>()
            / n
    }
}

/// Unit vector toward a star, ecliptic frame.
pub(crate) fn ecliptic_unit(instant: &StarInstant) -> DVec3 {
    let (sl, cl) = instant.ecliptic_longitude_rad.sin_cos();
    let (sb, cb) = instant.ecliptic_latitude_rad.sin_cos();
    DVec3::new(cb * cl, cb * sl, sb)
}

#[cfg(test)]
mod tests;
