//! Save games: everything the plugin lets a game serialise comes back equal through JSON and
//! through RON, and the calendar jump refuses readings outside the calendar.

use std::time::Duration;

use bevy::prelude::*;
use bevy_insola::prelude::*;
use bevy_insola::{ClockError, SeasonMark};
use serde::Serialize;
use serde::de::DeserializeOwned;

use crate::common::*;

fn round_trips<T: Serialize + DeserializeOwned + PartialEq + std::fmt::Debug>(value: &T) {
    let json = serde_json::to_string(value).expect("serialises to JSON");
    let back: T = serde_json::from_str(&json).unwrap_or_else(|e| panic!("JSON {json}: {e}"));
    assert_eq!(&back, value, "through JSON {json}");
    let ron_text = ron::to_string(value).expect("serialises to RON");
    let back: T = ron::from_str(&ron_text).unwrap_or_else(|e| panic!("RON {ron_text}: {e}"));
    assert_eq!(&back, value, "through RON {ron_text}");
}

#[test]
fn clocks_round_trip_through_json_and_ron() {
    // The default clock has no frame-time cap: JSON has no infinity, so it must not be one.
    round_trips(&WorldClock::default());
    let mut clock =
        WorldClock::starting_at(WorldInstant::from_parts(123_456_789, 0.25)).with_rate(-4000.0);
    clock.max_real_delta_s = Some(0.25);
    clock.real_seconds_per_day = Some(90.0);
    clock.pause();
    clock.step(12.5).unwrap();
    round_trips(&clock);
    // A clock saved paused restores paused.
    let back: WorldClock = serde_json::from_str(&serde_json::to_string(&clock).unwrap()).unwrap();
    assert!(back.is_paused());
    round_trips(&WorldInstant::from_secs_f64(-7.75));
}

#[test]
fn every_notice_a_year_sends_round_trips() {
    let text = brindle_with_moon();
    let mut app = app(
        &text,
        settings_at(30.0, 10.0),
        200.0 * 72_000.0 / 600.0,
        Duration::from_millis(100),
    );
    for _ in 0..6_000 {
        app.update();
    }
    let seen = notices(&app);
    assert!(seen.len() > 1_000, "a year of notices: {}", seen.len());
    for notice in seen {
        round_trips(notice);
    }
    for mark in [
        SeasonMark::NorthwardEquinox,
        SeasonMark::NorthernSolstice,
        SeasonMark::SouthwardEquinox,
        SeasonMark::SouthernSolstice,
    ] {
        round_trips(&mark);
    }
}

#[test]
fn a_calendar_jump_outside_the_year_is_refused() {
    let planet = planet(BRINDLE);
    let mut clock = WorldClock::default();
    // Brindle: a 200-day year of 20-hour days holds 240 local days.
    let days = u64::from(planet.year_days(2));
    assert_eq!(days, 240);
    let err = clock.jump_to_date(&planet, 2, days, 1.0).unwrap_err();
    assert!(matches!(err, ClockError::Calendar(_)), "{err}");
    clock.jump_to_date(&planet, 2, days - 1, 1.0).unwrap();
    assert_eq!(clock.date(&planet).year, 2);
    assert!(clock.jump_to_date_text(&planet, "3-500").is_err());
    clock.jump_to_date_text(&planet, "3-17T06:30").unwrap();
    let date = clock.date(&planet);
    assert_eq!((date.year, date.day_of_year), (3, 16));
}

#[test]
fn one_world_day_per_real_second_holds_for_a_world_given_later() {
    let mut app = App::new();
    app.add_plugins(MinimalPlugins)
        .add_plugins(InsolaPlugins::new().with_real_seconds_per_day(2.0))
        .insert_resource(bevy::time::TimeUpdateStrategy::ManualDuration(
            Duration::from_millis(250),
        ));
    app.update();
    app.world_mut()
        .resource_mut::<ActiveWorld>()
        .set_spec(&spec(BRINDLE))
        .unwrap();
    app.update();
    app.update();
    let rate = app.world().resource::<WorldClock>().rate();
    let day_s = planet(BRINDLE).day_s();
    assert!((rate - day_s / 2.0).abs() < 1e-9, "rate {rate}");
}
