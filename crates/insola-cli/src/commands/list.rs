//! `insola worlds`: the built-in worlds.

use serde::Serialize;

use crate::worlds::BUILT_IN;

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
    for (name, text) in BUILT_IN {
        let spec = insola::WorldSpec::from_ron_str(text).map_err(|e| e.to_string())?;
        entries.push(Entry {
            name: name.to_string(),
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
