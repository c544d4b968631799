//! The core's modules form no import loop: for the top-level modules of `src/` (a file, or a
//! folder with everything under it), the graph of `crate::module` references in code (not in
//! comments, not in test modules) has no cycle. A loop is how the sky, its events and its
//! lighting drifted into copies of each other once; this keeps the layering visible.

use std::collections::{BTreeMap, BTreeSet};
use std::fs;
use std::path::{Path, PathBuf};

fn rust_files(dir: &Path, out: &mut Vec<PathBuf>) {
    for entry in fs::read_dir(dir).expect("src is readable") {
        let path = entry.expect("entry").path();
        if path.is_dir() {
            rust_files(&path, out);
        } else if path.extension().is_some_and(|e| e == "rs") {
            out.push(path);
        }
    }
}

/// Top-level module name → the files that make it up.
fn modules(src: &Path) -> BTreeMap<String, Vec<PathBuf>> {
    let mut mods = BTreeMap::new();
    for entry in fs::read_dir(src).expect("src is readable") {
        let path = entry.expect("entry").path();
        let name = path.file_stem().unwrap().to_string_lossy().to_string();
        if path.is_dir() {
            let mut files = Vec::new();
            rust_files(&path, &mut files);
            mods.insert(name, files);
        } else if path.extension().is_some_and(|e| e == "rs") && name != "lib" {
            mods.insert(name, vec![path]);
        }
    }
    mods
}

/// The modules `text` refers to as `crate::name`, outside comments and test modules.
fn references(text: &str, known: &BTreeSet<String>) -> BTreeSet<String> {
    let code = text.split("#[cfg(test)]").next().unwrap_or_default();
    let mut found = BTreeSet::new();
    for line in code.lines() {
        let line = line.trim_start();
        if line.starts_with("//") {
            continue;
        }
        for (i, _) in line.match_indices("crate::") {
            let rest = &line[i + "crate::".len()..];
            let name: String = rest
                .chars()
                .take_while(|c| c.is_ascii_lowercase() || c.is_ascii_digit() || *c == '_')
                .collect();
            if known.contains(&name) {
                found.insert(name);
            }
        }
    }
    found
}

#[test]
fn the_core_has_no_import_loop() {
    let src = Path::new(env!("CARGO_MANIFEST_DIR")).join("src");
    let mods = modules(&src);
    let known: BTreeSet<String> = mods.keys().cloned().collect();
    let mut edges: BTreeMap<&str, BTreeSet<String>> = BTreeMap::new();
    for (name, files) in &mods {
        let mut out = BTreeSet::new();
        for file in files {
            if file.file_name().is_some_and(|f| f == "tests.rs") {
                continue;
            }
            let text = fs::read_to_string(file).expect("source is readable");
            out.extend(references(&text, &known));
        }
        out.remove(name);
        edges.insert(name, out);
    }
    // Depth-first search for a back edge; report the loop it closes.
    fn visit<'a>(
        node: &'a str,
        edges: &'a BTreeMap<&'a str, BTreeSet<String>>,
        path: &mut Vec<&'a str>,
        done: &mut BTreeSet<&'a str>,
    ) -> Option<Vec<String>> {
        if let Some(at) = path.iter().position(|n| *n == node) {
            let mut cycle: Vec<String> = path[at..].iter().map(|s| s.to_string()).collect();
            cycle.push(node.to_string());
            return Some(cycle);
        }
        if done.contains(node) {
            return None;
        }
        path.push(node);
        for next in &edges[node] {
            if let Some(cycle) = visit(next.as_str(), edges, path, done) {
                return Some(cycle);
            }
        }
        path.pop();
        done.insert(node);
        None
    }
    let mut done = BTreeSet::new();
    for name in edges.keys() {
        let mut path = Vec::new();
        if let Some(cycle) = visit(name, &edges, &mut path, &mut done) {
            panic!("import loop: {}", cycle.join(" -> "));
        }
    }
    assert!(mods.len() > 20, "found only {} modules", mods.len());
}
