//! Events that need no search: new local days, new calendar years, equinoxes and solstices.

use super::kind::{SkyEvent, SkyEventKind};
use crate::planet::Planet;
use crate::seasons::SeasonMark;
use crate::sky::Place;

impl Planet {
    /// New calendar years in `[from_s, to_s)`: year `k` from time zero starts at `k` orbital
    /// periods, as [`Planet::date_at`] counts them.
    pub(super) fn new_years_into(&self, from_s: f64, to_s: f64, out: &mut Vec<SkyEvent>) {
        let year_s = self.year_s();
        let first_year = self.calendar().first_year;
        // `+ 0.0` turns the −0 that `ceil` gives just below zero into 0.
        let mut k = (from_s / year_s).ceil() + 0.0;
        while k * year_s < to_s {
            if k * year_s >= from_s {
                out.push(SkyEvent {
                    at_s: k * year_s,
                    kind: SkyEventKind::NewYear {
                        year: first_year.saturating_add(k as i64),
                    },
                });
            }
            k += 1.0;
        }
    }

    /// New local days (local mean midnight at the place's longitude) in `[from_s, to_s)`.
    pub(super) fn new_days_into(
        &self,
        place: Place,
        from_s: f64,
        to_s: f64,
        out: &mut Vec<SkyEvent>,
    ) {
        let lon = place.longitude_rad;
        let mut day = self.local_day_count(from_s, lon).floor();
        loop {
            let at_s = self.local_day_start_s(day, lon);
            if at_s >= to_s {
                break;
            }
            if at_s >= from_s {
                out.push(SkyEvent {
                    at_s,
                    kind: SkyEventKind::NewDay { day: day as i64 },
                });
            }
            day += 1.0;
        }
    }

    /// Equinoxes and solstices in `[from_s, to_s)` (exact: Kepler's equation inverted).
    pub(super) fn season_marks_into(&self, from_s: f64, to_s: f64, out: &mut Vec<SkyEvent>) {
        for mark in SeasonMark::ALL {
            let mut at_s = self.time_of_season_mark(mark, from_s);
            while at_s < to_s {
                out.push(SkyEvent {
                    at_s,
                    kind: SkyEventKind::Season(mark),
                });
                let next = self.time_of_season_mark(mark, at_s + 0.5 * self.year_s());
                if next <= at_s {
                    break;
                }
                at_s = next;
            }
        }
    }
}
