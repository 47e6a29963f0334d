//! Files written by measuring instruments, read from their text (no file is opened here):
//! network analysers' Touchstone files.

pub mod touchstone;
