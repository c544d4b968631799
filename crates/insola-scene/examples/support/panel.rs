//! The world tuner: an egui window to reshape the active world while the scene runs.
//!
//! Sliders change the world's tilt, orbit, day and year (the world is rebuilt at once); a
//! scrubber moves the clock through the day and the year; readouts and four live plots show
//! what the sky and the climate do at the scene's place; a button writes the tuned world to a
//! `*.world.ron` file. Needs the `tuning-panel` feature (bevy_egui and egui_plot).

use bevy::prelude::*;
use bevy_egui::{EguiContexts, EguiPlugin, EguiPrimaryContextPass, egui};
use bevy_insola::ActiveWorld;
use bevy_insola::prelude::*;
use egui_plot::{Heatmap, Line, Plot, PlotPoint, PlotPoints, Points};
use insola::star_track::TrackTimes;
use insola::{Place, Planet, WorldSpec};

/// Adds the world tuner window.
pub struct WorldTunerPlugin;

impl Plugin for WorldTunerPlugin {
    fn build(&self, app: &mut App) {
        if !app.is_plugin_added::<EguiPlugin>() {
            app.add_plugins(EguiPlugin::default());
        }
        app.init_resource::<TunerState>()
            .add_systems(EguiPrimaryContextPass, world_tuner_window);
    }
}

#[derive(Resource, Default)]
struct TunerState {
    /// World generation the cached plots belong to, and the latitude (centidegrees).
    cached_for: Option<(u64, i64, i64)>,
    heat_map: Vec<f64>,
    heat_max: f64,
    year_temperature: Vec<[f64; 2]>,
    analemma: Vec<[f64; 2]>,
    saved: Option<String>,
    file_name: String,
}

const MAP_ROWS: usize = 37; // latitude, every 5°
const MAP_COLUMNS: usize = 48; // fraction of the year
/// Colours of the insolation map, from none (polar night) to the most: night blue, rust, straw.
const HEAT_COLOURS: [egui::Color32; 3] = [
    egui::Color32::from_rgb(18, 22, 58),
    egui::Color32::from_rgb(170, 70, 40),
    egui::Color32::from_rgb(250, 224, 130),
];

fn world_tuner_window(
    mut contexts: EguiContexts,
    mut world: ResMut<ActiveWorld>,
    mut clock: ResMut<WorldClock>,
    mut settings: ResMut<InsolaSettings>,
    sky: Res<SkyState>,
    climate: Res<SeasonalClimate>,
    mut state: ResMut<TunerState>,
) -> Result {
    let ctx = contexts.ctx_mut()?;
    let Some(planet) = world.planet_arc() else {
        return Ok(());
    };
    let mut spec = planet.spec().clone();
    let mut changed = false;
    let place = settings.reference_place_clamped();
    let t = clock.world_time_s();

    // On the right, below the status line; scrolls when the window is short.
    egui::Window::new("World tuner")
        .anchor(egui::Align2::RIGHT_TOP, [-8.0, 36.0])
        .default_width(340.0)
        .default_height(660.0)
        .vscroll(true)
        .show(ctx, |ui| {
            ui.label(egui::RichText::new(&spec.name).strong());
            egui::CollapsingHeader::new("Shape of the world")
                .default_open(true)
                .show(ui, |ui| {
                    changed |= ui
                        .add(
                            egui::Slider::new(&mut spec.spin.obliquity_deg, 0.0..=180.0)
                                .text("tilt °"),
                        )
                        .changed();
                    changed |= ui
                        .add(
                            egui::Slider::new(&mut spec.orbit.eccentricity, 0.0..=0.9)
                                .text("eccentricity"),
                        )
                        .changed();
                    changed |= ui
                        .add(
                            egui::Slider::new(&mut spec.orbit.periapsis_longitude_deg, 0.0..=360.0)
                                .text("periapsis °"),
                        )
                        .changed();
                    if let Some(day_h) = spec.spin.solar_day_hours.as_mut() {
                        changed |= ui
                            .add(
                                egui::Slider::new(day_h, 2.0..=2000.0)
                                    .logarithmic(true)
                                    .text("day, hours"),
                            )
                            .changed();
                    } else if let Some(day_h) = spec.spin.sidereal_day_hours.as_mut() {
                        changed |= ui
                            .add(
                                egui::Slider::new(day_h, 2.0..=2000.0)
                                    .logarithmic(true)
                                    .text("sidereal day, hours"),
                            )
                            .changed();
                    } else {
                        ui.label("tidally locked: the day is the year");
                    }
                    changed |= ui
                        .add(
                            egui::Slider::new(&mut spec.orbit.period_days, 20.0..=5000.0)
                                .logarithmic(true)
                                .text("year, days"),
                        )
                        .changed();
                });
            egui::CollapsingHeader::new("Place and time")
                .default_open(true)
                .show(ui, |ui| {
                    ui.add(
                        egui::Slider::new(&mut settings.reference_latitude_deg, -90.0..=90.0)
                            .text("latitude °"),
                    );
                    let mut rate = clock.rate();
                    if ui
                        .add(
                            egui::Slider::new(&mut rate, 1.0..=1.0e7)
                                .logarithmic(true)
                                .text("time rate ×"),
                        )
                        .changed()
                    {
                        let _ = clock.set_rate(rate);
                    }
                    let day_h = planet.day_s() / 3600.0;
                    let count = planet.local_day_count(t, place.longitude_rad);
                    let year_days = planet.year_in_solar_days();
                    let mut day_of_year = (sky.date.year_fraction * year_days).floor();
                    let mut hour = count.rem_euclid(1.0) * day_h;
                    let day_changed = year_days.is_finite()
                        && ui
                            .add(
                                egui::Slider::new(
                                    &mut day_of_year,
                                    0.0..=year_days.floor().max(1.0),
                                )
                                .text("day of year"),
                            )
                            .changed();
                    let hour_changed = ui
                        .add(egui::Slider::new(&mut hour, 0.0..=day_h).text("local hour"))
                        .changed();
                    if day_changed || hour_changed {
                        let year_start_days = count - sky.date.year_fraction * year_days.min(1e12);
                        let target = if day_changed {
                            year_start_days.floor() + day_of_year + hour / day_h
                        } else {
                            count.floor() + hour / day_h
                        };
                        clock.jump_to(WorldInstant::from_secs_f64(
                            planet.local_day_start_s(target, place.longitude_rad),
                        ));
                    }
                    ui.horizontal(|ui| {
                        if ui
                            .button(if clock.is_paused() { "run" } else { "hold" })
                            .clicked()
                        {
                            clock.toggle_pause();
                        }
                        if ui.button("+1 day").clicked() {
                            let _ = clock.step(planet.day_s());
                        }
                        if ui.button("+1 season").clicked() {
                            let _ = clock.step(planet.year_s() / 4.0);
                        }
                    });
                });
            egui::CollapsingHeader::new("Today here")
                .default_open(true)
                .show(ui, |ui| {
                    readouts(ui, &planet, place, t, &sky, &climate);
                });
            egui::CollapsingHeader::new("Plots")
                .default_open(true)
                .show(ui, |ui| {
                    refresh_plots(&mut state, &planet, place, world.generation(), &climate);
                    plots(ui, &planet, place, t, &sky, &state);
                });
            ui.separator();
            if state.file_name.is_empty() {
                state.file_name = format!("{}-tuned.world.ron", slug(&spec.name));
            }
            ui.horizontal(|ui| {
                ui.text_edit_singleline(&mut state.file_name);
                if ui.button("save world").clicked() {
                    state.saved = Some(save_world(planet.spec(), &state.file_name));
                }
            });
            if let Some(message) = &state.saved {
                ui.label(message);
            }
        });

    if changed {
        // A world that fails its checks is reported by the plugin and the last good one kept.
        if let Err(e) = world.set_spec(&spec) {
            state.saved = Some(format!("not applied: {e}"));
        }
    }
    Ok(())
}

fn slug(name: &str) -> String {
    name.chars()
        .map(|c| {
            if c.is_ascii_alphanumeric() {
                c.to_ascii_lowercase()
            } else {
                '-'
            }
        })
        .collect()
}

fn save_world(spec: &WorldSpec, file_name: &str) -> String {
    let name = file_name.trim();
    if !name.ends_with(".world.ron") || name.contains(['/', '\\']) {
        return "the file name must end in .world.ron (no folders)".into();
    }
    let text = spec.to_ron_string();
    match std::fs::write(name, text) {
        Ok(()) => format!("saved {name}"),
        Err(e) => format!("cannot write {name}: {e}"),
    }
}

fn hours_text(events_day_start: f64, t: Option<f64>) -> String {
    match t {
        Some(t) => {
            let h = (t - events_day_start) / 3600.0;
            format!(
                "{:02}:{:02}",
                h.floor() as i64,
                ((h.fract()) * 60.0).floor() as i64
            )
        }
        None => "—".into(),
    }
}

fn readouts(
    ui: &mut egui::Ui,
    planet: &Planet,
    place: Place,
    t: f64,
    sky: &SkyState,
    climate: &SeasonalClimate,
) {
    let day = planet.local_day_count(t, place.longitude_rad).floor() as i64;
    let events = planet.day_events(day, place);
    let daylight_h = events.sunlight.time_above_s / 3600.0;
    let polar = match events.sunlight.polar {
        Some(insola::events::Polar::Day) => " (the star does not set)",
        Some(insola::events::Polar::Night) => " (the star does not rise)",
        None => "",
    };
    let temperature = climate
        .local_temperature_c(planet, place, t)
        .map_or("computing…".to_string(), |c| format!("{c:.1} °C"));
    egui::Grid::new("today").num_columns(2).show(ui, |ui| {
        ui.label("star rises");
        ui.label(hours_text(events.day_start_s, events.sunlight.rise_s));
        ui.end_row();
        ui.label("star sets");
        ui.label(hours_text(events.day_start_s, events.sunlight.set_s));
        ui.end_row();
        ui.label("daylight");
        ui.label(format!(
            "{daylight_h:.1} h of {:.1} h{polar}",
            events.day_length_s / 3600.0
        ));
        ui.end_row();
        ui.label("star now");
        ui.label(format!(
            "{:+.1}° high, {}",
            sky.star.altitude_rad.to_degrees(),
            sky.phase
        ));
        ui.end_row();
        ui.label("season");
        ui.label(sky.season.to_string());
        ui.end_row();
        ui.label("temperature");
        ui.label(temperature);
        ui.end_row();
    });
}

fn refresh_plots(
    state: &mut TunerState,
    planet: &Planet,
    place: Place,
    generation: u64,
    climate: &SeasonalClimate,
) {
    let lat_key = (place.latitude_rad.to_degrees() * 100.0).round() as i64;
    // The climate arrives a little after the world (it is computed in the background).
    let climate_key = i64::from(climate.is_current(generation));
    let key = (generation, lat_key, climate_key);
    if state.cached_for == Some(key) {
        return;
    }
    state.cached_for = Some(key);
    let year_s = planet.year_s();
    // Daily mean insolation over latitude × time of year (rows from the south pole up, as
    // egui_plot draws them).
    state.heat_map.clear();
    for row in 0..MAP_ROWS {
        let lat = (-90.0 + 180.0 * row as f64 / (MAP_ROWS - 1) as f64).to_radians();
        for col in 0..MAP_COLUMNS {
            let f = (col as f64 + 0.5) / MAP_COLUMNS as f64;
            let q = planet.daily_mean_insolation_w_m2(f * year_s, lat);
            state.heat_map.push(if q.is_finite() { q } else { 0.0 });
        }
    }
    state.heat_max = state.heat_map.iter().copied().fold(1.0, f64::max);
    // Temperature through the year at this latitude.
    state.year_temperature = (0..=96)
        .filter_map(|i| {
            let f = i as f64 / 96.0;
            climate
                .zonal_temperature_c(place.latitude_rad, f * year_s)
                .map(|c| [f, c])
        })
        .collect();
    // The analemma: where the star stands at the same clock time on each day of the year, as
    // one time series at the place (the core's `star_track`).
    let days = planet.year_in_solar_days();
    state.analemma.clear();
    if days.is_finite() && days >= 2.0 {
        let step = (days / 240.0).max(1.0);
        let times: Vec<f64> = (0..)
            .map(|k| k as f64 * step)
            .take_while(|d| *d < days)
            .map(|d| planet.local_day_start_s(d.floor() + 0.5, place.longitude_rad))
            .collect();
        let mut track = vec![planet.star_position(0.0, place); times.len()];
        if planet
            .star_track_into(place, TrackTimes::Given(&times), &mut track)
            .is_ok()
        {
            state.analemma.extend(
                track
                    .iter()
                    .map(|s| [s.azimuth_rad.to_degrees(), s.altitude_rad.to_degrees()]),
            );
        }
    }
}

fn plots(
    ui: &mut egui::Ui,
    planet: &Planet,
    place: Place,
    t: f64,
    sky: &SkyState,
    state: &TunerState,
) {
    let height = 90.0;
    // Star altitude over today.
    let day = planet.local_day_count(t, place.longitude_rad).floor();
    let day_h = planet.day_s() / 3600.0;
    // One time series per frame: 97 instants a 96th of the day apart.
    let times = TrackTimes::Even {
        start_s: planet.local_day_start_s(day, place.longitude_rad),
        step_s: planet.day_s() / 96.0,
        count: 97,
    };
    let mut track = vec![planet.star_position(0.0, place); times.len()];
    let altitude: PlotPoints = match planet.star_track_into(place, times, &mut track) {
        Ok(()) => track
            .iter()
            .enumerate()
            .map(|(i, s)| [i as f64 / 96.0 * day_h, s.altitude_rad.to_degrees()])
            .collect(),
        Err(_) => PlotPoints::default(),
    };
    let now_h = planet
        .local_day_count(t, place.longitude_rad)
        .rem_euclid(1.0)
        * day_h;
    ui.label("star altitude today (°, by local hour)");
    Plot::new("altitude_today")
        .height(height)
        .allow_scroll(false)
        .show(ui, |plot| {
            plot.line(Line::new("altitude", altitude));
            plot.line(Line::new(
                "horizon",
                PlotPoints::from(vec![[0.0, 0.0], [day_h, 0.0]]),
            ));
            plot.points(
                Points::new("now", vec![[now_h, sky.star.altitude_rad.to_degrees()]]).radius(4.0),
            );
        });

    ui.label("daily insolation (W/m², latitude by time of year)");
    let year_f = sky.date.year_fraction;
    let lat_deg = place.latitude_rad.to_degrees();
    Plot::new("insolation_map")
        .height(height + 30.0)
        .allow_scroll(false)
        // Latitude runs from pole to pole: the axis shows −90…90 (not the tiles' half-tile
        // margin rounded up to ±100), with marks every 30°.
        .default_x_bounds(0.0, 1.0)
        .default_y_bounds(-90.0, 90.0)
        .y_grid_spacer(egui_plot::uniform_grid_spacer(|_| [90.0, 30.0, 10.0]))
        .show(ui, |plot| {
            // Tiles are 1/48 of the year wide and 5° of latitude high, the first row at 90° S.
            let tile_w = 1.0 / MAP_COLUMNS as f32;
            let tile_h = 180.0 / (MAP_ROWS - 1) as f32;
            plot.heatmap(
                Heatmap::new(state.heat_map.clone(), MAP_COLUMNS)
                    .range(0.0, state.heat_max)
                    .show_labels(false)
                    .palette(&HEAT_COLOURS)
                    .tile_size(tile_w, tile_h)
                    .at(PlotPoint::new(0.0, -90.0 - f64::from(tile_h) / 2.0))
                    .name("insolation"),
            );
            plot.points(Points::new("here and now", vec![[year_f, lat_deg]]).radius(5.0));
        });

    ui.label("temperature through the year here (°C)");
    Plot::new("temperature_year")
        .height(height)
        .allow_scroll(false)
        .show(ui, |plot| {
            if state.year_temperature.is_empty() {
                return;
            }
            plot.line(Line::new(
                "temperature",
                PlotPoints::from(state.year_temperature.clone()),
            ));
            let now_c = state
                .year_temperature
                .iter()
                .min_by(|a, b| (a[0] - year_f).abs().total_cmp(&(b[0] - year_f).abs()))
                .map_or(0.0, |p| p[1]);
            plot.points(Points::new("today", vec![[year_f, now_c]]).radius(4.0));
        });

    ui.label("analemma: the star at local noon through the year (azimuth °, altitude °)");
    Plot::new("analemma")
        .height(height + 30.0)
        .data_aspect(1.0)
        .allow_scroll(false)
        .show(ui, |plot| {
            plot.points(
                Points::new("noon star", PlotPoints::from(state.analemma.clone())).radius(1.5),
            );
        });
}
