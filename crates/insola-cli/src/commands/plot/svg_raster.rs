//! SVG output with colour fields embedded as PNG images.
//!
//! `plotters`' SVG backend draws a bitmap pixel by pixel, one `<rect>` each: a 720 × 380 heat
//! map would be a 30 MB file. [`RasterSvg`] wraps the backend and turns each bitmap into a
//! placeholder rectangle of a marker colour, remembering the bitmap as a PNG; [`render`] then
//! replaces each placeholder line by an `<image>` element holding the PNG as a data URI. The
//! placeholder keeps its place in the drawing order, so the axes and labels drawn after it stay
//! on top.

use std::cell::RefCell;
use std::rc::Rc;

use base64::Engine;
use plotters::prelude::*;
use plotters_backend::{
    BackendColor, BackendCoord, BackendStyle, BackendTextStyle, DrawingErrorKind,
};

use super::Chart;

/// Opacity of the placeholders: with the marker colour it appears nowhere else.
const MARKER_OPACITY: f64 = 0.999;

/// A bitmap waiting to replace its placeholder.
struct Embedded {
    /// The placeholder's fill, `#RRGGBB` as the SVG backend writes it.
    fill: String,
    /// The `<image>` element.
    element: String,
}

/// The SVG backend with bitmaps kept as PNG images.
pub struct RasterSvg<'a> {
    inner: SVGBackend<'a>,
    images: Rc<RefCell<Vec<Embedded>>>,
}

/// Draws `chart` as SVG text.
pub fn render(chart: &impl Chart) -> Result<String, String> {
    let mut text = String::new();
    let images = Rc::new(RefCell::new(Vec::new()));
    {
        let backend = RasterSvg {
            inner: SVGBackend::with_string(&mut text, chart.size()),
            images: Rc::clone(&images),
        };
        let root = backend.into_drawing_area();
        chart.draw(&root)?;
        root.present().map_err(super::fail)?;
    }
    let images = images.borrow();
    let opacity = format!("opacity=\"{MARKER_OPACITY}\"");
    let mut out = String::with_capacity(text.len());
    for line in text.lines() {
        let found = if line.starts_with("<rect") && line.contains(&opacity) {
            images
                .iter()
                .find(|i| line.contains(&format!("fill=\"{}\"", i.fill)))
        } else {
            None
        };
        match found {
            Some(img) => out.push_str(&img.element),
            None => out.push_str(line),
        }
        out.push('\n');
    }
    Ok(out)
}

fn png_data_uri(w: u32, h: u32, rgb: &[u8]) -> Result<String, std::io::Error> {
    let img = image::RgbImage::from_raw(w, h, rgb.to_vec())
        .ok_or_else(|| std::io::Error::other("bitmap of the wrong size"))?;
    let mut png = Vec::new();
    img.write_to(&mut std::io::Cursor::new(&mut png), image::ImageFormat::Png)
        .map_err(std::io::Error::other)?;
    Ok(format!(
        "data:image/png;base64,{}",
        base64::engine::general_purpose::STANDARD.encode(&png)
    ))
}

type Res = Result<(), DrawingErrorKind<std::io::Error>>;

impl DrawingBackend for RasterSvg<'_> {
    type ErrorType = std::io::Error;

    fn get_size(&self) -> (u32, u32) {
        self.inner.get_size()
    }

    fn ensure_prepared(&mut self) -> Res {
        self.inner.ensure_prepared()
    }

    fn present(&mut self) -> Res {
        self.inner.present()
    }

    fn draw_pixel(&mut self, point: BackendCoord, color: BackendColor) -> Res {
        self.inner.draw_pixel(point, color)
    }

    fn draw_line<S: BackendStyle>(&mut self, from: BackendCoord, to: BackendCoord, s: &S) -> Res {
        self.inner.draw_line(from, to, s)
    }

    fn draw_rect<S: BackendStyle>(
        &mut self,
        upper_left: BackendCoord,
        bottom_right: BackendCoord,
        s: &S,
        fill: bool,
    ) -> Res {
        self.inner.draw_rect(upper_left, bottom_right, s, fill)
    }

    fn draw_path<S: BackendStyle, I: IntoIterator<Item = BackendCoord>>(
        &mut self,
        path: I,
        s: &S,
    ) -> Res {
        self.inner.draw_path(path, s)
    }

    fn draw_circle<S: BackendStyle>(
        &mut self,
        center: BackendCoord,
        radius: u32,
        s: &S,
        fill: bool,
    ) -> Res {
        self.inner.draw_circle(center, radius, s, fill)
    }

    fn fill_polygon<S: BackendStyle, I: IntoIterator<Item = BackendCoord>>(
        &mut self,
        vert: I,
        s: &S,
    ) -> Res {
        self.inner.fill_polygon(vert, s)
    }

    fn draw_text<T: BackendTextStyle>(&mut self, text: &str, s: &T, pos: BackendCoord) -> Res {
        self.inner.draw_text(text, s, pos)
    }

    fn estimate_text_size<T: BackendTextStyle>(
        &self,
        text: &str,
        s: &T,
    ) -> Result<(u32, u32), DrawingErrorKind<std::io::Error>> {
        self.inner.estimate_text_size(text, s)
    }

    fn blit_bitmap(&mut self, pos: BackendCoord, (w, h): (u32, u32), src: &[u8]) -> Res {
        let uri = png_data_uri(w, h, src).map_err(DrawingErrorKind::DrawingError)?;
        let mut images = self.images.borrow_mut();
        // Marker colours #0102xx: one per bitmap (a chart has a handful).
        let k = images.len();
        let rgb = (1, 2 + (k / 256) as u8, (k % 256) as u8);
        images.push(Embedded {
            fill: format!("#{:02X}{:02X}{:02X}", rgb.0, rgb.1, rgb.2),
            element: format!(
                "<image x=\"{}\" y=\"{}\" width=\"{w}\" height=\"{h}\" preserveAspectRatio=\"none\" href=\"{uri}\"/>",
                pos.0, pos.1
            ),
        });
        let marker = BackendColor {
            alpha: MARKER_OPACITY,
            rgb,
        };
        self.inner
            .draw_rect(pos, (pos.0 + w as i32, pos.1 + h as i32), &marker, true)
    }
}
