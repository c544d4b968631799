//! A surface map: what covers the ground, cell by cell, on an equirectangular raster.
//!
//! Raster layout, as in an equirectangular image: row 0 is the northernmost strip (its top edge
//! at 90° N), row `height − 1` the southernmost (bottom edge at 90° S); column 0 starts at
//! 180° W, columns run east. Every pixel spans `360°/width` of longitude and `180°/height` of
//! latitude, of any size (the model resamples it, see [`SurfaceMap::resample`]).

use serde::{Deserialize, Serialize};

use super::error::SurfaceMapError;

/// Largest raster side accepted, pixels (a 16k × 8k world image is 128 M cells).
pub const MAX_RASTER_SIDE: usize = 16_384;

/// Highest and lowest elevation accepted, m (above the reference level; sea cells are at 0).
const ELEVATION_RANGE_M: (f64, f64) = (-12_000.0, 12_000.0);

/// What covers a cell of the surface.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize, Default)]
pub enum SurfaceKind {
    /// Open water: the ocean mixed layer stores the seasons' heat.
    #[default]
    Sea,
    /// Bare or vegetated land: a thin layer, little heat storage.
    Land,
    /// Land under a permanent ice sheet: land's heat capacity, the ice albedo whatever the
    /// temperature.
    IceSheet,
}

impl SurfaceKind {
    /// Whether the kind is land (an ice sheet is land).
    pub fn is_land(self) -> bool {
        !matches!(self, SurfaceKind::Sea)
    }
}

/// An equirectangular raster of surface kinds with an optional elevation (see the module docs
/// for the layout).
#[derive(Debug, Clone, PartialEq)]
pub struct SurfaceMap {
    width: usize,
    height: usize,
    kinds: Vec<SurfaceKind>,
    elevation_m: Option<Vec<f64>>,
}

fn check_size(width: usize, height: usize) -> Result<(), SurfaceMapError> {
    if width == 0 || height == 0 {
        return Err(SurfaceMapError::Empty {
            what: "surface map",
            width,
            height,
        });
    }
    if width > MAX_RASTER_SIDE || height > MAX_RASTER_SIDE {
        return Err(SurfaceMapError::BadSize {
            what: "surface map",
            width,
            height,
            allowed: "at most 16384 pixels a side",
        });
    }
    Ok(())
}

fn check_len(
    what: &'static str,
    got: usize,
    width: usize,
    height: usize,
) -> Result<(), SurfaceMapError> {
    if got != width * height {
        return Err(SurfaceMapError::WrongLength {
            what,
            got,
            expected: width * height,
            width,
            height,
        });
    }
    Ok(())
}

impl SurfaceMap {
    /// A raster from row-major kinds (`width × height`, row 0 northernmost).
    pub fn from_kinds(
        width: usize,
        height: usize,
        kinds: Vec<SurfaceKind>,
    ) -> Result<Self, SurfaceMapError> {
        check_size(width, height)?;
        check_len("kinds", kinds.len(), width, height)?;
        Ok(SurfaceMap {
            width,
            height,
            kinds,
            elevation_m: None,
        })
    }

    /// A land/sea raster from row-major flags (`true` is land).
    pub fn from_land_mask(
        width: usize,
        height: usize,
        land: &[bool],
    ) -> Result<Self, SurfaceMapError> {
        check_len("land", land.len(), width, height)?;
        let kinds = land
            .iter()
            .map(|&l| {
                if l {
                    SurfaceKind::Land
                } else {
                    SurfaceKind::Sea
                }
            })
            .collect();
        Self::from_kinds(width, height, kinds)
    }

    /// A raster from a function of the pixel centre's latitude and longitude, degrees.
    pub fn from_fn(
        width: usize,
        height: usize,
        kind_at: impl Fn(f64, f64) -> SurfaceKind,
    ) -> Result<Self, SurfaceMapError> {
        check_size(width, height)?;
        let mut kinds = Vec::with_capacity(width * height);
        for r in 0..height {
            let lat = 90.0 - (r as f64 + 0.5) * 180.0 / height as f64;
            for c in 0..width {
                let lon = -180.0 + (c as f64 + 0.5) * 360.0 / width as f64;
                kinds.push(kind_at(lat, lon));
            }
        }
        Self::from_kinds(width, height, kinds)
    }

    /// A map of one kind everywhere (1 × 1 raster).
    pub fn uniform(kind: SurfaceKind) -> Self {
        SurfaceMap {
            width: 1,
            height: 1,
            kinds: vec![kind],
            elevation_m: None,
        }
    }

    /// Adds an elevation raster, m above the reference level, row-major like the kinds (any
    /// finite value within ±12 km). Sea pixels are taken at 0 m whatever the value: the sea
    /// surface is the reference level.
    pub fn with_elevation(mut self, elevation_m: Vec<f64>) -> Result<Self, SurfaceMapError> {
        check_len("elevation_m", elevation_m.len(), self.width, self.height)?;
        for (k, &z) in elevation_m.iter().enumerate() {
            if !(z.is_finite() && (ELEVATION_RANGE_M.0..=ELEVATION_RANGE_M.1).contains(&z)) {
                return Err(SurfaceMapError::BadValue {
                    what: "elevation_m",
                    row: k / self.width,
                    column: k % self.width,
                    value: z,
                    allowed: "a finite number from -12000 to 12000",
                });
            }
        }
        self.elevation_m = Some(elevation_m);
        Ok(self)
    }

    /// Columns of the raster.
    pub fn width(&self) -> usize {
        self.width
    }

    /// Rows of the raster.
    pub fn height(&self) -> usize {
        self.height
    }

    /// Kinds, row-major (row 0 northernmost).
    pub fn kinds(&self) -> &[SurfaceKind] {
        &self.kinds
    }

    /// Elevations, m, row-major, when given.
    pub fn elevation_m(&self) -> Option<&[f64]> {
        self.elevation_m.as_deref()
    }

    /// Kind of the pixel containing latitude `lat_deg`, longitude `lon_deg` (any longitude;
    /// latitude clamped to ±90°).
    pub fn kind_at(&self, lat_deg: f64, lon_deg: f64) -> SurfaceKind {
        self.kinds[self.pixel_of(lat_deg, lon_deg)]
    }

    /// Elevation of the pixel containing the place, m (0 at sea or without elevation).
    pub fn elevation_at_m(&self, lat_deg: f64, lon_deg: f64) -> f64 {
        let p = self.pixel_of(lat_deg, lon_deg);
        match (&self.elevation_m, self.kinds[p]) {
            (Some(z), k) if k.is_land() => z[p],
            _ => 0.0,
        }
    }

    fn pixel_of(&self, lat_deg: f64, lon_deg: f64) -> usize {
        let lat = if lat_deg.is_nan() { 0.0 } else { lat_deg };
        let lon = if lon_deg.is_finite() { lon_deg } else { 0.0 };
        let r = (((90.0 - lat) / 180.0 * self.height as f64).floor().max(0.0) as usize)
            .min(self.height - 1);
        let c = ((((lon + 180.0).rem_euclid(360.0)) / 360.0 * self.width as f64).floor() as usize)
            .min(self.width - 1);
        r * self.width + c
    }

    /// Fraction of the sphere's area that is land (ice sheets included), area-weighted by the
    /// pixels' latitude strips.
    pub fn land_area_fraction(&self) -> f64 {
        let mut land = 0.0;
        for r in 0..self.height {
            let (north, south) = self.row_edges_rad(r);
            let w = (north.sin() - south.sin()) / 2.0;
            let row = &self.kinds[r * self.width..(r + 1) * self.width];
            land += w * row.iter().filter(|k| k.is_land()).count() as f64 / self.width as f64;
        }
        land
    }

    /// Northern and southern edge of raster row `r`, radians.
    pub(crate) fn row_edges_rad(&self, r: usize) -> (f64, f64) {
        let h = self.height as f64;
        let north = (90.0 - r as f64 * 180.0 / h).to_radians();
        let south = (90.0 - (r + 1) as f64 * 180.0 / h).to_radians();
        (north, south)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn layout_and_lookups() {
        // 4 × 2: the north half land in the west, the south all sea.
        let m = SurfaceMap::from_land_mask(
            4,
            2,
            &[true, true, false, false, false, false, false, false],
        )
        .unwrap();
        assert_eq!(m.kind_at(45.0, -135.0), SurfaceKind::Land);
        assert_eq!(m.kind_at(45.0, 45.0), SurfaceKind::Sea);
        assert_eq!(m.kind_at(-45.0, -135.0), SurfaceKind::Sea);
        // Longitude wraps; latitude clamps.
        assert_eq!(m.kind_at(45.0, 225.0), SurfaceKind::Land);
        assert_eq!(m.kind_at(95.0, -100.0), SurfaceKind::Land);
        // Half of the northern hemisphere: a quarter of the sphere (exact).
        assert!((m.land_area_fraction() - 0.25).abs() < 1e-12);
    }

    #[test]
    fn bad_input_is_a_typed_error() {
        assert!(matches!(
            SurfaceMap::from_kinds(0, 3, vec![]),
            Err(SurfaceMapError::Empty { .. })
        ));
        assert!(matches!(
            SurfaceMap::from_land_mask(3, 2, &[true; 5]),
            Err(SurfaceMapError::WrongLength {
                got: 5,
                expected: 6,
                ..
            })
        ));
        let m = SurfaceMap::from_land_mask(2, 1, &[true, false]).unwrap();
        let err = m.with_elevation(vec![10.0, f64::NAN]).unwrap_err();
        assert!(matches!(
            err,
            SurfaceMapError::BadValue {
                what: "elevation_m",
                row: 0,
                column: 1,
                ..
            }
        ));
    }

    #[test]
    fn elevation_reads_zero_at_sea() {
        let m = SurfaceMap::from_land_mask(2, 1, &[true, false])
            .unwrap()
            .with_elevation(vec![1500.0, -300.0])
            .unwrap();
        assert_eq!(m.elevation_at_m(0.0, -90.0), 1500.0);
        assert_eq!(m.elevation_at_m(0.0, 90.0), 0.0);
    }
}
