//! Property tests: time series at one place equal the scalar path for random worlds, places
//! and spans (1e-9 rad; insolation to 1e-9 of the star's flux).

use insola::angle::wrap_pi;
use insola::star_track::TrackTimes;
use insola::{Place, Planet, StarPosition, WorldSpec};
use proptest::prelude::*;

prop_compose! {
    fn any_planet()(
        obliquity in 0.0f64..=180.0,
        e in 0.0f64..0.95,
        peri in 0.0f64..360.0,
        year_days in 20.0f64..2000.0,
        day_frac in 0.001f64..0.9,
        locked in prop::bool::weighted(0.1),
    ) -> Planet {
        let obliquity = if locked { obliquity.min(90.0) } else { obliquity };
        let day = if locked {
            "tidally_locked: true".to_string()
        } else {
            format!("solar_day_hours: {}", (day_frac * year_days * 24.0).max(1.0))
        };
        let text = format!(
            r#"(name: "Random", star: (temperature_k: 5500, radius_r_sun: 1, luminosity_l_sun: 1),
               orbit: (semi_major_axis_au: 1, eccentricity: {e}, periapsis_longitude_deg: {peri}, period_days: {year_days}),
               spin: (obliquity_deg: {obliquity}, {day}))"#
        );
        Planet::new(&WorldSpec::from_ron_str(&text).expect("valid")).expect("valid")
    }
}

/// Largest difference from [`Planet::star_position`] over the series (see the unit tests of
/// `star_track` for why azimuth and hour angle are weighed as arcs on the sky).
fn worst(p: &Planet, place: Place, times: TrackTimes<'_>, got: &[StarPosition]) -> f64 {
    let mut worst: f64 = 0.0;
    for (k, g) in got.iter().enumerate() {
        let t = times.time_s(k);
        let want = p.star_position(t, place);
        let i = p.star_instant(t);
        worst = worst
            .max((g.altitude_rad - want.altitude_rad).abs())
            .max(wrap_pi(g.azimuth_rad - want.azimuth_rad).abs() * want.altitude_rad.cos())
            .max(wrap_pi(g.hour_angle_rad - want.hour_angle_rad).abs() * i.cos_declination)
            .max((g.direction_enu - want.direction_enu).length())
            .max((g.toa_insolation_w_m2 - want.toa_insolation_w_m2).abs() / i.toa_flux_w_m2);
    }
    worst
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 96, .. ProptestConfig::default() })]

    #[test]
    fn even_series_equal_the_scalar_path(
        p in any_planet(),
        lat in -90.0f64..=90.0,
        lon in -180.0f64..180.0,
        start in -1e9f64..1e9,
        log_step in 0.0f64..7.0,
        backwards in any::<bool>(),
        count in 1usize..400,
    ) {
        let place = Place::from_degrees(lat, lon).unwrap();
        let step = 10f64.powf(log_step) * if backwards { -1.0 } else { 1.0 };
        let times = TrackTimes::Even { start_s: start, step_s: step, count };
        let mut out = vec![p.star_position(0.0, place); count];
        p.star_track_into(place, times, &mut out).unwrap();
        let w = worst(&p, place, times, &out);
        prop_assert!(w < 1e-9, "{w:e}");
        let mut q = vec![0.0; count];
        p.toa_insolation_track_into(place, times, &mut q).unwrap();
        for (s, q) in out.iter().zip(&q) {
            prop_assert_eq!(s.toa_insolation_w_m2, *q);
        }
    }

    #[test]
    fn given_series_equal_the_scalar_path(
        p in any_planet(),
        lat in -90.0f64..=90.0,
        lon in -180.0f64..180.0,
        times in prop::collection::vec(-1e9f64..1e9, 1..40),
        jitter in prop::collection::vec(0.0f64..5e4, 1..200),
    ) {
        // Clusters of close instants around random ones: both the carried and the fallback
        // paths are taken.
        let instants: Vec<f64> = times
            .iter()
            .flat_map(|t| jitter.iter().scan(*t, |acc, j| { *acc += j; Some(*acc) }))
            .collect();
        let place = Place::from_degrees(lat, lon).unwrap();
        let given = TrackTimes::Given(&instants);
        let mut out = vec![p.star_position(0.0, place); instants.len()];
        p.star_track_into(place, given, &mut out).unwrap();
        let w = worst(&p, place, given, &out);
        prop_assert!(w < 1e-9, "{w:e}");
    }
}
