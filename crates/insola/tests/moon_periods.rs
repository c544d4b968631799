//! Moons with periods from hours to years on one invented world: every output finite, rises
//! and sets alternating at the rate the standard synodic-day formula gives, moons faster than
//! the planet's turn rising in the west, and phases following the synodic month.

use std::f64::consts::PI;

use insola::lighting::LightMode;
use insola::{Place, Planet, WorldSpec};

/// Quillmere: an invented world of 10 Earth masses at 6 AU from a bright star of 1.8 solar
/// masses (an 11-year orbit, Hill sphere about 16 million km), with three moons whose periods
/// follow Kepler's third law for their distances (T = 2π √(a³/GM), GM of Earth
/// 3.986 × 10¹⁴ m³/s²; from memory): 2.5 hours, 9.2 days and 2 years.
const QUILLMERE: &str = r#"(
    name: "Quillmere",
    star: (temperature_k: 7500, radius_r_sun: 3.2, luminosity_l_sun: 29),
    orbit: (semi_major_axis_au: 6.0, eccentricity: 0.03, periapsis_longitude_deg: 40, period_days: 4000),
    spin: (obliquity_deg: 15, solar_day_hours: 30),
    body: (radius_km: 12000, mass_earth: 10, star_mass_m_sun: 1.8),
    moons: [
        (name: "Skerrin", radius_km: 200, distance_km: 20000, period_days: 0.103),
        (name: "Orrisk", radius_km: 1500, distance_km: 400000, period_days: 9.2, inclination_deg: 4),
        (name: "Oldwane", radius_km: 2500, distance_km: 7500000, period_days: 748, inclination_deg: 2),
    ],
)"#;

const DAY_S: f64 = 86_400.0;

fn quillmere() -> Planet {
    Planet::new(&WorldSpec::from_ron_str(QUILLMERE).expect("valid world")).expect("valid world")
}

/// Rises per standard day of a moon of sidereal period `period_days` over a planet turning
/// once per `sidereal_day_s`: the moon's sky turns at 1/P_sky = |1/P_rotation − 1/P_moon|
/// (the synodic-day relation, standard).
fn rises_per_day(planet: &Planet, period_days: f64) -> f64 {
    (DAY_S / planet.spin().sidereal_day_s - 1.0 / period_days).abs()
}

#[test]
fn every_moon_output_is_finite_over_years() {
    let p = quillmere();
    let place = Place::from_degrees(20.0, 10.0).unwrap();
    for k in 0..500 {
        let t = k as f64 * 7.77 * DAY_S;
        let i = p.star_instant(t);
        for m in 0..3 {
            let v = p.moon_view(&i, m, place).expect("moon exists");
            for x in [
                v.altitude_rad,
                v.azimuth_rad,
                v.distance_m,
                v.angular_radius_rad,
                v.phase_angle_rad,
                v.elongation_rad,
                v.star_covered_fraction,
                v.shadow_fraction,
            ] {
                assert!(x.is_finite(), "moon {m} at {t}");
            }
            assert!((v.direction_enu.length() - 1.0).abs() < 1e-12);
        }
        for light in p.moon_lighting(&i, place, LightMode::Ground) {
            assert!(light.light.illuminance_lux.is_finite() && light.light.illuminance_lux >= 0.0);
        }
    }
}

#[test]
fn rises_and_sets_alternate_at_the_synodic_day_rate() {
    let p = quillmere();
    let place = Place::from_degrees(0.0, 0.0).unwrap();
    // (moon, days to watch): a few of each moon's sky days.
    for (m, days) in [(0usize, 2.0), (1, 20.0), (2, 20.0)] {
        let period = p.spec().moons[m].period_days;
        let mut out = Vec::new();
        let threshold = p.moon_rise_altitude_rad(m);
        p.moon_altitude_crossings_into(m, place, 0.0, days * DAY_S, threshold, &mut out);
        assert!(
            out.windows(2).all(|w| w[0].t_s < w[1].t_s),
            "moon {m}: in time order"
        );
        assert!(
            out.windows(2).all(|w| w[0].rising != w[1].rising),
            "moon {m}: alternate"
        );
        let rises = out.iter().filter(|c| c.rising).count() as f64;
        let expected = rises_per_day(&p, period) * days;
        assert!(
            (rises - expected).abs() <= 1.5,
            "moon {m}: {rises} rises in {days} days, expected {expected:.1}"
        );
    }
}

#[test]
fn a_moon_faster_than_the_planet_turns_rises_in_the_west() {
    // Skerrin goes round in 2.5 hours, the planet in 30: Skerrin overtakes the sky's turning and so
    // crosses it from west to east (as Mars's moon Phobos does; from memory).
    let p = quillmere();
    let place = Place::from_degrees(0.0, 0.0).unwrap();
    let mut out = Vec::new();
    p.moon_altitude_crossings_into(
        0,
        place,
        0.0,
        2.0 * DAY_S,
        p.moon_rise_altitude_rad(0),
        &mut out,
    );
    let rises: Vec<f64> = out.iter().filter(|c| c.rising).map(|c| c.t_s).collect();
    assert!(rises.len() >= 4);
    for t in rises {
        let v = p.moon_view(&p.star_instant(t), 0, place).unwrap();
        // Azimuth from north through east: the western half is 180°–360°.
        assert!(
            v.azimuth_rad.sin() < -0.9,
            "Skerrin rose at azimuth {}°",
            v.azimuth_rad.to_degrees()
        );
    }
    // Orrisk (9.2 days) is slower than the sky and rises in the east.
    out.clear();
    p.moon_altitude_crossings_into(
        1,
        place,
        0.0,
        3.0 * DAY_S,
        p.moon_rise_altitude_rad(1),
        &mut out,
    );
    for c in out.iter().filter(|c| c.rising) {
        let v = p.moon_view(&p.star_instant(c.t_s), 1, place).unwrap();
        assert!(
            v.azimuth_rad.sin() > 0.9,
            "Orrisk rose at azimuth {}°",
            v.azimuth_rad.to_degrees()
        );
    }
}

#[test]
fn phases_follow_the_synodic_month_for_hours_days_and_years() {
    let p = quillmere();
    let place = Place::from_degrees(30.0, 0.0).unwrap();
    for m in 0..3 {
        let period_s = p.spec().moons[m].period_days * DAY_S;
        let synodic = insola::moons::synodic_period_s(period_s, p.year_s());
        let phase = |t: f64| {
            p.moon_view(&p.star_instant(t), m, place)
                .unwrap()
                .phase_angle_rad
        };
        // Full at time zero (the default phase), new half a synodic month later, full again
        // after one. Allowances: the phase angle is seen from the place, so parallax moves it
        // by up to the planet's angular radius seen from the moon (largest for Skerrin); an
        // inclined moon passes beside the star's line by up to its inclination; and the
        // synodic month is a mean, while the star's longitude runs ahead or behind its mean by
        // up to 2e (the equation of the centre's first term; standard).
        let parallax = (p.spec().body.unwrap().radius_km / p.spec().moons[m].distance_km).asin();
        let inclination = p.spec().moons[m].inclination_deg.to_radians();
        let slack = 0.02 + parallax + inclination + 2.0 * p.spec().orbit.eccentricity;
        assert!(phase(0.0) < slack, "moon {m} full at zero: {}", phase(0.0));
        assert!(
            phase(0.5 * synodic) > PI - slack,
            "moon {m} new: {}",
            phase(0.5 * synodic)
        );
        assert!(
            phase(synodic) < slack,
            "moon {m} full again: {}",
            phase(synodic)
        );
    }
}
