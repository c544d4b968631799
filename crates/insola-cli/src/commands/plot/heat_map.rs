//! The latitude × time-of-year heat map of `insola map` (without `--land`): 960 × 540 px, the
//! field 720 × 370 px with latitude up and the year left to right from time zero, equinoxes
//! and solstices marked along the top, tropics and polar circles as dashed lines, and a colour
//! bar with the unit on the right.

use plotters::coord::Shift;
use plotters::prelude::*;

use super::field::{FieldFrame, dashed, top_label};
use super::{Chart, legend, number_text};
use crate::commands::colour_map::{Scale, nice_ticks};
use crate::commands::map_zonal::Field;

const SIZE: (u32, u32) = (960, 540);
const FIELD: (i32, i32, u32, u32) = (86, 96, 720, 370);

/// What the heat map shows and how it is labelled.
pub struct HeatMap<'a> {
    /// The samples.
    pub field: &'a Field,
    /// Title.
    pub title: String,
    /// Line under the title (the world's numbers).
    pub subtitle: String,
    /// Footnote: what the quantity is and where it comes from.
    pub note: String,
    /// Unit over the colour bar.
    pub unit: String,
    /// Colours.
    pub scale: Scale,
    /// Draw a black line where the value crosses 0 (the freezing line of temperature maps).
    pub zero_line: bool,
    /// Length of the year in the time axis' days.
    pub year_days: f64,
    /// Time axis description.
    pub x_desc: String,
    /// Tropics and polar circles.
    pub lat_lines: Vec<(f64, String)>,
    /// Equinoxes and solstices: year fraction and name.
    pub season_marks: Vec<(f64, &'static str)>,
}

impl HeatMap<'_> {
    /// Nearest sample to the centre of field pixel `(px, py)`.
    fn value(&self, frame: &FieldFrame<'_>, px: u32, py: u32) -> f64 {
        let f = self.field;
        let (n_lat, n_time) = (f.lats_deg.len(), f.fractions.len());
        let (day, lat) = frame.value_at(px, py);
        let i = (((lat + 90.0) / 180.0 * n_lat as f64) as usize).min(n_lat - 1);
        let k = ((day / self.year_days * n_time as f64) as usize).min(n_time - 1);
        f.values[k * n_lat + i]
    }
}

impl Chart for HeatMap<'_> {
    fn size(&self) -> (u32, u32) {
        SIZE
    }

    fn draw<DB: DrawingBackend>(&self, root: &DrawingArea<DB, Shift>) -> Result<(), String> {
        super::page(root, FIELD.0, &self.title, &self.subtitle, &self.note)?;
        let label = |v: f64| number_text(v);
        let frame = FieldFrame {
            rect: FIELD,
            x_range: (0.0, self.year_days),
            x_ticks: nice_ticks(0.0, self.year_days, 8),
            x_label: &label,
            x_desc: self.x_desc.clone(),
            lat_lines: self.lat_lines.clone(),
        };
        let (_, _, w, h) = FIELD;
        let values: Vec<f64> = (0..h)
            .flat_map(|py| (0..w).map(move |px| (px, py)))
            .map(|(px, py)| self.value(&frame, px, py))
            .collect();
        let at = |px: u32, py: u32| values[(py * w + px) as usize];
        frame.draw(root, |px, py| {
            let v = at(px, py);
            if self.zero_line {
                let r = if px + 1 < w { at(px + 1, py) } else { v };
                let d = if py + 1 < h { at(px, py + 1) } else { v };
                if (v < 0.0) != (r < 0.0) || (v < 0.0) != (d < 0.0) {
                    return [0, 0, 0];
                }
            }
            self.scale.colour(v)
        })?;
        // Equinoxes and solstices: dashed lines, names in two rows so neighbours cannot overlap.
        let (x0, y0) = (FIELD.0, FIELD.1);
        for (n, (fraction, name)) in self.season_marks.iter().enumerate() {
            let x = frame.x_px(fraction * self.year_days);
            dashed(root, (x, y0), (x, y0 + h as i32 - 1), 3)?;
            root.draw(&PathElement::new(
                vec![(x, y0 - 6), (x, y0 - 1)],
                super::INK.stroke_width(1),
            ))
            .map_err(super::fail)?;
            let row = if n % 2 == 0 { y0 - 7 } else { y0 - 21 };
            top_label(root, name, (x, row), (x0, x0 + w as i32))?;
        }
        frame.draw_lat_labels(root)?;
        legend::colour_bar(
            root,
            (x0 + w as i32 + 34, y0, 18, h),
            &self.scale,
            &self.unit,
        )
    }
}
