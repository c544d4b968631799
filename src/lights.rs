//! Lights: a directional light under the star and under each moon, and the sky's ambient
//! light.
//!
//! Put [`StarLight`] (or [`MoonLight`]) on an entity; it gets a [`DirectionalLight`] if it has
//! none. Each frame the plugin sets the light's rotation (it shines from the body toward the
//! scene), its illuminance and its colour, and hides it while the body is below the horizon.
//! Shadow settings, cascades and everything else on the light stay yours.
//!
//! Units: Bevy multiplies a light's colour by its illuminance. Our colours have their largest
//! channel at 1, so their luminance is below 1; the illuminance written is the body's lux
//! divided by the colour's relative luminance, so the light's photometric illuminance is
//! exactly the core's lux. The same holds for the ambient light.
//!
//! Attenuation: with [`LightAttenuation::ByInsola`](crate::LightAttenuation) the lights carry
//! the light at the ground; with `ByEngineAtmosphere` they carry the light above the air, and
//! Bevy's atmosphere dims them. The core's mode decides which, so extinction is applied once.

use bevy::color::{Color, LinearRgba};
use bevy::prelude::*;

use crate::flash_guard::DisplayedSky;
use crate::settings::{InsolaSettings, SceneCompass};
use crate::sky_state::SceneBody;

/// Marks a directional light driven by one star: the world's star ([`StarLight::PRIMARY`]) or,
/// on a world of two suns, the companion ([`StarLight::of`]`(1)`). The light is hidden while
/// its star is down, or if the world has no such star.
///
/// ```
/// use bevy::prelude::*;
/// use bevy_insola::StarLight;
/// fn setup(mut commands: Commands) {
///     // The plugin sets rotation, illuminance and colour; shadows are yours, except that on a
///     // world of several stars it keeps them on the brighter star's light only
///     // (`InsolaSettings::shadows_follow_brighter_star`).
///     commands.spawn((StarLight::PRIMARY, DirectionalLight { shadow_maps_enabled: true, ..default() }));
///     commands.spawn(StarLight::of(1));
/// }
/// # App::new().add_systems(Startup, setup).update();
/// ```
#[derive(Component, Debug, Clone, Copy, Default, PartialEq, Eq, Reflect)]
#[reflect(Component, Debug, Default, Clone)]
#[require(DirectionalLight)]
pub struct StarLight {
    /// Index of the star: 0 the world's star (the primary), 1 its companion.
    pub star: usize,
}

impl StarLight {
    /// The light of the world's star (the primary of a pair).
    pub const PRIMARY: StarLight = StarLight { star: 0 };

    /// The light of star `star` (0 the primary, 1 the companion).
    pub const fn of(star: usize) -> StarLight {
        StarLight { star }
    }
}

/// Marks a directional light driven by one moon (by its index in the world file's `moons`).
/// The light is hidden while the moon is down, or if the world has no such moon.
#[derive(Component, Debug, Clone, Copy, Default, PartialEq, Eq, Reflect)]
#[reflect(Component, Debug, Default, Clone)]
#[require(DirectionalLight)]
pub struct MoonLight {
    /// Index of the moon in the world file's `moons` list.
    pub moon: usize,
}

/// Relative luminance of a linear sRGB colour (ITU-R BT.709 primaries, D65 white: Y = 0.2126 R
/// + 0.7152 G + 0.0722 B; coefficients from memory).
pub fn relative_luminance(color: LinearRgba) -> f32 {
    0.2126 * color.red + 0.7152 * color.green + 0.0722 * color.blue
}

/// The value to put in `DirectionalLight::illuminance` so a light of `color` delivers
/// `lux` photometric lux (see the module docs).
pub fn bevy_illuminance(lux: f64, color: LinearRgba) -> f32 {
    let y = relative_luminance(color);
    let y = if y.is_finite() && y > 1e-4 { y } else { 1.0 };
    (lux as f32 / y).max(0.0)
}

/// The ambient brightness, cd/m², of a uniform sky dome that gives `sky_lux` on a horizontal
/// surface: the radiance L of a uniform hemisphere gives E = π L, so L = E / π (then divided
/// by the colour's relative luminance, as for lights).
pub fn ambient_brightness_cd_m2(sky_lux: f64, color: LinearRgba) -> f32 {
    bevy_illuminance(sky_lux / std::f64::consts::PI, color)
}

/// The rotation of a directional light shining from a body in scene direction `to_body`
/// (unit vector from the scene toward the body): the light looks along `−to_body`.
///
/// The light's own up is north carried along the shortest arc from the zenith to the body, so
/// the rotation is smooth everywhere, also through the zenith; the only turning point is the
/// nadir, where the light is off.
pub fn light_rotation(to_body: Vec3, compass: &SceneCompass) -> Quat {
    let Some(d) = to_body.try_normalize() else {
        return Quat::IDENTITY;
    };
    let up_hint = Quat::from_rotation_arc(compass.up(), d) * compass.north();
    Transform::IDENTITY.looking_to(-d, up_hint).rotation
}

fn drive_light(
    body: Option<&SceneBody>,
    compass: &SceneCompass,
    light: &mut Mut<DirectionalLight>,
    transform: &mut Mut<Transform>,
    visibility: &mut Mut<Visibility>,
) {
    // The rotation follows the body even while it is down, so the light is already pointing
    // the right way when it comes on.
    if let Some(body) = body {
        let rotation = light_rotation(body.direction, compass);
        if transform.rotation != rotation {
            transform.rotation = rotation;
        }
    }
    let on = body.is_some_and(|b| b.is_up && b.illuminance_lux > 0.0);
    let Some(body) = body.filter(|_| on) else {
        visibility.set_if_neq(Visibility::Hidden);
        if light.illuminance != 0.0 {
            light.illuminance = 0.0;
        }
        return;
    };
    let illuminance = bevy_illuminance(body.illuminance_lux, body.color);
    let color = Color::LinearRgba(body.color);
    if light.illuminance != illuminance || light.color != color {
        light.illuminance = illuminance;
        light.color = color;
    }
    visibility.set_if_neq(Visibility::Inherited);
}

/// The parts of a light entity the plugin writes.
type LightParts = (
    &'static mut DirectionalLight,
    &'static mut Transform,
    &'static mut Visibility,
);

/// Writes the star's and moons' rotation, illuminance, colour and visibility into their
/// lights, from the [`DisplayedSky`] (the exact sky unless the flash guard holds it).
pub(crate) fn write_body_lights(
    sky: Res<DisplayedSky>,
    settings: Res<InsolaSettings>,
    mut stars: Query<(&StarLight, LightParts), Without<MoonLight>>,
    mut moons: Query<(&MoonLight, LightParts), Without<StarLight>>,
) {
    if !sky.ready {
        return;
    }
    let compass = &settings.compass;
    let body_of = |star: usize| match star {
        0 => Some(&sky.star),
        k => sky.other_stars.get(k - 1),
    };
    // With several stars, shadows go to the brightest star that is up (the primary when none
    // is), so a scene casts one set of shadows and the right one.
    let shadow_star = (settings.shadows_follow_brighter_star && !sky.other_stars.is_empty())
        .then(|| brightest_star(&sky));
    for (marker, (mut light, mut transform, mut visibility)) in &mut stars {
        drive_light(
            body_of(marker.star),
            compass,
            &mut light,
            &mut transform,
            &mut visibility,
        );
        if let Some(brightest) = shadow_star {
            let shadows = marker.star == brightest;
            if light.shadow_maps_enabled != shadows {
                light.shadow_maps_enabled = shadows;
            }
        }
    }
    for (moon, (mut light, mut transform, mut visibility)) in &mut moons {
        let body = sky.moons.get(moon.moon);
        drive_light(body, compass, &mut light, &mut transform, &mut visibility);
    }
}

/// Index of the star giving the most light on a surface facing it among those up (0 when none
/// is up).
pub fn brightest_star(sky: &DisplayedSky) -> usize {
    let mut best = (
        0,
        if sky.star.is_up {
            sky.star.illuminance_lux
        } else {
            -1.0
        },
    );
    for (i, o) in sky.other_stars.iter().enumerate() {
        if o.is_up && o.illuminance_lux > best.1 {
            best = (i + 1, o.illuminance_lux);
        }
    }
    best.0
}

/// Writes the sky's diffuse light into [`GlobalAmbientLight`] (when
/// [`InsolaSettings::write_ambient_light`] is on).
pub(crate) fn write_ambient_light(
    sky: Res<DisplayedSky>,
    settings: Res<InsolaSettings>,
    ambient: Option<ResMut<GlobalAmbientLight>>,
) {
    let (true, true, Some(mut ambient)) = (sky.ready, settings.write_ambient_light, ambient) else {
        return;
    };
    let brightness = ambient_brightness_cd_m2(sky.sky_illuminance_lux, sky.sky_color);
    let color = Color::LinearRgba(sky.sky_color);
    if ambient.brightness != brightness || ambient.color != color {
        ambient.brightness = brightness;
        ambient.color = color;
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn light_looks_away_from_the_body_and_is_smooth_through_the_zenith() {
        let compass = SceneCompass::default();
        let mut previous: Option<Quat> = None;
        // A star passing overhead from east to west, a little north of the zenith and exactly
        // through it.
        for offset in [0.0f32, 0.01] {
            for i in 0..=200 {
                let a = -1.2 + 2.4 * i as f32 / 200.0;
                let d = Vec3::new(a.sin(), a.cos(), -offset).normalize();
                let q = light_rotation(d, &compass);
                assert!((q * Vec3::NEG_Z - (-d)).length() < 1e-5);
                if let Some(p) = previous {
                    assert!(p.dot(q).abs() > 0.999, "jump at {a}: {p:?} -> {q:?}");
                }
                previous = Some(q);
            }
            previous = None;
        }
    }

    #[test]
    fn photometric_units() {
        let white = LinearRgba::rgb(1.0, 1.0, 1.0);
        assert!((bevy_illuminance(1000.0, white) - 1000.0).abs() < 0.5);
        let warm = LinearRgba::rgb(1.0, 0.8, 0.6);
        let written = bevy_illuminance(1000.0, warm);
        assert!((written * relative_luminance(warm) - 1000.0).abs() < 0.5);
        // A uniform sky of 10 000 lux is 10 000 / π cd/m².
        assert!((ambient_brightness_cd_m2(10_000.0, white) - 3183.1).abs() < 0.5);
    }
}
