//! Fuzz the world-file loader: any bytes must give a world or a typed error, never a panic; a
//! world that loads must answer sky queries with finite values.
#![no_main]

use insola::lighting::LightMode;
use insola::{Place, Planet, WorldSpec};
use libfuzzer_sys::fuzz_target;

fuzz_target!(|data: &[u8]| {
    let Ok(text) = std::str::from_utf8(data) else { return };
    let Ok(spec) = WorldSpec::from_ron_str(text) else { return };
    let Ok(planet) = Planet::new(&spec) else { return };
    let place = Place { latitude_rad: 0.3, longitude_rad: 1.0 };
    for k in 0..4 {
        let t = k as f64 * planet.day_s() * 0.37;
        let l = planet.lighting(t, place, LightMode::Ground);
        assert!(l.star.illuminance_lux.is_finite() && l.sky.illuminance_lux.is_finite());
        assert!((l.star.direction_enu.length() - 1.0).abs() < 1e-9);
    }
    // Round trip: what we write, we read back.
    let again = WorldSpec::from_ron_str(&spec.to_ron_string()).expect("round trip");
    assert_eq!(again.name, spec.name);
});
