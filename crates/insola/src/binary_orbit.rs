//! The two stars of a world with a companion: their mutual Keplerian orbit and where each
//! stands relative to the planet's orbital focus.
//!
//! # Frames and conventions
//!
//! Vectors are in the planet's ecliptic frame (x toward the northward equinox direction, z
//! along the planet's orbital angular momentum), metres. The planet's own orbit (the world's
//! `orbit` section, [`crate::orbit::Orbit`]) is about its *focus*: the barycentre of the pair
//! for a circumbinary world, the primary for a wide pair. Seen from the planet the focus stands
//! at `r (cos λ, sin λ, 0)` with λ and `r` from that orbit; each star stands at that vector
//! plus its offset from the focus ([`StellarPair::offsets_from_focus_m`]).
//!
//! The pair's relative orbit (companion minus primary) is the Keplerian ellipse of
//! [`crate::world::StellarOrbitSpec`]: with the eccentric anomaly `E` from Kepler's equation
//! (the same solver as the planet's orbit), the position in the orbital plane is
//! `(a (cos E − e), a √(1 − e²) sin E, 0)` from the primary, periapsis on the x′ axis; it is
//! turned into the ecliptic frame by `R_z(Ω) R_x(i) R_z(ω)` with `ω = ϖ − Ω` (argument of
//! periapsis), the standard orbital-element rotation (Murray & Dermott, *Solar System
//! Dynamics*, eq. 2.122). Barycentre: the primary sits at `−m₂/(m₁+m₂)` of the relative vector
//! from it, the companion at `+m₁/(m₁+m₂)` (the two-body reduction, any mechanics text).
//!
//! Index 0 is the primary (the world's `star`), 1 the companion.

use glam::DVec3;

use crate::constants::{SUN_LUMINOSITY_W, SUN_RADIUS_M};
use crate::orbit::solve_kepler_sin_cos;
use crate::world::{CompanionArrangement, CompanionSpec, StarSpec};

/// The two stars' mutual orbit and the companion's own constants, precomputed.
#[derive(Debug, Clone, PartialEq)]
pub struct StellarPair {
    /// Circumbinary or wide.
    pub arrangement: CompanionArrangement,
    /// Primary's mass, solar masses.
    pub primary_mass_m_sun: f64,
    /// Companion's mass, solar masses.
    pub companion_mass_m_sun: f64,
    /// Period of the pair, seconds.
    pub period_s: f64,
    /// Semi-major axis of the relative orbit, metres.
    pub separation_m: f64,
    /// Eccentricity of the relative orbit.
    pub eccentricity: f64,
    /// Mean anomaly at time zero, radians.
    pub mean_anomaly_at_zero_rad: f64,
    /// Columns of `R_z(Ω) R_x(i) R_z(ω)`: the ecliptic directions of the orbital plane's
    /// periapsis axis x′ and of y′ (a quarter turn ahead in the direction of motion).
    axes: [DVec3; 2],
    /// Companion's luminosity, watts.
    pub companion_luminosity_w: f64,
    /// Companion's radius, metres.
    pub companion_radius_m: f64,
}

impl StellarPair {
    /// Builds the pair of a validated companion section; `primary` is the world's `star`.
    pub fn new(companion: &CompanionSpec, primary: &StarSpec) -> StellarPair {
        let m1 = primary.mass_m_sun.unwrap_or(1.0);
        let m2 = companion.star.mass_m_sun.unwrap_or(1.0);
        let o = &companion.orbit;
        let resolved = o.resolve(m1 + m2);
        let node = o.ascending_node_deg.to_radians();
        let inc = o.inclination_deg.to_radians();
        let arg = o.periapsis_longitude_deg.to_radians() - node;
        let (so, co) = arg.sin_cos();
        let (si, ci) = inc.sin_cos();
        let (sn, cn) = node.sin_cos();
        // R_z(Ω) R_x(i) R_z(ω) applied to x′ = (1, 0, 0) and y′ = (0, 1, 0).
        let x_axis = DVec3::new(cn * co - sn * so * ci, sn * co + cn * so * ci, so * si);
        let y_axis = DVec3::new(-cn * so - sn * co * ci, -sn * so + cn * co * ci, co * si);
        StellarPair {
            arrangement: companion.arrangement,
            primary_mass_m_sun: m1,
            companion_mass_m_sun: m2,
            period_s: resolved.period_s,
            separation_m: resolved.separation_m,
            eccentricity: o.eccentricity,
            mean_anomaly_at_zero_rad: o.phase_at_zero_deg.to_radians(),
            axes: [x_axis, y_axis],
            companion_luminosity_w: companion.star.luminosity_l_sun.unwrap_or(0.0)
                * SUN_LUMINOSITY_W,
            companion_radius_m: companion.star.radius_r_sun * SUN_RADIUS_M,
        }
    }

    /// The companion relative to the primary at `t_s`, ecliptic frame, metres.
    pub fn relative_position_m(&self, t_s: f64) -> DVec3 {
        let frac = crate::angle::cycle_fraction(t_s, self.period_s);
        let m = self.mean_anomaly_at_zero_rad + std::f64::consts::TAU * frac;
        let e = self.eccentricity;
        let (_, se, ce) = solve_kepler_sin_cos(m, e);
        let a = self.separation_m;
        let x = a * (ce - e);
        let y = a * (1.0 - e * e).sqrt() * se;
        self.axes[0] * x + self.axes[1] * y
    }

    /// Offsets of the primary and the companion from the planet's orbital focus at `t_s`,
    /// metres: the barycentre split for a circumbinary pair, `(0, relative)` for a wide one.
    pub fn offsets_from_focus_m(&self, t_s: f64) -> [DVec3; 2] {
        let rel = self.relative_position_m(t_s);
        match self.arrangement {
            CompanionArrangement::Circumbinary => {
                let total = self.primary_mass_m_sun + self.companion_mass_m_sun;
                [
                    -rel * (self.companion_mass_m_sun / total),
                    rel * (self.primary_mass_m_sun / total),
                ]
            }
            CompanionArrangement::Wide => [DVec3::ZERO, rel],
        }
    }

    /// `true` if the companion gives any light.
    pub fn companion_shines(&self) -> bool {
        self.companion_luminosity_w > 0.0
    }
}

/// The companion star as the sky queries need it: the pair's orbit, the companion's light
/// model (its own temperature through the world's atmosphere) and its flux scale.
#[derive(Debug, Clone)]
pub struct CompanionStar {
    /// The mutual orbit.
    pub pair: StellarPair,
    /// The companion's flux at the planet's semi-major axis, `L₂ / (4π a²)`, W m⁻² (its flux at
    /// a distance `d` is this times `(a/d)²`).
    pub flux_at_mean_distance_w_m2: f64,
    /// The spectral light model of the companion.
    pub light_model: crate::light::StarLightModel,
}

impl CompanionStar {
    /// Builds the companion of a validated world; `semi_major_axis_m` is the planet's.
    pub fn new(
        companion: &CompanionSpec,
        primary: &StarSpec,
        atmosphere: &crate::light::AtmosphereSpec,
        semi_major_axis_m: f64,
    ) -> Result<CompanionStar, crate::SpecError> {
        let pair = StellarPair::new(companion, primary);
        // The disc size the horizon fade uses: seen from the planet's mean distance for a
        // circumbinary pair, from the pair's separation for a wide one (its typical distance).
        let typical_m = match pair.arrangement {
            CompanionArrangement::Circumbinary => semi_major_axis_m,
            CompanionArrangement::Wide => pair.separation_m,
        };
        let radius = (pair.companion_radius_m / typical_m).min(0.5).asin();
        let light_model =
            crate::light::StarLightModel::new(companion.star.temperature_k, atmosphere)
                .and_then(|m| m.with_star_angular_radius(radius))
                .map_err(|e| match e.field() {
                    Some("star.angular_radius_rad") => crate::SpecError::out_of_range(
                        "companion.star.radius_r_sun",
                        companion.star.radius_r_sun,
                        "a star disc seen from the planet at most 45° in radius",
                    ),
                    Some(f) if f.starts_with("star.") => crate::SpecError::out_of_range(
                        format!("companion.{f}"),
                        companion.star.temperature_k,
                        "a temperature the light model describes",
                    ),
                    _ => e,
                })?;
        let flux = pair.companion_luminosity_w
            / (4.0 * std::f64::consts::PI * semi_major_axis_m * semi_major_axis_m);
        Ok(CompanionStar {
            pair,
            flux_at_mean_distance_w_m2: flux,
            light_model,
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::WorldSpec;
    use crate::constants::{AU_M, SECONDS_PER_DAY};

    fn kepler_16() -> WorldSpec {
        WorldSpec::from_ron_str(include_str!("../worlds/reference/kepler-16.world.ron")).unwrap()
    }

    #[test]
    fn kepler_16_pair_period_separation_and_extremes() {
        let w = kepler_16();
        let pair = StellarPair::new(w.companion.as_ref().unwrap(), &w.star);
        // Doyle et al. 2011 Table 1: a = 0.22431 AU for P = 41.079 d (from memory).
        assert!((pair.separation_m / AU_M - 0.22431).abs() < 5e-4);
        assert!((pair.period_s / SECONDS_PER_DAY - 41.079).abs() < 1e-9);
        // Periapsis a(1 − e) at phase 0, apoapsis a(1 + e) half a period later.
        let a = pair.separation_m;
        let r0 = pair.relative_position_m(0.0).length();
        let r1 = pair.relative_position_m(pair.period_s / 2.0).length();
        assert!((r0 / (a * (1.0 - 0.159)) - 1.0).abs() < 1e-12, "{r0}");
        assert!((r1 / (a * (1.0 + 0.159)) - 1.0).abs() < 1e-12, "{r1}");
        // One period later the pair is back where it was.
        let back = pair.relative_position_m(pair.period_s);
        assert!((back - pair.relative_position_m(0.0)).length() < 1e-6 * a);
        // Coplanar: no height above the planet's orbital plane.
        assert!(pair.relative_position_m(1.0e6).z.abs() < 1e-6);
    }

    #[test]
    fn barycentre_stays_at_the_focus_sun_jupiter_example() {
        // Sun–Jupiter: Jupiter's mass 1/1047.35 of the Sun's, a = 5.2038 AU, so the barycentre
        // lies a · m_J/(m_S + m_J) = 742 000 km from the Sun's centre, 1.07 solar radii (NASA
        // Sun and Jupiter fact sheets; the "barycentre just outside the Sun" textbook example,
        // values from memory).
        let text = r#"(name: "Pairtest", star: (temperature_k: 5772, radius_r_sun: 1, luminosity_l_sun: 1, mass_m_sun: 1),
            orbit: (semi_major_axis_au: 40, eccentricity: 0, periapsis_longitude_deg: 0, period_days: 92370),
            spin: (obliquity_deg: 0, solar_day_hours: 24),
            companion: (star: (temperature_k: 1500, radius_r_sun: 0.10045, luminosity_l_sun: 0, mass_m_sun: 0.000954786),
                arrangement: Circumbinary, orbit: (separation_au: 5.2038, eccentricity: 0.0489)))"#;
        let w = WorldSpec::from_ron_str(text).unwrap();
        let pair = StellarPair::new(w.companion.as_ref().unwrap(), &w.star);
        for k in 0..12 {
            let t = k as f64 * pair.period_s / 12.0;
            let [sun, jupiter] = pair.offsets_from_focus_m(t);
            // m₁ r₁ + m₂ r₂ = 0: the barycentre does not move.
            let moment = sun * pair.primary_mass_m_sun + jupiter * pair.companion_mass_m_sun;
            assert!(moment.length() < 1e-9 * sun.length(), "{moment}");
        }
        let mean_offset_km = pair.separation_m * 0.000954786 / (1.0 + 0.000954786) / 1000.0;
        assert!(
            (mean_offset_km - 742_000.0).abs() < 2_000.0,
            "{mean_offset_km}"
        );
        assert!((mean_offset_km / 695_700.0 - 1.07).abs() < 0.01);
        // Jupiter's period 4332.59 d (fact sheet, from memory) from Kepler's third law.
        assert!((pair.period_s / SECONDS_PER_DAY / 4332.59 - 1.0).abs() < 2e-3);
    }

    #[test]
    fn inclined_orbit_rises_above_the_plane_at_a_quarter_from_the_node() {
        let text = r#"(name: "Tilt", star: (temperature_k: 5772, radius_r_sun: 1, luminosity_l_sun: 1, mass_m_sun: 1),
            orbit: (semi_major_axis_au: 1, eccentricity: 0, periapsis_longitude_deg: 0, period_days: 365.25),
            spin: (obliquity_deg: 0, solar_day_hours: 24),
            companion: (star: (temperature_k: 4000, radius_r_sun: 0.6, luminosity_l_sun: 0.1, mass_m_sun: 0.5),
                arrangement: Wide, orbit: (separation_au: 40, inclination_deg: 30, ascending_node_deg: 90,
                periapsis_longitude_deg: 90)))"#;
        let w = WorldSpec::from_ron_str(text).unwrap();
        let pair = StellarPair::new(w.companion.as_ref().unwrap(), &w.star);
        // Periapsis at the ascending node (ω = 0): at phase 0 the companion crosses the plane
        // toward +z at longitude 90°; a quarter period later it is highest, at sin 30° = 0.5 of
        // the radius (circular orbit).
        let p0 = pair.relative_position_m(0.0) / pair.separation_m;
        assert!(p0.z.abs() < 1e-12 && (p0.y - 1.0).abs() < 1e-12, "{p0}");
        let p1 = pair.relative_position_m(pair.period_s / 4.0) / pair.separation_m;
        assert!((p1.z - 0.5).abs() < 1e-9, "{p1}");
        assert_eq!(pair.offsets_from_focus_m(0.0)[0], DVec3::ZERO);
    }
}
