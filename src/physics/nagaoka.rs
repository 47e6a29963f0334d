//! Nagaoka's coefficient and the current-sheet inductance of a solenoid.
//!
//! A single-layer coil whose current is spread evenly over a cylinder of mean (wire-centre)
//! diameter D and length l has L = µ0·π·a²·N²·K_N / l (a = D/2), where K_N ≤ 1 is Nagaoka's
//! coefficient (H. Nagaoka, J. Coll. Sci. Tokyo 27, 1909; tabulated in F. W. Grover,
//! *Inductance Calculations*, 1946, Table 36).

use super::constants::MU_0;
use super::elliptic::agm_with_sum;
use std::f64::consts::PI;

/// Nagaoka's coefficient K_N, exact, from complete elliptic integrals.
///
/// # Formula
/// With the modulus k, k² = D²/(D²+l²) and k′ = l/√(D²+l²):
/// K_N = 4/(3π k′)·[(k′²/k²)(K(k) − E(k)) + E(k) − k]
/// (Grover 1946, eq. 76), evaluated with parameter m = k² as in [`sheet`].
///
/// `diameter_over_length` = D/l must be positive and finite.
pub fn coefficient(diameter_over_length: f64) -> f64 {
    sheet(diameter_over_length, 1.0, 1.0).coefficient
}

/// The exact current sheet: Nagaoka's coefficient and the inductance it gives.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Sheet {
    /// Nagaoka's coefficient K_N.
    pub coefficient: f64,
    /// µ0·π·a²·N²·K_N/l, henries.
    pub inductance: f64,
}

/// Nagaoka's coefficient and the current-sheet inductance for mean diameter D, length l (metres)
/// and `turns` N, exact.
///
/// # Formula
/// Grover's eq. 76 (see [`coefficient`]) with K and E from the AGM of h = √(D²+l²) and l, whose
/// parameter is m = D²/h² (see [`agm_with_sum`]: K = πh/(2M), E = K·(1 − S/h²)). Substituting
/// k = D/h and k′ = l/h gives
/// K_N = 2·(h² + S·(l² − D²)/D²)/(3·l·M) − 4D/(3πl)
///     = [2π·(h²D² + S·(l² − D²)) − 4D³M]/(3π·l·D²·M)
/// and L = µ0·N²·[…]/(12·l²·M), both from the one reciprocal 1/(l²·D²·M).
///
/// D and l must be positive and finite.
pub fn sheet(mean_diameter: f64, length: f64, turns: f64) -> Sheet {
    let d = mean_diameter;
    let l = length;
    let d2 = d * d;
    let l2 = l * l;
    let h2 = d2 + l2;
    let (mean, sum) = agm_with_sum(h2.sqrt(), l, d2);
    let bracket = 2.0 * PI * (h2 * d2 + sum * (l2 - d2)) - 4.0 * d2 * d * mean;
    let reciprocal = 1.0 / (l2 * d2 * mean);
    Sheet {
        coefficient: bracket * l * reciprocal * (1.0 / (3.0 * PI)),
        inductance: bracket * d2 * reciprocal * (MU_0 / 12.0) * turns * turns,
    }
}

/// Nagaoka's coefficient by Lundin's closed form, accurate to a few ppm over all shapes.
///
/// # Formula
/// R. Lundin, "A handbook formula for the inductance of a single-layer circular coil",
/// Proc. IEEE 73 (1985) 1428. With x = D/l,
/// f₁(y) = (1 + 0.383901y + 0.017108y²)/(1 + 0.258952y),
/// f₂(y) = 0.093842y + 0.002029y² − 0.000801y³;
/// l ≥ D: K_N = f₁(x²) − 4x/(3π);
/// l < D: K_N = (2/(πx))·[(ln(4x) − ½)·f₁(1/x²) + f₂(1/x²)].
pub fn coefficient_lundin(diameter_over_length: f64) -> f64 {
    let x = diameter_over_length;
    let f1 = |y: f64| (1.0 + 0.383901 * y + 0.017108 * y * y) / (1.0 + 0.258952 * y);
    let f2 = |y: f64| 0.093842 * y + 0.002029 * y * y - 0.000801 * y * y * y;
    if x <= 1.0 {
        f1(x * x) - 4.0 / (3.0 * PI) * x
    } else {
        let y = 1.0 / (x * x);
        2.0 / (PI * x) * (((4.0 * x).ln() - 0.5) * f1(y) + f2(y))
    }
}

/// Inductance of the ideal current sheet, henries: µ0·π·a²·N²·K_N/l.
///
/// `mean_diameter` and `length` in metres; `nagaoka` is K_N for D/l.
pub fn current_sheet_inductance(mean_diameter: f64, length: f64, turns: f64, nagaoka: f64) -> f64 {
    let a = 0.5 * mean_diameter;
    nagaoka * (MU_0 * PI * a * a * turns * turns / length)
}
