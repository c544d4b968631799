//! The map climate on the observers' shared table: local temperatures by latitude and
//! longitude at one instant, so that many places read it as they read the zonal climate's.

use super::cycle::MapClimate;
use crate::climate::{PlaceTable, SNAPSHOT_LATITUDES, Season};
use crate::error::QueryError;

impl MapClimate {
    /// Local temperatures ([`MapClimate::local_temperature_c`]) on a [`PlaceTable`] at
    /// `year_fraction`, where the star's local hour angle at east longitude `lon` (radians) is
    /// `hour_angle_at(lon)` and the mean solar day lasts `solar_day_s`; `seasons` are the rows'
    /// seasons (from the zonal climate's [`crate::climate::ClimateSnapshot::seasons`]: the map
    /// model keeps no seasons of its own).
    ///
    /// One pass over the table's 8,827 nodes per instant; every place then reads four nodes,
    /// as it does for the zonal climate. Values equal [`MapClimate::local_temperature_c`] at
    /// the nodes to single precision.
    ///
    /// Errors: a non-finite `year_fraction` or a `solar_day_s` not positive and finite.
    pub fn place_table(
        &self,
        year_fraction: f64,
        hour_angle_at: impl Fn(f64) -> f64,
        solar_day_s: f64,
        seasons: [Season; SNAPSHOT_LATITUDES],
    ) -> Result<PlaceTable, QueryError> {
        super::cycle::check_year_and_day(year_fraction, solar_day_s)?;
        let (k0, k1, wt) = crate::climate::periodic_index(year_fraction, self.steps);
        let (a, b) = (self.temperatures_c(k0), self.temperatures_c(k1));
        let layer = self.diurnal_layer(year_fraction, solar_day_s);
        Ok(PlaceTable::from_fn(
            |lat, lon| {
                let t = self.interpolate(
                    |c| (1.0 - wt) * f64::from(a[c]) + wt * f64::from(b[c]),
                    lat,
                    lon,
                );
                let t = match &layer {
                    Some(layer) => {
                        let (sp, cp) = lat.sin_cos();
                        self.with_diurnal_layer(layer, t, sp, cp, lat, lon, hour_angle_at(lon))
                    }
                    None => t,
                };
                t as f32
            },
            seasons,
        ))
    }
}

#[cfg(test)]
mod tests {
    use crate::climate::{PlaceCell, SNAPSHOT_LATITUDES, Season};
    use crate::map_climate::{MapGrid, Resampling, SurfaceKind, SurfaceMap};
    use crate::{Place, Planet, WorldSpec};

    /// Every node of the table is the direct query there; a place between nodes reads close to
    /// its own direct query.
    #[test]
    fn table_nodes_are_the_direct_queries() {
        let text = include_str!("../../worlds/verdance.world.ron");
        let planet = Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap();
        let surface = SurfaceMap::from_fn(72, 36, |lat, lon| {
            if (lon - 40.0).abs() < 50.0 && lat.abs() < 55.0 {
                SurfaceKind::Land
            } else {
                SurfaceKind::Sea
            }
        })
        .unwrap();
        let grid = MapGrid::new(48, 24).unwrap();
        let climate = planet
            .equilibrate_map_climate(&surface, &grid, Resampling::AreaFraction)
            .unwrap();
        let (yf, day_s) = (0.3, planet.day_s());
        let hour_angle_at = |lon: f64| 1.1 + lon;
        let table = climate
            .place_table(
                yf,
                hour_angle_at,
                day_s,
                [Season::Steady; SNAPSHOT_LATITUDES],
            )
            .unwrap();
        for (lat_deg, lon_deg) in [(0.0, 0.0), (30.0, 45.0), (-42.0, -120.0), (88.0, 170.0)] {
            let place = Place::from_degrees(lat_deg, lon_deg).unwrap();
            let want = climate
                .local_temperature_c(
                    place.latitude_rad,
                    place.longitude_rad,
                    yf,
                    hour_angle_at(place.longitude_rad),
                    day_s,
                )
                .unwrap();
            let (got, _) = table.at(&PlaceCell::new(place));
            // Nodes every 2° of latitude and 3.75° of longitude: between them the table is
            // bilinear, so a smooth field agrees to a fraction of a kelvin.
            assert!(
                (f64::from(got) - want).abs() < 0.6,
                "{lat_deg},{lon_deg}: {got} vs {want}"
            );
        }
        assert!(
            climate
                .place_table(
                    f64::NAN,
                    hour_angle_at,
                    day_s,
                    [Season::Steady; SNAPSHOT_LATITUDES]
                )
                .is_err()
        );
        assert!(
            climate
                .place_table(yf, hour_angle_at, 0.0, [Season::Steady; SNAPSHOT_LATITUDES])
                .is_err()
        );
    }
}
