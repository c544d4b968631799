//! Fuzz the sky query: arbitrary (but valid-by-validation) worlds, places and times must give
//! finite, physically bounded answers without panicking.
#![no_main]

use arbitrary::Arbitrary;
use insola::lighting::LightMode;
use insola::{Place, Planet, WorldSpec};
use libfuzzer_sys::fuzz_target;

#[derive(Debug, Arbitrary)]
struct Input {
    obliquity_deg: f64,
    eccentricity: f64,
    periapsis_deg: f64,
    year_days: f64,
    day_hours: f64,
    temperature_k: f64,
    pressure_kpa: f64,
    lat_deg: f64,
    lon_deg: f64,
    t_s: f64,
}

fuzz_target!(|i: Input| {
    let text = format!(
        "(name: \"Fuzzed\", star: (temperature_k: {:?}, radius_r_sun: 1, luminosity_l_sun: 1), \
         orbit: (semi_major_axis_au: 1, eccentricity: {:?}, periapsis_longitude_deg: {:?}, period_days: {:?}), \
         spin: (obliquity_deg: {:?}, solar_day_hours: {:?}), atmosphere: (surface_pressure_kpa: {:?}))",
        i.temperature_k, i.eccentricity, i.periapsis_deg, i.year_days, i.obliquity_deg, i.day_hours, i.pressure_kpa
    );
    let Ok(spec) = WorldSpec::from_ron_str(&text) else { return };
    let Ok(planet) = Planet::new(&spec) else { return };
    let Ok(place) = Place::from_degrees(i.lat_deg, i.lon_deg) else { return };
    if !i.t_s.is_finite() || i.t_s.abs() > 1e13 {
        return;
    }
    let s = planet.star_position(i.t_s, place);
    assert!((s.direction_enu.length() - 1.0).abs() < 1e-9);
    let l = planet.lighting(i.t_s, place, LightMode::Ground);
    assert!(l.star.illuminance_lux >= 0.0 && l.star.illuminance_lux.is_finite());
    assert!(l.sky.illuminance_lux >= 0.0 && l.sky.illuminance_lux.is_finite());
    let ev = planet.day_events(3, place);
    assert!(ev.sunlight.time_above_s.is_finite());
});
