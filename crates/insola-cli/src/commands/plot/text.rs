//! Fonts and text placement for the charts.
//!
//! One family, DejaVu Sans from the `dejavu` crate, registered with `plotters` under the name
//! `sans-serif` so SVG viewers fall back to their own sans-serif face.

use std::sync::OnceLock;

use plotters::coord::Shift;
use plotters::prelude::*;
use plotters::style::text_anchor::{HPos, Pos, VPos};

/// The family name the charts ask for.
pub const FAMILY: &str = "sans-serif";

/// Registers the bundled fonts once per process.
pub fn register_fonts() -> Result<(), String> {
    static DONE: OnceLock<Result<(), String>> = OnceLock::new();
    DONE.get_or_init(|| {
        let bad = |_| "the bundled DejaVu Sans font did not load".to_string();
        plotters::style::register_font(FAMILY, FontStyle::Normal, dejavu::sans::regular())
            .map_err(bad)?;
        plotters::style::register_font(FAMILY, FontStyle::Bold, dejavu::sans::bold()).map_err(bad)
    })
    .clone()
}

/// A text style of the bundled family: `size` px, `colour`. Sizes are even: `plotters` places
/// each glyph at half the size plus its top and truncates, so at odd sizes short glyphs (points,
/// commas) sit a pixel too high.
pub fn style(size: f64, colour: RGBColor) -> TextStyle<'static> {
    (FAMILY, size).into_font().color(&colour)
}

/// The same in bold.
pub fn bold(size: f64, colour: RGBColor) -> TextStyle<'static> {
    (FAMILY, size)
        .into_font()
        .style(FontStyle::Bold)
        .color(&colour)
}

/// Where a text's anchor sits on it.
#[derive(Debug, Clone, Copy)]
pub enum Anchor {
    /// Top-left corner.
    TopLeft,
    /// Middle of the left edge.
    Left,
    /// Middle of the bottom edge.
    BottomCentre,
}

impl Anchor {
    fn pos(self) -> Pos {
        let (h, v) = match self {
            Anchor::TopLeft => (HPos::Left, VPos::Top),
            Anchor::Left => (HPos::Left, VPos::Center),
            Anchor::BottomCentre => (HPos::Center, VPos::Bottom),
        };
        Pos::new(h, v)
    }
}

/// Draws `s` at pixel `(x, y)` of `root`, anchored as `anchor` says.
pub fn put<DB: DrawingBackend>(
    root: &DrawingArea<DB, Shift>,
    s: &str,
    (x, y): (i32, i32),
    style: &TextStyle<'_>,
    anchor: Anchor,
) -> Result<(), String> {
    let st = style.pos(anchor.pos());
    root.draw(&Text::new(s.to_string(), (x, y), st))
        .map_err(super::fail)
}

/// Width of `s` in `style`, px (the font's advance widths).
pub fn width(s: &str, style: &TextStyle<'_>) -> i32 {
    style
        .font
        .box_size(s)
        .map(|(w, _)| w as i32)
        .unwrap_or(s.chars().count() as i32 * 7)
}

/// Draws `s` on a filled box (a label readable over a colour field).
pub fn label<DB: DrawingBackend>(
    root: &DrawingArea<DB, Shift>,
    s: &str,
    (x, y): (i32, i32),
    style: &TextStyle<'_>,
    fill: RGBColor,
) -> Result<(), String> {
    let w = width(s, style);
    let h = style.font.get_size() as i32;
    root.draw(&Rectangle::new(
        [(x - 3, y - 2), (x + w + 3, y + h + 1)],
        fill.mix(0.85).filled(),
    ))
    .map_err(super::fail)?;
    put(root, s, (x, y), style, Anchor::TopLeft)
}
