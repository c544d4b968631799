//! The charts of the CLI: heat maps, world maps, the year chart and the analemma, as PNG or SVG.
//!
//! Drawing library: `plotters` (axes, tick labels, series, text), with its bitmap backend for
//! PNG (encoded by the `image` crate the CLI already uses) and its SVG backend for SVG. It is a
//! well-kept, widely used Rust plotting crate that needs no system libraries. Text goes through
//! `ab_glyph` with DejaVu Sans bundled in the binary (the `dejavu` crate; Bitstream Vera licence
//! with public-domain DejaVu changes), so charts render the same on a bare server without fonts.
//!
//! Each chart implements [`Chart`]: it draws on a `plotters` drawing area of any backend, and
//! [`save`] picks the backend from the file's extension (`.png` or `.svg`). Colour fields (heat
//! maps, world maps) are drawn as one bitmap each; in SVG that bitmap is embedded as a PNG
//! `<image>` (see [`svg_raster`]) instead of hundreds of thousands of rectangles.

pub mod analemma;
pub mod axis;
pub mod field;
pub mod heat_map;
pub mod legend;
pub mod svg_raster;
pub mod text;
pub mod world_map;
pub mod year_chart;

use plotters::coord::Shift;
use plotters::prelude::*;

/// Page background.
pub const BACKGROUND: RGBColor = RGBColor(250, 249, 246);
/// Text and frames.
pub const INK: RGBColor = RGBColor(28, 28, 32);
/// Secondary text.
pub const SOFT: RGBColor = RGBColor(96, 96, 104);

/// A chart that draws itself on any `plotters` backend.
pub trait Chart {
    /// Picture size, px.
    fn size(&self) -> (u32, u32);
    /// Draws the whole picture (background included) on `root`.
    fn draw<DB: DrawingBackend>(&self, root: &DrawingArea<DB, Shift>) -> Result<(), String>;
}

/// File formats a chart can be written in.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Format {
    /// Portable Network Graphics.
    Png,
    /// Scalable Vector Graphics.
    Svg,
}

impl Format {
    /// The format named by a path's extension (case-insensitive).
    pub fn of_path(path: &str) -> Result<Self, String> {
        let ext = std::path::Path::new(path)
            .extension()
            .and_then(|e| e.to_str())
            .map(str::to_ascii_lowercase);
        match ext.as_deref() {
            Some("png") => Ok(Format::Png),
            Some("svg") => Ok(Format::Svg),
            _ => Err(format!(
                "{path}: unknown picture format; the file name must end in .png or .svg"
            )),
        }
    }
}

/// Turns a drawing error into the CLI's error text.
pub fn fail<E: std::fmt::Display>(e: E) -> String {
    format!("drawing failed: {e}")
}

/// Draws `chart` and writes it to `path` as PNG or SVG by the extension.
pub fn save(chart: &impl Chart, path: &str) -> Result<(), String> {
    let format = Format::of_path(path)?;
    text::register_fonts()?;
    let (w, h) = chart.size();
    match format {
        Format::Png => {
            let mut buf = vec![0u8; w as usize * h as usize * 3];
            {
                let root = BitMapBackend::with_buffer(&mut buf, (w, h)).into_drawing_area();
                chart.draw(&root)?;
                root.present().map_err(fail)?;
            }
            let img = image::RgbImage::from_raw(w, h, buf)
                .ok_or_else(|| "drawing failed: picture buffer of the wrong size".to_string())?;
            img.save_with_format(path, image::ImageFormat::Png)
                .map_err(|e| format!("cannot write {path}: {e}"))
        }
        Format::Svg => {
            let text = svg_raster::render(chart)?;
            std::fs::write(path, text).map_err(|e| format!("cannot write {path}: {e}"))
        }
    }
}

/// Draws a colour field (row-major RGB, `w × h` px) with its top-left corner at pixel `(x, y)`
/// of `root`.
pub fn blit<DB: DrawingBackend>(
    root: &DrawingArea<DB, Shift>,
    (x, y): (i32, i32),
    img: &image::RgbImage,
) -> Result<(), String> {
    let (w, h) = img.dimensions();
    let el = BitMapElement::with_ref((x, y), (w, h), img.as_raw())
        .ok_or_else(|| "drawing failed: colour field of the wrong size".to_string())?;
    root.draw(&el).map_err(fail)
}

/// Fills the page and draws the title (bold, top left at `x`), a subtitle under it and a
/// footnote at the bottom (a second line after a `\n` smaller, under the first).
pub fn page<DB: DrawingBackend>(
    root: &DrawingArea<DB, Shift>,
    x: i32,
    title: &str,
    subtitle: &str,
    note: &str,
) -> Result<(), String> {
    root.fill(&BACKGROUND).map_err(fail)?;
    let (_, h) = root.dim_in_pixel();
    text::put(
        root,
        title,
        (x, 12),
        &text::bold(20.0, INK),
        text::Anchor::TopLeft,
    )?;
    text::put(
        root,
        subtitle,
        (x, 40),
        &text::style(14.0, SOFT),
        text::Anchor::TopLeft,
    )?;
    // A second line (the caution of a reference world) goes under the note, smaller.
    match note.split_once('\n') {
        None => text::put(
            root,
            note,
            (x, h as i32 - 24),
            &text::style(12.0, SOFT),
            text::Anchor::TopLeft,
        ),
        Some((first, second)) => {
            text::put(
                root,
                first,
                (x, h as i32 - 28),
                &text::style(12.0, SOFT),
                text::Anchor::TopLeft,
            )?;
            text::put(
                root,
                second,
                (x, h as i32 - 14),
                &text::style(10.0, SOFT),
                text::Anchor::TopLeft,
            )
        }
    }
}

/// A latitude as text: `30°N`, `23.5°S`, `0°`.
pub fn lat_text(lat: f64) -> String {
    let a = lat.abs();
    let a = if (a - a.round()).abs() < 0.05 {
        format!("{a:.0}")
    } else {
        format!("{a:.1}")
    };
    if lat > 0.05 {
        format!("{a}°N")
    } else if lat < -0.05 {
        format!("{a}°S")
    } else {
        "0°".to_string()
    }
}

/// A longitude as text: `120°E`, `60°W`, `0°`, `180°`.
pub fn lon_text(lon: f64) -> String {
    let a = lon.abs();
    if a < 0.05 {
        "0°".into()
    } else if (a - 180.0).abs() < 0.05 {
        "180°".into()
    } else if lon > 0.0 {
        format!("{a:.0}°E")
    } else {
        format!("{a:.0}°W")
    }
}

/// A number for tick labels: no trailing `.0`, a true minus sign.
pub fn number_text(v: f64) -> String {
    let s = if (v - v.round()).abs() < 1e-9 {
        format!("{v:.0}")
    } else {
        let s = format!("{v:.2}");
        s.trim_end_matches('0').trim_end_matches('.').to_string()
    };
    if s == "-0" {
        "0".into()
    } else {
        s.replace('-', "−")
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn formats_follow_the_extension() {
        assert_eq!(Format::of_path("a/b.PNG"), Ok(Format::Png));
        assert_eq!(Format::of_path("b.svg"), Ok(Format::Svg));
        assert!(Format::of_path("b.jpg").is_err());
        assert!(Format::of_path("b").is_err());
    }

    #[test]
    fn labels_read_as_on_a_map() {
        assert_eq!(lat_text(23.44), "23.4°S".replace('S', "N"));
        assert_eq!(lat_text(-60.0), "60°S");
        assert_eq!(lat_text(0.0), "0°");
        assert_eq!(lon_text(-120.0), "120°W");
        assert_eq!(lon_text(180.0), "180°");
        assert_eq!(number_text(-10.0), "−10");
        assert_eq!(number_text(2.5), "2.5");
        assert_eq!(number_text(-0.0), "0");
    }
}
