//! The model grid: latitude rows of equal area (uniform in `x = sin φ`, the rows of the zonal
//! model's [`ClimateGrid`]) times longitude columns of equal width, so every cell has the same
//! area and a uniform map reduces row by row to the zonal model.

use std::f64::consts::{PI, TAU};

use super::error::SurfaceMapError;
use crate::climate::ClimateGrid;

/// Smallest and largest number of longitude columns.
const COLUMNS: (usize, usize) = (4, 4096);
/// Smallest and largest number of latitude rows.
const ROWS: (usize, usize) = (4, 2000);

/// Latitude × longitude cells of equal area. Cell `(row, col)` is stored at `row * columns +
/// col`; rows run south to north, columns west to east from 180° W.
#[derive(Debug, Clone, PartialEq)]
pub struct MapGrid {
    rows: ClimateGrid,
    columns: usize,
    lon_centres_rad: Vec<f64>,
}

impl MapGrid {
    /// A grid of `columns` longitudes (4–4096) by `rows` latitudes (4–2000).
    pub fn new(columns: usize, rows: usize) -> Result<Self, SurfaceMapError> {
        if columns == 0 || rows == 0 {
            return Err(SurfaceMapError::Empty {
                what: "model grid",
                width: columns,
                height: rows,
            });
        }
        if !(COLUMNS.0..=COLUMNS.1).contains(&columns) || !(ROWS.0..=ROWS.1).contains(&rows) {
            return Err(SurfaceMapError::BadSize {
                what: "model grid",
                width: columns,
                height: rows,
                allowed: "4 to 4096 columns by 4 to 2000 rows",
            });
        }
        let rows = ClimateGrid::new(rows).map_err(|_| SurfaceMapError::BadSize {
            what: "model grid",
            width: columns,
            height: rows,
            allowed: "4 to 4096 columns by 4 to 2000 rows",
        })?;
        let dl = TAU / columns as f64;
        let lon_centres_rad = (0..columns).map(|i| -PI + (i as f64 + 0.5) * dl).collect();
        Ok(MapGrid {
            rows,
            columns,
            lon_centres_rad,
        })
    }

    /// The latitude rows (equal-area bands, south to north).
    pub fn rows(&self) -> &ClimateGrid {
        &self.rows
    }

    /// Number of latitude rows.
    pub fn row_count(&self) -> usize {
        self.rows.len()
    }

    /// Number of longitude columns.
    pub fn columns(&self) -> usize {
        self.columns
    }

    /// Number of cells, `rows × columns`.
    pub fn len(&self) -> usize {
        self.rows.len() * self.columns
    }

    /// Always false: a grid has at least 16 cells.
    pub fn is_empty(&self) -> bool {
        self.len() == 0
    }

    /// Width of every column, radians.
    pub fn dlon_rad(&self) -> f64 {
        TAU / self.columns as f64
    }

    /// Longitudes of the column centres, radians, from just east of −π.
    pub fn lon_centres_rad(&self) -> &[f64] {
        &self.lon_centres_rad
    }

    /// Interpolation weights in longitude (periodic): `(c0, c1, w)` with the value at `lon_rad`
    /// `(1 − w)·v[c0] + w·v[c1]`. Any finite longitude; NaN maps to column 0.
    pub fn lon_interpolation(&self, lon_rad: f64) -> (usize, usize, f64) {
        let n = self.columns;
        let s = if lon_rad.is_finite() {
            ((lon_rad + PI) / self.dlon_rad() - 0.5).rem_euclid(n as f64)
        } else {
            0.0
        };
        let c0 = (s.floor() as usize).min(n - 1);
        (c0, (c0 + 1) % n, (s - c0 as f64).clamp(0.0, 1.0))
    }

    /// Index of the cell holding latitude `lat_rad`, longitude `lon_rad`.
    pub fn cell_of(&self, lat_rad: f64, lon_rad: f64) -> usize {
        let row = self.rows.band_of(lat_rad);
        let s = if lon_rad.is_finite() {
            ((lon_rad + PI) / self.dlon_rad()).rem_euclid(self.columns as f64)
        } else {
            0.0
        };
        row * self.columns + (s.floor() as usize).min(self.columns - 1)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn sizes_and_interpolation() {
        let g = MapGrid::new(8, 6).unwrap();
        assert_eq!(g.len(), 48);
        assert!(MapGrid::new(0, 6).is_err());
        assert!(MapGrid::new(3, 6).is_err());
        // Periodic: just west of the first centre blends the last column into the first.
        let (c0, c1, w) = g.lon_interpolation(g.lon_centres_rad()[0] - 0.25 * g.dlon_rad());
        assert_eq!((c0, c1), (7, 0));
        assert!((w - 0.75).abs() < 1e-12);
        let (c0, _, w) = g.lon_interpolation(g.lon_centres_rad()[3] + TAU);
        assert_eq!(c0, 3);
        assert!(w.abs() < 1e-9);
        assert_eq!(g.cell_of(-1.5, -PI + 1e-9), 0);
        assert_eq!(g.cell_of(1.5, PI - 1e-9), 47);
    }
}
