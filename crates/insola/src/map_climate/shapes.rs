//! A surface drawn as shapes in degrees — polygons and latitude–longitude rectangles painted in
//! order over open sea — for world files and hand-made maps, rasterised to a [`SurfaceMap`].
//!
//! A polygon is a closed ring of `(longitude, latitude)` vertices in degrees, edges straight in
//! the equirectangular plane; a pixel is inside by the even-odd rule at its centre. Longitudes
//! may run past ±180° (a shape crossing the date line can be written with longitudes 170 to
//! 200); the test is repeated one turn east and west. Later shapes paint over earlier ones, so
//! a lake is a `Sea` shape after its continent.

use serde::{Deserialize, Serialize};

use super::error::SurfaceMapError;
use super::surface::{SurfaceKind, SurfaceMap};

/// The outline of one shape, degrees.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub enum Outline {
    /// A closed ring of `(longitude_deg, latitude_deg)` vertices (at least 3).
    Polygon(Vec<(f64, f64)>),
    /// Everything between two latitudes and two longitudes, degrees (west to east, possibly
    /// across the date line when `east_deg < west_deg`).
    Rectangle {
        /// Western edge, degrees.
        west_deg: f64,
        /// Eastern edge, degrees.
        east_deg: f64,
        /// Southern edge, degrees.
        south_deg: f64,
        /// Northern edge, degrees.
        north_deg: f64,
    },
}

/// One painted shape.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct SurfaceShape {
    /// What the shape is made of.
    pub kind: SurfaceKind,
    /// Where it is.
    pub outline: Outline,
    /// Height of the shape's ground above the reference level, m (land only; default 0).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub elevation_m: Option<f64>,
}

/// A surface drawn as shapes over open sea (the RON form of a land file).
#[derive(Debug, Clone, PartialEq, Default, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct SurfaceLayout {
    /// A name for messages.
    #[serde(default)]
    pub name: String,
    /// Shapes, painted in order.
    pub shapes: Vec<SurfaceShape>,
}

fn bad(index: usize, reason: impl Into<String>) -> SurfaceMapError {
    SurfaceMapError::BadShape {
        index,
        reason: reason.into(),
    }
}

impl SurfaceLayout {
    /// Reads a layout from RON text.
    pub fn from_ron_str(text: &str) -> Result<Self, SurfaceMapError> {
        ron::from_str(text).map_err(|e| SurfaceMapError::Syntax(e.to_string()))
    }

    /// Checks every shape: finite coordinates, latitudes within ±90°, at least three polygon
    /// vertices, elevations within ±12 km.
    pub fn validate(&self) -> Result<(), SurfaceMapError> {
        for (i, s) in self.shapes.iter().enumerate() {
            match &s.outline {
                Outline::Polygon(points) => {
                    if points.len() < 3 {
                        return Err(bad(
                            i,
                            format!("a polygon needs at least 3 points, {} given", points.len()),
                        ));
                    }
                    for (k, &(lon, lat)) in points.iter().enumerate() {
                        if !lon.is_finite() || !(-90.0..=90.0).contains(&lat) {
                            return Err(bad(
                                i,
                                format!(
                                    "point {k} = ({lon}, {lat}): longitude must be finite and latitude within -90 to 90"
                                ),
                            ));
                        }
                    }
                }
                Outline::Rectangle {
                    west_deg,
                    east_deg,
                    south_deg,
                    north_deg,
                } => {
                    let ok = west_deg.is_finite()
                        && east_deg.is_finite()
                        && (-90.0..=90.0).contains(south_deg)
                        && (-90.0..=90.0).contains(north_deg)
                        && south_deg < north_deg;
                    if !ok {
                        return Err(bad(
                            i,
                            "a rectangle needs finite longitudes and -90 ≤ south_deg < north_deg ≤ 90",
                        ));
                    }
                }
            }
            if let Some(z) = s.elevation_m
                && !(z.is_finite() && (-12_000.0..=12_000.0).contains(&z))
            {
                return Err(bad(
                    i,
                    format!("elevation_m = {z}: allowed a finite number from -12000 to 12000"),
                ));
            }
        }
        Ok(())
    }

    /// Whether any shape gives an elevation.
    pub fn has_elevation(&self) -> bool {
        self.shapes.iter().any(|s| s.elevation_m.is_some())
    }

    /// The layout drawn on a `width × height` equirectangular raster (pixel centres tested).
    pub fn rasterise(&self, width: usize, height: usize) -> Result<SurfaceMap, SurfaceMapError> {
        self.validate()?;
        // Sizes are checked by the map constructor; an empty raster fails there.
        let n = width.saturating_mul(height);
        if width == 0
            || height == 0
            || width > super::MAX_RASTER_SIDE
            || height > super::MAX_RASTER_SIDE
        {
            return SurfaceMap::from_kinds(width, height, Vec::new());
        }
        let mut kinds = vec![SurfaceKind::Sea; n];
        let mut elev = vec![0.0; n];
        for shape in &self.shapes {
            for r in 0..height {
                let lat = 90.0 - (r as f64 + 0.5) * 180.0 / height as f64;
                for c in 0..width {
                    let lon = -180.0 + (c as f64 + 0.5) * 360.0 / width as f64;
                    if shape.outline.contains(lon, lat) {
                        kinds[r * width + c] = shape.kind;
                        elev[r * width + c] = shape.elevation_m.unwrap_or(0.0);
                    }
                }
            }
        }
        let map = SurfaceMap::from_kinds(width, height, kinds)?;
        if self.has_elevation() {
            map.with_elevation(elev)
        } else {
            Ok(map)
        }
    }
}

impl Outline {
    /// Whether the point (degrees) lies inside, trying the longitude one turn east and west too.
    pub fn contains(&self, lon_deg: f64, lat_deg: f64) -> bool {
        [0.0, 360.0, -360.0]
            .iter()
            .any(|shift| self.contains_once(lon_deg + shift, lat_deg))
    }

    fn contains_once(&self, x: f64, y: f64) -> bool {
        match self {
            Outline::Rectangle {
                west_deg,
                east_deg,
                south_deg,
                north_deg,
            } => {
                let east = if east_deg < west_deg {
                    east_deg + 360.0
                } else {
                    *east_deg
                };
                y >= *south_deg && y <= *north_deg && x >= *west_deg && x <= east
            }
            Outline::Polygon(points) => {
                // Even-odd rule: count edges crossed by a ray toward +x.
                let mut inside = false;
                let n = points.len();
                for k in 0..n {
                    let (x0, y0) = points[k];
                    let (x1, y1) = points[(k + 1) % n];
                    if (y0 > y) != (y1 > y) {
                        let xc = x0 + (y - y0) / (y1 - y0) * (x1 - x0);
                        if x < xc {
                            inside = !inside;
                        }
                    }
                }
                inside
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn polygons_rectangles_and_lakes() {
        let text = r#"(
            name: "test",
            shapes: [
                (kind: Land, outline: Rectangle(west_deg: -60, east_deg: 60, south_deg: -30, north_deg: 30), elevation_m: Some(500)),
                (kind: Sea, outline: Polygon([(-10, -10), (10, -10), (10, 10), (-10, 10)])),
                (kind: IceSheet, outline: Polygon([(170, 60), (200, 60), (185, 80)])),
            ],
        )"#;
        let layout = SurfaceLayout::from_ron_str(text).unwrap();
        let m = layout.rasterise(360, 180).unwrap();
        assert_eq!(m.kind_at(20.0, 40.0), SurfaceKind::Land);
        assert_eq!(m.elevation_at_m(20.0, 40.0), 500.0);
        assert_eq!(m.kind_at(0.0, 0.0), SurfaceKind::Sea);
        // Across the date line: 190° E is 170° W.
        assert_eq!(m.kind_at(65.0, -170.0), SurfaceKind::IceSheet);
        assert_eq!(m.kind_at(65.0, 175.0), SurfaceKind::IceSheet);
        assert_eq!(m.kind_at(-60.0, 100.0), SurfaceKind::Sea);
    }

    #[test]
    fn bad_shapes_name_their_index() {
        let layout = SurfaceLayout {
            name: String::new(),
            shapes: vec![
                SurfaceShape {
                    kind: SurfaceKind::Land,
                    outline: Outline::Polygon(vec![(0.0, 0.0), (10.0, 0.0), (5.0, 5.0)]),
                    elevation_m: None,
                },
                SurfaceShape {
                    kind: SurfaceKind::Land,
                    outline: Outline::Polygon(vec![(0.0, 0.0), (10.0, 95.0), (5.0, 5.0)]),
                    elevation_m: None,
                },
            ],
        };
        assert!(matches!(
            layout.validate(),
            Err(SurfaceMapError::BadShape { index: 1, .. })
        ));
        assert!(matches!(
            SurfaceLayout::from_ron_str("(shapes: [(kind: Rock)])"),
            Err(SurfaceMapError::Syntax(_))
        ));
        assert!(layout.rasterise(0, 10).is_err());
    }
}
