//! The world clock and the sky notices in a headless app with manual time steps.

use std::time::Duration;

use bevy::prelude::*;
use bevy_insola::prelude::*;
use bevy_insola::{EclipseStage, MoonPhase, TwilightBand, WorldRejected};

use crate::common::*;

const FRAME: Duration = Duration::from_millis(16);

/// Core sunrise of the local day containing `t_s` at the reference place.
fn core_sunrise(planet: &insola::Planet, place: insola::Place, t_s: f64) -> Option<f64> {
    let day = planet.local_day_count(t_s, place.longitude_rad).floor() as i64;
    planet.day_events(day, place).sunlight.rise_s
}

#[test]
fn sunrise_fires_once_per_day_at_the_cores_instant() {
    let planet = planet(BRINDLE);
    // A fifth of a 20-hour day per frame: 4 h per 16 ms frame.
    let rate = 4.0 * 3600.0 / FRAME.as_secs_f64();
    let mut app = app(BRINDLE, settings_at(30.0, 10.0), rate, FRAME);
    let days = 12;
    for _ in 0..(days * 5 + 1) {
        app.update();
    }
    let place = insola::Place::from_degrees(30.0, 10.0).unwrap();
    let rises: Vec<f64> = notices(&app)
        .iter()
        .filter(|n| n.kind == SkyEventKind::Rise(SkyBody::Star(0)))
        .map(|n| n.world_time_s)
        .collect();
    assert!(
        rises.len() >= days - 1 && rises.len() <= days + 1,
        "{} rises in {days} days",
        rises.len()
    );
    for t in &rises {
        let core = core_sunrise(&planet, place, *t).expect("the core has a sunrise that day");
        assert_approx_eq!(*t, core, 1.0);
    }
    // Each kind once per day: as many sets and transits as rises (give or take the ends).
    let sets = count(&app, SkyEventKind::Set(SkyBody::Star(0)));
    let transits = count(&app, SkyEventKind::Transit(SkyBody::Star(0)));
    assert!(
        sets.abs_diff(rises.len()) <= 1 && transits.abs_diff(rises.len()) <= 1,
        "{sets} {transits}"
    );
}

#[test]
fn a_frame_spanning_ten_days_fires_ten_sunrises_in_order() {
    let planet = planet(BRINDLE);
    let mut app = app(BRINDLE, settings_at(-20.0, 0.0), 0.0, FRAME);
    app.update();
    app.world_mut()
        .resource_mut::<WorldClock>()
        .step(10.0 * planet.day_s())
        .unwrap();
    app.update();
    let all = notices(&app);
    assert_eq!(count(&app, SkyEventKind::Rise(SkyBody::Star(0))), 10);
    assert_eq!(count(&app, SkyEventKind::Set(SkyBody::Star(0))), 10);
    assert_eq!(count(&app, SkyEventKind::Dawn(TwilightBand::Civil)), 10);
    assert_eq!(
        count(&app, SkyEventKind::Dusk(TwilightBand::Astronomical)),
        10
    );
    assert_eq!(
        all.iter()
            .filter(|n| matches!(n.kind, SkyEventKind::NewDay { .. }))
            .count(),
        10
    );
    assert!(
        all.windows(2)
            .all(|w| w[0].world_time_s <= w[1].world_time_s),
        "notices out of order"
    );
    // Within a morning: astronomical, nautical and civil dawn come before the rise.
    let first_rise = all
        .iter()
        .position(|n| n.kind == SkyEventKind::Rise(SkyBody::Star(0)))
        .unwrap();
    let first_civil = all
        .iter()
        .position(|n| n.kind == SkyEventKind::Dawn(TwilightBand::Civil))
        .unwrap();
    assert!(all[first_civil].world_time_s < all[first_rise].world_time_s);
}

#[test]
fn a_year_per_minute_counts_every_sunrise() {
    let planet = planet(BRINDLE);
    // One 200-day year per real minute, at 60 frames per second.
    let frame = Duration::from_nanos(16_666_667);
    let rate = planet.year_s() / 60.0;
    let mut app = app(BRINDLE, settings_at(10.0, 0.0), rate, frame);
    let frames = 60 * 6; // six real seconds: 20 world days
    for _ in 0..frames {
        app.update();
    }
    let clock = app.world().resource::<WorldClock>();
    let end = clock.world_time_s();
    let place = insola::Place::from_degrees(10.0, 0.0).unwrap();
    let mut expected = Vec::new();
    planet.altitude_crossings_into(
        place,
        0.0,
        end,
        planet.standard_rise_altitude_rad(),
        &mut expected,
    );
    let expected_rises: Vec<f64> = expected
        .iter()
        .filter(|c| c.rising)
        .map(|c| c.t_s)
        .collect();
    let rises: Vec<f64> = notices(&app)
        .iter()
        .filter(|n| n.kind == SkyEventKind::Rise(SkyBody::Star(0)))
        .map(|n| n.world_time_s)
        .collect();
    assert!(expected_rises.len() >= 19);
    assert_eq!(rises.len(), expected_rises.len());
    for (a, b) in rises.iter().zip(&expected_rises) {
        assert_approx_eq!(*a, *b, 1.0);
    }
}

#[test]
fn polar_night_fires_no_sunrise() {
    let planet = planet(BRINDLE);
    // Deep southern winter at 85° S: jump to the northern solstice, then run five days.
    let solstice = planet.season_marks_after(0.0).northern_solstice_s;
    let mut app = app(BRINDLE, settings_at(-85.0, 0.0), 0.0, FRAME);
    app.world_mut()
        .resource_mut::<WorldClock>()
        .jump_to(WorldInstant::from_secs_f64(solstice - 2.0 * planet.day_s()));
    app.update();
    app.world_mut()
        .resource_mut::<WorldClock>()
        .step(5.0 * planet.day_s())
        .unwrap();
    app.update();
    assert_eq!(count(&app, SkyEventKind::Rise(SkyBody::Star(0))), 0);
    assert_eq!(count(&app, SkyEventKind::Set(SkyBody::Star(0))), 0);
    assert!(
        notices(&app)
            .iter()
            .any(|n| matches!(n.kind, SkyEventKind::NewDay { .. }))
    );
    assert!(
        notices(&app)
            .iter()
            .any(|n| n.season_begins(-85f64.to_radians()) == Some(SeasonOfYear::Winter))
    );
}

#[test]
fn new_year_and_season_turns_over_two_years() {
    let planet = planet(BRINDLE);
    let mut app = app(BRINDLE, settings_at(45.0, 0.0), 0.0, FRAME);
    // Start just after time zero, which is itself an equinox.
    app.world_mut()
        .resource_mut::<WorldClock>()
        .jump_to(WorldInstant::from_secs_f64(100.0));
    app.update();
    app.world_mut()
        .resource_mut::<WorldClock>()
        .step(2.0 * planet.year_s())
        .unwrap();
    app.update();
    let years: Vec<i64> = notices(&app)
        .iter()
        .filter_map(|n| {
            if let SkyEventKind::NewYear { year } = n.kind {
                Some(year)
            } else {
                None
            }
        })
        .collect();
    assert_eq!(years, vec![2, 3]);
    let turns = notices(&app)
        .iter()
        .filter(|n| matches!(n.kind, SkyEventKind::Season(_)))
        .count();
    assert_eq!(turns, 8);
}

#[test]
fn pause_stops_everything() {
    let mut app = app(BRINDLE, settings_at(30.0, 0.0), 3600.0, FRAME);
    for _ in 0..5 {
        app.update();
    }
    app.world_mut().resource_mut::<WorldClock>().pause();
    app.update();
    let clock = app.world().resource::<WorldClock>().clone();
    let sky = app.world().resource::<SkyState>().clone();
    let seen = notices(&app).len();
    for _ in 0..50 {
        app.update();
    }
    assert_eq!(app.world().resource::<WorldClock>().now(), clock.now());
    assert_eq!(*app.world().resource::<SkyState>(), sky);
    assert_eq!(notices(&app).len(), seen);
    // Pausing the game's virtual time pauses the world clock too.
    app.world_mut().resource_mut::<WorldClock>().resume();
    app.world_mut().resource_mut::<Time<Virtual>>().pause();
    app.update();
    app.update();
    assert_eq!(app.world().resource::<WorldClock>().now(), clock.now());
}

#[test]
fn save_and_restore_of_the_clock_is_exact() {
    let mut first = app(BRINDLE, settings_at(30.0, 0.0), 12_345.678, FRAME);
    for _ in 0..97 {
        first.update();
    }
    let saved = ron::to_string(first.world().resource::<WorldClock>()).unwrap();
    let restored: WorldClock = ron::from_str(&saved).unwrap();
    assert_eq!(&restored, first.world().resource::<WorldClock>());
    let mut second = app(BRINDLE, settings_at(30.0, 0.0), 0.0, FRAME);
    // The first frame of an app has no real delta; start the second app's real clock first.
    second.update();
    second.insert_resource(restored);
    // Same instant, same rate: the next frames agree bit for bit.
    first.update();
    second.update();
    let (a, b) = (
        first.world().resource::<SkyState>(),
        second.world().resource::<SkyState>(),
    );
    assert_eq!(a.world_time_s.to_bits(), b.world_time_s.to_bits());
    assert_eq!(a, b);
}

#[test]
fn same_world_and_steps_give_bit_identical_sky_twice() {
    let run = || {
        let mut app = app(BRINDLE, settings_at(51.0, -3.0), 7_777.0, FRAME);
        let mut states = Vec::new();
        for i in 0..120 {
            if i == 60 {
                app.world_mut()
                    .resource_mut::<WorldClock>()
                    .step(123_456.789)
                    .unwrap();
            }
            app.update();
            states.push(format!("{:?}", app.world().resource::<SkyState>()));
        }
        (states, notices(&app).to_vec())
    };
    let (a, na) = run();
    let (b, nb) = run();
    assert_eq!(a, b);
    assert_eq!(na.len(), nb.len());
    assert!(
        na.iter()
            .zip(&nb)
            .all(|(x, y)| x.world_time_s.to_bits() == y.world_time_s.to_bits() && x.kind == y.kind)
    );
}

#[test]
fn jump_to_a_date_and_hour() {
    let planet = planet(BRINDLE);
    let mut app = app(BRINDLE, settings_at(0.0, 0.0), 0.0, FRAME);
    app.update();
    app.world_mut()
        .resource_mut::<WorldClock>()
        .jump_to_date(&planet, 3, 17, 13.5)
        .unwrap();
    app.update();
    let sky = app.world().resource::<SkyState>();
    assert_eq!((sky.date.year, sky.date.day_of_year), (3, 17));
    assert_approx_eq!(sky.date.hour_of_day, 13.5, 1e-6);
    assert_eq!(sky.date.clock(), "13:30");
    // Jumps send no notices for the skipped span.
    assert_eq!(count(&app, SkyEventKind::Rise(SkyBody::Star(0))), 0);
    let err = app
        .world_mut()
        .resource_mut::<WorldClock>()
        .jump_to_date(&planet, 3, 17, 25.0);
    assert!(err.is_err(), "hour 25 of a 20-hour day");
}

#[test]
fn an_invalid_inline_world_is_reported_not_panicked() {
    let mut bad = spec(BRINDLE);
    bad.orbit.eccentricity = 1.5;
    let mut app = App::new();
    app.add_plugins(MinimalPlugins)
        .add_plugins(InsolaPlugins::new().with_world_spec(bad));
    #[derive(Resource, Default)]
    struct Rejections(Vec<WorldRejected>);
    app.init_resource::<Rejections>().add_systems(
        Last,
        |mut r: MessageReader<WorldRejected>, mut out: ResMut<Rejections>| {
            out.0.extend(r.read().cloned());
        },
    );
    app.update();
    app.update();
    let rejections = &app.world().resource::<Rejections>().0;
    assert_eq!(rejections.len(), 1);
    assert_eq!(rejections[0].field.as_deref(), Some("orbit.eccentricity"));
    assert!(!rejections[0].kept_world);
    assert!(!app.world().resource::<SkyState>().ready);
}

#[test]
fn moon_phases_rises_and_eclipses() {
    let text = brindle_with_moon();
    let planet = planet(&text);
    let mut app = app(&text, settings_at(15.0, 0.0), 0.0, FRAME);
    app.update();
    let span = 100.0 * 86_400.0;
    app.world_mut()
        .resource_mut::<WorldClock>()
        .step(span)
        .unwrap();
    app.update();
    let moon = 0;
    let synodic =
        insola::moons::synodic_period_s(planet.moon_orbits()[0].period_s, planet.year_s());
    let expected = span / synodic;
    let news = count(
        &app,
        SkyEventKind::MoonPhase {
            moon,
            phase: MoonPhase::New,
        },
    ) as f64;
    let fulls = count(
        &app,
        SkyEventKind::MoonPhase {
            moon,
            phase: MoonPhase::Full,
        },
    ) as f64;
    assert!(
        (news - expected).abs() <= 1.0 && (fulls - expected).abs() <= 1.0,
        "{news} new, {fulls} full, {expected} expected"
    );
    // In the ecliptic plane every full moon passes through the planet's shadow.
    let eclipses = count(
        &app,
        SkyEventKind::MoonEclipse {
            moon,
            stage: EclipseStage::Begins,
        },
    ) as f64;
    assert!(
        (eclipses - fulls).abs() <= 1.0,
        "{eclipses} eclipses for {fulls} full moons"
    );
    // Moonrise about once per local day of the moon (a bit longer than the solar day).
    let rises = count(&app, SkyEventKind::Rise(SkyBody::Moon(moon))) as f64;
    let moon_days = span / planet.day_s() * (1.0 - planet.day_s() / synodic);
    assert!(
        (rises - moon_days).abs() <= 2.0,
        "{rises} moonrises, {moon_days} expected"
    );
    // Each full moon: the moon's ecliptic longitude is opposite the star's.
    for n in notices(&app).iter().filter(|n| {
        n.kind
            == SkyEventKind::MoonPhase {
                moon,
                phase: MoonPhase::Full,
            }
    }) {
        let p = planet.moon_orbits()[0].position_at(n.world_time_s);
        let d = insola::angle::wrap_pi(
            p.y.atan2(p.x) - planet.star_instant(n.world_time_s).ecliptic_longitude_rad,
        );
        assert_approx_eq!(d.abs(), std::f64::consts::PI, 1e-6);
    }
}
