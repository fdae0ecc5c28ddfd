//! CSV lines with RFC 4180 quoting: the batch input and every CSV export,
//! and the reference tables of the check suite.

/// Quotes a CSV field when needed.
pub fn csv_field(s: &str) -> String {
    if s.contains([',', '"', '\n']) {
        format!("\"{}\"", s.replace('"', "\"\""))
    } else {
        s.to_string()
    }
}

/// Splits one CSV line (RFC 4180 quoting).
pub fn split_csv(line: &str) -> Vec<String> {
    let mut fields = Vec::new();
    let mut cur = String::new();
    let mut quoted = false;
    let mut chars = line.chars().peekable();
    while let Some(c) = chars.next() {
        match (c, quoted) {
            ('"', true) if chars.peek() == Some(&'"') => {
                cur.push('"');
                chars.next();
            }
            ('"', _) => quoted = !quoted,
            (',', false) => fields.push(std::mem::take(&mut cur)),
            _ => cur.push(c),
        }
    }
    fields.push(cur);
    fields
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn csv_splits_quoted_fields() {
        assert_eq!(
            split_csv(r#"a,"b, c","d ""q""""#),
            vec!["a", "b, c", r#"d "q""#]
        );
        assert_eq!(csv_field("x,y"), "\"x,y\"");
        assert_eq!(split_csv(&csv_field(r#"a "b", c"#)), vec![r#"a "b", c"#]);
    }
}
