//! UTC instants for reference worlds: RFC 3339 text to seconds and back.
//!
//! UTC is treated as a uniform time scale here (leap seconds ignored): reference worlds are for
//! checking against almanacs to minutes, not for timekeeping.

use chrono::{DateTime, NaiveDate, Utc};

/// Parses an RFC 3339 instant (`2000-01-01T12:00:00Z`) or a plain date (`2000-06-21`, taken
/// as 00:00 UTC) to seconds since the Unix epoch.
pub fn parse_utc_unix_s(text: &str) -> Result<f64, String> {
    if let Ok(dt) = DateTime::parse_from_rfc3339(text.trim()) {
        let utc = dt.with_timezone(&Utc);
        return Ok(utc.timestamp() as f64 + f64::from(utc.timestamp_subsec_nanos()) * 1e-9);
    }
    if let Ok(date) = NaiveDate::parse_from_str(text.trim(), "%Y-%m-%d") {
        let dt = date.and_hms_opt(0, 0, 0).ok_or("invalid date")?.and_utc();
        return Ok(dt.timestamp() as f64);
    }
    Err("expected an RFC 3339 instant such as 2000-01-01T12:00:00Z or a date YYYY-MM-DD".into())
}

/// Formats seconds since the Unix epoch as an RFC 3339 UTC instant (to the millisecond).
pub fn format_utc(unix_s: f64) -> String {
    let secs = unix_s.floor();
    let nanos = ((unix_s - secs) * 1e9).round().clamp(0.0, 999_999_999.0) as u32;
    match DateTime::<Utc>::from_timestamp(secs as i64, nanos) {
        Some(dt) => dt.to_rfc3339_opts(chrono::SecondsFormat::Millis, true),
        None => format!("{unix_s} s since 1970"),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn j2000_noon() {
        // 2000-01-01T12:00:00Z is 946 728 000 s after the Unix epoch (10 957.5 days; from memory).
        assert_eq!(
            parse_utc_unix_s("2000-01-01T12:00:00Z").unwrap(),
            946_728_000.0
        );
        assert_eq!(parse_utc_unix_s("2000-01-02").unwrap(), 946_771_200.0);
        assert!(parse_utc_unix_s("yesterday").is_err());
        assert_eq!(format_utc(946_728_000.0), "2000-01-01T12:00:00.000Z");
    }
}
