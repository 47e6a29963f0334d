//! Hand-outs: the build sheet with the apprentice's worksheet (PDF) and any chart (SVG, PNG).
//!
//! The content comes from [`crate::recipe::figures()`], the same figures as the window and
//! `report`; the charts from the engine's sweeps. `sheet` and `chart_data` make the content
//! (no I/O), `pdf`, `chart_draw` and `chart_files` draw it (krilla for the PDF, plotters for
//! the charts, one drawing function for every format), and `export` writes files atomically.

mod chart_data;
mod chart_draw;
mod chart_files;
mod export;
mod fonts;
mod pdf;
mod pdf_backend;
mod sheet;
mod spice_netlist;
mod stage_netlist;

pub use chart_data::{ChartData, ChartKind, Curve, chart_data, refused};
pub use chart_draw::ChartLayout;
pub use chart_files::{CHART_SIZE, SUPERSAMPLE, chart_file_layout, chart_png, chart_svg};
pub use export::{
    CHART_EXTENSIONS, SHEET_EXTENSIONS, chart_bytes, sheet_bytes, write_chart, write_sheet,
};
pub use pdf::sheet_pdf;
pub use sheet::{BENCH_COLUMNS, BENCH_ROWS, Row, Sheet, sheet};
pub use spice_netlist::{CoilNetwork, FIT_HALF_BAND, spice_netlist};
pub use stage_netlist::{StageRun, stage_netlist};
