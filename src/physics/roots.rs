//! Roots of a continuous function of one variable: the one home of the tool's root finders.
//!
//! - [`illinois`]: the Illinois variant of regula falsi on a bracket (M. Dowell and P.
//!   Jarratt, "A modified regula falsi method for computing the root of an equation", BIT 11,
//!   1971, pp. 168–174): the secant through the bracket's ends, and the retained end's value
//!   halved whenever the same end is kept twice running, which restores superlinear
//!   convergence (order about 1.44) where plain regula falsi stalls on a convex function. A
//!   value that is not finite at an end (a pole, a refused point) takes a bisection step.
//! - [`bisect`]: halving a bracket a fixed number of times (each halving gains one bit; 60
//!   reach the resolution of an `f64` on any bracket the tool uses).

/// When [`illinois`] stops.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Stop {
    /// The bracket is narrow enough when its width is at most this (absolute) …
    pub width: f64,
    /// … plus this fraction of the larger end's size.
    pub relative_width: f64,
    /// A point whose value is at most this in size is the root.
    pub value: f64,
    /// Most evaluations.
    pub steps: usize,
}

/// What [`illinois`] found.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Found {
    /// The root: the point whose value met [`Stop::value`], else the bracket's middle.
    pub x: f64,
    /// The value at `x` when it was evaluated there (NaN for the bracket's middle).
    pub value: f64,
    /// The bracket as last held, each end with its value as carried by the method (the
    /// Illinois step halves a retained end's value).
    pub bracket: [(f64, f64); 2],
    /// Evaluations made.
    pub steps: usize,
    /// False when [`Stop::steps`] ran out first.
    pub converged: bool,
}

/// A root of `g` in the bracket `a`, `b` (each a point and its value, of opposite signs),
/// by the Illinois method, stopped by `stop`; `g`'s error ends the search.
pub fn illinois<E>(
    a: (f64, f64),
    b: (f64, f64),
    stop: Stop,
    mut g: impl FnMut(f64) -> Result<f64, E>,
) -> Result<Found, E> {
    let ((mut x0, mut g0), (mut x1, mut g1)) = (a, b);
    let mut side = 0i32;
    let middle = |x0: f64, x1: f64| 0.5 * (x0 + x1);
    for steps in 0..stop.steps {
        let width = (x1 - x0).abs();
        if width <= stop.width + stop.relative_width * x0.abs().max(x1.abs()) {
            return Ok(Found {
                x: middle(x0, x1),
                value: f64::NAN,
                bracket: [(x0, g0), (x1, g1)],
                steps,
                converged: true,
            });
        }
        let x = if g0.is_finite() && g1.is_finite() && g1 != g0 {
            (x0 * g1 - x1 * g0) / (g1 - g0)
        } else {
            middle(x0, x1)
        };
        let gx = g(x)?;
        if gx.abs() <= stop.value {
            return Ok(Found {
                x,
                value: gx,
                bracket: [(x0, g0), (x1, g1)],
                steps: steps + 1,
                converged: true,
            });
        }
        if (gx < 0.0) == (g0 < 0.0) {
            (x0, g0) = (x, gx);
            if side == -1 {
                g1 *= 0.5;
            }
            side = -1;
        } else {
            (x1, g1) = (x, gx);
            if side == 1 {
                g0 *= 0.5;
            }
            side = 1;
        }
    }
    Ok(Found {
        x: middle(x0, x1),
        value: f64::NAN,
        bracket: [(x0, g0), (x1, g1)],
        steps: stop.steps,
        converged: false,
    })
}

/// The point where `above` turns from false (at `lo`) to true (at `hi`), after `halvings`
/// halvings of the bracket: its middle.
pub fn bisect(
    mut lo: f64,
    mut hi: f64,
    halvings: usize,
    mut above: impl FnMut(f64) -> bool,
) -> f64 {
    for _ in 0..halvings {
        let mid = 0.5 * (lo + hi);
        if above(mid) {
            hi = mid;
        } else {
            lo = mid;
        }
    }
    0.5 * (lo + hi)
}

#[cfg(test)]
mod tests {
    use super::*;

    /// x³ − 2x − 5 = 0, Wallis's example used by Dowell and Jarratt (1971): root
    /// 2.0945514815423265 (from memory; checked here by the residual).
    #[test]
    fn illinois_finds_wallis_root_and_bisect_agrees() {
        let f = |x: f64| x * x * x - 2.0 * x - 5.0;
        let stop = Stop {
            width: 0.0,
            relative_width: 1e-15,
            value: 0.0,
            steps: 100,
        };
        let found = illinois::<()>((2.0, f(2.0)), (3.0, f(3.0)), stop, |x| Ok(f(x))).unwrap();
        assert!(found.converged);
        assert!(f(found.x).abs() < 1e-12, "{}", found.x);
        // Superlinear: far fewer evaluations than the 50 halvings bisection needs.
        assert!(found.steps < 15, "{}", found.steps);
        let b = bisect(2.0, 3.0, 60, |x| f(x) > 0.0);
        assert!((b - found.x).abs() < 1e-12);
    }

    #[test]
    fn a_pole_at_one_end_takes_bisection_steps() {
        // 1/(1 − x) − 2 has its root at 0.5 and a pole at 1.
        let g = |x: f64| {
            if x >= 1.0 {
                f64::INFINITY
            } else {
                1.0 / (1.0 - x) - 2.0
            }
        };
        let stop = Stop {
            width: 1e-12,
            relative_width: 0.0,
            value: 0.0,
            steps: 200,
        };
        let found = illinois::<()>((0.0, g(0.0)), (1.0, g(1.0)), stop, |x| Ok(g(x))).unwrap();
        assert!((found.x - 0.5).abs() < 1e-9, "{}", found.x);
    }
}
