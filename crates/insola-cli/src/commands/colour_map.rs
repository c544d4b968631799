//! Drawing helpers for `insola map`: colour ramps and a small RGB canvas with lines and text.
//!
//! Text uses the public-domain 8×8 bitmap glyphs of the `font8x8` crate (no system fonts needed).

use font8x8::UnicodeFonts;
use image::{Rgb, RgbImage};

/// An RGB colour, 8 bits per channel.
pub type Colour = [u8; 3];

/// A colour ramp: stops at positions 0–1, linear interpolation between them.
#[derive(Debug, Clone, Copy)]
pub struct Ramp(pub &'static [(f64, Colour)]);

/// Sunlight: night-dark violet through rose and amber to pale straw. Lightness rises
/// monotonically along the ramp, so it reads in order even in grey.
pub const SUNLIGHT: Ramp = Ramp(&[
    (0.0, [18, 14, 34]),
    (0.22, [62, 40, 108]),
    (0.45, [150, 56, 104]),
    (0.68, [218, 112, 62]),
    (0.86, [244, 184, 84]),
    (1.0, [252, 243, 200]),
]);

/// Daylight: deep night blue through dusk blue and grey-teal to pale daylight yellow.
/// Lightness rises monotonically.
pub const DAYLIGHT: Ramp = Ramp(&[
    (0.0, [10, 14, 44]),
    (0.3, [38, 66, 132]),
    (0.55, [84, 138, 170]),
    (0.8, [182, 204, 170]),
    (1.0, [250, 240, 170]),
]);

/// Below freezing: dark indigo to pale ice blue (read at 0 = coldest, 1 = just below 0 °C).
pub const FROST: Ramp = Ramp(&[
    (0.0, [30, 16, 72]),
    (0.35, [44, 70, 160]),
    (0.7, [92, 150, 212]),
    (1.0, [200, 230, 244]),
]);

/// Above freezing: pale cream through ochre and brick red to dark maroon (0 = just above
/// 0 °C, 1 = hottest).
pub const WARMTH: Ramp = Ramp(&[
    (0.0, [246, 236, 188]),
    (0.3, [232, 178, 92]),
    (0.6, [206, 96, 52]),
    (0.85, [150, 34, 40]),
    (1.0, [80, 12, 32]),
]);

impl Ramp {
    /// The colour at `t` (clamped to 0–1; NaN gives the start colour).
    pub fn at(&self, t: f64) -> Colour {
        let t = if t.is_nan() { 0.0 } else { t.clamp(0.0, 1.0) };
        let stops = self.0;
        for w in stops.windows(2) {
            let ((t0, c0), (t1, c1)) = (w[0], w[1]);
            if t <= t1 {
                let u = if t1 > t0 { (t - t0) / (t1 - t0) } else { 0.0 };
                let mix =
                    |a: u8, b: u8| (f64::from(a) + u * (f64::from(b) - f64::from(a))).round() as u8;
                return [mix(c0[0], c1[0]), mix(c0[1], c1[1]), mix(c0[2], c1[2])];
            }
        }
        stops[stops.len() - 1].1
    }
}

/// How values map to colours.
#[derive(Debug, Clone, Copy)]
pub enum Scale {
    /// One ramp from `lo` to `hi`.
    Linear {
        /// Ramp.
        ramp: Ramp,
        /// Value at the ramp start.
        lo: f64,
        /// Value at the ramp end.
        hi: f64,
    },
    /// Two ramps meeting at `mid` (0 °C), `below` under it and `above` over it, each stretched
    /// over the larger of `mid - lo` and `hi - mid` so a degree is the same step on both sides.
    Split {
        /// Ramp below `mid`.
        below: Ramp,
        /// Ramp above `mid`.
        above: Ramp,
        /// Lowest value.
        lo: f64,
        /// Meeting value.
        mid: f64,
        /// Highest value.
        hi: f64,
    },
}

impl Scale {
    /// Colour of a value.
    pub fn colour(&self, v: f64) -> Colour {
        match *self {
            Scale::Linear { ramp, lo, hi } => ramp.at((v - lo) / (hi - lo)),
            Scale::Split {
                below,
                above,
                lo,
                mid,
                hi,
            } => {
                // Same colour change per unit on both sides: the ramps span the larger side.
                let span = (mid - lo).max(hi - mid);
                if v < mid {
                    below.at(1.0 + (v - mid) / span)
                } else {
                    above.at((v - mid) / span)
                }
            }
        }
    }

    /// Value range shown, `(lo, hi)`.
    pub fn range(&self) -> (f64, f64) {
        match *self {
            Scale::Linear { lo, hi, .. } | Scale::Split { lo, hi, .. } => (lo, hi),
        }
    }
}

/// An RGB canvas with clipped drawing.
pub struct Canvas {
    /// The pixels.
    pub img: RgbImage,
}

impl Canvas {
    /// A canvas filled with `bg`.
    pub fn new(w: u32, h: u32, bg: Colour) -> Self {
        Canvas {
            img: RgbImage::from_pixel(w, h, Rgb(bg)),
        }
    }

    /// Sets one pixel (ignored outside the canvas).
    pub fn put(&mut self, x: i64, y: i64, c: Colour) {
        if x >= 0 && y >= 0 && (x as u32) < self.img.width() && (y as u32) < self.img.height() {
            self.img.put_pixel(x as u32, y as u32, Rgb(c));
        }
    }

    /// Fills a rectangle.
    pub fn rect(&mut self, x: i64, y: i64, w: i64, h: i64, c: Colour) {
        for yy in y..y + h {
            for xx in x..x + w {
                self.put(xx, yy, c);
            }
        }
    }

    /// Outlines a rectangle, 1 px.
    pub fn frame(&mut self, x: i64, y: i64, w: i64, h: i64, c: Colour) {
        self.hline(x, x + w - 1, y, c);
        self.hline(x, x + w - 1, y + h - 1, c);
        self.vline(x, y, y + h - 1, c);
        self.vline(x + w - 1, y, y + h - 1, c);
    }

    /// Horizontal line from `x0` to `x1` inclusive.
    pub fn hline(&mut self, x0: i64, x1: i64, y: i64, c: Colour) {
        for x in x0..=x1 {
            self.put(x, y, c);
        }
    }

    /// Vertical line from `y0` to `y1` inclusive.
    pub fn vline(&mut self, x: i64, y0: i64, y1: i64, c: Colour) {
        for y in y0..=y1 {
            self.put(x, y, c);
        }
    }

    /// Horizontal dashed line alternating `a` and `b` dashes of `dash` px (visible on light and
    /// dark backgrounds alike).
    pub fn dashed_hline(&mut self, x0: i64, x1: i64, y: i64, dash: i64, a: Colour, b: Colour) {
        for x in x0..=x1 {
            let c = if ((x - x0) / dash) % 2 == 0 { a } else { b };
            self.put(x, y, c);
        }
    }

    /// Vertical dashed line, as [`Self::dashed_hline`].
    pub fn dashed_vline(&mut self, x: i64, y0: i64, y1: i64, dash: i64, a: Colour, b: Colour) {
        for y in y0..=y1 {
            let c = if ((y - y0) / dash) % 2 == 0 { a } else { b };
            self.put(x, y, c);
        }
    }

    /// Draws text with its top-left corner at `(x, y)`, glyphs scaled by `scale`. A superscript
    /// two (`²`) is drawn as the font's `2` at half size, raised.
    pub fn text(&mut self, x: i64, y: i64, s: &str, scale: i64, c: Colour) {
        let mut gx = x;
        for ch in s.chars() {
            if ch == '²' {
                let g = glyph('2');
                for row in 0..4 {
                    for col in 0..4 {
                        let hit = (0..2).any(|dy| g[2 * row + dy] & (0b11 << (2 * col)) != 0);
                        if hit {
                            self.rect(
                                gx + col as i64 * scale,
                                y + row as i64 * scale,
                                scale,
                                scale,
                                c,
                            );
                        }
                    }
                }
            } else {
                let g = glyph(ch);
                for (row, bits) in g.iter().enumerate() {
                    for col in 0..8 {
                        if bits & (1 << col) != 0 {
                            self.rect(gx + col * scale, y + row as i64 * scale, scale, scale, c);
                        }
                    }
                }
            }
            gx += advance(ch) * scale;
        }
    }

    /// Draws text turned a quarter left (reading bottom to top), its baseline start at the
    /// bottom-left `(x, y)`.
    pub fn text_up(&mut self, x: i64, y: i64, s: &str, c: Colour) {
        for (i, ch) in s.chars().enumerate() {
            let g = glyph(ch);
            let base = y - i as i64 * 8;
            for (row, bits) in g.iter().enumerate() {
                for col in 0..8i64 {
                    if bits & (1 << col) != 0 {
                        self.put(x + row as i64, base - col, c);
                    }
                }
            }
        }
    }

    /// Text on a filled box with a 2 px margin.
    pub fn label(&mut self, x: i64, y: i64, s: &str, fg: Colour, bg: Colour) {
        self.rect(x - 2, y - 2, text_width(s, 1) + 4, 12, bg);
        self.text(x, y, s, 1, fg);
    }
}

/// Width of a text in pixels.
pub fn text_width(s: &str, scale: i64) -> i64 {
    s.chars().map(advance).sum::<i64>() * scale
}

/// Horizontal advance of one character, px at scale 1.
fn advance(ch: char) -> i64 {
    if ch == '²' { 5 } else { 8 }
}

fn glyph(ch: char) -> [u8; 8] {
    font8x8::BASIC_FONTS
        .get(ch)
        .or_else(|| font8x8::LATIN_FONTS.get(ch))
        .or_else(|| font8x8::GREEK_FONTS.get(ch))
        .unwrap_or([0; 8])
}

/// Tick values covering `lo..=hi` at a "nice" step (1, 2 or 5 × 10ⁿ), about `target` of them.
pub fn nice_ticks(lo: f64, hi: f64, target: usize) -> Vec<f64> {
    if hi <= lo || !lo.is_finite() || !hi.is_finite() {
        return vec![lo];
    }
    let raw = (hi - lo) / target.max(1) as f64;
    let mag = 10f64.powf(raw.log10().floor());
    let step = [1.0, 2.0, 5.0, 10.0]
        .iter()
        .map(|m| m * mag)
        .find(|s| *s >= raw)
        .unwrap_or(10.0 * mag);
    let first = (lo / step).ceil() as i64;
    let last = (hi / step).floor() as i64;
    (first..=last).map(|k| k as f64 * step).collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn ramps_hit_their_ends_and_stay_in_order() {
        assert_eq!(SUNLIGHT.at(0.0), [18, 14, 34]);
        assert_eq!(SUNLIGHT.at(1.0), [252, 243, 200]);
        assert_eq!(SUNLIGHT.at(f64::NAN), [18, 14, 34]);
        // Lightness (a simple luma) rises along the sequential ramps.
        for ramp in [SUNLIGHT, DAYLIGHT, FROST] {
            let luma = |c: Colour| 0.3 * c[0] as f64 + 0.59 * c[1] as f64 + 0.11 * c[2] as f64;
            let mut last = -1.0;
            for i in 0..=50 {
                let l = luma(ramp.at(i as f64 / 50.0));
                assert!(l >= last - 0.5, "{i}");
                last = l;
            }
        }
    }

    #[test]
    fn ticks_are_round_numbers() {
        assert_eq!(nice_ticks(0.0, 24.0, 6), vec![0.0, 5.0, 10.0, 15.0, 20.0]);
        assert_eq!(
            nice_ticks(-38.0, 41.0, 8),
            vec![-30.0, -20.0, -10.0, 0.0, 10.0, 20.0, 30.0, 40.0]
        );
        assert_eq!(nice_ticks(3.0, 3.0, 5), vec![3.0]);
    }
}
