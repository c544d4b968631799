//! The climate model on the Earth reference world (`assets/reference-worlds/earth.world.ron`,
//! a marked validation reference, not game content), with the calibrated `climate` section.

use insola::{Place, Planet, WorldSpec};

fn earth() -> Planet {
    let path = concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/../../assets/reference-worlds/earth.world.ron"
    );
    Planet::new(&WorldSpec::from_path(path).expect("reference world loads")).expect("valid")
}

#[test]
fn global_annual_mean_is_fourteen_to_fifteen_degrees() {
    // Global annual-mean surface air temperature 14.0–15.1 °C from historical zonal tables
    // (Kramm et al. 2020, read in the abstract); we ask for 14–15 °C.
    let c = earth().equilibrate_climate().unwrap();
    assert!(c.converged());
    let g = c.global_mean_c();
    assert!((14.0..=15.0).contains(&g), "global mean {g:.2} °C");
}

#[test]
fn zonal_profile_within_five_degrees_of_observed() {
    // Annual zonal-mean surface air temperature of Earth, °C — from memory, not confirmed
    // against a table, hence the wide ±5 °C band. The South Pole (−49 °C) is checked
    // separately below because it is the top of an ice sheet.
    let expected = [
        (0.0, 26.0),
        (30.0, 20.0),
        (-30.0, 17.0),
        (45.0, 10.0),
        (60.0, 0.0),
        (-60.0, -2.0),
        (75.0, -13.0),
        (90.0, -20.0),
    ];
    let c = earth().equilibrate_climate().unwrap();
    let means: Vec<f64> = c.band_stats().iter().map(|s| s.mean_c).collect();
    for (lat, want) in expected {
        let got = c.grid().interpolate(&means, f64::to_radians(lat));
        assert!(
            (got - want).abs() <= 5.0,
            "{lat}°: model {got:.1} °C, observed {want} °C"
        );
    }
}

#[test]
fn south_pole_at_ice_sheet_altitude() {
    // The South Pole's annual mean of about −49 °C (from memory) is measured on the ice sheet
    // at about 2800 m (from memory). The model has no continents, so the place is given that
    // elevation and the standard lapse rate of 6.5 K/km (ICAO standard atmosphere, from memory)
    // does part of the work. What remains — the strong surface inversion over the plateau and
    // the bright, dry ice sheet — is outside a zonal energy balance model, so the ±5 °C band is
    // not asked for here (the model lands near −35 °C). Checked instead: the elevation makes
    // the pole at least 15 K colder than sea level and the result is well below the
    // sea-level North Pole.
    let p = earth();
    let c = p.equilibrate_climate().unwrap();
    let pole = Place::from_degrees(-90.0, 0.0).unwrap();
    let n = 487;
    let mean = |elevation_m: f64| {
        (0..n)
            .map(|i| {
                // Spread over the year and over the hours of the day.
                let t = (i as f64 + 0.5) / n as f64 * p.year_s();
                p.local_climate(&c, t, pole, elevation_m)
                    .unwrap()
                    .temperature_c
            })
            .sum::<f64>()
            / n as f64
    };
    let sea = mean(0.0);
    let plateau = mean(2800.0);
    assert!((sea - plateau - 18.2).abs() < 0.01, "{sea} {plateau}");
    assert!(plateau < -30.0 && plateau > -49.0 - 5.0, "{plateau}");
}

#[test]
fn ice_edge_and_seasons_look_like_earth() {
    // Annual-mean ice edge of the present climate near 70° in simple EBMs (climlab
    // `tests/test_ebm.py`: ±70° for its annual model); we accept 60–80°.
    let c = earth().equilibrate_climate().unwrap();
    let e = c.ice_edges();
    let n = e.north_lat_rad.unwrap().to_degrees();
    let s = e.south_lat_rad.unwrap().to_degrees();
    assert!(
        (60.0..80.0).contains(&n) && (-80.0..-60.0).contains(&s),
        "{n} {s}"
    );
}
