//! The fixed stars: a field of small glowing discs on a far sphere that turns with the planet's
//! sidereal rotation, so the night sky wheels about the celestial pole (which stands at the
//! place's latitude above the northern horizon, or the southern one).
//!
//! Their luminance is a star's illuminance spread over the disc's solid angle, so the camera's
//! exposure shows them at night and lets them come out one by one through twilight. While the
//! star is up the field is hidden: the engine's atmosphere adds the glow of 800 m of daylit air
//! to each disc, which would show them as pale dots.

use bevy::light::NotShadowCaster;
use bevy::math::DVec3;
use bevy::prelude::*;
use bevy_insola::ActiveWorld;
use bevy_insola::prelude::*;
use insola::frames::enu_from_equatorial;

/// How many stars.
const STAR_COUNT: u32 = 1500;
/// Distance of the star sphere, m (inside the camera's far plane of 1000 m).
const SKY_RADIUS_M: f32 = 800.0;
/// Radius of each star's disc, m: about one pixel at the scene's usual field of view.
const DISC_RADIUS_M: f32 = 1.2;
/// Illuminance from a star of magnitude 0, lux (about 2.1 × 10⁻⁶ lx; from memory).
const MAGNITUDE_ZERO_LUX: f32 = 2.1e-6;
/// The brightest and faintest magnitudes drawn, in steps of one magnitude.
const MAGNITUDES: [f32; 6] = [-1.0, 0.0, 1.0, 2.0, 3.0, 4.0];

/// The turning sphere of stars.
#[derive(Component)]
pub struct StarField;

/// A deterministic hash in [0, 1) (so the sky is the same every run).
fn unit_hash(i: u32, salt: u32) -> f32 {
    let mut x = i.wrapping_mul(0x9E37_79B9) ^ salt.wrapping_mul(0x85EB_CA6B);
    x ^= x >> 15;
    x = x.wrapping_mul(0x2C1B_3C6D);
    x ^= x >> 12;
    (x >> 8) as f32 / (1u32 << 24) as f32
}

/// Spawns the star sphere: directions spread evenly (a golden-angle spiral, jittered) in the
/// world's equatorial frame; magnitudes with faint stars commoner than bright ones.
pub fn spawn_star_field(
    mut commands: Commands,
    mut meshes: ResMut<Assets<Mesh>>,
    mut materials: ResMut<Assets<StandardMaterial>>,
) {
    let mesh = meshes.add(
        Sphere::new(DISC_RADIUS_M)
            .mesh()
            .ico(1)
            .expect("small ico sphere"),
    );
    let solid_angle_sr = std::f32::consts::PI * (DISC_RADIUS_M / SKY_RADIUS_M).powi(2);
    let looks: Vec<Handle<StandardMaterial>> = MAGNITUDES
        .iter()
        .map(|&m| {
            // Luminance that gives the star's illuminance over the disc: L = E / Ω.
            let lux = MAGNITUDE_ZERO_LUX * 10f32.powf(-0.4 * m);
            let l = lux / solid_angle_sr;
            materials.add(StandardMaterial {
                base_color: Color::BLACK,
                emissive: LinearRgba::rgb(l * 0.95, l * 0.97, l),
                // Added to the sky behind, never hiding it: by day a star is just too faint.
                alpha_mode: AlphaMode::Add,
                ..default()
            })
        })
        .collect();
    let field = commands
        .spawn((StarField, Transform::default(), Visibility::default()))
        .id();
    let golden = std::f32::consts::PI * (3.0 - 5f32.sqrt());
    for i in 0..STAR_COUNT {
        let z = 1.0 - 2.0 * (i as f32 + unit_hash(i, 1)) / STAR_COUNT as f32;
        let r = (1.0 - z * z).max(0.0).sqrt();
        let phi = golden * i as f32 + 0.3 * unit_hash(i, 2);
        let direction = Vec3::new(r * phi.cos(), r * phi.sin(), z);
        // Star counts grow about threefold per magnitude: most stars are faint.
        let class = ((unit_hash(i, 3).powf(0.35)) * MAGNITUDES.len() as f32) as usize;
        commands.spawn((
            Mesh3d(mesh.clone()),
            MeshMaterial3d(looks[class.min(MAGNITUDES.len() - 1)].clone()),
            Transform::from_translation(direction * SKY_RADIUS_M),
            NotShadowCaster,
            ChildOf(field),
        ));
    }
}

/// Turns the star sphere to the sky of the reference place at the clock's time: the sphere's
/// own axes are the world's equatorial axes.
pub fn turn_star_field(
    world: Res<ActiveWorld>,
    clock: Res<WorldClock>,
    settings: Res<InsolaSettings>,
    sky: Res<SkyState>,
    mut fields: Query<(&mut Transform, &mut Visibility), With<StarField>>,
) {
    let Some(planet) = world.planet() else {
        return;
    };
    let place = settings.reference_place_clamped();
    let instant = planet.star_instant(clock.world_time_s());
    let local_sidereal = instant.sidereal_angle_rad + place.longitude_rad;
    let (sin_lat, cos_lat) = place.latitude_rad.sin_cos();
    let axis = |v: DVec3| {
        settings
            .compass
            .to_scene(enu_from_equatorial(v, sin_lat, cos_lat, local_sidereal))
    };
    let rotation = Quat::from_mat3(&Mat3::from_cols(
        axis(DVec3::X),
        axis(DVec3::Y),
        axis(DVec3::Z),
    ));
    let shown = if sky.phase == TwilightPhase::Day {
        Visibility::Hidden
    } else {
        Visibility::Inherited
    };
    for (mut transform, mut visibility) in &mut fields {
        transform.rotation = rotation;
        visibility.set_if_neq(shown);
    }
}
