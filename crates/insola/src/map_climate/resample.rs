//! From a surface map of any size to the model grid: each model cell's land fraction, ice-sheet
//! fraction and mean land elevation.
//!
//! [`Resampling::AreaFraction`] is exact for the equirectangular raster: the overlap of a pixel
//! (a latitude strip times a longitude interval) with a model cell (an interval of `sin φ` times
//! a longitude interval) has area `Δ(sin φ)·Δλ`, and both factors are intervals, so the weights
//! separate into rows and columns. [`Resampling::Nearest`] takes the pixel under each cell
//! centre (fractions 0 or 1): the coastline stays sharp, at the cost of small islands
//! vanishing or growing to a whole cell.

use std::f64::consts::PI;

use serde::{Deserialize, Serialize};

use super::grid::MapGrid;
use super::surface::{SurfaceKind, SurfaceMap};

/// How a surface map is carried to the model grid.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize, Deserialize)]
pub enum Resampling {
    /// The pixel under each cell centre.
    Nearest,
    /// Each cell's exact area fractions of land and ice sheet (the default).
    #[default]
    AreaFraction,
}

/// The surface as the model sees it, one value per model cell (index `row * columns + col`,
/// rows south to north).
#[derive(Debug, Clone, PartialEq)]
pub struct CellSurface {
    /// Fraction of the cell that is land, ice sheets included (0–1).
    pub land_fraction: Vec<f64>,
    /// Fraction of the cell under a permanent ice sheet (0–1, at most the land fraction).
    pub ice_sheet_fraction: Vec<f64>,
    /// Mean elevation of the cell, m, its sea counted at 0 (0 without elevation). The whole
    /// cell's mean, not its land's: the model applies it to the cell's one temperature, and a
    /// coastal cell half sea, half highland is not all highland.
    pub elevation_m: Vec<f64>,
}

impl CellSurface {
    /// Every cell the same: land fraction `land` (0–1), no ice sheet, no elevation.
    pub fn uniform(grid: &MapGrid, land: f64) -> Self {
        let n = grid.len();
        CellSurface {
            land_fraction: vec![land.clamp(0.0, 1.0); n],
            ice_sheet_fraction: vec![0.0; n],
            elevation_m: vec![0.0; n],
        }
    }

    /// Area-weighted fraction of the sphere that is land (all cells have equal area).
    pub fn land_area_fraction(&self) -> f64 {
        self.land_fraction.iter().sum::<f64>() / self.land_fraction.len().max(1) as f64
    }
}

/// Overlap length of intervals `[a0, a1]` and `[b0, b1]`.
fn overlap(a0: f64, a1: f64, b0: f64, b1: f64) -> f64 {
    (a1.min(b1) - a0.max(b0)).max(0.0)
}

/// Sparse overlap weights of target intervals with source intervals: for target `t`, the list
/// of `(source index, overlap)`. Both partitions cover the same range in increasing order.
fn interval_weights(target: &[f64], source: &[f64]) -> Vec<Vec<(usize, f64)>> {
    let mut out = Vec::with_capacity(target.len() - 1);
    let mut s0 = 0;
    for t in 0..target.len() - 1 {
        let (a0, a1) = (target[t], target[t + 1]);
        while s0 + 1 < source.len() - 1 && source[s0 + 1] <= a0 {
            s0 += 1;
        }
        let mut w = Vec::new();
        let mut s = s0;
        while s < source.len() - 1 && source[s] < a1 {
            let o = overlap(a0, a1, source[s], source[s + 1]);
            if o > 0.0 {
                w.push((s, o));
            }
            s += 1;
        }
        out.push(w);
    }
    out
}

impl SurfaceMap {
    /// This map carried to `grid` (see the module docs).
    pub fn resample(&self, grid: &MapGrid, how: Resampling) -> CellSurface {
        match how {
            Resampling::Nearest => self.resample_nearest(grid),
            Resampling::AreaFraction => self.resample_area(grid),
        }
    }

    fn resample_nearest(&self, grid: &MapGrid) -> CellSurface {
        let n = grid.len();
        let mut s = CellSurface::uniform(grid, 0.0);
        let lats = grid.rows().lat_centres_rad();
        for k in 0..n {
            let (lat, lon) = (
                lats[k / grid.columns()].to_degrees(),
                grid.lon_centres_rad()[k % grid.columns()].to_degrees(),
            );
            let kind = self.kind_at(lat, lon);
            s.land_fraction[k] = f64::from(u8::from(kind.is_land()));
            s.ice_sheet_fraction[k] = f64::from(u8::from(kind == SurfaceKind::IceSheet));
            s.elevation_m[k] = self.elevation_at_m(lat, lon);
        }
        s
    }

    fn resample_area(&self, grid: &MapGrid) -> CellSurface {
        let (w, h) = (self.width(), self.height());
        // Source edges in sin φ, south to north (raster rows run north to south).
        let src_x: Vec<f64> = (0..=h)
            .map(|k| (-90.0 + k as f64 * 180.0 / h as f64).to_radians().sin())
            .collect();
        let src_lon: Vec<f64> = (0..=w)
            .map(|c| -PI + c as f64 * 2.0 * PI / w as f64)
            .collect();
        let cols = grid.columns();
        let model_lon: Vec<f64> = (0..=cols)
            .map(|i| -PI + i as f64 * grid.dlon_rad())
            .collect();
        let wy = interval_weights(grid.rows().x_edges(), &src_x);
        let wx = interval_weights(&model_lon, &src_lon);
        // Per source row (south-to-north index), the column-collapsed sums per model column:
        // land, ice sheet, land × elevation.
        let sums_of_row = |sr: usize| {
            let r = h - 1 - sr;
            let kinds = &self.kinds()[r * w..(r + 1) * w];
            let elev = self.elevation_m().map(|z| &z[r * w..(r + 1) * w]);
            let mut out = vec![[0.0f64; 3]; cols];
            for (i, weights) in wx.iter().enumerate() {
                for &(c, o) in weights {
                    if kinds[c].is_land() {
                        out[i][0] += o;
                        if kinds[c] == SurfaceKind::IceSheet {
                            out[i][1] += o;
                        }
                        if let Some(z) = elev {
                            out[i][2] += o * z[c];
                        }
                    }
                }
            }
            out
        };
        let area = grid.rows().dx() * grid.dlon_rad();
        let mut s = CellSurface::uniform(grid, 0.0);
        let mut cache: Vec<Option<Vec<[f64; 3]>>> = vec![None; h];
        for (j, weights) in wy.iter().enumerate() {
            let mut acc = vec![[0.0f64; 3]; cols];
            for &(sr, o) in weights {
                let row = cache[sr].get_or_insert_with(|| sums_of_row(sr));
                for (a, v) in acc.iter_mut().zip(row.iter()) {
                    for q in 0..3 {
                        a[q] += o * v[q];
                    }
                }
            }
            for (i, a) in acc.iter().enumerate() {
                let k = j * cols + i;
                s.land_fraction[k] = (a[0] / area).clamp(0.0, 1.0);
                s.ice_sheet_fraction[k] = (a[1] / area).clamp(0.0, s.land_fraction[k]);
                s.elevation_m[k] = a[2] / area;
            }
        }
        s
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn area_fractions_are_exact_and_conserve_land() {
        // Land north of the equator in the western hemisphere: a quarter of the sphere.
        let m = SurfaceMap::from_fn(360, 180, |lat, lon| {
            if lat > 0.0 && lon < 0.0 {
                SurfaceKind::Land
            } else {
                SurfaceKind::Sea
            }
        })
        .unwrap();
        for (cols, rows) in [(128, 64), (36, 18), (100, 50)] {
            let g = MapGrid::new(cols, rows).unwrap();
            let s = m.resample(&g, Resampling::AreaFraction);
            // Exact overlaps: the land area is conserved to rounding.
            assert!(
                (s.land_area_fraction() - 0.25).abs() < 1e-12,
                "{cols}×{rows}: {}",
                s.land_area_fraction()
            );
            let near = m.resample(&g, Resampling::Nearest);
            assert!((near.land_area_fraction() - 0.25).abs() < 0.02);
        }
        // A coarse raster onto a fine grid: fractions 0 or 1 away from the edges.
        let coarse = SurfaceMap::from_land_mask(2, 1, &[true, false]).unwrap();
        let g = MapGrid::new(8, 4).unwrap();
        let s = coarse.resample(&g, Resampling::AreaFraction);
        assert_eq!(
            &s.land_fraction[0..8],
            &[1.0, 1.0, 1.0, 1.0, 0.0, 0.0, 0.0, 0.0]
        );
    }

    #[test]
    fn elevation_is_the_cell_mean_with_sea_at_zero() {
        let m = SurfaceMap::from_land_mask(4, 1, &[true, true, false, false])
            .unwrap()
            .with_elevation(vec![1000.0, 3000.0, 0.0, 0.0])
            .unwrap();
        let g = MapGrid::new(4, 4).unwrap();
        let s = m.resample(&g, Resampling::AreaFraction);
        assert!((s.elevation_m[0] - 1000.0).abs() < 1e-9);
        assert!((s.elevation_m[1] - 3000.0).abs() < 1e-9);
        let g2 = MapGrid::new(4, 4).unwrap();
        let half = SurfaceMap::from_land_mask(2, 1, &[true, false])
            .unwrap()
            .with_elevation(vec![2000.0, 0.0])
            .unwrap()
            .resample(&g2, Resampling::AreaFraction);
        assert!((half.elevation_m[0] - 2000.0).abs() < 1e-9);
        // One model cell over a land pixel at 2000 m and a sea pixel: 1000 m.
        let g3 = MapGrid::new(4, 4).unwrap();
        let mixed =
            SurfaceMap::from_land_mask(8, 1, &[true, false, true, false, true, false, true, false])
                .unwrap()
                .with_elevation(vec![2000.0; 8])
                .unwrap()
                .resample(&g3, Resampling::AreaFraction);
        assert!((mixed.elevation_m[5] - 1000.0).abs() < 1e-9);
    }
}
