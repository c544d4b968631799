//! Long runs of the plugin: thousands of world years at a year per real second, with the clock
//! exact to the millisecond, every yearly notice once and in order, and memory flat.
//!
//! `cargo test` runs 200 years; the full 10,000 years is ignored by default (several minutes
//! in a debug build): `cargo test --release --test long_runs -- --ignored`.

#[path = "plugin/common/mod.rs"]
mod common;

use std::alloc::System;
use std::sync::Mutex;
use std::time::Duration;

use bevy::prelude::*;
use bevy_insola::SeasonMark;
use bevy_insola::prelude::*;
use cap::Cap;
use common::*;

/// Counts the heap bytes in use, to check that memory stays flat.
#[global_allocator]
static HEAP: Cap<System> = Cap::new(System, usize::MAX);

/// The heap is shared by every test of this binary: one long run at a time.
static ONE_AT_A_TIME: Mutex<()> = Mutex::new(());

/// Real time per frame, nanoseconds (60 frames per second, rounded to whole nanoseconds so the
/// exact world time is an integer computation).
const FRAME_NS: u64 = 16_666_667;

/// What the run saw, in fixed-size counters (a growing log would itself use memory).
#[derive(Resource, Default)]
struct Tally {
    new_years: u64,
    last_year: Option<i64>,
    year_gaps: u64,
    season_turns: u64,
    last_mark: Option<SeasonMark>,
    marks_out_of_order: u64,
    sunrises: u64,
}

fn tally(mut notices: MessageReader<SkyNotice>, mut tally: ResMut<Tally>) {
    for notice in notices.read() {
        match notice.kind {
            SkyEventKind::NewYear { year } => {
                if tally.last_year.is_some_and(|last| year != last + 1) {
                    tally.year_gaps += 1;
                }
                tally.last_year = Some(year);
                tally.new_years += 1;
            }
            SkyEventKind::Season(mark) => {
                if tally.last_mark.is_some_and(|last| next_mark(last) != mark) {
                    tally.marks_out_of_order += 1;
                }
                tally.last_mark = Some(mark);
                tally.season_turns += 1;
            }
            SkyEventKind::Rise(SkyBody::Star(0)) => tally.sunrises += 1,
            _ => {}
        }
    }
}

fn next_mark(mark: SeasonMark) -> SeasonMark {
    match mark {
        SeasonMark::NorthwardEquinox => SeasonMark::NorthernSolstice,
        SeasonMark::NorthernSolstice => SeasonMark::SouthwardEquinox,
        SeasonMark::SouthwardEquinox => SeasonMark::SouthernSolstice,
        SeasonMark::SouthernSolstice => SeasonMark::NorthwardEquinox,
    }
}

fn run_years(years: u64) {
    let _alone = ONE_AT_A_TIME.lock().unwrap_or_else(|e| e.into_inner());
    let planet = planet(BRINDLE);
    // Brindle's year is a whole number of seconds, so a rate of a year per second is exact.
    let year_s = planet.year_s();
    assert_eq!(year_s.fract(), 0.0);
    let rate = year_s as u64;
    let mut app = App::new();
    app.add_plugins(MinimalPlugins)
        .add_plugins(
            InsolaPlugins::new()
                .with_world_spec(spec(BRINDLE))
                .with_reference_place(45.0, 0.0)
                .with_clock_rate(year_s),
        )
        .insert_resource(bevy::time::TimeUpdateStrategy::ManualDuration(
            Duration::from_nanos(FRAME_NS),
        ))
        .init_resource::<Tally>()
        .add_systems(Last, tally);
    app.world_mut().spawn(StarLight::PRIMARY);
    app.world_mut()
        .spawn(SurfacePlace::from_degrees(10.0, 20.0).unwrap());

    let frames_per_year = 1_000_000_000 / FRAME_NS;
    let frames = years * frames_per_year;
    let warm_up = frames_per_year * 10;
    let mut heap_after_warm_up = 0;
    for frame in 1..=frames {
        app.update();
        if frame == warm_up {
            heap_after_warm_up = HEAP.allocated();
        }
    }
    let heap_at_end = HEAP.allocated();

    // The clock: exactly rate × real time, to the millisecond. Bevy's first update measures no
    // time, so `frames − 1` frame steps have passed.
    let exact_ns = u128::from(rate) * u128::from(FRAME_NS) * u128::from(frames - 1);
    let now = app.world().resource::<WorldClock>().now();
    let drift_s = (now.whole_seconds() as i128 - (exact_ns / 1_000_000_000) as i128) as f64
        + (now.fraction() - (exact_ns % 1_000_000_000) as f64 * 1e-9);
    assert!(
        drift_s.abs() < 1e-3,
        "clock drift {drift_s} s after {years} years"
    );

    // Yearly notices: one new year per year start in [0, now) (notices cover half-open spans,
    // so the start of year 1 at time zero, where the clock starts, is announced too), numbered
    // without gaps; four season turns a year in their order.
    let elapsed_years = (now.whole_seconds() as f64 / year_s).floor() as u64;
    let t = app.world().resource::<Tally>();
    assert_eq!(t.new_years, elapsed_years + 1, "new years");
    assert_eq!(t.year_gaps, 0);
    let turns_expected = 4 * elapsed_years;
    assert!(
        t.season_turns.abs_diff(turns_expected) <= 4,
        "{} season turns for {elapsed_years} years",
        t.season_turns
    );
    assert_eq!(t.marks_out_of_order, 0);
    // Brindle has a 20-hour day: 240 sunrises a year at 45° N.
    let days = (now.whole_seconds() as f64 / planet.day_s()).floor() as u64;
    assert!(
        t.sunrises.abs_diff(days) <= 2,
        "{} sunrises in {days} days",
        t.sunrises
    );

    // Memory flat: what the run holds after its warm-up is all it ever holds.
    let growth = heap_at_end as i64 - heap_after_warm_up as i64;
    assert!(
        growth < 256 * 1024,
        "heap grew by {growth} bytes from year 10 to year {years}"
    );
}

#[test]
fn two_hundred_years_at_a_year_per_second() {
    run_years(200);
}

#[test]
#[ignore = "the full form, several minutes in a debug build"]
fn ten_thousand_years_at_a_year_per_second() {
    run_years(10_000);
}
