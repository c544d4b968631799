//! `insola`: the command-line almanac for invented worlds.
//!
//! Every command takes `--json`. Errors go to standard error with exit status 2.

/// Prints a line on standard output; a closed pipe (`insola year … | head`) ends the program
/// quietly instead of panicking as `println!` would.
macro_rules! say {
    ($($arg:tt)*) => {
        $crate::write_line(format_args!($($arg)*))
    };
}

mod climate_setup;
mod commands;
mod worlds;

use std::process::ExitCode;

use clap::{Parser, Subcommand};

/// Sky, seasons and climate of any planet, from a world file.
#[derive(Debug, Parser)]
#[command(name = "insola", version, about, long_about = None, after_help = commands::output::CAUTION)]
struct Cli {
    #[command(subcommand)]
    command: Command,
}

#[derive(Debug, Subcommand)]
enum Command {
    /// Validate a world file and print its derived facts and warnings.
    Check(commands::check::Args),
    /// Where the star stands, and its light, at one place and time.
    Sky(commands::sky::Args),
    /// Rise, set, transit and twilights of one local day.
    Day(commands::day::Args),
    /// Every event of the sky in an interval: rise, set, twilight, seasons, moon phases,
    /// eclipses.
    Events(commands::events::Args),
    /// One row per day of the year: daylight, noon altitude, daily insolation; `--png` draws
    /// them.
    Year(commands::year::Args),
    /// List the invented worlds built into this command.
    Worlds(commands::list::Args),
    /// Seasonal climate per latitude band: temperatures, ice, seasons; or a sweep over tilt.
    Climate(commands::climate::Args),
    /// Latitude × time-of-year heat map (PNG or SVG, and/or CSV) of sunlight, daylight or
    /// temperature; with `--land FILE` a latitude × longitude map of the climate over the land.
    Map(commands::map::Args),
    /// Leap rules, lunar and lunisolar schemes that fit the world; write one to the file.
    Calendar(commands::calendar::Args),
}

/// Writes one line to standard output; exits with status 0 on a closed pipe and 2 on any other
/// write error.
pub fn write_line(args: std::fmt::Arguments<'_>) {
    use std::io::Write;
    if let Err(e) = writeln!(std::io::stdout().lock(), "{args}") {
        if e.kind() == std::io::ErrorKind::BrokenPipe {
            std::process::exit(0);
        }
        eprintln!("insola: cannot write output: {e}");
        std::process::exit(2);
    }
}

fn main() -> ExitCode {
    let cli = Cli::parse();
    let result = match cli.command {
        Command::Check(a) => commands::check::run(a),
        Command::Sky(a) => commands::sky::run(a),
        Command::Day(a) => commands::day::run(a),
        Command::Events(a) => commands::events::run(a),
        Command::Year(a) => commands::year::run(a),
        Command::Worlds(a) => commands::list::run(a),
        Command::Climate(a) => commands::climate::run(a),
        Command::Map(a) => commands::map::run(a),
        Command::Calendar(a) => commands::calendar::run(a),
    };
    match result {
        Ok(()) => ExitCode::SUCCESS,
        Err(message) => {
            eprintln!("insola: {message}");
            ExitCode::from(2)
        }
    }
}
