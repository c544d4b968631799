//! Renders the demo world without a window or GPU (software Vulkan) and looks at the
//! pictures: noon is much brighter than midnight, noon is not a flat colour, and the shadow of
//! a tall post falls on the side away from the star, at noon and in the afternoon.
//!
//! Needs a Vulkan driver; on a machine without a GPU install Mesa's software one with
//! `.ci/install-render-deps`, then run `cargo test --test render -- --ignored`.

#[path = "../examples/support/capture.rs"]
mod capture;

use std::sync::{Arc, Mutex};

use bevy::camera::ScalingMode;
use bevy::light::CascadeShadowConfigBuilder;
use bevy::prelude::*;
use bevy_insola::prelude::*;
use capture::{CapturePlugin, Shot};
use insola::{Place, Planet, WorldSpec};

/// Picture side, pixels.
const SIZE: u32 = 96;
/// Ground seen by the camera, metres across.
const VIEW_M: f32 = 24.0;
const LATITUDE_DEG: f64 = 40.0;
const DAY: f64 = 100.0;
/// Mid-afternoon, as a fraction of the local day (for a shadow off the north-south line).
const AFTERNOON: f64 = 0.62;

fn demo_world() -> WorldSpec {
    let path = concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/assets/worlds/verdance.world.ron"
    );
    let text = std::fs::read_to_string(path).expect("the demo world file is readable");
    WorldSpec::from_ron_str(&text).expect("the demo world file is valid")
}

/// A light grey ground, a 1.5 m × 12 m post at the origin, seen from straight above by an
/// orthographic camera with north at the top of the picture and east on the right.
fn spawn_scene(
    mut commands: Commands,
    mut meshes: ResMut<Assets<Mesh>>,
    mut materials: ResMut<Assets<StandardMaterial>>,
    target: Res<Target>,
) {
    let grey = materials.add(StandardMaterial {
        base_color: Color::srgb(0.55, 0.55, 0.55),
        perceptual_roughness: 1.0,
        ..default()
    });
    commands.spawn((
        Mesh3d(meshes.add(Plane3d::default().mesh().size(80.0, 80.0))),
        MeshMaterial3d(grey.clone()),
    ));
    commands.spawn((
        Mesh3d(meshes.add(Cuboid::new(1.5, 12.0, 1.5))),
        MeshMaterial3d(grey),
        Transform::from_xyz(0.0, 6.0, 0.0),
    ));
    commands.spawn((
        StarLight::PRIMARY,
        DirectionalLight {
            shadow_maps_enabled: true,
            ..default()
        },
        CascadeShadowConfigBuilder {
            num_cascades: 1,
            maximum_distance: 60.0,
            ..default()
        }
        .build(),
    ));
    commands.spawn(MoonLight { moon: 0 });
    commands.spawn(MoonLight { moon: 1 });
    commands.spawn((
        Camera3d::default(),
        Projection::Orthographic(OrthographicProjection {
            scaling_mode: ScalingMode::Fixed {
                width: VIEW_M,
                height: VIEW_M,
            },
            ..OrthographicProjection::default_3d()
        }),
        Transform::from_xyz(0.0, 40.0, 0.0).looking_at(Vec3::ZERO, Vec3::NEG_Z),
        capture::image_target(&target.0),
        Msaa::Off,
        ExposureFollowsSky {
            max_change_ev_per_s: f64::INFINITY,
            ..default()
        },
    ));
}

#[derive(Resource)]
struct Target(Handle<Image>);

/// Luminance of each pixel (Rec. 709 weights on the 8-bit sRGB values), row by row.
fn luminances(image: &Image) -> Vec<f64> {
    let data = image.data.as_deref().unwrap_or_default();
    data.chunks_exact(4)
        .map(|p| 0.2126 * f64::from(p[0]) + 0.7152 * f64::from(p[1]) + 0.0722 * f64::from(p[2]))
        .collect()
}

fn mean(values: &[f64]) -> f64 {
    values.iter().sum::<f64>() / values.len().max(1) as f64
}

fn std_dev(values: &[f64]) -> f64 {
    let m = mean(values);
    (values.iter().map(|v| (v - m) * (v - m)).sum::<f64>() / values.len().max(1) as f64).sqrt()
}

/// Where the shadow falls: the centre of the pixels much darker than the lit ground, seen
/// from the post, as (east, north) pixels; and how many such pixels there are.
fn shadow_centre(lum: &[f64]) -> ((f64, f64), usize) {
    let mut sorted = lum.to_vec();
    sorted.sort_by(f64::total_cmp);
    let ground = sorted[sorted.len() / 2];
    let (mut sx, mut sy, mut n) = (0.0, 0.0, 0usize);
    let half = f64::from(SIZE) / 2.0;
    for (i, l) in lum.iter().enumerate() {
        if *l < 0.7 * ground {
            let (col, row) = (
                (i as u32 % SIZE) as f64 + 0.5,
                (i as u32 / SIZE) as f64 + 0.5,
            );
            sx += col - half; // east
            sy += half - row; // north
            n += 1;
        }
    }
    ((sx / n.max(1) as f64, sy / n.max(1) as f64), n)
}

/// Checks that the shadow in `lum` points away from `star` (within about 25°).
fn assert_shadow_away_from(label: &str, lum: &[f64], star: &insola::StarPosition) {
    let (shadow, n) = shadow_centre(lum);
    assert!(
        n >= 10,
        "{label}: a shadow should be visible, found {n} dark pixels"
    );
    // Away from the star: opposite its azimuth (clockwise from north).
    let away = (-star.azimuth_rad.sin(), -star.azimuth_rad.cos()); // (east, north)
    let cos = (shadow.0 * away.0 + shadow.1 * away.1) / shadow.0.hypot(shadow.1).max(1e-9);
    println!(
        "{label}: star azimuth {:.1}°, altitude {:.1}°; shadow centre {:.1} px east, {:.1} px \
         north of the post ({n} px); cosine to the anti-star direction {cos:.3}",
        star.azimuth_rad.to_degrees(),
        star.altitude_rad.to_degrees(),
        shadow.0,
        shadow.1
    );
    assert!(
        cos > 0.9,
        "{label}: the shadow (centre {shadow:?} px east/north of the post) should point away \
         from the star (azimuth {:.1}°); cosine {cos:.3}",
        star.azimuth_rad.to_degrees()
    );
}

#[test]
#[ignore = "needs a Vulkan driver (software: .ci/install-render-deps); run with `cargo test --test render -- --ignored`"]
fn noon_is_bright_midnight_is_dark_and_shadows_point_away_from_the_star() {
    let spec = demo_world();
    let planet = Planet::new(&spec).expect("the demo world builds");
    let noon = planet.local_day_start_s(DAY + 0.5, 0.0);
    let afternoon = planet.local_day_start_s(DAY + AFTERNOON, 0.0);
    let midnight = planet.local_day_start_s(DAY + 1.0, 0.0);
    let place = Place::from_degrees(LATITUDE_DEG, 0.0).expect("a valid place");
    let (noon_star, afternoon_star) = (
        planet.star_position(noon, place),
        planet.star_position(afternoon, place),
    );
    for star in [&noon_star, &afternoon_star] {
        assert!(
            star.altitude_rad.to_degrees() > 30.0,
            "the test wants a high star, got {:.1}°",
            star.altitude_rad.to_degrees()
        );
    }

    let sink = Arc::new(Mutex::new(Vec::new()));
    let mut app = App::new();
    app.add_plugins((capture::headless_plugins(), capture::runner()))
        .add_plugins(
            InsolaPlugins::new()
                .with_world_spec(spec)
                .with_reference_place(LATITUDE_DEG, 0.0)
                .with_start(WorldInstant::from_secs_f64(noon)),
        );
    let target = {
        let mut images = app.world_mut().resource_mut::<Assets<Image>>();
        capture::render_target(&mut images, SIZE, SIZE)
    };
    let shot = |label: &str, t: f64| Shot {
        label: label.into(),
        world_time_s: Some(t),
        path: None,
    };
    app.insert_resource(Target(target.clone()))
        .add_systems(Startup, spawn_scene)
        .add_plugins(CapturePlugin {
            shots: vec![
                shot("noon", noon),
                shot("afternoon", afternoon),
                shot("midnight", midnight),
            ],
            target,
            warmup_frames: 100,
            settle_frames: 6,
            max_frames: 600,
            sink: sink.clone(),
        });
    let exit = app.run();
    assert!(exit.is_success(), "the app ended with {exit:?}");

    let shots = sink.lock().expect("capture results").clone();
    assert_eq!(shots.len(), 3, "all pictures taken");
    let out = std::path::Path::new(env!("CARGO_TARGET_TMPDIR")).join("render-test");
    for shot in &shots {
        capture::save_png(&shot.image, &out.join(format!("{}.png", shot.label)));
    }
    let noon_l = luminances(&shots[0].image);
    let afternoon_l = luminances(&shots[1].image);
    let night_l = luminances(&shots[2].image);
    assert_eq!(noon_l.len(), (SIZE * SIZE) as usize, "noon picture size");
    let (noon_mean, night_mean) = (mean(&noon_l), mean(&night_l));
    println!(
        "noon mean {noon_mean:.1}, midnight mean {night_mean:.1}, noon spread {:.1} (pictures in {})",
        std_dev(&noon_l),
        out.display()
    );
    assert!(
        noon_mean > 40.0,
        "noon should be bright: mean {noon_mean:.1}"
    );
    assert!(
        noon_mean > 4.0 * night_mean + 10.0,
        "noon ({noon_mean:.1}) should be much brighter than midnight ({night_mean:.1})"
    );
    assert!(
        std_dev(&noon_l) > 4.0,
        "the noon picture should not be a flat colour (spread {:.1})",
        std_dev(&noon_l)
    );
    assert_shadow_away_from("noon", &noon_l, &noon_star);
    assert_shadow_away_from("afternoon", &afternoon_l, &afternoon_star);
}
