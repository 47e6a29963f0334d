//! Numbers in the file's units (mm, pF, MHz, percent) as decimal text, exactly: the digits in
//! the file are the shortest digits of the SI value with the decimal point moved. Reading
//! parses the written digits with the exponent moved back, so "6.8" pF is exactly the SI
//! literal 6.8e-12 F, and any SI value is written in digits that read back to the same bits
//! (a product like 6.8 × 1e-12 would not be).

/// The SI value of a number written as `token` in units of 10^-exp of SI (mm: exp = 3).
/// `None` when the token is not a number.
pub(crate) fn si_from_text(token: &str, exp: i32) -> Option<f64> {
    let token: String = token.chars().filter(|&c| c != '_').collect();
    let token = token.trim();
    let plain: f64 = token.parse().ok()?;
    // NaN and infinity pass through (validation refuses them); a finite token that only
    // overflows in its own unit is shifted like any other.
    if plain.is_nan() || plain == 0.0 || token.to_ascii_lowercase().contains("inf") {
        return Some(plain);
    }
    let (mantissa, exponent) = match token.split_once(['e', 'E']) {
        Some((m, e)) => (m, e.parse::<i32>().ok()?),
        None => (token, 0),
    };
    format!("{mantissa}e{}", exponent.saturating_sub(exp))
        .parse()
        .ok()
}

/// Largest exponent (in file units) still written without an exponent.
const PLAIN_MAX: i32 = 15;
/// Smallest exponent still written without an exponent.
const PLAIN_MIN: i32 = -7;

/// `si` written in units of 10^-exp of SI, as RON number text that [`si_from_text`] reads back
/// to exactly `si`.
pub(crate) fn text_from_si(si: f64, exp: i32) -> String {
    if !si.is_finite() {
        return format!("{si:?}");
    }
    let printed = format!("{si:e}");
    let Some((mantissa, exponent)) = printed.split_once('e') else {
        return format!("{si:?}");
    };
    let Ok(exponent) = exponent.parse::<i32>() else {
        return format!("{si:?}");
    };
    let (sign, mantissa) = match mantissa.strip_prefix('-') {
        Some(m) => ("-", m),
        None => ("", mantissa),
    };
    let digits: String = mantissa.chars().filter(char::is_ascii_digit).collect();
    let n = exponent.saturating_add(exp);
    if si == 0.0 {
        return format!("{sign}0.0");
    }
    if !(PLAIN_MIN..=PLAIN_MAX).contains(&n) {
        let (first, rest) = digits.split_at(1);
        let rest = if rest.is_empty() { "0" } else { rest };
        return format!("{sign}{first}.{rest}e{n}");
    }
    // Digits before the decimal point.
    let point = n + 1;
    let body = if point <= 0 {
        format!("0.{}{digits}", "0".repeat(point.unsigned_abs() as usize))
    } else {
        let point = point as usize;
        if point >= digits.len() {
            format!("{digits}{}.0", "0".repeat(point - digits.len()))
        } else {
            format!("{}.{}", &digits[..point], &digits[point..])
        }
    };
    format!("{sign}{body}")
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn typed_digits_land_on_the_si_literal() {
        assert_eq!(si_from_text("6.8", 12), Some(6.8e-12));
        assert_eq!(si_from_text("98.7", -6), Some(98.7e6));
        assert_eq!(si_from_text("0.35", 3), Some(0.35e-3));
        assert_eq!(si_from_text("5", 3), Some(5e-3));
        assert_eq!(si_from_text("1_000.5", 3), Some(1.0005));
        assert_eq!(si_from_text("2.5E1", 3), Some(25e-3));
        assert_eq!(si_from_text("\"five\"", 3), None);
        assert!(si_from_text("NaN", 3).is_some_and(f64::is_nan));
    }

    #[test]
    fn written_as_a_builder_reads_it() {
        assert_eq!(text_from_si(6.8e-12, 12), "6.8");
        assert_eq!(text_from_si(98.7e6, -6), "98.7");
        assert_eq!(text_from_si(0.5, 2), "50.0");
        assert_eq!(text_from_si(8e-3, 3), "8.0");
        assert_eq!(text_from_si(0.35e-3, 3), "0.35");
        assert_eq!(text_from_si(-2.5e-3, 3), "-2.5");
        assert_eq!(text_from_si(0.0, 12), "0.0");
        assert_eq!(text_from_si(1e-30, 3), "1.0e-27");
        assert_eq!(text_from_si(145.2875e6, -6), "145.2875");
    }

    #[test]
    fn every_typed_value_with_three_decimals_is_written_back_as_typed() {
        for exp in [3, 12, -6, 2] {
            for n in 0..20_000u32 {
                let typed = format!("{}.{:03}", n / 1000, n % 1000);
                let si = si_from_text(&typed, exp).unwrap();
                let back = text_from_si(si, exp);
                assert_eq!(
                    back.trim_end_matches('0').trim_end_matches('.'),
                    typed.trim_end_matches('0').trim_end_matches('.'),
                    "exp {exp}"
                );
            }
        }
    }

    #[test]
    fn any_si_value_reads_back_to_the_same_bits() {
        let mut x: u64 = 0x9E37_79B9_7F4A_7C15;
        for _ in 0..50_000 {
            x ^= x << 13;
            x ^= x >> 7;
            x ^= x << 17;
            let si = f64::from_bits(x);
            if !si.is_finite() {
                continue;
            }
            for exp in [3, 12, -6, 2] {
                let text = text_from_si(si, exp);
                assert_eq!(si_from_text(&text, exp), Some(si), "{si:e} as {text}");
            }
        }
    }
}
