//! Shared set-up for the App-level tests: invented worlds and a headless app with manual time.

#![allow(
    dead_code,
    reason = "each test binary uses a different part of the helpers"
)]

pub mod assets;

use std::time::Duration;

use bevy::prelude::*;
use bevy::time::TimeUpdateStrategy;
use bevy_insola::prelude::*;
use insola::{Planet, WorldSpec};

/// Brindle: an invented temperate world with a 20-hour day and a 200-day year.
pub const BRINDLE: &str = r#"(
    name: "Brindle",
    star: (temperature_k: 5800, radius_r_sun: 1.0, luminosity_l_sun: 1.0),
    orbit: (semi_major_axis_au: 1.0, eccentricity: 0.02, periapsis_longitude_deg: 70, period_days: 200),
    spin: (obliquity_deg: 23, solar_day_hours: 20),
)"#;

/// Ombrel: an invented untilted world, so the star passes the zenith at the equator every noon.
pub const OMBREL: &str = r#"(
    name: "Ombrel",
    star: (temperature_k: 5200, radius_r_sun: 0.9, luminosity_l_sun: 0.7),
    orbit: (semi_major_axis_au: 0.8, eccentricity: 0.0, periapsis_longitude_deg: 0, period_days: 150),
    spin: (obliquity_deg: 0, solar_day_hours: 30),
)"#;

pub fn spec(text: &str) -> WorldSpec {
    WorldSpec::from_ron_str(text).expect("test world is valid")
}

pub fn planet(text: &str) -> Planet {
    Planet::new(&spec(text)).expect("test world is valid")
}

/// Every sky notice seen, in the order received.
#[derive(Resource, Default)]
pub struct Collected(pub Vec<SkyNotice>);

pub fn collect(mut reader: MessageReader<SkyNotice>, mut collected: ResMut<Collected>) {
    collected.0.extend(reader.read().copied());
}

/// A headless app (MinimalPlugins) with the world `text`, the given settings, clock rate and
/// manual frame time; sky notices are collected into [`Collected`].
pub fn app(text: &str, settings: InsolaSettings, rate: f64, frame: Duration) -> App {
    let mut app = App::new();
    app.add_plugins(MinimalPlugins)
        .add_plugins(
            InsolaPlugins::new()
                .with_world_spec(spec(text))
                .with_settings(settings)
                .with_clock_rate(rate),
        )
        .insert_resource(TimeUpdateStrategy::ManualDuration(frame))
        .init_resource::<Collected>()
        .add_systems(Last, collect);
    app
}

pub fn settings_at(latitude_deg: f64, longitude_deg: f64) -> InsolaSettings {
    InsolaSettings {
        reference_latitude_deg: latitude_deg,
        reference_longitude_deg: longitude_deg,
        ..default()
    }
}

pub fn notices(app: &App) -> &[SkyNotice] {
    &app.world().resource::<Collected>().0
}

pub fn count(app: &App, kind: SkyEventKind) -> usize {
    notices(app).iter().filter(|n| n.kind == kind).count()
}

/// Asserts `|a − b| ≤ eps`, printing the difference.
#[macro_export]
macro_rules! assert_approx_eq {
    ($a:expr, $b:expr, $eps:expr) => {{
        let (a, b, eps) = ($a as f64, $b as f64, $eps as f64);
        assert!(
            (a - b).abs() <= eps,
            "{} = {a} vs {} = {b}: differ by {} > {eps}",
            stringify!($a),
            stringify!($b),
            (a - b).abs()
        );
    }};
}

/// Brindle with one moon on an orbit in the ecliptic, so every full moon is eclipsed.
pub fn brindle_with_moon() -> String {
    BRINDLE.replace(
        "spin: (obliquity_deg: 23, solar_day_hours: 20),",
        r#"spin: (obliquity_deg: 23, solar_day_hours: 20),
    moons: [(name: "Tamsin", radius_km: 1700, distance_km: 380000, period_days: 27.3,
             inclination_deg: 0, phase_at_zero_deg: 90, bond_albedo: 0.12)],"#,
    )
}
