//! Dense complex LU factorisation with partial pivoting, for the moment matrix.
//!
//! Written here rather than taken from a linear-algebra crate: it is one short routine, the
//! only one the solver needs, and a general crate's generic code would be compiled into this
//! crate at its own (unoptimised, in tests) level anyway, so it would cost build time without
//! making the tests faster.
//!
//! # Formula
//! Gaussian elimination with row interchanges (partial pivoting), PA = LU, then forward and
//! back substitution (G. H. Golub and C. F. Van Loan, *Matrix Computations*, 4th ed. 2013,
//! algorithms 3.4.1 and 3.1.1–3.1.2).

use num_complex::Complex64;

/// Solve A·x = b for a row-major n×n `matrix` (overwritten by its factors); `None` when a pivot
/// vanishes or is not finite.
pub fn solve_in_place(
    matrix: &mut [Complex64],
    n: usize,
    rhs: &[Complex64],
) -> Option<Vec<Complex64>> {
    let mut pivots = vec![0usize; n];
    for col in 0..n {
        let mut best = col;
        let mut best_size = matrix[col * n + col].norm_sqr();
        for row in col + 1..n {
            let size = matrix[row * n + col].norm_sqr();
            if size > best_size {
                best = row;
                best_size = size;
            }
        }
        if best_size == 0.0 || !best_size.is_finite() {
            return None;
        }
        pivots[col] = best;
        if best != col {
            for k in 0..n {
                matrix.swap(col * n + k, best * n + k);
            }
        }
        let inverse = matrix[col * n + col].inv();
        let (upper, lower) = matrix.split_at_mut((col + 1) * n);
        let pivot_row = &upper[col * n..(col + 1) * n];
        for row in lower.chunks_exact_mut(n) {
            let factor = row[col] * inverse;
            row[col] = factor;
            if factor.re == 0.0 && factor.im == 0.0 {
                continue;
            }
            for (x, p) in row[col + 1..].iter_mut().zip(&pivot_row[col + 1..]) {
                *x -= factor * *p;
            }
        }
    }
    let mut x: Vec<Complex64> = rhs.to_vec();
    for (col, &pivot) in pivots.iter().enumerate() {
        x.swap(col, pivot);
    }
    // L·y = P·b (unit lower triangle).
    for row in 0..n {
        let mut sum = x[row];
        for k in 0..row {
            sum -= matrix[row * n + k] * x[k];
        }
        x[row] = sum;
    }
    // U·x = y.
    for row in (0..n).rev() {
        let mut sum = x[row];
        for k in row + 1..n {
            sum -= matrix[row * n + k] * x[k];
        }
        x[row] = sum / matrix[row * n + row];
    }
    Some(x)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn solves_a_small_complex_system_needing_a_row_swap() {
        // A with a zero leading pivot; x chosen, b = A·x, then solved back.
        let c = |re, im| Complex64::new(re, im);
        let a = vec![
            c(0.0, 0.0),
            c(2.0, 1.0),
            c(1.0, -1.0),
            c(3.0, 0.5),
            c(1.0, 0.0),
            c(0.0, 2.0),
            c(1.0, 1.0),
            c(-1.0, 0.0),
            c(4.0, 0.0),
        ];
        let x = [c(1.0, -2.0), c(0.5, 0.5), c(-3.0, 1.0)];
        let b: Vec<Complex64> = (0..3)
            .map(|r| (0..3).map(|k| a[r * 3 + k] * x[k]).sum())
            .collect();
        let mut m = a.clone();
        let got = solve_in_place(&mut m, 3, &b).expect("regular matrix");
        for (g, w) in got.iter().zip(&x) {
            assert!((g - w).norm() < 1e-13, "{g} vs {w}");
        }
    }

    #[test]
    fn refuses_a_singular_matrix() {
        let z = Complex64::new(0.0, 0.0);
        let one = Complex64::new(1.0, 0.0);
        let mut m = vec![one, one, one, one];
        assert!(solve_in_place(&mut m, 2, &[one, z]).is_none());
    }
}
