//! The seasonal climate: temperature by latitude, time of year and time of day, rebuilt in the
//! background whenever the world changes.
//!
//! [`SeasonalClimate`] holds the climate of the [`ActiveWorld`]. When the world changes, the new
//! climate is equilibrated on Bevy's async compute pool; until it is ready the previous one (if
//! any) keeps answering, so no frame stalls. Queries: [`SeasonalClimate::zonal_temperature_c`]
//! for any latitude and time, [`SeasonalClimate::local_temperature_c`] with the day-night
//! swing, and [`ClimateSnapshot`], a table of one instant that observers read with a few flops.
//!
//! The model is the core's seasonal energy-balance model ([`insola::climate`]), equilibrated
//! with [`Planet::equilibrate_climate`]. Should it fail to build, a deliberately small interim
//! stand-in takes over (logged; [`ClimateModel::is_interim`]): each latitude band relaxes
//! toward radiative balance with the daily-mean insolation, `C dT/dt = (1 − α) Q − (A + B T)`,
//! without heat transport between bands, plus a cosine day-night swing. Its numbers are
//! plausible, not validated.

use std::sync::Arc;

use bevy::prelude::*;
use bevy::tasks::{AsyncComputeTaskPool, Task, block_on, futures_lite::future};
use insola::climate::{ClimateCycle, ClimateError, Season};
use insola::{Place, Planet};

use crate::season::ThermalSeason;
use crate::world_asset::ActiveWorld;

/// Latitude rows of a [`ClimateSnapshot`] (every 2°, pole to pole).
pub const SNAPSHOT_LATITUDES: usize = 91;
/// Hour-angle columns of a [`ClimateSnapshot`] (every 7.5°, −180° to 180°).
pub const SNAPSHOT_HOUR_ANGLES: usize = 49;

/// A world's seasonal climate, ready for queries.
#[derive(Debug, Clone)]
pub struct ClimateModel {
    backend: Backend,
    year_s: f64,
    day_s: f64,
}

#[derive(Debug, Clone)]
enum Backend {
    /// The core's energy-balance model.
    Core(Box<ClimateCycle>),
    /// The stand-in, used only if the core model cannot be built (see the module docs).
    Interim(InterimClimate),
}

impl ClimateModel {
    /// Equilibrates the climate of `planet` with the core's energy-balance model (milliseconds
    /// to tens of milliseconds; the plugin runs it in the background). A climate that does not
    /// settle uses its last computed year (logged); a model that cannot be built at all falls
    /// back to the interim stand-in (logged).
    pub fn build(planet: &Planet) -> ClimateModel {
        let backend = match planet.equilibrate_climate() {
            Ok(cycle) => Backend::Core(Box::new(cycle)),
            Err(ClimateError::NotConverged { last, .. }) => {
                warn!(
                    "Insola: the climate of `{}` did not settle to a repeating year; using the last year computed",
                    planet.spec.name
                );
                Backend::Core(last)
            }
            Err(error) => {
                error!(
                    "Insola: climate model failed for `{}` ({error}); using the interim stand-in",
                    planet.spec.name
                );
                Backend::Interim(InterimClimate::build(planet))
            }
        };
        ClimateModel::with_backend(planet, backend)
    }

    /// The interim stand-in model (no heat transport; see the module docs), for comparison.
    pub fn build_interim(planet: &Planet) -> ClimateModel {
        ClimateModel::with_backend(planet, Backend::Interim(InterimClimate::build(planet)))
    }

    fn with_backend(planet: &Planet, backend: Backend) -> ClimateModel {
        let day_s = planet.day_s();
        ClimateModel {
            backend,
            year_s: planet.year_s(),
            day_s: if day_s.is_finite() && day_s > 0.0 {
                day_s
            } else {
                planet.year_s()
            },
        }
    }

    /// `true` if this is the interim stand-in rather than the core's climate model.
    pub fn is_interim(&self) -> bool {
        matches!(self.backend, Backend::Interim(_))
    }

    /// The core's climate cycle (band statistics, ice edges, zones...), unless interim.
    pub fn cycle(&self) -> Option<&ClimateCycle> {
        match &self.backend {
            Backend::Core(c) => Some(c),
            Backend::Interim(_) => None,
        }
    }

    /// Fraction of the climate year at world time `t_s`, `[0, 1)` (years start at whole
    /// multiples of the orbital period, as on the calendar).
    pub fn year_fraction(&self, t_s: f64) -> f64 {
        (t_s / self.year_s).rem_euclid(1.0)
    }

    /// Zonal-mean surface temperature, °C, at latitude `lat_rad` and `year_fraction`.
    pub fn zonal_temperature_c(&self, lat_rad: f64, year_fraction: f64) -> f64 {
        match &self.backend {
            Backend::Core(c) => c.temperature_c(lat_rad, year_fraction),
            Backend::Interim(m) => m.zonal_c(lat_rad, year_fraction),
        }
    }

    /// Local temperature, °C, at the reference elevation: zonal mean plus the day-night
    /// deviation at the star's local hour angle `hour_angle_rad` (0 at local noon, growing with
    /// time). `NaN` for a latitude outside ±π/2 or a non-finite input.
    pub fn temperature_c(&self, lat_rad: f64, year_fraction: f64, hour_angle_rad: f64) -> f64 {
        match &self.backend {
            Backend::Core(c) => c
                .instant(year_fraction, self.day_s)
                .and_then(|i| i.temperature_c(lat_rad, hour_angle_rad, 0.0))
                .unwrap_or(f64::NAN),
            Backend::Interim(m) => {
                m.zonal_c(lat_rad, year_fraction)
                    + m.diurnal_k(lat_rad, year_fraction, hour_angle_rad)
            }
        }
    }

    /// The season, following the local temperature cycle, at `lat_rad` and `year_fraction`
    /// (`None` from the interim model).
    pub fn season(&self, lat_rad: f64, year_fraction: f64) -> Option<Season> {
        self.cycle().map(|c| c.season(lat_rad, year_fraction))
    }

    /// The table of one instant for fast per-place lookups.
    pub fn snapshot(&self, year_fraction: f64) -> ClimateSnapshot {
        use std::f64::consts::{FRAC_PI_2, PI, TAU};
        let mut table = Vec::with_capacity(SNAPSHOT_LATITUDES * SNAPSHOT_HOUR_ANGLES);
        let instant = self
            .cycle()
            .and_then(|c| c.instant(year_fraction, self.day_s).ok());
        for i in 0..SNAPSHOT_LATITUDES {
            let lat = -FRAC_PI_2 + PI * i as f64 / (SNAPSHOT_LATITUDES - 1) as f64;
            for j in 0..SNAPSHOT_HOUR_ANGLES {
                let h = -PI + TAU * j as f64 / (SNAPSHOT_HOUR_ANGLES - 1) as f64;
                let t = match (&self.backend, &instant) {
                    (Backend::Core(_), Some(i)) => i.temperature_c(lat, h, 0.0).unwrap_or(f64::NAN),
                    (Backend::Core(_), None) => f64::NAN,
                    (Backend::Interim(m), _) => {
                        m.zonal_c(lat, year_fraction) + m.diurnal_k(lat, year_fraction, h)
                    }
                };
                table.push(t as f32);
            }
        }
        let seasons = (0..SNAPSHOT_LATITUDES)
            .map(|i| {
                let lat = -FRAC_PI_2 + PI * i as f64 / (SNAPSHOT_LATITUDES - 1) as f64;
                self.season(lat, year_fraction)
                    .map_or(ThermalSeason::Unknown, ThermalSeason::from)
            })
            .collect();
        ClimateSnapshot { table, seasons }
    }
}

/// Temperatures of one instant on a latitude × hour-angle grid, for many places at once.
#[derive(Debug, Clone, Default, PartialEq)]
pub struct ClimateSnapshot {
    table: Vec<f32>,
    seasons: Vec<ThermalSeason>,
}

impl ClimateSnapshot {
    /// The season by the temperature cycle at latitude `lat_rad` (nearest table row).
    #[inline]
    pub fn season(&self, lat_rad: f64) -> ThermalSeason {
        let u = ((lat_rad + std::f64::consts::FRAC_PI_2) / std::f64::consts::PI).clamp(0.0, 1.0)
            * (SNAPSHOT_LATITUDES - 1) as f64;
        self.seasons
            .get(u.round() as usize)
            .copied()
            .unwrap_or_default()
    }

    /// Temperature, °C, at latitude `lat_rad` and the star's local hour angle `hour_angle_rad`
    /// (bilinear in the table; `NaN` for an empty snapshot).
    #[inline]
    pub fn temperature_c(&self, lat_rad: f64, hour_angle_rad: f64) -> f32 {
        if self.table.is_empty() {
            return f32::NAN;
        }
        let u = ((lat_rad + std::f64::consts::FRAC_PI_2) / std::f64::consts::PI).clamp(0.0, 1.0)
            * (SNAPSHOT_LATITUDES - 1) as f64;
        let h = (hour_angle_rad + std::f64::consts::PI).rem_euclid(std::f64::consts::TAU);
        let v = h / std::f64::consts::TAU * (SNAPSHOT_HOUR_ANGLES - 1) as f64;
        let (i0, j0) = (
            (u as usize).min(SNAPSHOT_LATITUDES - 2),
            (v as usize).min(SNAPSHOT_HOUR_ANGLES - 2),
        );
        let (fu, fv) = ((u - i0 as f64) as f32, (v - j0 as f64) as f32);
        let at = |i: usize, j: usize| self.table[i * SNAPSHOT_HOUR_ANGLES + j];
        let a = at(i0, j0) + fv * (at(i0, j0 + 1) - at(i0, j0));
        let b = at(i0 + 1, j0) + fv * (at(i0 + 1, j0 + 1) - at(i0 + 1, j0));
        a + fu * (b - a)
    }
}

/// The climate of the active world.
///
/// ```
/// use bevy::prelude::*;
/// use bevy_insola::{SeasonalClimate, SurfacePlace};
/// fn frost_warning(climate: Res<SeasonalClimate>, clock: Res<bevy_insola::WorldClock>, world: Res<bevy_insola::ActiveWorld>) {
///     let (Some(planet), true) = (world.planet(), climate.is_ready()) else { return };
///     let farm = SurfacePlace::from_degrees(52.0, 10.0).unwrap().place();
///     if climate.local_temperature_c(planet, farm, clock.elapsed_s()).is_some_and(|t| t < 0.0) {
///         info!("frost on the farm");
///     }
/// }
/// ```
#[derive(Resource, Default)]
pub struct SeasonalClimate {
    model: Option<Arc<ClimateModel>>,
    generation: u64,
    task: Option<(u64, Task<ClimateModel>)>,
}

impl SeasonalClimate {
    /// `true` once a climate is available (possibly still the previous world's while the new
    /// one is computed; see [`SeasonalClimate::is_current`]).
    pub fn is_ready(&self) -> bool {
        self.model.is_some()
    }

    /// `true` if the climate belongs to the world of `generation` ([`ActiveWorld::generation`]).
    pub fn is_current(&self, generation: u64) -> bool {
        self.model.is_some() && self.generation == generation
    }

    /// `true` while a new climate is being computed in the background.
    pub fn is_rebuilding(&self) -> bool {
        self.task.is_some()
    }

    /// The model, once ready.
    pub fn model(&self) -> Option<&ClimateModel> {
        self.model.as_deref()
    }

    /// Installs a model computed elsewhere (for tests or tools), for world `generation`.
    pub fn set_model(&mut self, model: ClimateModel, generation: u64) {
        self.model = Some(Arc::new(model));
        self.generation = generation;
        self.task = None;
    }

    /// Zonal-mean temperature, °C, at `lat_rad` and world time `t_s`.
    pub fn zonal_temperature_c(&self, lat_rad: f64, t_s: f64) -> Option<f64> {
        let m = self.model()?;
        Some(m.zonal_temperature_c(lat_rad, m.year_fraction(t_s)))
    }

    /// The season by the temperature cycle at `lat_rad` and world time `t_s`.
    pub fn season(&self, lat_rad: f64, t_s: f64) -> Option<ThermalSeason> {
        let m = self.model()?;
        m.season(lat_rad, m.year_fraction(t_s))
            .map(ThermalSeason::from)
    }

    /// Local temperature, °C, at `place` and world time `t_s`, with the day-night swing.
    pub fn local_temperature_c(&self, planet: &Planet, place: Place, t_s: f64) -> Option<f64> {
        let m = self.model()?;
        let h = planet.star_position(t_s, place).hour_angle_rad;
        Some(m.temperature_c(place.latitude_rad, m.year_fraction(t_s), h))
    }
}

/// Starts a background rebuild when the world changes and installs it when done.
pub fn update_climate(world: Res<ActiveWorld>, mut climate: ResMut<SeasonalClimate>) {
    let generation = world.generation();
    if let Some((task_generation, task)) = climate.task.as_mut()
        && let Some(model) = block_on(future::poll_once(task))
    {
        let g = *task_generation;
        climate.task = None;
        if g == generation {
            climate.model = Some(Arc::new(model));
            climate.generation = g;
        }
    }
    let Some(planet) = world.planet_arc() else {
        return;
    };
    let up_to_date = climate.model.is_some() && climate.generation == generation;
    let building = climate.task.as_ref().is_some_and(|(g, _)| *g == generation);
    if up_to_date || building {
        return;
    }
    match AsyncComputeTaskPool::try_get() {
        Some(pool) => {
            climate.task = Some((
                generation,
                pool.spawn(async move { ClimateModel::build(&planet) }),
            ))
        }
        // No task pools (an app without `TaskPoolPlugin`): compute in place.
        None => climate.set_model(ClimateModel::build(&planet), generation),
    }
}

// ---------------------------------------------------------------------------------------------
// Interim stand-in (see the module docs): used only when the core's model cannot be built.

/// Bands of the interim model (every 5°).
const INTERIM_BANDS: usize = 36;
/// Time steps per year of the interim model.
const INTERIM_STEPS: usize = 96;
/// Planetary albedo, outgoing longwave A (W m⁻²) and B (W m⁻² K⁻¹), T in °C: the classic
/// North–Coakley values (North & Coakley 1979; from memory).
const INTERIM_ALBEDO: f64 = 0.3;
const INTERIM_OLR_A_W_M2: f64 = 203.3;
const INTERIM_OLR_B_W_M2_K: f64 = 2.09;
/// Column heat capacity, J m⁻² K⁻¹ (about a 25 m ocean mixed layer; common practice, no source).
const INTERIM_HEAT_CAPACITY: f64 = 1.0e8;
/// Day-night swing per W m⁻² of daily-mean insolation, K, and the lag of the warmest hour after
/// noon as an hour angle (about two hours of a 24 h day). Common practice, no source.
const INTERIM_DIURNAL_K_PER_W_M2: f64 = 0.025;
const INTERIM_DIURNAL_LAG_RAD: f64 = 0.5;

#[derive(Debug, Clone)]
struct InterimClimate {
    /// `temps[k * INTERIM_BANDS + b]`, °C, step k of the year, band b (south to north).
    temps: Vec<f64>,
    /// Daily-mean insolation per step and band, W m⁻².
    insolation: Vec<f64>,
    /// Slow rotators swing more: the swing scales with sqrt(day / 24 h), capped at 4.
    diurnal_scale: f64,
}

impl InterimClimate {
    fn band_lat(b: usize) -> f64 {
        (-90.0 + 180.0 * (b as f64 + 0.5) / INTERIM_BANDS as f64).to_radians()
    }

    fn build(planet: &Planet) -> InterimClimate {
        let year_s = planet.year_s();
        let mut insolation = vec![0.0; INTERIM_STEPS * INTERIM_BANDS];
        for k in 0..INTERIM_STEPS {
            let t = year_s * k as f64 / INTERIM_STEPS as f64;
            for b in 0..INTERIM_BANDS {
                insolation[k * INTERIM_BANDS + b] =
                    planet.daily_mean_insolation_w_m2(t, Self::band_lat(b));
            }
        }
        let absorbed = |q: f64| (1.0 - INTERIM_ALBEDO) * q;
        // Start from the annual-mean balance, then run years (backward Euler) until periodic.
        let mut t: Vec<f64> = (0..INTERIM_BANDS)
            .map(|b| {
                let mean = (0..INTERIM_STEPS)
                    .map(|k| insolation[k * INTERIM_BANDS + b])
                    .sum::<f64>()
                    / INTERIM_STEPS as f64;
                (absorbed(mean) - INTERIM_OLR_A_W_M2) / INTERIM_OLR_B_W_M2_K
            })
            .collect();
        let dt = year_s / INTERIM_STEPS as f64;
        let r = dt / INTERIM_HEAT_CAPACITY;
        let mut temps = vec![0.0; INTERIM_STEPS * INTERIM_BANDS];
        for _year in 0..30 {
            let start = t.clone();
            for k in 0..INTERIM_STEPS {
                for b in 0..INTERIM_BANDS {
                    let s = absorbed(insolation[k * INTERIM_BANDS + b]);
                    t[b] = (t[b] + r * (s - INTERIM_OLR_A_W_M2)) / (1.0 + r * INTERIM_OLR_B_W_M2_K);
                    temps[k * INTERIM_BANDS + b] = t[b];
                }
            }
            if start.iter().zip(&t).all(|(a, b)| (a - b).abs() < 0.01) {
                break;
            }
        }
        let day_h = planet.day_s() / 3600.0;
        let diurnal_scale = if day_h.is_finite() {
            (day_h / 24.0).sqrt().clamp(0.0, 4.0)
        } else {
            0.0
        };
        InterimClimate {
            temps,
            insolation,
            diurnal_scale,
        }
    }

    /// Linear interpolation weights in the periodic step table and the band table.
    fn index(lat_rad: f64, year_fraction: f64) -> (usize, usize, f64, usize, usize, f64) {
        let f = if year_fraction.is_finite() {
            year_fraction.rem_euclid(1.0)
        } else {
            0.0
        };
        let s = f * INTERIM_STEPS as f64;
        let k0 = (s.floor() as usize).min(INTERIM_STEPS - 1);
        let wk = s - k0 as f64;
        let x = ((lat_rad.to_degrees() + 90.0) / 180.0 * INTERIM_BANDS as f64 - 0.5)
            .clamp(0.0, (INTERIM_BANDS - 1) as f64);
        let b0 = (x.floor() as usize).min(INTERIM_BANDS - 2);
        (k0, (k0 + 1) % INTERIM_STEPS, wk, b0, b0 + 1, x - b0 as f64)
    }

    fn lookup(table: &[f64], lat_rad: f64, year_fraction: f64) -> f64 {
        let (k0, k1, wk, b0, b1, wb) = Self::index(lat_rad, year_fraction);
        let at = |k: usize| {
            (1.0 - wb) * table[k * INTERIM_BANDS + b0] + wb * table[k * INTERIM_BANDS + b1]
        };
        (1.0 - wk) * at(k0) + wk * at(k1)
    }

    fn zonal_c(&self, lat_rad: f64, year_fraction: f64) -> f64 {
        Self::lookup(&self.temps, lat_rad, year_fraction)
    }

    fn diurnal_k(&self, lat_rad: f64, year_fraction: f64, hour_angle_rad: f64) -> f64 {
        let q = Self::lookup(&self.insolation, lat_rad, year_fraction);
        0.5 * INTERIM_DIURNAL_K_PER_W_M2
            * q
            * self.diurnal_scale
            * (hour_angle_rad - INTERIM_DIURNAL_LAG_RAD).cos()
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use insola::WorldSpec;

    fn planet() -> Planet {
        let text = r#"(name: "Brindle", star: (temperature_k: 5800, radius_r_sun: 1, luminosity_l_sun: 1),
            orbit: (semi_major_axis_au: 1, eccentricity: 0.01, periapsis_longitude_deg: 0, period_days: 360),
            spin: (obliquity_deg: 25, solar_day_hours: 24))"#;
        Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap()
    }

    #[test]
    fn warm_equator_cold_poles_and_seasons_in_phase() {
        for m in [
            ClimateModel::build(&planet()),
            ClimateModel::build_interim(&planet()),
        ] {
            check_model(&m);
        }
        assert!(!ClimateModel::build(&planet()).is_interim());
    }

    fn check_model(m: &ClimateModel) {
        let eq = m.zonal_temperature_c(0.0, 0.3);
        let pole = m.zonal_temperature_c(1.5, 0.3);
        assert!(eq > pole + 20.0, "{eq} {pole}");
        // Northern summer (after the northern solstice at 0.25) is warmer than northern winter.
        let lat = 50f64.to_radians();
        assert!(m.zonal_temperature_c(lat, 0.35) > m.zonal_temperature_c(lat, 0.85));
        // Afternoon warmer than before dawn.
        assert!(m.temperature_c(lat, 0.35, 0.5) > m.temperature_c(lat, 0.35, -2.5));
        // The snapshot agrees with direct queries to within its interpolation error.
        let snap = m.snapshot(0.35);
        let direct = m.temperature_c(lat, 0.35, 0.3);
        assert!((snap.temperature_c(lat, 0.3) as f64 - direct).abs() < 0.5);
    }
}
