//! A headless game server: no window, no renderer, just the world clock and the sky's
//! notifications (sunrise, twilights, moon phases, season turns) printed as they happen.
//!
//! ```sh
//! cargo run --example headless_server -- calvenne 3     # world, days to run
//! ```

use std::time::Duration;

use bevy::app::ScheduleRunnerPlugin;
use bevy::prelude::*;
use bevy_insola::ActiveWorld;
use bevy_insola::prelude::*;

fn main() -> AppExit {
    let mut args = std::env::args().skip(1);
    let world = args.next().unwrap_or_else(|| "verdance".into());
    let days: f64 = match args.next().map(|d| d.parse()) {
        None => 3.0,
        Some(Ok(d)) if d > 0.0 => d,
        Some(_) => {
            eprintln!("headless_server: the number of days must be a positive number");
            return AppExit::error();
        }
    };
    // Without an asset server the world file is read here and handed over as a spec.
    let path = format!(
        "{}/assets/worlds/{world}.world.ron",
        env!("CARGO_MANIFEST_DIR")
    );
    let spec = match std::fs::read_to_string(&path)
        .map_err(|e| e.to_string())
        .and_then(|text| insola::WorldSpec::from_ron_str(&text).map_err(|e| e.to_string()))
    {
        Ok(spec) => spec,
        Err(e) => {
            eprintln!("headless_server: {path}: {e}");
            return AppExit::error();
        }
    };

    App::new()
        // 100 server ticks per second; each tick advances the world by 36 minutes.
        .add_plugins(MinimalPlugins.set(ScheduleRunnerPlugin::run_loop(Duration::from_millis(10))))
        .add_plugins(
            InsolaPlugins::new()
                .with_world_spec(spec)
                .with_reference_place(52.0, 0.0)
                .with_clock_rate(36.0 * 60.0 * 100.0),
        )
        .insert_resource(RunFor { days })
        .add_systems(Update, (print_notices, stop_after_days))
        .run()
}

#[derive(Resource)]
struct RunFor {
    days: f64,
}

fn print_notices(mut notices: MessageReader<SkyNotice>, world: Res<ActiveWorld>) {
    let Some(planet) = world.planet() else {
        return;
    };
    for notice in notices.read() {
        let date = planet.date_at(notice.world_time_s);
        // Notices name moons by index; say their names instead.
        let mut what = notice.kind.to_string();
        for (i, moon) in planet.spec().moons.iter().enumerate() {
            what = what.replace(&format!("moon {i}"), &moon.name);
        }
        // Printed days of the year count from 1, as `insola --date` reads them; the field
        // `day_of_year` counts from 0.
        println!(
            "year {} day {:>3} {}  {what}",
            date.year,
            date.day_of_year + 1,
            date_clock(date.hour_of_day)
        );
    }
}

fn date_clock(hours: f64) -> String {
    let minutes = (hours * 60.0).floor().max(0.0) as u64;
    format!("{:02}:{:02}", minutes / 60, minutes % 60)
}

fn stop_after_days(
    clock: Res<WorldClock>,
    world: Res<ActiveWorld>,
    run: Res<RunFor>,
    mut exit: MessageWriter<AppExit>,
) {
    if let Some(planet) = world.planet()
        && clock.world_time_s() >= run.days * planet.day_s()
    {
        exit.write(AppExit::Success);
    }
}
