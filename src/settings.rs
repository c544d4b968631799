//! Runtime settings: the scene's compass, the reference place, who attenuates the light, and
//! how often observers update.

use bevy::math::DVec3;
use bevy::prelude::*;
use insola::Place;
use insola::lighting::LightMode;

use insola::sky_events::EventFilter;

use crate::flash_guard::FlashGuard;

/// Which way the scene's axes point on the planet's surface.
///
/// The core computes directions in the local east-north-up frame; the compass turns them into
/// scene vectors. Default: +Y up, −Z north, so +X is east (Bevy's usual right-handed,
/// Y-up layout with the camera looking north).
///
/// ```
/// use bevy::prelude::*;
/// use bevy_insola::SceneCompass;
/// let compass = SceneCompass::default();
/// assert_eq!(compass.east(), Vec3::X);
/// // A map whose north is +X:
/// let turned = SceneCompass::new(Vec3::Y, Vec3::X).unwrap();
/// assert!((turned.east() - Vec3::Z).length() < 1e-6);
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Reflect)]
#[reflect(Debug, PartialEq, Default, Clone)]
pub struct SceneCompass {
    up: Vec3,
    north: Vec3,
    east: Vec3,
}

/// Why a [`SceneCompass`] could not be built.
#[derive(Debug, Clone, Copy, PartialEq, thiserror::Error)]
pub enum CompassError {
    /// `up` is zero, not finite, or parallel to `north`.
    #[error("up {up:?} and north {north:?} must be finite, non-zero and not parallel")]
    Degenerate {
        /// The up vector given.
        up: Vec3,
        /// The north vector given.
        north: Vec3,
    },
}

impl Default for SceneCompass {
    fn default() -> Self {
        SceneCompass {
            up: Vec3::Y,
            north: Vec3::NEG_Z,
            east: Vec3::X,
        }
    }
}

impl SceneCompass {
    /// A compass from the scene's up and north vectors. `north` is made perpendicular to `up`
    /// (its horizontal part is kept); east is `north × up`.
    pub fn new(up: Vec3, north: Vec3) -> Result<SceneCompass, CompassError> {
        let bad = CompassError::Degenerate { up, north };
        let up_n = up.try_normalize().ok_or(bad)?;
        let north_h = (north - up_n * north.dot(up_n))
            .try_normalize()
            .ok_or(bad)?;
        Ok(SceneCompass {
            up: up_n,
            north: north_h,
            east: north_h.cross(up_n),
        })
    }

    /// The scene's up (unit vector).
    pub fn up(&self) -> Vec3 {
        self.up
    }

    /// The scene's north (unit vector, horizontal).
    pub fn north(&self) -> Vec3 {
        self.north
    }

    /// The scene's east (unit vector, horizontal).
    pub fn east(&self) -> Vec3 {
        self.east
    }

    /// A local east-north-up vector from the core as a scene vector (`f32`).
    pub fn to_scene(&self, enu: DVec3) -> Vec3 {
        self.east * enu.x as f32 + self.north * enu.y as f32 + self.up * enu.z as f32
    }

    /// A scene vector as local east-north-up.
    pub fn to_enu(&self, v: Vec3) -> DVec3 {
        DVec3::new(
            v.dot(self.east) as f64,
            v.dot(self.north) as f64,
            v.dot(self.up) as f64,
        )
    }
}

/// Who dims and colours the star's and moons' light on its way through the air.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Reflect)]
#[reflect(Debug, PartialEq, Default, Clone)]
pub enum LightAttenuation {
    /// Insola applies the atmosphere's extinction: lights carry the light as it reaches the
    /// ground. Use this without an engine atmosphere. Default.
    #[default]
    ByInsola,
    /// The engine's atmosphere (Bevy's `Atmosphere`) dims each directional light itself, so
    /// lights carry the light above the air and Insola adds no extinction of its own.
    ByEngineAtmosphere,
}

impl LightAttenuation {
    /// The core's light mode for this choice.
    pub fn light_mode(self) -> LightMode {
        match self {
            LightAttenuation::ByInsola => LightMode::Ground,
            LightAttenuation::ByEngineAtmosphere => LightMode::TopOfAtmosphere,
        }
    }
}

/// How often observers ([`SurfacePlace`](crate::SurfacePlace) entities) are updated.
#[derive(Debug, Clone, Copy, PartialEq, Default, Reflect)]
#[reflect(Debug, PartialEq, Default, Clone)]
pub enum ObserverInterval {
    /// Every frame. Default.
    #[default]
    EveryFrame,
    /// When at least this many real seconds have passed since the last update.
    RealSeconds(f32),
    /// When at least this many world seconds have passed (the world clock's rate matters).
    WorldSeconds(f64),
}

/// Runtime settings of the plugin. Change them at any time; they take effect the same frame.
#[derive(Resource, Debug, Clone, PartialEq, Reflect)]
#[reflect(Resource, Debug, Default, Clone)]
pub struct InsolaSettings {
    /// Latitude of the scene's reference place, degrees in −90…90 (positive toward the north
    /// pole). The sky state, lights and notifications are for this place. Default 40.
    pub reference_latitude_deg: f64,
    /// East longitude of the scene's reference place, degrees in −360…360. Default 0.
    pub reference_longitude_deg: f64,
    /// The scene's compass. Default: +Y up, −Z north.
    pub compass: SceneCompass,
    /// Who attenuates the lights. Default [`LightAttenuation::ByInsola`].
    pub attenuation: LightAttenuation,
    /// Write the sky's diffuse light into `GlobalAmbientLight`. Turn off if something else
    /// lights the scene with the sky (an environment map from the engine's atmosphere), so the
    /// sky is not counted twice. Default `true`.
    pub write_ambient_light: bool,
    /// How often observers update. Default [`ObserverInterval::EveryFrame`].
    pub observer_interval: ObserverInterval,
    /// Longest world span, seconds, for which one frame's notifications are computed; a longer
    /// frame (a big step) sends none and logs a warning, so one step of centuries cannot stall
    /// the game. Default: two world years' worth of a 1000-day year (1.728×10⁸ s).
    pub max_notified_span_s: f64,
    /// Keeps the displayed light from flashing at high clock rates (photosensitivity). Default
    /// [`FlashGuard::On`]; turn it off only for tools and tests. See [`crate::flash_guard`].
    pub flash_guard: FlashGuard,
    /// Which sky events are sent as [`SkyNotice`](crate::SkyNotice)s. Default: all of them.
    #[reflect(ignore)]
    pub notices: EventFilter,
    /// On a world of several stars, keep shadow maps on the light of the brightest star that
    /// is up and off on the others' ([`StarLight`](crate::StarLight)), so the scene casts one
    /// set of shadows, from the right sun. Off: shadows stay as you set them. One-star worlds
    /// are never touched. Default `true`.
    pub shadows_follow_brighter_star: bool,
}

impl Default for InsolaSettings {
    fn default() -> Self {
        InsolaSettings {
            reference_latitude_deg: 40.0,
            reference_longitude_deg: 0.0,
            compass: SceneCompass::default(),
            attenuation: LightAttenuation::ByInsola,
            write_ambient_light: true,
            observer_interval: ObserverInterval::EveryFrame,
            max_notified_span_s: 2.0 * 1000.0 * 86_400.0,
            flash_guard: FlashGuard::default(),
            notices: EventFilter::all(),
            shadows_follow_brighter_star: true,
        }
    }
}

impl InsolaSettings {
    /// The reference place, or `None` if the latitude or longitude is out of range.
    pub fn reference_place(&self) -> Option<Place> {
        Place::from_degrees(self.reference_latitude_deg, self.reference_longitude_deg).ok()
    }

    /// The reference place by the core's rule ([`Place::normalised`]): latitude clamped to
    /// ±90°, longitude wrapped to ±180°, non-finite values taken as 0.
    pub fn reference_place_clamped(&self) -> Place {
        Place::normalised(self.reference_latitude_deg, self.reference_longitude_deg)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn compass_is_orthonormal_and_round_trips() {
        let c = SceneCompass::new(Vec3::new(0.0, 1.0, 0.1), Vec3::new(1.0, 0.3, 0.2)).unwrap();
        assert!(c.up().dot(c.north()).abs() < 1e-6 && c.up().dot(c.east()).abs() < 1e-6);
        let v = DVec3::new(0.3, -0.5, 0.81).normalize();
        assert!((c.to_enu(c.to_scene(v)) - v).length() < 1e-6);
        assert!(SceneCompass::new(Vec3::Y, Vec3::Y * 2.0).is_err());
        assert!(SceneCompass::new(Vec3::ZERO, Vec3::X).is_err());
    }

    #[test]
    fn reference_place_rejects_and_clamps() {
        let s = InsolaSettings {
            reference_latitude_deg: 120.0,
            ..default()
        };
        assert!(s.reference_place().is_none());
        assert_eq!(s.reference_place_clamped().latitude_rad, 90f64.to_radians());
    }
}
