//! The saved coil recipe (in progress).
