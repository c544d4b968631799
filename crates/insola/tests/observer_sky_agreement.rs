//! The star frames ([`insola::StarFrame`], [`insola::StarFrameF32`]) against
//! [`Planet::lighting`]: for random valid worlds — with a moon on an orbit in the ecliptic plane,
//! so every new moon eclipses the star somewhere — and instants, an observer sees the same star
//! altitude, insolation and eclipse dimming as the scene's lighting.

use insola::lighting::LightMode;
use insola::{Place, PlaceF32, Planet, WorldSpec};

/// SplitMix64: a small deterministic generator, so every run checks the same cases.
struct Mix(u64);

impl Mix {
    fn next(&mut self) -> u64 {
        self.0 = self.0.wrapping_add(0x9E37_79B9_7F4A_7C15);
        let mut z = self.0;
        z = (z ^ (z >> 30)).wrapping_mul(0xBF58_476D_1CE4_E5B9);
        z = (z ^ (z >> 27)).wrapping_mul(0x94D0_49BB_1331_11EB);
        z ^ (z >> 31)
    }

    /// Uniform in `[lo, hi)`.
    fn range(&mut self, lo: f64, hi: f64) -> f64 {
        lo + (hi - lo) * (self.next() >> 11) as f64 / (1u64 << 53) as f64
    }
}

/// An invented world with one large moon, new at time zero, in the ecliptic plane.
fn random_world(r: &mut Mix) -> (Planet, f64) {
    let year_days = r.range(60.0, 900.0);
    let moon_days = r.range(4.0, 40.0);
    let text = format!(
        r#"(name: "Umbra {seed}", star: (temperature_k: {temp}, radius_r_sun: {rs}, luminosity_l_sun: {lum}),
           orbit: (semi_major_axis_au: {a}, eccentricity: {e}, periapsis_longitude_deg: {peri}, period_days: {year_days}),
           spin: (obliquity_deg: {obl}, solar_day_hours: {day}),
           moons: [(name: "Veil", radius_km: {mr}, distance_km: {md}, period_days: {moon_days}, phase_at_zero_deg: 0, inclination_deg: 0)])"#,
        seed = r.next() % 1000,
        temp = r.range(3500.0, 9000.0),
        rs = r.range(0.5, 2.0),
        lum = r.range(0.3, 3.0),
        a = r.range(0.6, 2.0),
        e = r.range(0.0, 0.3),
        peri = r.range(0.0, 360.0),
        obl = r.range(0.0, 180.0),
        day = r.range(8.0, 60.0),
        mr = r.range(800.0, 3000.0),
        md = r.range(150_000.0, 500_000.0),
    );
    let planet = Planet::new(&WorldSpec::from_ron_str(&text).expect("valid world")).expect("valid");
    let synodic_s = 86_400.0 / (1.0 / moon_days - 1.0 / year_days);
    (planet, synodic_s)
}

/// The place under the star at `t_s` (where the moon's shadow falls at a new moon).
fn under_the_star(planet: &Planet, t_s: f64) -> Place {
    let i = planet.star_instant(t_s);
    Place {
        latitude_rad: i.declination_rad,
        longitude_rad: i.right_ascension_rad - i.sidereal_angle_rad,
    }
    .normalise()
}

#[test]
fn frames_at_a_place_equal_the_lighting_there_including_eclipses() {
    let mut r = Mix(0x005E_ED0F_5A1E);
    let (mut cases, mut eclipsed, mut skipped) = (0, 0, 0);
    for _ in 0..120 {
        let (planet, synodic_s) = random_world(&mut r);
        for k in 0..12 {
            // Half the instants near a new moon, half anywhere in a few years.
            let t = if k % 2 == 0 {
                (r.next() % 40) as f64 * synodic_s + r.range(-3.0e3, 3.0e3)
            } else {
                r.range(-1e8, 1e8)
            };
            let place = if k % 4 == 0 {
                under_the_star(&planet, t)
            } else if k % 4 == 2 {
                let c = under_the_star(&planet, t);
                Place::normalised(
                    c.latitude_rad.to_degrees() + r.range(-5.0, 5.0),
                    c.longitude_rad.to_degrees() + r.range(-5.0, 5.0),
                )
            } else {
                Place::normalised(r.range(-90.0, 90.0), r.range(-180.0, 180.0))
            };
            let frame = planet.star_frame(t);
            let sky = frame.at(place);
            let light = planet.lighting(t, place, LightMode::Ground);
            let flux = frame.instant().toa_flux_w_m2;
            // f64: to 1e-9 (altitude sine; insolation relative to the star's flux).
            assert!((sky.sin_altitude - light.star.direction_enu.z).abs() < 1e-9);
            assert!((sky.position.altitude_rad - light.star.altitude_rad).abs() < 1e-9);
            assert!((sky.toa_insolation_w_m2 - light.toa_insolation_w_m2).abs() < 1e-9 * flux);
            assert!(
                (sky.occlusion.hidden_fraction - light.star_eclipse_fraction).abs() < 1e-9,
                "{t}: {} vs {}",
                sky.occlusion.hidden_fraction,
                light.star_eclipse_fraction
            );
            if light.star_eclipse_fraction > 0.0 {
                assert!(frame.eclipse_possible());
                assert_eq!(sky.occlusion.by, light.star_occluded_by);
            }
            assert_eq!(sky.is_up, light.star.is_up);
            // f32: to about 1e-5 of the star's flux.
            let bulk = frame.to_f32();
            let fast = bulk.at(&PlaceF32::new(place));
            assert!((f64::from(fast.sin_altitude) - sky.sin_altitude).abs() < 1e-5);
            assert!(
                (f64::from(fast.toa_insolation_w_m2) - sky.toa_insolation_w_m2).abs() < 1e-5 * flux,
                "{t}: {} vs {}",
                fast.toa_insolation_w_m2,
                sky.toa_insolation_w_m2
            );
            if sky.sin_altitude > 1e-4 {
                assert!(
                    (f64::from(fast.star_hidden_fraction) - sky.occlusion.hidden_fraction).abs()
                        < 1e-5
                );
            }
            // The up decision agrees except within single precision of the rise altitude.
            if (sky.position.altitude_rad - frame.rise_altitude_rad()).abs() > 1e-5 {
                assert_eq!(fast.is_up, sky.is_up);
            } else {
                skipped += 1;
            }
            cases += 1;
            if light.star_eclipse_fraction > 0.01 && sky.sin_altitude > 0.0 {
                eclipsed += 1;
            }
        }
    }
    assert_eq!(cases, 1440);
    assert!(eclipsed >= 60, "only {eclipsed} eclipsed cases");
    assert!(skipped < 10);
}

#[test]
fn the_planet_wide_test_lets_no_eclipse_through() {
    // Around new moons, many places near the star's point: wherever the lighting sees the star
    // covered, the frame has kept the moon.
    let mut r = Mix(42);
    let mut covered = 0;
    for _ in 0..40 {
        let (planet, synodic_s) = random_world(&mut r);
        for _ in 0..10 {
            let t = (r.next() % 20) as f64 * synodic_s + r.range(-2.0e4, 2.0e4);
            let frame = planet.star_frame(t);
            let centre = under_the_star(&planet, t);
            for _ in 0..20 {
                let place = Place::normalised(
                    centre.latitude_rad.to_degrees() + r.range(-30.0, 30.0),
                    centre.longitude_rad.to_degrees() + r.range(-30.0, 30.0),
                );
                let i = planet.star_instant(t);
                if planet.star_eclipse_fraction(&i, place) > 0.0 {
                    covered += 1;
                    assert!(frame.eclipse_possible());
                }
            }
        }
    }
    assert!(covered > 100, "{covered}");
}
