//! From scene positions to latitude and longitude, for large maps.
//!
//! Put [`PlaceFromPosition`] on an entity (it gets a [`SurfacePlace`]) and insert a
//! [`MapProjection`]: the entity's place follows its `Transform` translation. The projection is
//! equirectangular around an origin: metres along the compass's north become degrees of
//! latitude, metres along east become degrees of longitude scaled by the cosine of the origin's
//! latitude. Use top-level entities (the translation is read from `Transform`, not
//! `GlobalTransform`, so no transform propagation is needed on a server).

use bevy::prelude::*;
use insola::Place;

use crate::observers::SurfacePlace;
use crate::settings::InsolaSettings;

/// How scene positions map to latitude and longitude.
///
/// ```
/// use bevy::prelude::*;
/// use bevy_insola::MapProjection;
/// let map = MapProjection { origin_latitude_deg: 30.0, origin_longitude_deg: 0.0, metres_per_degree: 1000.0 };
/// // 2 km north and 1 km east of the origin (default compass: north is −Z, east is +X).
/// let place = map.place_at(Vec3::new(1000.0, 0.0, -2000.0), &Default::default());
/// assert!((place.latitude_rad.to_degrees() - 32.0).abs() < 1e-9);
/// ```
#[derive(Resource, Debug, Clone, Copy, PartialEq, Reflect)]
#[reflect(Resource, Debug, Default, Clone)]
pub struct MapProjection {
    /// Latitude at the scene origin, degrees. Default 0.
    pub origin_latitude_deg: f64,
    /// East longitude at the scene origin, degrees. Default 0.
    pub origin_longitude_deg: f64,
    /// Scene metres per degree of latitude (a planet of radius R has 2πR/360). Default 111 000
    /// (an Earth-sized planet).
    pub metres_per_degree: f64,
}

impl Default for MapProjection {
    fn default() -> Self {
        MapProjection {
            origin_latitude_deg: 0.0,
            origin_longitude_deg: 0.0,
            metres_per_degree: 111_000.0,
        }
    }
}

impl MapProjection {
    /// The place at scene position `position`, normalised by the core's rule
    /// ([`Place::normalised`]: latitude clamped to ±90°, longitude wrapped to ±180°).
    pub fn place_at(&self, position: Vec3, compass: &crate::SceneCompass) -> Place {
        let m = if self.metres_per_degree.is_finite() && self.metres_per_degree > 0.0 {
            self.metres_per_degree
        } else {
            111_000.0
        };
        let north_m = position.dot(compass.north()) as f64;
        let east_m = position.dot(compass.east()) as f64;
        let cos0 = self.origin_latitude_deg.to_radians().cos().max(1e-3);
        Place::normalised(
            self.origin_latitude_deg + north_m / m,
            self.origin_longitude_deg + east_m / (m * cos0),
        )
    }
}

/// Marks an entity whose [`SurfacePlace`] follows its position through the [`MapProjection`].
#[derive(Component, Debug, Clone, Copy, Default, Reflect)]
#[reflect(Component, Debug, Default, Clone)]
#[require(SurfacePlace, Transform)]
pub struct PlaceFromPosition;

/// Sets the [`SurfacePlace`] of moved [`PlaceFromPosition`] entities (all of them when the
/// projection or the compass changes).
pub(crate) fn places_from_positions(
    projection: Option<Res<MapProjection>>,
    settings: Res<InsolaSettings>,
    mut entities: Query<(Ref<Transform>, &mut SurfacePlace), With<PlaceFromPosition>>,
) {
    let Some(projection) = projection else {
        return;
    };
    let all = projection.is_changed() || settings.is_changed();
    entities.par_iter_mut().for_each(|(transform, mut place)| {
        if all || transform.is_changed() {
            let new = SurfacePlace::from_place(
                projection.place_at(transform.translation, &settings.compass),
            );
            place.set_if_neq(new);
        }
    });
}
