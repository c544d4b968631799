//! Observers at scale: many places on the planet, each with its own star altitude,
//! insolation, temperature and season.
//!
//! Give an entity a [`SurfacePlace`] (latitude and longitude) and it gets [`LocalConditions`],
//! updated in [`InsolaSystems::UpdateObservers`](crate::InsolaSystems) at the cadence of
//! [`InsolaSettings::observer_interval`]. The star's state is computed once per update
//! ([`StarFrame`]); each place then costs one cosine, one arcsine and a table lookup, run in
//! parallel with `par_iter_mut`, so a million places stay cheap. Places whose position changed
//! are updated on every frame in between.

use bevy::prelude::*;
use insola::error::QueryError;
use insola::{Place, Planet};

use crate::climate::{ClimateSnapshot, SeasonalClimate};
use crate::clock::WorldClock;
use crate::season::{SeasonOfYear, ThermalSeason};
use crate::settings::{InsolaSettings, ObserverInterval};
use crate::world_asset::ActiveWorld;

/// A place on the planet: latitude and longitude, with their sine and cosine cached.
///
/// ```
/// use bevy::prelude::*;
/// use bevy_insola::SurfacePlace;
/// fn spawn_villages(mut commands: Commands) {
///     for (lat, lon) in [(12.0, 40.0), (-33.5, 151.0)] {
///         commands.spawn(SurfacePlace::from_degrees(lat, lon).unwrap());
///     }
/// }
/// # App::new().add_systems(Startup, spawn_villages).update();
/// ```
#[derive(Component, Debug, Clone, Copy, PartialEq, Reflect)]
#[reflect(Component, Debug, Default, Clone)]
#[require(LocalConditions)]
pub struct SurfacePlace {
    latitude_rad: f64,
    longitude_rad: f64,
    sin_lat: f64,
    cos_lat: f64,
}

impl Default for SurfacePlace {
    /// Latitude 0, longitude 0.
    fn default() -> Self {
        SurfacePlace::from_place(Place {
            latitude_rad: 0.0,
            longitude_rad: 0.0,
        })
    }
}

impl SurfacePlace {
    /// A place from degrees: latitude −90…90 (positive toward the north pole), east longitude
    /// −360…360.
    pub fn from_degrees(latitude_deg: f64, longitude_deg: f64) -> Result<SurfacePlace, QueryError> {
        Ok(SurfacePlace::from_place(Place::from_degrees(
            latitude_deg,
            longitude_deg,
        )?))
    }

    /// A place from the core's [`Place`] (radians; latitude clamped to ±π/2).
    pub fn from_place(place: Place) -> SurfacePlace {
        let lat = place
            .latitude_rad
            .clamp(-std::f64::consts::FRAC_PI_2, std::f64::consts::FRAC_PI_2);
        let (sin_lat, cos_lat) = lat.sin_cos();
        SurfacePlace {
            latitude_rad: lat,
            longitude_rad: place.longitude_rad,
            sin_lat,
            cos_lat,
        }
    }

    /// The place as the core's [`Place`].
    pub fn place(&self) -> Place {
        Place {
            latitude_rad: self.latitude_rad,
            longitude_rad: self.longitude_rad,
        }
    }

    /// Latitude, radians.
    pub fn latitude_rad(&self) -> f64 {
        self.latitude_rad
    }

    /// East longitude, radians.
    pub fn longitude_rad(&self) -> f64 {
        self.longitude_rad
    }
}

/// What an observer at a [`SurfacePlace`] has, as of its last update.
#[derive(Component, Debug, Clone, Copy, PartialEq, Default, Reflect)]
#[reflect(Component, Debug, Default, Clone)]
pub struct LocalConditions {
    /// Geometric altitude of the star's centre, radians.
    pub star_altitude_rad: f32,
    /// `true` while the star is up (above the standard rise altitude).
    pub star_is_up: bool,
    /// Top-of-atmosphere insolation on a horizontal surface, W m⁻².
    pub toa_insolation_w_m2: f32,
    /// Surface air temperature, °C (zonal seasonal mean plus the day-night swing; `NaN` until
    /// the climate is ready).
    pub temperature_c: f32,
    /// The astronomical season in the place's hemisphere.
    pub season: SeasonOfYear,
    /// The season by the local temperature cycle (from the climate model).
    pub thermal_season: ThermalSeason,
    /// World time of the update, seconds since time zero.
    pub updated_at_s: f64,
}

/// The star's state at one instant, everything per-place work needs (computed once per update).
#[derive(Debug, Clone, Default)]
pub struct StarFrame {
    /// World time, seconds since time zero.
    pub t_s: f64,
    sin_dec: f64,
    cos_dec: f64,
    /// Geometric hour angle at longitude 0 (sidereal angle − right ascension), radians.
    hour_angle_0_rad: f64,
    /// +1 on forward-spinning worlds, −1 on backward ones.
    sense: f64,
    toa_flux_w_m2: f64,
    sin_rise_altitude: f64,
    season_north: SeasonOfYear,
    season_south: SeasonOfYear,
    climate: ClimateSnapshot,
}

impl StarFrame {
    /// The frame of `planet` at `t_s`, with the climate's snapshot if one is given.
    pub fn new(planet: &Planet, t_s: f64, climate: Option<&SeasonalClimate>) -> StarFrame {
        let i = planet.star_instant(t_s);
        let (sin_dec, cos_dec) = i.declination_rad.sin_cos();
        let snapshot = climate
            .and_then(|c| c.model())
            .map(|m| m.snapshot(m.year_fraction(t_s)))
            .unwrap_or_default();
        StarFrame {
            t_s,
            sin_dec,
            cos_dec,
            hour_angle_0_rad: i.sidereal_angle_rad - i.right_ascension_rad,
            sense: planet.spin.sense.sign(),
            toa_flux_w_m2: i.toa_flux_w_m2,
            sin_rise_altitude: planet.standard_rise_altitude_rad().sin(),
            season_north: SeasonOfYear::at(i.ecliptic_longitude_rad, 1.0),
            season_south: SeasonOfYear::at(i.ecliptic_longitude_rad, -1.0),
            climate: snapshot,
        }
    }

    /// The conditions at `place` (one cosine, one arcsine, a table lookup).
    #[inline]
    pub fn conditions(&self, place: &SurfacePlace) -> LocalConditions {
        let h = self.hour_angle_0_rad + place.longitude_rad;
        let sin_alt = (place.sin_lat * self.sin_dec + place.cos_lat * self.cos_dec * h.cos())
            .clamp(-1.0, 1.0);
        LocalConditions {
            star_altitude_rad: sin_alt.asin() as f32,
            star_is_up: sin_alt > self.sin_rise_altitude,
            toa_insolation_w_m2: (self.toa_flux_w_m2 * sin_alt.max(0.0)) as f32,
            // The climate takes the hour angle in the sense the sky turns.
            temperature_c: self
                .climate
                .temperature_c(place.latitude_rad, self.sense * h),
            thermal_season: self.climate.season(place.latitude_rad),
            season: if place.latitude_rad < 0.0 {
                self.season_south
            } else {
                self.season_north
            },
            updated_at_s: self.t_s,
        }
    }
}

/// When observers were last updated.
#[derive(Default)]
pub struct ObserverCadence {
    last_real_s: Option<f64>,
    last_world_s: f64,
    generation: u64,
    climate_ready: bool,
    frame: StarFrame,
}

/// Updates [`LocalConditions`] of every [`SurfacePlace`] when due, and of moved places every
/// frame.
pub fn update_observers(
    world: Res<ActiveWorld>,
    clock: Res<WorldClock>,
    settings: Res<InsolaSettings>,
    climate: Res<SeasonalClimate>,
    real: Res<Time<Real>>,
    mut cadence: Local<ObserverCadence>,
    mut observers: Query<(Ref<SurfacePlace>, &mut LocalConditions)>,
) {
    let Some(planet) = world.planet() else {
        return;
    };
    let now_real = real.elapsed_secs_f64();
    let now_world = clock.elapsed_s();
    let forced = cadence.last_real_s.is_none()
        || cadence.generation != world.generation()
        || cadence.climate_ready != climate.is_ready()
        || clock.jumped_this_frame();
    let due = forced
        || match settings.observer_interval {
            ObserverInterval::EveryFrame => true,
            ObserverInterval::RealSeconds(s) => {
                now_real - cadence.last_real_s.unwrap_or(0.0) >= s as f64
            }
            ObserverInterval::WorldSeconds(s) => (now_world - cadence.last_world_s).abs() >= s,
        };
    if due {
        cadence.frame = StarFrame::new(planet, now_world, Some(&climate));
        cadence.last_real_s = Some(now_real);
        cadence.last_world_s = now_world;
        cadence.generation = world.generation();
        cadence.climate_ready = climate.is_ready();
    }
    let frame = &cadence.frame;
    observers
        .par_iter_mut()
        .for_each(|(place, mut conditions)| {
            if due || place.is_changed() {
                *conditions = frame.conditions(&place);
            }
        });
}

#[cfg(test)]
mod tests {
    use super::*;
    use insola::WorldSpec;

    #[test]
    fn fast_path_matches_the_core() {
        let text = r#"(name: "Brindle", star: (temperature_k: 5800, radius_r_sun: 1, luminosity_l_sun: 1),
            orbit: (semi_major_axis_au: 1, eccentricity: 0.05, periapsis_longitude_deg: 40, period_days: 300),
            spin: (obliquity_deg: 130, solar_day_hours: 20))"#;
        let planet = Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap();
        for k in 0..40 {
            let t = k as f64 * 98_765.4;
            let frame = StarFrame::new(&planet, t, None);
            for (lat, lon) in [(0.0, 0.0), (45.0, 100.0), (-70.0, -30.0), (89.0, 200.0)] {
                let p = SurfacePlace::from_degrees(lat, lon).unwrap();
                let c = frame.conditions(&p);
                let s = planet.star_position(t, p.place());
                assert!((c.star_altitude_rad as f64 - s.altitude_rad).abs() < 1e-5);
                assert!((c.toa_insolation_w_m2 as f64 - s.toa_insolation_w_m2).abs() < 1e-2);
            }
        }
    }
}
