//! Events that need no search: new local days, new calendar years, equinoxes and solstices.

use super::kind::{SkyEvent, SkyEventKind};
use crate::planet::Planet;
use crate::seasons::SeasonMark;
use crate::sky::Place;

impl Planet {
    /// New calendar years in `[from_s, to_s)`: each year starts at the local mean midnight at
    /// the prime meridian that the world's calendar (its leap rule) gives it, as
    /// [`Planet::date_at`] counts them.
    pub(super) fn new_years_into(&self, from_s: f64, to_s: f64, out: &mut Vec<SkyEvent>) {
        // The year holding `from_s` may itself start at `from_s`.
        let mut year = self.date_at(from_s).year;
        loop {
            let at_s = self.year_start_s(year);
            // Written to stop on NaN as well.
            if at_s.partial_cmp(&to_s) != Some(std::cmp::Ordering::Less) {
                break;
            }
            if at_s >= from_s {
                out.push(SkyEvent {
                    at_s,
                    kind: SkyEventKind::NewYear { year },
                });
            }
            year = year.saturating_add(1);
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
