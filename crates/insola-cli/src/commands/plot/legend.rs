//! Colour legends: a continuous colour bar with ticks and unit, and swatches for categories.

use plotters::coord::Shift;
use plotters::prelude::*;

use super::text::{self, Anchor};
use super::{INK, fail, number_text};
use crate::commands::colour_map::{Colour, Scale, nice_ticks};

/// An `[r, g, b]` colour as `plotters` wants it.
pub fn rgb(c: Colour) -> RGBColor {
    RGBColor(c[0], c[1], c[2])
}

/// A vertical colour bar of `scale` in the box at `(x, y)`, `w × h` px, high values at the top,
/// with round ticks on the right and `unit` above.
pub fn colour_bar<DB: DrawingBackend>(
    root: &DrawingArea<DB, Shift>,
    (x, y, w, h): (i32, i32, u32, u32),
    scale: &Scale,
    unit: &str,
) -> Result<(), String> {
    let (lo, hi) = scale.range();
    let mut img = image::RgbImage::new(w, h);
    for py in 0..h {
        let v = hi - (f64::from(py) + 0.5) / f64::from(h) * (hi - lo);
        let c = image::Rgb(scale.colour(v));
        for px in 0..w {
            img.put_pixel(px, py, c);
        }
    }
    super::blit(root, (x, y), &img)?;
    let (wi, hi_px) = (w as i32, h as i32);
    root.draw(&Rectangle::new(
        [(x - 1, y - 1), (x + wi, y + hi_px)],
        INK.stroke_width(1),
    ))
    .map_err(fail)?;
    let label = text::style(12.0, INK);
    for v in nice_ticks(lo, hi, 8) {
        let ty = y + ((hi - v) / (hi - lo) * f64::from(h)).round() as i32;
        let ty = ty.clamp(y, y + hi_px - 1);
        root.draw(&PathElement::new(
            vec![(x + wi, ty), (x + wi + 5, ty)],
            INK.stroke_width(1),
        ))
        .map_err(fail)?;
        text::put(
            root,
            &number_text(v),
            (x + wi + 8, ty),
            &label,
            Anchor::Left,
        )?;
    }
    text::put(
        root,
        unit,
        (x + wi / 2, y - 8),
        &text::style(14.0, INK),
        Anchor::BottomCentre,
    )
}

/// Swatches with names, one a row from `(x, y)` down.
pub fn swatches<DB: DrawingBackend>(
    root: &DrawingArea<DB, Shift>,
    (x, y): (i32, i32),
    entries: &[(Colour, &str)],
) -> Result<(), String> {
    let label = text::style(12.0, INK);
    for (i, (c, name)) in entries.iter().enumerate() {
        let top = y + 24 * i as i32;
        root.draw(&Rectangle::new(
            [(x, top), (x + 18, top + 16)],
            rgb(*c).filled(),
        ))
        .map_err(fail)?;
        root.draw(&Rectangle::new(
            [(x, top), (x + 18, top + 16)],
            INK.stroke_width(1),
        ))
        .map_err(fail)?;
        text::put(root, name, (x + 24, top + 8), &label, Anchor::Left)?;
    }
    Ok(())
}
