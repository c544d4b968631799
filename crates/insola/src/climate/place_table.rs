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

/// Index of a table cell's lower corner: row × [`COLUMNS`] + column. The last row and
/// column start no cell, so the four corners of any cell are in the table.
const LAST_CORNER: usize = (SNAPSHOT_LATITUDES - 2) * COLUMNS + INTERVALS - 1;

/// How many [`PlaceCell::season_key`]s there are: a table row and a hemisphere each.
pub const SEASON_KEYS: usize = 2 * SNAPSHOT_LATITUDES;

/// Where a place reads a [`PlaceTable`]: the cell's lower corner, the weights toward the
/// next row (north) and column (east), and which row's season and which hemisphere it takes,
/// all fixed for the place (12 bytes).
///
/// Why the corner is one flat index and the season one key: at a million places the read is
/// bound by instructions, and these save the row arithmetic and the hemisphere test per place.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PlaceCell {
    corner: u16,
    season_key: u8,
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
        let row_weight = (row - i0 as f64) as f32;
        let nearest_row = if row_weight < 0.5 { i0 } else { i0 + 1 };
        // The hemisphere as the single-precision sine of the latitude says it, the test the
        // observers' star frame makes ([`crate::PlaceF32`]).
        let south = (p.latitude_rad.sin() as f32) < 0.0;
        PlaceCell {
            corner: (i0 * COLUMNS + j0) as u16,
            season_key: (2 * nearest_row + usize::from(south)) as u8,
            row_weight,
            column_weight: (column - j0 as f64) as f32,
        }
    }

    /// The place's season key, below [`SEASON_KEYS`]: the table row nearest the place
    /// ([`season_key_row`]) and whether it is south of the equator ([`season_key_is_south`]).
    /// A per-instant array of seasons indexed by it gives a place both its hemisphere's
    /// astronomical season and its row's thermal season in one read; an array of 256 needs no
    /// bounds test.
    #[inline(always)]
    pub fn season_key(&self) -> u8 {
        self.season_key
    }
}

/// The table row of a [`PlaceCell::season_key`].
pub fn season_key_row(key: usize) -> usize {
    (key / 2).min(SNAPSHOT_LATITUDES - 1)
}

/// Whether a [`PlaceCell::season_key`] belongs to a place south of the equator.
pub fn season_key_is_south(key: usize) -> bool {
    key % 2 == 1
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
        (
            self.temperature_at(cell),
            self.row_season(season_key_row(usize::from(cell.season_key()))),
        )
    }

    /// Temperature at `cell`, °C: bilinear between the cell's four corners.
    #[inline(always)]
    pub fn temperature_at(&self, cell: &PlaceCell) -> f32 {
        let t = self.rows.as_flattened();
        let k = usize::from(cell.corner).min(LAST_CORNER);
        let w = cell.column_weight;
        let south = t[k] + w * (t[k + 1] - t[k]);
        let north = t[k + COLUMNS] + w * (t[k + COLUMNS + 1] - t[k + COLUMNS]);
        south + cell.row_weight * (north - south)
    }

    /// The season of table row `row` (clamped to the last row), from the south pole to the
    /// north pole every 2°.
    pub fn row_season(&self, row: usize) -> Season {
        self.seasons[row.min(SNAPSHOT_LATITUDES - 1)]
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

    #[test]
    fn a_cell_reads_the_rows_and_season_of_its_latitude_and_hemisphere() {
        // Rows are 2° apart from the south pole, columns 3.75° from −180° (the snapshot's
        // spacing): each place's corner, weights and nearest row follow from its coordinates.
        let snapshot = ClimateSnapshot::from_fn(smooth, |lat| {
            if lat < 0.0 {
                Season::Winter
            } else {
                Season::Summer
            }
        });
        let table = PlaceTable::turned(&snapshot, 0.0, 1.0).unwrap();
        let rows = table.rows.as_flattened();
        for (lat_deg, lon_deg) in [
            (-89.9, -180.0),
            (-0.3, 10.0),
            (0.0, 0.0),
            (0.9, 179.9),
            (90.0, 180.0),
        ] {
            let place = Place::normalised(lat_deg, lon_deg);
            let cell = PlaceCell::new(place);
            let row = ((lat_deg + 90.0) / 2.0).min(90.0);
            let column = ((lon_deg + 180.0) / 3.75).rem_euclid(96.0);
            let (i0, j0) = ((row as usize).min(89), (column as usize).min(95));
            let (rw, cw) = ((row - i0 as f64) as f32, (column - j0 as f64) as f32);
            let at = |i: usize, j: usize| rows[i * COLUMNS + j];
            let south = at(i0, j0) + cw * (at(i0, j0 + 1) - at(i0, j0));
            let north = at(i0 + 1, j0) + cw * (at(i0 + 1, j0 + 1) - at(i0 + 1, j0));
            let expected = south + rw * (north - south);
            let got = table.temperature_at(&cell);
            assert!(
                (got - expected).abs() < 1e-4,
                "{lat_deg} {lon_deg}: {got} vs {expected}"
            );
            let nearest = if rw < 0.5 { i0 } else { i0 + 1 };
            let key = usize::from(cell.season_key());
            assert!(key < SEASON_KEYS);
            assert_eq!(season_key_row(key), nearest, "{lat_deg}");
            assert_eq!(season_key_is_south(key), lat_deg < 0.0, "{lat_deg}");
            assert_eq!(table.at(&cell).1, table.row_season(nearest));
        }
    }
}
