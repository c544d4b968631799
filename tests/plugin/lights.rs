//! Star and moon lights, ambient light and attenuation modes in a headless app.

use std::time::Duration;

use crate::common::*;
use bevy::color::LinearRgba;
use bevy::prelude::*;
use bevy_insola::prelude::*;
use bevy_insola::{LightAttenuation, relative_luminance};
use insola::Place;
use insola::lighting::LightMode;

const FRAME: Duration = Duration::from_millis(16);

fn star_light(app: &mut App) -> (DirectionalLight, Transform, Visibility) {
    let mut q = app
        .world_mut()
        .query_filtered::<(&DirectionalLight, &Transform, &Visibility), With<StarLight>>();
    let (l, t, v) = q.single(app.world()).unwrap();
    (*l, *t, *v)
}

fn linear(color: Color) -> LinearRgba {
    color.to_linear()
}

fn app_with_light(text: &str, settings: InsolaSettings) -> App {
    let mut app = app(text, settings, 0.0, FRAME);
    app.world_mut().spawn((
        StarLight::PRIMARY,
        DirectionalLight {
            shadow_maps_enabled: true,
            ..default()
        },
    ));
    app.world_mut().spawn(MoonLight { moon: 0 });
    app.update();
    app
}

fn go_to(app: &mut App, t_s: f64) {
    app.world_mut()
        .resource_mut::<WorldClock>()
        .jump_to(WorldInstant::from_secs_f64(t_s));
    app.update();
}

#[test]
fn light_shines_along_the_cores_star_vector() {
    let planet = planet(BRINDLE);
    for compass in [
        SceneCompass::default(),
        SceneCompass::new(Vec3::Y, Vec3::X).unwrap(),
        SceneCompass::new(Vec3::Z, Vec3::Y).unwrap(),
    ] {
        let settings = InsolaSettings {
            compass,
            ..settings_at(30.0, 10.0)
        };
        let mut app = app_with_light(BRINDLE, settings);
        let place = Place::from_degrees(30.0, 10.0).unwrap();
        for k in 0..30 {
            let t = 1.0e6 + k as f64 * 7_321.0;
            go_to(&mut app, t);
            let star = planet.star_position(t, place);
            let (light, transform, visibility) = star_light(&mut app);
            let expected = -compass.to_scene(star.direction_enu);
            assert!(
                (transform.forward().as_vec3() - expected).length() < 1e-5,
                "t {t}"
            );
            if star.altitude_rad > 0.02 {
                assert_eq!(visibility, Visibility::Inherited);
                assert!(light.illuminance > 0.0);
                assert!(light.shadow_maps_enabled, "shadow settings stay the user's");
            }
        }
    }
}

#[test]
fn star_light_is_off_at_night_and_moon_light_without_moons() {
    let planet = planet(BRINDLE);
    let mut app = app_with_light(BRINDLE, settings_at(30.0, 0.0));
    // Local midnight at the prime meridian: day 3 starts there.
    go_to(&mut app, planet.local_day_start_s(3.0, 0.0));
    let (light, _, visibility) = star_light(&mut app);
    assert_eq!(visibility, Visibility::Hidden);
    assert_eq!(light.illuminance, 0.0);
    let mut moons = app
        .world_mut()
        .query_filtered::<&Visibility, With<MoonLight>>();
    assert_eq!(*moons.single(app.world()).unwrap(), Visibility::Hidden);
    let sky = app.world().resource::<SkyState>();
    assert_ne!(sky.phase, TwilightPhase::Day);
    // Noon: on.
    go_to(
        &mut app,
        planet.local_day_start_s(3.0, 0.0) + 0.5 * planet.day_s(),
    );
    let (light, _, visibility) = star_light(&mut app);
    assert_eq!(visibility, Visibility::Inherited);
    assert!(light.illuminance > 1000.0);
}

#[test]
fn both_modes_carry_the_cores_light_once() {
    let planet = planet(BRINDLE);
    let place = Place::from_degrees(30.0, 0.0).unwrap();
    // Mid-morning, star low: extinction matters.
    let t = planet.local_day_start_s(5.0, 0.0) + 0.3 * planet.day_s();
    let mut lux = Vec::new();
    for (attenuation, mode) in [
        (LightAttenuation::ByInsola, LightMode::Ground),
        (
            LightAttenuation::ByEngineAtmosphere,
            LightMode::TopOfAtmosphere,
        ),
    ] {
        let settings = InsolaSettings {
            attenuation,
            ..settings_at(30.0, 0.0)
        };
        let mut app = app_with_light(BRINDLE, settings);
        go_to(&mut app, t);
        let (light, _, _) = star_light(&mut app);
        let core = planet.lighting(t, place, mode);
        // Photometric illuminance of the Bevy light (colour × illuminance) equals the core's lux.
        let photometric = light.illuminance as f64 * relative_luminance(linear(light.color)) as f64;
        assert_approx_eq!(
            photometric,
            core.star.illuminance_lux,
            core.star.illuminance_lux * 1e-5
        );
        lux.push(photometric);
        // The exposure meter reads the light at the ground in both modes.
        let ground_core = planet.lighting(t, place, LightMode::Ground);
        let meter = ground_core.star.illuminance_lux * ground_core.star.direction_enu.z.max(0.0)
            + ground_core.sky.illuminance_lux
            + ground_core
                .moons
                .iter()
                .map(|m| m.light.illuminance_lux * m.light.direction_enu.z.max(0.0))
                .sum::<f64>();
        let sky = app.world().resource::<SkyState>();
        assert_approx_eq!(sky.horizontal_illuminance_lux, meter, meter * 1e-9);
    }
    let (ground, above_air) = (lux[0], lux[1]);
    assert!(
        ground < above_air,
        "ground {ground} must be below the top-of-atmosphere {above_air}"
    );
    assert_approx_eq!(
        above_air,
        planet
            .lighting(t, place, LightMode::TopOfAtmosphere)
            .star
            .illuminance_lux,
        above_air * 1e-5
    );
}

#[test]
fn ambient_light_is_the_sky_over_pi() {
    let planet = planet(BRINDLE);
    let mut app = app_with_light(BRINDLE, settings_at(30.0, 0.0));
    go_to(
        &mut app,
        planet.local_day_start_s(2.0, 0.0) + 0.45 * planet.day_s(),
    );
    let sky = app.world().resource::<SkyState>().clone();
    let ambient = app.world().resource::<GlobalAmbientLight>();
    let luminance = ambient.brightness as f64 * relative_luminance(linear(ambient.color)) as f64;
    assert_approx_eq!(
        luminance,
        sky.sky_illuminance_lux / std::f64::consts::PI,
        sky.sky_illuminance_lux * 1e-5
    );
    // Turned off: left alone.
    app.world_mut()
        .resource_mut::<InsolaSettings>()
        .write_ambient_light = false;
    app.world_mut()
        .resource_mut::<GlobalAmbientLight>()
        .brightness = 1.0;
    app.update();
    assert_eq!(app.world().resource::<GlobalAmbientLight>().brightness, 1.0);
}

#[test]
fn orientation_is_continuous_through_the_zenith() {
    let planet = planet(OMBREL);
    // Equator of an untilted world: the star passes straight overhead at every noon.
    let mut app = app_with_light(OMBREL, settings_at(0.0, 0.0));
    let noon = planet.local_day_start_s(4.0, 0.0) + 0.5 * planet.day_s();
    let mut previous: Option<Quat> = None;
    let mut highest = 0.0f64;
    for k in -200..=200 {
        let t = noon + k as f64 * planet.day_s() / 4000.0;
        go_to(&mut app, t);
        let (_, transform, _) = star_light(&mut app);
        highest = highest.max(app.world().resource::<SkyState>().star.altitude_rad);
        if let Some(p) = previous {
            // Neighbouring samples are 0.09° of hour angle apart; no flip may occur.
            assert!(p.dot(transform.rotation).abs() > 0.9999, "jump at step {k}");
        }
        previous = Some(transform.rotation);
    }
    assert!(
        highest.to_degrees() > 89.9,
        "the star must pass the zenith, reached {}",
        highest.to_degrees()
    );
}
