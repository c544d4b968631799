//! The flash guard: at any clock rate and frame rate, what the lights show changes by a flash
//! (WCAG 2.x success criterion 2.3.1) at most three times in any one second; without the guard
//! the same runs flash (so the count can fail); at ordinary rates the guard changes nothing.

use std::time::Duration;

use bevy::camera::Exposure;
use bevy::prelude::*;
use bevy::time::TimeUpdateStrategy;
use bevy_insola::parts::{InsolaClimatePlugin, InsolaObserversPlugin};
use bevy_insola::prelude::*;
use bevy_insola::{DisplayedSky, FlashGuard, SkyHold, relative_luminance};

use crate::common::*;

/// Real seconds each run lasts.
const RUN_S: f64 = 3.0;

/// An app on Brindle (20-hour day, 200-day year) at `rate` and `fps`, with a star light and a
/// camera whose exposure follows the sky, as the examples set them.
fn lit_app(rate: f64, fps: f64, guard: FlashGuard) -> App {
    lit_app_on(BRINDLE, rate, fps, guard)
}

/// [`lit_app`] on `world`, with a light for each of its stars.
fn lit_app_on(world: &str, rate: f64, fps: f64, guard: FlashGuard) -> App {
    let settings = InsolaSettings {
        flash_guard: guard,
        // Notices are not under test; long frames skip them.
        max_notified_span_s: 1.0e5,
        ..settings_at(30.0, 0.0)
    };
    let mut app = App::new();
    app.add_plugins(MinimalPlugins)
        .add_plugins(
            InsolaPlugins::new()
                .with_world_spec(spec(world))
                .with_settings(settings)
                .with_clock_rate(rate)
                .build()
                .disable::<InsolaClimatePlugin>()
                .disable::<InsolaObserversPlugin>(),
        )
        .insert_resource(TimeUpdateStrategy::ManualDuration(Duration::from_secs_f64(
            1.0 / fps,
        )));
    let stars = planet(world).star_count();
    for k in 0..stars {
        app.world_mut().spawn(StarLight::of(k));
    }
    app.world_mut()
        .spawn((ExposureFollowsSky::default(), Exposure::default()));
    app
}

/// Relative luminance (0–1) of a mid-grey ground as the camera shows it: the light on a
/// horizontal surface (star and ambient, as written into the engine) through the camera's
/// exposure, with an incident-meter exposure putting the metered light at 18 % grey (common
/// practice, no source), clipped at white.
fn shown_luminance(app: &mut App) -> f64 {
    let world = app.world_mut();
    let mut star_h = 0.0;
    let mut q =
        world.query_filtered::<(&DirectionalLight, &Transform, &Visibility), With<StarLight>>();
    for (light, transform, visibility) in q.iter(world) {
        if *visibility == Visibility::Hidden {
            continue;
        }
        let lux = f64::from(light.illuminance * relative_luminance(light.color.to_linear()));
        let down = f64::from((transform.rotation * Vec3::NEG_Z).dot(Vec3::NEG_Y));
        star_h += lux * down.max(0.0);
    }
    let ambient = world.resource::<GlobalAmbientLight>();
    let sky_lux = f64::from(ambient.brightness * relative_luminance(ambient.color.to_linear()))
        * std::f64::consts::PI;
    let mut cams = world.query::<&Exposure>();
    let ev = cams.iter(world).next().map_or(15.0, |e| f64::from(e.ev100));
    let metered_lux = 2f64.powf(ev) * 250.0 / 100.0;
    (0.18 * (star_h + sky_lux) / metered_lux).clamp(0.0, 1.0)
}

/// Instants (real seconds) of the changes that make up flashes by WCAG 2.3.1: alternating
/// changes of relative luminance by at least 0.1 where the darker state is below 0.8.
fn flash_changes(series: &[(f64, f64)]) -> Vec<f64> {
    let mut changes = Vec::new();
    let Some(&(_, first)) = series.first() else {
        return changes;
    };
    let (mut lo, mut hi) = (first, first);
    let mut rising: Option<bool> = None;
    for &(t, y) in series {
        lo = lo.min(y);
        hi = hi.max(y);
        let up = y - lo >= 0.1 && lo < 0.8 && rising != Some(true);
        let down = hi - y >= 0.1 && y < 0.8 && rising != Some(false);
        if up || down {
            changes.push(t);
            rising = Some(up);
            (lo, hi) = (y, y);
        } else if rising == Some(true) {
            lo = y.min(hi);
        } else if rising == Some(false) {
            hi = y.max(lo);
        }
    }
    changes
}

/// Most flashes (pairs of opposing changes, a lone change counting as one) in any one-second
/// window.
fn most_flashes_per_second(changes: &[f64]) -> usize {
    let mut most = 0;
    for (i, &t) in changes.iter().enumerate() {
        let n = changes[i..].iter().take_while(|&&u| u < t + 1.0).count();
        most = most.max(n.div_ceil(2));
    }
    most
}

fn run(rate: f64, fps: f64, guard: FlashGuard) -> usize {
    run_on(BRINDLE, rate, fps, guard)
}

fn run_on(world: &str, rate: f64, fps: f64, guard: FlashGuard) -> usize {
    let mut app = lit_app_on(world, rate, fps, guard);
    let frames = (RUN_S * fps) as usize;
    let mut series = Vec::with_capacity(frames);
    for i in 0..frames {
        app.update();
        series.push((i as f64 / fps, shown_luminance(&mut app)));
    }
    most_flashes_per_second(&flash_changes(&series))
}

#[test]
fn no_more_than_three_flashes_a_second_at_any_rate() {
    for rate in [1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9] {
        for fps in [30.0, 60.0, 144.0] {
            let flashes = run(rate, fps, FlashGuard::default());
            assert!(
                flashes <= 3,
                "rate {rate:e} at {fps} Hz: {flashes} flashes in one second"
            );
        }
    }
}

#[test]
fn without_the_guard_the_same_runs_flash() {
    // Brindle's day in 0.072 real s at 1e6: the exact sky swings many times a second.
    let flashes = run(1e6, 60.0, FlashGuard::Off);
    assert!(
        flashes > 3,
        "the unguarded light flashed only {flashes} times"
    );
}

#[test]
fn at_ordinary_rates_the_displayed_sky_is_the_exact_one() {
    let mut app = lit_app(60.0, 60.0, FlashGuard::default());
    for _ in 0..30 {
        app.update();
        let shown = app.world().resource::<DisplayedSky>();
        let exact = DisplayedSky::exact(app.world().resource::<SkyState>());
        assert_eq!(shown.hold, SkyHold::Exact);
        assert_eq!(*shown, exact);
    }
    // The guard holds the day once a day lasts under a real second, and the year once a year
    // does.
    let guard = FlashGuard::default();
    assert_eq!(guard.hold_for(72_000.0, 1.44e7, 7.0e4), SkyHold::Exact);
    assert_eq!(guard.hold_for(72_000.0, 1.44e7, 1.0e5), SkyHold::Day);
    assert_eq!(guard.hold_for(72_000.0, 1.44e7, -2.0e7), SkyHold::Year);
    // It cannot be set looser than three cycles a second.
    let loose = FlashGuard::On {
        min_real_period_s: 0.01,
    };
    assert_eq!(loose.hold_for(72_000.0, 1.44e7, 3.0e5), SkyHold::Day);
}

#[test]
fn with_two_suns_both_lights_are_held_and_nothing_flashes() {
    use crate::two_suns::TESSALY;
    // Every star's light counts in what the camera shows (`shown_luminance` sums the star
    // lights), so the companion held at its mean must not flash either.
    for rate in [1e5, 1e6, 1e8] {
        for fps in [30.0, 144.0] {
            let flashes = run_on(TESSALY, rate, fps, FlashGuard::default());
            assert!(
                flashes <= 3,
                "rate {rate:e} at {fps} Hz: {flashes} flashes in one second"
            );
        }
    }
    // Tessaly's 24-hour day passes in under a real second at 1e5: the day is held, the
    // companion shown at its mean, lit (it stands beside the primary, so it is up in the
    // day), and unchanged within one local day.
    let mut app = lit_app_on(TESSALY, 1e5, 60.0, FlashGuard::default());
    let mut held: Option<(i64, DisplayedSky)> = None;
    let mut days_checked = 0;
    for _ in 0..200 {
        app.update();
        let shown = app.world().resource::<DisplayedSky>().clone();
        let day = app.world().resource::<SkyState>().local_day;
        assert_eq!(shown.hold, SkyHold::Day);
        assert_eq!(shown.other_stars.len(), 1);
        let companion = shown.other_stars[0];
        assert!(
            companion.is_up && companion.illuminance_lux > 0.0,
            "{companion:?}"
        );
        match &held {
            Some((d, before)) if *d == day => assert_eq!(*before, shown),
            _ => {
                days_checked += 1;
                held = Some((day, shown));
            }
        }
    }
    assert!(days_checked >= 3);
    // Its light is on while held.
    let world = app.world_mut();
    let mut q = world.query::<(&StarLight, &Visibility)>();
    assert!(q.iter(world).all(|(_, v)| *v != Visibility::Hidden));
}
