//! Moon checks: geometry, light, eclipses, rise and set, limits.

use super::synodic_period_s;
use crate::Planet;
use crate::light::illuminated_fraction;
use crate::lighting::LightMode;
use crate::sky::Place;
use crate::world::{BodySpec, WorldSpec};

fn world(moon: &str) -> Planet {
    let text = format!(
        r#"(name: "Moonlit", star: (temperature_k: 5772, radius_r_sun: 1, flux_at_mean_distance_w_m2: 1361),
           orbit: (semi_major_axis_au: 1, eccentricity: 0, periapsis_longitude_deg: 0, period_days: 360),
           spin: (obliquity_deg: 0, solar_day_hours: 24),
           moons: [{moon}])"#
    );
    Planet::new(&WorldSpec::from_ron_str(&text).unwrap()).unwrap()
}

#[test]
fn full_moon_at_midnight_overhead_and_lit() {
    // Phase 180 at time zero, prime meridian at midnight: the full moon stands at the zenith
    // of the equator (parallax of ~1° at this distance).
    let p = world(r#"(name: "Pale", radius_km: 1700, distance_km: 380000, period_days: 27)"#);
    let place = Place::from_degrees(0.0, 0.0).unwrap();
    let i = p.star_instant(0.0);
    let v = p.moon_view(&i, 0, place).unwrap();
    assert!(
        v.altitude_rad.to_degrees() > 88.0,
        "{}",
        v.altitude_rad.to_degrees()
    );
    assert!(v.phase_angle_rad.to_degrees() < 1.5);
    // In the planet's shadow: a total lunar eclipse (orbit in the ecliptic).
    assert!(v.shadow_fraction > 0.99, "{}", v.shadow_fraction);
    let l = p.moon_lighting(&i, place, LightMode::TopOfAtmosphere);
    assert!(l[0].light.illuminance_lux < 1e-3);
    assert!(l[0].illuminated_fraction > 0.999);
}

#[test]
fn new_moon_eclipses_the_star_at_noon() {
    // Phase 0 and a moon as large in the sky as the star: at local noon on the equator the
    // star's disc is covered.
    let p = world(
        r#"(name: "Shade", radius_km: 1800, distance_km: 380000, period_days: 27, phase_at_zero_deg: 0)"#,
    );
    let place = Place::from_degrees(0.0, 180.0).unwrap();
    let i = p.star_instant(0.0);
    let v = p.moon_view(&i, 0, place).unwrap();
    assert!(
        v.elongation_rad.to_degrees() < 0.3,
        "{}",
        v.elongation_rad.to_degrees()
    );
    assert!(
        v.star_covered_fraction > 0.99,
        "{}",
        v.star_covered_fraction
    );
    let light = p.lighting(0.0, place, LightMode::Ground);
    assert!(light.star_eclipse_fraction > 0.99);
    assert!(
        light.star.illuminance_lux
            < 0.01 * p.light_model().direct_beam(1.5, 1361.0).illuminance_lux
    );
    // Far from the shadow's path the star is whole.
    let far = p.star_eclipse_fraction(&i, Place::from_degrees(60.0, 180.0).unwrap());
    assert_eq!(far, 0.0);
}

#[test]
fn quarter_moon_is_half_lit() {
    let p = world(
        r#"(name: "Half", radius_km: 1700, distance_km: 380000, period_days: 27, phase_at_zero_deg: 90)"#,
    );
    let v = p
        .moon_view(
            &p.star_instant(0.0),
            0,
            Place::from_degrees(0.0, 0.0).unwrap(),
        )
        .unwrap();
    let k = illuminated_fraction(v.phase_angle_rad);
    assert!((k - 0.5).abs() < 0.02, "{k}");
}

#[test]
fn moon_inside_planet_or_too_far_is_rejected() {
    let text = |d: f64| {
        format!(
            r#"(name: "M", star: (temperature_k: 5772, radius_r_sun: 1, flux_at_mean_distance_w_m2: 1361),
               orbit: (semi_major_axis_au: 1, eccentricity: 0, periapsis_longitude_deg: 0, period_days: 360),
               spin: (obliquity_deg: 0, solar_day_hours: 24),
               moons: [(name: "X", radius_km: 100, distance_km: {d}, period_days: 3)])"#
        )
    };
    let inside = WorldSpec::from_ron_str(&text(5000.0)).unwrap_err();
    assert_eq!(inside.field(), Some("moons[0].distance_km"));
    let far = WorldSpec::from_ron_str(&text(5.0e6)).unwrap_err();
    assert_eq!(far.field(), Some("moons[0].distance_km"));
    assert!(far.to_string().contains("Hill"));
}

#[test]
fn moon_rises_and_sets_about_once_a_day() {
    let p = world(r#"(name: "Pale", radius_km: 1700, distance_km: 380000, period_days: 27)"#);
    let place = Place::from_degrees(20.0, 0.0).unwrap();
    let mut out = Vec::new();
    p.moon_altitude_crossings_into(
        0,
        place,
        0.0,
        10.0 * 86_400.0,
        p.moon_rise_altitude_rad(0),
        &mut out,
    );
    // A moon of 27 days over a 24-hour day rises once per 1/(1/24 h − 1/27 d) ≈ 24.9 h.
    let rises = out.iter().filter(|c| c.rising).count();
    assert!((9..=10).contains(&rises), "{rises}");
    for w in out.windows(2) {
        assert!(w[0].t_s < w[1].t_s && w[0].rising != w[1].rising);
    }
}

#[test]
fn earth_hill_radius() {
    // Earth's Hill sphere is about 1.5 million km (standard figure; from memory).
    let h = BodySpec::default().hill_radius_km(1.0);
    assert!((h - 1.5e6).abs() < 0.05e6, "{h}");
}

#[test]
fn synodic_month() {
    // Earth's Moon: sidereal 27.321661 d, year 365.256363 d → synodic 29.530589 d (published
    // mean synodic month; from memory).
    let p = synodic_period_s(27.321_661, 365.256_363);
    assert!((p - 29.530_589).abs() < 1e-3, "{p}");
}
