//! From a moon's proposals to a calendar section: the month rule to use, the day the first
//! month begins (the day of a new moon), and the `moon_months` entry `insola calendar --write`
//! puts in the world file.

use super::lunar::{LunarProposal, LunisolarProposal};
use crate::planet::Planet;
use crate::sky::Place;
use crate::sky_events::{EventFilter, EventGroup, MoonPhase, SkyEventKind};
use crate::world::{LeapRule, MoonMonthsSpec};

/// A month rule counts as good when it drifts at most this much against the phases (one day
/// in 1000 years), days per 1000 years.
pub const BEST_LUNAR_DRIFT_DAYS_PER_KY: f64 = 1.0;

/// The month rule a lunisolar proposal is written with: the shortest cycle drifting at most
/// [`BEST_LUNAR_DRIFT_DAYS_PER_KY`], or the closest of them all. `None` for an empty list.
pub fn best_lunar_index(list: &[LunarProposal]) -> Option<usize> {
    list.iter()
        .position(|p| p.drift_days_per_1000_years.abs() <= BEST_LUNAR_DRIFT_DAYS_PER_KY)
        .or_else(|| {
            (0..list.len()).min_by(|&a, &b| {
                list[a]
                    .drift_days_per_1000_years
                    .abs()
                    .total_cmp(&list[b].drift_days_per_1000_years.abs())
            })
        })
}

impl Planet {
    /// Moon `moon`'s new moons in `[from_s, to_s]`, world times in seconds; empty for a bad
    /// index or bad times.
    pub fn new_moons_between(&self, moon: usize, from_s: f64, to_s: f64) -> Vec<f64> {
        if moon >= self.moon_orbits().len() || !(from_s.is_finite() && to_s.is_finite()) {
            return Vec::new();
        }
        let filter = EventFilter::only([EventGroup::MoonPhase]).with_moons([moon]);
        let Ok(place) = Place::from_degrees(0.0, 0.0) else {
            return Vec::new();
        };
        self.sky_events_between(place, from_s, to_s + 1.0e-3, &filter)
            .unwrap_or_default()
            .into_iter()
            .filter(|e| {
                e.at_s <= to_s
                    && matches!(
                        e.kind,
                        SkyEventKind::MoonPhase {
                            phase: MoonPhase::New,
                            ..
                        }
                    )
            })
            .map(|e| e.at_s)
            .collect()
    }

    /// World time of moon `moon`'s last **mean** new moon at or before `t_s`, seconds: the
    /// new moons of the year before `t_s`, each moved by whole synodic months onto the last,
    /// averaged. The moon's and the planet's eccentric orbits move single new moons by hours
    /// or more; over a year their swings mostly cancel. `None` for a bad index or no new moon.
    pub fn mean_new_moon_at_or_before(&self, moon: usize, t_s: f64) -> Option<f64> {
        let orbit = self.moon_orbits().get(moon)?;
        let synodic = crate::moons::synodic_period_s(orbit.period_s, self.tropical_year_s());
        if !synodic.is_finite() {
            return None;
        }
        let span = self.tropical_year_s().max(2.0 * synodic);
        let news = self.new_moons_between(moon, t_s - span, t_s);
        let last = *news.last()?;
        let mean = news
            .iter()
            .map(|&t| {
                let months = ((last - t) / synodic).round();
                t + months * synodic - last
            })
            .sum::<f64>()
            / news.len() as f64;
        let mut at = last + mean;
        while at > t_s {
            at -= synodic;
        }
        Some(at)
    }

    /// The calendar day number whose first midnight lies nearest half a day after moon
    /// `moon`'s last mean new moon at or before the first calendar day's start (0 when none is
    /// found). The month rule's `⌊m·L/C⌋` starts months up to a day before the mean new
    /// moon; half a day later centres the new moons on the months' first midnights.
    pub fn new_moon_day(&self, moon: usize) -> i64 {
        let epoch = self.calendar_day_start_s(0);
        self.mean_new_moon_at_or_before(moon, epoch)
            .map_or(0, |t| ((t - epoch) / self.day_s() + 0.5).round() as i64)
    }

    /// The `moon_months` entry of a lunar calendar (with `lunisolar` `None`: years of
    /// ⌊months per year⌋ months) or a lunisolar one, months by `lunar`, following moon
    /// `moon` (index into the world's moons) from the day of its new moon.
    pub fn moon_months_of(
        &self,
        moon: usize,
        lunar: &LunarProposal,
        lunisolar: Option<&LunisolarProposal>,
    ) -> Option<MoonMonthsSpec> {
        let name = self.spec().moons.get(moon)?.name.clone();
        let to_u32 = |x: u64| u32::try_from(x).ok();
        let year_months = match lunisolar {
            Some(s) => to_u32(s.common_year_months)?,
            None => {
                let per_year = self.tropical_year_days() / lunar.mean_month_days;
                per_year.floor().clamp(1.0, 1000.0) as u32
            }
        };
        let intercalary = match lunisolar {
            // A month more every year is a lunar calendar of one month more.
            Some(s) if s.leap_years >= s.years => {
                return Some(MoonMonthsSpec {
                    year_months: year_months.checked_add(1)?,
                    ..self.moon_months_of(moon, lunar, None)?
                });
            }
            Some(s) if s.leap_years == 0 => None,
            Some(s) => Some(LeapRule {
                leap_years: to_u32(s.leap_years)?,
                cycle_years: to_u32(s.years)?,
                exceptions: Vec::new(),
            }),
            None => None,
        };
        Some(MoonMonthsSpec {
            moon: name,
            short_month_days: lunar.short_month_days,
            long_months: to_u32(lunar.long_months)?,
            cycle_months: to_u32(lunar.cycle_months)?,
            first_month_day: self.new_moon_day(moon),
            year_months: year_months.max(1),
            intercalary,
            month_names: Vec::new(),
            intercalary_month: None,
            intercalary_after: None,
        })
    }
}
