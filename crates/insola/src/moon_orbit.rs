//! A moon's fixed Keplerian orbit around the planet, precomputed from its spec.

use std::f64::consts::TAU;

use glam::DVec3;

use crate::orbit::{solve_kepler, true_anomaly_from_eccentric};
use crate::world::MoonSpec;

/// Precomputed orbit of one moon.
#[derive(Debug, Clone, PartialEq)]
pub struct MoonOrbit {
    /// Index in the world file.
    pub index: usize,
    /// Semi-major axis, metres.
    pub distance_m: f64,
    /// Radius, metres.
    pub radius_m: f64,
    /// Period, seconds.
    pub period_s: f64,
    /// Eccentricity.
    pub eccentricity: f64,
    /// Mean anomaly at time zero, radians.
    pub mean_anomaly_at_zero_rad: f64,
    /// Orbital-plane basis in the ecliptic frame: toward periapsis and 90° ahead of it.
    pub p_axis: DVec3,
    /// Second basis vector of the orbital plane (in the direction of motion at periapsis).
    pub q_axis: DVec3,
}

impl MoonOrbit {
    /// Builds the orbit of moon `index`; the phase at zero is taken against the star's
    /// ecliptic longitude at time zero, `star_longitude_0`.
    pub fn new(index: usize, spec: &MoonSpec, star_longitude_0: f64) -> MoonOrbit {
        let (i, node, w) = (
            spec.inclination_deg.to_radians(),
            spec.ascending_node_deg.to_radians(),
            spec.periapsis_argument_deg.to_radians(),
        );
        let (sn, cn) = node.sin_cos();
        let (si, ci) = i.sin_cos();
        let (sw, cw) = w.sin_cos();
        // Standard perifocal-to-ecliptic rotation R_z(Ω) R_x(i) R_z(ω).
        let p = DVec3::new(cn * cw - sn * sw * ci, sn * cw + cn * sw * ci, sw * si);
        let q = DVec3::new(-cn * sw - sn * cw * ci, -sn * sw + cn * cw * ci, cw * si);
        let mut orbit = MoonOrbit {
            index,
            distance_m: spec.distance_km * 1000.0,
            radius_m: spec.radius_km * 1000.0,
            period_s: spec.period_days * crate::constants::SECONDS_PER_DAY,
            eccentricity: spec.eccentricity,
            mean_anomaly_at_zero_rad: 0.0,
            p_axis: p,
            q_axis: q,
        };
        // The phase is counted along the orbit: orbit longitude Ω + ω + v equals the star's
        // longitude plus the phase (the ecliptic longitude for small inclinations).
        let v0 = star_longitude_0 + spec.phase_at_zero_deg.to_radians() - node - w;
        orbit.mean_anomaly_at_zero_rad =
            crate::orbit::mean_anomaly_from_true(v0, spec.eccentricity);
        orbit
    }

    /// Position relative to the planet's centre, ecliptic frame, metres.
    pub fn position_at_mean_anomaly(&self, mean_anomaly_rad: f64) -> DVec3 {
        let e = self.eccentricity;
        let ecc = solve_kepler(mean_anomaly_rad, e);
        let v = true_anomaly_from_eccentric(ecc, e);
        let r = self.distance_m * (1.0 - e * ecc.cos());
        let (sv, cv) = v.sin_cos();
        (self.p_axis * cv + self.q_axis * sv) * r
    }

    /// Position relative to the planet's centre at world time `t_s`, ecliptic frame, metres.
    pub fn position_at(&self, t_s: f64) -> DVec3 {
        let frac = crate::angle::cycle_fraction(t_s, self.period_s);
        self.position_at_mean_anomaly(self.mean_anomaly_at_zero_rad + TAU * frac)
    }
}

/// Synodic period (new moon to new moon) of a moon of sidereal period `moon_period_s` around
/// a planet of year `year_s`, seconds: `1/P_syn = 1/P_moon − 1/P_year` (standard; prograde
/// orbits). Infinite when the two match.
pub fn synodic_period_s(moon_period_s: f64, year_s: f64) -> f64 {
    let rate = 1.0 / moon_period_s - 1.0 / year_s;
    if rate.abs() < 1e-18 {
        f64::INFINITY
    } else {
        (1.0 / rate).abs()
    }
}
