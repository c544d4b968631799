//! Latitude bands uniform in `x = sin(latitude)`, so every band has the same area.

use crate::error::{SpecError, check_range};

/// Latitude bands of equal area: edges uniform in `x = sin φ` from −1 (south pole) to +1.
#[derive(Debug, Clone, PartialEq)]
pub struct ClimateGrid {
    /// Band edges in `x = sin φ`, `bands + 1` values from −1 to 1.
    x_edges: Vec<f64>,
    /// Band centres in `x`, midway between edges.
    x_centres: Vec<f64>,
    /// Latitude of each band centre, radians.
    lat_centres_rad: Vec<f64>,
}

impl ClimateGrid {
    /// A grid of `bands` equal-area bands (at least 2, at most 2000).
    pub fn new(bands: usize) -> Result<Self, SpecError> {
        check_range("climate.bands", bands as f64, 2.0, 2000.0)?;
        let dx = 2.0 / bands as f64;
        let x_edges: Vec<f64> = (0..=bands)
            .map(|j| (-1.0 + j as f64 * dx).clamp(-1.0, 1.0))
            .collect();
        let x_centres: Vec<f64> = (0..bands).map(|j| -1.0 + (j as f64 + 0.5) * dx).collect();
        let lat_centres_rad = x_centres.iter().map(|x| x.asin()).collect();
        Ok(ClimateGrid {
            x_edges,
            x_centres,
            lat_centres_rad,
        })
    }

    /// Number of bands.
    pub fn len(&self) -> usize {
        self.x_centres.len()
    }

    /// Always false: a grid has at least two bands.
    pub fn is_empty(&self) -> bool {
        self.x_centres.is_empty()
    }

    /// Width of every band in `x` (dimensionless), `2 / bands`.
    pub fn dx(&self) -> f64 {
        2.0 / self.len() as f64
    }

    /// Band edges in `x = sin φ`, south to north (`bands + 1` values).
    pub fn x_edges(&self) -> &[f64] {
        &self.x_edges
    }

    /// Band centres in `x = sin φ`, south to north.
    pub fn x_centres(&self) -> &[f64] {
        &self.x_centres
    }

    /// Latitudes of the band centres, radians, south to north.
    pub fn lat_centres_rad(&self) -> &[f64] {
        &self.lat_centres_rad
    }

    /// Area weight of each band as a fraction of the globe (all equal, summing to 1).
    pub fn area_weight(&self) -> f64 {
        1.0 / self.len() as f64
    }

    /// Area-weighted global mean of one value per band.
    pub fn global_mean(&self, per_band: &[f64]) -> f64 {
        per_band.iter().sum::<f64>() / per_band.len().max(1) as f64
    }

    /// Index of the band containing latitude `lat_rad` (clamped to the poles).
    pub fn band_of(&self, lat_rad: f64) -> usize {
        let x = lat_rad.sin();
        let j = ((x + 1.0) / self.dx()).floor();
        if j.is_nan() {
            0
        } else {
            (j.max(0.0) as usize).min(self.len() - 1)
        }
    }

    /// Linear interpolation in `x` between band centres: `(i0, i1, w)` such that the value at
    /// `lat_rad` is `(1 − w)·v[i0] + w·v[i1]`. Beyond the outermost centres (the half bands at the
    /// poles) the line through the two outermost centres is extended, so `w` may leave [0, 1] by
    /// at most one half.
    pub fn interpolation(&self, lat_rad: f64) -> (usize, usize, f64) {
        self.interpolation_x(lat_rad.sin())
    }

    /// [`Self::interpolation`] for a place given by `x = sin φ` (clamped to [−1, 1]).
    pub fn interpolation_x(&self, x: f64) -> (usize, usize, f64) {
        let n = self.len();
        let s = (x + 1.0) / self.dx() - 0.5; // fractional centre index
        let s = if s.is_nan() {
            0.0
        } else {
            s.clamp(-0.5, n as f64 - 0.5)
        };
        let i0 = (s.floor().max(0.0) as usize).min(n - 2);
        (i0, i0 + 1, s - i0 as f64)
    }

    /// Value at `lat_rad` interpolated from one value per band (see [`Self::interpolation`]).
    pub fn interpolate(&self, per_band: &[f64], lat_rad: f64) -> f64 {
        let (i0, i1, w) = self.interpolation(lat_rad);
        (1.0 - w) * per_band[i0] + w * per_band[i1]
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn edges_centres_and_weights() {
        let g = ClimateGrid::new(90).unwrap();
        assert_eq!(g.len(), 90);
        assert_eq!(g.x_edges()[0], -1.0);
        assert_eq!(g.x_edges()[90], 1.0);
        assert!(g.x_edges()[45].abs() < 1e-15);
        assert!((g.area_weight() * 90.0 - 1.0).abs() < 1e-15);
        // Symmetric about the equator.
        for j in 0..45 {
            assert!((g.x_centres()[j] + g.x_centres()[89 - j]).abs() < 1e-14);
        }
    }

    #[test]
    fn interpolation_is_exact_for_linear_functions_including_the_poles() {
        let g = ClimateGrid::new(36).unwrap();
        let v: Vec<f64> = g.x_centres().iter().map(|x| 3.0 * x - 1.0).collect();
        for lat_deg in [-90.0, -89.0, -45.0, 0.0, 12.0, 60.0, 88.0, 90.0] {
            let lat = f64::to_radians(lat_deg);
            let got = g.interpolate(&v, lat);
            assert!(
                (got - (3.0 * lat.sin() - 1.0)).abs() < 1e-12,
                "{lat_deg}: {got}"
            );
        }
    }

    #[test]
    fn band_of_clamps() {
        let g = ClimateGrid::new(10).unwrap();
        assert_eq!(g.band_of(-std::f64::consts::FRAC_PI_2), 0);
        assert_eq!(g.band_of(std::f64::consts::FRAC_PI_2), 9);
        assert_eq!(g.band_of(f64::NAN), 0);
        assert!(ClimateGrid::new(1).is_err());
    }
}
