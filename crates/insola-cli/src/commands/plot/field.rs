//! A colour field over latitude: the frame both the latitude × time heat map and the latitude ×
//! longitude world map share (axes, ticks, tropics and polar circles over a bitmap).

use plotters::coord::Shift;
use plotters::prelude::*;

use super::axis::Ticked;
use super::text::{self, Anchor};
use super::{INK, fail, lat_text};
use crate::commands::colour_map::Colour;

/// Width of the latitude label area left of the field, px.
const Y_LABELS: u32 = 62;
/// Height of the tick-label and description area below the field, px.
const X_LABELS: u32 = 44;

/// The field's frame: where it sits, its horizontal axis, the latitude lines to mark.
pub struct FieldFrame<'a> {
    /// Field rectangle: left, top, width, height, px.
    pub rect: (i32, i32, u32, u32),
    /// Horizontal axis range, in its own unit.
    pub x_range: (f64, f64),
    /// Tick positions on the horizontal axis.
    pub x_ticks: Vec<f64>,
    /// Tick label text.
    pub x_label: &'a dyn Fn(f64) -> String,
    /// Axis description under the ticks (with its unit).
    pub x_desc: String,
    /// Latitude lines with their labels (tropics, polar circles), degrees.
    pub lat_lines: Vec<(f64, String)>,
}

impl FieldFrame<'_> {
    /// Pixel column of a horizontal-axis value.
    pub fn x_px(&self, v: f64) -> i32 {
        let (x, _, w, _) = self.rect;
        let (lo, hi) = self.x_range;
        x + ((v - lo) / (hi - lo) * f64::from(w)).round() as i32
    }

    /// Pixel row of a latitude, degrees.
    pub fn y_px(&self, lat_deg: f64) -> i32 {
        let (_, y, _, h) = self.rect;
        y + ((90.0 - lat_deg) / 180.0 * f64::from(h)).round() as i32
    }

    /// The value at the centre of pixel column `px` (0 at the field's left edge) and the
    /// latitude at the centre of pixel row `py` (0 at the top), degrees.
    pub fn value_at(&self, px: u32, py: u32) -> (f64, f64) {
        let (_, _, w, h) = self.rect;
        let (lo, hi) = self.x_range;
        let x = lo + (f64::from(px) + 0.5) / f64::from(w) * (hi - lo);
        let lat = 90.0 - (f64::from(py) + 0.5) / f64::from(h) * 180.0;
        (x, lat)
    }

    /// Draws the field (colour of each pixel from `colour_at(px, py)`), its axes with ticks,
    /// and the latitude lines.
    pub fn draw<DB: DrawingBackend>(
        &self,
        root: &DrawingArea<DB, Shift>,
        colour_at: impl Fn(u32, u32) -> Colour,
    ) -> Result<(), String> {
        let (x, y, w, h) = self.rect;
        let mut img = image::RgbImage::new(w, h);
        for (px, py, p) in img.enumerate_pixels_mut() {
            *p = image::Rgb(colour_at(px, py));
        }
        let area = root
            .clone()
            .shrink((x - Y_LABELS as i32, y), (w + Y_LABELS, h + X_LABELS));
        let (lo, hi) = self.x_range;
        let mut chart = ChartBuilder::on(&area)
            .y_label_area_size(Y_LABELS)
            .x_label_area_size(X_LABELS)
            .build_cartesian_2d(
                Ticked::new(lo, hi, self.x_ticks.clone()),
                Ticked::new(
                    -90.0,
                    90.0,
                    vec![-90.0, -60.0, -30.0, 0.0, 30.0, 60.0, 90.0],
                ),
            )
            .map_err(fail)?;
        super::blit(root, (x, y), &img)?;
        let x_label = |v: &f64| (self.x_label)(*v);
        let y_label = |v: &f64| lat_text(*v);
        chart
            .configure_mesh()
            .disable_mesh()
            .x_label_formatter(&x_label)
            .y_label_formatter(&y_label)
            .x_desc(self.x_desc.as_str())
            .y_desc("latitude")
            .label_style(text::style(12.0, INK))
            .axis_desc_style(text::style(14.0, INK))
            .axis_style(INK)
            .draw()
            .map_err(fail)?;
        root.draw(&Rectangle::new(
            [(x - 1, y - 1), (x + w as i32, y + h as i32)],
            INK.stroke_width(1),
        ))
        .map_err(fail)?;
        for (lat, _) in &self.lat_lines {
            let ly = self.y_px(*lat);
            dashed(root, (x, ly), (x + w as i32 - 1, ly), 6)?;
        }
        Ok(())
    }

    /// Labels the latitude lines at the right end, on boxes (drawn last, over everything).
    /// A label sits on the poleward side of its line, or the other side near the frame.
    pub fn draw_lat_labels<DB: DrawingBackend>(
        &self,
        root: &DrawingArea<DB, Shift>,
    ) -> Result<(), String> {
        let (x, y, w, h) = self.rect;
        let small = text::style(12.0, INK);
        for (lat, name) in &self.lat_lines {
            let ly = self.y_px(*lat);
            let tw = text::width(name, &small);
            let room_above = ly - y >= 20;
            let room_below = y + h as i32 - ly >= 20;
            let above = if *lat > 0.0 { room_above } else { !room_below };
            let ty = if above { ly - 16 } else { ly + 4 };
            text::label(
                root,
                name,
                (x + w as i32 - tw - 8, ty),
                &small,
                RGBColor(255, 255, 255),
            )?;
        }
        Ok(())
    }
}

/// A straight line in white and black dashes of `dash` px, readable on dark and light colours.
pub fn dashed<DB: DrawingBackend>(
    root: &DrawingArea<DB, Shift>,
    from: (i32, i32),
    to: (i32, i32),
    dash: i32,
) -> Result<(), String> {
    let (dx, dy) = (to.0 - from.0, to.1 - from.1);
    let len = dx.abs().max(dy.abs()).max(1);
    let at = |t: i32| (from.0 + dx * t / len, from.1 + dy * t / len);
    let mut t = 0;
    let mut dark = false;
    while t < len {
        let end = (t + dash).min(len);
        let colour = if dark { BLACK } else { WHITE };
        root.draw(&PathElement::new(
            vec![at(t), at(end)],
            colour.stroke_width(1),
        ))
        .map_err(fail)?;
        dark = !dark;
        t = end;
    }
    Ok(())
}

/// The tropics and polar circles of a world as labelled latitude lines (left out when they
/// fall on the equator or a pole).
pub fn zone_lines(tropic_deg: f64, polar_circle_deg: f64) -> Vec<(f64, String)> {
    let mut out = Vec::new();
    for (lat, what) in [(tropic_deg, "tropic"), (polar_circle_deg, "polar circle")] {
        if lat > 0.3 && lat < 89.7 {
            for sign in [1.0, -1.0] {
                out.push((sign * lat, format!("{what} {}", lat_text(sign * lat))));
            }
        }
    }
    out
}

/// Draws `name` centred over pixel column `x`, kept within `[left, right]`, its bottom at `y`.
pub fn top_label<DB: DrawingBackend>(
    root: &DrawingArea<DB, Shift>,
    name: &str,
    (x, y): (i32, i32),
    (left, right): (i32, i32),
) -> Result<(), String> {
    let st = text::style(12.0, INK);
    let w = text::width(name, &st);
    let cx = x.clamp(left + w / 2, right - w / 2);
    text::put(root, name, (cx, y), &st, Anchor::BottomCentre)
}
