//! A page's content stream written as bytes (ISO 32000-1, 8 and 9: path, colour and text operators).
//!
//! The page is drawn straight into the stream's text, not through a list of operation objects that a
//! later pass turns into text: that pass was a quarter of the demo run's time (docs/speed.md). Numbers
//! are written with a fixed number of decimals, trailing zeros dropped, never `-0`.

/// The content stream of one page being written.
#[derive(Debug, Default, Clone, PartialEq, Eq)]
pub(crate) struct Content {
    bytes: Vec<u8>,
}

/// Decimals for coordinates and widths in points: 0.01 pt (0.0035 mm) is far below what a printer or a
/// reader sees.
const POINT_DECIMALS: u32 = 2;

/// Decimals for grey levels: the report's levels are set to three.
const LEVEL_DECIMALS: u32 = 3;

impl Content {
    pub(crate) fn into_bytes(self) -> Vec<u8> {
        self.bytes
    }

    #[cfg(test)]
    pub(crate) fn as_bytes(&self) -> &[u8] {
        &self.bytes
    }

    pub(crate) fn append(&mut self, other: &Content) {
        self.bytes.extend_from_slice(&other.bytes);
    }

    /// An operator and the end of its line.
    pub(crate) fn op(&mut self, operator: &str) {
        self.bytes.extend_from_slice(operator.as_bytes());
        self.bytes.push(b'\n');
    }

    /// A number in points followed by a space.
    pub(crate) fn pt(&mut self, value: f64) {
        self.number::<POINT_DECIMALS>(value);
        self.bytes.push(b' ');
    }

    /// A grey level (0 black, 1 white) followed by a space.
    pub(crate) fn level(&mut self, value: f64) {
        self.number::<LEVEL_DECIMALS>(value.clamp(0.0, 1.0));
        self.bytes.push(b' ');
    }

    /// A name operand (`/F5 `).
    pub(crate) fn name(&mut self, name: &str) {
        self.bytes.push(b'/');
        self.bytes.extend_from_slice(name.as_bytes());
        self.bytes.push(b' ');
    }

    /// An array of numbers in points (`[3 1.6] `).
    pub(crate) fn pt_array(&mut self, values: &[f64]) {
        self.bytes.push(b'[');
        for (index, value) in values.iter().enumerate() {
            if index > 0 {
                self.bytes.push(b' ');
            }
            self.number::<POINT_DECIMALS>(*value);
        }
        self.bytes.extend_from_slice(b"] ");
    }

    /// A literal string of single-byte codes (`(text) `), with the characters the syntax reserves and
    /// every byte below 0x20 escaped.
    pub(crate) fn string(&mut self, codes: impl Iterator<Item = u8>) {
        self.bytes.push(b'(');
        for code in codes {
            match code {
                b'(' | b')' | b'\\' => self.bytes.extend_from_slice(&[b'\\', code]),
                0..=0x1F => {
                    self.bytes.push(b'\\');
                    self.bytes.extend_from_slice(&[
                        b'0' + (code >> 6),
                        b'0' + ((code >> 3) & 7),
                        b'0' + (code & 7),
                    ]);
                }
                _ => self.bytes.push(code),
            }
        }
        self.bytes.extend_from_slice(b") ");
    }

    /// `value` rounded to `DECIMALS` places, trailing zeros and a bare point dropped; a value that rounds to
    /// zero is `0`, never `-0`. Values beyond what a page can hold are clamped (the drawing keeps to
    /// the page; this only keeps a wild value from printing as an exponent or `inf`).
    fn number<const DECIMALS: u32>(&mut self, value: f64) {
        const LIMIT: f64 = 1.0e9;
        let value = if value.is_finite() {
            value.clamp(-LIMIT, LIMIT)
        } else {
            0.0
        };
        let scale = 10_u64.pow(DECIMALS);
        // Half away from zero, as `f64::round`, without the library call (this runs for every coordinate).
        let magnitude = (value.abs() * scale as f64 + 0.5) as u64;
        if value < 0.0 && magnitude != 0 {
            self.bytes.push(b'-');
        }
        self.digits(magnitude / scale);
        let mut fraction = magnitude % scale;
        if fraction == 0 {
            return;
        }
        self.bytes.push(b'.');
        let mut place = scale / 10;
        while fraction > 0 {
            self.bytes.push(b'0' + (fraction / place) as u8);
            fraction %= place;
            place /= 10;
        }
    }

    fn digits(&mut self, value: u64) {
        if value < 10 {
            self.bytes.push(b'0' + value as u8);
            return;
        }
        let mut buffer = [0u8; 20];
        let mut at = buffer.len();
        let mut rest = value;
        loop {
            at -= 1;
            buffer[at] = b'0' + (rest % 10) as u8;
            rest /= 10;
            if rest == 0 {
                break;
            }
        }
        self.bytes.extend_from_slice(&buffer[at..]);
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn written(f: impl FnOnce(&mut Content)) -> String {
        let mut content = Content::default();
        f(&mut content);
        String::from_utf8(content.into_bytes()).expect("ASCII")
    }

    #[test]
    fn numbers_drop_trailing_zeros_and_never_print_minus_zero() {
        assert_eq!(written(|c| c.pt(12.0)), "12 ");
        assert_eq!(written(|c| c.pt(0.5)), "0.5 ");
        assert_eq!(written(|c| c.pt(-3.25)), "-3.25 ");
        assert_eq!(written(|c| c.pt(1.23456)), "1.23 ");
        assert_eq!(written(|c| c.pt(0.0351)), "0.04 ");
        assert_eq!(written(|c| c.pt(-0.004)), "0 ");
        assert_eq!(written(|c| c.pt(-0.0)), "0 ");
        assert_eq!(written(|c| c.pt(841.889_763)), "841.89 ");
        assert_eq!(written(|c| c.pt(-12.305)), "-12.31 ");
        assert_eq!(written(|c| c.pt(f64::NAN)), "0 ");
        assert_eq!(written(|c| c.pt(1.0e12)), "1000000000 ");
        assert_eq!(written(|c| c.level(0.585)), "0.585 ");
        assert_eq!(written(|c| c.level(1.7)), "1 ");
    }

    #[test]
    fn strings_escape_what_the_syntax_reserves() {
        assert_eq!(
            written(|c| c.string(b"a(b)c\\d\ne".iter().copied())),
            "(a\\(b\\)c\\\\d\\012e) "
        );
        let mut content = Content::default();
        content.string([0xE9].into_iter());
        assert_eq!(content.into_bytes(), b"(\xE9) ".to_vec());
    }

    #[test]
    fn arrays_and_names() {
        assert_eq!(written(|c| c.pt_array(&[3.0, 1.6])), "[3 1.6] ");
        assert_eq!(written(|c| c.pt_array(&[])), "[] ");
        assert_eq!(written(|c| c.name("F5")), "/F5 ");
    }
}
