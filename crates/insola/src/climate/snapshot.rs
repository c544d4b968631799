//! The climate of one time of year on a small latitude × hour-angle table, for many places.
//!
//! A [`ClimateSnapshot`] holds the local temperature (zonal mean plus the day-night swing) on
//! rows from the south pole to the north pole every 2° and columns over the star's local hour
//! angle from −180° to 180° every 3.75° (fine enough for the kink of the sunrise minimum), and
//! the [`Season`] of each row. It is 35 KB, so it stays in the second-level cache while a
//! million places read it; lookups are bilinear in single precision. Turned to one instant it
//! becomes a [`crate::climate::PlaceTable`].

use std::f64::consts::{FRAC_PI_2, PI, TAU};

use super::{ClimateCycle, Season};

/// Latitude rows of a [`ClimateSnapshot`] (every 2°, pole to pole).
pub const SNAPSHOT_LATITUDES: usize = 91;
/// Hour-angle columns of a [`ClimateSnapshot`] (every 3.75°, −180° to 180°, the last column
/// repeating the first).
pub const SNAPSHOT_HOUR_ANGLES: usize = 97;

/// Temperatures, °C, by row (latitude) and column (hour angle).
pub(crate) type SnapshotRows = [[f32; SNAPSHOT_HOUR_ANGLES]; SNAPSHOT_LATITUDES];

/// Temperatures of one time of year on a latitude × hour-angle grid (see the module docs).
#[derive(Debug, Clone, PartialEq, Default)]
pub struct ClimateSnapshot {
    /// The table, `None` when empty. Fixed sizes let lookups go without bounds checks.
    data: Option<Box<SnapshotData>>,
}

#[derive(Debug, Clone, PartialEq)]
struct SnapshotData {
    rows: SnapshotRows,
    seasons: [Season; SNAPSHOT_LATITUDES],
}

impl ClimateCycle {
    /// The snapshot of this cycle at `year_fraction` on a world whose mean solar day lasts
    /// `solar_day_s` seconds; empty (temperatures `NaN`, no seasons) when the arguments are
    /// unusable.
    pub fn snapshot(&self, year_fraction: f64, solar_day_s: f64) -> ClimateSnapshot {
        let Ok(instant) = self.instant(year_fraction, solar_day_s) else {
            return ClimateSnapshot::default();
        };
        ClimateSnapshot::from_fn(
            |lat, h| instant.temperature_c(lat, h, 0.0).unwrap_or(f64::NAN),
            |lat| self.season(lat, year_fraction),
        )
    }
}

impl ClimateSnapshot {
    /// Latitude of table row `i`, radians.
    pub fn row_latitude_rad(i: usize) -> f64 {
        -FRAC_PI_2 + PI * i as f64 / (SNAPSHOT_LATITUDES - 1) as f64
    }

    /// Hour angle of table column `j`, radians.
    pub fn column_hour_angle_rad(j: usize) -> f64 {
        -PI + TAU * j as f64 / (SNAPSHOT_HOUR_ANGLES - 1) as f64
    }

    /// A table of `temperature_c(latitude_rad, hour_angle_rad)` (°C) and `season(latitude_rad)`
    /// at the grid's nodes.
    pub fn from_fn(
        temperature_c: impl Fn(f64, f64) -> f64,
        season: impl Fn(f64) -> Season,
    ) -> ClimateSnapshot {
        let mut data = Box::new(SnapshotData {
            rows: [[f32::NAN; SNAPSHOT_HOUR_ANGLES]; SNAPSHOT_LATITUDES],
            seasons: [Season::Steady; SNAPSHOT_LATITUDES],
        });
        for (i, (row, s)) in data.rows.iter_mut().zip(&mut data.seasons).enumerate() {
            let lat = Self::row_latitude_rad(i);
            for (j, cell) in row.iter_mut().enumerate() {
                *cell = temperature_c(lat, Self::column_hour_angle_rad(j)) as f32;
            }
            *s = season(lat);
        }
        ClimateSnapshot { data: Some(data) }
    }

    /// `true` for the empty snapshot.
    pub fn is_empty(&self) -> bool {
        self.data.is_none()
    }

    /// The temperature rows, °C (latitude × hour angle), unless empty.
    pub(crate) fn rows(&self) -> Option<&SnapshotRows> {
        self.data.as_ref().map(|d| &d.rows)
    }

    /// The season of each row, unless empty.
    pub fn seasons(&self) -> Option<&[Season; SNAPSHOT_LATITUDES]> {
        self.data.as_ref().map(|d| &d.seasons)
    }

    /// The fractional table row of latitude `lat_rad`, `[0, SNAPSHOT_LATITUDES − 1]`.
    pub(crate) fn row(lat_rad: f64) -> f64 {
        ((lat_rad + FRAC_PI_2) / PI * (SNAPSHOT_LATITUDES - 1) as f64)
            .clamp(0.0, (SNAPSHOT_LATITUDES - 1) as f64)
    }

    /// The season by the temperature cycle at latitude `lat_rad` (nearest row; `None` when
    /// empty or for a non-finite latitude).
    pub fn season(&self, lat_rad: f64) -> Option<Season> {
        if !lat_rad.is_finite() {
            return None;
        }
        let i = (Self::row(lat_rad).round() as usize).min(SNAPSHOT_LATITUDES - 1);
        self.seasons().map(|s| s[i])
    }

    /// Temperature, °C, at latitude `lat_rad` and the star's local hour angle `hour_angle_rad`
    /// (0 at transit, in the sense the sky turns): bilinear in the table; `NaN` when empty or
    /// for a non-finite input.
    pub fn temperature_c(&self, lat_rad: f64, hour_angle_rad: f64) -> f32 {
        let Some(rows) = self.rows() else {
            return f32::NAN;
        };
        if !(lat_rad.is_finite() && hour_angle_rad.is_finite()) {
            return f32::NAN;
        }
        let row = Self::row(lat_rad);
        let column =
            (hour_angle_rad / TAU + 0.5).rem_euclid(1.0) * (SNAPSHOT_HOUR_ANGLES - 1) as f64;
        let i0 = (row as usize).min(SNAPSHOT_LATITUDES - 2);
        let j0 = (column as usize).min(SNAPSHOT_HOUR_ANGLES - 2);
        let (fu, fv) = ((row - i0 as f64) as f32, (column - j0 as f64) as f32);
        let (near, far) = (&rows[i0], &rows[i0 + 1]);
        let a = near[j0] + fv * (near[j0 + 1] - near[j0]);
        let b = far[j0] + fv * (far[j0 + 1] - far[j0]);
        a + fu * (b - a)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn lookups_interpolate_between_nodes_and_empty_answers_nan() {
        let smooth = |lat: f64, h: f64| 10.0 * lat.cos() + 3.0 * (h - 0.4).cos();
        let s = ClimateSnapshot::from_fn(smooth, |lat| {
            if lat > 0.0 {
                Season::Summer
            } else {
                Season::Winter
            }
        });
        for (lat, h) in [(0.1, 0.3), (-1.2, -3.0), (1.5, 3.1)] {
            assert!((f64::from(s.temperature_c(lat, h)) - smooth(lat, h)).abs() < 0.05);
        }
        assert_eq!(s.season(0.5), Some(Season::Summer));
        assert_eq!(s.season(-0.5), Some(Season::Winter));
        let empty = ClimateSnapshot::default();
        assert!(empty.temperature_c(0.0, 0.0).is_nan() && empty.season(0.0).is_none());
        assert!(s.temperature_c(f64::NAN, 0.0).is_nan());
    }
}
