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

/// Marks a directional light driven by the star.
///
/// ```
/// use bevy::prelude::*;
/// use bevy_insola::StarLight;
/// fn setup(mut commands: Commands) {
///     // Shadows are yours to choose; the plugin sets rotation, illuminance and colour.
///     commands.spawn((StarLight, DirectionalLight { shadow_maps_enabled: true, ..default() }));
/// }
/// # App::new().add_systems(Startup, setup).update();
/// ```
#[derive(Component, Debug, Clone, Copy, Default, Reflect)]
#[reflect(Component, Debug, Default, Clone)]
#[require(DirectionalLight)]
pub struct StarLight;

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
    mut stars: Query<LightParts, (With<StarLight>, Without<MoonLight>)>,
    mut moons: Query<(&MoonLight, LightParts), Without<StarLight>>,
) {
    if !sky.ready {
        return;
    }
    let compass = &settings.compass;
    for (mut light, mut transform, mut visibility) in &mut stars {
        drive_light(
            Some(&sky.star),
            compass,
            &mut light,
            &mut transform,
            &mut visibility,
        );
    }
    for (moon, (mut light, mut transform, mut visibility)) in &mut moons {
        let body = sky.moons.get(moon.moon);
        drive_light(body, compass, &mut light, &mut transform, &mut visibility);
    }
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
