//! A small place on an invented world — stones, huts, trees, a pond and a sundial — under the
//! star, two moons and Bevy's atmosphere, all driven by Insola.
//!
//! ```sh
//! cargo run --release --example sky_scene                     # a window; keys below
//! cargo run --release --example sky_scene -- --world calvenne --lat 70
//! cargo run --example sky_scene -- --out docs/images --at 100.5 --at 100.9   # PNGs, no window
//! cargo run --example sky_scene --features tuning-panel -- --window-shot tuner.png
//! ```
//!
//! With `--features tuning-panel` the world tuner opens over the scene: sliders for the
//! world's shape, a time scrubber, readouts and live plots, and a save button.
//!
//! Keys: `=`/`-` run time faster/slower, Space pause, `D` one day on, `S` one season on,
//! `W` next world, `L`/`K` latitude up/down 5°, arrows or left-drag to turn the camera,
//! wheel or PageUp/PageDown to zoom.
//!
//! Photosensitivity: at high rates day and night would alternate several times a second; the
//! plugin's flash guard (on) then shows the day's or the year's mean light instead.
//!
//! The plugin runs in top-of-atmosphere mode (`with_engine_atmosphere_from_world()`): Bevy's
//! atmosphere dims and reddens each light itself, so Insola must not do it too.

mod support;

use std::f32::consts::{PI, TAU};
use std::sync::{Arc, Mutex};

use bevy::light::{CascadeShadowConfigBuilder, SunDisk};
use bevy::pbr::AtmosphereSettings;
use bevy::prelude::*;
use bevy_insola::prelude::*;
use bevy_insola::{ActiveWorld, WorldChanged, WorldFile};
use insola::Planet;
use support::capture::{self, CapturePlugin, Shot};
use support::{OrbitCamera, SceneOptions};

const HELP: &str = "=/- faster/slower | Space pause | D +1 day | S +1 season | W next world | L/K latitude | arrows, drag: camera | fast rates show mean light (flash guard)";

fn main() -> AppExit {
    let options = SceneOptions::from_args();
    let spec = match support::read_world(&options.world) {
        Ok(spec) => spec,
        Err(e) => {
            eprintln!("sky_scene: {e}");
            return AppExit::error();
        }
    };
    let look = match options.look_azimuth_deg() {
        Ok(look) => look,
        Err(e) => {
            eprintln!("sky_scene: {e}");
            return AppExit::error();
        }
    };
    // The spec was checked by `read_world`.
    let Ok(planet) = Planet::new(&spec) else {
        return AppExit::error();
    };
    let times: Vec<f64> = options
        .at
        .iter()
        .map(|days| SceneOptions::world_time_s(&planet, *days))
        .collect();

    let mut app = App::new();
    let insola = InsolaPlugins::new()
        .with_engine_atmosphere_from_world()
        .with_reference_place(options.lat, 0.0)
        .with_clock_rate(options.rate)
        .with_start(WorldInstant::from_secs_f64(
            times.first().copied().unwrap_or(
                // Mid-morning of day 100 unless told otherwise.
                SceneOptions::world_time_s(&planet, 100.4),
            ),
        ));

    let headless = options.out.is_some();
    if headless {
        app.add_plugins((capture::headless_plugins(), capture::runner()))
            .add_plugins(insola.with_world_spec(spec));
    } else {
        app.add_plugins(DefaultPlugins.set(WindowPlugin {
            primary_window: Some(Window {
                title: "Insola — sky scene".into(),
                resolution: options.window_size.into(),
                ..default()
            }),
            ..default()
        }))
        .add_plugins(insola.with_world_file(support::world_asset_path(&options.world)));
    }

    app.insert_resource(bevy::light::DirectionalLightShadowMap { size: 4096 })
        .insert_resource(SceneSetup {
            options: options.clone(),
            look_azimuth_deg: look,
            headless,
        })
        .add_systems(
            Startup,
            (
                spawn_scenery,
                spawn_lights,
                spawn_camera,
                support::stars::spawn_star_field,
            ),
        )
        .add_systems(
            Update,
            (
                rebuild_sundial,
                support::update_status_line,
                support::stars::turn_star_field,
                support::ring::draw_ring,
            ),
        );

    if headless {
        let Some(out) = options.out.clone() else {
            return AppExit::error();
        };
        let target = {
            let mut images = app.world_mut().resource_mut::<Assets<Image>>();
            capture::render_target(&mut images, options.width, options.height)
        };
        app.insert_resource(PictureTarget(target.clone()));
        let days = if options.at.is_empty() {
            vec![100.4]
        } else {
            options.at.clone()
        };
        let single_file = out.extension().is_some_and(|e| e == "png") && days.len() == 1;
        let shots = days
            .iter()
            .map(|d| Shot {
                label: format!("{} day {d}", options.world),
                world_time_s: Some(SceneOptions::world_time_s(&planet, *d)),
                path: Some(if single_file {
                    out.clone()
                } else {
                    out.join(format!("{}-lat{}-day{d}.png", options.world, options.lat))
                }),
            })
            .collect();
        app.add_plugins(CapturePlugin {
            shots,
            target,
            warmup_frames: options.frames,
            settle_frames: 8,
            max_frames: options.frames + 200,
            sink: Arc::new(Mutex::new(Vec::new())),
        })
        .add_systems(Update, face_the_star);
    } else {
        app.add_systems(Startup, load_all_worlds).add_systems(
            Update,
            (scene_keys, support::orbit_camera_controls, face_the_star).run_if(scene_has_input),
        );
        #[cfg(feature = "tuning-panel")]
        app.add_plugins(support::panel::WorldTunerPlugin);
        if let Some(path) = options.window_shot.clone() {
            app.insert_resource(WindowShot {
                path,
                after_frames: options.frames,
                frame: 0,
            })
            .add_systems(Update, take_window_shot);
        }
    }
    app.run()
}

/// A screenshot of the window to take after some frames, then quit.
#[derive(Resource)]
struct WindowShot {
    path: std::path::PathBuf,
    after_frames: u32,
    frame: u32,
}

fn take_window_shot(
    mut shot: ResMut<WindowShot>,
    mut commands: Commands,
    mut exit: MessageWriter<AppExit>,
) {
    use bevy::render::view::screenshot::{Screenshot, save_to_disk};
    shot.frame += 1;
    if shot.frame == shot.after_frames {
        commands
            .spawn(Screenshot::primary_window())
            .observe(save_to_disk(shot.path.clone()));
    }
    // Saving happens a few frames after the request, on another thread.
    if shot.frame >= shot.after_frames + 30 && shot.path.exists() {
        exit.write(AppExit::Success);
    }
}

/// `false` while the world tuner has the keyboard or mouse.
#[cfg(feature = "tuning-panel")]
fn scene_has_input(wants: Option<Res<bevy_egui::input::EguiWantsInput>>) -> bool {
    wants.is_none_or(|w| !w.wants_any_input())
}

/// Without the world tuner the scene always has the input.
#[cfg(not(feature = "tuning-panel"))]
fn scene_has_input() -> bool {
    true
}

#[derive(Resource)]
struct SceneSetup {
    options: SceneOptions,
    /// `None`: face the star.
    look_azimuth_deg: Option<f64>,
    headless: bool,
}

#[derive(Resource)]
struct PictureTarget(Handle<Image>);

/// Keeps the camera facing the star's azimuth (`--look star`), until the user turns it.
#[derive(Component)]
struct FacesStar;

fn spawn_camera(
    mut commands: Commands,
    setup: Res<SceneSetup>,
    target: Option<Res<PictureTarget>>,
) {
    let o = &setup.options;
    let orbit = OrbitCamera {
        focus: Vec3::new(0.0, 2.0, 0.0),
        distance: o.distance as f32,
        look_azimuth: setup.look_azimuth_deg.unwrap_or(0.0).to_radians() as f32,
        pitch: o.pitch.to_radians() as f32,
    };
    let (follow, exposure) = support::instant_exposure();
    let follow = ExposureFollowsSky {
        // Pivoting a little below sunlight's 15 EV brightens every scene slightly (a taste).
        reference_ev100: 14.3,
        max_change_ev_per_s: if setup.headless {
            f64::INFINITY
        } else {
            ExposureFollowsSky::default().max_change_ev_per_s
        },
        ..follow
    };
    let mut camera = commands.spawn((
        Camera3d::default(),
        Projection::Perspective(PerspectiveProjection {
            fov: (o.fov.clamp(10.0, 150.0) as f32).to_radians(),
            ..default()
        }),
        orbit.transform(),
        orbit,
        AtmosphereSettings::default(),
        follow,
        exposure,
    ));
    if let Some(target) = target {
        camera.insert((capture::image_target(&target.0), Msaa::Off));
    }
    if setup.look_azimuth_deg.is_none() {
        camera.insert(FacesStar);
    }
    let camera = camera.id();
    let (help, height) = if setup.headless {
        ("", o.height as f32)
    } else {
        (HELP, 720.0)
    };
    support::spawn_status_line(&mut commands, camera, help, height);
}

fn face_the_star(
    sky: Res<SkyState>,
    keys: Res<ButtonInput<KeyCode>>,
    buttons: Res<ButtonInput<MouseButton>>,
    mut commands: Commands,
    mut cameras: Query<(Entity, &mut OrbitCamera, &mut Transform), With<FacesStar>>,
) {
    if !sky.ready {
        return;
    }
    let user_turns = buttons.pressed(MouseButton::Left)
        || keys.any_pressed([KeyCode::ArrowLeft, KeyCode::ArrowRight]);
    for (entity, mut orbit, mut transform) in &mut cameras {
        if user_turns {
            commands.entity(entity).remove::<FacesStar>();
            continue;
        }
        orbit.look_azimuth = sky.star.azimuth_rad as f32;
        *transform = orbit.transform();
    }
}

/// A star's light: shadows over the whole place, a sun disc (the plugin sets direction, lux,
/// colour and the disc's size).
fn star_light(marker: StarLight) -> impl Bundle {
    (
        marker,
        DirectionalLight {
            shadow_maps_enabled: true,
            ..default()
        },
        SunDisk::EARTH,
        CascadeShadowConfigBuilder {
            num_cascades: 3,
            first_cascade_far_bound: 32.0,
            maximum_distance: 140.0,
            ..default()
        }
        .build(),
    )
}

fn spawn_lights(mut commands: Commands) {
    commands.spawn(star_light(StarLight::PRIMARY));
    // A second sun, on worlds that have one (hidden otherwise). The plugin keeps the shadows on
    // whichever of the two suns is brighter.
    commands.spawn(star_light(StarLight::of(1)));
    // The two moons; the larger one casts shadows on moonlit nights.
    commands.spawn((
        MoonLight { moon: 0 },
        DirectionalLight {
            shadow_maps_enabled: true,
            ..default()
        },
        SunDisk {
            angular_size: 0.01,
            intensity: 1.0,
        },
        CascadeShadowConfigBuilder {
            num_cascades: 1,
            maximum_distance: 60.0,
            ..default()
        }
        .build(),
    ));
    commands.spawn((
        MoonLight { moon: 1 },
        DirectionalLight::default(),
        SunDisk {
            angular_size: 0.006,
            intensity: 1.0,
        },
    ));
}

/// A small deterministic pseudo-random sequence (so every run looks the same).
struct Scatter(u32);

impl Scatter {
    fn next_unit(&mut self) -> f32 {
        self.0 = self.0.wrapping_mul(1_664_525).wrapping_add(1_013_904_223);
        (self.0 >> 8) as f32 / (1u32 << 24) as f32
    }
}

fn spawn_scenery(
    mut commands: Commands,
    mut meshes: ResMut<Assets<Mesh>>,
    mut materials: ResMut<Assets<StandardMaterial>>,
) {
    let mut material = |r: f32, g: f32, b: f32, roughness: f32| {
        materials.add(StandardMaterial {
            base_color: Color::srgb(r, g, b),
            perceptual_roughness: roughness,
            ..default()
        })
    };
    let grass = material(0.24, 0.36, 0.13, 0.95);
    let path = material(0.55, 0.50, 0.40, 0.9);
    let stone = material(0.52, 0.52, 0.50, 0.85);
    let pale_stone = material(0.80, 0.77, 0.70, 0.7);
    let wall = material(0.70, 0.60, 0.45, 0.9);
    let thatch = material(0.45, 0.33, 0.16, 1.0);
    let bark = material(0.30, 0.20, 0.12, 1.0);
    let leaves = material(0.13, 0.32, 0.10, 0.9);
    let dark_leaves = material(0.08, 0.24, 0.12, 0.9);
    let water = materials.add(StandardMaterial {
        base_color: Color::srgb(0.03, 0.09, 0.12),
        perceptual_roughness: 0.06,
        reflectance: 0.6,
        ..default()
    });

    // Ground and a path to the dial.
    commands.spawn((
        Mesh3d(meshes.add(Plane3d::default().mesh().size(20_000.0, 20_000.0))),
        MeshMaterial3d(grass),
    ));
    commands.spawn((
        Mesh3d(meshes.add(Cuboid::new(2.2, 0.02, 30.0))),
        MeshMaterial3d(path.clone()),
        Transform::from_xyz(0.0, 0.01, 19.0),
    ));

    // A pond to the north-west.
    commands.spawn((
        Mesh3d(meshes.add(Cylinder::new(7.0, 0.04))),
        MeshMaterial3d(water),
        Transform::from_xyz(-13.0, 0.02, -12.0).with_scale(Vec3::new(1.4, 1.0, 1.0)),
    ));

    // A ring of standing stones to the north-east.
    let stone_mesh = meshes.add(Cuboid::new(1.0, 1.0, 1.0));
    let ring = Vec3::new(16.0, 0.0, -14.0);
    for i in 0..9 {
        let a = i as f32 / 9.0 * TAU;
        let h = 2.6 + 0.9 * ((i * 7 % 5) as f32 / 4.0);
        commands.spawn((
            Mesh3d(stone_mesh.clone()),
            MeshMaterial3d(stone.clone()),
            Transform::from_translation(ring + Vec3::new(7.0 * a.cos(), h / 2.0, 7.0 * a.sin()))
                .with_rotation(Quat::from_rotation_y(-a + 0.2))
                .with_scale(Vec3::new(1.1, h, 0.6)),
        ));
    }

    // Two huts to the west and south-east.
    let hut_wall = meshes.add(Cylinder::new(2.6, 2.4));
    let hut_roof = meshes.add(Cone {
        radius: 3.3,
        height: 2.6,
    });
    for position in [Vec3::new(-15.0, 0.0, 4.0), Vec3::new(12.0, 0.0, 9.0)] {
        commands.spawn((
            Mesh3d(hut_wall.clone()),
            MeshMaterial3d(wall.clone()),
            Transform::from_translation(position + Vec3::Y * 1.2),
        ));
        commands.spawn((
            Mesh3d(hut_roof.clone()),
            MeshMaterial3d(thatch.clone()),
            Transform::from_translation(position + Vec3::Y * 3.7),
        ));
    }

    // Trees: a trunk and a round or pointed crown, scattered around the clearing.
    let trunk = meshes.add(Cylinder::new(0.22, 1.0));
    let round_crown = meshes.add(Sphere::new(1.0).mesh().uv(16, 10));
    let pointed_crown = meshes.add(Cone {
        radius: 1.0,
        height: 1.0,
    });
    let mut scatter = Scatter(7);
    let mut planted = 0;
    while planted < 26 {
        let a = scatter.next_unit() * TAU;
        let r = 22.0 + scatter.next_unit() * 40.0;
        let at = Vec3::new(r * a.cos(), 0.0, r * a.sin());
        if (at - Vec3::new(0.0, 0.0, 30.0)).length() < 10.0 {
            continue; // keep the view from the south open
        }
        planted += 1;
        let height = 3.0 + scatter.next_unit() * 3.0;
        commands.spawn((
            Mesh3d(trunk.clone()),
            MeshMaterial3d(bark.clone()),
            Transform::from_translation(at + Vec3::Y * height * 0.3).with_scale(Vec3::new(
                1.0,
                height * 0.6,
                1.0,
            )),
        ));
        if scatter.next_unit() < 0.5 {
            let s = 1.4 + scatter.next_unit() * 1.0;
            commands.spawn((
                Mesh3d(round_crown.clone()),
                MeshMaterial3d(leaves.clone()),
                Transform::from_translation(at + Vec3::Y * (height * 0.6 + s * 0.6))
                    .with_scale(Vec3::new(s, s * 1.1, s)),
            ));
        } else {
            let w = 1.3 + scatter.next_unit() * 0.6;
            commands.spawn((
                Mesh3d(pointed_crown.clone()),
                MeshMaterial3d(dark_leaves.clone()),
                Transform::from_translation(at + Vec3::Y * (height * 0.55 + height * 0.45))
                    .with_scale(Vec3::new(w, height * 0.9, w)),
            ));
        }
    }

    // The sundial's plate (its gnomon and hour marks depend on the world and the latitude).
    commands.spawn((
        Mesh3d(meshes.add(Cylinder::new(3.2, 0.25))),
        MeshMaterial3d(pale_stone),
        Transform::from_xyz(0.0, 0.125, 0.0),
    ));
}

/// The parts of the sundial that depend on the world and the latitude.
#[derive(Component)]
struct DialPart;

/// Which world and latitude the sundial was built for.
#[derive(Default)]
struct DialBuiltFor(Option<(u64, i64)>);

/// The direction (scene axes) of the shadow line of a polar gnomon at hour angle `hour_angle`
/// (radians, 0 at local noon, positive after noon on a prograde world), or `None` when the
/// star is below the horizon at that hour on the equinox.
///
/// The gnomon lies along the planet's axis, pointing to the visible pole, so its shadow falls
/// on the same line at the same hour all year.
fn hour_line(latitude: f32, hour_angle: f32) -> Option<Vec3> {
    // Star on the celestial equator at this hour angle, east-north-up.
    let (sh, ch) = hour_angle.sin_cos();
    let (sp, cp) = latitude.sin_cos();
    let star = Vec3::new(-sh, -sp * ch, cp * ch);
    if star.z < 0.05 {
        return None;
    }
    let pole = gnomon_axis(latitude);
    // Shadow of the gnomon's tip on the dial plane, from its foot.
    let tip = pole * 1.0;
    let shadow = tip - star * (tip.z / star.z);
    let dir = Vec2::new(shadow.x, shadow.y).try_normalize()?;
    Some(Vec3::new(dir.x, 0.0, -dir.y))
}

/// The gnomon's direction, east-north-up: the planet's axis, toward the pole above the
/// horizon (straight up at the poles, nearly level at the equator).
fn gnomon_axis(latitude: f32) -> Vec3 {
    let lat = if latitude.abs() < 0.02 {
        0.02f32.copysign(if latitude == 0.0 { 1.0 } else { latitude })
    } else {
        latitude
    };
    let (sp, cp) = lat.sin_cos();
    let toward = lat.signum();
    Vec3::new(0.0, cp * toward, sp * toward)
}

fn rebuild_sundial(
    mut commands: Commands,
    world: Res<ActiveWorld>,
    settings: Res<InsolaSettings>,
    parts: Query<Entity, With<DialPart>>,
    mut built: Local<DialBuiltFor>,
    mut meshes: ResMut<Assets<Mesh>>,
    mut materials: ResMut<Assets<StandardMaterial>>,
) {
    let Some(planet) = world.planet() else {
        return;
    };
    let key = (
        world.generation(),
        (settings.reference_latitude_deg * 100.0).round() as i64,
    );
    if built.0 == Some(key) {
        return;
    }
    built.0 = Some(key);
    for part in &parts {
        commands.entity(part).despawn();
    }
    let lat = settings.reference_place_clamped().latitude_rad as f32;
    let dark = materials.add(StandardMaterial {
        base_color: Color::srgb(0.12, 0.11, 0.10),
        perceptual_roughness: 0.6,
        ..default()
    });
    let bronze = materials.add(StandardMaterial {
        base_color: Color::srgb(0.55, 0.38, 0.18),
        metallic: 0.6,
        perceptual_roughness: 0.45,
        ..default()
    });
    let top = 0.25;

    // The gnomon: a rod along the planet's axis whose tip stands 2.2 m above the plate.
    let axis = gnomon_axis(lat);
    let axis_scene = Vec3::new(axis.x, axis.z, -axis.y);
    let length = (2.2 / axis.z.max(0.15)).min(6.0);
    let foot = Vec3::Y * top;
    commands.spawn((
        Mesh3d(meshes.add(Cylinder::new(0.09, length))),
        MeshMaterial3d(bronze.clone()),
        Transform::from_translation(foot + axis_scene * length * 0.5)
            .with_rotation(Quat::from_rotation_arc(Vec3::Y, axis_scene)),
        DialPart,
    ));
    // A knob where the rod meets the plate.
    commands.spawn((
        Mesh3d(meshes.add(Sphere::new(0.14))),
        MeshMaterial3d(bronze),
        Transform::from_translation(foot),
        DialPart,
    ));

    // Hour marks for every hour of the world's day when the star can be up; noon longest.
    let day_h = (planet.day_s() / 3600.0).max(1.0);
    let sense = if planet.is_retrograde() { -1.0 } else { 1.0 };
    let hours = day_h.round().clamp(1.0, 96.0) as i32;
    let mark = meshes.add(Cuboid::new(0.1, 0.04, 1.0));
    for hour in 0..hours {
        let hour_angle = sense * ((hour as f64 / day_h) as f32 * TAU - PI);
        let Some(dir) = hour_line(lat, hour_angle) else {
            continue;
        };
        let noon = hour as f64 == (day_h / 2.0).round();
        let (inner, outer) = if noon { (1.3, 3.1) } else { (2.3, 3.0) };
        let yaw = dir.x.atan2(dir.z);
        commands.spawn((
            Mesh3d(mark.clone()),
            MeshMaterial3d(dark.clone()),
            Transform::from_translation(dir * (inner + outer) * 0.5 + Vec3::Y * (top + 0.02))
                .with_rotation(Quat::from_rotation_y(yaw))
                .with_scale(Vec3::new(if noon { 1.6 } else { 1.0 }, 1.0, outer - inner)),
            DialPart,
        ));
    }
}

/// The shipped world files, loaded up front so switching is instant.
#[derive(Resource)]
struct WorldFiles(Vec<Handle<WorldFile>>);

fn load_all_worlds(mut commands: Commands, server: Res<AssetServer>) {
    let handles = support::world_names()
        .map(|name| server.load(support::world_asset_path(name)))
        .collect();
    commands.insert_resource(WorldFiles(handles));
}

fn scene_keys(
    keys: Res<ButtonInput<KeyCode>>,
    mut clock: ResMut<WorldClock>,
    mut world: ResMut<ActiveWorld>,
    mut settings: ResMut<InsolaSettings>,
    files: Res<Assets<WorldFile>>,
    handles: Option<Res<WorldFiles>>,
    mut changed: MessageReader<WorldChanged>,
) {
    for change in changed.read() {
        info!("now on {} ({:?})", change.name, change.cause);
    }
    let Some(planet) = world.planet() else {
        return;
    };
    let (day_s, year_s) = (planet.day_s(), planet.year_s());
    if keys.just_pressed(KeyCode::Equal) || keys.just_pressed(KeyCode::NumpadAdd) {
        let rate = clock.rate() * 2.0;
        let _ = clock.set_rate(rate.clamp(-1e9, 1e9));
    }
    if keys.just_pressed(KeyCode::Minus) || keys.just_pressed(KeyCode::NumpadSubtract) {
        let rate = clock.rate() / 2.0;
        let _ = clock.set_rate(rate);
    }
    if keys.just_pressed(KeyCode::Space) {
        clock.toggle_pause();
    }
    if keys.just_pressed(KeyCode::KeyD) {
        let _ = clock.step(day_s);
    }
    if keys.just_pressed(KeyCode::KeyS) {
        let _ = clock.step(year_s / 4.0);
    }
    if keys.just_pressed(KeyCode::KeyL) {
        settings.reference_latitude_deg = (settings.reference_latitude_deg + 5.0).min(90.0);
    }
    if keys.just_pressed(KeyCode::KeyK) {
        settings.reference_latitude_deg = (settings.reference_latitude_deg - 5.0).max(-90.0);
    }
    if keys.just_pressed(KeyCode::KeyW)
        && let Some(handles) = handles
    {
        let name = planet.spec().name.clone();
        let current = handles
            .0
            .iter()
            .position(|h| files.get(h).is_some_and(|f| f.spec.name == name))
            .unwrap_or(0);
        let next = &handles.0[(current + 1) % handles.0.len()];
        match files.get(next) {
            Some(file) => {
                let spec = file.spec.clone();
                // A world that fails its checks is reported and the current one kept.
                if world.set_spec(&spec).is_ok() {
                    world.follow(next.clone());
                }
            }
            None => warn!("that world is still loading"),
        }
    }
}
