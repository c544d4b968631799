//! The year at one place (`insola year --png`): day length, noon altitude and daily insolation
//! in three panels over one time axis, the equinoxes and solstices as dashed lines across all
//! three. 960 × 720 px.

use plotters::coord::Shift;
use plotters::prelude::*;

use super::axis::Ticked;
use super::field::top_label;
use super::text;
use super::{Chart, INK, SOFT, fail, number_text};
use crate::commands::colour_map::nice_ticks;

const SIZE: (u32, u32) = (960, 720);
/// Left edge and width of the panels' plotting areas, px.
const PLOT_X: i32 = 96;
const PLOT_W: u32 = 800;
/// Top of the first panel, height of each, gap between them, px.
const TOP: i32 = 96;
const PANEL_H: u32 = 150;
const GAP: i32 = 34;
/// Width of the value-label area left of each panel, px.
const Y_LABELS: u32 = 72;

/// One panel: a named series with its unit.
pub struct Panel {
    /// Axis description, with its unit.
    pub name: String,
    /// One value per day.
    pub values: Vec<f64>,
    /// Line colour.
    pub colour: RGBColor,
    /// Value range shown; `None` for a round range around the values.
    pub range: Option<(f64, f64)>,
}

/// The year chart.
pub struct YearChart {
    /// Title.
    pub title: String,
    /// Line under the title.
    pub subtitle: String,
    /// Footnote.
    pub note: String,
    /// Time axis description.
    pub x_desc: String,
    /// The time of each value, in the time axis' days.
    pub days: Vec<f64>,
    /// Length of the axis, days.
    pub x_max: f64,
    /// The panels, top to bottom.
    pub panels: Vec<Panel>,
    /// Equinoxes and solstices: day on the time axis and name.
    pub season_marks: Vec<(f64, &'static str)>,
}

/// A round range holding `values` (at least one unit wide).
fn round_range(values: &[f64]) -> (f64, f64) {
    let lo = values.iter().copied().fold(f64::INFINITY, f64::min);
    let hi = values.iter().copied().fold(f64::NEG_INFINITY, f64::max);
    if !lo.is_finite() || !hi.is_finite() {
        return (0.0, 1.0);
    }
    let span = (hi - lo).max(1.0);
    let step = nice_ticks(0.0, span, 8).get(1).copied().unwrap_or(1.0);
    let (lo, hi) = ((lo / step).floor() * step, (hi / step).ceil() * step);
    if hi > lo { (lo, hi) } else { (lo, lo + step) }
}

impl Chart for YearChart {
    fn size(&self) -> (u32, u32) {
        SIZE
    }

    fn draw<DB: DrawingBackend>(&self, root: &DrawingArea<DB, Shift>) -> Result<(), String> {
        super::page(root, PLOT_X, &self.title, &self.subtitle, &self.note)?;
        let x_ticks = nice_ticks(0.0, self.x_max, 10);
        let label = |v: &f64| number_text(*v);
        let last = self.panels.len().saturating_sub(1);
        for (n, panel) in self.panels.iter().enumerate() {
            let top = TOP + n as i32 * (PANEL_H as i32 + GAP);
            let x_area = if n == last { 44 } else { 20 };
            let area = root.clone().shrink(
                (PLOT_X - Y_LABELS as i32, top),
                (PLOT_W + Y_LABELS, PANEL_H + x_area),
            );
            let (lo, hi) = panel.range.unwrap_or_else(|| round_range(&panel.values));
            let mut chart = ChartBuilder::on(&area)
                .y_label_area_size(Y_LABELS)
                .x_label_area_size(x_area)
                .build_cartesian_2d(
                    Ticked::new(0.0, self.x_max, x_ticks.clone()),
                    Ticked::new(lo, hi, nice_ticks(lo, hi, 5)),
                )
                .map_err(fail)?;
            let mut mesh = chart.configure_mesh();
            mesh.x_label_formatter(&label)
                .y_label_formatter(&label)
                .y_desc(panel.name.as_str())
                .light_line_style(RGBColor(236, 234, 228))
                .bold_line_style(RGBColor(222, 220, 212))
                .label_style(text::style(12.0, INK))
                .axis_desc_style(text::style(14.0, INK))
                .axis_style(INK);
            if n == last {
                mesh.x_desc(self.x_desc.as_str());
            }
            mesh.draw().map_err(fail)?;
            for (day, name) in &self.season_marks {
                chart
                    .draw_series(DashedLineSeries::new(
                        [(*day, lo), (*day, hi)],
                        4,
                        3,
                        RGBColor(120, 120, 128).stroke_width(1),
                    ))
                    .map_err(fail)?;
                if n == 0 {
                    let x = chart.backend_coord(&(*day, hi)).0;
                    top_label(root, name, (x, top - 4), (PLOT_X, PLOT_X + PLOT_W as i32))?;
                }
            }
            if lo < 0.0 && hi > 0.0 {
                // Zero (the horizon, for the noon altitude) as a solid line.
                chart
                    .draw_series(LineSeries::new(
                        [(0.0, 0.0), (self.x_max, 0.0)],
                        SOFT.stroke_width(1),
                    ))
                    .map_err(fail)?;
            }
            let points = self.days.iter().copied().zip(panel.values.iter().copied());
            chart
                .draw_series(LineSeries::new(
                    points.filter(|(_, v)| v.is_finite()),
                    panel.colour.stroke_width(2),
                ))
                .map_err(fail)?;
        }
        Ok(())
    }
}

#[cfg(test)]
mod tests {
    use super::round_range;

    #[test]
    fn ranges_are_round_and_hold_the_values() {
        assert_eq!(round_range(&[3.0, 21.5]), (0.0, 25.0));
        assert_eq!(round_range(&[-62.0, 48.0]), (-80.0, 60.0));
        let (lo, hi) = round_range(&[5.0, 5.0]);
        assert!(lo <= 5.0 && hi > 5.0);
    }
}
