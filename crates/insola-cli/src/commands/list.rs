//! `insola worlds`: the built-in worlds.

use serde::Serialize;

use insola::built_in_worlds::BUILT_IN_WORLDS;

/// Arguments of `insola worlds`.
#[derive(Debug, clap::Args)]
pub struct Args {
    /// Print JSON instead of text.
    #[arg(long)]
    json: bool,
}

#[derive(Serialize)]
struct Entry {
    name: String,
    title: String,
    description: String,
    reference: bool,
}

/// Runs the command.
pub fn run(args: Args) -> Result<(), String> {
    let mut entries = Vec::new();
    for world in BUILT_IN_WORLDS {
        let spec = world.spec().map_err(|e| e.to_string())?;
        entries.push(Entry {
            name: world.name.to_string(),
            title: spec.name,
            description: spec.description,
            reference: spec.reference,
        });
    }
    if args.json {
        return super::output::print_json(&entries);
    }
    for e in entries {
        let mark = if e.reference {
            " (validation reference, not game content)"
        } else {
            ""
        };
        say!("{:<16} {}{mark}: {}", e.name, e.title, e.description);
    }
    Ok(())
}
