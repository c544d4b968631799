//! Property tests over random valid worlds, places and times.

use insola::events::Crossing;
use insola::lighting::LightMode;
use insola::{Place, Planet, WorldSpec};
use proptest::prelude::*;

fn world_text(
    obliquity: f64,
    e: f64,
    peri: f64,
    year_days: f64,
    day_h: f64,
    temp: f64,
    pressure: f64,
) -> String {
    format!(
        r#"(name: "Random", star: (temperature_k: {temp}, radius_r_sun: 1, luminosity_l_sun: 1),
           orbit: (semi_major_axis_au: 1, eccentricity: {e}, periapsis_longitude_deg: {peri}, period_days: {year_days}),
           spin: (obliquity_deg: {obliquity}, solar_day_hours: {day_h}),
           atmosphere: (surface_pressure_kpa: {pressure}),
           moons: [(name: "Dot", radius_km: 900, distance_km: 200000, period_days: 9, inclination_deg: 3)])"#
    )
}

prop_compose! {
    fn any_planet()(
        obliquity in 0.0f64..=180.0,
        e in 0.0f64..0.95,
        peri in 0.0f64..360.0,
        year_days in 20.0f64..2000.0,
        day_frac in 0.001f64..0.9,
        temp in 2000.0f64..12000.0,
        pressure in prop_oneof![Just(0.0), 1.0f64..300.0],
    ) -> Planet {
        let year_h = year_days * 24.0;
        let text = world_text(obliquity, e, peri, year_days, (day_frac * year_h).max(1.0), temp, pressure);
        Planet::new(&WorldSpec::from_ron_str(&text).expect("valid")).expect("valid")
    }
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 64, .. ProptestConfig::default() })]

    #[test]
    fn outputs_are_finite_and_directions_unit(p in any_planet(), lat in -90.0f64..=90.0, lon in -180.0f64..180.0, t in -1e10f64..1e10) {
        let place = Place::from_degrees(lat, lon).unwrap();
        let s = p.star_position(t, place);
        prop_assert!((s.direction_enu.length() - 1.0).abs() < 1e-12);
        prop_assert!(s.altitude_rad.is_finite() && s.azimuth_rad.is_finite() && s.hour_angle_rad.is_finite());
        prop_assert!(s.toa_insolation_w_m2 >= 0.0 && s.toa_insolation_w_m2.is_finite());
        prop_assert!(p.equation_of_time_min(t).is_finite());
        let l = p.lighting(t, place, LightMode::Ground);
        prop_assert!(l.star.illuminance_lux >= 0.0 && l.star.illuminance_lux.is_finite());
        prop_assert!(l.sky.illuminance_lux >= 0.0 && l.sky.illuminance_lux.is_finite());
        prop_assert!(l.star.colour_linear_srgb.iter().all(|c| c.is_finite() && *c >= 0.0 && *c <= 1.0));
        for m in &l.moons {
            prop_assert!((m.light.direction_enu.length() - 1.0).abs() < 1e-9);
            prop_assert!(m.light.illuminance_lux >= 0.0 && m.light.illuminance_lux.is_finite());
            prop_assert!((0.0..=1.0).contains(&m.illuminated_fraction));
            prop_assert!((0.0..=1.0).contains(&m.eclipse_fraction));
        }
        let top = p.lighting(t, place, LightMode::TopOfAtmosphere);
        // Above the air the beam is never weaker than at the ground.
        prop_assert!(top.star.illuminance_lux * (1.0 + 1e-12) + 1e-9 >= l.star.illuminance_lux, "top {} ground {} alt {}", top.star.illuminance_lux, l.star.illuminance_lux, l.star.altitude_rad);
        let q = p.daily_mean_insolation_w_m2(t, place.latitude_rad);
        prop_assert!(q.is_finite() && q >= 0.0);
        // The meter reading at the ground is the same whichever mode the lights are in, and in
        // ground mode it is the sum of the horizontal parts.
        let meter = l.ground_horizontal_illuminance_lux;
        prop_assert!(meter.is_finite() && meter >= 0.0);
        prop_assert!((top.ground_horizontal_illuminance_lux - meter).abs() <= 1e-9 * meter.max(1.0));
        let sum = l.star.illuminance_lux * l.star.direction_enu.z.max(0.0)
            + l.sky.illuminance_lux
            + l.moons.iter().map(|m| m.light.illuminance_lux * m.light.direction_enu.z.max(0.0)).sum::<f64>();
        prop_assert!((sum - meter).abs() <= 1e-9 * meter.max(1.0));
    }

    #[test]
    fn star_moves_continuously(p in any_planet(), lat in -89.0f64..=89.0, t in -1e9f64..1e9) {
        let place = Place::from_degrees(lat, 0.0).unwrap();
        // Over a thousandth of the shorter of day and year, the star moves at most a few
        // degrees (2π per day plus the orbit's fastest angular motion).
        let dt = p.day_s().min(p.year_s()) * 1e-3;
        let a = p.star_position(t, place).direction_enu;
        let b = p.star_position(t + dt, place).direction_enu;
        // At periapsis the orbit turns (1 + e)² / (1 − e²)^(3/2) times faster than on average
        // (Kepler's second law, from memory), which on very eccentric orbits dominates.
        let e = p.spec().orbit.eccentricity;
        let fastest_orbit = (1.0 + e).powi(2) / (1.0 - e * e).powf(1.5);
        let bound = 0.1 + std::f64::consts::TAU * 1e-3 * fastest_orbit;
        prop_assert!(a.angle_between(b) < bound, "{} (bound {bound})", a.angle_between(b));
    }

    #[test]
    fn crossings_alternate_in_time_order(p in any_planet(), lat in -80.0f64..=80.0, t in 0.0f64..1e8) {
        let place = Place::from_degrees(lat, 0.0).unwrap();
        let mut out: Vec<Crossing> = Vec::new();
        p.altitude_crossings_into(place, t, t + 3.0 * p.day_s().min(p.year_s()), p.standard_rise_altitude_rad(), &mut out);
        for w in out.windows(2) {
            prop_assert!(w[0].t_s < w[1].t_s);
            prop_assert!(w[0].rising != w[1].rising);
        }
    }

    #[test]
    fn supplementary_tilts_share_declination_but_rise_on_opposite_sides(obliquity in 1.0f64..89.0, day_h in 5.0f64..100.0) {
        let a = Planet::new(&WorldSpec::from_ron_str(&world_text(obliquity, 0.0, 0.0, 400.0, day_h, 5772.0, 101.0)).unwrap()).unwrap();
        let b = Planet::new(&WorldSpec::from_ron_str(&world_text(180.0 - obliquity, 0.0, 0.0, 400.0, day_h, 5772.0, 101.0)).unwrap()).unwrap();
        let place = Place::from_degrees(0.0, 0.0).unwrap();
        let t = a.time_of_solar_days(0.25);
        let tb = b.time_of_solar_days(0.25);
        prop_assert!((a.star_instant(t).declination_rad - b.star_instant(t).declination_rad).abs() < 1e-12);
        // A quarter day after midnight the star is in the east on one and the west on the other.
        let ea = a.star_position(t, place).direction_enu.x;
        let eb = b.star_position(tb, place).direction_enu.x;
        prop_assert!(ea > 0.0 && eb < 0.0, "{ea} {eb}");
    }

    #[test]
    fn day_events_are_consistent(p in any_planet(), lat in -90.0f64..=90.0, day in -50i64..50) {
        let ev = p.day_events(day, Place::from_degrees(lat, 0.0).unwrap());
        prop_assert!(ev.sunlight.time_above_s >= 0.0 && ev.sunlight.time_above_s <= ev.day_length_s * (1.0 + 1e-9));
        // Twilight thresholds are nested: the star is above −18° at least as long as above −6°.
        prop_assert!(ev.astronomical.time_above_s + 1.0 >= ev.civil.time_above_s);
        prop_assert!(ev.civil.time_above_s + 1.0 >= ev.sunlight.time_above_s);
    }
}

#[test]
fn extreme_worlds_work() {
    // Tilt 0, 90 and 180; eccentricity 0.95; tidally locked; day longer than the year;
    // latitudes ±90.
    let cases = [
        world_text(0.0, 0.0, 0.0, 365.0, 24.0, 5772.0, 101.0),
        world_text(90.0, 0.2, 10.0, 365.0, 24.0, 5772.0, 101.0),
        world_text(180.0, 0.0, 0.0, 365.0, 24.0, 5772.0, 0.0),
        world_text(23.0, 0.95, 200.0, 365.0, 24.0, 3000.0, 101.0),
        world_text(10.0, 0.1, 0.0, 50.0, 3000.0, 5772.0, 101.0),
    ];
    let locked = r#"(name: "Locked", star: (temperature_k: 3200, radius_r_sun: 0.2, luminosity_l_sun: 0.005),
        orbit: (semi_major_axis_au: 0.05, eccentricity: 0.1, periapsis_longitude_deg: 0, period_days: 8),
        spin: (obliquity_deg: 0, tidally_locked: true))"#;
    for text in cases.iter().map(String::as_str).chain([locked]) {
        let p = Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap();
        for lat in [-90.0, -45.0, 0.0, 45.0, 90.0] {
            let place = Place::from_degrees(lat, 33.0).unwrap();
            for k in 0..40 {
                let t = k as f64 * p.year_s() / 37.0;
                let l = p.lighting(t, place, LightMode::Ground);
                assert!(l.star.illuminance_lux.is_finite() && l.sky.illuminance_lux.is_finite());
            }
            let ev = p.day_events(3, place);
            assert!(ev.sunlight.time_above_s.is_finite());
        }
        let s = p.season_lengths();
        assert!(
            ((s.spring_s + s.summer_s + s.autumn_s + s.winter_s) / p.year_s() - 1.0).abs() < 1e-9
        );
    }
}

proptest! {
    // Each case equilibrates a climate (tens of milliseconds in a debug build).
    #![proptest_config(ProptestConfig { cases: 48, .. ProptestConfig::default() })]

    #[test]
    fn climate_temperatures_stay_within_physical_bounds(
        p in any_planet(),
        lat in -90.0f64..=90.0,
        lon in -180.0f64..180.0,
        t in 0.0f64..1e9,
    ) {
        let cycle = match p.equilibrate_climate() {
            Ok(c) => c,
            Err(insola::climate::ClimateError::NotConverged { last, .. }) => *last,
            Err(e) => return Err(TestCaseError::fail(format!("climate failed: {e}"))),
        };
        // Bounds: above absolute zero, and below the temperature at which a gray body of the
        // model's least emissivity ε radiates the star's flux at its closest approach,
        // T = (S/(εσ))^¼, σ = 5.670374 × 10⁻⁸ W m⁻² K⁻⁴ (CODATA 2018; from memory). The model
        // never emits less than that gray body (ε is matched to its A + B·T at 60 °C), so no
        // band can absorb more than it sheds above that temperature.
        let e = p.spec().orbit.eccentricity;
        let peak_flux = p.flux_at_mean_distance_w_m2() / ((1.0 - e) * (1.0 - e));
        let spec = p.climate_spec();
        let sigma = 5.670_374e-8;
        let emissivity = (spec.olr_a_w_m2 + spec.olr_b_w_m2_per_k * 60.0)
            / (sigma * (60.0f64 + 273.15).powi(4));
        let hottest_c = (peak_flux / (emissivity * sigma)).powf(0.25) - 273.15;
        let place = Place::from_degrees(lat, lon).unwrap();
        let local = p.local_climate(&cycle, t, place, 0.0).unwrap();
        for temperature in [local.temperature_c, local.zonal_temperature_c] {
            prop_assert!(temperature.is_finite());
            prop_assert!(temperature >= -273.15, "{temperature} °C");
            prop_assert!(temperature <= hottest_c, "{temperature} °C above {hottest_c} °C");
        }
    }
}
