//! The latitude × longitude map of `insola map --land` (or `--all-sea`): 960 × 560 px, the field
//! 720 × 360 px in equirectangular projection (180° W at the left, north up), the coastline of
//! the land file drawn as a dark contour, the tropics and polar circles dashed, and a colour bar
//! or, for categories, swatches on the right.

use plotters::coord::Shift;
use plotters::prelude::*;

use super::field::FieldFrame;
use super::{Chart, legend, lon_text};
use crate::commands::colour_map::{Colour, Scale};

const SIZE: (u32, u32) = (960, 560);
const FIELD: (i32, i32, u32, u32) = (86, 96, 720, 360);
/// Coastline colour.
const COAST: Colour = [24, 24, 28];

/// The key beside the map.
pub enum Key {
    /// A continuous colour bar with its unit.
    Bar {
        /// Colours.
        scale: Scale,
        /// Unit over the bar.
        unit: String,
    },
    /// One swatch per category.
    Swatches(Vec<(Colour, String)>),
}

/// The world map.
pub struct WorldMap<'a> {
    /// Title.
    pub title: String,
    /// Line under the title.
    pub subtitle: String,
    /// Footnote.
    pub note: String,
    /// Colour at a latitude and longitude, degrees.
    pub colour_at: &'a dyn Fn(f64, f64) -> Colour,
    /// Whether a place is land, degrees; `None` draws no coastline.
    pub land_at: Option<&'a dyn Fn(f64, f64) -> bool>,
    /// Colour bar or swatches.
    pub key: Key,
    /// Tropics and polar circles.
    pub lat_lines: Vec<(f64, String)>,
}

impl Chart for WorldMap<'_> {
    fn size(&self) -> (u32, u32) {
        SIZE
    }

    fn draw<DB: DrawingBackend>(&self, root: &DrawingArea<DB, Shift>) -> Result<(), String> {
        super::page(root, FIELD.0, &self.title, &self.subtitle, &self.note)?;
        let label = |v: f64| lon_text(v);
        let frame = FieldFrame {
            rect: FIELD,
            x_range: (-180.0, 180.0),
            x_ticks: (-3..=3).map(|k| 60.0 * f64::from(k)).collect(),
            x_label: &label,
            x_desc: "longitude".into(),
            lat_lines: self.lat_lines.clone(),
        };
        let (_, _, w, h) = FIELD;
        // Land per pixel, then the coast where a pixel's land differs from its right or lower
        // neighbour's.
        let land: Option<Vec<bool>> = self.land_at.map(|f| {
            (0..h)
                .flat_map(|py| (0..w).map(move |px| (px, py)))
                .map(|(px, py)| {
                    let (lon, lat) = frame.value_at(px, py);
                    f(lat, lon)
                })
                .collect()
        });
        frame.draw(root, |px, py| {
            if let Some(land) = &land {
                let at = |x: u32, y: u32| land[(y * w + x) as usize];
                let here = at(px, py);
                let right = at((px + 1) % w, py);
                let below = if py + 1 < h { at(px, py + 1) } else { here };
                if here != right || here != below {
                    return COAST;
                }
            }
            let (lon, lat) = frame.value_at(px, py);
            (self.colour_at)(lat, lon)
        })?;
        frame.draw_lat_labels(root)?;
        let key_x = FIELD.0 + w as i32 + 34;
        match &self.key {
            Key::Bar { scale, unit } => {
                legend::colour_bar(root, (key_x, FIELD.1, 18, h), scale, unit)
            }
            Key::Swatches(entries) => {
                let entries: Vec<(Colour, &str)> =
                    entries.iter().map(|(c, s)| (*c, s.as_str())).collect();
                legend::swatches(root, (key_x - 14, FIELD.1), &entries)
            }
        }
    }
}
