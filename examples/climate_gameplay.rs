//! Reading the climate from gameplay code: a farm on Verdance sows when the season's warmth
//! arrives, counts growing warmth day by day, harvests when the crop is ripe, and warns of
//! night frost — all from `LocalConditions` and `SeasonalClimate`, with no renderer.
//!
//! ```sh
//! cargo run --example climate_gameplay
//! ```

use std::time::Duration;

use bevy::app::ScheduleRunnerPlugin;
use bevy::prelude::*;
use bevy_insola::ActiveWorld;
use bevy_insola::prelude::*;

/// Daily mean temperature above which the crop grows, °C.
const GROWING_BASE_C: f64 = 6.0;
/// Warmth the crop needs between sowing and harvest, degree-days above the base.
const RIPE_DEGREE_DAYS: f64 = 900.0;

fn main() -> AppExit {
    let path = concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/assets/worlds/verdance.world.ron"
    );
    let spec = match std::fs::read_to_string(path)
        .map_err(|e| e.to_string())
        .and_then(|text| insola::WorldSpec::from_ron_str(&text).map_err(|e| e.to_string()))
    {
        Ok(spec) => spec,
        Err(e) => {
            eprintln!("climate_gameplay: {path}: {e}");
            return AppExit::error();
        }
    };
    App::new()
        .add_plugins(MinimalPlugins.set(ScheduleRunnerPlugin::run_loop(Duration::from_millis(2))))
        // One world hour per tick.
        .add_plugins(
            InsolaPlugins::new()
                .with_world_spec(spec)
                .with_clock_rate(3600.0 / 0.002),
        )
        .add_systems(Startup, |mut commands: Commands| {
            let Ok(place) = SurfacePlace::from_degrees(48.0, 0.0) else {
                return;
            };
            commands.spawn((Name::new("Brennick farm"), place, Farm::default()));
        })
        .add_systems(Update, (tend_the_farm, stop_after_a_year))
        .run()
}

/// The gameplay state of one farm.
#[derive(Component, Default)]
struct Farm {
    sown_on_day: Option<i64>,
    degree_days: f64,
    harvests: u32,
    frost_warned_today: bool,
}

fn tend_the_farm(
    mut notices: MessageReader<SkyNotice>,
    climate: Res<SeasonalClimate>,
    world: Res<ActiveWorld>,
    mut farms: Query<(&Name, &SurfacePlace, &LocalConditions, &mut Farm)>,
) {
    if world.planet().is_none() || !climate.is_ready() {
        return;
    }
    let new_days: Vec<(i64, f64)> = notices
        .read()
        .filter_map(|n| match n.kind {
            SkyEventKind::NewDay { day } => Some((day, n.world_time_s)),
            _ => None,
        })
        .collect();
    for (name, place, now, mut farm) in &mut farms {
        // Every frame: the local temperature right now, with the day-night swing.
        if now.temperature_c < 0.0 && farm.sown_on_day.is_some() && !farm.frost_warned_today {
            farm.frost_warned_today = true;
            println!(
                "{name}: frost tonight ({:.1} °C), cover the seedlings",
                now.temperature_c
            );
        }
        // Once a day: the seasonal mean temperature at the farm's latitude.
        for &(day, t_s) in &new_days {
            farm.frost_warned_today = false;
            let Some(mean_c) = climate.zonal_temperature_c(place.latitude_rad(), t_s) else {
                continue;
            };
            match farm.sown_on_day {
                None if mean_c > GROWING_BASE_C + 2.0 && now.season == SeasonOfYear::Spring => {
                    farm.sown_on_day = Some(day);
                    farm.degree_days = 0.0;
                    println!(
                        "{name}: day {day}, {mean_c:.1} °C on average, {}: sowing",
                        now.season
                    );
                }
                None => {}
                Some(sown) => {
                    farm.degree_days += (mean_c - GROWING_BASE_C).max(0.0);
                    if farm.degree_days >= RIPE_DEGREE_DAYS {
                        farm.harvests += 1;
                        farm.sown_on_day = None;
                        println!(
                            "{name}: day {day}, ripe after {} days: harvest number {}",
                            day - sown,
                            farm.harvests
                        );
                    } else if mean_c < GROWING_BASE_C - 4.0 {
                        farm.sown_on_day = None;
                        println!(
                            "{name}: day {day}, {mean_c:.1} °C: the cold came first, crop lost"
                        );
                    }
                }
            }
        }
    }
}

fn stop_after_a_year(
    clock: Res<WorldClock>,
    world: Res<ActiveWorld>,
    mut exit: MessageWriter<AppExit>,
) {
    if let Some(planet) = world.planet()
        && clock.world_time_s() >= planet.year_s()
    {
        exit.write(AppExit::Success);
    }
}
