//! The climate model driven by a [`Planet`]'s orbit: forcing, equilibrium and local weather.

use serde::{Deserialize, Serialize};

use crate::climate::{
    AnnualForcing, ClimateCycle, ClimateError, ClimateSpec, ClimateZone, Season, SeasonSample,
    equilibrate,
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

impl Planet {
    /// The world's climate parameters (its file's `climate` section, or the defaults).
    pub fn climate_spec(&self) -> ClimateSpec {
        self.spec().climate.clone().unwrap_or_default()
    }

    /// Fraction of the orbit elapsed since the last time-zero anniversary, `[0, 1)`.
    pub fn year_fraction(&self, t_s: f64) -> f64 {
        (t_s.rem_euclid(self.year_s()) / self.year_s()).clamp(0.0, 1.0 - f64::EPSILON)
    }

    /// The orbit's forcing as the climate model takes it: `steps` samples of declination and
    /// distance evenly spaced in time over one year, starting at time zero.
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

    /// Runs the climate model to its repeating year (milliseconds for the default 90 bands).
    pub fn equilibrate_climate(&self) -> Result<ClimateCycle, ClimateError> {
        let spec = self.climate_spec();
        let forcing = self.annual_forcing(spec.steps_per_year);
        equilibrate(&spec, &forcing)
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
    fn high_tilt_world_has_warm_poles() {
        let p = planet("tessaly-reach.world.ron");
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
