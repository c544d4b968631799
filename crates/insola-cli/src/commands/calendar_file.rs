//! Writing a calendar section into a world file while keeping the rest of the text: the
//! top-level `calendar: (…)` entry (and the comment lines right above it from the first one
//! starting with `// Calendar`) is replaced, or a new one is added before the world's closing parenthesis.
//! Everything else — other sections, comments, layout — is left byte for byte.

use insola::calendar::{CalendarSpec, LeapRule, MoonMonthsSpec};

/// Text spans of the top-level tuple found by [`scan`].
struct Layout {
    /// Byte range of an existing `calendar: (…)` entry, with its trailing comma.
    calendar: Option<(usize, usize)>,
    /// Byte offset of the world's closing parenthesis.
    close: usize,
    /// Byte offset just after the last code character before `close` (not a comment).
    last_code_end: usize,
}

/// Finds the world's top-level entries, skipping strings and comments.
fn scan(text: &str) -> Result<Layout, String> {
    let bytes = text.as_bytes();
    let (mut i, mut depth) = (0usize, 0i32);
    let mut calendar_key: Option<usize> = None;
    let mut calendar: Option<(usize, usize)> = None;
    let mut last_code_end = 0usize;
    while i < bytes.len() {
        let c = bytes[i];
        if c == b'/' && bytes.get(i + 1) == Some(&b'/') {
            while i < bytes.len() && bytes[i] != b'\n' {
                i += 1;
            }
            continue;
        }
        if c == b'/' && bytes.get(i + 1) == Some(&b'*') {
            i += 2;
            while i + 1 < bytes.len() && !(bytes[i] == b'*' && bytes[i + 1] == b'/') {
                i += 1;
            }
            i += 2;
            continue;
        }
        if c == b'"' {
            i += 1;
            while i < bytes.len() && bytes[i] != b'"' {
                i += if bytes[i] == b'\\' { 2 } else { 1 };
            }
            i += 1;
            last_code_end = i;
            continue;
        }
        match c {
            b'(' | b'[' | b'{' => depth += 1,
            b')' | b']' | b'}' => {
                depth -= 1;
                if depth == 0 && c == b')' {
                    return Ok(Layout {
                        calendar,
                        close: i,
                        last_code_end,
                    });
                }
                if depth == 1
                    && let Some(start) = calendar_key.take()
                {
                    let mut end = i + 1;
                    let rest = &text[end..];
                    let skipped = rest.len() - rest.trim_start_matches([' ', '\t']).len();
                    if rest[skipped..].starts_with(',') {
                        end += skipped + 1;
                    }
                    calendar = Some((start, end));
                }
            }
            _ => {}
        }
        if depth == 1 && text[i..].starts_with("calendar") {
            let after = text[i + 8..].trim_start();
            let word_start =
                i == 0 || !(bytes[i - 1].is_ascii_alphanumeric() || bytes[i - 1] == b'_');
            if word_start && after.starts_with(':') {
                calendar_key = Some(i);
            }
        }
        if !c.is_ascii_whitespace() {
            last_code_end = i + 1;
        }
        i += 1;
    }
    Err("the world file has no closing parenthesis".into())
}

/// The calendar section as RON text, indented by four spaces, ending in a newline.
pub fn section_text(spec: &CalendarSpec, comment: &[String]) -> String {
    let mut out = String::new();
    for line in comment {
        out.push_str(&format!("    // {line}\n"));
    }
    out.push_str("    calendar: (\n");
    out.push_str(&format!("        first_year: {},\n", spec.first_year));
    if let Some(n) = spec.year_days {
        out.push_str(&format!("        year_days: {n},\n"));
    }
    if let Some(rule) = &spec.leap {
        out.push_str(&format!("        leap: {},\n", rule_text(rule)));
    }
    if let Some(m) = &spec.leap_month {
        out.push_str(&format!("        leap_month: {m:?},\n"));
    }
    if let Some(m) = &spec.moon_months {
        out.push_str(&moon_months_text(m));
    }
    if let Some(w) = &spec.week {
        let names: Vec<String> = w.names.iter().map(|n| format!("{n:?}")).collect();
        out.push_str(&format!(
            "        week: (days: {}, names: [{}], first_weekday: {}),\n",
            w.days,
            names.join(", "),
            w.first_weekday
        ));
    }
    if !spec.months.is_empty() {
        out.push_str("        months: [\n");
        for m in &spec.months {
            out.push_str(&format!(
                "            (name: {:?}, days: {}),\n",
                m.name, m.days
            ));
        }
        out.push_str("        ],\n");
    }
    out.push_str("    ),\n");
    out
}

/// The `moon_months: (…)` entry, indented by eight spaces, ending in a newline.
fn moon_months_text(m: &MoonMonthsSpec) -> String {
    let mut out = String::from("        moon_months: (\n");
    let mut line = |text: String| out.push_str(&format!("            {text},\n"));
    line(format!("moon: {:?}", m.moon));
    line(format!("short_month_days: {}", m.short_month_days));
    line(format!("long_months: {}", m.long_months));
    line(format!("cycle_months: {}", m.cycle_months));
    line(format!("first_month_day: {}", m.first_month_day));
    line(format!("year_months: {}", m.year_months));
    if let Some(rule) = &m.intercalary {
        line(format!("intercalary: {}", rule_text(rule)));
    }
    if !m.month_names.is_empty() {
        let names: Vec<String> = m.month_names.iter().map(|n| format!("{n:?}")).collect();
        line(format!("month_names: [{}]", names.join(", ")));
    }
    if let Some(name) = &m.intercalary_month {
        line(format!("intercalary_month: {name:?}"));
    }
    if let Some(after) = &m.intercalary_after {
        line(format!("intercalary_after: {after:?}"));
    }
    out.push_str("        ),\n");
    out
}

fn rule_text(rule: &LeapRule) -> String {
    if rule.exceptions.is_empty() {
        format!(
            "(leap_years: {}, cycle_years: {})",
            rule.leap_years, rule.cycle_years
        )
    } else {
        let ex: Vec<String> = rule.exceptions.iter().map(u32::to_string).collect();
        format!(
            "(leap_years: {}, cycle_years: {}, exceptions: [{}])",
            rule.leap_years,
            rule.cycle_years,
            ex.join(", ")
        )
    }
}

/// `text` with its calendar section replaced by (or extended with) `section`.
pub fn with_section(text: &str, section: &str) -> Result<String, String> {
    let layout = scan(text)?;
    match layout.calendar {
        Some((start, end)) => {
            // Start of the key's line, and of the `// Calendar` comment lines right above it.
            let mut line_start = text[..start].rfind('\n').map_or(0, |i| i + 1);
            if !text[line_start..start].trim().is_empty() {
                return Err("the calendar entry does not start its own line".into());
            }
            // The comment block right above the key, from its topmost `// Calendar` line.
            let (mut probe, mut from) = (line_start, line_start);
            while probe > 0 {
                let prev_start = text[..probe - 1].rfind('\n').map_or(0, |i| i + 1);
                let line = text[prev_start..probe].trim_start();
                if !line.starts_with("//") {
                    break;
                }
                if line.starts_with("// Calendar") {
                    from = prev_start;
                }
                probe = prev_start;
            }
            line_start = from;
            let mut end = end;
            if text[end..].starts_with('\n') {
                end += 1;
            }
            Ok(format!("{}{section}{}", &text[..line_start], &text[end..]))
        }
        None => {
            let head = &text[..layout.last_code_end];
            let comma = if head.ends_with(',') || head.ends_with('(') {
                ""
            } else {
                ","
            };
            let mut middle = text[layout.last_code_end..layout.close].to_string();
            if !middle.ends_with('\n') {
                middle.push('\n');
            }
            Ok(format!(
                "{head}{comma}{middle}{section}{}",
                &text[layout.close..]
            ))
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    const WORLD: &str = "// A world.\n(\n    name: \"A (calendar: no)\", // calendar: nope\n    spin: (x: 1),\n    // Calendar old note\n    calendar: (first_year: 3),\n    moons: [],\n)\n";

    #[test]
    fn replaces_the_section_and_keeps_the_rest() {
        let new = with_section(WORLD, "    calendar: (first_year: 9),\n").unwrap();
        assert_eq!(
            new,
            "// A world.\n(\n    name: \"A (calendar: no)\", // calendar: nope\n    spin: (x: 1),\n    calendar: (first_year: 9),\n    moons: [],\n)\n"
        );
    }

    #[test]
    fn moon_months_read_back() {
        let world = insola::built_in_worlds::BUILT_IN_WORLDS
            .iter()
            .find(|w| w.name == "verdance")
            .unwrap();
        let spec = CalendarSpec {
            moon_months: Some(MoonMonthsSpec {
                moon: "Ossel".into(),
                short_month_days: 27,
                long_months: 11,
                cycle_months: 14,
                first_month_day: -3,
                year_months: 13,
                intercalary: Some(LeapRule {
                    leap_years: 11,
                    cycle_years: 16,
                    exceptions: vec![],
                }),
                month_names: (1..=13).map(|i| format!("Moon{i}x")).collect(),
                intercalary_month: Some("Deepmoon".into()),
                intercalary_after: Some("Moon6x".into()),
            }),
            ..CalendarSpec::default()
        };
        let text = with_section(world.ron, &section_text(&spec, &["Calendar x".into()])).unwrap();
        let back = insola::WorldSpec::from_ron_str(&text).unwrap();
        assert_eq!(back.calendar, Some(spec));
    }

    #[test]
    fn adds_a_section_before_the_end() {
        let text = "(\n    name: \"B\",\n    spin: (x: 1)\n    // last words\n)\n";
        let new = with_section(text, "    calendar: (),\n").unwrap();
        assert_eq!(
            new,
            "(\n    name: \"B\",\n    spin: (x: 1),\n    // last words\n    calendar: (),\n)\n"
        );
    }
}
