//! The climate model driven by a [`Planet`]'s orbit: forcing, equilibrium and local weather,
//! and [`WorldClimate`], an equilibrated cycle bundled with its world's year and day for
//! queries by world time.

use serde::{Deserialize, Serialize};

use crate::climate::{
    AnnualForcing, ClimateCycle, ClimateError, ClimateGrid, ClimateSnapshot, ClimateSpec,
    ClimateZone, Season, SeasonSample, equilibrate,
};
use crate::error::QueryError;
use crate::planet::Planet;
use crate::sky::Place;

/// Temperature and season at one place and instant.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct LocalClimate {
    /// Local temperature: zonal seasonal value + day-night deviation − lapse rate × elevation, °C.
    pub temperature_c: f64,
    /// Zonal seasonal temperature of the latitude band at this time of year, °C.
    pub zonal_temperature_c: f64,
    /// Season at this latitude.
    pub season: Season,
    /// Ice regime of the latitude band.
    pub zone: ClimateZone,
}

/// A world's equilibrated climate, ready for queries by latitude, time of year and the star's
/// hour angle: the cycle with the world's year and mean solar day.
#[derive(Debug, Clone)]
pub struct WorldClimate {
    cycle: Box<ClimateCycle>,
    year_s: f64,
    day_s: f64,
}

/// Fraction of a year of `year_s` seconds elapsed at `t_s` since the last whole year from time
/// zero, `[0, 1)`.
fn year_fraction_of(t_s: f64, year_s: f64) -> f64 {
    (t_s.rem_euclid(year_s) / year_s).clamp(0.0, 1.0 - f64::EPSILON)
}

impl WorldClimate {
    /// Equilibrates the climate of `planet` ([`Planet::equilibrate_climate`]; milliseconds to
    /// tens of milliseconds).
    ///
    /// # Errors
    /// As [`Planet::equilibrate_climate`]; [`ClimateError::NotConverged`] carries the last
    /// year, which [`WorldClimate::from_cycle`] accepts.
    pub fn equilibrate(planet: &Planet) -> Result<WorldClimate, ClimateError> {
        Ok(WorldClimate::from_cycle(
            planet,
            planet.equilibrate_climate()?,
        ))
    }

    /// `cycle`, computed for `planet`, ready for queries. A tidally locked world's day-night
    /// cycle is its year.
    pub fn from_cycle(planet: &Planet, cycle: ClimateCycle) -> WorldClimate {
        let day_s = planet.day_s();
        WorldClimate {
            cycle: Box::new(cycle),
            year_s: planet.year_s(),
            day_s: if day_s.is_finite() && day_s > 0.0 {
                day_s
            } else {
                planet.year_s()
            },
        }
    }

    /// The climate cycle: band statistics, ice edges, zones, summaries.
    pub fn cycle(&self) -> &ClimateCycle {
        &self.cycle
    }

    /// Fraction of the climate year at world time `t_s`, `[0, 1)` (as
    /// [`Planet::year_fraction`]).
    pub fn year_fraction(&self, t_s: f64) -> f64 {
        year_fraction_of(t_s, self.year_s)
    }

    /// Zonal-mean surface temperature, °C, at latitude `lat_rad` and `year_fraction`.
    pub fn zonal_temperature_c(&self, lat_rad: f64, year_fraction: f64) -> f64 {
        self.cycle.temperature_c(lat_rad, year_fraction)
    }

    /// Local temperature, °C, at the reference elevation: zonal mean plus the day-night
    /// deviation at the star's local hour angle `hour_angle_rad` (0 at local transit, growing
    /// with time). `NaN` for a latitude outside ±π/2 or a non-finite input.
    pub fn temperature_c(&self, lat_rad: f64, year_fraction: f64, hour_angle_rad: f64) -> f64 {
        self.cycle
            .instant(year_fraction, self.day_s)
            .and_then(|i| i.temperature_c(lat_rad, hour_angle_rad, 0.0))
            .unwrap_or(f64::NAN)
    }

    /// The season, following the local temperature cycle, at `lat_rad` and `year_fraction`.
    pub fn season(&self, lat_rad: f64, year_fraction: f64) -> Season {
        self.cycle.season(lat_rad, year_fraction)
    }

    /// The table of `year_fraction` for fast per-place lookups.
    pub fn snapshot(&self, year_fraction: f64) -> ClimateSnapshot {
        self.cycle.snapshot(year_fraction, self.day_s)
    }
}

impl Planet {
    /// The world's climate parameters (its file's `climate` section, or the defaults).
    pub fn climate_spec(&self) -> ClimateSpec {
        self.spec().climate.clone().unwrap_or_default()
    }

    /// Fraction of the orbit elapsed since the last time-zero anniversary, `[0, 1)`.
    pub fn year_fraction(&self, t_s: f64) -> f64 {
        year_fraction_of(t_s, self.year_s())
    }

    /// The orbit's forcing as the climate model takes it: `steps` samples of declination and
    /// distance evenly spaced in time over one year, starting at time zero. On a world of two
    /// stars this is the primary's; [`Planet::star_forcings`] gives each star's.
    pub fn annual_forcing(&self, steps: usize) -> AnnualForcing {
        let n = steps.max(1);
        let samples = (0..n)
            .map(|i| {
                let s = self.star_instant(i as f64 / n as f64 * self.year_s());
                SeasonSample {
                    declination_rad: s.declination_rad,
                    distance_factor: s.distance_factor,
                }
            })
            .collect();
        AnnualForcing {
            s0_w_m2: self.flux_at_mean_distance_w_m2(),
            year_s: self.year_s(),
            samples,
        }
    }

    /// The forcing of each shining star (primary first), as [`Planet::annual_forcing`] gives
    /// the primary's: `steps` samples of that star's declination and distance factor (its
    /// distance over the planet's semi-major axis), with its own flux at that distance.
    pub fn star_forcings(&self, steps: usize) -> Vec<AnnualForcing> {
        let n = steps.max(1);
        self.shining_stars()
            .map(|k| {
                let samples = (0..n)
                    .filter_map(|i| self.star_instant_of(k, i as f64 / n as f64 * self.year_s()))
                    .map(|s| SeasonSample {
                        declination_rad: s.declination_rad,
                        distance_factor: s.distance_factor,
                    })
                    .collect();
                AnnualForcing {
                    s0_w_m2: self.flux_at_mean_distance_of_w_m2(k).unwrap_or(0.0),
                    year_s: self.year_s(),
                    samples,
                }
            })
            .collect()
    }

    /// Runs the climate model to its repeating year (milliseconds for the default 90 bands).
    ///
    /// With a shining companion or a ring the model is forced by the sum of each star's
    /// insolation ([`Planet::star_band_tables`] of [`Planet::star_forcings`]): at each step each
    /// star's band mean with its own declination and distance, by quadrature under the ring.
    /// Mutual eclipses of the stars, a few hours long, are left out of this forcing. The cycle
    /// keeps the primary's forcing for its day-night queries.
    pub fn equilibrate_climate(&self) -> Result<ClimateCycle, ClimateError> {
        let spec = self.climate_spec();
        let forcing = self.annual_forcing(spec.steps_per_year);
        let steps = spec.steps_per_year;
        if !self.daily_mean_needs_quadrature() {
            return equilibrate(&spec, &forcing);
        }
        // Under a ring or two suns the table is built per star (each star's own declination,
        // distance and flux), by quadrature under the ring, and summed.
        let grid = ClimateGrid::new(spec.bands)?;
        let table = self.star_band_tables(&forcing, &grid, steps)?;
        crate::climate::equilibrate_with_insolation(&spec, &forcing, table)
    }

    /// Temperature and season at `place`, `elevation_m` above the reference level, at `t_s`,
    /// from an equilibrated `cycle` of this planet.
    pub fn local_climate(
        &self,
        cycle: &ClimateCycle,
        t_s: f64,
        place: Place,
        elevation_m: f64,
    ) -> Result<LocalClimate, QueryError> {
        let f = self.year_fraction(t_s);
        let hour_angle = self.star_position(t_s, place).hour_angle_rad;
        let instant = cycle.instant(f, self.day_s())?;
        Ok(LocalClimate {
            temperature_c: instant.temperature_c(place.latitude_rad, hour_angle, elevation_m)?,
            zonal_temperature_c: instant.zonal_temperature_c(place.latitude_rad),
            season: cycle.season(place.latitude_rad, f),
            zone: cycle.zone(place.latitude_rad),
        })
    }
}

#[cfg(test)]
mod tests {
    use crate::{Place, Planet, WorldSpec};

    fn planet(file: &str) -> Planet {
        let text = std::fs::read_to_string(format!(
            "{}/../../assets/worlds/{file}",
            env!("CARGO_MANIFEST_DIR")
        ))
        .unwrap();
        Planet::new(&WorldSpec::from_ron_str(&text).unwrap()).unwrap()
    }

    #[test]
    fn world_climate_snapshot_agrees_with_direct_queries() {
        let p = planet("verdance.world.ron");
        let m = crate::WorldClimate::equilibrate(&p).unwrap();
        let lat = 50f64.to_radians();
        let snap = m.snapshot(0.35);
        let direct = m.temperature_c(lat, 0.35, 0.3);
        // Within the table's interpolation error.
        assert!((f64::from(snap.temperature_c(lat, 0.3)) - direct).abs() < 0.5);
        assert_eq!(snap.season(lat), Some(m.season(lat, 0.35)));
        assert_eq!(
            m.year_fraction(1.5 * p.year_s()),
            p.year_fraction(1.5 * p.year_s())
        );
    }

    #[test]
    fn high_tilt_world_has_warm_poles() {
        let p = planet("calvenne.world.ron");
        let c = p.equilibrate_climate().unwrap();
        let stats = c.band_stats();
        let equator = stats
            .iter()
            .min_by(|a, b| a.lat_rad.abs().total_cmp(&b.lat_rad.abs()))
            .unwrap();
        let pole = stats
            .iter()
            .max_by(|a, b| a.lat_rad.total_cmp(&b.lat_rad))
            .unwrap();
        assert!(
            pole.mean_c > equator.mean_c,
            "pole {} equator {}",
            pole.mean_c,
            equator.mean_c
        );
    }

    #[test]
    fn demo_world_is_temperate_and_local_values_are_sane() {
        let p = planet("verdance.world.ron");
        let c = p.equilibrate_climate().unwrap();
        assert!(
            c.global_mean_c() > -5.0 && c.global_mean_c() < 30.0,
            "{}",
            c.global_mean_c()
        );
        let place = Place::from_degrees(35.0, 10.0).unwrap();
        let noon = p
            .local_climate(&c, p.time_of_solar_days(100.5), place, 0.0)
            .unwrap();
        let high = p
            .local_climate(&c, p.time_of_solar_days(100.5), place, 3000.0)
            .unwrap();
        // Standard lapse rate 6.5 K/km (ICAO standard atmosphere; from memory).
        assert!((noon.temperature_c - high.temperature_c - 19.5).abs() < 1e-9);
        assert!(noon.temperature_c.is_finite());
    }
}
