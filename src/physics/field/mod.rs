//! The coil solved from its own currents: a thin-wire method-of-moments solution of the
//! actual wire (helix, leads and the path that closes the loop), giving the impedance at the
//! terminals Z(f), the first parallel self-resonance, the apparent inductance X/ω and the
//! series resistance.
//!
//! The geometry is stated once in [`geometry`]; the kernel and its integrals in [`kernel`];
//! the Galerkin moment matrix in [`matrix`]; the solution in [`solve`]; its cost bounded
//! before any work in [`budget`].
//!
//! # Formula
//! Electric-field integral equation of a thin wire in mixed-potential form, discretised by
//! Galerkin's method with triangle basis and testing functions on straight segments
//! (R. F. Harrington, *Field Computation by Moment Methods*, 1968, ch. 4; D. R. Wilton and
//! C. M. Butler, IEEE Trans. AP-24, 1976), on the thin-wire kernel (the reduced kernel of
//! Harrington §4.2 and Burke and Poggio, NEC Part I, 1981, along the wire), with the wire's skin-effect impedance as a distributed
//! load, driven by a delta-gap source at the terminals.
//!
//! # Thin-wire limits
//! The reduced kernel assumes the current is axial and spread evenly round the wire. Segments
//! are kept longer than the wire radius ([`WireCoil::segments_per_turn`]): with the reduced
//! kernel, segments much shorter than the radius make the discrete problem ill-conditioned
//! (G. Fikioris and T. T. Wu, "On the application of numerical methods to Hallén's equation",
//! IEEE Trans. AP-49, 2001). Close turns: neighbouring turns couple at their axis-to-axis
//! separation (the tube current's potential outside the wire, see [`kernel`]), which holds as
//! long as the turns do not touch; pitches below the wire diameter are refused, and the current's crowding towards neighbouring turns (the proximity
//! effect) is not represented, so the series resistance is the skin-effect and radiation part
//! only.

pub mod budget;
pub mod geometry;
pub mod kernel;
pub mod lu;
pub mod matrix;
pub mod solve;

pub use geometry::{Feed, FieldError, Structure, WireCoil};
pub use solve::{FieldModel, FieldSolution};
