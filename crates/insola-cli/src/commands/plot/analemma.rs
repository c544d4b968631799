//! The analemma (`insola sky --analemma --png`): where the star stands at the same clock time on
//! every day of one year, altitude against azimuth at equal degrees on both axes, the equinoxes
//! and solstices labelled, the ground below the horizon shaded. 960 × 640 px.

use plotters::coord::Shift;
use plotters::prelude::*;

use super::axis::Ticked;
use super::text;
use super::{Chart, INK, fail};
use crate::commands::colour_map::{SUNLIGHT, nice_ticks};

const SIZE: (u32, u32) = (960, 640);
/// The plotting area: left, top, width, height, px.
const PLOT: (i32, i32, u32, u32) = (100, 80, 800, 480);

/// One sample: azimuth (unwrapped around the figure's middle, so it may leave 0–360) and
/// altitude, degrees.
pub type Sample = (f64, f64);

/// The analemma chart.
pub struct Analemma {
    /// Title.
    pub title: String,
    /// Line under the title.
    pub subtitle: String,
    /// Footnote.
    pub note: String,
    /// One sample a day, in time order over the year.
    pub samples: Vec<Sample>,
    /// Equinoxes and solstices: the sample nearest each, and its name.
    pub marks: Vec<(Sample, &'static str)>,
}

/// Compass name of an azimuth, degrees.
fn compass(az: f64) -> &'static str {
    const NAMES: [&str; 8] = ["N", "NE", "E", "SE", "S", "SW", "W", "NW"];
    NAMES[((az.rem_euclid(360.0) + 22.5) / 45.0) as usize % 8]
}

/// Ranges holding the samples with a margin, widened so a degree is as long across as up.
fn ranges(samples: &[Sample]) -> ((f64, f64), (f64, f64)) {
    let fold = |f: fn(&Sample) -> f64| {
        samples
            .iter()
            .map(f)
            .fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), v| {
                (lo.min(v), hi.max(v))
            })
    };
    let (az, alt) = (fold(|s| s.0), fold(|s| s.1));
    let (az_mid, alt_mid) = (0.5 * (az.0 + az.1), 0.5 * (alt.0 + alt.1));
    let (w, h) = (f64::from(PLOT.2), f64::from(PLOT.3));
    // Degrees per pixel: the larger need of the two axes, with 10% margin, at least 2°/100 px.
    let per_px = ((az.1 - az.0) / w).max((alt.1 - alt.0) / h).max(0.02) * 1.2;
    (
        (az_mid - 0.5 * per_px * w, az_mid + 0.5 * per_px * w),
        (alt_mid - 0.5 * per_px * h, alt_mid + 0.5 * per_px * h),
    )
}

impl Chart for Analemma {
    fn size(&self) -> (u32, u32) {
        SIZE
    }

    fn draw<DB: DrawingBackend>(&self, root: &DrawingArea<DB, Shift>) -> Result<(), String> {
        super::page(root, PLOT.0, &self.title, &self.subtitle, &self.note)?;
        let ((x0, x1), (y0, y1)) = ranges(&self.samples);
        let (px, py, pw, ph) = PLOT;
        let area = root.clone().shrink((px - 72, py), (pw + 72, ph + 44));
        let mut chart = ChartBuilder::on(&area)
            .y_label_area_size(72)
            .x_label_area_size(44)
            .build_cartesian_2d(
                Ticked::new(x0, x1, nice_ticks(x0, x1, 10)),
                Ticked::new(y0, y1, nice_ticks(y0, y1, 8)),
            )
            .map_err(fail)?;
        if y0 < 0.0 {
            // The ground: below the horizon, the star is not seen.
            chart
                .draw_series(std::iter::once(Rectangle::new(
                    [(x0, y0), (x1, y1.min(0.0))],
                    RGBColor(226, 220, 204).filled(),
                )))
                .map_err(fail)?;
        }
        let az_label = |v: &f64| format!("{:.0}° {}", v.rem_euclid(360.0), compass(*v));
        let alt_label = |v: &f64| super::number_text(*v) + "°";
        chart
            .configure_mesh()
            .x_label_formatter(&az_label)
            .y_label_formatter(&alt_label)
            .x_desc("azimuth, degrees clockwise from north")
            .y_desc("altitude of the star's centre, degrees")
            .light_line_style(RGBColor(236, 234, 228))
            .bold_line_style(RGBColor(214, 212, 204))
            .label_style(text::style(12.0, INK))
            .axis_desc_style(text::style(14.0, INK))
            .axis_style(INK)
            .draw()
            .map_err(fail)?;
        if y0 < 0.0 && y1 > 0.0 {
            chart
                .draw_series(LineSeries::new([(x0, 0.0), (x1, 0.0)], INK.stroke_width(1)))
                .map_err(fail)?;
        }
        let n = self.samples.len().max(1);
        let mut closed = self.samples.clone();
        if let Some(&first) = self.samples.first() {
            closed.push(first);
        }
        chart
            .draw_series(LineSeries::new(
                closed,
                RGBColor(150, 140, 130).stroke_width(1),
            ))
            .map_err(fail)?;
        // Dots coloured through the year (dark at the start, pale at the end).
        chart
            .draw_series(self.samples.iter().enumerate().map(|(k, s)| {
                let c = SUNLIGHT.at(0.15 + 0.7 * k as f64 / n as f64);
                Circle::new(*s, 3, RGBColor(c[0], c[1], c[2]).filled())
            }))
            .map_err(fail)?;
        let st = text::style(12.0, INK);
        // Labels point away from the figure's middle, so two marks close together (the
        // equinoxes often are) label to opposite sides.
        let middle = chart.backend_coord(&(0.5 * (x0 + x1), 0.5 * (y0 + y1))).0;
        for (s, name) in &self.marks {
            chart
                .draw_series(std::iter::once(Circle::new(*s, 6, INK.stroke_width(2))))
                .map_err(fail)?;
            let (cx, cy) = chart.backend_coord(s);
            let w = text::width(name, &st);
            let right = cx >= middle;
            let x = if (right && cx + 11 + w < px + pw as i32) || cx - 11 - w < px {
                cx + 11
            } else {
                cx - 11 - w
            };
            text::label(root, name, (x, cy - 7), &st, super::BACKGROUND)?;
        }
        Ok(())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn compass_points_and_square_degrees() {
        assert_eq!(compass(0.0), "N");
        assert_eq!(compass(181.0), "S");
        assert_eq!(compass(-90.0), "W");
        assert_eq!(compass(400.0), "NE");
        let ((x0, x1), (y0, y1)) = ranges(&[(170.0, 20.0), (190.0, 60.0)]);
        let (w, h) = (f64::from(PLOT.2), f64::from(PLOT.3));
        assert!(((x1 - x0) / w - (y1 - y0) / h).abs() < 1e-12);
        assert!(x0 < 170.0 && x1 > 190.0 && y0 < 20.0 && y1 > 60.0);
    }
}
