use super::*;
use crate::WorldSpec;
use crate::angle::wrap_pi;

fn calvenne() -> Planet {
    let text = include_str!("../../../../assets/worlds/calvenne.world.ron");
    Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap()
}

/// Largest difference from the scalar path: angles in radians on the sky (azimuth times the
/// cosine of the altitude, hour angle times the cosine of the declination, where each is
/// defined), insolation relative to the star's flux at that instant (near the horizon a
/// relative difference of the insolation itself is only the time's rounding, ~1e-16 of
/// t / day, divided by a vanishing sine of altitude).
fn worst_difference(p: &Planet, place: Place, times: TrackTimes<'_>, got: &[StarPosition]) -> f64 {
    let mut worst: f64 = 0.0;
    for (k, g) in got.iter().enumerate() {
        let t = times.time_s(k);
        let want = p.star_position(t, place);
        let cos_dec = p.star_instant(t).cos_declination;
        let flux = p.star_instant(t).toa_flux_w_m2;
        worst = worst
            .max((g.altitude_rad - want.altitude_rad).abs())
            .max(wrap_pi(g.azimuth_rad - want.azimuth_rad).abs() * want.altitude_rad.cos())
            .max(wrap_pi(g.hour_angle_rad - want.hour_angle_rad).abs() * cos_dec)
            .max((g.direction_enu - want.direction_enu).length())
            .max((g.toa_insolation_w_m2 - want.toa_insolation_w_m2).abs() / flux);
    }
    worst
}

#[test]
fn even_and_given_tracks_match_the_scalar_path() {
    let p = calvenne();
    let place = Place::from_degrees(63.5, -140.0).unwrap();
    for step in [1.0, 61.0, 3_600.0, 86_400.0, -7_777.0, 2.9e6] {
        let times = TrackTimes::Even {
            start_s: 3.3e8,
            step_s: step,
            count: 3_000,
        };
        let mut out = vec![p.star_position(0.0, place); times.len()];
        p.star_track_into(place, times, &mut out).unwrap();
        let worst = worst_difference(&p, place, times, &out);
        assert!(worst < 1e-9, "step {step}: {worst:e}");
        let instants: Vec<f64> = (0..3_000).map(|k| times.time_s(k)).collect();
        let given = TrackTimes::Given(&instants);
        p.star_track_into(place, given, &mut out).unwrap();
        let worst = worst_difference(&p, place, given, &out);
        assert!(worst < 1e-9, "given, step {step}: {worst:e}");
    }
}

#[test]
fn parallel_equals_serial_bit_for_bit_and_insolation_matches_positions() {
    let p = calvenne();
    let place = Place::from_degrees(-12.0, 33.0).unwrap();
    let times = TrackTimes::Even {
        start_s: -1e7,
        step_s: 97.0,
        count: 3 * CHUNK + 17,
    };
    let n = times.len();
    let mut serial = vec![p.star_position(0.0, place); n];
    let mut par = serial.clone();
    p.star_track_into(place, times, &mut serial).unwrap();
    p.star_track_par(place, times, &mut par).unwrap();
    assert_eq!(serial, par);
    let (mut q, mut q_par) = (vec![0.0; n], vec![0.0; n]);
    p.toa_insolation_track_into(place, times, &mut q).unwrap();
    p.toa_insolation_track_par(place, times, &mut q_par)
        .unwrap();
    assert_eq!(q, q_par);
    for (s, q) in serial.iter().zip(&q) {
        assert_eq!(s.toa_insolation_w_m2, *q);
    }
}

#[test]
fn bad_input_is_an_error() {
    let p = calvenne();
    let place = Place::from_degrees(0.0, 0.0).unwrap();
    let mut out = vec![0.0; 3];
    let even = |start_s, step_s, count| TrackTimes::Even {
        start_s,
        step_s,
        count,
    };
    assert!(matches!(
        p.toa_insolation_track_into(place, even(0.0, 1.0, 4), &mut out),
        Err(QueryError::BufferLength {
            needed: 4,
            given: 3
        })
    ));
    assert!(
        p.toa_insolation_track_into(place, even(f64::NAN, 1.0, 3), &mut out)
            .is_err()
    );
    assert!(
        p.toa_insolation_track_par(place, even(0.0, f64::INFINITY, 3), &mut out)
            .is_err()
    );
    let times = [0.0, f64::NAN, 2.0];
    assert!(
        p.toa_insolation_track_into(place, TrackTimes::Given(&times), &mut out)
            .is_err()
    );
    let mut none: Vec<StarPosition> = vec![];
    assert!(
        p.star_track_into(place, even(0.0, 1.0, 0), &mut none)
            .is_ok()
    );
}
