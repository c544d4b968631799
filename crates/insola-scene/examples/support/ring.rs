//! The ring across the sky: each annulus drawn as a band between its inner and outer edges,
//! from the plugin's [`SkyState::ring`] (the core's geometry for the reference place), on a
//! far sphere inside the camera's far plane.
//!
//! Brightness: the ring is lit by the star above the air whatever the hour on the ground (at
//! night its lit face still shines), with the luminance of a diffusely reflecting layer,
//! `L = a · E · (1 − exp(−τ)) / π` for the face the star lights (E the star's illuminance above
//! the air, a the ring particles' albedo, τ the annulus's optical depth; a Lambertian layer,
//! common practice, no source), and a fiftieth of that for the unlit face, which only passes the
//! light that filters through. The ring's shadow on the ground needs nothing here: the plugin's
//! star light already carries it.

use bevy::asset::RenderAssetUsages;
use bevy::light::NotShadowCaster;
use bevy::mesh::{Indices, PrimitiveTopology};
use bevy::prelude::*;
use bevy_insola::prelude::*;
use bevy_insola::{ActiveWorld, SkyRingArc};

/// Radius of the ring's sphere around the camera, m. Near, because the engine's atmosphere
/// adds the glow of the air between the camera and anything drawn (at 700 m, the star field's
/// distance, a daylit sky would wash the ring out); centred on the camera, so it stays at the
/// same place in the sky as the camera moves.
const RING_RADIUS_M: f32 = 60.0;
/// The camera exposes for the ground, which lies in the ring's shadow; at the luminance above
/// the ring would burn the whole band to white, so it is drawn this much dimmer (a display
/// choice for the scene, not physics).
const DISPLAY_SCALE: f32 = 2e-3;
/// Bond albedo of the ring's particles (icy; invented for the scene).
const PARTICLE_ALBEDO: f32 = 0.5;
/// The unlit face's share of the lit face's luminance: only the light the layer scatters
/// forward comes through (invented for the scene, no source).
const UNLIT_SHARE: f32 = 0.02;

/// One drawn annulus.
#[derive(Component)]
pub struct RingBand {
    annulus: usize,
    /// The arc the mesh was built from (first and last outer points), to rebuild on change.
    built_from: (Vec3, Vec3),
}

/// What a band's mesh is rebuilt on: the first and last points of its outer edge (the arcs of
/// the plugin's sky state are non-empty).
fn arc_key(arc: &SkyRingArc) -> (Vec3, Vec3) {
    let first = arc.outer.first().copied().unwrap_or_default();
    (first, arc.outer.last().copied().unwrap_or(first))
}

/// A band mesh between two edges (each a list of unit directions; the inner edge falls back to
/// the horizon below the outer one where it is below the horizon).
fn band_mesh(inner: &[Vec3], outer: &[Vec3]) -> Mesh {
    let n = outer.len();
    let inner_at = |i: usize| -> Vec3 {
        inner
            .get(i * inner.len().max(1) / n.max(1))
            .copied()
            .unwrap_or_else(|| {
                let o = outer[i];
                Vec3::new(o.x, 0.0, o.z).normalize_or_zero()
            })
    };
    let mut positions = Vec::with_capacity(2 * n);
    for (i, o) in outer.iter().enumerate() {
        positions.push((inner_at(i) * RING_RADIUS_M).to_array());
        positions.push((*o * RING_RADIUS_M).to_array());
    }
    let mut indices = Vec::with_capacity(6 * n);
    for i in 0..n.saturating_sub(1) as u32 {
        let (a, b, c, d) = (2 * i, 2 * i + 1, 2 * i + 2, 2 * i + 3);
        // Both windings: the band is seen from inside the sphere.
        indices.extend_from_slice(&[a, b, c, b, d, c, a, c, b, b, c, d]);
    }
    let normals = vec![[0.0, 1.0, 0.0]; positions.len()];
    Mesh::new(
        PrimitiveTopology::TriangleList,
        RenderAssetUsages::default(),
    )
    .with_inserted_attribute(Mesh::ATTRIBUTE_POSITION, positions)
    .with_inserted_attribute(Mesh::ATTRIBUTE_NORMAL, normals)
    .with_inserted_indices(Indices::U32(indices))
}

/// Builds, rebuilds and colours the ring's bands each frame from the sky state.
#[allow(
    clippy::too_many_arguments,
    clippy::type_complexity,
    reason = "a Bevy system's parameters are its data access"
)]
pub fn draw_ring(
    mut commands: Commands,
    world: Res<ActiveWorld>,
    clock: Res<WorldClock>,
    sky: Res<SkyState>,
    mut meshes: ResMut<Assets<Mesh>>,
    mut materials: ResMut<Assets<StandardMaterial>>,
    mut bands: Query<(
        Entity,
        &mut RingBand,
        &mut Mesh3d,
        &MeshMaterial3d<StandardMaterial>,
        &mut Transform,
    )>,
    cameras: Query<&Transform, (With<Camera3d>, Without<RingBand>)>,
) {
    let centre = cameras.iter().next().map_or(Vec3::ZERO, |t| t.translation);
    let (Some(planet), Some(ring)) = (world.planet(), sky.ring.as_ref().filter(|_| sky.ready))
    else {
        for (entity, ..) in &bands {
            commands.entity(entity).despawn();
        }
        return;
    };
    // Borrowed, not copied: this runs every frame and allocates nothing (a mesh is built only
    // when an annulus first shows or its arc moves, i.e. when the world or the place changes).
    let annuli = planet.ring().map_or(&[][..], |r| &r.annuli[..]);
    let instant = planet.star_instant(clock.world_time_s());
    let star_lux = planet
        .light_model()
        .top_of_atmosphere(instant.toa_flux_w_m2)
        .illuminance_lux as f32;
    let [r, g, b] = sky.star.color.to_f32_array_no_alpha();
    for (entity, mut band, mut mesh, material, mut transform) in &mut bands {
        transform.translation = centre;
        let Some(arc) = ring.arcs.iter().find(|a| a.annulus == band.annulus) else {
            commands.entity(entity).despawn();
            continue;
        };
        let key = arc_key(arc);
        if key != band.built_from {
            mesh.0 = meshes.add(band_mesh(&arc.inner, &arc.outer));
            band.built_from = key;
        }
        let tau = annuli.get(band.annulus).map_or(0.0, |a| a.optical_depth) as f32;
        let lit = PARTICLE_ALBEDO * star_lux * (1.0 - (-tau).exp()) / std::f32::consts::PI;
        let l = if ring.sees_lit_face {
            lit
        } else {
            UNLIT_SHARE * lit
        };
        let l = l * DISPLAY_SCALE;
        let emissive = LinearRgba::rgb(l * r, l * g, l * b);
        // Touched only when the colour changes, so an unchanged material is not sent to the
        // GPU again.
        if materials
            .get(&material.0)
            .is_some_and(|m| m.emissive != emissive)
            && let Some(mut m) = materials.get_mut(&material.0)
        {
            m.emissive = emissive;
        }
    }
    for arc in &ring.arcs {
        // Bands already drawn (the query still holds those despawned above, but only for
        // annuli no longer in the arcs, which this loop does not visit).
        if arc.outer.is_empty() || bands.iter().any(|(_, b, ..)| b.annulus == arc.annulus) {
            continue;
        }
        // Black and emissive (as the star field): the band's own light, in cd/m².
        let material = materials.add(StandardMaterial {
            base_color: Color::BLACK,
            // Added to the sky behind it: a thin ring shows the stars through it.
            alpha_mode: AlphaMode::Add,
            cull_mode: None,
            ..default()
        });
        commands.spawn((
            RingBand {
                annulus: arc.annulus,
                // The arc it is built from now, so the next frame does not build it again.
                built_from: arc_key(arc),
            },
            Mesh3d(meshes.add(band_mesh(&arc.inner, &arc.outer))),
            MeshMaterial3d(material),
            Transform::from_translation(centre),
            NotShadowCaster,
        ));
    }
}
