//! Files written by measuring instruments, read from their text (no file is opened here):
//! network analysers' Touchstone files and receivers' power sweeps (CSV).

pub mod sweep_csv;
pub mod touchstone;
