//! Small widgets of our own, shared by the panels.

mod quantity;
mod readout;

pub use quantity::{LABEL_WIDTH, Quantity, row_label};
pub use readout::{Readout, caution_mark, cautions_line};
