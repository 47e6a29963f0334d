//! Whether two values are the same as written, NaN included.
//!
//! A recipe may hold NaN (read from a file as written, so that nothing is lost), and NaN is
//! unequal to itself under `PartialEq`: every "has it changed?" check would then answer yes on
//! every frame, recomputing the figures and rewriting the working copy for ever. Two values
//! are the same here when they are equal or when every field prints alike (`Debug` writes an
//! `f64` exactly, NaN as "NaN"); the printing is only done when `==` says they differ.

use std::fmt::Debug;

/// True when `a` and `b` hold the same values, a NaN matching a NaN in the same place.
pub fn same<T: PartialEq + Debug + ?Sized>(a: &T, b: &T) -> bool {
    a == b || format!("{a:?}") == format!("{b:?}")
}

#[cfg(test)]
mod tests {
    use super::same;

    #[test]
    fn nan_matches_nan_and_nothing_else() {
        assert!(same(&f64::NAN, &f64::NAN));
        assert!(same(&[1.0, f64::NAN], &[1.0, f64::NAN]));
        assert!(!same(&[1.0, f64::NAN], &[2.0, f64::NAN]));
        assert!(!same(&f64::NAN, &1.0));
        assert!(same(&0.1, &0.1));
        assert!(!same(&0.1, &0.1000000000000001));
    }
}
