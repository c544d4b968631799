//! The default climate follows the world's own sky: an invented Earth-like world with no
//! `climate` section keeps a habitable global mean at any tilt, its warmest latitudes follow
//! the annual sunlight, and at high tilt its ice forms in low-latitude belts.

use std::sync::OnceLock;

use insola::climate::ClimateCycle;
use insola::insolation::pole_equator_crossover_obliquity_deg;
use insola::{Planet, WorldSpec};

/// Tilts of the sweep, degrees (every 15°: keeps debug test builds quick).
const TILTS_DEG: [f64; 7] = [0.0, 15.0, 30.0, 45.0, 60.0, 75.0, 90.0];

/// An invented Earth-like world (Sun-like star, 1 AU, circular orbit, 24 h day) at `tilt_deg`;
/// `extra` is appended to the world file (e.g. a `climate` section), empty for none.
fn world(tilt_deg: f64, extra: &str) -> Planet {
    let text = format!(
        "(name: \"Tilt trial\", star: (temperature_k: 5772, radius_r_sun: 1.0, luminosity_l_sun: 1.0),
          orbit: (semi_major_axis_au: 1.0, eccentricity: 0.0, periapsis_longitude_deg: 0, period_days: 365.25),
          spin: (obliquity_deg: {tilt_deg}, solar_day_hours: 24), {extra})"
    );
    Planet::new(&WorldSpec::from_ron_str(&text).expect("world parses")).expect("world is valid")
}

/// The default-climate sweep, computed once for all tests of this file.
fn sweep() -> &'static [(f64, ClimateCycle)] {
    static SWEEP: OnceLock<Vec<(f64, ClimateCycle)>> = OnceLock::new();
    SWEEP.get_or_init(|| {
        TILTS_DEG
            .iter()
            .map(|&t| {
                (
                    t,
                    world(t, "").equilibrate_climate().expect("climate settles"),
                )
            })
            .collect()
    })
}

/// Annual means of the band nearest the equator and of the northernmost band, °C.
fn equator_and_pole(c: &ClimateCycle) -> (f64, f64) {
    let s = c.band_stats();
    let eq = s
        .iter()
        .min_by(|a, b| a.lat_rad.abs().total_cmp(&b.lat_rad.abs()))
        .unwrap();
    (eq.mean_c, s.last().unwrap().mean_c)
}

#[test]
fn no_climate_section_stays_above_freezing_at_every_tilt() {
    // Published high-obliquity Earths are warm and largely ice-free (Williams & Kasting 1997,
    // from memory); here we ask only for a global annual mean above 0 °C at every tilt.
    for (tilt, c) in sweep() {
        let g = c.global_mean_c();
        assert!(g > 0.0, "tilt {tilt}°: global mean {g:.2} °C");
    }
}

#[test]
fn pole_is_warmer_than_equator_exactly_above_the_sunlight_crossover() {
    // Over a year the poles receive more sunlight than the equator above 53.9° of tilt (the
    // core's own crossover, checked in `insolation`); with the sky law the annual-mean
    // temperature follows. Tilts within 5° of the crossover are skipped: there the two are
    // within a degree of each other and heat transport decides.
    let crossover = pole_equator_crossover_obliquity_deg();
    assert!((crossover - 53.9).abs() < 0.1, "{crossover}");
    for (tilt, c) in sweep() {
        let (eq, pole) = equator_and_pole(c);
        if *tilt > crossover + 5.0 {
            assert!(pole > eq, "tilt {tilt}°: pole {pole:.2} equator {eq:.2}");
        } else if *tilt < crossover - 5.0 {
            assert!(pole < eq, "tilt {tilt}°: pole {pole:.2} equator {eq:.2}");
        }
    }
}

#[test]
fn sky_law_darkens_poles_that_see_a_high_sun() {
    // The albedo follows the sky: at low tilt the poles' low sun makes them brighter than the
    // equator (as Earth's explicit latitude term has it); above the crossover the polar sun
    // stands higher than the equator's over the year and the poles are the darker.
    for (tilt, c) in sweep() {
        let a = c.ice_free_albedo();
        let (eq, pole) = (a[a.len() / 2], a[a.len() - 1]);
        if *tilt < 45.0 {
            assert!(
                pole > eq,
                "tilt {tilt}°: albedo pole {pole:.3} equator {eq:.3}"
            );
        } else if *tilt > 60.0 {
            assert!(
                pole < eq,
                "tilt {tilt}°: albedo pole {pole:.3} equator {eq:.3}"
            );
        }
        assert!(a.iter().all(|v| (0.0..=0.62).contains(v)), "tilt {tilt}°");
    }
}

#[test]
fn high_tilt_ice_forms_in_a_low_latitude_belt() {
    // Energy-balance studies of high obliquity find ice, where it forms, as belts at low
    // latitudes rather than polar caps (Rose, Cronin & Bitz 2017, from memory). Checked: a
    // colder 90° world (hazier sky 0.38, ice albedo 0.45 — with the default 0.62 this model
    // passes straight from ice-free to a snowball at high tilt) has ice, every band iced for
    // most of the year lies within 30° of the equator, and bands poleward of 60° never ice.
    let c = world(90.0, "climate: (atmosphere_albedo: 0.38, ice_albedo: 0.45)")
        .equilibrate_climate()
        .expect("climate settles");
    assert!(c.ice_area_fraction() > 0.05, "{}", c.ice_area_fraction());
    for s in c.band_stats() {
        let lat = s.lat_rad.to_degrees();
        if s.ice_fraction_of_year > 0.5 {
            assert!(lat.abs() < 30.0, "iced band at {lat:.1}°");
        }
        if lat.abs() > 60.0 {
            assert_eq!(s.ice_fraction_of_year, 0.0, "polar band at {lat:.1}°");
        }
    }
}

#[test]
fn files_with_albedo_fields_keep_their_explicit_law() {
    // The Earth reference world (validation only) keeps its calibrated latitude law, so its
    // checks in `climate_earth.rs` run with the parameters they were tuned with.
    let path = concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/../../assets/reference-worlds/earth.world.ron"
    );
    let earth = Planet::new(&WorldSpec::from_path(path).unwrap()).unwrap();
    assert_eq!(
        earth.climate_spec().ice_free_albedo,
        insola::climate::IceFreeAlbedo::legendre(0.31, 0.10)
    );
    assert_eq!(
        world(30.0, "").climate_spec().ice_free_albedo,
        insola::climate::IceFreeAlbedo::default()
    );
}
