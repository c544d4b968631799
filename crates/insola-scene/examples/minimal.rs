//! The smallest set-up: the plugin, one star light with shadows, a camera whose exposure
//! follows the sky, and something to cast a shadow.

use bevy::prelude::*;
use bevy_insola::prelude::*;

fn main() {
    App::new()
        .add_plugins(DefaultPlugins)
        // 3000 world seconds per real second: a 26-hour Verdance day in about 31 s.
        .add_plugins(
            InsolaPlugins::new()
                .with_world_file("worlds/verdance.world.ron")
                .with_clock_rate(3000.0),
        )
        .add_systems(Startup, setup)
        .run();
}

fn setup(
    mut commands: Commands,
    mut meshes: ResMut<Assets<Mesh>>,
    mut materials: ResMut<Assets<StandardMaterial>>,
) {
    commands.spawn((
        StarLight::PRIMARY,
        DirectionalLight {
            shadow_maps_enabled: true,
            ..default()
        },
    ));
    commands.spawn((
        Camera3d::default(),
        ExposureFollowsSky::default(),
        Transform::from_xyz(0.0, 6.0, 14.0).looking_at(Vec3::Y, Vec3::Y),
    ));
    commands.spawn((
        Mesh3d(meshes.add(Plane3d::default().mesh().size(40.0, 40.0))),
        MeshMaterial3d(materials.add(Color::srgb(0.3, 0.5, 0.2))),
    ));
    commands.spawn((
        Mesh3d(meshes.add(Cuboid::new(1.0, 4.0, 1.0))),
        MeshMaterial3d(materials.add(Color::srgb(0.7, 0.7, 0.7))),
        Transform::from_xyz(0.0, 2.0, 0.0),
    ));
}
