//! Small widgets of our own, shared by the panels.

mod quantity;
mod readout;
mod steady;

pub use quantity::{LABEL_WIDTH, Quantity, row_label, to_si_at_resolution};
pub use readout::{Readout, caution_mark, cautions_line};
pub use steady::steady;
