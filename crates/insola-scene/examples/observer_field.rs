//! Many observers at once: a map of the whole planet, one tile per place, each coloured by
//! its own temperature as the seasons sweep over it (blue cold, red hot).
//!
//! Every tile is an entity with a `SurfacePlace`; the plugin keeps its `LocalConditions`
//! current. It starts on Verdance with its continents (`verdance.land.ron`), so the plugin's
//! map climate colours each tile by land and sea: continental interiors bake and freeze, coasts
//! stay mild. Press `W` for the next world (other worlds show the zonal climate; the map climate
//! follows the land file only on Verdance).

mod support;

use bevy::prelude::*;
use bevy_insola::insola::map_climate::SurfaceLayout;
use bevy_insola::prelude::*;
use bevy_insola::{ActiveWorld, ClimateSurface, WorldFile};

const COLUMNS: usize = 72;
const ROWS: usize = 36;
const TILE: f32 = 1.0;
/// Colours from −40 °C to +50 °C.
const PALETTE: usize = 32;

fn main() {
    App::new()
        .add_plugins(DefaultPlugins)
        .add_plugins(
            InsolaPlugins::new()
                .with_world_file(support::world_asset_path("verdance"))
                // Four world days per real second: a year in a little over a minute.
                .with_clock_rate(4.0 * 21.0 * 3600.0),
        )
        .insert_resource(verdance_continents())
        .add_systems(Startup, (spawn_map, load_worlds))
        .add_systems(
            Update,
            (colour_by_temperature, next_world, land_for_verdance),
        )
        .run();
}

/// Verdance's invented continents on the map climate's default grid.
fn verdance_continents() -> ClimateSurface {
    let text = include_str!("../../../assets/worlds/verdance.land.ron");
    let layout = SurfaceLayout::from_ron_str(text).expect("the shipped land file is valid");
    ClimateSurface::new(layout.rasterise(720, 360).expect("a valid raster size"))
}

/// The land file belongs to Verdance: keep it while Verdance is shown, drop it otherwise.
fn land_for_verdance(
    mut commands: Commands,
    world: Res<ActiveWorld>,
    surface: Option<Res<ClimateSurface>>,
) {
    if !world.is_changed() {
        return;
    }
    let on_verdance = world.planet().is_some_and(|p| p.spec().name == "Verdance");
    match (on_verdance, surface.is_some()) {
        (true, false) => commands.insert_resource(verdance_continents()),
        (false, true) => commands.remove_resource::<ClimateSurface>(),
        _ => {}
    }
}

#[derive(Resource)]
struct Palette(Vec<Handle<StandardMaterial>>);

fn palette_colour(i: usize) -> Color {
    // Blue → white → red.
    let x = i as f32 / (PALETTE - 1) as f32;
    if x < 0.5 {
        Color::srgb(0.15 + 1.6 * x, 0.3 + 1.3 * x, 1.0)
    } else {
        Color::srgb(1.0, 1.0 - 1.6 * (x - 0.5), 1.0 - 1.9 * (x - 0.5))
    }
}

fn spawn_map(
    mut commands: Commands,
    mut meshes: ResMut<Assets<Mesh>>,
    mut materials: ResMut<Assets<StandardMaterial>>,
) {
    let palette: Vec<_> = (0..PALETTE)
        .map(|i| {
            materials.add(StandardMaterial {
                base_color: palette_colour(i),
                unlit: true,
                ..default()
            })
        })
        .collect();
    let tile = meshes.add(Cuboid::new(TILE * 0.92, 0.1, TILE * 0.92));
    for row in 0..ROWS {
        for col in 0..COLUMNS {
            let lat = 90.0 - (row as f64 + 0.5) * 180.0 / ROWS as f64;
            let lon = -180.0 + (col as f64 + 0.5) * 360.0 / COLUMNS as f64;
            let Ok(place) = SurfacePlace::from_degrees(lat, lon) else {
                continue;
            };
            let x = (col as f32 - COLUMNS as f32 / 2.0) * TILE;
            let z = (row as f32 - ROWS as f32 / 2.0) * TILE;
            commands.spawn((
                place,
                Mesh3d(tile.clone()),
                MeshMaterial3d(palette[PALETTE / 2].clone()),
                Transform::from_xyz(x, 0.0, z),
            ));
        }
    }
    commands.insert_resource(Palette(palette));
    commands.spawn((
        Camera3d::default(),
        Transform::from_xyz(0.0, 62.0, 0.1).looking_at(Vec3::ZERO, Vec3::NEG_Z),
    ));
    commands.spawn((
        Text::new("..."),
        Node {
            position_type: PositionType::Absolute,
            top: Val::Px(8.0),
            left: Val::Px(10.0),
            ..default()
        },
        support::StatusLine { show_rate: false },
    ));
}

fn colour_by_temperature(
    palette: Res<Palette>,
    mut tiles: Query<
        (&LocalConditions, &mut MeshMaterial3d<StandardMaterial>),
        Changed<LocalConditions>,
    >,
    world: Res<ActiveWorld>,
    sky: Res<SkyState>,
    mut text: Query<&mut Text, With<support::StatusLine>>,
) {
    for (conditions, mut material) in &mut tiles {
        if !conditions.temperature_c.is_finite() {
            continue; // the climate is still being computed
        }
        let x = ((conditions.temperature_c + 40.0) / 90.0).clamp(0.0, 1.0);
        let i = (x * (PALETTE - 1) as f32).round() as usize;
        if material.0 != palette.0[i] {
            material.0 = palette.0[i].clone();
        }
    }
    if let (Some(planet), Ok(mut text)) = (world.planet(), text.single_mut()) {
        text.0 = format!(
            "{} | year {} day {} | temperature -40 C (blue) to +50 C (red) | W: next world",
            planet.spec().name,
            sky.date.year,
            sky.date.day_of_year + 1
        );
    }
}

#[derive(Resource)]
struct Worlds(Vec<Handle<WorldFile>>);

fn load_worlds(mut commands: Commands, server: Res<AssetServer>) {
    let handles = support::world_names()
        .map(|name| server.load(support::world_asset_path(name)))
        .collect();
    commands.insert_resource(Worlds(handles));
}

fn next_world(
    keys: Res<ButtonInput<KeyCode>>,
    worlds: Res<Worlds>,
    files: Res<Assets<WorldFile>>,
    mut world: ResMut<ActiveWorld>,
) {
    if !keys.just_pressed(KeyCode::KeyW) {
        return;
    }
    let name = world
        .planet()
        .map(|p| p.spec().name.clone())
        .unwrap_or_default();
    let current = worlds
        .0
        .iter()
        .position(|h| files.get(h).is_some_and(|f| f.spec.name == name))
        .unwrap_or(0);
    let next = &worlds.0[(current + 1) % worlds.0.len()];
    if let Some(file) = files.get(next) {
        let spec = file.spec.clone();
        if world.set_spec(&spec).is_ok() {
            world.follow(next.clone());
        }
    }
}
