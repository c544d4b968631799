//! An observer at the reference place sees the scene's sky: the same star altitude, insolation
//! and eclipse dimming as [`SkyState`], to single precision — the core's one star frame and one
//! occlusion seam behind both.

use std::time::Duration;

use crate::common::*;
use bevy::prelude::*;
use bevy_insola::ObserverInstant;
use bevy_insola::prelude::*;

const FRAME: Duration = Duration::from_millis(16);

/// Umbrel: an invented untilted world whose moon is as large in the sky as the star and new at
/// time zero, so the place at longitude 180° on the equator starts in a total eclipse.
const UMBREL: &str = r#"(name: "Umbrel",
    star: (temperature_k: 5772, radius_r_sun: 1, flux_at_mean_distance_w_m2: 1361),
    orbit: (semi_major_axis_au: 1, eccentricity: 0, periapsis_longitude_deg: 0, period_days: 360),
    spin: (obliquity_deg: 0, solar_day_hours: 24),
    moons: [(name: "Shade", radius_km: 1800, distance_km: 380000, period_days: 27, phase_at_zero_deg: 0)])"#;

/// Checks the observer `id` against this frame's [`SkyState`]; returns the eclipse fraction.
fn observer_matches_the_sky(app: &App, id: Entity) -> f64 {
    let sky = app.world().resource::<SkyState>();
    assert!(sky.ready);
    let observed = app.world().resource::<ObserverInstant>().world_time_s;
    assert_eq!(observed, Some(sky.world_time_s));
    let c = *app.world().get::<LocalConditions>(id).unwrap();
    // Single precision: sines to 1e-6, insolation to 1e-5 of the full flux (1361 W m⁻² here
    // and on Brindle about as much).
    assert_approx_eq!(c.sin_star_altitude, sky.star.altitude_rad.sin(), 2e-6);
    assert_approx_eq!(c.toa_insolation_w_m2, sky.toa_insolation_w_m2, 0.02);
    if (sky.star.altitude_rad - insola_rise(app)).abs() > 1e-5 {
        assert_eq!(c.star_is_up, sky.star.is_up);
    }
    sky.star_eclipse_fraction
}

/// The world's standard rise altitude, radians.
fn insola_rise(app: &App) -> f64 {
    app.world()
        .resource::<ActiveWorld>()
        .planet()
        .expect("world loaded")
        .standard_rise_altitude_rad()
}

#[test]
fn an_observer_at_the_reference_place_sees_the_eclipse_the_scene_shows() {
    let mut app = app(UMBREL, settings_at(0.0, 180.0), 60.0, FRAME);
    let id = app
        .world_mut()
        .spawn(SurfacePlace::from_degrees(0.0, 180.0).unwrap())
        .id();
    let mut deepest: f64 = 0.0;
    for _ in 0..30 {
        app.update();
        deepest = deepest.max(observer_matches_the_sky(&app, id));
    }
    // The scene is in the eclipse, and the observer's insolation carries it.
    assert!(deepest > 0.9, "eclipse fraction {deepest}");
    let sky = app.world().resource::<SkyState>();
    let c = app.world().get::<LocalConditions>(id).unwrap();
    let place = insola::Place::from_degrees(0.0, 180.0).unwrap();
    let clear = planet(UMBREL)
        .star_position(sky.world_time_s, place)
        .toa_insolation_w_m2;
    assert!(
        clear > 100.0 && f64::from(c.toa_insolation_w_m2) < 0.5 * clear,
        "clear {clear}, observed {}, eclipse {}",
        c.toa_insolation_w_m2,
        sky.star_eclipse_fraction
    );
}

#[test]
fn an_observer_at_the_reference_place_follows_the_sky_through_a_day_and_a_half() {
    // Brindle with a moon in the ecliptic, run fast through a day and a half (about 1.8 of its days),
    // with a second observer far away so the frame also serves other places.
    let text = brindle_with_moon();
    let mut app = app(&text, settings_at(12.0, -40.0), 20_000.0, FRAME);
    let id = app
        .world_mut()
        .spawn(SurfacePlace::from_degrees(12.0, -40.0).unwrap())
        .id();
    app.world_mut()
        .spawn(SurfacePlace::from_degrees(-50.0, 100.0).unwrap());
    for _ in 0..400 {
        app.update();
        observer_matches_the_sky(&app, id);
    }
}
