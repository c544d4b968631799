//! An axis with ticks where the chart wants them (every 30° of latitude, round days), which
//! `plotters`' own numeric axes cannot be told.

use std::ops::Range;

use plotters::coord::ranged1d::{DefaultFormatting, KeyPointHint, Ranged};

/// A linear `f64` axis from `lo` to `hi` with the given tick positions.
#[derive(Debug, Clone)]
pub struct Ticked {
    /// Value at the start.
    pub lo: f64,
    /// Value at the end.
    pub hi: f64,
    /// Tick positions.
    pub ticks: Vec<f64>,
}

impl Ticked {
    /// An axis over `lo..hi` with ticks at `ticks`.
    pub fn new(lo: f64, hi: f64, ticks: Vec<f64>) -> Self {
        Ticked { lo, hi, ticks }
    }
}

impl Ranged for Ticked {
    // Labels come from each chart's own formatter; the default formatting is never shown.
    type FormatOption = DefaultFormatting;
    type ValueType = f64;

    fn map(&self, value: &f64, limit: (i32, i32)) -> i32 {
        let t = (value - self.lo) / (self.hi - self.lo);
        let span = f64::from(limit.1 - limit.0);
        if !t.is_finite() {
            return limit.0;
        }
        limit.0 + (span * t).round() as i32
    }

    fn key_points<Hint: KeyPointHint>(&self, _hint: Hint) -> Vec<f64> {
        self.ticks.clone()
    }

    fn range(&self) -> Range<f64> {
        self.lo..self.hi
    }
}
