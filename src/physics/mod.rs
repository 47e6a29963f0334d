//! Pure formulas in SI units: no state, no I/O, no egui.
//!
//! One file per family of formulas, each citing its source. Everything here takes metres,
//! henries, farads, hertz and ohms and returns the same.

pub mod coil_ground;
pub mod constants;
pub mod coplanar;
pub mod copper;
pub mod dielectric_class;
pub mod elliptic;
pub mod field;
pub mod filament;
pub mod helix;
pub mod junction;
pub mod leads;
pub mod medhurst;
pub mod nagaoka;
pub mod plate;
pub mod proximity;
pub mod roots;
pub mod round_wire;
pub mod wheeler;
pub mod wire_capacitance;
pub mod wire_gauge;
