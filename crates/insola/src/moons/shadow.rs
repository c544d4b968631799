//! How far a moon is from the planet's shadow, and how fast that can change: what the event
//! finder walks along to find each moon eclipse.

use crate::orbit::OrbitExtremes;
use crate::planet::Planet;
use crate::search::OccluderMotion;

/// Safety factor on the rate bound (common practice, no source).
const SHADOW_RATE_MARGIN: f64 = 1.25;

impl Planet {
    /// Angular gap between the planet's disc and the star's seen from moon `index` at world
    /// time `t_s`, radians: negative exactly while the planet's shadow dims the moon
    /// ([`crate::moons::MoonView::shadow_fraction`] `> 0`); `+∞` for a bad index. The same
    /// for every place on the planet.
    pub fn moon_shadow_clearance_rad(&self, index: usize, t_s: f64) -> f64 {
        let Some(orbit) = self.moon_orbits().get(index) else {
            return f64::INFINITY;
        };
        let g = self.shadow_geometry(&self.star_instant(t_s), orbit.position_at(t_s));
        g.separation_rad - g.star_radius_rad - g.planet_radius_rad
    }

    /// Bounds on how fast [`Planet::moon_shadow_clearance_rad`] can change (`None` for a bad
    /// index).
    pub fn moon_shadow_motion(&self, index: usize) -> Option<OccluderMotion> {
        let orbit = self.moon_orbits().get(index)?;
        let planet_r = self.body().radius_km * 1000.0;
        let moon = OrbitExtremes::of(orbit.distance_m, orbit.eccentricity, orbit.period_s);
        let ours = OrbitExtremes::of(
            self.semi_major_axis_m(),
            self.spec().orbit.eccentricity,
            self.year_s(),
        );
        // Seen from the moon, the planet's direction turns at most at the moon's fastest
        // angular rate and the star's at (the two orbital speeds) / (the nearest the star can
        // be); each angular radius changes at most by (radius × those rates).
        let planet_dir = moon.fastest_rad_s;
        let star_dir =
            (ours.fastest_m_s + moon.fastest_m_s) / (ours.closest_m - moon.farthest_m).max(1.0);
        let planet_r_max = crate::light::angular_radius(planet_r, moon.closest_m);
        let star_r_max = crate::light::angular_radius(
            self.star_radius_m(),
            (ours.closest_m - moon.farthest_m).max(self.star_radius_m()),
        );
        let radial = moon.fastest_m_s / moon.closest_m;
        let rate = (planet_dir + star_dir + planet_r_max * radial + star_r_max * star_dir)
            * SHADOW_RATE_MARGIN;
        let contact = crate::light::angular_radius(planet_r, moon.farthest_m)
            + crate::light::angular_radius(self.star_radius_m(), ours.farthest_m + moon.farthest_m);
        Some(OccluderMotion {
            max_rate_rad_s: rate,
            min_contact_rad: contact,
            longest_s: crate::moons::synodic_period_s(orbit.period_s, self.year_s())
                .min(self.year_s()),
        })
    }
}
