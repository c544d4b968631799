//! The temperature table many places read at one instant: a [`ClimateSnapshot`]'s
//! latitude × hour-angle table turned, once per instant, into a latitude × longitude table for
//! the star's current hour angle.
//!
//! Why: a place's hour angle is the hour angle at longitude 0 plus its longitude, so turning
//! the table costs one pass over its 8,827 cells per instant, and afterwards every place reads
//! the same four cells it read at the last instant, at an index and with weights fixed when the
//! place was made ([`PlaceCell`]). The per-place work is then four loads and three
//! interpolations with no dependent index arithmetic, which keeps a million places cheap.
//! Turning is a linear interpolation along the hour angle between columns of the same spacing,
//! so a place's value is still an average of nearby snapshot cells.

use std::f64::consts::{FRAC_PI_2, PI, TAU};

use super::Season;
use super::snapshot::{ClimateSnapshot, SNAPSHOT_HOUR_ANGLES, SNAPSHOT_LATITUDES};
use crate::place::Place;

/// Longitude columns: the same count and spacing as the snapshot's hour-angle columns
/// (−180° to 180°, the last column repeating the first).
const COLUMNS: usize = SNAPSHOT_HOUR_ANGLES;
/// Intervals around the full turn.
const INTERVALS: usize = COLUMNS - 1;

/// Where a place reads a [`PlaceTable`]: the cell's lower corner and the weights toward the
/// next row (north) and column (east), fixed for the place (12 bytes).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PlaceCell {
    row: u16,
    column: u16,
    row_weight: f32,
    column_weight: f32,
}

impl Default for PlaceCell {
    /// The cell of latitude 0, longitude 0.
    fn default() -> Self {
        PlaceCell::new(Place::normalised(0.0, 0.0))
    }
}

impl PlaceCell {
    /// The cell of `place`, normalised first ([`Place::normalise`]).
    pub fn new(place: Place) -> PlaceCell {
        let p = place.normalise();
        let row = ((p.latitude_rad + FRAC_PI_2) / PI * (SNAPSHOT_LATITUDES - 1) as f64)
            .clamp(0.0, (SNAPSHOT_LATITUDES - 1) as f64);
        let column = ((p.longitude_rad + PI) / TAU).rem_euclid(1.0) * INTERVALS as f64;
        let (i0, j0) = (
            (row as usize).min(SNAPSHOT_LATITUDES - 2),
            (column as usize).min(INTERVALS - 1),
        );
        PlaceCell {
            row: i0 as u16,
            column: j0 as u16,
            row_weight: (row - i0 as f64) as f32,
            column_weight: (column - j0 as f64) as f32,
        }
    }
}

/// Temperatures by latitude and longitude at one instant, and the season of each row.
#[derive(Debug, Clone, PartialEq)]
pub struct PlaceTable {
    rows: Box<[[f32; COLUMNS]; SNAPSHOT_LATITUDES]>,
    seasons: [Season; SNAPSHOT_LATITUDES],
}

impl PlaceTable {
    /// `snapshot` turned to the instant when the star's geometric hour angle at longitude 0 is
    /// `hour_angle_0_rad` ([`crate::StarFrame::hour_angle_0_rad`]) on a world spinning in
    /// `spin_sign` (+1 forward, −1 backward; [`crate::StarFrame::spin_sign`]). `None` for an
    /// empty snapshot.
    pub fn turned(
        snapshot: &ClimateSnapshot,
        hour_angle_0_rad: f64,
        spin_sign: f64,
    ) -> Option<PlaceTable> {
        let source = snapshot.rows()?;
        let sense = if spin_sign < 0.0 { -1.0 } else { 1.0 };
        // The snapshot's hour-angle coordinate at longitude 0, in turns past −180°.
        let turns_0 = (0.5 + sense * hour_angle_0_rad / TAU).rem_euclid(1.0);
        // Longitude column j is at hour-angle position (base + sense · j) in snapshot columns.
        let base = INTERVALS as f64 * (turns_0 - 0.5 * sense);
        let mut from = [(0usize, 0f32); COLUMNS];
        for (j, f) in from.iter_mut().enumerate() {
            let c = (base + sense * j as f64).rem_euclid(INTERVALS as f64);
            let k = (c as usize).min(INTERVALS - 1);
            *f = (k, (c - k as f64) as f32);
        }
        let mut rows = Box::new([[0f32; COLUMNS]; SNAPSHOT_LATITUDES]);
        for (out, row) in rows.iter_mut().zip(source) {
            for (cell, &(k, w)) in out.iter_mut().zip(&from) {
                *cell = row[k] + w * (row[k + 1] - row[k]);
            }
        }
        Some(PlaceTable {
            rows,
            seasons: *snapshot.seasons()?,
        })
    }

    /// A table from a function of latitude and east longitude, radians, °C, with the season
    /// of each row (rows from the south pole to the north pole every 2°, the snapshot's rows;
    /// columns from −180° to 180° of longitude at the snapshot's hour-angle spacing). For
    /// climates whose temperature is not a function of latitude and hour angle alone, such as
    /// the map model's ([`crate::map_climate::MapClimate::place_table`]).
    pub fn from_fn(
        temperature_c: impl Fn(f64, f64) -> f32,
        seasons: [Season; SNAPSHOT_LATITUDES],
    ) -> PlaceTable {
        let mut rows = Box::new([[0f32; COLUMNS]; SNAPSHOT_LATITUDES]);
        for (i, row) in rows.iter_mut().enumerate() {
            let lat = ClimateSnapshot::row_latitude_rad(i);
            for (j, cell) in row.iter_mut().enumerate() {
                *cell = temperature_c(lat, Self::column_longitude_rad(j));
            }
        }
        PlaceTable { rows, seasons }
    }

    /// East longitude of table column `j`, radians (−π for the first, π for the last).
    pub fn column_longitude_rad(j: usize) -> f64 {
        -PI + TAU * j as f64 / INTERVALS as f64
    }

    /// Temperature, °C, and season at `cell`.
    #[inline(always)]
    pub fn at(&self, cell: &PlaceCell) -> (f32, Season) {
        let (i0, j0) = (
            usize::from(cell.row).min(SNAPSHOT_LATITUDES - 2),
            usize::from(cell.column).min(COLUMNS - 2),
        );
        let (near, far) = (&self.rows[i0], &self.rows[i0 + 1]);
        let w = cell.column_weight;
        let a = near[j0] + w * (near[j0 + 1] - near[j0]);
        let b = far[j0] + w * (far[j0 + 1] - far[j0]);
        let nearest_row = if cell.row_weight < 0.5 { i0 } else { i0 + 1 };
        (a + cell.row_weight * (b - a), self.seasons[nearest_row])
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// A smooth function of latitude and hour angle.
    fn smooth(lat: f64, h: f64) -> f64 {
        10.0 * lat.cos() + 3.0 * (h - 0.4).cos()
    }

    #[test]
    fn turning_matches_the_hour_angle_lookup_for_both_spin_senses() {
        let snapshot = ClimateSnapshot::from_fn(smooth, |_| Season::Steady);
        for sense in [1.0, -1.0] {
            for h0 in [0.0, 0.3, 2.0, -2.9, 6.1] {
                let table = PlaceTable::turned(&snapshot, h0, sense).unwrap();
                for (lat, lon) in [(0.1, 0.0), (0.7, 2.0), (-1.2, -3.0), (FRAC_PI_2, PI)] {
                    let place = Place {
                        latitude_rad: lat,
                        longitude_rad: lon,
                    };
                    let (t, _) = table.at(&PlaceCell::new(place));
                    let exact = smooth(lat, sense * (h0 + lon));
                    assert!(
                        (f64::from(t) - exact).abs() < 0.05,
                        "{sense} {h0} {lat} {lon}: {t} vs {exact}"
                    );
                }
            }
        }
        assert!(PlaceTable::turned(&ClimateSnapshot::default(), 0.0, 1.0).is_none());
    }
}
